//! The "This worker" tab: the task-demand sheet of the worker on screen
//! (written as HTML text by `markup::demand_sheet`), or why there is none,
//! and a print button. Printed, the sheet is one A4 page (the print rules
//! in `style/app.css` hide everything else while this view is open).

use crate::markup::demand_sheet::{demand_sheet, sheet_intro, sheet_problem};
use crate::plan::demands;
use crate::web::clock::today;
use crate::web::state::use_app_state;
use leptos::prelude::*;

/// The "This worker" tab: the sheet of the scenario on screen, or why
/// there is none, and a print button.
#[component]
pub fn SheetTab() -> impl IntoView {
    let state = use_app_state();
    let date = today();
    let sheet =
        Memo::new(move |_| {
            let unit = state.unit.get();
            state.checked.with(|c| match c {
                Ok(valid) => match demands::demand_sheet(valid) {
                    Ok(sheet) => demand_sheet(&sheet, unit, &date),
                    Err(e) => sheet_problem(&e.to_string()),
                },
                Err(errors) => {
                    sheet_problem(&format!(
                "the scenario on screen has {} field {} to fix first (see the input panels)",
                errors.len(),
                if errors.len() == 1 { "problem" } else { "problems" }
            ))
                }
            })
        });
    let print = move |_| {
        if let Some(w) = web_sys::window() {
            let _ = w.print();
        }
    };
    view! {
        <div class="part" inner_html=sheet_intro()></div>
        <button type="button" class="primary wv-print" data-testid="wv-print" on:click=print>
            "Print the sheet"
        </button>
        <div class="part" inner_html=move || sheet.get()></div>
    }
}
