//! Depth of field of the eye in geometric optics: the blur a defocus makes
//! through a pupil, and the half depth of field a task tolerates, either
//! derived from the task's critical detail or set as a clinical tolerance.
//!
//! Geometric blur: a defocus of ΔD dioptres seen through a pupil of diameter
//! p metres gives a blur disc of angular diameter β = p ΔD radians (the
//! reduced-eye result, for example Atchison & Smith, *Optics of the Human
//! Eye*, chapter on defocus and depth of field; from memory). A tolerable
//! blur angle β_t therefore gives a half depth of field dof = β_t / p.
//!
//! **Rule for a task's tolerable blur (a modelling choice of this product,
//! not a published criterion).** The blur disc may be as large as a fraction
//! `ratio` of the angle the critical detail subtends; the default ratio is 1:
//! a blur disc the size of the detail smears neighbouring strokes of that
//! size into each other, which is where legibility starts to fail. The rule
//! ignores aberrations, diffraction, contrast and neural tolerance, which is
//! why measured depths of focus (Ogle & Schwartz 1959; Atchison et al. 1997)
//! are larger for small pupils than it predicts; those data were not at hand
//! when this was written, so the rule is not checked against them. When in
//! doubt use the clinical tolerance (±0.25 D strict, ±0.50 D lenient; common
//! practice), which overrides the rule.

use super::error::OpticsError;
use super::units::{Dioptres, Metres, Millimetres};

/// Default blur-to-detail ratio of the detail rule (see the module note).
pub const DEFAULT_BLUR_TO_DETAIL: f64 = 1.0;
/// Largest half depth of field the detail rule may give, in dioptres. A very
/// coarse task would otherwise be declared clear at any distance; beyond
/// about 2 D the eye's blur is no longer a thin geometric disc and other
/// limits apply (a product choice, marked as such).
pub const MAX_HALF_DEPTH_D: f64 = 2.0;

fn pupil_m(pupil: Millimetres) -> Result<f64, OpticsError> {
    OpticsError::in_range("pupil diameter", pupil.0, 1.0, 10.0, "mm").map(|mm| mm / 1000.0)
}

/// Angular diameter in radians of the blur disc made by a defocus of
/// `defocus` dioptres (either sign) through a pupil of diameter `pupil`:
/// β = p |ΔD|.
///
/// ```
/// use clearspan::core::{depth_of_field::blur_angle, units::{Dioptres, Millimetres}};
/// // 0.50 D through a 4 mm pupil: 0.004 x 0.5 = 0.002 rad (6.9 arcmin).
/// assert!((blur_angle(Dioptres(0.5), Millimetres(4.0)).unwrap() - 0.002).abs() < 1e-15);
/// ```
pub fn blur_angle(defocus: Dioptres, pupil: Millimetres) -> Result<f64, OpticsError> {
    let d = OpticsError::in_range("defocus", defocus.0, -50.0, 50.0, "D")?;
    Ok(pupil_m(pupil)? * d.abs())
}

/// Half depth of field in dioptres for a tolerable blur angle
/// `tolerable_blur_rad` (radians) through a pupil of diameter `pupil`:
/// dof = β_t / p.
///
/// ```
/// use clearspan::core::{depth_of_field::half_depth_of_field, units::Millimetres};
/// // 1 mrad through 4 mm: 0.001 / 0.004 = 0.25 D.
/// assert!((half_depth_of_field(0.001, Millimetres(4.0)).unwrap().0 - 0.25).abs() < 1e-12);
/// ```
pub fn half_depth_of_field(
    tolerable_blur_rad: f64,
    pupil: Millimetres,
) -> Result<Dioptres, OpticsError> {
    let beta = OpticsError::in_range("tolerable blur angle", tolerable_blur_rad, 0.0, 0.1, "rad")?;
    Ok(Dioptres(beta / pupil_m(pupil)?))
}

/// The angle in radians a detail of size `detail` subtends at `distance`:
/// 2 atan(d / 2l).
pub fn detail_angle(detail: Millimetres, distance: Metres) -> Result<f64, OpticsError> {
    let d = OpticsError::in_range("critical detail size", detail.0, 0.001, 1000.0, "mm")?;
    let l = OpticsError::in_range("viewing distance", distance.0, 0.02, 100_000.0, "m")?;
    Ok(2.0 * (d / 1000.0 / (2.0 * l)).atan())
}

/// How a task's tolerable defocus is set.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum BlurTolerance {
    /// From the critical detail: the blur disc may reach `ratio` times the
    /// detail's angular size (see the module note; default ratio 1).
    FromDetail {
        /// Blur-disc diameter allowed, as a multiple of the detail's angle (0.1 to 5).
        ratio: f64,
    },
    /// A clinical half depth of field, the same for every task, in dioptres.
    Clinical(Dioptres),
}

