//! The one error type of the optics core: invalid input to a formula (a
//! number that is not finite, a distance or power outside what the model can
//! handle, an age outside the range a published model was fitted to). Physical
//! outcomes such as "nothing is in focus" are values, never errors; this type
//! is only for input that must be corrected before the optics can run.
//! The helper constructors here let every core module check its input the same
//! way, so messages read alike across the product.

use crate::core::bounds::{unit_suffix, Bounds, RangeFault};
use std::fmt;

/// Why a core formula refused its input. Every message says what is wrong
/// and what is allowed, so a user can correct the entry.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum OpticsError {
    /// A quantity is NaN or infinite (for example an empty form field read as NaN).
    NotFinite {
        /// Name of the quantity, as a user would recognise it ("viewing distance").
        quantity: &'static str,
    },
    /// A quantity lies outside the range the formula accepts.
    OutOfRange {
        /// Name of the quantity.
        quantity: &'static str,
        /// The value given, in `unit`.
        value: f64,
        /// Smallest allowed value, in `unit`.
        min: f64,
        /// Largest allowed value, in `unit`.
        max: f64,
        /// Unit symbol of the three numbers ("m", "D", "years"); may be empty.
        unit: &'static str,
    },
    /// A quantity lies outside the range a published model was fitted to, so
    /// the model would only extrapolate (for example an age outside the data
    /// of an accommodation study).
    OutsideModel {
        /// Name of the model ("Anderson et al. 2008").
        model: &'static str,
        /// Name of the quantity.
        quantity: &'static str,
        /// The value given, in `unit`.
        value: f64,
        /// Smallest supported value, in `unit`.
        min: f64,
        /// Largest supported value, in `unit`.
        max: f64,
        /// Unit symbol of the three numbers.
        unit: &'static str,
    },
    /// Several inputs are each acceptable but together describe an optical
    /// system the model cannot handle (for example a lens so strong at its
    /// vertex distance that its image falls at the eye).
    Incompatible {
        /// What is wrong, in plain words.
        problem: &'static str,
        /// What the user can change.
        remedy: &'static str,
    },
}

impl OpticsError {
    /// Returns `value` if it is finite, else a [`OpticsError::NotFinite`] naming `quantity`.
    pub fn finite(quantity: &'static str, value: f64) -> Result<f64, OpticsError> {
        if value.is_finite() {
            Ok(value)
        } else {
            Err(OpticsError::NotFinite { quantity })
        }
    }

    /// Returns `value` if it is finite and within `[min, max]` (inclusive),
    /// else the matching error.
    pub fn in_range(
        quantity: &'static str,
        value: f64,
        min: f64,
        max: f64,
        unit: &'static str,
    ) -> Result<f64, OpticsError> {
        within(quantity, value, Bounds::new(min, max, unit), || {
            OpticsError::OutOfRange {
                quantity,
                value,
                min,
                max,
                unit,
            }
        })
    }

    /// Returns `value` if it is finite and within the range `[min, max]` a
    /// published `model` supports, else the matching error.
    pub fn in_model_range(
        model: &'static str,
        quantity: &'static str,
        value: f64,
        min: f64,
        max: f64,
        unit: &'static str,
    ) -> Result<f64, OpticsError> {
        within(quantity, value, Bounds::new(min, max, unit), || {
            OpticsError::OutsideModel {
                model,
                quantity,
                value,
                min,
                max,
                unit,
            }
        })
    }
}

/// Checks `value` against `bounds`: a value that is not a number is
/// [`OpticsError::NotFinite`], one outside the range is the error `outside` makes.
fn within(
    quantity: &'static str,
    value: f64,
    bounds: Bounds,
    outside: impl FnOnce() -> OpticsError,
) -> Result<f64, OpticsError> {
    bounds.check(value).map_err(|fault| match fault {
        RangeFault::NotFinite => OpticsError::NotFinite { quantity },
        RangeFault::OutOfRange => outside(),
    })
}

impl fmt::Display for OpticsError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            OpticsError::NotFinite { quantity } => {
                write!(f, "{quantity} is missing or not a number; enter a number")
            }
            OpticsError::OutOfRange {
                quantity,
                value,
                min,
                max,
                unit,
            } => {
                let u = unit_suffix(unit);
                write!(
                    f,
                    "{quantity} of {value}{u} is outside the allowed range {min} to {max}{u}"
                )
            }
            OpticsError::OutsideModel {
                model,
                quantity,
                value,
                min,
                max,
                unit,
            } => {
                let u = unit_suffix(unit);
                write!(
                    f,
                    "{quantity} of {value}{u} is outside the range {min} to {max}{u} \
                     that the {model} model covers; choose another model or enter a measured value"
                )
            }
            OpticsError::Incompatible { problem, remedy } => write!(f, "{problem}; {remedy}"),
        }
    }
}

impl std::error::Error for OpticsError {}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn messages_say_what_is_wrong_and_what_is_allowed() {
        let cases: [(Result<f64, OpticsError>, &str); 4] = [
            (
                OpticsError::finite("viewing distance", f64::NAN),
                "viewing distance is missing or not a number; enter a number",
            ),
            (
                OpticsError::in_range("viewing distance", -0.4, 0.02, 1000.0, "m"),
                "viewing distance of -0.4 m is outside the allowed range 0.02 to 1000 m",
            ),
            (
                OpticsError::in_model_range(
                    "Anderson et al. 2008",
                    "age",
                    80.0,
                    3.0,
                    70.0,
                    "years",
                ),
                "age of 80 years is outside the range 3 to 70 years that the Anderson et al. 2008 \
                 model covers; choose another model or enter a measured value",
            ),
            (
                OpticsError::in_range("usable share", 1.5, 0.0, 1.0, ""),
                "usable share of 1.5 is outside the allowed range 0 to 1",
            ),
        ];
        for (result, expected) in cases {
            assert_eq!(result.unwrap_err().to_string(), expected);
        }
    }

    #[test]
    fn accepts_values_on_the_bounds() {
        assert_eq!(OpticsError::in_range("x", 0.0, 0.0, 1.0, ""), Ok(0.0));
        assert_eq!(OpticsError::in_range("x", 1.0, 0.0, 1.0, ""), Ok(1.0));
        assert!(OpticsError::in_range("x", f64::INFINITY, 0.0, 1.0, "").is_err());
    }
}
