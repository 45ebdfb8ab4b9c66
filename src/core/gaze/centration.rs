//! Prism at a lens point by Prentice's rule, the vertical imbalance between
//! the eyes at the reading level, and the angles a zone and a task span from
//! the eye, with the head turn needed when the task is wider than the zone.

use crate::core::lens::{LensError, NamedBounds};
use crate::core::units::{Degrees, Dioptres, Millimetres, PrismDioptres};

const DECENTRATION: NamedBounds = NamedBounds::new("decentration", -80.0, 80.0, "mm");

const POWER: NamedBounds = NamedBounds::new("lens power in the meridian", -40.0, 40.0, "D");

/// Prentice's rule: the prism (prism dioptres) at `decentration` millimetres
/// from the optical centre of a lens of `power` dioptres in that meridian,
/// `P = c (cm) x F`. The sign is the product of the two signs; the base
/// direction is given by [`vertical_prism`] and [`horizontal_prism`].
///
/// ```
/// use clearspan::core::gaze::prentice;
/// use clearspan::core::units::{Dioptres, Millimetres};
/// // 4 mm = 0.4 cm from the centre of a +5.00 D lens: 0.4 x 5 = 2 prism dioptres.
/// let p = prentice(Millimetres(4.0), Dioptres(5.0)).unwrap();
/// assert!((p.0 - 2.0).abs() < 1e-12);
/// ```
pub fn prentice(decentration: Millimetres, power: Dioptres) -> Result<PrismDioptres, LensError> {
    let c_cm = DECENTRATION.check(decentration.0)? / 10.0;
    Ok(PrismDioptres(c_cm * POWER.check(power.0)?))
}

/// The vertical prism at a point `below_or_above` millimetres above (positive)
/// or below the optical centre, for `vertical_power` dioptres in the vertical
/// meridian; base up positive. Below the centre of a plus lens the base is up
/// (a plus lens acts as prisms base to base).
pub fn vertical_prism(
    below_or_above: Millimetres,
    vertical_power: Dioptres,
) -> Result<PrismDioptres, LensError> {
    Ok(-prentice(below_or_above, vertical_power)?)
}

/// The horizontal prism at a point `nasal` millimetres towards the nose
/// (positive) or the temple from the optical centre, for `horizontal_power`
/// dioptres in the horizontal meridian; base in (towards the nose) positive.
pub fn horizontal_prism(
    nasal: Millimetres,
    horizontal_power: Dioptres,
) -> Result<PrismDioptres, LensError> {
    Ok(-prentice(nasal, horizontal_power)?)
}

/// The vertical prism before each eye and their difference at the reading level.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct VerticalImbalance {
    /// Vertical prism before the right eye, base up positive.
    pub right: PrismDioptres,
    /// Vertical prism before the left eye, base up positive.
    pub left: PrismDioptres,
    /// Right minus left: positive when the right eye has the more base-up prism.
    pub difference: PrismDioptres,
}

/// The vertical imbalance when the right and left lines of sight cross their
/// lenses `right_y` and `left_y` millimetres from the optical centres
/// (negative below), with `right_power` and `left_power` dioptres in the
/// vertical meridians (Prentice's rule for each eye).
pub fn vertical_imbalance(
    right_y: Millimetres,
    right_power: Dioptres,
    left_y: Millimetres,
    left_power: Dioptres,
) -> Result<VerticalImbalance, LensError> {
    let right = vertical_prism(right_y, right_power)?;
    let left = vertical_prism(left_y, left_power)?;
    Ok(VerticalImbalance {
        right,
        left,
        difference: right - left,
    })
}

/// The angle (degrees) a width spans seen from `distance` away, `2 atan(W / 2d)`:
/// a zone `width` on the lens seen from the CoR, or a task seen from the eye.
///
/// ```
/// use clearspan::core::gaze::subtended_angle;
/// use clearspan::core::units::Millimetres;
/// // A 600 mm wide monitor at 600 mm: 2 atan(0.5) = 53.130 degrees.
/// let a = subtended_angle(Millimetres(600.0), Millimetres(600.0)).unwrap();
/// assert!((a.0 - 53.130).abs() < 1e-3);
/// ```
pub fn subtended_angle(width: Millimetres, distance: Millimetres) -> Result<Degrees, LensError> {
    let w = NamedBounds::new("width", 0.0, 1.0e6, "mm").check(width.0)?;
    let d = NamedBounds::new("viewing distance", 1.0, 1.0e7, "mm").check(distance.0)?;
    Ok(Degrees::from_radians(2.0 * (w / (2.0 * d)).atan()))
}

/// Half the horizontal size of a typical adult spectacle lens, in
/// millimetres (a box width of about 50 mm; common practice). Scenarios
/// record lens heights only, so sideways limits use this.
pub const TYPICAL_LENS_HALF_WIDTH_MM: f64 = 25.0;

/// Where the line of sight can cross the lens when a task lies so far to the
/// side that the eye alone would look past the lens edge at `half_width`
/// (mm from the fitting point): the head turns towards the task until the
/// line of sight meets the edge. Takes the lens x of the upright crossing
/// and the centre of rotation to lens distance (mm); returns the x used and
/// the head turn, atan(|x| / c) - atan(half_width / c) (0 when on the lens).
///
/// ```
/// use clearspan::core::gaze::keep_on_lens;
/// use clearspan::core::units::Millimetres;
/// // Worked by hand: x = 54 mm at c = 27 mm is atan(2) = 63.435°; the edge
/// // at 27 mm is atan(1) = 45°, so the head turns 18.435° and x becomes 27.
/// let (x, turn) = keep_on_lens(Millimetres(54.0), Millimetres(27.0), Millimetres(27.0));
/// assert!((x.0 - 27.0).abs() < 1e-12 && (turn.0 - 18.435).abs() < 1e-3);
/// ```
pub fn keep_on_lens(
    x: Millimetres,
    cor_to_lens: Millimetres,
    half_width: Millimetres,
) -> (Millimetres, Degrees) {
    let (c, edge) = (cor_to_lens.0.max(1.0), half_width.0.abs());
    if !x.0.is_finite() || x.0.abs() <= edge {
        return (x, Degrees(0.0));
    }
    let turn = Degrees::from_radians((x.0.abs() / c).atan() - (edge / c).atan());
    (Millimetres(edge.copysign(x.0)), turn)
}

/// How far (degrees) the head must turn to each side to bring the edges of a
/// task spanning `task_angle` into a zone spanning `zone_angle` (both seen
/// from the eye): half the excess, zero when the zone is wide enough.
pub fn head_turn_per_side(task_angle: Degrees, zone_angle: Degrees) -> Degrees {
    Degrees((0.5 * (task_angle.0 - zone_angle.0)).max(0.0))
}
