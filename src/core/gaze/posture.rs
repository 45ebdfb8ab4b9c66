//! The head posture a task forces: the head pitch (chin up or down) that
//! brings the line of sight to a task through the part of the lens carrying a
//! wanted addition, with the eyes within a comfortable range of rotation.
//!
//! Everything here is monotone in the head pitch: raising the chin turns the
//! task downwards relative to the head, so both the eyes' elevation and the
//! lens heights crossed fall. Each constraint therefore holds on one side of
//! a threshold pitch, found by bisection, and the feasible pitches form one
//! interval; the pitch nearest upright is chosen.

use super::{Eye, Fitting, LensCrossing, TaskPoint};
use crate::core::lens::{LensDesign, LensError, NamedBounds, Zone};
use crate::core::units::{Degrees, Dioptres};

/// The largest head pitch searched either way, in degrees. Beyond it no
/// posture is offered; the planner judges whether a smaller pitch is
/// acceptable (working with the chin raised more than a few degrees is the
/// classic complaint of multifocal wearers at a high monitor: common practice).
pub const HEAD_PITCH_LIMIT_DEG: f64 = 45.0;

/// Bisection steps: 2 x 45 degrees halved 40 times is below 1e-10 degrees.
const STEPS: usize = 40;

/// A lens height standing in for "the line of sight misses the lens plane",
/// beyond any real lens, with the sign of the direction it misses towards.
const OFF_LENS_MM: f64 = 1.0e6;

const ELEVATION: NamedBounds = NamedBounds::new("comfortable eye rotation", -60.0, 40.0, "°");

const ADDITION: NamedBounds = NamedBounds::new("wanted addition", 0.0, 6.0, "D");

const TOLERANCE: NamedBounds = NamedBounds::new("addition tolerance", 0.0, 2.0, "D");

/// The range of eye rotation (elevation relative to the primary position,
/// negative downwards) the wearer can hold comfortably.
///
/// The default, 35 degrees down to 10 degrees up, is this product's choice
/// from common practice (reading is done with the eyes turned down by up to
/// about 30-35 degrees; sustained upward rotation tires quickly). Ergonomic
/// standards and guidance (ISO 9241 and national guidance) disagree on the
/// best gaze angle for screens, so the range is a parameter, not a constant.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ComfortRange {
    lowest: f64,
    highest: f64,
}

impl Default for ComfortRange {
    fn default() -> ComfortRange {
        ComfortRange {
            lowest: -35.0,
            highest: 10.0,
        }
    }
}

impl ComfortRange {
    /// Eye rotations from `lowest` to `highest` degrees (negative down,
    /// each within -60 to +40 degrees).
    pub fn new(lowest: Degrees, highest: Degrees) -> Result<ComfortRange, LensError> {
        let lowest = ELEVATION.check(lowest.0)?;
        let highest = ELEVATION.check(highest.0)?;
        if lowest > highest {
            return Err(LensError::EmptyRange {
                parameter: "comfortable eye rotation",
            });
        }
        Ok(ComfortRange { lowest, highest })
    }

    /// The lowest comfortable eye rotation, in degrees (negative is down).
    pub fn lowest(&self) -> Degrees {
        Degrees(self.lowest)
    }

    /// The highest comfortable eye rotation, in degrees.
    pub fn highest(&self) -> Degrees {
        Degrees(self.highest)
    }
}

/// A head posture and what each eye sees through in it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Posture {
    /// Head pitch, in degrees: chin up positive, chin down negative, 0 upright.
    pub head_pitch: Degrees,
    /// The right eye's lens crossing.
    pub right: LensCrossing,
    /// The left eye's lens crossing.
    pub left: LensCrossing,
    /// The zone of the height band used.
    pub zone: Zone,
    /// The addition the right lens gives at the crossing, in dioptres.
    pub right_addition: Dioptres,
    /// The addition the left lens gives at the crossing, in dioptres.
    pub left_addition: Dioptres,
}

/// The outcome of looking for a posture.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum PostureOutcome {
    /// The task is seen through the wanted addition at this posture
    /// (a head pitch of 0 means upright).
    Found(Posture),
    /// The heights are right, but at least one line of sight passes beside
    /// the segment that carries the addition.
    OutsideZoneSideways(Posture),
    /// No part of the lens gives the wanted addition within the tolerance.
    AdditionNotOnLens,
    /// The lens has the addition, but no head pitch within the limit brings
    /// it to the task with the eyes in the comfortable range.
    NoComfortablePosture,
}

/// The extremes over both eyes of what one head pitch gives.
struct Probe {
    highest_y: f64,
    lowest_y: f64,
    highest_elevation: f64,
    lowest_elevation: f64,
}

impl Fitting {
    fn probe(&self, task: &TaskPoint, pitch: f64) -> Probe {
        let mut p = Probe {
            highest_y: f64::MIN,
            lowest_y: f64::MAX,
            highest_elevation: f64::MIN,
            lowest_elevation: f64::MAX,
        };
        let target = task.pitched(Degrees(pitch));
        for eye in [Eye::Right, Eye::Left] {
            let (y, elevation) = match self.crossing_towards(eye, &target) {
                Some(c) => (c.point.y.0, c.elevation.0),
                None => {
                    // The sight line misses the plane only at extreme up or
                    // down gaze; keep the ordering with a far-off height.
                    let up = self.task_elevation(task, pitch) > 0.0;
                    let y = if up { OFF_LENS_MM } else { -OFF_LENS_MM };
                    (y, self.task_elevation(task, pitch))
                }
            };
            p.highest_y = p.highest_y.max(y);
            p.lowest_y = p.lowest_y.min(y);
            p.highest_elevation = p.highest_elevation.max(elevation);
            p.lowest_elevation = p.lowest_elevation.min(elevation);
        }
        p
    }

