//! The order sheet: the parameters a lab order needs for the chosen option,
//! the wearer's age and prescription, each task with its distance, zone and
//! verdict through that option, the date and a line for the practitioner's
//! signature. On screen it is a summary; printed, it is the one-page plan
//! sheet (the cautions print above it).

use crate::plan::text::{family_name, order_lines};
use crate::plan::Plan;
use crate::web::state::use_app_state;
use crate::web::table::column_heads;
use leptos::prelude::*;

/// The order sheet for `plan`.
pub fn order_sheet(plan: &Plan) -> impl IntoView {
    let state = use_app_state();
    let order = plan.order.as_ref().map(|o| {
        let lines = order_lines(o)
            .into_iter()
            .map(|l| view! { <li>{l}</li> })
            .collect_view();
        view! {
            <p>{format!("{} ({})", o.option.label, family_name(&o.design))}</p>
            <ul class="order-lines">{lines}</ul>
        }
    });
    let unit = state.unit.get();
    let chosen = plan
        .order
        .as_ref()
        .and_then(|o| plan.options.iter().find(|p| p.option == o.option));
    let tasks = plan
        .tasks
        .iter()
        .map(|t| {
            let through =
                chosen.and_then(|o| o.tasks.iter().find(|tp| tp.task.index == t.task.index));
            view! {
                <tr>
                    <td>
                        {format!(
                            "{}: {} {} at {:+.0}°, {:.1} h a day",
                            t.task.name,
                            crate::display::trim_number(unit.from_metres(t.distance), 0),
                            unit.symbol(),
                            t.gaze_elevation.0,
                            t.hours_per_day
                        )}
                    </td>
                    <td>{through.map(|tp| tp.zone.to_string()).unwrap_or_default()}</td>
                    <td>{through.map(|tp| tp.verdict.to_string()).unwrap_or_default()}</td>
                </tr>
            }
        })
        .collect_view();
    let wearer = state.scenario.with(|s| {
        let w = &s.wearer;
        let eye = |rx: &crate::scenario::Prescription| {
            format!(
                "{} / {} x {:.0}",
                crate::core::units::Dioptres(rx.sphere_d).signed(),
                crate::core::units::Dioptres(rx.cylinder_d).signed(),
                rx.axis_deg
            )
        };
        format!(
            "Wearer: {:.0} years; distance prescription R {} L {}{}",
            w.age_years,
            eye(&w.right),
            eye(&w.left),
            w.prescribed_addition_d.map_or(String::new(), |a| format!(
                ", addition {}",
                crate::core::units::Dioptres(a)
            ))
        )
    });
    let date = String::from(
        js_sys::Date::new_0().to_locale_date_string("en-GB", &wasm_bindgen::JsValue::UNDEFINED),
    );
    view! {
        <section class="order-sheet" aria-labelledby="order-heading" data-testid="order-sheet">
            <h3 id="order-heading">"Order sheet"</h3>
            <p class="print-only">{format!("clearspan plan sheet: {}", plan.scenario_name)}</p>
            <p class="detail">{format!("{wearer} · {date}")}</p>
            {order}
            <h4>"Tasks planned for"</h4>
            <table class="sheet-tasks">
                {column_heads(&["Task: distance, gaze, time", "Zone", "Verdict"])}
                <tbody>{tasks}</tbody>
            </table>
            <p class="signature">"Checked and confirmed by a licensed eye-care practitioner: name, signature, date ______________________________"</p>
            <button type="button" class="no-print" on:click=move |_| {
                if let Some(w) = web_sys::window() {
                    let _ = w.print();
                }
            }>"Print plan sheet"</button>
        </section>
    }
}
