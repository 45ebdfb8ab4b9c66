//! Binds one number of the scenario to a form field through its entry in
//! the field table ([`crate::scenario::fields`]): reads it in the unit the
//! user sees, writes accepted input back in the stored unit, shows the
//! field's help, and the validation problem of its path in the user's words.

use super::fields::NumberField;
use super::state::use_app_state;
use crate::display::{describe_problem, shown_symbol, to_shown, to_stored};
use crate::scenario::fields::{Field, Unit};
use leptos::prelude::*;

/// Where a field's row stands in its list now: a task's or an option's
/// position, following the row as rows before it come and go (`None` once
/// it is gone); an eye; 0 for a field of the scenario itself.
pub type RowAt = Signal<Option<usize>>;

/// The form field of table entry `field` at a row that never moves: an
/// eye (0 right, 1 left), or 0 for a field of the scenario itself.
pub fn number_field(field: &'static Field, index: usize) -> impl IntoView {
    row_field(field, Signal::stored(Some(index)))
}

/// The form field of table entry `field` in the row at `at`.
pub fn row_field(field: &'static Field, at: RowAt) -> impl IntoView {
    let state = use_app_state();
    let length = state.unit;
    let unit = field.unit;
    let value = Signal::derive(move || {
        let l = length.get();
        let index = at.get()?;
        state
            .scenario
            .with(|s| (field.get)(s, index))
            .map(|v| to_shown(unit, l, v))
    });
    let on_input = Callback::new(move |v: Option<f64>| {
        let l = length.get_untracked();
        if let Some(index) = at.get_untracked() {
            state.edit(|s| (field.set)(s, index, v.map(|v| to_stored(unit, l, v))));
        }
    });
    let path = Signal::derive(move || at.get().map(|i| field.path(i)).unwrap_or_default());
    let test_id = Signal::derive(move || path.with(|p| p.replace(['[', ']', '.'], "-")));
    let problem = Signal::derive(move || {
        path.with(|path| state.problem_at(path))
            .map(|p| describe_problem(&p, field.label, unit, length.get()))
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
