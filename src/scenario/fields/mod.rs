//! The one table of the numbers a user edits: for each, where it sits in a
//! [`Scenario`] (a path pattern), its label, unit, allowed range (from the
//! core's one bounds table [`crate::core::limits`]), starting value, a short
//! help text, and plain functions that read and write it. The scenario gate,
//! the input panels, the display of problems and the field help all loop
//! over or look up this table, so a number is described once.
//!
//! The entries live by topic: [`wearer`] (the wearer and the plan's limits),
//! [`task`] (one task of the working day) and [`lens`] (the open parameters
//! of a lens family, one entry per [`Parameter`] of the core catalogue).

mod lens;
mod task;
mod wearer;

pub use lens::*;
pub use task::*;
pub use wearer::*;

use super::model::Scenario;
use crate::core::bounds::Bounds;
use crate::core::lens::Parameter;

/// The unit a number is stored in (and, except for lengths and shares, typed in).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Unit {
    /// Years of age.
    Years,
    /// Dioptres (powers, additions, amplitudes, depths of field); written
    /// with an explicit sign, as prescriptions are.
    Dioptres,
    /// Degrees of angle.
    Degrees,
    /// Prism dioptres (centimetres of deviation per metre).
    PrismDioptres,
    /// Millimetres (frame and fitting measurements, detail sizes).
    Millimetres,
    /// Metres, typed and shown in the user's length unit (cm or inches).
    Metres,
    /// Hours a day.
    Hours,
    /// Luminance, in candelas per square metre.
    CandelasPerSquareMetre,
    /// A share from 0 to 1, typed and shown as a percentage.
    Share,
    /// A ratio without unit (a share of an addition, a decimal acuity).
    Ratio,
}

impl Unit {
    /// The symbol of the stored unit, as the core's bounds table writes it
    /// ("D", "mm", "m"; empty for a share or a ratio).
    pub fn symbol(self) -> &'static str {
        match self {
            Unit::Years => "years",
            Unit::Dioptres => "D",
            Unit::Degrees => "°",
            Unit::PrismDioptres => "Δ",
            Unit::Millimetres => "mm",
            Unit::Metres => "m",
            Unit::Hours => "h",
            Unit::CandelasPerSquareMetre => "cd/m²",
            Unit::Share | Unit::Ratio => "",
        }
    }
}

/// Where a field sits, and what its index counts.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Scope {
    /// One field of the scenario; the key is its whole path. No index.
    Scenario,
    /// A field of each eye's prescription: index 0 is the right eye, 1 the left.
    Eye,
    /// A field of each task: the index is the task's position.
    Task,
    /// An open parameter of each lens option's family: the index is the
    /// option's position.
    Lens(Parameter),
}

/// A field's help, in plain words: what it is, how it is measured, and the
/// usual range with its source (or "common practice").
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Help {
    /// What the number is.
    pub what: &'static str,
    /// How it is measured or found.
    pub how: &'static str,
    /// The usual range, and where that comes from.
    pub usual: &'static str,
}

impl Help {
    /// The three parts as one paragraph.
    pub fn text(&self) -> String {
        format!("{} {} {}", self.what, self.how, self.usual)
    }
}

/// Reads a field of the scenario at an index (see [`Scope`]); `None` when
/// the field does not apply (no such task, another variant chosen) or an
/// optional field is empty.
pub type Getter = fn(&Scenario, usize) -> Option<f64>;

/// Writes a field of the scenario at an index; `None` empties an optional
/// field. Nothing happens when the field does not apply.
pub type Setter = fn(&mut Scenario, usize, Option<f64>);

/// One number the user edits.
#[derive(Debug, Clone, Copy)]
pub struct Field {
    /// Where the field sits.
    pub scope: Scope,
    /// The last part of its path (the whole path for [`Scope::Scenario`]).
    pub key: &'static str,
    /// The label shown beside it.
    pub label: &'static str,
    /// The stored unit.
    pub unit: Unit,
    /// The allowed range, in the stored unit (an entry of `core::limits`).
    pub bounds: Bounds,
    /// The value a new scenario, task or choice starts with; `None` for an
    /// optional field that starts empty (not given, or left to the planner).
    pub default: Option<f64>,
    /// Whether the field may be left empty.
    pub optional: bool,
    /// The field's help.
    pub help: Help,
    /// Reads the field.
    pub get: Getter,
    /// Writes the field.
    pub set: Setter,
}

/// The names of the eyes in field paths, right first.
const EYES: [&str; 2] = ["right", "left"];

