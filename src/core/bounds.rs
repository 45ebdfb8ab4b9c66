//! The one range check of the product: an inclusive range of allowed values
//! with its unit, and the two ways a number can fail it (not a number at
//! all, or outside the range). The optics core, the lens and gaze models and
//! the scenario gate each turn a failure into their own error type, so their
//! messages stay their own while the check itself is written once.

/// An inclusive range of allowed values, `min..=max`, in the unit `unit`
/// ("m", "mm", "D", "°", "years"; empty for a ratio).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Bounds {
    /// Smallest allowed value, in `unit`.
    pub min: f64,
    /// Largest allowed value, in `unit`.
    pub max: f64,
    /// The unit's symbol, for messages; empty for a quantity without unit.
    pub unit: &'static str,
}

/// Why a value failed a [`Bounds`] check.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum RangeFault {
    /// The value is NaN or infinite.
    NotFinite,
    /// The value is finite but below `min` or above `max`.
    OutOfRange,
}

impl Bounds {
    /// The range `min..=max` in `unit`.
    pub const fn new(min: f64, max: f64, unit: &'static str) -> Bounds {
        Bounds { min, max, unit }
    }

    /// Returns `value` if it is finite and within `min..=max`, else why not.
    ///
    /// ```
    /// use clearspan::core::bounds::{Bounds, RangeFault};
    /// let addition = Bounds::new(0.0, 4.0, "D");
    /// assert_eq!(addition.check(4.0), Ok(4.0));
    /// assert_eq!(addition.check(4.25), Err(RangeFault::OutOfRange));
    /// assert_eq!(addition.check(f64::NAN), Err(RangeFault::NotFinite));
    /// ```
    pub fn check(&self, value: f64) -> Result<f64, RangeFault> {
        if !value.is_finite() {
            Err(RangeFault::NotFinite)
        } else if value < self.min || value > self.max {
            Err(RangeFault::OutOfRange)
        } else {
            Ok(value)
        }
    }
}

/// The unit as it follows a number in a message: " unit" with a leading
/// space, or nothing for a quantity without unit.
pub fn unit_suffix(unit: &str) -> String {
    if unit.is_empty() {
        String::new()
    } else {
        format!(" {unit}")
    }
}
