//! The task-demand sheet of the worker on screen: who and through what
//! glasses, each task's demands against what the worker has, its flag with
//! the reasons in numbers and what would clear it, the display-screen rule,
//! the date and a line for the nurse's name and signature. Printed, it is
//! one A4 page (the print rules in `style/app.css` hide everything else
//! while this view is open).

use crate::display::{trim_number, LengthUnit};
use crate::plan::demands::{demand_sheet, DemandSheet, FlagKind, TaskDemand};
use crate::plan::ergonomics::DISPLAY_SCREEN_RULE;
use crate::plan::roster::advice;
use crate::plan::text::amplitude_line;
use crate::web::state::use_app_state;
use crate::web::table::column_heads;
use leptos::prelude::*;

/// The class that marks a flag on screen and on paper (never by colour
/// alone: the words are always there).
fn flag_class(kind: FlagKind) -> &'static str {
    match kind {
        FlagKind::Fine => "wv-flag fine",
        FlagKind::WorkstationChange => "wv-flag change",
        FlagKind::TaskEyewear => "wv-flag eyewear",
        FlagKind::Refer => "wv-flag refer",
    }
}

/// One task's row: figures, flag, reasons and advice.
fn task_row(t: &TaskDemand, unit: LengthUnit) -> impl IntoView {
    let kind = t.flag.kind();
    let reasons = t
        .flag
        .reasons()
        .iter()
        .map(|r| view! { <li>{r.to_string()}</li> })
        .collect_view();
    let advice = advice(&t.flag);
    view! {
        <tr data-testid=format!("wv-task-{}", t.task.index)>
            <th scope="row">
                {t.task.name.clone()}
                <span class="detail">
                    {format!("{} {} · {} h a day", unit.format(t.distance), unit.symbol(), trim_number(t.hours_per_day, 1))}
                </span>
            </th>
            <td>{t.focus_words()}</td>
            <td>
                {format!("{:+.0}° gaze; {}", t.gaze.0, t.posture_words())}
                <span class="detail">{format!("convergence {:.1} Δ", t.convergence.0)}</span>
            </td>
            <td>{t.detail_words()}</td>
            <td class=flag_class(kind)>
                <strong>{kind.words()}</strong>
                <ul class="wv-reasons">{reasons}</ul>
                {(!advice.is_empty()).then(|| view! { <p class="wv-advice">{advice}</p> })}
            </td>
        </tr>
    }
}

/// The sheet itself.
fn sheet_view(sheet: &DemandSheet, unit: LengthUnit, date: String) -> impl IntoView {
    let rows = sheet.tasks.iter().map(|t| task_row(t, unit)).collect_view();
    view! {
        <article class="wv-sheet" data-testid="wv-sheet" aria-labelledby="wv-sheet-title">
            <h3 id="wv-sheet-title">{format!("Task-demand sheet: {}", sheet.scenario_name)}</h3>
            <p class="wv-facts">
                {format!("Seen through: {}.", sheet.glasses)}
                <br />
                {amplitude_line(&sheet.amplitude)}
                {sheet.age_norm_words().map(|w| view! { <br /> {w} })}
            </p>
            <p class="wv-worst" data-testid="wv-worst">
                {format!("Most serious flag: {}.", sheet.worst_flag().words())}
            </p>
            <div class="table-scroll">
                <table class="wv-table">
                    {column_heads(&["Task, distance, hours", "Focusing (ocular)", "Gaze, posture, convergence", "Detail size", "Flag, reasons, what would help"])}
                    <tbody>{rows}</tbody>
                </table>
            </div>
            <p class="wv-rule" data-testid="wv-rule">{DISPLAY_SCREEN_RULE}</p>
            <div class="wv-sign">
                <p>{format!("Date: {date}")}</p>
                <p>"Occupational health nurse (name): "<span class="wv-line"></span></p>
                <p>"Signature: "<span class="wv-line"></span></p>
            </div>
        </article>
    }
}

/// The "This worker" tab: the sheet of the scenario on screen, or why
/// there is none, and a print button.
#[component]
pub fn SheetTab() -> impl IntoView {
    let state = use_app_state();
    let sheet =
        Memo::new(move |_| {
            state.checked.with(|c| match c {
                Ok(valid) => demand_sheet(valid).map_err(|e| e.to_string()),
                Err(errors) => {
                    Err(format!(
                "the scenario on screen has {} field {} to fix first (see the input panels)",
                errors.len(),
                if errors.len() == 1 { "problem" } else { "problems" }
            ))
                }
            })
        });
    let date = String::from(
        js_sys::Date::new_0().to_locale_date_string("en-GB", &wasm_bindgen::JsValue::UNDEFINED),
    );
    let print = move |_| {
        if let Some(w) = web_sys::window() {
            let _ = w.print();
        }
    };
    view! {
        <p class="hint wv-intro">
            "Each task of the scenario on screen, seen through the worker's current glasses (the distance correction alone when none are entered). A screening aid for occupational health: it flags and documents; it does not examine or prescribe."
        </p>
        <button type="button" class="primary wv-print" data-testid="wv-print" on:click=print>
            "Print the sheet"
        </button>
        {move || {
            sheet
                .with(|s| match s {
                    Ok(sheet) => sheet_view(sheet, state.unit.get(), date.clone()).into_any(),
                    Err(e) => {
                        view! {
                            <p class="notice warning" role="alert" data-testid="wv-sheet-problem">
                                {format!("No sheet yet: {e}.")}
                            </p>
                        }
                            .into_any()
                    }
                })
        }}
    }
}
