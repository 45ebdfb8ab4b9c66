//! Paraxial schematic eyes: one matrix ray trace shared by every eye, used
//! to check the closed-form vergence results, to size the retinal blur circle
//! of a defocus and to give each eye's equivalent power, refraction and
//! cardinal points. Each eye is data in its own file: the Le Grand full
//! theoretical eye (`le_grand.rs`), the Gullstrand exact (No. 1) eye
//! (`gullstrand.rs`) and the Bennett–Rabbetts simplified eye
//! (`bennett_rabbetts.rs`), each with its published values checked there.
//!
//! Rays are column vectors (y, n u): height in metres and reduced angle. A
//! surface of power F refracts with [[1, 0], [-F, 1]]; a gap of thickness t
//! in index n translates with [[1, t/n], [0, 1]]. The equivalent power is
//! minus the lower-left element of the system matrix. Distances along the
//! axis are measured from the corneal vertex, positive towards the retina.

mod bennett_rabbetts;
mod gullstrand;
mod le_grand;

use super::error::OpticsError;
use super::units::{Dioptres, Metres, Millimetres};
use super::vergence::{check_power, check_vertex, object_vergence};
use nalgebra::{Matrix2, Vector2};
use std::ops::Range;

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

/// A paraxial schematic eye: its published surfaces (from the cornea to the
/// back of the lens, the last gap reaching the retina) and any change of the
/// vitreous length that makes it axially ametropic.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SchematicEye {
    /// The eye's surfaces, front to back.
    surfaces: &'static [Surface],
    /// How many of the surfaces belong to the cornea; the iris lies at the
    /// front of the lens, just behind them.
    corneal_surfaces: usize,
    /// Change of the vitreous length from the published eye, in mm.
    vitreous_change_mm: f64,
}

/// The six cardinal points of an eye, in mm from the corneal vertex
/// (positive: behind it, towards the retina).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CardinalPoints {
    /// First (object-space) focal point F: a point source here leaves the eye
    /// as a parallel beam. Negative: in front of the cornea.
    pub front_focal: Millimetres,
    /// Second (image-space) focal point F': where a distant object is imaged.
    pub back_focal: Millimetres,
    /// First principal point P, from which the anterior focal length is measured.
    pub front_principal: Millimetres,
    /// Second principal point P', from which the posterior focal length is measured.
    pub back_principal: Millimetres,
    /// First nodal point N: a ray aimed at it leaves from N' at the same angle.
    pub front_nodal: Millimetres,
    /// Second nodal point N'.
    pub back_nodal: Millimetres,
}

