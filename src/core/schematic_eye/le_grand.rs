//! The Le Grand full theoretical eye, relaxed and accommodated: four
//! spherical surfaces (cornea front and back, lens front and back) of
//! homogeneous media.
//!
//! Constants: Le Grand & El Hage (1980, *Physiological Optics*), as listed
//! by the visisipy project (MREYE-LUMC/visisipy): radii and distances in
//! `models/catalog/gullstrand.py` ("Gullstrand-LeGrand" eye), refractive
//! indices in `models/materials.py`; the same eye is tabulated in the
//! appendix of Atchison & Smith, *Optics of the Human Eye* (2000; table
//! number not at hand). Relaxed: cornea 7.8 / 6.5 mm radii, 0.55 mm thick,
//! index 1.3771; aqueous 1.3374, 3.05 mm; lens 10.2 / -6.0 mm, 4.0 mm thick,
//! index 1.42; vitreous 1.336, 16.59655 mm. Accommodated: aqueous 2.65 mm,
//! lens 6.0 / -5.5 mm, 4.5 mm thick, index 1.427, vitreous 16.49655 mm.

use super::{surface as s, SchematicEye, Surface};

/// The relaxed eye, cornea to back of lens; the last gap reaches the retina.
const RELAXED: [Surface; 4] = [
    s(7.8, 1.3771, 0.55),
    s(6.5, 1.3374, 3.05),
    s(10.2, 1.42, 4.0),
    s(-6.0, 1.336, 16.59655),
];

/// The accommodated eye: same cornea and axial length, thicker and more
/// curved lens moved forward.
const ACCOMMODATED: [Surface; 4] = [
    s(7.8, 1.3771, 0.55),
    s(6.5, 1.3374, 2.65),
    s(6.0, 1.427, 4.5),
    s(-5.5, 1.336, 16.49655),
];

impl SchematicEye {
    /// The relaxed Le Grand full theoretical eye (emmetropic, 59.94 D).
    pub fn le_grand_relaxed() -> SchematicEye {
        SchematicEye::from_data(&RELAXED, 2)
    }

    /// The accommodated Le Grand full theoretical eye (about 7 D of accommodation).
    pub fn le_grand_accommodated() -> SchematicEye {
        SchematicEye::from_data(&ACCOMMODATED, 2)
    }
}

#[cfg(test)]
mod tests {
    use super::super::close;
    use super::*;

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
        // Same source (from memory): cornea 42.356 D, relaxed lens 21.779 D.
        close(relaxed.cornea_power().0, 42.356, 1e-3);
        close(relaxed.lens_power().0, 21.779, 1e-3);
    }

    #[test]
    fn published_cardinal_points() {
        // visisipy test suite (tests/models/zoo/test_gullstrand.py, the
        // Gullstrand-LeGrand eye), to 0.01 mm from the corneal vertex:
        // relaxed f = -16.68, f' = 22.29, P = 1.59, P' = 1.91, N = 7.20,
        // N' = 7.51, retina at 24.19655; accommodated f = -14.78, f' = 19.74,
        // P = 1.82, P' = 2.19, N = 6.78, N' = 7.16, same retina.
        for (eye, f, f_back, p, p_back, n, n_back) in [
            (
                SchematicEye::le_grand_relaxed(),
                -16.68,
                22.29,
                1.59,
                1.91,
                7.20,
                7.51,
            ),
            (
                SchematicEye::le_grand_accommodated(),
                -14.78,
                19.74,
                1.82,
                2.19,
                6.78,
                7.16,
            ),
        ] {
            let c = eye.cardinal_points();
            let (focal, focal_back) = eye.focal_lengths();
            close(focal.0, f, 0.005);
            close(focal_back.0, f_back, 0.005);
            close(c.front_principal.0, p, 0.005);
            close(c.back_principal.0, p_back, 0.005);
            close(c.front_nodal.0, n, 0.005);
            close(c.back_nodal.0, n_back, 0.005);
            close(eye.axial_length().0, 24.19655, 1e-9);
        }
        // Atchison & Smith (from memory), relaxed, to 0.001 mm: F = -15.089,
        // F' = 24.197, P = 1.595, P' = 1.908, N = 7.200, N' = 7.513.
        let c = SchematicEye::le_grand_relaxed().cardinal_points();
        close(c.front_focal.0, -15.089, 1e-3);
        close(c.back_focal.0, 24.197, 1e-3);
        close(c.front_principal.0, 1.595, 1e-3);
        close(c.back_principal.0, 1.908, 1e-3);
        close(c.front_nodal.0, 7.200, 1e-3);
        close(c.back_nodal.0, 7.513, 1e-3);
    }
}