/// Half depth of field in dioptres for a task with critical detail `detail`
/// at `distance`, through a pupil of diameter `pupil`, under `tolerance`.
/// The detail rule is capped at [`MAX_HALF_DEPTH_D`].
///
/// ```
/// use clearspan::core::depth_of_field::{task_half_depth, BlurTolerance};
/// use clearspan::core::units::{Metres, Millimetres};
/// // 0.4 mm detail at 40 cm subtends 2 atan(0.0004 / 0.8) = 1.0 mrad; through a
/// // 3 mm pupil with ratio 1: 0.001 / 0.003 = 0.333 D.
/// let dof = task_half_depth(BlurTolerance::FromDetail { ratio: 1.0 }, Millimetres(3.0), Millimetres(0.4), Metres(0.4)).unwrap();
/// assert!((dof.0 - 0.3333).abs() < 1e-4);
/// ```
pub fn task_half_depth(
    tolerance: BlurTolerance,
    pupil: Millimetres,
    detail: Millimetres,
    distance: Metres,
) -> Result<Dioptres, OpticsError> {
    match tolerance {
        BlurTolerance::Clinical(d) => OpticsError::in_range(
            "clinical half depth of field",
            d.0,
            0.0,
            MAX_HALF_DEPTH_D,
            "D",
        )
        .map(Dioptres),
        BlurTolerance::FromDetail { ratio } => {
            let k = OpticsError::in_range("blur-to-detail ratio", ratio, 0.1, 5.0, "")?;
            let beta = k * detail_angle(detail, distance)?;
            Ok(Dioptres((beta / pupil_m(pupil)?).min(MAX_HALF_DEPTH_D)))
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn check(
        tolerance: BlurTolerance,
        pupil_mm: f64,
        detail_mm: f64,
        distance_m: f64,
        expected: f64,
    ) {
        let dof = task_half_depth(
            tolerance,
            Millimetres(pupil_mm),
            Millimetres(detail_mm),
            Metres(distance_m),
        )
        .unwrap();
        assert!(
            (dof.0 - expected).abs() < 1e-4,
            "got {}, expected {expected}",
            dof.0
        );
    }

    #[test]
    fn half_depth_for_tasks() {
        let rule = BlurTolerance::FromDetail {
            ratio: DEFAULT_BLUR_TO_DETAIL,
        };
        // Worked by hand with dof = k x 2 atan(d / 2l) / p:
        // 1 mm monitor detail at 0.65 m, 3 mm pupil: 1.53846 mrad / 0.003 = 0.51282 D.
        check(rule, 3.0, 1.0, 0.65, 0.512_82);
        // Same detail, 6 mm pupil (dim room): half as much, 0.25641 D.
        check(rule, 6.0, 1.0, 0.65, 0.256_41);
        // A 20 mm dial at 1 m, 3 mm pupil: 20 mrad / 0.003 = 6.7 D, capped at 2 D.
        check(rule, 3.0, 20.0, 1.0, MAX_HALF_DEPTH_D);
        // The clinical override ignores pupil and detail.
        check(
            BlurTolerance::Clinical(Dioptres(0.25)),
            3.0,
            1.0,
            0.65,
            0.25,
        );
    }

    #[test]
    fn blur_and_depth_invert() {
        // β = p ΔD and dof = β / p are inverses (geometric blur definition).
        let beta = blur_angle(Dioptres(-0.75), Millimetres(5.0)).unwrap();
        assert!((half_depth_of_field(beta, Millimetres(5.0)).unwrap().0 - 0.75).abs() < 1e-12);
    }

    #[test]
    fn invalid_entries_are_errors() {
        let rule = BlurTolerance::FromDetail { ratio: 1.0 };
        assert!(task_half_depth(rule, Millimetres(0.0), Millimetres(1.0), Metres(0.5)).is_err());
        assert!(
            task_half_depth(rule, Millimetres(3.0), Millimetres(f64::NAN), Metres(0.5)).is_err()
        );
        assert!(task_half_depth(rule, Millimetres(3.0), Millimetres(1.0), Metres(-1.0)).is_err());
        let bad = BlurTolerance::Clinical(Dioptres(-0.25));
        assert!(task_half_depth(bad, Millimetres(3.0), Millimetres(1.0), Metres(0.5)).is_err());
    }

    mod properties {
        use super::*;
        use proptest::prelude::*;

        proptest! {
            #[test]
            fn larger_pupils_never_widen_the_depth_of_field(
                p in 1.0..9.0f64, more in 0.0..1.0f64, detail in 0.01..50.0f64, l in 0.1..10.0f64,
            ) {
                let rule = BlurTolerance::FromDetail { ratio: 1.0 };
                let small = task_half_depth(rule, Millimetres(p), Millimetres(detail), Metres(l)).unwrap();
                let large = task_half_depth(rule, Millimetres(p + more), Millimetres(detail), Metres(l)).unwrap();
                prop_assert!(large.0 <= small.0 && large.0.is_finite() && large.0 >= 0.0);
            }
        }
    }
}
