//! The top-level layout of the app: masthead, the input panels and the outcome.

use super::demands::WorkVisionLauncher;
use super::options_panel::OptionsPanel;
use super::outcome::{OutcomePanel, PlanPeek};
use super::shelf_panel::{NoticeBar, ShelfPanel};
use super::startup::drawn_after_first_paint;
use super::state::provide_app_state;
use super::tasks_panel::TasksPanel;
use super::wearer_panel::WearerPanel;
use crate::display::LengthUnit;
use leptos::prelude::*;

/// The whole app.
#[component]
pub fn App() -> impl IntoView {
    let state = provide_app_state();
    let shelf = state.shelf;
    // Another tab of the app changed local storage: follow it.
    let _listener = window_event_listener(leptos::ev::storage, move |ev| {
        let key = ev.key();
        let shown = shelf.run(|s| s.follow_other_tab(key.as_deref())).flatten();
        state.show(shown);
    });
    // Back in view (focus, or the tab shown again): write what storage
    // refused before, and catch up with other tabs' writes.
    let catch_up =
        move |_: web_sys::Event| shelf.in_turn(|s, _| s.catch_up(), move |shown| state.show(shown));
    let _focus = window_event_listener_untyped("focus", catch_up);
    let _shown = window_event_listener_untyped("visibilitychange", move |ev| {
        let visible = document().visibility_state() == web_sys::VisibilityState::Visible;
        if visible {
            catch_up(ev);
        } else {
            shelf.write_now();
        }
    });
    // Leaving: staged edits are written now rather than after the delay.
    let _hiding = window_event_listener_untyped("pagehide", move |_| shelf.write_now());
    // Leaving while a change is in this tab only would lose it: ask first.
    let _leaving = window_event_listener(leptos::ev::beforeunload, move |ev| {
        if shelf.read(|s| s.has_unsaved()).unwrap_or(false) {
            ev.prevent_default();
            ev.set_return_value("Some changes are kept in this tab only.");
        }
    });
    let wearer_row = Memo::new(move |_| state.rows.with(|rows| rows.wearer()));
    // The working day and the lens options start below the wearer's block,
    // about 2,000 px down (measured at 1366 x 900 and 768 x 1024), out of
    // view at start: they are drawn in the task after the first plan is
    // painted, which then comes sooner (on a screen tall enough to show
    // them, they appear a frame later).
    let later = drawn_after_first_paint();
    let title = state.part(|s| s.name.clone());
    let unit_label = move || match state.unit.get() {
        LengthUnit::Centimetres => "Show inches",
        LengthUnit::Inches => "Show centimetres",
    };
    let toggle_unit = move |_| {
        state.set_unit(match state.unit.get_untracked() {
            LengthUnit::Centimetres => LengthUnit::Inches,
            LengthUnit::Inches => LengthUnit::Centimetres,
        })
    };
    view! {
        <header class="masthead">
            <div class="brand">
                <span class="name">"clearspan"</span>
                <span class="tagline">"eyewear planning for working distances"</span>
            </div>
            <h1 data-testid="scenario-title">{move || title.get()}</h1>
            <nav class="jump" aria-label="Sections">
                <a href="#wearer-heading">"Wearer"</a>
                <a href="#tasks-heading">"Working day"</a>
                <a href="#options-heading">"Lens options"</a>
                <a href="#outcome-heading">"Plan"</a>
            </nav>
            <WorkVisionLauncher />
            <button type="button" data-testid="unit-toggle" on:click=toggle_unit>
                {unit_label}
            </button>
        </header>
        <NoticeBar />
        <main id="workspace" data-testid="workspace">
            <ShelfPanel />
            <div class="inputs">
                {move || {
                    // The wearer's fields are drawn afresh with each scenario
                    // opened (a new row id). The memo is read, not only
                    // tracked: a memo never read is never computed, so it
                    // never hears of a change.
                    let _opened = wearer_row.get();
                    view! { <WearerPanel /> }
                }}
                {move || {
                    later.get().then(|| view! {
                        <TasksPanel />
                        <OptionsPanel />
                    })
                }}
            </div>
            <OutcomePanel />
        </main>
        {move || later.get().then(|| view! { <PlanPeek /> })}
    }
}
