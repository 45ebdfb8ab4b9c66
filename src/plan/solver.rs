//! The solver: for one lens option, every manufactured combination of the
//! parameters the user left open (on the lens catalogue's grids, 0.25 D for
//! powers), scored by the objective; the best is kept, lower values winning
//! ties unless one is nearer the clinical defaults (see
//! [`crate::core::lens::Parameter::clinical_default`]). On a day that includes driving, a design fit for driving always
//! beats one that is not, whatever their scores; after that, a design that
//! fits the frame (a progressive lens's minimum fitting height) beats one
//! that does not. The neighbours of the chosen values on each open grid are then
//! tried once more to explain the choice in words.
//!
//! The search is exhaustive: at most a few hundred designs per option, each
//! scored with the per-task values worked out once in the context, without
//! allocating.

use super::context::TaskPrep;
use super::driving;
use super::objective::{score, total_above, TaskChoice};
use super::outcome::{
    ChoiceNote, ParameterKind, ParameterSource, ParameterValue, PenaltyKind, RangeEnd,
    ResolvedParameter, Score, TaskContext, TaskRef,
};
use crate::core::lens::{
    combination, combination_count, option_axes, with_values, Axis, LensDesign, LensError,
    VerticalExtent,
};
use crate::core::units::{Dioptres, Millimetres};
use crate::scenario::FamilyChoice;

/// The parameter's value `v` with its unit.
fn typed(kind: ParameterKind, v: f64) -> ParameterValue {
    match kind {
        ParameterKind::IntermediateRatio => ParameterValue::Ratio(v),
        ParameterKind::ProgressionLength => ParameterValue::Length(Millimetres(v)),
        ParameterKind::SegmentTop
        | ParameterKind::LowerSegmentTop
        | ParameterKind::UpperSegmentBottom => ParameterValue::Height(Millimetres(v)),
        _ => ParameterValue::Power(Dioptres(v)),
    }
}

/// The chosen design of one option.
#[derive(Debug, Clone, PartialEq)]
pub struct Solution {
    /// The design with every parameter resolved.
    pub choice: FamilyChoice,
    /// The built design.
    pub design: LensDesign,
    /// The parameter values, in the order of [`option_axes`].
    pub values: [f64; 3],
    /// Its objective.
    pub score: Score,
    /// Whether it is fit for driving (always true on a day without driving).
    pub fit_for_driving: bool,
    /// Whether it fits the frame (a progressive lens's minimum fitting height).
    pub fits_frame: bool,
}

impl Solution {
    /// What outranks the score: fit for driving first, then fitting the frame.
    fn standing(&self) -> (bool, bool) {
        (self.fit_for_driving, self.fits_frame)
    }
}

/// The best design of `choice` for `tasks`: exhaustive over the open grids.
/// An error when no combination builds a valid design.
pub fn solve(
    choice: &FamilyChoice,
    tasks: &[TaskPrep],
    extent: VerticalExtent,
) -> Result<Solution, LensError> {
    let (_, axes) = option_axes(choice);
    let total = combination_count(&axes);
    // Hours of the tasks after each task, for the bound that stops scoring
    // a design once it can no longer beat the best so far.
    let mut hours_after = vec![0.0; tasks.len()];
    let mut rest = 0.0;
    for (h, t) in hours_after.iter_mut().zip(tasks).rev() {
        *h = rest;
        rest += t.hours;
    }
    let mut best: Option<Solution> = None;
    let mut first_error = None;
    for n in 0..total {
        let values = combination(&axes, n);
        let resolved = with_values(choice, values);
        let design = match LensDesign::from_choice(&resolved) {
            Ok(d) => d,
            Err(e) => {
                first_error.get_or_insert(e);
                continue;
            }
        };
        let fit = driving::is_fit(&design, tasks);
        let fits_frame = design.fits(extent);
        let standing = (fit, fits_frame);
        let floor = match &best {
            Some(b) if b.standing() > standing => continue,
            Some(b) if b.standing() == standing => b.score.total - TIE_H,
            _ => f64::NEG_INFINITY,
        };
        let wins = |total: f64| match &best {
            Some(b) if b.standing() == standing => {
                total > b.score.total + TIE_H
                    || (total > b.score.total - TIE_H
                        && distance_from_defaults(&axes, values)
                            < distance_from_defaults(&axes, b.values))
            }
            _ => true,
        };
        if total_above(&design, tasks, &hours_after, extent, floor).is_some_and(wins) {
            best = Some(Solution {
                choice: resolved,
                design,
                values,
                score: score(&design, tasks, extent, None),
                fit_for_driving: fit,
                fits_frame,
            });
        }
    }
    best.ok_or(first_error.unwrap_or(LensError::MissingParameter {
        parameter: "any buildable combination",
    }))
}

/// Scores closer than this, in hours, are a tie (rounding, not a difference).
const TIE_H: f64 = 1e-9;

/// How far the open values lie from the clinical defaults, in grid steps:
/// of designs that serve the day equally, the one nearest what a
/// practitioner fits by default wins.
fn distance_from_defaults(axes: &[Option<Axis>; 3], values: [f64; 3]) -> f64 {
    axes.iter()
        .zip(values)
        .filter_map(|(a, v)| {
            let a = a.filter(|a| a.fixed.is_none())?;
            let default = a.kind.clinical_default()?;
            Some((v - default).abs() / a.grid.step)
        })
        .sum()
}

