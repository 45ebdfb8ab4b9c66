//! The solver: for one lens option, every manufactured combination of the
//! parameters the user left open (on the lens catalogue's grids, 0.25 D for
//! powers), scored by the objective; the best is kept, lower values winning
//! ties. The neighbours of the chosen values on each open grid are then
//! tried once more to explain the choice in words.
//!
//! The search is exhaustive: at most a few hundred designs per option, each
//! scored with the per-task values worked out once in the context, without
//! allocating.

use super::context::TaskPrep;
use super::objective::{score, total_above, TaskChoice};
use super::outcome::{
    ChoiceNote, ParameterKind, ParameterSource, ParameterValue, PenaltyKind, RangeEnd,
    ResolvedParameter, Score, TaskContext, TaskRef,
};
use crate::core::lens::{
    Grid, LensDesign, LensError, VerticalExtent, ADDITION_GRID, DEGRESSION_GRID,
    INTERMEDIATE_RATIO_GRID, PROGRESSION_LENGTH_GRID, SEGMENT_TOP_GRID,
    SINGLE_VISION_ADDITION_GRID, UPPER_BOTTOM_GRID,
};
use crate::core::units::{Dioptres, Millimetres};
use crate::scenario::FamilyChoice;

/// One parameter of a family: its kind, the user's value if fixed, and the
/// grid of values made.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Axis {
    /// Which parameter.
    pub kind: ParameterKind,
    /// The user's value, or `None` to choose from `grid`.
    pub fixed: Option<f64>,
    /// The values made.
    pub grid: Grid,
}

impl Axis {
    fn len(&self) -> usize {
        if self.fixed.is_some() {
            1
        } else {
            self.grid.len()
        }
    }

    fn value(&self, i: usize) -> f64 {
        self.fixed
            .or_else(|| self.grid.get(i))
            .unwrap_or(self.grid.first)
    }

    /// The parameter's value with its unit.
    pub fn typed(&self, v: f64) -> ParameterValue {
        match self.kind {
            ParameterKind::IntermediateRatio => ParameterValue::Ratio(v),
            ParameterKind::SegmentTop
            | ParameterKind::ProgressionLength
            | ParameterKind::LowerSegmentTop
            | ParameterKind::UpperSegmentBottom => ParameterValue::Length(Millimetres(v)),
            _ => ParameterValue::Power(Dioptres(v)),
        }
    }
}

fn axis(kind: ParameterKind, fixed: Option<f64>, grid: Grid) -> Axis {
    Axis { kind, fixed, grid }
}

/// The parameters of a lens option, in the order [`with_values`] takes them.
/// The grids are the lens catalogue's (the same the catalogue's candidate
/// iterator uses for each family).
pub fn axes(choice: &FamilyChoice) -> ([Option<Axis>; 3], usize) {
    use ParameterKind as K;
    match *choice {
        FamilyChoice::SingleVision { addition_d } => (
            [
                Some(axis(K::Addition, addition_d, SINGLE_VISION_ADDITION_GRID)),
                None,
                None,
            ],
            1,
        ),
        FamilyChoice::Bifocal {
            addition_d,
            segment_top_mm,
        } => (
            [
                Some(axis(K::Addition, addition_d, ADDITION_GRID)),
                Some(axis(K::SegmentTop, segment_top_mm, SEGMENT_TOP_GRID)),
                None,
            ],
            2,
        ),
        FamilyChoice::Trifocal {
            addition_d,
            intermediate_ratio,
            segment_top_mm,
        } => (
            [
                Some(axis(K::Addition, addition_d, ADDITION_GRID)),
                Some(axis(
                    K::IntermediateRatio,
                    intermediate_ratio,
                    INTERMEDIATE_RATIO_GRID,
                )),
                Some(axis(K::SegmentTop, segment_top_mm, SEGMENT_TOP_GRID)),
            ],
            3,
        ),
        FamilyChoice::Progressive {
            addition_d,
            progression_length_mm,
        } => (
            [
                Some(axis(K::Addition, addition_d, ADDITION_GRID)),
                Some(axis(
                    K::ProgressionLength,
                    progression_length_mm,
                    PROGRESSION_LENGTH_GRID,
                )),
                None,
            ],
            2,
        ),
        FamilyChoice::Degressive {
            near_addition_d,
            degression_d,
        } => (
            [
                Some(axis(K::NearAddition, near_addition_d, ADDITION_GRID)),
                Some(axis(K::Degression, degression_d, DEGRESSION_GRID)),
                None,
            ],
            2,
        ),
        FamilyChoice::DoubleSegment {
            addition_d,
            lower_top_mm,
            upper_bottom_mm,
        } => (
            [
                Some(axis(K::Addition, addition_d, ADDITION_GRID)),
                Some(axis(K::LowerSegmentTop, lower_top_mm, SEGMENT_TOP_GRID)),
                Some(axis(
                    K::UpperSegmentBottom,
                    upper_bottom_mm,
                    UPPER_BOTTOM_GRID,
                )),
            ],
            3,
        ),
    }
}

