//! The solver's objective: how well one design serves the working day, in
//! weighted hours. Each task is seen at the head posture that serves it best
//! (upright when the upright lens point already suits it, else the smallest
//! chin lift or drop that reaches a zone of the right power), and counts
//!
//! `hours x (1 if comfortable, LIMITED_COMFORT_WEIGHT if comfortable in focus
//!  but beyond the vertical prism limit or at a tiring head pitch,
//!  TIRING_WEIGHT if in focus but tiring, 0 if blurred)
//!  - hours x min(GAP_WEIGHT_PER_D x dioptres of addition missing for comfort, GAP_CAP)
//!  - hours x (POSTURE_WEIGHT_PER_DEG x |head pitch| + TURN_WEIGHT_PER_DEG x head turn)`.
//!
//! The design then loses `ADDITION_WEIGHT_PER_D` per dioptre of its largest
//! addition, so that of two designs serving the tasks equally the one with
//! less addition wins (more addition narrows every zone's range of clear
//! vision and, on corridor lenses, brings more unwanted astigmatism).
//! The weights are this product's choices; the penalties are small enough
//! never to outweigh a change of verdict of a task of more than a few minutes.
//!
//! Nothing here allocates: the solver calls [`assess`] for every task of
//! every candidate design.

use super::context::{TaskPrep, TOLERATED_ASTIGMATISM_D};
use super::outcome::{Score, Verdict};
use crate::core::astigmatism::{usable_width, ZoneWidth};
use crate::core::gaze::{pitch_strain, Strain};
use crate::core::lens::{LensDesign, LensPoint, VerticalExtent};
use crate::core::units::Millimetres;
use crate::core::units::{Degrees, Dioptres};

/// Weight of an hour in focus but tiring, relative to a comfortable hour.
pub const TIRING_WEIGHT: f64 = 0.5;
/// Weight of an hour whose focus is comfortable but that is tiring for
/// another reason (the vertical prism difference exceeds the limit, or the
/// head pitch it needs is graded tiring): better than a tiring focus, so
/// that the planner still chooses the power that focuses the task.
pub const LIMITED_COMFORT_WEIGHT: f64 = 0.75;
/// Deduction per degree of head pitch, in hours per hour of the task.
pub const POSTURE_WEIGHT_PER_DEG: f64 = 0.01;
/// Deduction per degree of head turn, in hours per hour of the task: less
/// than for pitch, since the head turns only to reach the task's edges,
/// while a pitch is held all the time the task is worked on.
pub const TURN_WEIGHT_PER_DEG: f64 = 0.002;
/// Deduction per dioptre of addition still missing (or in excess) for
/// comfort, in hours per hour of the task: of two powers that both leave a
/// task short of comfort, the nearer one wins (a 20 cm task is better
/// served by the strongest reading lens made than by a weak one).
pub const GAP_WEIGHT_PER_D: f64 = 0.1;
/// The most the gap deduction takes, in hours per hour: less than the step
/// from tiring to blurred, so that the gap never outweighs a change of
/// verdict.
pub const GAP_CAP: f64 = 0.4;
/// Deduction per dioptre of the design's largest addition, in hours.
pub const ADDITION_WEIGHT_PER_D: f64 = 0.05;
/// How far inside a zone's edge the line of sight is placed when the head
/// moves to reach it, in millimetres (half a small pupil; a product choice).
pub const ZONE_MARGIN_MM: f64 = 1.0;

/// How one task is best seen through one design.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TaskChoice {
    /// Lens x, mm, nasal positive.
    pub x: f64,
    /// Lens y, mm, up positive.
    pub y: f64,
    /// Head pitch, degrees, chin up positive.
    pub pitch: f64,
    /// Local addition at the point, dioptres.
    pub addition: f64,
    /// The verdict there.
    pub verdict: Verdict,
    /// Total head turn needed to sweep the task, degrees.
    pub turn: f64,
    /// The part of `turn` held all the time the task is worked on (towards
    /// a task beyond the lens edge or beside a corridor's usable zone), degrees.
    pub held_turn: f64,
    /// The task's contribution to the objective, weighted hours.
    pub value: f64,
    /// The lens carries a power that would make the task comfortable, but no
    /// allowed head pitch brings the line of sight to it.
    pub out_of_reach: bool,
    /// Addition missing (or in excess) for comfort at the point, in dioptres.
    pub gap: f64,
    /// Comfortable focus lowered to tiring by the vertical prism difference.
    pub prism_limited: bool,
    /// Comfortable focus lowered to tiring by the head pitch it needs (a
    /// chin lift or drop graded tiring for work held for long periods).
    pub posture_limited: bool,
}

