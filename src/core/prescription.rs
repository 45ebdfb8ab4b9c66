//! A sphero-cylindrical prescription (sphere, cylinder, axis in the TABO
//! convention): its spherical equivalent, transposition between plus- and
//! minus-cylinder notation, the power in any meridian, the principal
//! meridians, and the written form with explicit signs in 0.25 D steps.
//!
//! The power in the meridian at angle θ of a sphero-cylinder S / C × α is
//! S + C sin²(θ - α) (the standard oblique-meridian formula, for example
//! Jalie, *Principles of Ophthalmic Lenses*, and Keating, *Geometric,
//! Physical and Visual Optics*; from memory). It is the curvature power of
//! the lens in that section, the quantity Prentice's rule needs for the
//! vertical prism at a reading point.

use super::error::OpticsError;
use super::units::{Degrees, Dioptres};
use std::fmt;

/// Largest sphere accepted, in dioptres (magnitude).
const MAX_SPHERE_D: f64 = 40.0;
/// Largest cylinder accepted, in dioptres (magnitude).
const MAX_CYLINDER_D: f64 = 20.0;

/// A sphero-cylindrical lens power: sphere and cylinder in dioptres, the
/// cylinder axis in degrees (TABO: 0 to 180, anticlockwise from the wearer's
/// left as seen by the practitioner). The axis is stored in [0, 180).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpheroCylinder {
    sphere: Dioptres,
    cylinder: Dioptres,
    axis: Degrees,
}

/// One principal meridian of a sphero-cylinder: its direction and power.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PrincipalMeridian {
    /// Direction of the meridian in degrees (TABO), in [0, 180).
    pub meridian: Degrees,
    /// Power in that meridian, in dioptres.
    pub power: Dioptres,
}

/// Brings an angle in degrees into [0, 180).
fn normalise_axis(degrees: f64) -> f64 {
    let a = degrees.rem_euclid(180.0);
    // rem_euclid can return exactly 180.0 for tiny negative inputs through rounding.
    if a >= 180.0 {
        0.0
    } else {
        a
    }
}

impl SpheroCylinder {
    /// A prescription; an error if a value is not finite, the sphere exceeds
    /// ±40 D, the cylinder ±20 D, or the axis lies outside 0 to 180 degrees.
    pub fn new(
        sphere: Dioptres,
        cylinder: Dioptres,
        axis: Degrees,
    ) -> Result<SpheroCylinder, OpticsError> {
        let s = OpticsError::in_range("sphere", sphere.0, -MAX_SPHERE_D, MAX_SPHERE_D, "D")?;
        let c =
            OpticsError::in_range("cylinder", cylinder.0, -MAX_CYLINDER_D, MAX_CYLINDER_D, "D")?;
        let a = OpticsError::in_range("cylinder axis", axis.0, 0.0, 180.0, "°")?;
        Ok(SpheroCylinder {
            sphere: Dioptres(s),
            cylinder: Dioptres(c),
            axis: Degrees(normalise_axis(a)),
        })
    }

    /// A plano lens: no power in any meridian.
    pub const PLANO: SpheroCylinder = SpheroCylinder {
        sphere: Dioptres(0.0),
        cylinder: Dioptres(0.0),
        axis: Degrees(0.0),
    };

    /// A spherical power (no cylinder).
    pub fn spherical(power: Dioptres) -> Result<SpheroCylinder, OpticsError> {
        SpheroCylinder::new(power, Dioptres(0.0), Degrees(0.0))
    }

    /// The sphere, in dioptres.
    pub fn sphere(&self) -> Dioptres {
        self.sphere
    }

    /// The cylinder, in dioptres (either sign).
    pub fn cylinder(&self) -> Dioptres {
        self.cylinder
    }

    /// The cylinder axis, in degrees in [0, 180).
    pub fn axis(&self) -> Degrees {
        self.axis
    }

    /// The spherical equivalent S + C/2, in dioptres: the mean of the two
    /// principal powers, the sphere that puts the circle of least confusion
    /// on the retina.
    ///
    /// ```
    /// use clearspan::core::{prescription::SpheroCylinder, units::{Degrees, Dioptres}};
    /// // +1.00 / -1.50 x 90: 1.00 - 0.75 = +0.25 D.
    /// let rx = SpheroCylinder::new(Dioptres(1.0), Dioptres(-1.5), Degrees(90.0)).unwrap();
    /// assert!((rx.spherical_equivalent().0 - 0.25).abs() < 1e-12);
    /// ```
    pub fn spherical_equivalent(&self) -> Dioptres {
        Dioptres(self.sphere.0 + self.cylinder.0 / 2.0)
    }

