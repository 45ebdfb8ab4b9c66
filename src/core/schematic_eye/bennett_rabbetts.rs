//! The Bennett–Rabbetts simplified schematic eye, relaxed: one corneal
//! surface and a homogeneous lens, three spherical surfaces in all (Bennett
//! & Rabbetts, *Clinical Visual Optics*, 2nd ed.).
//!
//! Constants: as listed by the visisipy project (MREYE-LUMC/visisipy,
//! `models/catalog/bennett_rabbetts.py`, earlier `models/zoo/`, and
//! `models/materials.py`, citing that book); the lens radii and indices also appear in the OCT scaling script
//! of another public project ("Bennett and Rabbetts schematic emmetropic eye
//! model": 11 / -6.47515 mm, 1.336 / 1.422 / 1.336). Cornea 7.80 mm radius
//! into aqueous 1.336, 3.60 mm to the lens; lens 11.0 / -6.47515 mm radii,
//! 3.70 mm thick, index 1.422; vitreous 1.336, 16.79 mm (axial length 24.09 mm).

use super::{surface as s, SchematicEye, Surface};

/// The relaxed eye, cornea to back of lens; the last gap reaches the retina.
const RELAXED: [Surface; 3] = [
    s(7.80, 1.336, 3.60),
    s(11.0, 1.422, 3.70),
    s(-6.47515, 1.336, 16.79),
];

impl SchematicEye {
    /// The relaxed Bennett–Rabbetts simplified schematic eye (60.00 D,
    /// emmetropic within 0.02 D), with a single corneal surface.
    pub fn bennett_rabbetts_relaxed() -> SchematicEye {
        SchematicEye::from_data(&RELAXED, 1)
    }
}

#[cfg(test)]
mod tests {
    use super::super::close;
    use super::*;

    /// Half the last digit of values published to 0.01 mm.
    const ROUNDING: f64 = 0.005;

    #[test]
    fn published_power_and_focal_lengths() {
        // visisipy test suite (tests/models/catalog/test_bennett_rabbetts.py,
        // relaxed row), to 0.01 mm: f = -16.67 mm, f' = 22.27 mm, hence
        // F = 1000/16.67 = 59.99 D, i.e. 60.0 D to the precision published.
        let eye = SchematicEye::bennett_rabbetts_relaxed();
        let (f, f_back) = eye.focal_lengths();
        close(f.0, -16.67, ROUNDING);
        close(f_back.0, 22.27, ROUNDING);
        close(eye.equivalent_power().0, 60.0, 0.02);
        // The single corneal surface, worked by hand from the published radius
        // and index: (1.336 - 1) / 0.0078 m = 43.077 D.
        close(eye.cornea_power().0, 43.077, 1e-3);
    }

    #[test]
    fn published_cardinal_points_and_refraction() {
        // visisipy test suite (as above), relaxed row, mm from the corneal
        // vertex: F = -15.16, F' = 24.09, P = 1.51, P' = 1.82, N = 7.11,
        // N' = 7.42, axial length 24.09.
        let eye = SchematicEye::bennett_rabbetts_relaxed();
        let c = eye.cardinal_points();
        close(c.front_focal.0, -15.16, ROUNDING);
        close(c.back_focal.0, 24.09, ROUNDING);
        close(c.front_principal.0, 1.51, ROUNDING);
        close(c.back_principal.0, 1.82, ROUNDING);
        close(c.front_nodal.0, 7.11, ROUNDING);
        close(c.back_nodal.0, 7.42, ROUNDING);
        close(eye.axial_length().0, 24.09, 1e-9);
        // F' and the retina coincide at 24.09 mm to the published 0.01 mm, so
        // the eye is emmetropic within the vergence that 0.005 mm makes:
        // 1.336 / 0.02227 m = 59.99 D image vergence; ±0.005 mm ≈ ±0.014 D.
        close(eye.ocular_refraction().0, 0.0, 0.014);
    }
}
