//! The planner: from a checked scenario (a wearer and a working day of tasks)
//! to lens options ranked best first, each with its open parameters chosen,
//! the ranges of clear vision of its zones, and for every task the lens
//! point, local power, focus verdict, head posture and centration.
//! The planner reads only [`crate::scenario::ValidScenario`] and calls the
//! optics and lens cores for every formula.
//!
//! Steps: [`context`] works out everything independent of the lenses once;
//! [`solver`] chooses each option's open parameters on the manufactured
//! grids by the objective in [`objective`]; [`report`] writes out each
//! option; the options are ranked by their objective (designs not fit for
//! driving, judged by [`driving`], last when the day includes driving);
//! [`cautions`] adds the warnings; [`text`] renders the plan for the
//! command line. [`demands`] builds the occupational-health task-demand
//! sheet on top of the plan (reference values in [`ergonomics`], its
//! figures in words in [`demand_words`]), and
//! [`roster`] screens a team with it.

pub mod cautions;
pub mod context;
pub mod demand_words;
pub mod demands;
pub mod driving;
pub mod ergonomics;
pub mod error;
pub mod objective;
pub mod outcome;
pub mod report;
pub mod roster;
pub mod solver;
pub mod text;
pub mod tolerances;
pub mod walkthrough;

pub use error::PlanError;
pub use outcome::*;

use crate::core::units::{Degrees, Dioptres, Metres, Millimetres};
use crate::scenario::{Correction, FamilyChoice, ValidScenario};
use context::Context;
use objective::score;

/// Plans `scenario`: every option solved, reported and ranked, with the
/// unserved tasks, cautions and the order summary of the best option.
///
/// An error only when a combination of checked values leaves a model's
/// domain (the message names the field).
pub fn plan(scenario: &ValidScenario) -> Result<Plan, PlanError> {
    let s = scenario.get();
    let ctx = Context::new(scenario)?;
    let mut options = Vec::with_capacity(s.options.len());
    let mut choices = vec![objective::TaskChoice::default(); ctx.tasks.len()];
    let prescribed = s.wearer.prescribed_addition_d;
    let from_prescription = prescribed.filter(|_| s.settings.use_prescribed_addition);
    for (i, o) in s.options.iter().enumerate() {
        let field = format!("options[{i}]");
        // The prescribed addition is taken where the design can carry it (a
        // degressive lens needs at least its minimum near addition and more
        // than its degression); otherwise the option is planned as entered.
        let prescribed_solution = from_prescription.and_then(|add| {
            let family = with_near_addition(&o.family, add);
            solver::solve(&family, &ctx.tasks, ctx.extent)
                .ok()
                .map(|s| (family, s))
        });
        let (family, solution) = match prescribed_solution {
            Some(found) => found,
            None => (
                o.family,
                solver::solve(&o.family, &ctx.tasks, ctx.extent).map_err(PlanError::lens(field))?,
            ),
        };
        let sc = score(&solution.design, &ctx.tasks, ctx.extent, Some(&mut choices));
        let centre = objective::optical_centre(&solution.design, &ctx.tasks, ctx.extent);
        let tasks = choices
            .iter()
            .enumerate()
            .map(|(t, c)| report::task_plan(&ctx, &solution.design, t, c, centre))
            .collect::<Result<Vec<_>, _>>()?;
        let zones = report::fixed_zones(&solution.design)
            .into_iter()
            .map(|(z, add)| {
                report::zone_range(&ctx, z, add, (ctx.zone_half_depth, ctx.zone_half_depth))
            })
            .collect::<Result<Vec<_>, _>>()?;
        options.push(OptionPlan {
            rank: 0,
            option: OptionRef {
                index: i,
                label: o.label.clone(),
            },
            design: solution.choice,
            parameters: solver::resolved_parameters(&o.family, &family, solution.values),
            explanation: solver::explain(&family, &solution, &ctx.tasks, &ctx.contexts, ctx.extent),
            score: sc,
            zones,
            tasks,
            driving: driving::fitness(&solution.design, &ctx.tasks, &ctx.contexts),
            near_tie: None,
            prescribed_addition: prescribed
                .filter(|_| near_addition(&solution.choice).0 > 0.0)
                .map(|p| AdditionComparison {
                    prescribed: Dioptres(p),
                    planned: near_addition(&solution.choice),
                    difference: near_addition(&solution.choice) - Dioptres(p),
                }),
            optical_centre_height: Millimetres(centre),
        });
    }
    // Ranking: by the objective, except that when the day includes driving
    // a design unfit for driving never ranks above one that is fit for it,
    // however well it scores on the other tasks.
    let unfit = |o: &OptionPlan| o.driving.as_ref().is_some_and(|d| !d.is_fit());
    options.sort_by(|a, b| {
        unfit(a)
            .cmp(&unfit(b))
            .then(b.score.total.total_cmp(&a.score.total))
            .then(a.option.index.cmp(&b.option.index))
    });
    for (r, o) in options.iter_mut().enumerate() {
        o.rank = r + 1;
    }
    mark_near_ties(&mut options);
    let unserved = unserved(&ctx, &options);
    let cautions = cautions::cautions(s, &ctx, &options);
    let choice = choice_of(s.chosen_option, &options);
    let order = choice
        .as_ref()
        .and_then(|c| options.iter().find(|o| o.option == c.chosen))
        .map(|chosen| order_summary(s, &ctx, chosen));
    Ok(Plan {
        scenario_name: s.name.clone(),
        amplitude: ctx.amplitude,
        refraction: ctx.refraction,
        pupil: ctx.pupil_used,
        zone_half_depth: ctx.zone_half_depth,
        lens_to_cor: ctx.fitting.lens_to_cor(),
        tasks: ctx.contexts.clone(),
        options,
        unserved,
        cautions,
        choice,
        order,
    })
}