impl Field {
    /// The field's path at `index`, as the scenario gate reports problems
    /// and the saved JSON nests it (`tasks[2].distance_m`).
    pub fn path(&self, index: usize) -> String {
        match self.scope {
            Scope::Scenario => self.key.to_string(),
            Scope::Eye => format!("wearer.{}.{}", EYES[index.min(1)], self.key),
            Scope::Task => format!("tasks[{index}].{}", self.key),
            Scope::Lens(_) => format!("options[{index}].{}", self.key),
        }
    }

    /// The indices at which the field exists in `scenario`.
    pub fn indices(&self, scenario: &Scenario) -> std::ops::Range<usize> {
        match self.scope {
            Scope::Scenario => 0..1,
            Scope::Eye => 0..EYES.len(),
            Scope::Task => 0..scenario.tasks.len(),
            Scope::Lens(_) => 0..scenario.options.len(),
        }
    }

    /// The starting value; zero for an optional field that starts empty
    /// (never used: such a field is written only when the user types).
    pub fn start(&self) -> f64 {
        self.default.unwrap_or(0.0)
    }
}

/// Every field, in the order the gate checks them and the form shows them.
pub fn all() -> impl Iterator<Item = &'static Field> {
    WEARER.iter().chain(TASK.iter()).chain(LENS.iter()).copied()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::scenario::{validate, Scenario};

    #[test]
    fn units_agree_with_the_bounds_table() {
        for f in all() {
            assert_eq!(f.unit.symbol(), f.bounds.unit, "{}", f.key);
        }
    }

    #[test]
    fn defaults_lie_in_their_bounds_and_required_fields_have_one() {
        for f in all() {
            match f.default {
                Some(d) => assert!(f.bounds.check(d).is_ok(), "{}: {d}", f.key),
                None => assert!(f.optional, "{} needs a starting value", f.key),
            }
        }
    }

    #[test]
    fn every_help_says_what_how_and_the_usual_range_with_its_source() {
        for f in all() {
            let h = f.help;
            for part in [h.what, h.how, h.usual] {
                assert!(
                    part.len() > 10 && part.ends_with('.'),
                    "{}: {part:?}",
                    f.key
                );
            }
            // The usual range names where it comes from, in brackets.
            assert!(h.usual.contains('(') && h.usual.contains(')'), "{}", f.key);
        }
    }

    #[test]
    fn each_lens_parameter_has_its_own_field() {
        for f in LENS {
            match f.scope {
                Scope::Lens(p) => assert_eq!(lens_field(p).key, f.key),
                other => panic!("{} is in the lens list with scope {other:?}", f.key),
            }
        }
    }

    #[test]
    fn paths_are_unique() {
        let mut s = Scenario::untitled();
        s.tasks.push(s.tasks[0].clone());
        let mut seen = std::collections::BTreeSet::new();
        for f in all() {
            for i in f.indices(&s) {
                let path = f.path(i);
                assert!(seen.insert(path.clone()), "{path} twice");
            }
        }
    }

    /// What a field's setter writes, its getter reads back, at the path the
    /// gate reports: a value beyond the bounds is refused at exactly that path.
    #[test]
    fn getters_setters_and_the_gate_agree() {
        let mut base = Scenario::untitled();
        base.options.push(crate::scenario::LensOption {
            label: "segments".to_string(),
            family: crate::scenario::FamilyChoice::DoubleSegment {
                addition_d: None,
                lower_top_mm: None,
                upper_bottom_mm: None,
            },
        });
        base.options.push(crate::scenario::LensOption {
            label: "trifocal".to_string(),
            family: crate::scenario::FamilyChoice::Trifocal {
                addition_d: None,
                intermediate_ratio: None,
                segment_top_mm: None,
            },
        });
        for f in all() {
            for i in f.indices(&base) {
                let mut s = base.clone();
                let inside = f.default.unwrap_or(f.bounds.min);
                (f.set)(&mut s, i, Some(inside));
                if (f.get)(&s, i).is_none() {
                    continue; // another variant is chosen, or the family lacks it
                }
                assert_eq!((f.get)(&s, i), Some(inside), "{}", f.path(i));
                (f.set)(&mut s, i, Some(f.bounds.max + 1000.0));
                let errors = validate(s).expect_err("beyond the bounds");
                assert!(
                    errors.iter().any(|e| e.path == f.path(i)),
                    "{}: {errors:?}",
                    f.path(i)
                );
            }
        }
    }
}
