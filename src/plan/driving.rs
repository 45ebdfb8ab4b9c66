//! Whether a design is fit for driving on a day that includes it. A design
//! is unfit when it is near-biased by its family (an occupational lens, a
//! single-vision lens with an addition, an upper segment that puts plus
//! power where the mirrors and signs above the road are seen), or when any
//! road or mirror task meets more than [`DRIVING_PLUS_LIMIT_D`] of addition
//! at its upright lens point or, on segment designs, within
//! [`SEGMENT_CLEARANCE_MM`] below it (so that a segment top at or just under
//! the line of sight for the road also counts). The planner never ranks an unfit design above a fit one.

use super::context::TaskPrep;
use super::outcome::{DrivingFitness, DrivingUnfit, TaskContext, TaskRef};
use crate::core::lens::{LensDesign, LensPoint};
use crate::core::units::Dioptres;

/// Plus power over the distance correction allowed where the road or a
/// mirror is seen, in dioptres (a quarter dioptre; common practice).
pub const DRIVING_PLUS_LIMIT_D: f64 = 0.25;
/// How far below the road's line of sight a segment top must stay, in
/// millimetres: about a pupil radius plus small eye movements while
/// scanning the road (a product choice).
pub const SEGMENT_CLEARANCE_MM: f64 = 2.0;
/// Slack when comparing an addition with the limit, in dioptres.
const SLACK_D: f64 = 1e-9;

/// The reason a design is unfit for driving by its family alone, if it is.
fn family_unfit(design: &LensDesign) -> Option<DrivingUnfit> {
    match design {
        LensDesign::Degressive(_) => Some(DrivingUnfit::OccupationalDesign),
        LensDesign::DoubleSegment(_) => Some(DrivingUnfit::UpperSegment),
        LensDesign::SingleVision(sv) if sv.addition().0 > DRIVING_PLUS_LIMIT_D + SLACK_D => {
            Some(DrivingUnfit::NearSingleVision {
                addition: sv.addition(),
            })
        }
        _ => None,
    }
}

/// The largest addition met at the upright lens point of a road task or,
/// on a design with segments (whose power jumps at the segment top), up to
/// [`SEGMENT_CLEARANCE_MM`] below it. A corridor lens's power rises
/// smoothly, so only the point itself counts there.
fn addition_near_road_point(design: &LensDesign, prep: &TaskPrep) -> f64 {
    let y = prep.natural_y();
    let segmented = matches!(
        design,
        LensDesign::Bifocal(_) | LensDesign::Trifocal(_) | LensDesign::DoubleSegment(_)
    );
    let depth = if segmented { SEGMENT_CLEARANCE_MM } else { 0.0 };
    [0.0, 0.25, 0.5, 0.75, 1.0]
        .iter()
        .map(|share| {
            design
                .addition_at(LensPoint::new(prep.x, y - share * depth))
                .0
        })
        .fold(f64::NEG_INFINITY, f64::max)
}

/// Whether the design can be worn for driving: every reason it cannot, or
/// fit. `None` when the day has no driving task.
pub fn fitness(
    design: &LensDesign,
    tasks: &[TaskPrep],
    contexts: &[TaskContext],
) -> Option<DrivingFitness> {
    if !tasks.iter().any(|t| t.driving) {
        return None;
    }
    let mut reasons: Vec<DrivingUnfit> = family_unfit(design).into_iter().collect();
    for (prep, ctx) in tasks.iter().zip(contexts) {
        if !prep.road {
            continue;
        }
        let add = addition_near_road_point(design, prep);
        if add > DRIVING_PLUS_LIMIT_D + SLACK_D {
            reasons.push(DrivingUnfit::PlusWhereRoadIsSeen {
                task: TaskRef {
                    index: ctx.task.index,
                    name: ctx.task.name.clone(),
                },
                addition: Dioptres(add),
            });
        }
    }
    Some(if reasons.is_empty() {
        DrivingFitness::Fit
    } else {
        DrivingFitness::Unfit { reasons }
    })
}

/// Whether a design is fit for driving, without the reasons: the solver's
/// quick test on every candidate. True on a day without driving.
pub fn is_fit(design: &LensDesign, tasks: &[TaskPrep]) -> bool {
    if !tasks.iter().any(|t| t.driving) {
        return true;
    }
    family_unfit(design).is_none()
        && tasks
            .iter()
            .filter(|t| t.road)
            .all(|t| addition_near_road_point(design, t) <= DRIVING_PLUS_LIMIT_D + SLACK_D)
}