fn verdict_weight(v: Verdict) -> f64 {
    match v {
        Verdict::Comfortable => 1.0,
        Verdict::InFocusButTiring => TIRING_WEIGHT,
        Verdict::Blurred => 0.0,
    }
}

/// The angle in degrees the usable zone spans at lens height `y` (mm) seen
/// from `cor_to_lens` mm behind the lens; `None` when the design does not
/// limit the width there.
pub fn zone_angle(design: &LensDesign, y: f64, cor_to_lens: f64) -> Option<f64> {
    match usable_width(
        design,
        Millimetres(y),
        Dioptres(TOLERATED_ASTIGMATISM_D),
        Millimetres(cor_to_lens),
    ) {
        Ok(ZoneWidth::Limited { field_angle, .. }) => Some(field_angle.0),
        Ok(ZoneWidth::Unlimited) | Err(_) => None,
    }
}

/// The height of the optical centres of `design` relative to the fitting
/// point, in millimetres, for the prism the eyes meet. Multifocal and
/// corridor lenses have their prism reference at the fitting point (0). A
/// single-vision task lens is made with its optical centres at the upright
/// lens point of the task it serves longest (comfortable or in focus), since
/// that is how such lenses are centred; at the fitting point when it serves none.
pub fn optical_centre(design: &LensDesign, tasks: &[TaskPrep], extent: VerticalExtent) -> f64 {
    let LensDesign::SingleVision(sv) = design else {
        return 0.0;
    };
    let add = sv.addition().0;
    tasks
        .iter()
        .filter(|t| t.focus.contains(add))
        .max_by(|a, b| a.hours.total_cmp(&b.hours))
        .map_or(0.0, |t| {
            t.natural_y().clamp(
                extent.bottom().0 + ZONE_MARGIN_MM,
                extent.top().0 - ZONE_MARGIN_MM,
            )
        })
}

/// Where the eyes look through a corridor design at height `y`: the task's
/// own lens x when it lies within the usable zone (unwanted astigmatism
/// under the tolerated level), else the zone's edge, reached by turning the
/// head; with that head turn in degrees. Other designs take the task's x.
fn within_zone(design: &LensDesign, prep: &TaskPrep, y: f64) -> (f64, f64) {
    if design.ramp().is_none() {
        return (prep.x, 0.0);
    }
    let centre = design.corridor_x(Millimetres(y)).map_or(0.0, |c| c.0);
    let half = match usable_width(
        design,
        Millimetres(y),
        Dioptres(TOLERATED_ASTIGMATISM_D),
        Millimetres(prep.cor_to_lens),
    ) {
        Ok(ZoneWidth::Limited { width, .. }) => (0.5 * width.0 - ZONE_MARGIN_MM).max(0.0),
        Ok(ZoneWidth::Unlimited) | Err(_) => return (prep.x, 0.0),
    };
    let x = prep.x.clamp(centre - half, centre + half);
    let turn = ((prep.x - x).abs() / prep.cor_to_lens).atan().to_degrees();
    (x, turn)
}

