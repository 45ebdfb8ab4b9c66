//! Binds one number of the scenario to a form field through its entry in
//! the field table ([`crate::scenario::fields`]): reads it in the unit the
//! user sees, writes accepted input back in the stored unit, shows the
//! field's help, and the validation problem of its path in the user's words.

use super::fields::NumberField;
use super::state::use_app_state;
use crate::display::{describe_problem, shown_symbol, to_shown, to_stored};
use crate::scenario::fields::{Field, Unit};
use leptos::prelude::*;

/// The form field of table entry `field` at `index` (a task's or an
/// option's position, an eye; 0 for a field of the scenario itself).
pub fn number_field(field: &'static Field, index: usize) -> impl IntoView {
    let state = use_app_state();
    let length = state.unit;
    let unit = field.unit;
    let value = Signal::derive(move || {
        let l = length.get();
        state
            .scenario
            .with(|s| (field.get)(s, index))
            .map(|v| to_shown(unit, l, v))
    });
    let on_input = Callback::new(move |v: Option<f64>| {
        let l = length.get_untracked();
        state.edit(|s| (field.set)(s, index, v.map(|v| to_stored(unit, l, v))));
    });
    let path = field.path(index);
    let test_id = path.replace(['[', ']', '.'], "-");
    let problem = Signal::derive(move || {
        state
            .problem_at(&path)
            .map(|p| describe_problem(&p, unit, length.get()))
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
