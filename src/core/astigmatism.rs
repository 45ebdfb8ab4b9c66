//! Unwanted astigmatism beside the corridor of progressive and degressive
//! lenses, and the usable width of each lens zone.
//!
//! Minkwitz's theorem (G. Minkwitz, "Über den Flächenastigmatismus bei
//! gewissen symmetrischen Asphären", Optica Acta 10, 1963, 223-227; treated
//! in J. E. Sheedy et al., "Progressive powered lenses: the Minkwitz
//! theorem", Optometry and Vision Science 82, 2005; references from memory):
//! beside an umbilic corridor along which the mean power changes with
//! gradient `G = dP/dy`, the surface astigmatism grows sideways at twice that
//! rate, `C(x) ~ 2 |G| |x|` for a lateral distance `x` from the corridor.
//!
//! Derivation used here, for a surface sag `z = f(y) + k(y) x^2 / 2` with
//! `f'' = k` (umbilic along `x = 0`) and small slopes: the Hessian at `(x, y)`
//! has `z_xx = k`, `z_yy = k + k'' x^2 / 2`, `z_xy = k' x`. The difference of
//! its eigenvalues is `sqrt((k'' x^2 / 2)^2 + 4 k'^2 x^2) ~ 2 |k'| |x|` to
//! first order in `x`; multiplied by `(n - 1)` it is the cylinder, while the
//! mean power gradient along the corridor is `(n - 1) k'`. Setting the
//! cylinder equal to a tolerated astigmatism `T` gives the half width
//! `x = T / (2 |G|)`, so the **usable width is `w = 2 x = T / |G|`**.
//! A test builds such a surface numerically and checks this width.

use crate::core::gaze::subtended_angle;
use crate::core::lens::{LensDesign, LensError, LensPoint, PowerGradient};
use crate::core::units::{Degrees, Dioptres, Millimetres};

#[cfg(test)]
mod surface_check;

/// The largest tolerated astigmatism accepted, in dioptres.
const MAX_TOLERANCE_D: f64 = 4.0;

/// The surface astigmatism (cylinder, dioptres) Minkwitz's theorem predicts
/// at `lateral` millimetres beside an umbilic corridor whose mean power
/// changes by `gradient` dioptres per millimetre: `2 |G| |x|`.
///
/// ```
/// use clearspan::core::astigmatism::minkwitz_cylinder;
/// use clearspan::core::lens::PowerGradient;
/// use clearspan::core::units::Millimetres;
/// // 0.10 D/mm along the corridor, 2 mm to the side: 2 x 0.10 x 2 = 0.40 D.
/// let c = minkwitz_cylinder(PowerGradient(0.1), Millimetres(2.0));
/// assert!((c.0 - 0.4).abs() < 1e-12);
/// ```
pub fn minkwitz_cylinder(gradient: PowerGradient, lateral: Millimetres) -> Dioptres {
    Dioptres(2.0 * gradient.magnitude() * lateral.0.abs())
}

/// The full width (millimetres) of the corridor within which the surface
/// astigmatism stays below `tolerance`, `T / |G|`; `None` where the power
/// does not change (the width is then not limited by the corridor).
///
/// ```
/// use clearspan::core::astigmatism::minkwitz_width;
/// use clearspan::core::lens::PowerGradient;
/// use clearspan::core::units::Dioptres;
/// // 0.50 D tolerated, 0.10 D/mm: 0.50 / 0.10 = 5 mm.
/// let w = minkwitz_width(PowerGradient(0.1), Dioptres(0.5)).unwrap().unwrap();
/// assert!((w.0 - 5.0).abs() < 1e-12);
/// ```
pub fn minkwitz_width(
    gradient: PowerGradient,
    tolerance: Dioptres,
) -> Result<Option<Millimetres>, LensError> {
    let t = check_tolerance(tolerance)?;
    let g = gradient.magnitude();
    if !g.is_finite() {
        return Err(LensError::NotFinite {
            parameter: "power gradient",
        });
    }
    Ok((g > 0.0).then(|| Millimetres(t / g)))
}