    /// The task's elevation from the midpoint of the CoRs at a head pitch, in degrees.
    fn task_elevation(&self, task: &TaskPoint, pitch: f64) -> f64 {
        let p = task.position;
        let horizontal = (p.x * p.x + p.z * p.z).sqrt();
        p.y.atan2(horizontal).to_degrees() - pitch
    }

    /// The head pitch nearest upright at which both eyes' lines of sight to
    /// `task` cross `design` where its addition is within `tolerance` of
    /// `wanted`, with the eyes within `comfort`.
    pub fn posture_for(
        &self,
        design: &LensDesign,
        task: &TaskPoint,
        wanted: Dioptres,
        tolerance: Dioptres,
        comfort: ComfortRange,
    ) -> Result<PostureOutcome, LensError> {
        ADDITION.check(wanted.0)?;
        TOLERANCE.check(tolerance.0)?;
        let bands = design.bands_for_addition(wanted, tolerance, self.params.extent);
        if bands.is_empty() {
            return Ok(PostureOutcome::AdditionNotOnLens);
        }
        // The comfort limits do not depend on the band: find their pitches once.
        let comfort_pitches =
            self.pitches_where(task, &|p| p.highest_elevation <= comfort.highest, &|p| {
                p.lowest_elevation >= comfort.lowest
            });
        let mut best: Option<(f64, Zone)> = None;
        for band in bands.iter() {
            let (top, bottom) = (band.top.0, band.bottom.0);
            let band_pitches =
                self.pitches_where(task, &|p| p.highest_y <= top, &|p| p.lowest_y >= bottom);
            let (Some((a, b)), Some((c, d))) = (comfort_pitches, band_pitches) else {
                continue;
            };
            let (low, high) = (a.max(c), b.min(d));
            if low > high {
                continue;
            }
            let pitch = 0.0f64.clamp(low, high);
            if best.is_none_or(|(b, _)| pitch.abs() < b.abs()) {
                best = Some((pitch, band.zone));
            }
        }
        let Some((pitch, zone)) = best else {
            return Ok(PostureOutcome::NoComfortablePosture);
        };
        let crossings = (
            self.crossing(Eye::Right, task, Degrees(pitch)),
            self.crossing(Eye::Left, task, Degrees(pitch)),
        );
        let (Some(right), Some(left)) = crossings else {
            return Ok(PostureOutcome::NoComfortablePosture);
        };
        let posture = Posture {
            head_pitch: Degrees(pitch),
            right,
            left,
            zone,
            right_addition: design.addition_at(right.point),
            left_addition: design.addition_at(left.point),
        };
        let delivered = |a: Dioptres| (a.0 - wanted.0).abs() <= tolerance.0 + 1e-9;
        if delivered(posture.right_addition) && delivered(posture.left_addition) {
            Ok(PostureOutcome::Found(posture))
        } else {
            Ok(PostureOutcome::OutsideZoneSideways(posture))
        }
    }

    /// The interval of pitches where both `from_here` (a condition that,
    /// once true, stays true as the pitch rises) and `up_to_here` (one that,
    /// once false, stays false) hold; `None` when either never holds.
    fn pitches_where(
        &self,
        task: &TaskPoint,
        from_here: &dyn Fn(&Probe) -> bool,
        up_to_here: &dyn Fn(&Probe) -> bool,
    ) -> Option<(f64, f64)> {
        Some((
            self.first_pitch_where(task, from_here)?,
            self.last_pitch_where(task, up_to_here)?,
        ))
    }

    /// The smallest pitch in the searched range where `ok` holds, for a
    /// condition that, once true, stays true as the pitch rises.
    fn first_pitch_where(&self, task: &TaskPoint, ok: &dyn Fn(&Probe) -> bool) -> Option<f64> {
        let (mut lo, mut hi) = (-HEAD_PITCH_LIMIT_DEG, HEAD_PITCH_LIMIT_DEG);
        if ok(&self.probe(task, lo)) {
            return Some(lo);
        }
        if !ok(&self.probe(task, hi)) {
            return None;
        }
        for _ in 0..STEPS {
            let mid = 0.5 * (lo + hi);
            if ok(&self.probe(task, mid)) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        Some(hi)
    }

    /// The largest pitch in the searched range where `ok` holds, for a
    /// condition that, once false, stays false as the pitch rises.
    fn last_pitch_where(&self, task: &TaskPoint, ok: &dyn Fn(&Probe) -> bool) -> Option<f64> {
        let (mut lo, mut hi) = (-HEAD_PITCH_LIMIT_DEG, HEAD_PITCH_LIMIT_DEG);
        if ok(&self.probe(task, hi)) {
            return Some(hi);
        }
        if !ok(&self.probe(task, lo)) {
            return None;
        }
        for _ in 0..STEPS {
            let mid = 0.5 * (lo + hi);
            if ok(&self.probe(task, mid)) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        Some(lo)
    }
}
