//! Binds one number of the scenario to a form field: reads it in the unit
//! the user sees, writes accepted input back in the stored unit, and shows
//! the validation problem of that field path in the user's words.

use super::fields::NumberField;
use super::state::use_app_state;
use crate::core::units::Metres;
use crate::display::describe_problem;
use crate::scenario::Scenario;
use leptos::prelude::*;

/// How a stored number is shown.
#[derive(Clone, Copy)]
pub enum Shown {
    /// As stored, with this unit symbol.
    As(&'static str),
    /// A length stored in metres, shown in the user's length unit.
    Length,
    /// A share stored as 0–1, shown as a percentage.
    Percent,
}

impl Shown {
    fn to_shown(self, unit: crate::display::LengthUnit, stored: f64) -> f64 {
        match self {
            Shown::As(_) => stored,
            Shown::Length => unit.from_metres(Metres(stored)),
            Shown::Percent => stored * 100.0,
        }
    }

    fn to_stored(self, unit: crate::display::LengthUnit, shown: f64) -> f64 {
        match self {
            Shown::As(_) => shown,
            Shown::Length => unit.to_metres(shown).0,
            Shown::Percent => shown / 100.0,
        }
    }
}

/// A number field bound to the scenario value at `path`, read by `get` and
/// written by `set` in stored units. `optional` fields may be left empty.
pub fn scenario_number(
    label: &str,
    path: String,
    shown: Shown,
    get: impl Fn(&Scenario) -> Option<f64> + Copy + Send + Sync + 'static,
    set: impl Fn(&mut Scenario, Option<f64>) + Copy + Send + Sync + 'static,
    optional: bool,
) -> impl IntoView {
    row_number(label, Signal::stored(path), shown, get, set, optional)
}

/// A number field of a row that moves in its list (a task, a lens
/// option): as [`scenario_number`], with a `path` that follows the row.
pub fn row_number(
    label: &str,
    path: Signal<String>,
    shown: Shown,
    get: impl Fn(&Scenario) -> Option<f64> + Copy + Send + Sync + 'static,
    set: impl Fn(&mut Scenario, Option<f64>) + Copy + Send + Sync + 'static,
    optional: bool,
) -> impl IntoView {
    let state = use_app_state();
    let unit = state.unit;
    let value = Signal::derive(move || {
        let u = unit.get();
        state
            .scenario
            .with(|s| get(s))
            .map(|v| shown.to_shown(u, v))
    });
    let on_input = Callback::new(move |v: Option<f64>| {
        let u = unit.get_untracked();
        state.edit(|s| set(s, v.map(|v| shown.to_stored(u, v))));
    });
    let test_id = Signal::derive(move || path.with(|p| p.replace(['[', ']', '.'], "-")));
    let problem = Signal::derive(move || {
        path.with(|path| state.problem_at(path))
            .map(|p| describe_problem(&p, unit.get()))
    });
    let unit_text = Signal::derive(move || match shown {
        Shown::As(symbol) => symbol.to_string(),
        Shown::Length => unit.get().symbol().to_string(),
        Shown::Percent => "%".to_string(),
    });
    let decimals = match shown {
        Shown::Percent => 0,
        _ => 2,
    };
    view! {
        <NumberField
            label=label.to_string()
            unit=unit_text
            value=value
            on_input=on_input
            problem=problem
            optional=optional
            placeholder=if optional { "none" } else { "" }
            decimals=decimals
            signed=matches!(shown, Shown::As("D"))
            test_id=test_id
        />
    }
}
