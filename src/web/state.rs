//! The app state, provided once through context: the scenario being edited,
//! the user's length unit, and what is derived from them. Later views (a
//! wearer walkthrough, a task-demand sheet) read the same state.

use super::shelf::{Opening, Shelf};
use crate::display::LengthUnit;
use crate::plan::{plan, Plan};
use crate::scenario::{validate, FieldError, Problem, Scenario, ValidScenario};
use leptos::prelude::*;
use std::collections::BTreeSet;

/// Everything the views share. Cheap to copy: it holds signal handles only.
#[derive(Clone, Copy)]
pub struct AppState {
    /// The scenario being edited; every field holds a parsed number.
    pub scenario: RwSignal<Scenario>,
    /// The unit task distances and sizes are shown and typed in.
    pub unit: RwSignal<LengthUnit>,
    /// The scenario after the validation gate: checked, or every field problem.
    pub checked: Memo<Result<ValidScenario, Vec<FieldError>>>,
    /// The plan on screen, re-planned on every edit.
    pub outcome: Memo<Outcome>,
    /// The task whose numbers are shown in detail (input index).
    pub chosen_task: RwSignal<Option<usize>>,
    /// Counts the times what the fields show was replaced from elsewhere
    /// (a scenario opened, a task or option removed, the unit switched):
    /// text a user typed before then no longer belongs to the field.
    pub era: RwSignal<u64>,
    /// Fields whose typed text is not a number; while any is, the plan on
    /// screen does not reflect what the user sees and is marked stale.
    pub unparsed: RwSignal<BTreeSet<String>>,
    /// The scenarios kept on this device and the save state of the open one.
    pub shelf: Shelf,
}

/// The plan on screen: the latest from a valid scenario, kept and marked
/// stale while the scenario has a problem, so nothing vanishes mid-edit.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Outcome {
    /// The latest plan, if any scenario so far was valid.
    pub plan: Option<Plan>,
    /// Whether the scenario changed since `plan` and cannot be planned now.
    pub stale: bool,
    /// Why the current scenario could not be planned, beyond field problems.
    pub error: Option<String>,
}

impl AppState {
    fn new(opening: Opening) -> AppState {
        let scenario = RwSignal::new(opening.scenario);
        let checked = Memo::new(move |_| scenario.with(|s| validate(s.clone())));
        let outcome = Memo::new(move |previous: Option<&Outcome>| {
            let last = || previous.and_then(|p| p.plan.clone());
            checked.with(|c| match c {
                Ok(valid) => match plan(valid) {
                    Ok(plan) => Outcome {
                        plan: Some(plan),
                        stale: false,
                        error: None,
                    },
                    Err(e) => Outcome {
                        plan: last(),
                        stale: true,
                        error: Some(e.to_string()),
                    },
                },
                Err(_) => Outcome {
                    plan: last(),
                    stale: true,
                    error: None,
                },
            })
        });
        AppState {
            scenario,
            unit: RwSignal::new(opening.unit),
            checked,
            outcome,
            chosen_task: RwSignal::new(None),
            era: RwSignal::new(0),
            unparsed: RwSignal::new(BTreeSet::new()),
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

    /// The lens option the dispenser chose (input index), saved with the
    /// scenario; `None` follows the planner's recommendation.
    pub fn chosen_option(&self) -> Option<usize> {
        self.scenario.with(|s| s.chosen_option)
    }

    /// Chooses the lens option at input index `index` for the order and the
    /// printed sheet, and stores the scenario.
    pub fn choose_option(&self, index: usize) {
        self.edit(|s| s.chosen_option = Some(index));
    }

    /// Applies `edit` to the scenario being edited and stores the result.
    pub fn edit(&self, edit: impl FnOnce(&mut Scenario)) {
        self.scenario.update(edit);
        self.scenario.with_untracked(|s| self.shelf.autosave(s));
    }

    /// Switches the length unit and remembers it for the next visit.
    pub fn set_unit(&self, unit: LengthUnit) {
        self.new_era();
        self.unit.set(unit);
        self.shelf.remember(Some(unit));
    }

    /// Replaces the scenario on screen (opened, reloaded, taken from another
    /// tab) without storing it again.
    pub fn replace_scenario(&self, scenario: Scenario) {
        self.new_era();
        self.scenario.set(scenario);
    }

    /// Applies an edit that changes which task or option each field shows
    /// (removing one), then stores the result.
    pub fn reshape(&self, edit: impl FnOnce(&mut Scenario)) {
        self.new_era();
        self.edit(edit);
    }

    /// Starts a new era: typed text no longer belongs to its field.
    fn new_era(&self) {
        self.unparsed.update(BTreeSet::clear);
        self.era.update(|e| *e += 1);
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