fn check_tolerance(tolerance: Dioptres) -> Result<f64, LensError> {
    let t = tolerance.0;
    if !t.is_finite() {
        Err(LensError::NotFinite {
            parameter: "tolerated astigmatism",
        })
    } else if t <= 0.0 || t > MAX_TOLERANCE_D {
        Err(LensError::OutOfRange {
            parameter: "tolerated astigmatism",
            value: t,
            min: 0.0,
            max: MAX_TOLERANCE_D,
            unit: "D",
        })
    } else {
        Ok(t)
    }
}

/// The model's unwanted astigmatism at a lens point, in dioptres: for
/// progressive and degressive designs Minkwitz's linear growth away from the
/// corridor centre line, capped at the ramp's power change (near the corridor
/// the linear law holds; far from it real surfaces level off, and their peak
/// unwanted astigmatism is of the order of the addition: from memory). Zero
/// for the families whose zones have constant power, and zero beside the
/// distance and near zones of corridor designs, where the model's gradient is
/// zero (real lenses do have some astigmatism there; the model leaves it out).
pub fn unwanted_astigmatism(design: &LensDesign, point: LensPoint) -> Dioptres {
    match (design.ramp(), design.corridor_x(point.y)) {
        (Some(ramp), Some(centre)) => {
            let (least, most) = ramp.value_range();
            let lateral = point.x - centre;
            let c = minkwitz_cylinder(ramp.gradient_at(point.y), lateral);
            Dioptres(c.0.min(most - least))
        }
        _ => Dioptres(0.0),
    }
}

/// How wide a zone is at one lens height.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum ZoneWidth {
    /// The design does not limit the width there (a distance portion, a
    /// single-vision lens, or a corridor height where the power is constant):
    /// the frame does.
    Unlimited,
    /// The zone is this wide.
    Limited {
        /// Width on the lens, in millimetres.
        width: Millimetres,
        /// The angle the width spans seen from the eye's centre of rotation,
        /// which is also the angle of the field it covers at the task, in degrees.
        field_angle: Degrees,
    },
}

/// The usable width at lens height `y`: for corridor designs the Minkwitz
/// width `T / |G|` for the tolerated astigmatism `tolerance`; for segment
/// designs the segment's width at that height (full power across it); each
/// also as the angle it spans from the centre of rotation, `cor_to_lens`
/// millimetres away along the line of sight.
pub fn usable_width(
    design: &LensDesign,
    y: Millimetres,
    tolerance: Dioptres,
    cor_to_lens: Millimetres,
) -> Result<ZoneWidth, LensError> {
    check_tolerance(tolerance)?;
    if !y.0.is_finite() {
        return Err(LensError::NotFinite {
            parameter: "lens height",
        });
    }
    let width = match design {
        LensDesign::SingleVision(_) => None,
        LensDesign::Progressive(_) | LensDesign::Degressive(_) => match design.ramp() {
            Some(ramp) => minkwitz_width(ramp.gradient_at(y), tolerance)?,
            None => None,
        },
        LensDesign::Bifocal(b) => segment_chord(b.shape().chord_at_depth(b.segment_top().0 - y.0)),
        LensDesign::Trifocal(t) => segment_chord(t.shape().chord_at_depth(t.segment_top().0 - y.0)),
        LensDesign::DoubleSegment(d) => {
            let lower = d.shape().chord_at_depth(d.lower_top().0 - y.0);
            let upper = d.shape().chord_at_depth(y.0 - d.upper_bottom().0);
            segment_chord(Millimetres(lower.0.max(upper.0)))
        }
    };
    match width {
        None => Ok(ZoneWidth::Unlimited),
        Some(width) => Ok(ZoneWidth::Limited {
            width,
            field_angle: subtended_angle(width, cor_to_lens)?,
        }),
    }
}

