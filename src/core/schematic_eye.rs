//! A paraxial matrix ray trace of the Le Grand full theoretical eye, relaxed
//! and accommodated, used to check the closed-form vergence results and to
//! size the retinal blur circle of a defocus.
//!
//! Rays are column vectors (y, n u): height in metres and reduced angle. A
//! surface of power F refracts with [[1, 0], [-F, 1]]; a gap of thickness t
//! in index n translates with [[1, t/n], [0, 1]]. The equivalent power is
//! minus the lower-left element of the system matrix.
//!
//! Constants: Le Grand full theoretical eye as tabulated by Atchison & Smith,
//! *Optics of the Human Eye* (2000), appendix of schematic eyes (table number
//! not at hand; values from memory). The radii and distances agree with the
//! Gullstrand-Le Grand geometry listed by the visisipy project
//! (MREYE-LUMC/visisipy, `models/catalog/gullstrand.py`, after Le Grand &
//! El Hage 1980, *Physiological Optics*); the refractive indices were not
//! checked there. Relaxed: cornea 7.8 / 6.5 mm radii, 0.55 mm thick, index 1.3771;
//! aqueous 1.3374, 3.05 mm; lens 10.2 / -6.0 mm, 4.0 mm thick, index 1.42;
//! vitreous 1.336, 16.59655 mm. Accommodated: aqueous 2.65 mm, lens 6.0 /
//! -5.5 mm, 4.5 mm thick, index 1.427, vitreous 16.49655 mm. The tests check
//! that these constants reproduce the published equivalent powers.

use super::error::OpticsError;
use super::units::{Dioptres, Metres, Millimetres};
use super::vergence::{check_power, check_vertex, object_vergence};
use nalgebra::{Matrix2, Vector2};

/// One refracting surface and the medium behind it.
#[derive(Debug, Clone, Copy, PartialEq)]
struct Surface {
    /// Radius of curvature in mm (positive: centre behind the surface).
    radius_mm: f64,
    /// Refractive index behind the surface.
    index_after: f64,
    /// Distance to the next surface (or to the retina after the last), in mm.
    gap_after_mm: f64,
}

/// A four-surface paraxial schematic eye.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SchematicEye {
    surfaces: [Surface; 4],
}

/// Refraction matrix of a surface of power `power` dioptres.
fn refraction(power: f64) -> Matrix2<f64> {
    Matrix2::new(1.0, 0.0, -power, 1.0)
}

/// Translation matrix across `gap_m` metres of a medium of index `index`.
fn translation(gap_m: f64, index: f64) -> Matrix2<f64> {
    Matrix2::new(1.0, gap_m / index, 0.0, 1.0)
}

/// Largest change of axial length accepted, in mm (about ±20 D of ametropia).
const MAX_AXIAL_CHANGE_MM: f64 = 7.0;

impl SchematicEye {
    /// The relaxed Le Grand full theoretical eye (emmetropic).
    pub fn le_grand_relaxed() -> SchematicEye {
        SchematicEye::le_grand(3.05, 10.2, -6.0, 4.0, 1.42, 16.59655)
    }

    /// The accommodated Le Grand full theoretical eye (about 7 D of accommodation).
    pub fn le_grand_accommodated() -> SchematicEye {
        SchematicEye::le_grand(2.65, 6.0, -5.5, 4.5, 1.427, 16.49655)
    }

    fn le_grand(
        aqueous: f64,
        lens_front: f64,
        lens_back: f64,
        lens_thickness: f64,
        lens_index: f64,
        vitreous: f64,
    ) -> SchematicEye {
        let s = |radius_mm, index_after, gap_after_mm| Surface {
            radius_mm,
            index_after,
            gap_after_mm,
        };
        SchematicEye {
            surfaces: [
                s(7.8, 1.3771, 0.55),
                s(6.5, 1.3374, aqueous),
                s(lens_front, lens_index, lens_thickness),
                s(lens_back, 1.336, vitreous),
            ],
        }
    }

    /// The same eye with the vitreous chamber longer by `change` (negative:
    /// shorter), which makes it axially myopic (hyperopic); an error beyond ±7 mm.
    pub fn with_axial_change(&self, change: Millimetres) -> Result<SchematicEye, OpticsError> {
        let d = OpticsError::in_range(
            "axial length change",
            change.0,
            -MAX_AXIAL_CHANGE_MM,
            MAX_AXIAL_CHANGE_MM,
            "mm",
        )?;
        let mut eye = *self;
        eye.surfaces[3].gap_after_mm += d;
        Ok(eye)
    }

    /// Matrix from the corneal vertex to just behind surface `count - 1`
    /// (the first `count` surfaces), optionally including the gap after the last.
    fn matrix(&self, count: usize, include_last_gap: bool) -> Matrix2<f64> {
        let mut m = Matrix2::identity();
        let mut index = 1.0;
        for (i, s) in self.surfaces.iter().take(count).enumerate() {
            m = refraction((s.index_after - index) / (s.radius_mm / 1000.0)) * m;
            if include_last_gap || i + 1 < count {
                m = translation(s.gap_after_mm / 1000.0, s.index_after) * m;
            }
            index = s.index_after;
        }
        m
    }