/// A surface of radius `radius_mm` (positive: centre behind it) with a
/// medium of index `index_after` behind it, `gap_after_mm` deep; every eye's
/// data is written with this.
const fn surface(radius_mm: f64, index_after: f64, gap_after_mm: f64) -> Surface {
    Surface {
        radius_mm,
        index_after,
        gap_after_mm,
    }
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
    /// The eye made of `surfaces`, of which the first `corneal_surfaces`
    /// form the cornea; every named eye is built here from its data.
    const fn from_data(surfaces: &'static [Surface], corneal_surfaces: usize) -> SchematicEye {
        SchematicEye {
            surfaces,
            corneal_surfaces,
            vitreous_change_mm: 0.0,
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
        Ok(SchematicEye {
            vitreous_change_mm: self.vitreous_change_mm + d,
            ..*self
        })
    }

    /// Distance in mm after surface `i` (the last one reaches the retina).
    fn gap_after_mm(&self, i: usize) -> f64 {
        let gap = self.surfaces[i].gap_after_mm;
        if i + 1 == self.surfaces.len() {
            gap + self.vitreous_change_mm
        } else {
            gap
        }
    }

    /// Index of the medium in front of surface `i` (air before the cornea).
    fn index_before(&self, i: usize) -> f64 {
        if i == 0 {
            1.0
        } else {
            self.surfaces[i - 1].index_after
        }
    }

    /// The one trace: the matrix across the surfaces in `range`, from just
    /// in front of the first to just behind the last, or to the end of the
    /// gap after the last when `include_last_gap` is set.
    fn matrix(&self, range: Range<usize>, include_last_gap: bool) -> Matrix2<f64> {
        let mut m = Matrix2::identity();
        let mut index = self.index_before(range.start);
        for i in range.clone() {
            let s = self.surfaces[i];
            m = refraction((s.index_after - index) / (s.radius_mm / 1000.0)) * m;
            if include_last_gap || i + 1 < range.end {
                m = translation(self.gap_after_mm(i) / 1000.0, s.index_after) * m;
            }
            index = s.index_after;
        }
        m
    }

    /// All surfaces, front to back.
    fn all(&self) -> Range<usize> {
        0..self.surfaces.len()
    }

    /// Matrix from the corneal vertex to the retina.
    fn retina_matrix(&self) -> Matrix2<f64> {
        self.matrix(self.all(), true)
    }

    /// Index of the vitreous, the medium in front of the retina.
    fn vitreous_index(&self) -> f64 {
        self.index_before(self.surfaces.len())
    }

    /// Distance from the corneal vertex to the back of the lens, in mm.
    fn last_surface_depth_mm(&self) -> f64 {
        (0..self.surfaces.len() - 1)
            .map(|i| self.gap_after_mm(i))
            .sum()
    }

    /// Axial length in mm: corneal vertex to retina.
    pub fn axial_length(&self) -> Millimetres {
        Millimetres(self.last_surface_depth_mm() + self.gap_after_mm(self.surfaces.len() - 1))
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
        Dioptres(-self.matrix(self.all(), false)[(1, 0)])
    }

    /// Equivalent power of the cornea alone (air in front, aqueous behind), in dioptres.
    pub fn cornea_power(&self) -> Dioptres {
        Dioptres(-self.matrix(0..self.corneal_surfaces, false)[(1, 0)])
    }

    /// Equivalent power of the crystalline lens alone (aqueous in front,
    /// vitreous behind), in dioptres.
    pub fn lens_power(&self) -> Dioptres {
        Dioptres(-self.matrix(self.corneal_surfaces..self.surfaces.len(), false)[(1, 0)])
    }

    /// Anterior and posterior equivalent focal lengths in mm, measured from
    /// the principal points: f = -1/F (in air) and f' = n'/F (in the vitreous).
    pub fn focal_lengths(&self) -> (Millimetres, Millimetres) {
        let f = self.equivalent_power().0;
        (
            Millimetres(-1000.0 / f),
            Millimetres(1000.0 * self.vitreous_index() / f),
        )
    }

    /// The focal, principal and nodal points, in mm from the corneal vertex.
    /// From the system matrix [[A, B], [C, D]] (cornea to back of lens) of
    /// power F = -C: F' lies A n'/F behind the back of the lens, F lies D/F
    /// in front of the cornea; P = F - f, P' = F' - f', N = F + f', N' = F' + f.
    pub fn cardinal_points(&self) -> CardinalPoints {
        let m = self.matrix(self.all(), false);
        let power = -m[(1, 0)];
        let (f, f_back) = self.focal_lengths();
        let front_focal = -1000.0 * m[(1, 1)] / power;
        let back_focal =
            self.last_surface_depth_mm() + 1000.0 * m[(0, 0)] * self.vitreous_index() / power;
        CardinalPoints {
            front_focal: Millimetres(front_focal),
            back_focal: Millimetres(back_focal),
            front_principal: Millimetres(front_focal - f.0),
            back_principal: Millimetres(back_focal - f_back.0),
            front_nodal: Millimetres(front_focal + f_back.0),
            back_nodal: Millimetres(back_focal + f.0),
        }
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
        let to_iris = self.matrix(0..self.corneal_surfaces, true);
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

/// The tolerance check shared by the files of the individual eyes.
#[cfg(test)]
use crate::approx::close;

#[cfg(test)]
mod tests {
    use super::*;
    use crate::core::vergence::{spectacle_refraction, CorrectedEye};

    /// Every named relaxed eye.
    fn relaxed_eyes() -> [SchematicEye; 3] {
        [
            SchematicEye::le_grand_relaxed(),
            SchematicEye::gullstrand_relaxed(),
            SchematicEye::bennett_rabbetts_relaxed(),
        ]
    }

    /// Every named eye, relaxed and accommodated, for the checks that hold for any eye.
    fn every_eye() -> [SchematicEye; 4] {
        let [le_grand, gullstrand, bennett_rabbetts] = relaxed_eyes();
        [
            le_grand,
            SchematicEye::le_grand_accommodated(),
            gullstrand,
            bennett_rabbetts,
        ]
    }

    #[test]
    fn entrance_pupil_lies_about_three_millimetres_behind_the_cornea() {
        // The entrance pupil of schematic eyes lies about 3 mm behind the
        // corneal vertex, 0.5 mm in front of the iris (Atchison & Smith; from memory).
        for eye in relaxed_eyes() {
            let e = eye.entrance_pupil_depth().0;
            assert!(e > 2.9 && e < 3.2, "{e}");
        }
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
        // Every eye: a longer vitreous makes it more myopic, by the full change of length.
        for eye in every_eye() {
            let longer = eye.with_axial_change(Millimetres(1.0)).unwrap();
            assert!(longer.ocular_refraction().0 < eye.ocular_refraction().0 - 2.0);
            close(longer.axial_length().0 - eye.axial_length().0, 1.0, 1e-12);
        }
    }

    #[test]
    fn cardinal_points_obey_the_identities_of_a_system_in_air_and_vitreous() {
        // Identities of any thick system (Gaussian optics): PP' = NN', the
        // nodal points lie f' + f behind the principal points, F' - P' = f',
        // P - F = -f; and the retina sits at F' when the eye is emmetropic.
        for eye in every_eye() {
            let c = eye.cardinal_points();
            let (f, f_back) = eye.focal_lengths();
            close(
                c.back_principal.0 - c.front_principal.0,
                c.back_nodal.0 - c.front_nodal.0,
                1e-9,
            );
            close(c.front_nodal.0 - c.front_principal.0, f_back.0 + f.0, 1e-9);
            close(c.back_focal.0 - c.back_principal.0, f_back.0, 1e-9);
            close(c.front_principal.0 - c.front_focal.0, -f.0, 1e-9);
        }
        let emmetrope = SchematicEye::le_grand_relaxed();
        close(
            emmetrope.cardinal_points().back_focal.0,
            emmetrope.axial_length().0,
            1e-3,
        );
    }

    /// The trace against the closed form of [`crate::core::vergence`]: `eye`
    /// made ametropic by `axial_mm`, corrected by the spectacle power
    /// vergence.rs finds for it at `vertex_mm`, viewing at `distance` m
    /// through that power plus `add`.
    fn cross_check(eye: SchematicEye, axial_mm: f64, vertex_mm: f64, add: f64, distance: f64) {
        let eye = eye.with_axial_change(Millimetres(axial_mm)).unwrap();
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
        for eye in every_eye() {
            for (axial, vertex, add, distance) in [
                (3.0, 12.0, 0.0, 0.4),  // about -8 D myope, no addition
                (-3.0, 12.0, 0.0, 0.4), // about +8 D hyperope
                (1.5, 14.0, 1.5, 0.65),
                (-1.0, 0.0, 2.0, 0.33), // contact lens
                (0.0, 13.0, 1.0, 1.0),
            ] {
                cross_check(eye, axial, vertex, add, distance);
            }
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
                which in 0..3usize, axial in -5.0..5.0f64, vertex in 0.0..20.0f64,
                add in 0.0..3.5f64, distance in 0.2..20.0f64,
            ) {
                cross_check(relaxed_eyes()[which], axial, vertex, add, distance);
            }

            #[test]
            fn blur_grows_with_defocus_and_pupil(which in 0..3usize, dd in 0.0..5.0f64, p in 1.0..8.0f64) {
                let eye = relaxed_eyes()[which];
                let b = eye.retinal_blur_diameter(Dioptres(dd), Millimetres(p)).unwrap().0;
                let more = eye.retinal_blur_diameter(Dioptres(dd + 0.5), Millimetres(p + 0.5)).unwrap().0;
                prop_assert!(b.is_finite() && more > b);
            }
        }
    }
}