/// The task seen at lens height `y` with head pitch `pitch`, before any
/// head turn to sweep it, through a design whose optical centres sit at
/// height `centre`. On a corridor design the point is kept within the
/// usable zone, the head turning towards the task as far as that needs.
fn at(design: &LensDesign, prep: &TaskPrep, y: f64, pitch: f64, centre: f64) -> TaskChoice {
    let (x, zone_turn) = within_zone(design, prep, y);
    let addition = design.addition_at(LensPoint::new(x, y)).0;
    let focus = prep.focus_verdict(addition);
    let prism_limited = focus == Verdict::Comfortable && prep.prism_over_limit(y - centre);
    let posture_limited =
        focus == Verdict::Comfortable && pitch_strain(Degrees(pitch)) != Strain::Comfortable;
    let (verdict, weight) = if prism_limited || posture_limited {
        (Verdict::InFocusButTiring, LIMITED_COMFORT_WEIGHT)
    } else {
        (focus, verdict_weight(focus))
    };
    let gap = prep.comfort.distance_to(addition);
    let gap_cost = (GAP_WEIGHT_PER_D * gap).min(GAP_CAP);
    let value = prep.hours
        * (weight
            - gap_cost
            - POSTURE_WEIGHT_PER_DEG * pitch.abs()
            - TURN_WEIGHT_PER_DEG * zone_turn);
    TaskChoice {
        x,
        y,
        pitch,
        addition,
        verdict,
        turn: zone_turn,
        held_turn: zone_turn,
        value,
        out_of_reach: false,
        gap,
        prism_limited,
        posture_limited,
    }
}

/// Charges the head turns the task needs: towards a task beyond the lens
/// edge or beside a corridor's usable zone, always; and to sweep a task
/// wider than the zone, where the zone serves the task at all.
fn with_turn(design: &LensDesign, prep: &TaskPrep, mut c: TaskChoice) -> TaskChoice {
    let sweep = if c.verdict == Verdict::Blurred || prep.width_deg <= 0.0 {
        0.0
    } else {
        zone_angle(design, c.y, prep.cor_to_lens)
            .map_or(0.0, |zone| (prep.width_deg - zone).max(0.0))
    };
    let more = prep.side_turn + sweep;
    c.turn += more;
    c.held_turn += prep.side_turn;
    c.value -= prep.hours * TURN_WEIGHT_PER_DEG * more;
    c
}

/// A task whose upright line of sight passes above or below the lens: the
/// head pitches until the line of sight meets the lens just inside its rim.
/// If no allowed pitch does, the task is not seen through the lens at all
/// and counts as blurred.
fn onto_lens(
    design: &LensDesign,
    prep: &TaskPrep,
    y0: f64,
    extent: VerticalExtent,
    centre: f64,
) -> TaskChoice {
    let rim = y0.clamp(
        extent.bottom().0 + ZONE_MARGIN_MM,
        extent.top().0 - ZONE_MARGIN_MM,
    );
    match prep.pitch_for(rim) {
        Some(pitch) => at(design, prep, rim, pitch, centre),
        None => TaskChoice {
            verdict: Verdict::Blurred,
            value: 0.0,
            out_of_reach: true,
            ..at(design, prep, rim, 0.0, centre)
        },
    }
}

/// The best way to see one task through `design` within the frame
/// `extent`, its optical centres at height `centre`. A driving task is seen
/// with the head upright: the road and mirrors are watched with the eyes.
pub fn assess(
    design: &LensDesign,
    prep: &TaskPrep,
    extent: VerticalExtent,
    centre: f64,
) -> TaskChoice {
    let y0 = prep.natural_y();
    let mut best = if extent.contains(Millimetres(y0)) {
        at(design, prep, y0, 0.0, centre)
    } else {
        onto_lens(design, prep, y0, extent, centre)
    };
    if best.verdict == Verdict::Comfortable || prep.driving {
        return with_turn(design, prep, best);
    }
    let mut comfort_on_lens = false;
    let mut comfort_reached = false;
    for (band, target) in [
        (prep.comfort, Verdict::Comfortable),
        (prep.focus, Verdict::InFocusButTiring),
    ] {
        if target <= best.verdict || band.is_empty() {
            continue;
        }
        let wanted = Dioptres(0.5 * (band.lo + band.hi));
        let tolerance = Dioptres(0.5 * (band.hi - band.lo));
        let heights = design.bands_for_addition(wanted, tolerance, extent);
        for h in heights.iter() {
            if target == Verdict::Comfortable {
                comfort_on_lens = true;
            }
            let (bottom, top) = (h.bottom.0 + ZONE_MARGIN_MM, h.top.0 - ZONE_MARGIN_MM);
            let y = if bottom > top {
                0.5 * (h.bottom.0 + h.top.0)
            } else {
                y0.clamp(bottom, top)
            };
            let Some(pitch) = prep.pitch_for(y) else {
                continue;
            };
            let candidate = at(design, prep, y, pitch, centre);
            // The comfortable power is reached, even where the prism
            // difference or the pitch then makes the task tiring.
            if candidate.verdict == Verdict::Comfortable
                || candidate.prism_limited
                || candidate.posture_limited
            {
                comfort_reached = true;
            }
            if candidate.value > best.value {
                best = candidate;
            }
        }
    }
    best.out_of_reach |= comfort_on_lens && !comfort_reached;
    with_turn(design, prep, best)
}

