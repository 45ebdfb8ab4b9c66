//! The top-level layout of the app: masthead, the input panels and the outcome.

use super::options_panel::OptionsPanel;
use super::state::provide_app_state;
use super::tasks_panel::TasksPanel;
use super::wearer_panel::WearerPanel;
use crate::display::LengthUnit;
use crate::scenario::Scenario;
use leptos::prelude::*;

/// The whole app.
#[component]
pub fn App() -> impl IntoView {
    let state = provide_app_state(Scenario::untitled());
    let unit_label = move || match state.unit.get() {
        LengthUnit::Centimetres => "Show inches",
        LengthUnit::Inches => "Show centimetres",
    };
    let toggle_unit = move |_| {
        state.unit.update(|u| {
            *u = match u {
                LengthUnit::Centimetres => LengthUnit::Inches,
                LengthUnit::Inches => LengthUnit::Centimetres,
            }
        })
    };
    view! {
        <header class="masthead">
            <div class="brand">
                <span class="name">"clearspan"</span>
                <span class="tagline">"eyewear planning for working distances"</span>
            </div>
            <h1 data-testid="scenario-title">{move || state.scenario.with(|s| s.name.clone())}</h1>
            <button type="button" data-testid="unit-toggle" on:click=toggle_unit>
                {unit_label}
            </button>
        </header>
        <main id="workspace" data-testid="workspace">
            <div class="inputs">
                <WearerPanel />
                <TasksPanel />
                <OptionsPanel />
            </div>
        </main>
    }
}
