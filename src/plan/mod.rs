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
//! command line.

pub mod cautions;
pub mod context;
pub mod driving;
pub mod error;
pub mod objective;
pub mod outcome;
pub mod report;
pub mod solver;
pub mod text;

pub use error::PlanError;
pub use outcome::*;

use crate::core::units::{Degrees, Dioptres, Millimetres};
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
    for (i, o) in s.options.iter().enumerate() {
        let field = format!("options[{i}]");
        let solution =
            solver::solve(&o.family, &ctx.tasks, ctx.extent).map_err(PlanError::lens(field))?;
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
            parameters: solver::resolved_parameters(&o.family, solution.values),
            explanation: solver::explain(
                &o.family,
                &solution,
                &ctx.tasks,
                &ctx.contexts,
                ctx.extent,
            ),
            score: sc,
            zones,
            tasks,
            driving: driving::fitness(&solution.design, &ctx.tasks, &ctx.contexts),
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
    let unserved = unserved(&ctx, &options);
    let cautions = cautions::cautions(s, &ctx, &options);
    let order = options.first().map(|best| order_summary(s, &ctx, best));
    Ok(Plan {
        scenario_name: s.name.clone(),
        amplitude: ctx.amplitude,
        refraction: ctx.refraction,
        pupil: ctx.pupil_used,
        zone_half_depth: ctx.zone_half_depth,
        tasks: ctx.contexts.clone(),
        options,
        unserved,
        cautions,
        order,
    })
}

/// Tasks no option makes comfortable, with the option that came closest.
fn unserved(ctx: &Context, options: &[OptionPlan]) -> Vec<UnservedTask> {
    let mut out = Vec::new();
    for (i, tc) in ctx.contexts.iter().enumerate() {
        let closest = options
            .iter()
            .filter_map(|o| o.tasks.get(i).map(|t| (o, t)))
            .max_by(|(_, a), (_, b)| {
                a.verdict.cmp(&b.verdict).then(
                    b.blur
                        .short_of_comfort
                        .0
                        .abs()
                        .total_cmp(&a.blur.short_of_comfort.0.abs()),
                )
            });
        let (best_verdict, closest_option, reason) = match closest {
            None => (Verdict::Blurred, None, UnservedReason::NoOptions),
            Some((_, t)) if t.verdict == Verdict::Comfortable => continue,
            Some((o, t)) => {
                let d = t.blur.short_of_comfort;
                let reason = if !t.posture.reachable {
                    UnservedReason::PowerOutOfReach
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
        });
    }
    out
}

/// The order for the best-ranked option.
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
    let prism = |p: &crate::scenario::Prism| {
        let any = p.horizontal_pd > 0.0 || p.vertical_pd > 0.0;
        (any && !ctx.over_contact_lenses).then_some(*p)
    };
    OrderSummary {
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
    }
}
