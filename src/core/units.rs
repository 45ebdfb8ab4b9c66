//! Physical quantities with their units in the type: dioptres, metres,
//! millimetres, degrees and prism dioptres. Values convert only through the
//! named methods here, so a distance can never be added to a power by mistake.

use serde::{Deserialize, Serialize};
use std::fmt;
use std::ops::{Add, Mul, Neg, Sub};

/// A vergence or a lens power in dioptres (reciprocal metres).
/// Positive is converging (plus lens); negative is diverging.
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd, Default, Serialize, Deserialize)]
pub struct Dioptres(pub f64);

/// A length or distance in metres.
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd, Default, Serialize, Deserialize)]
pub struct Metres(pub f64);

/// A length on the lens or the face in millimetres (fitting data, lens coordinates).
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd, Default, Serialize, Deserialize)]
pub struct Millimetres(pub f64);

/// An angle in degrees.
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd, Default, Serialize, Deserialize)]
pub struct Degrees(pub f64);

/// A prismatic deviation in prism dioptres (1 Δ deviates a ray 1 cm at 1 m).
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd, Default, Serialize, Deserialize)]
pub struct PrismDioptres(pub f64);

impl Dioptres {
    /// The distance whose reciprocal this power is (1 / D metres);
    /// `None` for zero power, whose focal distance is infinite.
    pub fn focal_distance(self) -> Option<Metres> {
        if self.0 == 0.0 {
            None
        } else {
            Some(Metres(1.0 / self.0))
        }
    }

    /// This power rounded to the nearest multiple of `step` dioptres
    /// (0.25 D is the usual prescription step).
    pub fn round_to(self, step: f64) -> Dioptres {
        Dioptres((self.0 / step).round() * step)
    }

    /// The power as prescriptions write it, without unit: explicit sign and
    /// two decimals ("+1.25", "-0.50", "0.00").
    pub fn signed(self) -> String {
        let v = if self.0.abs() < 0.005 { 0.0 } else { self.0 };
        if v > 0.0 {
            format!("+{v:.2}")
        } else {
            format!("{v:.2}")
        }
    }

    /// The absolute value of the power, in dioptres.
    pub fn abs(self) -> Dioptres {
        Dioptres(self.0.abs())
    }
}

impl Metres {
    /// The vergence magnitude 1 / distance, in dioptres (positive for a positive distance).
    pub fn reciprocal(self) -> Dioptres {
        Dioptres(1.0 / self.0)
    }

    /// This length in millimetres.
    pub fn to_mm(self) -> Millimetres {
        Millimetres(self.0 * 1000.0)
    }

    /// This length in centimetres, as a plain number for display.
    pub fn to_cm(self) -> f64 {
        self.0 * 100.0
    }
}

impl Millimetres {
    /// This length in metres.
    pub fn to_m(self) -> Metres {
        Metres(self.0 / 1000.0)
    }
}

impl Degrees {
    /// This angle in radians.
    pub fn to_radians(self) -> f64 {
        self.0.to_radians()
    }

    /// The angle in degrees for `radians`.
    pub fn from_radians(radians: f64) -> Degrees {
        Degrees(radians.to_degrees())
    }
}

macro_rules! linear_quantity {
    ($t:ident) => {
        impl Add for $t {
            type Output = $t;
            fn add(self, other: $t) -> $t {
                $t(self.0 + other.0)
            }
        }
        impl Sub for $t {
            type Output = $t;
            fn sub(self, other: $t) -> $t {
                $t(self.0 - other.0)
            }
        }
        impl Neg for $t {
            type Output = $t;
            fn neg(self) -> $t {
                $t(-self.0)
            }
        }
        impl Mul<f64> for $t {
            type Output = $t;
            fn mul(self, k: f64) -> $t {
                $t(self.0 * k)
            }
        }
    };
}

linear_quantity!(Dioptres);
linear_quantity!(Metres);
linear_quantity!(Millimetres);
linear_quantity!(Degrees);
linear_quantity!(PrismDioptres);

impl fmt::Display for Dioptres {
    /// Writes the power the way prescriptions are written: explicit sign,
    /// two decimals, "D" (for example "+1.25 D", "-0.50 D", "0.00 D").
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{} D", self.signed())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn powers_print_with_explicit_sign() {
        // Prescription notation (ISO 13666 vocabulary, common practice): sign always shown.
        assert_eq!(Dioptres(1.25).to_string(), "+1.25 D");
        assert_eq!(Dioptres(-0.5).to_string(), "-0.50 D");
        assert_eq!(Dioptres(0.001).to_string(), "0.00 D");
    }

    #[test]
    fn rounding_to_quarter_dioptre_steps() {
        // 0.25 D prescription steps: common practice.
        assert_eq!(Dioptres(1.13).round_to(0.25), Dioptres(1.25));
        assert_eq!(Dioptres(1.12).round_to(0.25), Dioptres(1.0));
        assert_eq!(Dioptres(-0.37).round_to(0.25), Dioptres(-0.25));
    }

    #[test]
    fn reciprocal_of_a_distance() {
        // Vergence definition, D = 1 / m (ISO 13666 vocabulary): 40 cm is 2.50 D.
        assert!((Metres(0.4).reciprocal().0 - 2.5).abs() < 1e-12);
        assert_eq!(Dioptres(0.0).focal_distance(), None);
        assert_eq!(Millimetres(12.0).to_m(), Metres(0.012));
    }
}