/// `choice` with every parameter set from `v` (in the order of [`axes`]).
pub fn with_values(choice: &FamilyChoice, v: [f64; 3]) -> FamilyChoice {
    match choice {
        FamilyChoice::SingleVision { .. } => FamilyChoice::SingleVision {
            addition_d: Some(v[0]),
        },
        FamilyChoice::Bifocal { .. } => FamilyChoice::Bifocal {
            addition_d: Some(v[0]),
            segment_top_mm: Some(v[1]),
        },
        FamilyChoice::Trifocal { .. } => FamilyChoice::Trifocal {
            addition_d: Some(v[0]),
            intermediate_ratio: Some(v[1]),
            segment_top_mm: Some(v[2]),
        },
        FamilyChoice::Progressive { .. } => FamilyChoice::Progressive {
            addition_d: Some(v[0]),
            progression_length_mm: Some(v[1]),
        },
        FamilyChoice::Degressive { .. } => FamilyChoice::Degressive {
            near_addition_d: Some(v[0]),
            degression_d: Some(v[1]),
        },
        FamilyChoice::DoubleSegment { .. } => FamilyChoice::DoubleSegment {
            addition_d: Some(v[0]),
            lower_top_mm: Some(v[1]),
            upper_bottom_mm: Some(v[2]),
        },
    }
}

/// The chosen design of one option.
#[derive(Debug, Clone, PartialEq)]
pub struct Solution {
    /// The design with every parameter resolved.
    pub choice: FamilyChoice,
    /// The built design.
    pub design: LensDesign,
    /// The parameter values, in the order of [`axes`].
    pub values: [f64; 3],
    /// Its objective.
    pub score: Score,
}

/// The grid indices of combination number `n` (first axis fastest).
fn indices(axes: &[Option<Axis>; 3], mut n: usize) -> [usize; 3] {
    let mut idx = [0; 3];
    for (i, a) in idx.iter_mut().zip(axes.iter()) {
        let len = a.map_or(1, |a| a.len());
        *i = n % len;
        n /= len;
    }
    idx
}

fn values_at(axes: &[Option<Axis>; 3], idx: [usize; 3]) -> [f64; 3] {
    let mut v = [0.0; 3];
    for ((value, a), i) in v.iter_mut().zip(axes.iter()).zip(idx) {
        *value = a.map_or(0.0, |a| a.value(i));
    }
    v
}

/// The best design of `choice` for `tasks`: exhaustive over the open grids.
/// An error when no combination builds a valid design.
pub fn solve(
    choice: &FamilyChoice,
    tasks: &[TaskPrep],
    extent: VerticalExtent,
) -> Result<Solution, LensError> {
    let (axes, _) = axes(choice);
    let total: usize = axes.iter().map(|a| a.map_or(1, |a| a.len())).product();
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
        let values = values_at(&axes, indices(&axes, n));
        let resolved = with_values(choice, values);
        let design = match LensDesign::from_choice(&resolved) {
            Ok(d) => d,
            Err(e) => {
                first_error.get_or_insert(e);
                continue;
            }
        };
        let floor = best
            .as_ref()
            .map_or(f64::NEG_INFINITY, |b| b.score.total + 1e-12);
        if total_above(&design, tasks, &hours_after, extent, floor).is_some_and(|t| t > floor) {
            best = Some(Solution {
                choice: resolved,
                design,
                values,
                score: score(&design, tasks, extent, None),
            });
        }
    }
    best.ok_or(first_error.unwrap_or(LensError::MissingParameter {
        parameter: "any buildable combination",
    }))
}

/// The parameters of a solution with who set each.
pub fn resolved_parameters(choice: &FamilyChoice, values: [f64; 3]) -> Vec<ResolvedParameter> {
    let (axes, n) = axes(choice);
    axes.iter()
        .zip(values)
        .take(n)
        .filter_map(|(a, v)| {
            a.map(|a| ResolvedParameter {
                kind: a.kind,
                value: a.typed(v),
                source: if a.fixed.is_some() {
                    ParameterSource::FixedByUser
                } else {
                    ParameterSource::ChosenByPlanner
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
    let (axes, _) = axes(original);
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
    let neighbour_value = a.typed(neighbour);
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
    if (other.total - base.total).abs() < 1e-9 {
        ChoiceNote::NeighbourEqual {
            parameter: a.kind,
            neighbour: neighbour_value,
        }
    } else if other.posture_penalty > base.posture_penalty + 1e-9 {
        ChoiceNote::NeighbourOnlyCostsMore {
            parameter: a.kind,
            neighbour: neighbour_value,
            cost: PenaltyKind::HeadPosture,
        }
    } else if other.addition_penalty > base.addition_penalty + 1e-9 {
        ChoiceNote::NeighbourOnlyCostsMore {
            parameter: a.kind,
            neighbour: neighbour_value,
            cost: PenaltyKind::ExcessAddition,
        }
    } else {
        ChoiceNote::NeighbourEqual {
            parameter: a.kind,
            neighbour: neighbour_value,
        }
    }
}
