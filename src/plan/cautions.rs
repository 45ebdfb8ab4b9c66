//! The warnings a plan carries, drawn from the scenario and the planned
//! options: always that the plan is a planning aid; designs not for driving
//! where a task is driving or moving machinery; safety eyewear for tasks
//! that need it; anisometropia; vertical prismatic imbalance at the reading
//! level (Prentice's rule); high powers whose effect depends on the vertex
//! distance; inputs the models had to clamp; and a measured amplitude from
//! an older wearer, which already contains depth of field.

use super::context::Context;
use super::outcome::{Caution, CautionKind, OptionPlan, OptionRef, TaskRef};
use crate::core::units::Metres;
use crate::core::vergence::power_at_vertex;
use crate::scenario::{FamilyChoice, Scenario};

/// Spherical-equivalent difference between the eyes from which the plan
/// warns of anisometropia, in dioptres (1.00 D, the usual clinical
/// definition; from memory).
pub const ANISOMETROPIA_D: f64 = 1.0;
/// Vertical prism difference between the eyes from which the plan warns,
/// in prism dioptres (about 1 Δ is the usual limit of comfortable vertical
/// fusion for sustained reading; common practice, from memory).
pub const VERTICAL_IMBALANCE_PD: f64 = 1.0;
/// Power in any meridian beyond which the vertex distance matters, in
/// dioptres (vertex compensation is usual beyond ±4.00 D; common practice).
pub const HIGH_POWER_D: f64 = 4.0;
/// A change of vertex distance used to show how much a high power depends on it, in metres.
const VERTEX_CHANGE_M: f64 = 0.002;
/// Age from which a measured amplitude is mostly depth of field, in years
/// (domain brief: past about 60 the apparent amplitude stays near 0.5-1.0 D).
pub const APPARENT_AMPLITUDE_AGE: f64 = 60.0;

fn task_ref(s: &Scenario, i: usize) -> TaskRef {
    TaskRef {
        index: i,
        name: s.tasks.get(i).map(|t| t.name.clone()).unwrap_or_default(),
    }
}

fn names(tasks: &[TaskRef]) -> String {
    let quoted: Vec<String> = tasks.iter().map(|t| format!("\"{}\"", t.name)).collect();
    quoted.join(", ")
}

/// Whether an option's design is occupational or biased to near, so not for driving.
pub fn near_biased(design: &FamilyChoice) -> bool {
    match design {
        FamilyChoice::Degressive { .. } => true,
        FamilyChoice::SingleVision { addition_d } => addition_d.is_some_and(|a| a > 0.0),
        _ => false,
    }
}

/// Every caution for `scenario` planned as `options` (ranked).
pub fn cautions(s: &Scenario, ctx: &Context, options: &[OptionPlan]) -> Vec<Caution> {
    let mut out = vec![Caution {
        kind: CautionKind::PlanningAid,
        tasks: vec![],
        options: vec![],
        text: "This plan is a planning aid, not a prescription: powers, additions and designs \
               must be confirmed by a licensed eye-care practitioner under local rules."
            .to_string(),
    }];
    driving(s, options, &mut out);
    safety(s, &mut out);
    anisometropia(ctx, &mut out);
    imbalance(options, &mut out);
    high_power(ctx, &mut out);
    model_range(ctx, &mut out);
    if s.wearer.measured_amplitude.is_some() && s.wearer.age_years >= APPARENT_AMPLITUDE_AGE {
        out.push(Caution {
            kind: CautionKind::ApparentAmplitude,
            tasks: vec![],
            options: vec![],
            text: format!(
                "At {:.0} years a measured amplitude is mostly depth of field, not accommodation; \
                 the plan adds depth of field again, so it may be optimistic. Consider a clinical \
                 tolerance near 0 D or a smaller amplitude.",
                s.wearer.age_years
            ),
        });
    }
    out
}

fn driving(s: &Scenario, options: &[OptionPlan], out: &mut Vec<Caution>) {
    let tasks: Vec<TaskRef> = (0..s.tasks.len())
        .filter(|&i| s.tasks.get(i).is_some_and(|t| t.flags.driving))
        .map(|i| task_ref(s, i))
        .collect();
    let concerned: Vec<OptionRef> = options
        .iter()
        .filter(|o| near_biased(&o.design))
        .map(|o| o.option.clone())
        .collect();
    if tasks.is_empty() || concerned.is_empty() {
        return;
    }
    let labels: Vec<String> = concerned
        .iter()
        .map(|o| format!("\"{}\"", o.label))
        .collect();
    out.push(Caution {
        kind: CautionKind::NotForDriving,
        text: format!(
            "{} {} an occupational or near-biased design: not for driving or operating moving \
             machinery ({}).",
            labels.join(", "),
            if concerned.len() == 1 { "is" } else { "are" },
            names(&tasks)
        ),
        tasks,
        options: concerned,
    });
}

