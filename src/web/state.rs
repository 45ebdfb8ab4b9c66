//! The app state, provided once through context: the scenario being edited,
//! the user's length unit, and what is derived from them. Later views (a
//! wearer walkthrough, a task-demand sheet) read the same state.

use super::row_watch::RowWatch;
use super::shelf::{Opening, Shelf};
use super::startup::mark;
use crate::display::LengthUnit;
use crate::plan::{plan, Plan};
use crate::scenario::{validate, FieldError, Problem, RowIds, Scenario, ValidScenario};
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
    /// The gate's field problems alone (none for a valid scenario): it
    /// changes only when the problems do, so the fields that show them are
    /// not re-run by every valid edit.
    problems: Memo<Vec<FieldError>>,
    /// The plan on screen, re-planned on every edit.
    pub outcome: Memo<Outcome>,
    /// The task whose numbers are shown in detail (input index).
    pub chosen_task: RwSignal<Option<usize>>,
    /// The ids the editor keys its rows by (the wearer's block, each task,
    /// each option): fresh for every scenario opened and every unit switch.
    pub rows: RwSignal<RowIds>,
    /// Fields whose typed text is not a number; while any is, the plan on
    /// screen does not reflect what the user sees and is marked stale.
    pub unparsed: RwSignal<BTreeSet<String>>,
    /// The scenarios kept on this device and the save state of the open one.
    pub shelf: Shelf,
    /// The change signal of each row of the form.
    pub row_watch: RowWatch,
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
        let rows = RwSignal::new(RowIds::new(&opening.scenario));
        let scenario = RwSignal::new(opening.scenario);
        let checked = Memo::new(move |_| scenario.with(|s| validate(s.clone())));
        let problems =
            Memo::new(move |_| checked.with(|c| c.as_ref().err().cloned().unwrap_or_default()));
        let outcome = Memo::new(move |previous: Option<&Outcome>| {
            let last = || previous.and_then(|p| p.plan.clone());
            // The first plan is marked for the start-up measurement.
            let first = previous.is_none();
            if first {
                mark("planning");
            }
            let outcome = checked.with(|c| match c {
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
            });
            if first {
                mark("planned");
            }
            outcome
        });
        AppState {
            scenario,
            unit: RwSignal::new(opening.unit),
            checked,
            problems,
            row_watch: RowWatch::new(scenario, rows, problems),
            outcome,
            chosen_task: RwSignal::new(None),
            rows,
            unparsed: RwSignal::new(BTreeSet::new()),
            shelf: opening.shelf,
        }
    }

    /// One part of the scenario, read by a view, as a memo: the view
    /// updates only when that part changes. Views read the scenario through
    /// parts rather than directly because every edit re-runs each direct
    /// reader, and the framework's cost of re-subscribing grows with the
    /// number of readers (measured: 4 ms an edit on a 20-task day).
    pub fn part<T: Clone + PartialEq + Send + Sync + 'static>(
        &self,
        read: impl Fn(&Scenario) -> T + Send + Sync + 'static,
    ) -> Memo<T> {
        let scenario = self.scenario;
        Memo::new(move |_| scenario.with(&read))
    }

    /// The validation problem of the scenario's own field at `path` (its
    /// name, its list of tasks), in the words `words` gives it, as a memo
    /// that changes only when that field's problem does.
    pub fn problem_at(
        &self,
        path: Signal<String>,
        words: impl Fn(&Problem) -> String + Send + Sync + 'static,
    ) -> Memo<Option<String>> {
        let problems = self.problems;
        Memo::new(move |_| {
            problems.track();
            path.with(|path| problem_of(problems, path, &words))
        })
    }

    /// The validation problem of the field at `path` (a path that follows
    /// its row) in the row whose change signal is `row`, in the words
    /// `words` gives it: re-read only when that row changes (the row's
    /// signal covers its problems), not on every edit.
    pub fn problem_in(
        &self,
        row: Signal<()>,
        path: Signal<String>,
        words: impl Fn(&Problem) -> String + Send + Sync + 'static,
    ) -> Memo<Option<String>> {
        let problems = self.problems;
        Memo::new(move |_| {
            row.track();
            path.with(|path| problem_of(problems, path, &words))
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
    /// A task or option it adds at the end of its list gets a new row.
    pub fn edit(&self, edit: impl FnOnce(&mut Scenario)) {
        self.scenario.update(edit);
        self.scenario
            .with_untracked(|s| self.rows.maybe_update(|rows| rows.fit(s)));
        self.row_watch.check();
        self.store();
    }

    /// Removes the task with row id `id`, keeping it to be put back;
    /// returns whether it was there.
    pub fn remove_task(&self, id: u64) -> bool {
        let mut removed = false;
        self.scenario
            .update(|s| self.rows.update(|rows| removed = rows.remove_task(s, id)));
        self.store();
        removed
    }

    /// Puts the task removed last back in its place; returns where it went.
    pub fn put_back_task(&self) -> Option<usize> {
        if self
            .rows
            .with_untracked(|rows| rows.removed_task().is_none())
        {
            return None;
        }
        let mut at = None;
        self.scenario
            .update(|s| self.rows.update(|rows| at = rows.put_back_task(s)));
        self.store();
        at
    }

    /// Removes the lens option with row id `id`.
    pub fn remove_option(&self, id: u64) {
        self.scenario
            .update(|s| self.rows.update(|rows| _ = rows.remove_option(s, id)));
        self.store();
    }

    /// Stores the scenario being edited.
    fn store(&self) {
        self.scenario.with_untracked(|s| self.shelf.autosave(s));
    }

    /// Switches the length unit and remembers it for the next visit; every
    /// row is drawn afresh in the new unit.
    pub fn set_unit(&self, unit: LengthUnit) {
        self.scenario
            .with_untracked(|s| self.rows.update(|rows| rows.renew(s)));
        self.unit.set(unit);
        self.shelf.run(|s| s.remember(Some(unit)));
    }

    /// Replaces the scenario on screen (opened, reloaded, taken from another
    /// tab) without storing it again; every row is drawn afresh.
    pub fn replace_scenario(&self, scenario: Scenario) {
        self.rows.update(|rows| rows.renew(&scenario));
        self.scenario.set(scenario);
    }

    /// Shows `scenario` if there is one: what a shelf operation opened.
    pub fn show(&self, scenario: Option<Scenario>) {
        if let Some(scenario) = scenario {
            self.replace_scenario(scenario);
        }
    }
}

/// The problem at `path` among the gate's `problems` (read without
/// tracking them), in the words `words` gives it.
fn problem_of(
    problems: Memo<Vec<FieldError>>,
    path: &str,
    words: &impl Fn(&Problem) -> String,
) -> Option<String> {
    problems.with_untracked(|errors| {
        errors
            .iter()
            .find(|e| e.path == path)
            .map(|e| words(&e.problem))
    })
}

/// Opens the shelf, creates the app state around the scenario it opens, and
/// provides the state to every component below.
pub fn provide_app_state() -> AppState {
    let opening = Shelf::open();
    mark("shelf-opened");
    let state = AppState::new(opening);
    provide_context(state);
    state
}

/// The app state provided by [`provide_app_state`].
pub fn use_app_state() -> AppState {
    expect_context::<AppState>()
}
