//! Turns a solved design into the plan's per-option report: every task's
//! lens point, zone, local power as a prescription, accommodation and share
//! of the amplitude (from the optics core's task evaluation), verdict,
//! residual blur and acuity loss, range of clear vision at that point, head
//! posture, field and centration; and the ranges of the design's zones.

use super::context::Context;
use super::error::PlanError;
use super::objective::{zone_angle, TaskChoice};
use super::outcome::{
    Centration, DefocusDirection, DrivingVision, FieldFit, HeadPosture, LocalPower, ResidualBlur,
    SpectaclePower, TaskPlan, Verdict, ZoneKind, ZoneRangePlan,
};
use crate::core::acuity::{acuity_loss_logmar, blur_disc_arcmin, decimal_acuity};
use crate::core::clear_range::{evaluate_task, ranges_with_allowances};
use crate::core::gaze::{pitch_strain, turn_strain, vertical_imbalance, Eye};
use crate::core::lens::{LensDesign, LensPoint};
use crate::core::prescription::SpheroCylinder;
use crate::core::units::{Degrees, Dioptres, Millimetres, PrismDioptres};

/// Residuals smaller than this, in dioptres, are rounding, not defocus.
const NEGLIGIBLE_D: f64 = 1e-9;

/// The zones of constant power of a design, with their additions.
pub fn fixed_zones(design: &LensDesign) -> Vec<(ZoneKind, Dioptres)> {
    let near = design.max_addition();
    match design {
        LensDesign::SingleVision(d) => vec![(ZoneKind::SingleVision, d.addition())],
        LensDesign::Bifocal(_) | LensDesign::Progressive(_) => {
            vec![(ZoneKind::Distance, Dioptres(0.0)), (ZoneKind::Near, near)]
        }
        LensDesign::Trifocal(t) => vec![
            (ZoneKind::Distance, Dioptres(0.0)),
            (ZoneKind::Intermediate, t.intermediate_addition()),
            (ZoneKind::Near, near),
        ],
        LensDesign::Degressive(d) => vec![
            (ZoneKind::Intermediate, d.upper_addition()),
            (ZoneKind::Near, near),
        ],
        LensDesign::DoubleSegment(_) => vec![
            (ZoneKind::Distance, Dioptres(0.0)),
            (ZoneKind::Near, near),
            (ZoneKind::UpperSegment, near),
        ],
    }
}

/// The ranges of clear vision of a zone of addition `addition`, with half
/// depth `comfortable` for the comfortable range and `in_focus` for the
/// in-focus range.
pub fn zone_range(
    ctx: &Context,
    zone: ZoneKind,
    addition: Dioptres,
    (comfortable, in_focus): (Dioptres, Dioptres),
) -> Result<ZoneRangePlan, PlanError> {
    let r = ranges_with_allowances(
        &ctx.viewer,
        ctx.distance_power + addition,
        comfortable,
        in_focus,
    )
    .map_err(PlanError::optics("zone range"))?;
    Ok(ZoneRangePlan {
        zone,
        addition,
        in_focus: r.in_focus,
        comfortable: r.comfortable,
    })
}

/// A prescription with `addition` added to its sphere.
pub fn with_addition(rx: &SpheroCylinder, addition: Dioptres) -> SpectaclePower {
    SpectaclePower {
        sphere: rx.sphere() + addition,
        cylinder: rx.cylinder(),
        axis: rx.axis(),
    }
}

