//! The plan at a glance, for narrow screens where the plan sits below the
//! form: a bar fixed at the bottom of the window with the option shown and
//! how its tasks fare, updated with every edit, so the effect of an edit is
//! seen without scrolling. "See the plan" jumps to it and "Back to the
//! form" returns to the place left. Wide screens keep the plan pinned
//! beside the form instead and never show the bar (style sheet).

use super::shown_option;
use crate::plan::Verdict;
use crate::web::state::use_app_state;
use leptos::prelude::*;

/// Scrolls the window to the top of the element with id `id`.
fn scroll_to_id(id: &str) {
    if let Some(element) = web_sys::window()
        .and_then(|w| w.document())
        .and_then(|d| d.get_element_by_id(id))
    {
        element.scroll_into_view();
    }
}

/// How far the window is scrolled down, in CSS pixels.
fn scrolled() -> f64 {
    web_sys::window()
        .and_then(|w| w.scroll_y().ok())
        .unwrap_or(0.0)
}

/// The plan-at-a-glance bar.
#[component]
pub fn PlanPeek() -> impl IntoView {
    let state = use_app_state();
    let summary = Memo::new(move |_| {
        state.outcome.with(|o| {
            let plan = o.plan.as_ref()?;
            let option = shown_option(plan)?;
            let count = |v: Verdict| option.tasks.iter().filter(|t| t.verdict == v).count();
            Some(format!(
                "{}: {} comfortable, {} tiring, {} blurred{}",
                option.option.label,
                count(Verdict::Comfortable),
                count(Verdict::InFocusButTiring),
                count(Verdict::Blurred),
                if o.stale {
                    " (before the last change)"
                } else {
                    ""
                }
            ))
        })
    });
    // Where the form was left when the plan was opened from this bar.
    let left_at = RwSignal::new(None::<f64>);
    let see_plan = move |_| {
        left_at.set(Some(scrolled()));
        scroll_to_id("outcome-heading");
    };
    let back = move |_| {
        if let (Some(y), Some(window)) = (left_at.get_untracked(), web_sys::window()) {
            window.scroll_to_with_x_and_y(0.0, y);
        }
        left_at.set(None);
    };
    view! {
        <Show when=move || summary.with(Option::is_some)>
            <div class="plan-peek" role="status" aria-label="The plan at a glance" data-testid="plan-peek">
                <p>{move || summary.get().unwrap_or_default()}</p>
                <Show
                    when=move || left_at.with(Option::is_some)
                    fallback=move || view! { <button type="button" on:click=see_plan>"See the plan"</button> }
                >
                    <button type="button" on:click=back>"Back to the form"</button>
                </Show>
            </div>
        </Show>
    }
}