    /// The same lens written in the other cylinder sign: sphere S + C,
    /// cylinder -C, axis turned by 90 degrees.
    ///
    /// ```
    /// use clearspan::core::{prescription::SpheroCylinder, units::{Degrees, Dioptres}};
    /// // +2.00 / -1.00 x 30 transposes to +1.00 / +1.00 x 120.
    /// let rx = SpheroCylinder::new(Dioptres(2.0), Dioptres(-1.0), Degrees(30.0)).unwrap();
    /// assert_eq!(rx.transposed().to_string(), "+1.00 / +1.00 × 120");
    /// ```
    pub fn transposed(&self) -> SpheroCylinder {
        SpheroCylinder {
            sphere: self.sphere + self.cylinder,
            cylinder: -self.cylinder,
            axis: Degrees(normalise_axis(self.axis.0 + 90.0)),
        }
    }

    /// The lens in minus-cylinder notation (unchanged if it already is).
    pub fn in_minus_cylinder(&self) -> SpheroCylinder {
        if self.cylinder.0 > 0.0 {
            self.transposed()
        } else {
            *self
        }
    }

    /// The lens in plus-cylinder notation (unchanged if it already is).
    pub fn in_plus_cylinder(&self) -> SpheroCylinder {
        if self.cylinder.0 < 0.0 {
            self.transposed()
        } else {
            *self
        }
    }

    /// The power in dioptres in the meridian at `meridian` degrees:
    /// S + C sin²(θ - axis).
    ///
    /// ```
    /// use clearspan::core::{prescription::SpheroCylinder, units::{Degrees, Dioptres}};
    /// // -1.00 / -2.00 x 180, meridian 30: -1 - 2 sin²30° = -1 - 2 x 0.25 = -1.50 D.
    /// let rx = SpheroCylinder::new(Dioptres(-1.0), Dioptres(-2.0), Degrees(180.0)).unwrap();
    /// assert!((rx.power_in_meridian(Degrees(30.0)).0 + 1.5).abs() < 1e-12);
    /// ```
    pub fn power_in_meridian(&self, meridian: Degrees) -> Dioptres {
        let s = (meridian.to_radians() - self.axis.to_radians()).sin();
        Dioptres(self.sphere.0 + self.cylinder.0 * s * s)
    }

    /// The power in the vertical (90°) meridian, in dioptres: the power that
    /// Prentice's rule uses for vertical prism below the optical centre.
    pub fn vertical_power(&self) -> Dioptres {
        self.power_in_meridian(Degrees(90.0))
    }

    /// The power in the horizontal (180°) meridian, in dioptres.
    pub fn horizontal_power(&self) -> Dioptres {
        self.power_in_meridian(Degrees(0.0))
    }

    /// The two principal meridians: along the axis (power S) and at right
    /// angles to it (power S + C).
    pub fn principal_meridians(&self) -> [PrincipalMeridian; 2] {
        [
            PrincipalMeridian {
                meridian: self.axis,
                power: self.sphere,
            },
            PrincipalMeridian {
                meridian: Degrees(normalise_axis(self.axis.0 + 90.0)),
                power: self.sphere + self.cylinder,
            },
        ]
    }

    /// The lens with sphere and cylinder rounded to multiples of `step`
    /// dioptres (0.25 D in most markets) and the axis to a whole degree.
    pub fn rounded(&self, step: Dioptres) -> SpheroCylinder {
        SpheroCylinder {
            sphere: self.sphere.round_to(step.0),
            cylinder: self.cylinder.round_to(step.0),
            axis: Degrees(normalise_axis(self.axis.0.round())),
        }
    }
}

impl fmt::Display for SpheroCylinder {
    /// Writes the prescription the way it is written on an order, rounded to
    /// 0.25 D and a whole degree: "+1.25 / -0.50 × 180", or "+1.25 DS" with no
    /// cylinder. The axis is written 1 to 180 (0 is written 180).
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let r = self.rounded(Dioptres(0.25));
        if r.cylinder.0.abs() < 0.005 {
            return write!(f, "{} DS", r.sphere.signed());
        }
        let axis = if r.axis.0 < 0.5 { 180.0 } else { r.axis.0 };
        write!(
            f,
            "{} / {} × {axis:.0}",
            r.sphere.signed(),
            r.cylinder.signed()
        )
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn rx(s: f64, c: f64, a: f64) -> SpheroCylinder {
        SpheroCylinder::new(Dioptres(s), Dioptres(c), Degrees(a)).unwrap()
    }

