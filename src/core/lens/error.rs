//! The error type for lens-family, astigmatism and gaze computations: every
//! way a parameter handed to these modules can be unusable, each with a
//! message that says what is wrong and what is allowed.

use crate::core::bounds::{unit_suffix, Bounds, RangeFault};
use std::fmt;

/// A parameter of a lens design, a fitting or a task that the lens and gaze
/// models cannot use. Physical outcomes ("no zone gives this addition") are
/// not errors; they are values of the functions that compute them.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum LensError {
    /// A parameter is NaN or infinite.
    NotFinite {
        /// The parameter's name as the user sees it.
        parameter: &'static str,
    },
    /// A parameter lies outside the range the models support.
    OutOfRange {
        /// The parameter's name as the user sees it.
        parameter: &'static str,
        /// The value given.
        value: f64,
        /// Smallest allowed value.
        min: f64,
        /// Largest allowed value.
        max: f64,
        /// Unit of the value and the bounds ("D", "mm", "°", "m" or "").
        unit: &'static str,
    },
    /// A degressive lens would lose more power upwards than its near addition holds.
    DegressionExceedsAddition {
        /// Degression asked for, in dioptres.
        degression_d: f64,
        /// Near addition, in dioptres.
        near_addition_d: f64,
    },
    /// The upper segment of a double-segment lens would not lie above the lower one.
    SegmentsOverlap {
        /// Top of the lower segment relative to the fitting point, in millimetres.
        lower_top_mm: f64,
        /// Bottom of the upper segment relative to the fitting point, in millimetres.
        upper_bottom_mm: f64,
    },
    /// A lens option leaves a parameter to the planner, so no single design can be built.
    MissingParameter {
        /// The parameter left open.
        parameter: &'static str,
    },
    /// A task lies where no line of sight from the eyes can reach it
    /// (its sideways offset or height is not smaller than its distance).
    TaskUnreachable {
        /// What is inconsistent about the task position.
        reason: &'static str,
    },
    /// A range whose lower end is above its upper end.
    EmptyRange {
        /// The range's name as the user sees it.
        parameter: &'static str,
    },
}

impl fmt::Display for LensError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            LensError::NotFinite { parameter } => write!(f, "{parameter} must be a number"),
            LensError::OutOfRange {
                parameter,
                value,
                min,
                max,
                unit,
            } => {
                let unit = unit_suffix(unit);
                write!(
                    f,
                    "{parameter} is {value}{unit}; it must lie between {min} and {max}{unit}"
                )
            }
            LensError::DegressionExceedsAddition {
                degression_d,
                near_addition_d,
            } => write!(
                f,
                "the degression of {degression_d} D is larger than the near addition of \
                 {near_addition_d} D; it must not exceed the near addition"
            ),
            LensError::SegmentsOverlap {
                lower_top_mm,
                upper_bottom_mm,
            } => write!(
                f,
                "the upper segment starts at {upper_bottom_mm} mm, not above the lower segment \
                 top at {lower_top_mm} mm; it must start higher than the lower segment top"
            ),
            LensError::MissingParameter { parameter } => write!(
                f,
                "{parameter} is left to the planner; give a value to build a single lens"
            ),
            LensError::TaskUnreachable { reason } => write!(f, "the task cannot be seen: {reason}"),
            LensError::EmptyRange { parameter } => write!(
                f,
                "{parameter} has its lower end above its upper end; give the lower end first"
            ),
        }
    }
}

impl std::error::Error for LensError {}

/// The allowed range of one parameter, with the parameter's name as the
/// user sees it, for messages.
#[derive(Debug, Clone, Copy)]
pub(crate) struct NamedBounds {
    pub(crate) parameter: &'static str,
    pub(crate) bounds: Bounds,
}

impl NamedBounds {
    /// The range `min..=max` in `unit` of the parameter called `parameter`.
    pub(crate) const fn new(
        parameter: &'static str,
        min: f64,
        max: f64,
        unit: &'static str,
    ) -> NamedBounds {
        NamedBounds {
            parameter,
            bounds: Bounds::new(min, max, unit),
        }
    }

    /// The range `bounds` of the parameter called `parameter`.
    pub(crate) const fn of(parameter: &'static str, bounds: Bounds) -> NamedBounds {
        NamedBounds { parameter, bounds }
    }

    /// Checks that `value` is finite and within `[min, max]`.
    pub(crate) fn check(&self, value: f64) -> Result<f64, LensError> {
        let Bounds { min, max, unit } = self.bounds;
        self.bounds.check(value).map_err(|fault| match fault {
            RangeFault::NotFinite => LensError::NotFinite {
                parameter: self.parameter,
            },
            RangeFault::OutOfRange => LensError::OutOfRange {
                parameter: self.parameter,
                value,
                min,
                max,
                unit,
            },
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn messages_say_what_is_allowed() {
        let addition = NamedBounds::new("addition", 0.0, 4.0, "D");
        let e = addition.check(5.0).unwrap_err();
        assert_eq!(
            e.to_string(),
            "addition is 5 D; it must lie between 0 and 4 D"
        );
        let e = addition.check(f64::NAN).unwrap_err();
        assert_eq!(e.to_string(), "addition must be a number");
        assert_eq!(addition.check(4.0), Ok(4.0));
    }
}
