//! What a residual defocus does to the image: the geometric blur-disc angle
//! (from the optics core) and an approximate loss of visual acuity.
//!
//! The acuity relation is Smith's (1991, "Relation between spherical
//! refractive error and visual acuity", Optometry and Vision Science
//! 68:591-598; recalled from memory, not re-read): the minimum angle of
//! resolution grows with defocus as MAR = sqrt(MAR0² + (k p D)²), MAR in
//! minutes of arc, p the pupil diameter in millimetres, D the defocus in
//! dioptres, and k about 0.65 arcmin per (mm D). It is an average over
//! subjects; individual acuity with a given defocus varies by a line or more.
//! MAR0 is taken as 1 arcmin, the resolution of "normal" acuity (logMAR 0,
//! 6/6 or 20/20; ISO 8596 defines acuity 1.0 as a 1 arcmin gap, from memory).

use crate::core::depth_of_field::blur_angle;
use crate::core::error::OpticsError;
use crate::core::units::{Dioptres, Millimetres};

/// Smith's (1991) constant k, in arcmin per (millimetre x dioptre) (from memory).
pub const SMITH_K: f64 = 0.65;

/// Minimum angle of resolution without defocus, in arcmin (logMAR 0).
pub const BASELINE_MAR_ARCMIN: f64 = 1.0;

/// Minutes of arc in one radian (180 x 60 / π).
const ARCMIN_PER_RADIAN: f64 = 180.0 * 60.0 / std::f64::consts::PI;

/// Angular diameter of the geometric blur disc, in minutes of arc, for a
/// defocus `defocus` (either sign) through a pupil `pupil`.
///
/// ```
/// use clearspan::core::acuity::blur_disc_arcmin;
/// use clearspan::core::units::{Dioptres, Millimetres};
/// // 0.50 D through 4 mm: 0.004 x 0.5 = 0.002 rad = 6.875 arcmin.
/// let b = blur_disc_arcmin(Dioptres(0.5), Millimetres(4.0)).unwrap();
/// assert!((b - 6.875).abs() < 1e-3);
/// ```
pub fn blur_disc_arcmin(defocus: Dioptres, pupil: Millimetres) -> Result<f64, OpticsError> {
    Ok(blur_angle(defocus, pupil)? * ARCMIN_PER_RADIAN)
}

/// Approximate loss of visual acuity in logMAR (0.1 per chart line) that a
/// defocus `defocus` through a pupil `pupil` causes, by Smith (1991):
/// log10(sqrt(1 + (k p D)²)) for a baseline MAR of 1 arcmin.
///
/// ```
/// use clearspan::core::acuity::acuity_loss_logmar;
/// use clearspan::core::units::{Dioptres, Millimetres};
/// // 1.00 D through 4 mm: k p D = 0.65 x 4 x 1 = 2.6 arcmin;
/// // MAR = sqrt(1 + 6.76) = 2.7857; log10 = 0.4449 (between 6/15 and 6/18).
/// let loss = acuity_loss_logmar(Dioptres(1.0), Millimetres(4.0));
/// assert!((loss - 0.4449).abs() < 1e-4);
/// ```
pub fn acuity_loss_logmar(defocus: Dioptres, pupil: Millimetres) -> f64 {
    let blur = SMITH_K * pupil.0 * defocus.0.abs();
    let mar = (BASELINE_MAR_ARCMIN * BASELINE_MAR_ARCMIN + blur * blur).sqrt();
    (mar / BASELINE_MAR_ARCMIN).log10()
}

/// The decimal visual acuity (1.0 is 6/6 or 20/20) left by a defocus
/// `defocus` through a pupil `pupil`, for an eye that sees 1.0 without it.
pub fn decimal_acuity(defocus: Dioptres, pupil: Millimetres) -> f64 {
    10f64.powf(-acuity_loss_logmar(defocus, pupil))
}

/// The largest defocus, in dioptres (positive), that still leaves the
/// decimal acuity `acuity` (0 < acuity ≤ 1) through a pupil `pupil` by the
/// same relation: the inverse of [`decimal_acuity`]. `None` when the pupil
/// or the acuity is outside the relation's domain.
///
/// ```
/// use clearspan::core::acuity::defocus_for_decimal_acuity;
/// use clearspan::core::units::Millimetres;
/// // 0.5 decimal is MAR 2 arcmin: k p D = sqrt(4 - 1) = 1.732 arcmin;
/// // through 3 mm, D = 1.732 / (0.65 x 3) = 0.888 D.
/// let d = defocus_for_decimal_acuity(0.5, Millimetres(3.0)).unwrap();
/// assert!((d.0 - 0.888).abs() < 1e-3);
/// ```
pub fn defocus_for_decimal_acuity(acuity: f64, pupil: Millimetres) -> Option<Dioptres> {
    if !(acuity > 0.0 && acuity <= 1.0 && pupil.0 > 0.0 && pupil.0.is_finite()) {
        return None;
    }
    let mar = BASELINE_MAR_ARCMIN / acuity;
    let blur = (mar * mar - BASELINE_MAR_ARCMIN * BASELINE_MAR_ARCMIN).sqrt();
    Some(Dioptres(blur / (SMITH_K * pupil.0)))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn acuity_and_defocus_invert_each_other() {
        for acuity in [0.3, 0.5, 0.8, 1.0] {
            for pupil in [2.0, 3.5, 6.0] {
                let d = defocus_for_decimal_acuity(acuity, Millimetres(pupil)).expect("in domain");
                let back = decimal_acuity(d, Millimetres(pupil));
                assert!((back - acuity).abs() < 1e-9, "{acuity} {pupil}: {back}");
            }
        }
        assert_eq!(defocus_for_decimal_acuity(0.0, Millimetres(3.0)), None);
    }

    #[test]
    fn one_dioptre_of_blur_halves_acuity() {
        // Common practice (from memory): +1.00 D of blur over a distance
        // correction, with a daylight pupil of about 3 mm, leaves about
        // 6/12 (0.5 decimal); clinical tables give 6/9 to 6/18.
        let a = decimal_acuity(Dioptres(1.0), Millimetres(3.0));
        assert!((0.33..=0.67).contains(&a), "{a}");
    }

    #[test]
    fn no_defocus_no_loss_and_loss_grows_with_defocus() {
        assert_eq!(acuity_loss_logmar(Dioptres(0.0), Millimetres(3.0)), 0.0);
        let mut last = 0.0;
        for d in [0.25, 0.5, 1.0, 2.0] {
            let loss = acuity_loss_logmar(Dioptres(-d), Millimetres(3.0));
            assert!(loss > last, "{d}");
            last = loss;
        }
    }
}