    fn check_written(lens: SpheroCylinder, expected: &str) {
        assert_eq!(lens.to_string(), expected);
    }

    #[test]
    fn written_form() {
        // Prescription notation with explicit signs, 0.25 D steps and axis
        // 1-180 (common practice; ISO 13666 vocabulary).
        check_written(rx(1.25, -0.5, 180.0), "+1.25 / -0.50 × 180");
        check_written(rx(1.25, -0.5, 0.0), "+1.25 / -0.50 × 180");
        check_written(rx(-2.1, 0.0, 0.0), "-2.00 DS");
        check_written(rx(0.13, -0.37, 45.4), "+0.25 / -0.25 × 45");
        check_written(rx(0.0, 0.0, 0.0), "0.00 DS");
    }

    fn check_meridian(lens: SpheroCylinder, meridian: f64, expected: f64) {
        let p = lens.power_in_meridian(Degrees(meridian)).0;
        assert!(
            (p - expected).abs() < 1e-9,
            "meridian {meridian}: {p} vs {expected}"
        );
    }

    #[test]
    fn oblique_meridian_powers() {
        // S + C sin²(θ - α), worked by hand.
        let lens = rx(2.0, -1.0, 30.0);
        check_meridian(lens, 30.0, 2.0); // along the axis: the sphere
        check_meridian(lens, 120.0, 1.0); // at right angles: S + C
        check_meridian(lens, 90.0, 2.0 - 0.75); // sin²60° = 0.75
        check_meridian(lens, 0.0, 2.0 - 0.25); // sin²30° = 0.25
        assert!((lens.vertical_power().0 - 1.25).abs() < 1e-9);
        assert!((lens.horizontal_power().0 - 1.75).abs() < 1e-9);
    }

    #[test]
    fn principal_meridians_of_a_lens() {
        let [along, across] = rx(-3.0, -1.5, 170.0).principal_meridians();
        assert_eq!(along.power, Dioptres(-3.0));
        assert_eq!(along.meridian, Degrees(170.0));
        assert_eq!(across.power, Dioptres(-4.5));
        assert!((across.meridian.0 - 80.0).abs() < 1e-9);
    }

    #[test]
    fn invalid_entries_are_errors() {
        assert!(SpheroCylinder::new(Dioptres(f64::NAN), Dioptres(0.0), Degrees(0.0)).is_err());
        assert!(SpheroCylinder::new(Dioptres(1.0), Dioptres(-1.0), Degrees(181.0)).is_err());
        assert!(SpheroCylinder::new(Dioptres(1.0), Dioptres(-25.0), Degrees(90.0)).is_err());
    }

    mod properties {
        use super::*;
        use proptest::prelude::*;

        proptest! {
            #[test]
            fn transposition_keeps_every_meridian_and_inverts(
                s in -20.0..20.0f64, c in -6.0..6.0f64, a in 0.0..180.0f64, m in 0.0..180.0f64,
            ) {
                let lens = rx(s, c, a);
                let t = lens.transposed();
                let diff = lens.power_in_meridian(Degrees(m)).0 - t.power_in_meridian(Degrees(m)).0;
                prop_assert!(diff.abs() < 1e-9);
                let back = t.transposed();
                prop_assert!((back.sphere().0 - s).abs() < 1e-9);
                prop_assert!((back.cylinder().0 - c).abs() < 1e-9);
                let axis_diff = (back.axis().0 - lens.axis().0).abs();
                prop_assert!(axis_diff < 1e-9 || (axis_diff - 180.0).abs() < 1e-9);
                prop_assert!((t.spherical_equivalent().0 - lens.spherical_equivalent().0).abs() < 1e-9);
            }

            #[test]
            fn meridian_power_lies_between_the_principal_powers(
                s in -20.0..20.0f64, c in -6.0..6.0f64, a in 0.0..180.0f64, m in 0.0..360.0f64,
            ) {
                let lens = rx(s, c, a);
                let p = lens.power_in_meridian(Degrees(m)).0;
                prop_assert!(p >= s.min(s + c) - 1e-9 && p <= s.max(s + c) + 1e-9);
            }

            #[test]
            fn any_input_gives_a_valid_lens_or_an_error(
                s in proptest::num::f64::ANY, c in proptest::num::f64::ANY, a in proptest::num::f64::ANY,
            ) {
                if let Ok(lens) = SpheroCylinder::new(Dioptres(s), Dioptres(c), Degrees(a)) {
                    prop_assert!(lens.axis().0 >= 0.0 && lens.axis().0 < 180.0);
                    prop_assert!(lens.vertical_power().0.is_finite());
                }
            }
        }
    }
}