/// A segment's chord at some height; zero means the height is in the distance portion.
fn segment_chord(chord: Millimetres) -> Option<Millimetres> {
    (chord.0 > 0.0).then_some(chord)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::core::lens::{Bifocal, Progressive, SegmentShape, SingleVision};

    fn progressive(add: f64, length: f64) -> LensDesign {
        LensDesign::Progressive(
            Progressive::new(Dioptres(add), Millimetres(length), Millimetres(0.0)).unwrap(),
        )
    }

    /// Checks a usable width and its field angle against expected values.
    fn check(w: ZoneWidth, width: f64, angle: f64) {
        match w {
            ZoneWidth::Limited {
                width: w,
                field_angle,
            } => {
                assert!((w.0 - width).abs() < 1e-3, "width {} vs {width}", w.0);
                assert!(
                    (field_angle.0 - angle).abs() < 1e-3,
                    "angle {} vs {angle}",
                    field_angle.0
                );
            }
            ZoneWidth::Unlimited => panic!("expected a limited width of {width} mm"),
        }
    }

    #[test]
    fn corridor_width_at_the_steepest_point() {
        // +2.00 D over a 16 mm ramp (progression length 18 mm): peak gradient
        // pi/2 x 2/16 = 0.196350 D/mm at -10 mm. Tolerating 0.50 D:
        // w = 0.50 / 0.196350 = 2.546479 mm; seen from 27 mm,
        // 2 atan(1.273240 / 27) = 5.399796 degrees.
        let d = progressive(2.0, 18.0);
        let w = usable_width(&d, Millimetres(-10.0), Dioptres(0.5), Millimetres(27.0)).unwrap();
        check(w, 2.546479, 5.399796);
        // A longer progression is gentler and so wider: a 24 mm length (22 mm
        // ramp) gives 0.50 / (pi/2 x 2/22) = 3.501409 mm at its steepest
        // point, -13 mm; 2 atan(1.750704 / 27) = 7.419833 degrees.
        let long = progressive(2.0, 24.0);
        let w = usable_width(&long, Millimetres(-13.0), Dioptres(0.5), Millimetres(27.0)).unwrap();
        check(w, 3.501409, 7.419833);
    }

    #[test]
    fn constant_power_zones_are_not_limited_by_the_corridor() {
        let d = progressive(2.0, 18.0);
        for y in [5.0, -1.0, -18.0, -25.0] {
            let w = usable_width(&d, Millimetres(y), Dioptres(0.5), Millimetres(27.0)).unwrap();
            assert_eq!(w, ZoneWidth::Unlimited, "at {y} mm");
        }
        let sv = LensDesign::SingleVision(SingleVision::new(Dioptres(1.0)).unwrap());
        let w = usable_width(&sv, Millimetres(0.0), Dioptres(0.5), Millimetres(27.0)).unwrap();
        assert_eq!(w, ZoneWidth::Unlimited);
    }

    #[test]
    fn segment_width_is_the_segment_chord() {
        // 28 mm straight top at -4 mm, centre 5 mm inside the edge: at -9 mm
        // the chord is the full 28 mm; 2 atan(14 / 27) = 54.815151 degrees.
        let b = LensDesign::Bifocal(
            Bifocal::new(
                Dioptres(2.0),
                Millimetres(-4.0),
                SegmentShape::STRAIGHT_TOP_28,
            )
            .unwrap(),
        );
        let w = usable_width(&b, Millimetres(-9.0), Dioptres(0.5), Millimetres(27.0)).unwrap();
        check(w, 28.0, 54.815151);
        let above = usable_width(&b, Millimetres(0.0), Dioptres(0.5), Millimetres(27.0)).unwrap();
        assert_eq!(above, ZoneWidth::Unlimited);
    }

    #[test]
    fn astigmatism_grows_beside_the_corridor_and_is_capped() {
        let d = progressive(2.0, 18.0);
        // At the steepest point, 1 mm aside: 2 x (pi/2 x 2/16) x 1 = pi/8 D.
        let c = unwanted_astigmatism(&d, LensPoint::new(1.0, -10.0));
        assert!((c.0 - std::f64::consts::FRAC_PI_8).abs() < 1e-12);
        assert_eq!(
            unwanted_astigmatism(&d, LensPoint::new(0.0, -10.0)),
            Dioptres(0.0)
        );
        assert_eq!(
            unwanted_astigmatism(&d, LensPoint::new(30.0, -10.0)),
            Dioptres(2.0)
        );
        assert_eq!(
            unwanted_astigmatism(&d, LensPoint::new(30.0, 5.0)),
            Dioptres(0.0)
        );
    }

    #[test]
    fn bad_tolerances_are_refused() {
        let d = progressive(2.0, 18.0);
        for t in [0.0, -0.5, 9.0, f64::NAN] {
            assert!(usable_width(&d, Millimetres(-10.0), Dioptres(t), Millimetres(27.0)).is_err());
        }
        assert!(minkwitz_width(PowerGradient(f64::INFINITY), Dioptres(0.5)).is_err());
    }
}
