//! The order sheet: the parameters a lab order needs for the recommended
//! option, the tasks it was planned for and the cautions. On screen it is a
//! summary; printed, it is the one-page plan sheet.

use crate::plan::text::{family_name, order_lines};
use crate::plan::Plan;
use crate::web::state::use_app_state;
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
    let tasks = plan
        .tasks
        .iter()
        .map(|t| {
            view! {
                <li>
                    {format!(
                        "{}: {} {} at {:+.0}°, {:.1} h a day",
                        t.task.name,
                        crate::display::trim_number(unit.from_metres(t.distance), 0),
                        unit.symbol(),
                        t.gaze_elevation.0,
                        t.hours_per_day
                    )}
                </li>
            }
        })
        .collect_view();
    view! {
        <section class="order-sheet" aria-labelledby="order-heading" data-testid="order-sheet">
            <h3 id="order-heading">"Order sheet"</h3>
            <p class="print-only">{format!("clearspan plan sheet: {}", plan.scenario_name)}</p>
            {order}
            <h4>"Tasks planned for"</h4>
            <ol class="plain">{tasks}</ol>
            <button type="button" class="no-print" on:click=move |_| {
                if let Some(w) = web_sys::window() {
                    let _ = w.print();
                }
            }>"Print plan sheet"</button>
        </section>
    }
}