/// The report of task `i` seen as `choice` through `design`, whose optical
/// centres sit `centre` millimetres above the fitting point.
pub fn task_plan(
    ctx: &Context,
    design: &LensDesign,
    i: usize,
    choice: &TaskChoice,
    centre: f64,
) -> Result<TaskPlan, PlanError> {
    let (Some(prep), Some(tc)) = (ctx.tasks.get(i), ctx.contexts.get(i)) else {
        return Err(PlanError::Optics {
            context: format!("tasks[{i}]"),
            error: crate::core::error::OpticsError::Incompatible {
                problem: "the task list changed while planning",
                remedy: "plan again",
            },
        });
    };
    let field = format!("tasks[{i}]");
    let sample = design.evaluate(LensPoint::new(choice.x, choice.y));
    let add = sample.addition;
    let power = ctx.distance_power + add;
    let focus = evaluate_task(&ctx.viewer, prep.distance, power, prep.half_depth)
        .map_err(PlanError::optics(field.clone()))?;
    let a = focus.accommodation.0;
    let amp = ctx.viewer.amplitude().0;
    let (defocus, direction) = if a > amp + NEGLIGIBLE_D {
        (a - amp, DefocusDirection::NeedsMorePlus)
    } else if a < -NEGLIGIBLE_D {
        (-a, DefocusDirection::NeedsLessPlus)
    } else {
        (0.0, DefocusDirection::None)
    };
    let beyond = focus.residual_defocus.0.abs();
    let comfort_residual = focus.residual_for_comfort.0;
    let blur_disc =
        blur_disc_arcmin(Dioptres(defocus), ctx.pupil).map_err(PlanError::optics(field.clone()))?;
    let gaze = |e| PlanError::lens(field.clone())(e);
    // Near centration through the lens powers at the point: the right and
    // left horizontal meridians with the local addition.
    let through = |eye| match eye {
        Eye::Right => ctx.right.horizontal_power() + add,
        Eye::Left => ctx.left.horizontal_power() + add,
    };
    let near_pd = ctx
        .fitting
        .near_pd_through(prep.distance, [through(Eye::Right), through(Eye::Left)])
        .map_err(gaze)?;
    let convergence = both_eyes(|eye| {
        ctx.fitting
            .convergence_through(eye, prep.distance, through(eye))
            .map_err(gaze)
    })?;
    let inset = both_eyes(|eye| {
        ctx.fitting
            .near_inset_through(eye, prep.distance, through(eye))
            .map_err(gaze)
    })?;
    // Both lines of sight are taken at the right eye's height, measured from
    // the design's optical centres; a line of sight beyond the lens's edge
    // meets no prism, so the height is limited to the lens.
    let y = Millimetres(choice.y.clamp(ctx.extent.bottom().0, ctx.extent.top().0) - centre);
    let imbalance = vertical_imbalance(y, ctx.right.vertical_power(), y, ctx.left.vertical_power())
        .map_err(gaze)?;
    let standard = ctx.settings.driving_acuity_decimal;
    let driving_vision = prep.driving.then(|| {
        // A subjective amplitude ends where the depth of focus has already
        // been used up, so defocus beyond it adds to that depth: the
        // estimate then falls below the standard exactly where the in-focus
        // range ends, as the verdict does.
        let spent = if direction == DefocusDirection::NeedsMorePlus
            && ctx.viewer.includes_depth_of_focus()
        {
            prep.focus_depth.0
        } else {
            0.0
        };
        let acuity = decimal_acuity(Dioptres(defocus + spent), ctx.pupil);
        DrivingVision {
            acuity_decimal: acuity,
            standard_decimal: standard,
            meets_standard: choice.verdict >= Verdict::InFocusButTiring,
        }
    });
    let prism_over_limit = prep.prism_over_limit(y.0);
    Ok(TaskPlan {
        task: tc.task.clone(),
        lens_point: LensPoint {
            x: Millimetres(choice.x),
            y: Millimetres(choice.y),
        },
        zone: sample.zone,
        local_power: LocalPower {
            addition: add,
            right: with_addition(&ctx.right, add),
            left: with_addition(&ctx.left, add),
        },
        accommodation: focus.accommodation,
        share_of_amplitude: focus.share_of_amplitude,
        verdict: choice.verdict,
        focus: if choice.prism_limited || choice.posture_limited {
            Verdict::Comfortable
        } else {
            choice.verdict
        },
        blur: ResidualBlur {
            defocus: Dioptres(defocus),
            direction,
            beyond_tolerance: Dioptres(if beyond < NEGLIGIBLE_D { 0.0 } else { beyond }),
            short_of_comfort: Dioptres(if comfort_residual.abs() < NEGLIGIBLE_D {
                0.0
            } else {
                comfort_residual
            }),
            blur_disc_arcmin: blur_disc,
            acuity_loss_logmar: acuity_loss_logmar(Dioptres(defocus), ctx.pupil),
        },
        range_here: zone_range(ctx, sample.zone, add, (prep.half_depth, prep.focus_depth))?,
        posture: HeadPosture {
            chin_up: Degrees(choice.pitch),
            reachable: !choice.out_of_reach,
            strain: pitch_strain(Degrees(choice.pitch)),
        },
        field: FieldFit {
            zone_angle: zone_angle(design, choice.y, prep.cor_to_lens).map(Degrees),
            task_angle: Degrees(prep.width_deg),
            head_turn: Degrees(choice.turn),
            held_turn: Degrees(choice.held_turn),
            turn_strain: turn_strain(Degrees(
                choice.held_turn + 0.5 * (choice.turn - choice.held_turn),
            )),
        },
        near_vision: Centration {
            near_pd,
            inset_per_eye: inset * 0.5,
            convergence,
            vertical_imbalance: PrismDioptres(imbalance.difference.0.abs()),
        },
        driving_vision,
        prism_over_limit,
    })
}

/// The sum over both eyes of a per-eye quantity (a prism, a distance), the
/// right eye's taken first so that its error, if any, is the one reported.
fn both_eyes<T: std::ops::Add<Output = T>, E>(
    per_eye: impl Fn(Eye) -> Result<T, E>,
) -> Result<T, E> {
    Ok(per_eye(Eye::Right)? + per_eye(Eye::Left)?)
}
