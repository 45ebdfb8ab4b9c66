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
/// use clearspan::plan::acuity::blur_disc_arcmin;
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
/// use clearspan::plan::acuity::acuity_loss_logmar;
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

#[cfg(test)]
mod tests {
    use super::*;

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