    /// Matrix from the corneal vertex to the retina.
    fn retina_matrix(&self) -> Matrix2<f64> {
        self.matrix(self.surfaces.len(), true)
    }

    /// Equivalent power of the eye, in dioptres.
    ///
    /// ```
    /// use clearspan::core::schematic_eye::SchematicEye;
    /// // Le Grand full theoretical eye, relaxed: 59.940 D (Atchison & Smith; from memory).
    /// let f = SchematicEye::le_grand_relaxed().equivalent_power();
    /// assert!((f.0 - 59.940).abs() < 1e-3);
    /// ```
    pub fn equivalent_power(&self) -> Dioptres {
        Dioptres(-self.matrix(self.surfaces.len(), false)[(1, 0)])
    }

    /// Anterior and posterior equivalent focal lengths in mm, measured from
    /// the principal points: f = -1/F (in air) and f' = n'/F (in the vitreous).
    pub fn focal_lengths(&self) -> (Millimetres, Millimetres) {
        let f = self.equivalent_power().0;
        let n_vitreous = self.surfaces[3].index_after;
        (
            Millimetres(-1000.0 / f),
            Millimetres(1000.0 * n_vitreous / f),
        )
    }

    /// Ocular refraction in dioptres: the vergence at the corneal vertex that
    /// the eye images on its retina (0 for an emmetrope, negative for a myope).
    /// From the ray (1, -K) reaching the retina at height 0: K = A / B.
    pub fn ocular_refraction(&self) -> Dioptres {
        let m = self.retina_matrix();
        Dioptres(m[(0, 0)] / m[(0, 1)])
    }

    /// Distance of the entrance pupil behind the corneal vertex, in mm: the
    /// image of the iris (taken at the front of the lens) formed by the cornea.
    pub fn entrance_pupil_depth(&self) -> Millimetres {
        let to_iris = self.matrix(2, true);
        Millimetres(1000.0 * to_iris[(0, 1)] / to_iris[(0, 0)])
    }

    /// Ocular accommodation in dioptres this eye needs, found by the ray
    /// trace, for an object `distance` metres in front of a thin spectacle
    /// lens of power `lens_power` at `vertex` in front of the cornea. The
    /// accommodation is modelled as a thin lens at the corneal vertex, which
    /// is what "ocular accommodation" means (the vergence change needed at
    /// the cornea); its power is solved from the retinal ray height, which is
    /// linear in it.
    pub fn accommodation_through_lens(
        &self,
        lens_power: Dioptres,
        vertex: Metres,
        distance: Metres,
    ) -> Result<Dioptres, OpticsError> {
        let f = check_power("spectacle lens power", lens_power)?.0;
        let v = check_vertex(vertex)?.0;
        let object = object_vergence(distance)?.0;
        let front = translation(v, 1.0) * refraction(f);
        // A ray from the axial object point, unit height at the lens.
        let ray = Vector2::new(1.0, -object);
        let height_at_retina = |a: f64| (self.retina_matrix() * refraction(a) * front * ray)[0];
        let at_zero = height_at_retina(0.0);
        let slope = height_at_retina(1.0) - at_zero;
        let a = -at_zero / slope;
        if a.is_finite() {
            Ok(Dioptres(a))
        } else {
            Err(OpticsError::Incompatible {
                problem: "the lens images the object at the cornea",
                remedy: "check the lens power, vertex distance and viewing distance",
            })
        }
    }

