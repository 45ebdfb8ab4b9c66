//! Which rows of the form an edit changed. Every row of the form (the
//! wearer's block, each task, each option) has a change signal of its own,
//! and one watcher, run after each change of the scenario or of the gate's
//! problems, compares every row's content and problems with what it saw
//! last and signals only the rows that differ. The fields of a row depend
//! on that row's signal alone, never on the scenario: an edit then marks
//! one row's views for checking, where a field depending on the scenario
//! (even through a memo) had every field of the form marked and checked on
//! every keystroke (the framework walks and copies each reader's list of
//! readers as it marks them).

use crate::scenario::{FieldError, LensOption, PlanSettings, RowIds, Scenario, Task, Wearer};
use leptos::prelude::*;
use std::collections::HashMap;

/// What a row's views show from the scenario.
#[derive(PartialEq)]
enum Content {
    /// The wearer's block: the wearer and the plan settings.
    Wearer(Box<(Wearer, PlanSettings)>),
    /// A task.
    Task(Box<Task>),
    /// A lens option.
    Option(Box<LensOption>),
}

/// Every row's content and the gate's problems in it, by row id.
type Seen = HashMap<u64, (Content, Vec<FieldError>)>;

/// The row id a problem's path belongs to: `tasks[i].…` to the task at i,
/// `options[i].…` to the option at i, `wearer.…` and `settings.…` to the
/// wearer's block; `None` for the scenario's own fields.
fn row_of(path: &str, rows: &RowIds) -> Option<u64> {
    let listed = |list: &str, ids: &[u64]| {
        let rest = path.strip_prefix(list)?.strip_prefix('[')?;
        let (index, _) = rest.split_once(']')?;
        ids.get(index.parse::<usize>().ok()?).copied()
    };
    if path.starts_with("wearer.") || path.starts_with("settings.") {
        Some(rows.wearer())
    } else {
        listed("tasks", rows.tasks()).or_else(|| listed("options", rows.options()))
    }
}

/// What every row shows now.
fn look(scenario: &Scenario, rows: &RowIds, problems: &[FieldError]) -> Seen {
    let mut seen = Seen::new();
    seen.insert(
        rows.wearer(),
        (
            Content::Wearer(Box::new((scenario.wearer.clone(), scenario.settings))),
            Vec::new(),
        ),
    );
    for (id, task) in rows.tasks().iter().zip(&scenario.tasks) {
        seen.insert(*id, (Content::Task(Box::new(task.clone())), Vec::new()));
    }
    for (id, option) in rows.options().iter().zip(&scenario.options) {
        seen.insert(*id, (Content::Option(Box::new(option.clone())), Vec::new()));
    }
    for problem in problems {
        if let Some((_, list)) = row_of(&problem.path, rows).and_then(|id| seen.get_mut(&id)) {
            list.push(problem.clone());
        }
    }
    seen
}

/// The change signals of the form's rows.
#[derive(Clone, Copy)]
pub struct RowWatch {
    signals: StoredValue<HashMap<u64, ArcTrigger>>,
    /// What every row showed when last checked; `None` before the first check.
    seen: StoredValue<Option<Seen>>,
    scenario: RwSignal<Scenario>,
    rows: RwSignal<RowIds>,
    problems: Memo<Vec<FieldError>>,
}

impl RowWatch {
    /// Watches `scenario` and `problems` for the rows `rows` lists.
    pub fn new(
        scenario: RwSignal<Scenario>,
        rows: RwSignal<RowIds>,
        problems: Memo<Vec<FieldError>>,
    ) -> RowWatch {
        let watch = RowWatch {
            signals: StoredValue::new(HashMap::new()),
            seen: StoredValue::new(None),
            scenario,
            rows,
            problems,
        };
        Effect::new(move |_| {
            scenario.track();
            rows.track();
            problems.track();
            watch.check();
        });
        watch
    }

    /// Signals every row whose content or problems changed since the last
    /// check. Run after each change by the watcher, and at once by an edit
    /// (`AppState::edit`): the edited row's fields then hear of the new
    /// value in the same turn as of the text typed, and a field never
    /// writes the old value back into the input for a moment, which would
    /// move the caret to the end of the text.
    pub fn check(self) {
        let now = self.scenario.with_untracked(|s| {
            self.rows
                .with_untracked(|r| self.problems.with_untracked(|p| look(s, r, p)))
        });
        if let Some(before) = self.seen.try_update_value(Option::take).flatten() {
            self.signals.update_value(|signals| {
                signals.retain(|id, _| now.contains_key(id));
                for (id, signal) in signals.iter() {
                    if before.get(id) != now.get(id) {
                        signal.notify();
                    }
                }
            });
        }
        self.seen.set_value(Some(now));
    }

    /// The change signal of the row with id `id`: notified whenever that
    /// row's content or its problems change.
    pub fn signal(self, id: u64) -> ArcTrigger {
        self.signals
            .try_update_value(|signals| signals.entry(id).or_default().clone())
            .unwrap_or_default()
    }
}