/// The option the order is written for: the dispenser's `chosen` (an input
/// index), else the best-ranked; with how the recommendation compares.
fn choice_of(chosen: Option<usize>, ranked: &[OptionPlan]) -> Option<Choice> {
    let recommended = ranked.first()?;
    let picked = chosen
        .and_then(|i| ranked.iter().find(|o| o.option.index == i))
        .unwrap_or(recommended);
    let difference = (picked.option != recommended.option).then(|| ChoiceDifference {
        score_h: recommended.score.total - picked.score.total,
        recommended_comfortable_h: recommended.score.comfortable_hours,
        chosen_comfortable_h: picked.score.comfortable_hours,
        chosen_unfit_for_driving: picked.driving.as_ref().is_some_and(|d| !d.is_fit()),
    });
    Some(Choice {
        chosen: picked.option.clone(),
        recommended: recommended.option.clone(),
        by_dispenser: chosen.is_some(),
        difference,
    })
}

/// Scores closer than this, in hours of the working day, make two options
/// practically equal (six minutes a day; a product choice).
pub const NEAR_TIE_H: f64 = 0.1;

/// Notes, on each ranked option, whether it is practically equal to the
/// one above it and why that one comes first.
fn mark_near_ties(options: &mut [OptionPlan]) {
    for i in 1..options.len() {
        let (head, tail) = options.split_at_mut(i);
        let (Some(above), Some(o)) = (head.last(), tail.first_mut()) else {
            continue;
        };
        let margin = above.score.total - o.score.total;
        if margin.abs() >= NEAR_TIE_H {
            continue;
        }
        let fit = |p: &OptionPlan| p.driving.as_ref().is_none_or(DrivingFitness::is_fit);
        let reason = if fit(above) && !fit(o) {
            TieReason::AboveFitForDriving
        } else if margin > 1e-9 {
            TieReason::AboveScoresHigher
        } else {
            TieReason::AboveEnteredFirst
        };
        o.near_tie = Some(NearTie {
            above: above.option.clone(),
            margin_h: margin.abs(),
            reason,
        });
    }
}

/// `family` with its open near addition fixed to `add` (the prescribed
/// addition); single-vision task lenses keep theirs open, since their power
/// is chosen for the task, not for reading.
fn with_near_addition(family: &FamilyChoice, add: f64) -> FamilyChoice {
    let mut f = *family;
    match &mut f {
        FamilyChoice::SingleVision { .. } => {}
        FamilyChoice::Bifocal { addition_d, .. }
        | FamilyChoice::Trifocal { addition_d, .. }
        | FamilyChoice::Progressive { addition_d, .. }
        | FamilyChoice::DoubleSegment { addition_d, .. } => {
            addition_d.get_or_insert(add);
        }
        FamilyChoice::Degressive {
            near_addition_d, ..
        } => {
            near_addition_d.get_or_insert(add);
        }
    }
    f
}