/// The parameters of a solution with who set each: `entered` is the
/// option as the user entered it, `solved` the same with the prescribed
/// addition filled in where the plan takes it from the prescription.
pub fn resolved_parameters(
    entered: &FamilyChoice,
    solved: &FamilyChoice,
    values: [f64; 3],
) -> Vec<ResolvedParameter> {
    let (_, by_user) = option_axes(entered);
    let (_, axes) = option_axes(solved);
    axes.iter()
        .zip(by_user)
        .zip(values)
        .filter_map(|((a, user), v)| {
            a.map(|a| ResolvedParameter {
                kind: a.kind,
                value: typed(a.kind, v),
                source: match (user.and_then(|u| u.fixed), a.fixed) {
                    (Some(_), _) => ParameterSource::FixedByUser,
                    (None, Some(_)) => ParameterSource::FromPrescription,
                    (None, None) => ParameterSource::ChosenByPlanner,
                },
            })
        })
        .collect()
}

/// Explains the chosen values of the open parameters by trying each one's
/// neighbours on its grid, the others held.
pub fn explain(
    original: &FamilyChoice,
    solution: &Solution,
    tasks: &[TaskPrep],
    contexts: &[TaskContext],
    extent: VerticalExtent,
) -> Vec<ChoiceNote> {
    let (_, axes) = option_axes(original);
    let mut chosen = vec![TaskChoice::default(); tasks.len()];
    let base = score(&solution.design, tasks, extent, Some(&mut chosen));
    let mut other = vec![TaskChoice::default(); tasks.len()];
    let mut notes = Vec::new();
    for (i, a) in axes.iter().enumerate() {
        let Some(a) = a.filter(|a| a.fixed.is_none()) else {
            continue;
        };
        let v = solution.values.get(i).copied().unwrap_or(a.grid.first);
        for (step, end) in [
            (-a.grid.step, RangeEnd::Lowest),
            (a.grid.step, RangeEnd::Highest),
        ] {
            let nv = v + step;
            if nv < a.grid.first - 1e-9 || nv > a.grid.last + 1e-9 {
                notes.push(ChoiceNote::EndOfMadeRange {
                    parameter: a.kind,
                    end,
                });
                continue;
            }
            let mut values = solution.values;
            if let Some(slot) = values.get_mut(i) {
                *slot = nv;
            }
            let Ok(design) = LensDesign::from_choice(&with_values(original, values)) else {
                continue;
            };
            if solution.fit_for_driving && !driving::is_fit(&design, tasks) {
                notes.push(ChoiceNote::NeighbourNotForDriving {
                    parameter: a.kind,
                    neighbour: typed(a.kind, nv),
                });
                continue;
            }
            let s = score(&design, tasks, extent, Some(&mut other));
            notes.push(compare(a, nv, &base, &s, &chosen, &other, contexts));
        }
    }
    if notes.is_empty() {
        notes.push(ChoiceNote::AllFixed);
    }
    notes
}

/// The note for one neighbour: the task it hurts most (by hours), else
/// what extra it costs, else a tie.
fn compare(
    a: Axis,
    neighbour: f64,
    base: &Score,
    other: &Score,
    chosen: &[TaskChoice],
    tried: &[TaskChoice],
    contexts: &[TaskContext],
) -> ChoiceNote {
    let hurt = chosen
        .iter()
        .zip(tried)
        .zip(contexts)
        .filter(|((c, t), _)| t.verdict < c.verdict)
        .max_by(|((c1, _), x1), ((c2, _), x2)| {
            x1.hours_per_day
                .total_cmp(&x2.hours_per_day)
                .then(c2.value.total_cmp(&c1.value))
        });
    let neighbour_value = typed(a.kind, neighbour);
    if let Some(((c, t), ctx)) = hurt {
        return ChoiceNote::NeighbourHurtsTask {
            parameter: a.kind,
            neighbour: neighbour_value,
            task: TaskRef {
                index: ctx.task.index,
                name: ctx.task.name.clone(),
            },
            verdict_chosen: c.verdict,
            verdict_neighbour: t.verdict,
        };
    }
    // Of the deductions the neighbour raises, the one it raises most, in
    // weighted hours: what makes it score lower with no task's verdict worse.
    let costs = [
        (
            other.posture_penalty - base.posture_penalty,
            PenaltyKind::HeadPosture,
        ),
        (
            other.addition_penalty - base.addition_penalty,
            PenaltyKind::ExcessAddition,
        ),
        (
            other.gap_penalty - base.gap_penalty,
            PenaltyKind::AdditionGap,
        ),
        (
            other.prism_penalty - base.prism_penalty,
            PenaltyKind::VerticalPrism,
        ),
    ];
    let dearest = costs
        .into_iter()
        .filter(|(more, _)| *more > TIE_H)
        .max_by(|x, y| x.0.total_cmp(&y.0));
    match dearest {
        Some((_, cost)) if other.total < base.total - TIE_H => ChoiceNote::NeighbourOnlyCostsMore {
            parameter: a.kind,
            neighbour: neighbour_value,
            cost,
        },
        _ => ChoiceNote::NeighbourEqual {
            parameter: a.kind,
            neighbour: neighbour_value,
        },
    }
}