fn safety(s: &Scenario, out: &mut Vec<Caution>) {
    let tasks: Vec<TaskRef> = (0..s.tasks.len())
        .filter(|&i| s.tasks.get(i).is_some_and(|t| t.flags.needs_safety_eyewear))
        .map(|i| task_ref(s, i))
        .collect();
    if tasks.is_empty() {
        return;
    }
    out.push(Caution {
        kind: CautionKind::SafetyEyewear,
        text: format!(
            "{} need certified impact-rated safety eyewear under local rules; ordinary \
             dress lenses and frames are not enough.",
            names(&tasks)
        ),
        tasks,
        options: vec![],
    });
}

fn anisometropia(ctx: &Context, out: &mut Vec<Caution>) {
    let r = ctx.refraction.right_equivalent;
    let l = ctx.refraction.left_equivalent;
    let diff = (r - l).abs();
    if diff.0 + 1e-9 < ANISOMETROPIA_D {
        return;
    }
    out.push(Caution {
        kind: CautionKind::Anisometropia,
        tasks: vec![],
        options: vec![],
        text: format!(
            "The eyes' spherical equivalents differ by {:.2} D (R {r}, L {l}). The plan uses \
             their mean for accommodation, so each eye may be up to {:.2} D off; check \
             image size differences and prism at the reading level.",
            diff.0,
            diff.0 / 2.0
        ),
    });
}

fn imbalance(options: &[OptionPlan], out: &mut Vec<Caution>) {
    for o in options {
        let worst = o
            .tasks
            .iter()
            .filter(|t| t.lens_point.y.0 < 0.0)
            .max_by(|a, b| {
                a.near_vision
                    .vertical_imbalance
                    .0
                    .total_cmp(&b.near_vision.vertical_imbalance.0)
            });
        let Some(t) = worst else { continue };
        let p = t.near_vision.vertical_imbalance.0;
        if p + 1e-9 < VERTICAL_IMBALANCE_PD {
            continue;
        }
        out.push(Caution {
            kind: CautionKind::VerticalImbalance,
            tasks: vec![t.task.clone()],
            options: vec![o.option.clone()],
            text: format!(
                "With \"{}\", \"{}\" is seen {:.1} mm below the optical centres, where the \
                 unequal vertical powers give a vertical prism difference of {p:.2} Δ \
                 (Prentice's rule); consider slab-off or separate near lenses.",
                o.option.label, t.task.name, -t.lens_point.y.0
            ),
        });
    }
}

fn high_power(ctx: &Context, out: &mut Vec<Caution>) {
    let strongest = [ctx.right, ctx.left]
        .iter()
        .flat_map(|rx| rx.principal_meridians())
        .map(|m| m.power)
        .max_by(|a, b| a.0.abs().total_cmp(&b.0.abs()));
    let Some(power) = strongest else { return };
    if power.0.abs() <= HIGH_POWER_D {
        return;
    }
    let v = ctx.refraction.vertex.to_m();
    let moved = power_at_vertex(power, v, Metres(v.0 + VERTEX_CHANGE_M)).unwrap_or(power);
    out.push(Caution {
        kind: CautionKind::HighPower,
        tasks: vec![],
        options: vec![],
        text: format!(
            "A meridian of {power} makes the vertex distance matter: fitted {:.0} mm further \
             from the eye the lens would need {moved} for the same effect. Measure the vertex \
             distance of the chosen frame and compensate.",
            VERTEX_CHANGE_M * 1000.0
        ),
    });
}

fn model_range(ctx: &Context, out: &mut Vec<Caution>) {
    for (model, quantity, given, used) in &ctx.clamped {
        out.push(Caution {
            kind: CautionKind::ModelRange,
            tasks: vec![],
            options: vec![],
            text: format!(
                "The {quantity} {given} lies outside the range {model} was fitted to; the plan \
                 used {used} instead."
            ),
        });
    }
}
