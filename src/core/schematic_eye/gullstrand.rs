//! The Gullstrand exact (No. 1) schematic eye, relaxed: six spherical
//! surfaces, with a lens made of a core of higher index inside a cortex
//! (Gullstrand 1909, appendix to Helmholtz, *Handbuch der physiologischen
//! Optik*, 3rd ed.).
//!
//! Constants: as tabulated by Atchison & Smith, *Optics of the Human Eye*
//! (2000, p. 252), transcribed in the `GullstrandVar` eye of J. Duijnhouwer's
//! MATLAB ray tracer (which cites that page); not read from the book itself.
//! Cornea 7.7 / 6.8 mm radii, 0.5 mm thick, index 1.376; aqueous 1.336,
//! 3.1 mm; lens cortex 10.0 mm front radius, 0.546 mm thick, index 1.386;
//! core 7.911 / -5.76 mm radii, 2.419 mm thick, index 1.406; posterior cortex
//! 0.635 mm thick, -6.0 mm back radius, index 1.386; vitreous 1.336,
//! 17.1854 mm, which places the retina at the second focal point.

use super::{surface as s, SchematicEye, Surface};

/// The relaxed eye, cornea to back of lens; the last gap reaches the retina.
const RELAXED: [Surface; 6] = [
    s(7.7, 1.376, 0.5),
    s(6.8, 1.336, 3.1),
    s(10.0, 1.386, 0.546),
    s(7.911, 1.406, 2.419),
    s(-5.76, 1.386, 0.635),
    s(-6.0, 1.336, 17.1854),
];

impl SchematicEye {
    /// The relaxed Gullstrand exact (No. 1) schematic eye (emmetropic,
    /// 58.64 D), whose lens is a core of index 1.406 inside a cortex of 1.386.
    pub fn gullstrand_relaxed() -> SchematicEye {
        SchematicEye::from_data(&RELAXED, 2)
    }
}

#[cfg(test)]
mod tests {
    use super::super::close;
    use super::*;

    #[test]
    fn published_powers() {
        // Kira eye clinic, "Refractive error tips (I)" (kiraspecialist.com),
        // table of the optical constants of the eye, Gullstrand's values:
        // eye at rest +58.64 D, cornea 43.05 D, lens 19.11 D.
        let eye = SchematicEye::gullstrand_relaxed();
        close(eye.equivalent_power().0, 58.64, 0.005);
        close(eye.cornea_power().0, 43.05, 0.005);
        close(eye.lens_power().0, 19.11, 0.005);
        // Atchison & Smith (from memory): 58.636 D; f = -17.054 mm, f' = 22.785 mm.
        close(eye.equivalent_power().0, 58.636, 1e-3);
        let (f, f_back) = eye.focal_lengths();
        close(f.0, -17.054, 1e-3);
        close(f_back.0, 22.785, 1e-3);
    }

    #[test]
    fn relaxed_eye_is_emmetropic() {
        // The relaxed eye focuses at infinity ("focusing at 0-dpt", the
        // GullstrandVar eye after Atchison & Smith p. 252): refraction 0.
        let eye = SchematicEye::gullstrand_relaxed();
        close(eye.ocular_refraction().0, 0.0, 1e-3);
        // Same page: the vitreous of 17.1854 mm puts the retina 24.3854 mm
        // behind the cornea (0.5 + 3.1 + 0.546 + 2.419 + 0.635 + 17.1854).
        close(eye.axial_length().0, 24.3854, 1e-9);
    }

    #[test]
    fn published_cardinal_points() {
        // Kira eye clinic table (above): axial length of the eye 24.387 mm,
        // i.e. the second focal point of the emmetropic eye.
        let c = SchematicEye::gullstrand_relaxed().cardinal_points();
        close(c.back_focal.0, 24.387, 0.002);
        // Gullstrand's cardinal points as tabulated by Atchison & Smith (from
        // memory), in mm from the corneal vertex: F = -15.707, F' = 24.387,
        // P = 1.348, P' = 1.602, N = 7.078, N' = 7.332. The image-side points
        // of the trace lie 0.001 to 0.002 mm in front of these; the cause was
        // not traced (the surface data are used exactly as transcribed).
        close(c.front_focal.0, -15.707, 1e-3);
        close(c.front_principal.0, 1.348, 1e-3);
        close(c.back_principal.0, 1.602, 2e-3);
        close(c.front_nodal.0, 7.078, 1e-3);
        close(c.back_nodal.0, 7.332, 2e-3);
    }
}