/// The near addition of a resolved design (the whole power over the
/// distance power of a single-vision lens), in dioptres.
fn near_addition(design: &FamilyChoice) -> Dioptres {
    let add = match *design {
        FamilyChoice::SingleVision { addition_d }
        | FamilyChoice::Bifocal { addition_d, .. }
        | FamilyChoice::Trifocal { addition_d, .. }
        | FamilyChoice::Progressive { addition_d, .. }
        | FamilyChoice::DoubleSegment { addition_d, .. } => addition_d,
        FamilyChoice::Degressive {
            near_addition_d, ..
        } => near_addition_d,
    };
    Dioptres(add.unwrap_or(0.0))
}

/// Tasks no option makes comfortable, with the option that came closest.
fn unserved(ctx: &Context, options: &[OptionPlan]) -> Vec<UnservedTask> {
    let mut out = Vec::new();
    for (i, tc) in ctx.contexts.iter().enumerate() {
        // For a driving task, an option unfit for driving is never named as
        // the one that came closest while a fit one serves it at all.
        let driving = tc.half_depth_basis == HalfDepthBasis::DrivingStandard;
        let fit =
            |o: &OptionPlan| !(driving && matches!(o.driving, Some(DrivingFitness::Unfit { .. })));
        let closest = options
            .iter()
            .filter_map(|o| o.tasks.get(i).map(|t| (o, t)))
            .max_by(|(oa, a), (ob, b)| {
                fit(oa).cmp(&fit(ob)).then(a.verdict.cmp(&b.verdict)).then(
                    b.blur
                        .short_of_comfort
                        .0
                        .abs()
                        .total_cmp(&a.blur.short_of_comfort.0.abs()),
                )
            });
        let remedies = closest.map_or(Vec::new(), |(_, t)| remedies(ctx, i, tc, t));
        let (best_verdict, closest_option, reason) = match closest {
            None => (Verdict::Blurred, None, UnservedReason::NoOptions),
            Some((_, t)) if t.verdict == Verdict::Comfortable => continue,
            Some((o, t)) => {
                let d = t.blur.short_of_comfort;
                let reason = if !t.posture.reachable {
                    UnservedReason::PowerOutOfReach
                } else if t.focus == Verdict::Comfortable
                    && t.posture.strain != crate::core::gaze::Strain::Comfortable
                {
                    UnservedReason::TiringPosture {
                        chin_up: t.posture.chin_up,
                    }
                } else if t.focus == Verdict::Comfortable && t.prism_over_limit {
                    UnservedReason::VerticalImbalance {
                        difference: t.near_vision.vertical_imbalance,
                    }
                } else if d.0 >= 0.0 {
                    UnservedReason::NeedsMorePlus { short_by: d }
                } else {
                    UnservedReason::NeedsLessPlus { excess: -d }
                };
                (t.verdict, Some(o.option.clone()), reason)
            }
        };
        out.push(UnservedTask {
            task: tc.task.clone(),
            best_verdict,
            closest_option,
            reason,
            remedies,
        });
    }
    out
}

/// The strongest addition any lens in the catalogue makes, in dioptres.
const STRONGEST_MADE_D: f64 = crate::core::lens::SINGLE_VISION_ADDITION_GRID.last;

/// What would serve task `i` (context `tc`), seen as `seen` through the
/// option that came closest.
fn remedies(ctx: &Context, i: usize, tc: &TaskContext, seen: &TaskPlan) -> Vec<Remedy> {
    let mut out = Vec::new();
    if tc.gaze_elevation.0 > 0.0 && (!seen.posture.reachable || seen.posture.chin_up.0 > 0.5) {
        out.push(Remedy::UpperSegmentOrSeparatePair);
    }
    let needed = ctx.tasks.get(i).map(|p| p.comfort.lo).unwrap_or(0.0);
    if seen.blur.short_of_comfort.0 > 0.0 && needed > seen.local_power.addition.0 {
        let rounded = (needed * 4.0 - 1e-9).ceil() / 4.0;
        let beyond_made = rounded > STRONGEST_MADE_D;
        out.push(Remedy::Addition {
            needed: Dioptres(rounded),
            beyond_made,
        });
        if beyond_made {
            out.push(Remedy::Magnifier);
        }
    }
    if let ZoneRange::Clear { near, far } = seen.range_here.comfortable {
        let far_m = match far {
            FarLimit::Finite(m) => m.0,
            FarLimit::Infinite => f64::INFINITY,
        };
        let to = tc.distance.0.clamp(near.0, far_m);
        if (to - tc.distance.0).abs() > 0.005 {
            out.push(Remedy::MoveTask { to: Metres(to) });
        }
    }
    out
}

