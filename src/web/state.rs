//! The app state, provided once through context: the scenario being edited,
//! the user's length unit, and what is derived from them. Later views (a
//! wearer walkthrough, a task-demand sheet) read the same state.

use crate::display::LengthUnit;
use crate::scenario::{validate, FieldError, Problem, Scenario, ValidScenario};
use leptos::prelude::*;

/// Everything the views share. Cheap to copy: it holds signal handles only.
#[derive(Clone, Copy)]
pub struct AppState {
    /// The scenario being edited; every field holds a parsed number.
    pub scenario: RwSignal<Scenario>,
    /// The unit task distances and sizes are shown and typed in.
    pub unit: RwSignal<LengthUnit>,
    /// The scenario after the validation gate: checked, or every field problem.
    pub checked: Memo<Result<ValidScenario, Vec<FieldError>>>,
}

impl AppState {
    fn new(scenario: Scenario) -> AppState {
        let scenario = RwSignal::new(scenario);
        let checked = Memo::new(move |_| scenario.with(|s| validate(s.clone())));
        AppState {
            scenario,
            unit: RwSignal::new(LengthUnit::default()),
            checked,
        }
    }

    /// The validation problem of the field at `path`, if any (reactive).
    pub fn problem_at(&self, path: &str) -> Option<Problem> {
        self.checked.with(|c| match c {
            Ok(_) => None,
            Err(errors) => errors
                .iter()
                .find(|e| e.path == path)
                .map(|e| e.problem.clone()),
        })
    }

    /// Applies `edit` to the scenario being edited.
    pub fn edit(&self, edit: impl FnOnce(&mut Scenario)) {
        self.scenario.update(edit);
    }
}

/// Creates the app state around `scenario` and provides it to every component below.
pub fn provide_app_state(scenario: Scenario) -> AppState {
    let state = AppState::new(scenario);
    provide_context(state);
    state
}

/// The app state provided by [`provide_app_state`].
pub fn use_app_state() -> AppState {
    expect_context::<AppState>()
}
