//! Spectacle magnification: how much a correcting lens enlarges or shrinks
//! the retinal image of a distant object compared with the uncorrected eye,
//! as the product of a power factor and a shape factor (the thick-lens
//! formula of ophthalmic optics textbooks, for example Bennett & Rabbetts,
//! Clinical Visual Optics, and Fannin & Grosvenor, Clinical Optics):
//!
//! `SM = 1 / (1 - h F_v) x 1 / (1 - (t / n) F_1)`
//!
//! with `F_v` the back vertex power, `h` the distance from the lens's back
//! vertex to the eye's entrance pupil, `t` the centre thickness, `n` the
//! refractive index and `F_1` the front surface power. The difference
//! between the eyes estimates the image-size difference (aniseikonia) that
//! spectacles for unequal eyes cause.
//!
//! When only the prescription is known, [`typical_lens`] estimates the
//! lens's form: a best-form base curve by Vogel's rule and a centre
//! thickness from the sag of a typical blank (both from memory; they are
//! estimates, and a real lens may differ by a percent).

use crate::core::units::{Dioptres, Millimetres};

/// Distance from the cornea to the eye's entrance pupil, in millimetres
/// (about 3 mm in schematic eyes; from memory).
pub const CORNEA_TO_ENTRANCE_PUPIL_MM: f64 = 3.0;
/// Refractive index of ordinary spectacle lens material (CR-39 is 1.498).
pub const TYPICAL_INDEX: f64 = 1.5;
/// Centre thickness of a minus lens, and edge thickness of a plus lens, in
/// millimetres (common practice for ordinary lenses).
pub const MINIMUM_THICKNESS_MM: f64 = 2.0;
/// Semi-diameter of the finished lens used for the sag estimate, in
/// millimetres (a 50 mm lens; common practice).
pub const TYPICAL_SEMI_DIAMETER_MM: f64 = 25.0;

/// The form of a spectacle lens that matters for its magnification.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LensForm {
    /// Back vertex power, in dioptres.
    pub back_vertex_power: Dioptres,
    /// Front surface power, in dioptres.
    pub front_surface_power: Dioptres,
    /// Centre thickness, in millimetres.
    pub centre_thickness: Millimetres,
    /// Refractive index of the material.
    pub index: f64,
}

/// A typical lens of back vertex power `power`: front curve by Vogel's rule
/// (plus lenses: power + 6 D; minus lenses: power / 2 + 6 D; from memory)
/// and centre thickness from the sag formula `t = e + y² F / (2000 (n - 1))`
/// (y in mm, F in D; from memory) with the minimum thickness at the edge of
/// a plus lens or the centre of a minus lens.
pub fn typical_lens(power: Dioptres) -> LensForm {
    let f = power.0;
    let front = if f >= 0.0 { f + 6.0 } else { f / 2.0 + 6.0 };
    let sag = TYPICAL_SEMI_DIAMETER_MM.powi(2) * f.max(0.0) / (2000.0 * (TYPICAL_INDEX - 1.0));
    LensForm {
        back_vertex_power: power,
        front_surface_power: Dioptres(front),
        centre_thickness: Millimetres(MINIMUM_THICKNESS_MM + sag),
        index: TYPICAL_INDEX,
    }
}

/// Spectacle magnification of `lens` worn at `vertex` from the cornea, as a
/// ratio (1.05 is 5 % larger); `None` when a factor's denominator is not
/// positive (a lens or distance far outside ophthalmic values).
pub fn spectacle_magnification(lens: &LensForm, vertex: Millimetres) -> Option<f64> {
    let h = (vertex.0 + CORNEA_TO_ENTRANCE_PUPIL_MM) / 1000.0;
    let power_den = 1.0 - h * lens.back_vertex_power.0;
    let shape_den =
        1.0 - lens.centre_thickness.0 / 1000.0 / lens.index * lens.front_surface_power.0;
    (power_den > 0.0 && shape_den > 0.0).then(|| 1.0 / (power_den * shape_den))
}

/// Percentage by which the right eye's image is larger than the left's
/// (negative when smaller) through typical lenses of powers `right` and
/// `left` at `vertex`.
pub fn image_size_difference_percent(
    right: Dioptres,
    left: Dioptres,
    vertex: Millimetres,
) -> Option<f64> {
    let r = spectacle_magnification(&typical_lens(right), vertex)?;
    let l = spectacle_magnification(&typical_lens(left), vertex)?;
    Some((r / l - 1.0) * 100.0)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn plus_lenses_enlarge_and_minus_lenses_shrink() {
        // Textbook behaviour (Bennett & Rabbetts, Clinical Visual Optics):
        // the power factor of a plus lens exceeds 1, of a minus lens falls
        // below 1, and dominates the shape factor for ordinary lenses.
        let v = Millimetres(12.0);
        let plus = spectacle_magnification(&typical_lens(Dioptres(4.0)), v).unwrap();
        let minus = spectacle_magnification(&typical_lens(Dioptres(-4.0)), v).unwrap();
        assert!(plus > 1.0 && minus < 1.0, "{plus} {minus}");
    }

    #[test]
    fn about_one_to_two_percent_per_dioptre_of_anisometropia() {
        // Rule of thumb of the trade (from memory): spectacles for refractive
        // anisometropia give roughly 1 to 2 % image-size difference per
        // dioptre between the eyes at usual vertex distances, somewhat more
        // between plus lenses, whose thicker centres add shape magnification.
        for (r, l) in [(1.0, 3.0), (-2.0, -5.0), (0.0, 2.5), (4.0, 1.0)] {
            let diff = image_size_difference_percent(Dioptres(r), Dioptres(l), Millimetres(12.0))
                .unwrap()
                .abs();
            let per_d = diff / (r - l).abs();
            assert!((1.0..=2.5).contains(&per_d), "R {r} L {l}: {per_d} % per D");
        }
    }

    #[test]
    fn a_six_dioptre_plus_lens_enlarges_by_about_twelve_percent() {
        // Published example (opterio, "Spectacle magnification", from its
        // text): an eye corrected with +6.00 D sees images about 12 % larger.
        let sm = spectacle_magnification(&typical_lens(Dioptres(6.0)), Millimetres(12.0)).unwrap();
        assert!((1.10..=1.16).contains(&sm), "{sm}");
    }
}
