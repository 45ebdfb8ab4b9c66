//! The order sheet on the page: its content written by
//! `markup::order_sheet` for the plan shown, dated today (the local date,
//! month in words), and a button that prints the plan sheet.

use super::written::written_body;
use crate::markup::order_sheet::{order_sheet, task_columns, SIGNATURE};
use crate::web::clock::today;
use crate::web::state::use_app_state;
use leptos::prelude::*;

/// The order sheet of the plan on screen, while there is one.
#[component]
pub fn OrderSheet() -> impl IntoView {
    let state = use_app_state();
    let wearer = state.part(|s| s.wearer.clone());
    let sheet = Memo::new(move |_| {
        let unit = state.unit.get();
        state.outcome.with(|o| {
            let plan = o.plan.as_ref()?;
            Some(wearer.with(|w| order_sheet(plan, w, unit, &today())))
        })
    });
    let planned = Memo::new(move |_| sheet.with(Option::is_some));
    let order = Memo::new(move |_| sheet.with(|s| s.as_ref().map(|s| s.order.clone())));
    let print = move |_| {
        if let Some(w) = web_sys::window() {
            let _ = w.print();
        }
    };
    view! {
        <Show when=move || planned.get()>
            <section class="order-sheet" aria-labelledby="order-heading" data-testid="order-sheet">
                <div class="part" inner_html=move || order.get().unwrap_or_default()></div>
                <h4>"Tasks planned for"</h4>
                <table class="sheet-tasks">
                    <thead inner_html=task_columns()></thead>
                    {written_body(move || sheet.with(|s| s.as_ref().map(|s| s.tasks.clone()).unwrap_or_default()))}
                </table>
                <p class="signature">{SIGNATURE}</p>
                <button type="button" class="no-print" on:click=print>"Print plan sheet"</button>
            </section>
        </Show>
    }
}