/// The objective of `design` for `tasks` if it can exceed `floor`, else
/// `None` as soon as even comfortable, posture-free remaining tasks could
/// not lift it above `floor`. `hours_after[i]` is the total of the hours of
/// the tasks after task `i`. Gives exactly [`score`]'s total when it returns.
pub fn total_above(
    design: &LensDesign,
    tasks: &[TaskPrep],
    hours_after: &[f64],
    extent: VerticalExtent,
    floor: f64,
) -> Option<f64> {
    let mut total = -ADDITION_WEIGHT_PER_D * design.max_addition().0;
    let centre = optical_centre(design, tasks, extent);
    for (prep, rest) in tasks.iter().zip(hours_after) {
        total += assess(design, prep, extent, centre).value;
        if total + rest <= floor {
            return None;
        }
    }
    Some(total)
}

/// The objective of `design` for `tasks`; when `choices` is given (as long
/// as `tasks`), each task's choice is written into it.
pub fn score(
    design: &LensDesign,
    tasks: &[TaskPrep],
    extent: VerticalExtent,
    mut choices: Option<&mut [TaskChoice]>,
) -> Score {
    let mut s = Score {
        total: 0.0,
        comfortable_hours: 0.0,
        tiring_hours: 0.0,
        blurred_hours: 0.0,
        posture_penalty: 0.0,
        prism_penalty: 0.0,
        gap_penalty: 0.0,
        addition_penalty: ADDITION_WEIGHT_PER_D * design.max_addition().0,
    };
    let centre = optical_centre(design, tasks, extent);
    for (i, prep) in tasks.iter().enumerate() {
        let c = assess(design, prep, extent, centre);
        match c.verdict {
            Verdict::Comfortable => s.comfortable_hours += prep.hours,
            Verdict::InFocusButTiring => s.tiring_hours += prep.hours,
            Verdict::Blurred => s.blurred_hours += prep.hours,
        }
        s.posture_penalty +=
            prep.hours * (POSTURE_WEIGHT_PER_DEG * c.pitch.abs() + TURN_WEIGHT_PER_DEG * c.turn);
        if c.prism_limited {
            s.prism_penalty += prep.hours * (1.0 - LIMITED_COMFORT_WEIGHT);
        } else if c.posture_limited {
            s.posture_penalty += prep.hours * (1.0 - LIMITED_COMFORT_WEIGHT);
        }
        s.gap_penalty += prep.hours * (GAP_WEIGHT_PER_D * c.gap).min(GAP_CAP);
        s.total += c.value;
        if let Some(slot) = choices.as_deref_mut().and_then(|cs| cs.get_mut(i)) {
            *slot = c;
        }
    }
    s.total -= s.addition_penalty;
    s
}

impl Default for TaskChoice {
    /// A placeholder before a task is assessed: upright, blurred, worth nothing.
    fn default() -> TaskChoice {
        TaskChoice {
            x: 0.0,
            y: 0.0,
            pitch: 0.0,
            addition: 0.0,
            verdict: Verdict::Blurred,
            turn: 0.0,
            held_turn: 0.0,
            value: 0.0,
            out_of_reach: false,
            gap: 0.0,
            prism_limited: false,
            posture_limited: false,
        }
    }
}