/// The order for the chosen option.
fn order_summary(s: &crate::scenario::Scenario, ctx: &Context, best: &OptionPlan) -> OrderSummary {
    let w = &s.wearer;
    let (addition, degression) = match best.design {
        FamilyChoice::SingleVision { addition_d }
        | FamilyChoice::Bifocal { addition_d, .. }
        | FamilyChoice::Trifocal { addition_d, .. }
        | FamilyChoice::Progressive { addition_d, .. }
        | FamilyChoice::DoubleSegment { addition_d, .. } => (addition_d, None),
        FamilyChoice::Degressive {
            near_addition_d,
            degression_d,
        } => (near_addition_d, degression_d),
    };
    let nearest = ctx
        .tasks
        .iter()
        .map(|t| t.distance)
        .min_by(|a, b| a.0.total_cmp(&b.0));
    // A single-vision lens is ordered as the power to make; the others as
    // the distance power with their addition.
    let single_vision = matches!(best.design, FamilyChoice::SingleVision { .. });
    let made_add = Dioptres(if single_vision {
        addition.unwrap_or(0.0)
    } else {
        0.0
    });
    let height = |above_fitting_point: Option<f64>| {
        above_fitting_point.map(|mm| Millimetres(w.fitting_height_mm + mm))
    };
    let (segment_top, upper_bottom, ratio, progression) = match best.design {
        FamilyChoice::Bifocal { segment_top_mm, .. } => (segment_top_mm, None, None, None),
        FamilyChoice::Trifocal {
            segment_top_mm,
            intermediate_ratio,
            ..
        } => (segment_top_mm, None, intermediate_ratio, None),
        FamilyChoice::DoubleSegment {
            lower_top_mm,
            upper_bottom_mm,
            ..
        } => (lower_top_mm, upper_bottom_mm, None, None),
        FamilyChoice::Progressive {
            progression_length_mm,
            ..
        } => (None, None, None, progression_length_mm),
        _ => (None, None, None, None),
    };
    let nearest_task = best
        .tasks
        .iter()
        .zip(&ctx.tasks)
        .min_by(|(_, a), (_, b)| a.distance.0.total_cmp(&b.distance.0))
        .map(|(t, _)| t);
    let prism = |p: &crate::scenario::Prism| (p.any() && !ctx.over_contact_lenses).then_some(*p);
    let mut order = OrderSummary {
        option: best.option.clone(),
        design: best.design,
        over_contact_lenses: ctx.over_contact_lenses,
        right: report::with_addition(&ctx.right, made_add),
        left: report::with_addition(&ctx.left, made_add),
        right_prism: prism(&w.right.prism),
        left_prism: prism(&w.left.prism),
        addition: addition.filter(|_| !single_vision).map(Dioptres),
        degression: degression.map(Dioptres),
        fitting_height: Millimetres(w.fitting_height_mm),
        pd_right: Millimetres(w.pd_right_mm),
        pd_left: Millimetres(w.pd_left_mm),
        near_pd: nearest.and_then(|d| ctx.fitting.near_pd(d).ok()),
        vertex: match w.correction {
            Correction::Spectacles { vertex_mm } => Some(Millimetres(vertex_mm)),
            Correction::ContactLenses => None,
        },
        pantoscopic_tilt: Degrees(w.pantoscopic_tilt_deg),
        optical_centre_height: single_vision.then_some(Millimetres(
            w.fitting_height_mm + best.optical_centre_height.0,
        )),
        lens_height: Millimetres(w.lens_height_mm),
        segment_top_height: height(segment_top),
        upper_segment_bottom_height: height(upper_bottom),
        intermediate_percent: ratio.map(|r| r * 100.0),
        progression_length: progression.map(Millimetres),
        minimum_fitting_height: progression
            .map(|pl| Millimetres(pl + crate::core::lens::NEAR_ZONE_BELOW_NRP_MM)),
        near_inset_per_eye: nearest_task.map(|t| t.near_vision.inset_per_eye),
        tolerances: Vec::new(),
    };
    order.tolerances = tolerances::for_order(&order);
    order
}
