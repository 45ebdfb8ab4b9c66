//! The app state, provided once through context: the scenario being edited,
//! the user's length unit, and what is derived from them. Later views (a
//! wearer walkthrough, a task-demand sheet) read the same state.

use super::shelf::{Opening, Shelf};
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
    /// The scenarios kept on this device and the save state of the open one.
    pub shelf: Shelf,
}

impl AppState {
    fn new(opening: Opening) -> AppState {
        let scenario = RwSignal::new(opening.scenario);
        let checked = Memo::new(move |_| scenario.with(|s| validate(s.clone())));
        AppState {
            scenario,
            unit: RwSignal::new(opening.unit),
            checked,
            shelf: opening.shelf,
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

    /// Applies `edit` to the scenario being edited and stores the result.
    pub fn edit(&self, edit: impl FnOnce(&mut Scenario)) {
        self.scenario.update(edit);
        self.scenario.with_untracked(|s| self.shelf.autosave(s));
    }

    /// Switches the length unit and remembers it for the next visit.
    pub fn set_unit(&self, unit: LengthUnit) {
        self.unit.set(unit);
        self.shelf.remember(Some(unit));
    }
}

/// Opens the shelf, creates the app state around the scenario it opens, and
/// provides the state to every component below.
pub fn provide_app_state() -> AppState {
    let state = AppState::new(Shelf::open());
    provide_context(state);
    state
}

/// The app state provided by [`provide_app_state`].
pub fn use_app_state() -> AppState {
    expect_context::<AppState>()
}