    /// Diameter in mm of the geometric blur circle on the retina for an
    /// object `defocus` dioptres nearer than the far point (negative: beyond
    /// it), seen through an entrance pupil of diameter `pupil`.
    pub fn retinal_blur_diameter(
        &self,
        defocus: Dioptres,
        pupil: Millimetres,
    ) -> Result<Millimetres, OpticsError> {
        let dd = OpticsError::in_range("defocus", defocus.0, -20.0, 20.0, "D")?;
        let p = OpticsError::in_range("pupil diameter", pupil.0, 1.0, 10.0, "mm")? / 1000.0;
        let l = self.ocular_refraction().0 - dd;
        // Height at the cornea of the marginal ray aimed at the edge of the
        // entrance pupil, which lies e metres behind the cornea.
        let e = self.entrance_pupil_depth().0 / 1000.0;
        let y_cornea = (p / 2.0) / (1.0 - e * l);
        let at_retina = self.retina_matrix() * Vector2::new(y_cornea, -y_cornea * l);
        Ok(Millimetres(2000.0 * at_retina[0].abs()))
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::core::vergence::{spectacle_refraction, CorrectedEye};

    fn close(actual: f64, expected: f64, tol: f64) {
        assert!(
            (actual - expected).abs() <= tol,
            "got {actual}, expected {expected} ± {tol}"
        );
    }

    #[test]
    fn published_powers_and_focal_lengths() {
        // Atchison & Smith, Optics of the Human Eye, Le Grand full theoretical
        // eye (from memory): relaxed 59.940 D, f = -16.683 mm, f' = 22.289 mm,
        // emmetropic; accommodated 67.677 D with 7.053 D of accommodation.
        let relaxed = SchematicEye::le_grand_relaxed();
        close(relaxed.equivalent_power().0, 59.940, 1e-3);
        let (f, f_back) = relaxed.focal_lengths();
        close(f.0, -16.683, 1e-3);
        close(f_back.0, 22.289, 1e-3);
        close(relaxed.ocular_refraction().0, 0.0, 1e-3);
        let accommodated = SchematicEye::le_grand_accommodated();
        close(accommodated.equivalent_power().0, 67.677, 1e-3);
        close(-accommodated.ocular_refraction().0, 7.053, 1e-3);
    }

    #[test]
    fn entrance_pupil_lies_about_three_millimetres_behind_the_cornea() {
        // The entrance pupil of schematic eyes lies about 3 mm behind the
        // corneal vertex, 0.5 mm in front of the iris (Atchison & Smith; from memory).
        let e = SchematicEye::le_grand_relaxed().entrance_pupil_depth().0;
        assert!(e > 2.9 && e < 3.2, "{e}");
    }

    #[test]
    fn axial_ametropia_per_millimetre() {
        // About 2.5 to 3 D of myopia per mm of extra axial length (common practice).
        let eye = SchematicEye::le_grand_relaxed();
        let k = eye
            .with_axial_change(Millimetres(1.0))
            .unwrap()
            .ocular_refraction()
            .0;
        assert!(k < -2.5 && k > -3.0, "{k}");
        assert!(eye.with_axial_change(Millimetres(f64::NAN)).is_err());
    }

    /// The trace against the closed form of [`crate::core::vergence`]: an eye
    /// made ametropic by `axial_mm`, corrected by the spectacle power
    /// vergence.rs finds for it at `vertex_mm`, viewing at `distance` m
    /// through that power plus `add`.
    fn cross_check(axial_mm: f64, vertex_mm: f64, add: f64, distance: f64) {
        let eye = SchematicEye::le_grand_relaxed()
            .with_axial_change(Millimetres(axial_mm))
            .unwrap();
        let vertex = Metres(vertex_mm / 1000.0);
        let k = eye.ocular_refraction();
        let f = spectacle_refraction(k, vertex).unwrap();
        let traced = eye
            .accommodation_through_lens(f + Dioptres(add), vertex, Metres(distance))
            .unwrap();
        let closed = CorrectedEye::new(f, vertex)
            .unwrap()
            .accommodation_needed(Metres(distance), f + Dioptres(add))
            .unwrap();
        close(traced.0, closed.0, 1e-9);
        // The distance correction found by vergence.rs leaves a distant object
        // needing no accommodation in the trace.
        let far = eye
            .accommodation_through_lens(f, vertex, Metres(100_000.0))
            .unwrap();
        close(far.0, 0.0, 1e-4);
    }

    #[test]
    fn trace_agrees_with_the_vergence_formulas() {
        for (axial, vertex, add, distance) in [
            (3.0, 12.0, 0.0, 0.4),  // about -8 D myope, no addition
            (-3.0, 12.0, 0.0, 0.4), // about +8 D hyperope
            (1.5, 14.0, 1.5, 0.65),
            (-1.0, 0.0, 2.0, 0.33), // contact lens
            (0.0, 13.0, 1.0, 1.0),
        ] {
            cross_check(axial, vertex, add, distance);
        }
    }

    #[test]
    fn blur_circle_matches_the_angular_blur_formula() {
        // Geometric blur β = p ΔD (see depth_of_field.rs) mapped to the retina
        // through the eye's anterior focal length |f| = 16.683 mm: 1 D through a
        // 4 mm pupil gives 0.004 x 16.683 = 0.0667 mm. The trace places the pupil
        // at the entrance pupil, which shifts this by about 0.3 %.
        let eye = SchematicEye::le_grand_relaxed();
        let blur = eye
            .retinal_blur_diameter(Dioptres(1.0), Millimetres(4.0))
            .unwrap();
        close(blur.0, 0.0667, 0.0005);
        let none = eye
            .retinal_blur_diameter(Dioptres(0.0), Millimetres(4.0))
            .unwrap();
        close(none.0, 0.0, 1e-12);
        assert!(eye
            .retinal_blur_diameter(Dioptres(1.0), Millimetres(0.0))
            .is_err());
    }

    mod properties {
        use super::*;
        use proptest::prelude::*;

        proptest! {
            #[test]
            fn trace_and_closed_form_agree_everywhere(
                axial in -5.0..5.0f64, vertex in 0.0..20.0f64, add in 0.0..3.5f64, distance in 0.2..20.0f64,
            ) {
                cross_check(axial, vertex, add, distance);
            }

            #[test]
            fn blur_grows_with_defocus_and_pupil(dd in 0.0..5.0f64, p in 1.0..8.0f64) {
                let eye = SchematicEye::le_grand_relaxed();
                let b = eye.retinal_blur_diameter(Dioptres(dd), Millimetres(p)).unwrap().0;
                let more = eye.retinal_blur_diameter(Dioptres(dd + 0.5), Millimetres(p + 0.5)).unwrap().0;
                prop_assert!(b.is_finite() && more > b);
            }
        }
    }
}
