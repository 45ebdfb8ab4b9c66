//! Binds one number of the scenario to a form field through its entry in
//! the field table ([`crate::scenario::fields`]): reads it in the unit the
//! user sees, writes accepted input back in the stored unit, shows the
//! field's help, and the validation problem of its path in the user's words.

use super::fields::NumberField;
use super::state::use_app_state;
use crate::display::{describe_problem, shown_symbol, to_shown, to_stored};
use crate::scenario::fields::{Field, Unit};
use crate::scenario::{Problem, RowIds, Scenario};
use leptos::prelude::*;

/// One row of the form: the wearer's block, a task or a lens option.
///
/// A row's views re-read the scenario only when the row's own content
/// or its problems change (`web::row_watch`): an edit reaches only the
/// views of the row it changed, instead of every view of the form (the
/// framework's cost of marking and re-running readers grows with their
/// number).
#[derive(Clone, Copy)]
pub struct Row {
    /// Where the row stands in its list now: a task's or an option's
    /// position, following the row as rows before it come and go (`None`
    /// once it is gone); an eye; 0 for the wearer's block.
    pub at: Signal<Option<usize>>,
    /// Changes whenever the row's content or its problems do
    /// (`RowWatch`).
    changed: Signal<()>,
}

impl Row {
    /// The row with id `id` of a list (a task, an option), now at `at`.
    pub fn listed(id: u64, at: Memo<Option<usize>>) -> Row {
        let signal = use_app_state().row_watch.signal(id);
        Row {
            at: at.into(),
            changed: Signal::derive(move || signal.track()),
        }
    }

    /// A row of the wearer's block that never moves: an eye (0 right,
    /// 1 left), or 0 for a field of the wearer or the plan settings.
    pub fn wearer(index: usize) -> Row {
        let state = use_app_state();
        let signal = state
            .row_watch
            .signal(state.rows.with_untracked(RowIds::wearer));
        Row {
            at: Signal::stored(Some(index)),
            changed: Signal::derive(move || signal.track()),
        }
    }

    /// The validation problem of the field at `path` in this row, in the
    /// words `words` gives it, re-read only when the row changes.
    pub fn problem(
        self,
        path: Signal<String>,
        words: impl Fn(&Problem) -> String + Send + Sync + 'static,
    ) -> Memo<Option<String>> {
        use_app_state().problem_in(self.changed, path, words)
    }

    /// The path of `field` in this row of `list` (`tasks[1].name`), as the
    /// gate reports problems, following the row as it moves.
    pub fn path(self, list: &'static str, field: &'static str) -> Signal<String> {
        Memo::new(move |_| {
            self.at
                .get()
                .map(|i| format!("{list}[{i}].{field}"))
                .unwrap_or_default()
        })
        .into()
    }

    /// What `read` takes from this row, as a memo re-read only when the
    /// row changes; `None` once the row is gone.
    pub fn part<T: Clone + PartialEq + Send + Sync + 'static>(
        self,
        read: impl Fn(&Scenario, usize) -> Option<T> + Send + Sync + 'static,
    ) -> Memo<Option<T>> {
        let scenario = use_app_state().scenario;
        Memo::new(move |_| {
            self.changed.track();
            let index = self.at.get()?;
            scenario.with_untracked(|s| read(s, index))
        })
    }
}

/// The form field of table entry `field` in the wearer's block: an eye
/// (0 right, 1 left), or 0 for a field of the wearer or the settings.
pub fn number_field(field: &'static Field, index: usize) -> impl IntoView {
    row_field(field, Row::wearer(index))
}

/// The form field of table entry `field` in `row`.
pub fn row_field(field: &'static Field, row: Row) -> impl IntoView {
    let state = use_app_state();
    let length = state.unit;
    let unit = field.unit;
    let at = row.at;
    let stored = row.part(move |s, index| (field.get)(s, index));
    let value = Memo::new(move |_| stored.get().map(|v| to_shown(unit, length.get(), v)));
    let on_input = Callback::new(move |v: Option<f64>| {
        let l = length.get_untracked();
        if let Some(index) = at.get_untracked() {
            state.edit(|s| (field.set)(s, index, v.map(|v| to_stored(unit, l, v))));
        }
    });
    let path: Signal<String> =
        Memo::new(move |_| at.get().map(|i| field.path(i)).unwrap_or_default()).into();
    let test_id = Signal::derive(move || path.with(|p| p.replace(['[', ']', '.'], "-")));
    let problem = row.problem(path, move |p| {
        describe_problem(p, field.label, unit, length.get())
    });
    let unit_text = Signal::derive(move || shown_symbol(unit, length.get()).to_string());
    view! {
        <NumberField
            label=field.label
            unit=unit_text
            value=value
            on_input=on_input
            problem=problem
            optional=field.optional
            placeholder=if field.optional { "none" } else { "" }
            decimals=if unit == Unit::Share { 0 } else { 2 }
            signed=unit == Unit::Dioptres
            help=field.help.text()
            test_id=test_id
        />
    }
}
