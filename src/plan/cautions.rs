//! The warnings a plan carries, drawn from the scenario and the planned
//! options, each worded for the case at hand: always that the plan is a
//! planning aid; that the options are worn over contact lenses; designs not
//! fit for driving on a day that includes driving, with the reason; moving
//! machinery that must be seen clearly; protective eyewear for each named
//! hazard; the image-size difference and prism of spectacles for unequal
//! eyes; vertical prism beyond the limit at a task; high powers whose effect
//! depends on the vertex distance; inputs the models had to clamp; and a
//! measured amplitude from an older wearer, which already contains depth of
//! field.

use super::context::Context;
use super::outcome::{
    Caution, CautionKind, DrivingFitness, DrivingUnfit, OptionPlan, TaskRef, Verdict,
};
use crate::core::gaze::Strain;
use crate::core::magnification::image_size_difference_percent;
use crate::core::units::Metres;
use crate::core::vergence::power_at_vertex;
use crate::scenario::{Hazards, Scenario};

/// Spherical-equivalent difference between the eyes from which the plan
/// warns of anisometropia, in dioptres (1.00 D, the usual clinical
/// definition; from memory).
pub const ANISOMETROPIA_D: f64 = 1.0;
/// Image-size difference between the eyes above which the plan says it
/// often causes discomfort, in percent (symptoms are commonly reported from
/// about 3 %; from memory).
pub const ANISEIKONIA_PERCENT: f64 = 3.0;
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

/// The tasks of `s` for which `pick` holds.
fn tasks_where(s: &Scenario, pick: impl Fn(&crate::scenario::Task) -> bool) -> Vec<TaskRef> {
    (0..s.tasks.len())
        .filter(|&i| s.tasks.get(i).is_some_and(&pick))
        .map(|i| task_ref(s, i))
        .collect()
}

fn caution(kind: CautionKind, text: String) -> Caution {
    Caution {
        kind,
        tasks: vec![],
        options: vec![],
        text,
    }
}

/// Every caution for `scenario` planned as `options` (ranked).
pub fn cautions(s: &Scenario, ctx: &Context, options: &[OptionPlan]) -> Vec<Caution> {
    let mut out = vec![caution(
        CautionKind::PlanningAid,
        "This plan is a planning aid, not a prescription: powers, additions and designs \
         must be confirmed by a licensed eye-care practitioner under local rules."
            .to_string(),
    )];
    over_contact_lenses(s, ctx, &mut out);
    driving(s, options, &mut out);
    machinery(s, options, &mut out);
    protection(s, &mut out);
    if !ctx.over_contact_lenses {
        anisometropia(ctx, &mut out);
        high_power(ctx, &mut out);
    }
    imbalance(ctx, options, &mut out);
    posture(options, &mut out);
    model_range(ctx, &mut out);
    let measured = s.wearer.measured_amplitude.map_or(0.0, |m| m.dioptres);
    if measured > 0.0 && s.wearer.age_years >= APPARENT_AMPLITUDE_AGE {
        out.push(caution(
            CautionKind::ApparentAmplitude,
            format!(
                "At {:.0} years a measured amplitude of {measured:.2} D is mostly depth of \
                 field, not accommodation; the plan adds depth of field again, so it may be \
                 optimistic. Consider a clinical tolerance near 0 D or a smaller amplitude.",
                s.wearer.age_years
            ),
        ));
    }
    out
}

fn over_contact_lenses(s: &Scenario, ctx: &Context, out: &mut Vec<Caution>) {
    if !ctx.over_contact_lenses {
        return;
    }
    let mut text = "The wearer's contact lenses correct the distance vision, so every option \
                    here is a pair worn over them: plano at distance, carrying only the near or \
                    intermediate power. Wear them only with the contact lenses in; without the \
                    contact lenses they are the wrong glasses."
        .to_string();
    let w = &s.wearer;
    if [w.right.prism, w.left.prism].iter().any(|p| p.any()) {
        text.push_str(
            " The prescription includes prism, which contact lenses do not carry; ask the \
             prescriber whether the over-pair should.",
        );
    }
    out.push(caution(CautionKind::OverContactLenses, text));
}

/// One reason a design is unfit for driving, in words.
fn unfit_words(reason: &DrivingUnfit) -> String {
    match reason {
        DrivingUnfit::OccupationalDesign => {
            "an occupational lens has intermediate power at the top, where the road is seen"
                .to_string()
        }
        DrivingUnfit::UpperSegment => {
            "its upper segment puts reading power where mirrors and signs are seen".to_string()
        }
        DrivingUnfit::NearSingleVision { addition } => {
            format!("the road is seen through its addition of {addition}")
        }
        DrivingUnfit::PlusWhereRoadIsSeen { task, addition } => format!(
            "\"{}\" is seen through {addition} of addition at or just below its line of sight",
            task.name
        ),
    }
}

fn driving(s: &Scenario, options: &[OptionPlan], out: &mut Vec<Caution>) {
    let tasks = tasks_where(s, |t| t.flags.driving);
    if tasks.is_empty() {
        return;
    }
    for o in options {
        let Some(DrivingFitness::Unfit { reasons }) = &o.driving else {
            continue;
        };
        let why: Vec<String> = reasons.iter().map(unfit_words).collect();
        out.push(Caution {
            kind: CautionKind::NotForDriving,
            text: format!(
                "\"{}\" is not for driving: {}. Drive ({}) only in glasses fit for driving; \
                 the plan ranks it below every option that is.",
                o.option.label,
                why.join("; "),
                names(&tasks)
            ),
            tasks: tasks.clone(),
            options: vec![o.option.clone()],
        });
    }
    for o in options {
        let failing: Vec<TaskRef> = o
            .tasks
            .iter()
            .filter(|t| t.driving_vision.is_some_and(|d| !d.meets_standard))
            .map(|t| t.task.clone())
            .collect();
        if failing.is_empty() {
            continue;
        }
        out.push(Caution {
            kind: CautionKind::NotForDriving,
            text: format!(
                "With \"{}\", {} would not meet the driving vision standard of {:.1} decimal \
                 (the plan's setting, with one line to spare): not for driving.",
                o.option.label,
                names(&failing),
                s.settings.driving_acuity_decimal
            ),
            tasks: failing,
            options: vec![o.option.clone()],
        });
    }
}

fn machinery(s: &Scenario, options: &[OptionPlan], out: &mut Vec<Caution>) {
    let tasks = tasks_where(s, |t| t.flags.moving_machinery);
    if tasks.is_empty() {
        return;
    }
    let mut text = format!(
        "{} involve moving machinery: each must be seen clearly at its own working distance, \
         without a head posture held against the machine.",
        names(&tasks)
    );
    if let Some(best) = options.first() {
        let short: Vec<String> = best
            .tasks
            .iter()
            .filter(|t| {
                s.tasks
                    .get(t.task.index)
                    .is_some_and(|task| task.flags.moving_machinery)
            })
            .filter(|t| t.verdict != Verdict::Comfortable)
            .map(|t| format!("\"{}\" is {}", t.task.name, t.verdict))
            .collect();
        if !short.is_empty() {
            text.push_str(&format!(
                " With the recommended \"{}\", {}: plan another option for this work.",
                best.option.label,
                short.join(", ")
            ));
        }
    }
    out.push(Caution {
        kind: CautionKind::MovingMachinery,
        text,
        tasks,
        options: vec![],
    });
}

/// The protective eyewear a hazard calls for, in words (the EN 166 and
/// ANSI/ISEA Z87.1 families of eye-protection standards cover impact,
/// droplets and dust; filters for welding, lasers and ultraviolet have
/// standards of their own; from memory).
fn protection_words(h: &Hazards) -> Vec<&'static str> {
    let mut words = Vec::new();
    if h.impact {
        words.push("impact-rated safety lenses and frames");
    }
    if h.splash_or_aerosol {
        words.push("goggles or a face shield rated for liquid splashes and droplets");
    }
    if h.dust {
        words.push("close-fitting goggles rated for dust");
    }
    if h.optical_radiation {
        words.push("filters rated for the radiation source (welding, laser or ultraviolet)");
    }
    words
}

fn protection(s: &Scenario, out: &mut Vec<Caution>) {
    for (i, t) in s.tasks.iter().enumerate() {
        let words = protection_words(&t.flags.hazards);
        if words.is_empty() {
            continue;
        }
        out.push(Caution {
            kind: CautionKind::SafetyEyewear,
            tasks: vec![task_ref(s, i)],
            options: vec![],
            text: format!(
                "\"{}\" needs {}, certified under local rules, with this prescription built \
                 in or worn over it; ordinary lenses and frames do not protect.",
                t.name,
                words.join(", and ")
            ),
        });
    }
}

fn anisometropia(ctx: &Context, out: &mut Vec<Caution>) {
    let r = ctx.refraction.right_equivalent;
    let l = ctx.refraction.left_equivalent;
    let diff = (r - l).abs();
    if diff.0 + 1e-9 < ANISOMETROPIA_D {
        return;
    }
    let vertex = ctx.refraction.vertex;
    let size = image_size_difference_percent(r, l, vertex).map_or(String::new(), |p| {
        let advice = if p.abs() > ANISEIKONIA_PERCENT {
            " Above about 3 % this often causes discomfort or double vision: consider contact \
             lenses, a shorter vertex distance or size-matched lenses."
        } else {
            ""
        };
        format!(
            " Through spectacles the right eye's image is about {:.1} % {} than the left's \
             (spectacle magnification of typical lenses at {:.0} mm).{advice}",
            p.abs(),
            if p >= 0.0 { "larger" } else { "smaller" },
            vertex.0
        )
    });
    out.push(caution(
        CautionKind::Anisometropia,
        format!(
            "The eyes' spherical equivalents differ by {:.2} D (R {r}, L {l}). Each eye has its \
             own lens, but the unequal lenses give unequal image sizes and, below or above the \
             optical centres, unequal prism.{size}",
            diff.0
        ),
    ));
}

fn imbalance(ctx: &Context, options: &[OptionPlan], out: &mut Vec<Caution>) {
    let limit = ctx.settings.vertical_imbalance_limit_pd;
    for o in options {
        let over: Vec<_> = o.tasks.iter().filter(|t| t.prism_over_limit).collect();
        let Some(worst) = over.iter().max_by(|a, b| {
            a.near_vision
                .vertical_imbalance
                .0
                .total_cmp(&b.near_vision.vertical_imbalance.0)
        }) else {
            continue;
        };
        let tasks: Vec<TaskRef> = over.iter().map(|t| t.task.clone()).collect();
        out.push(Caution {
            kind: CautionKind::VerticalImbalance,
            text: format!(
                "With \"{}\", {} {} seen where the unequal vertical powers give more than \
                 {limit:.2} Δ of vertical prism difference between the eyes (up to {:.2} Δ at \
                 \"{}\", Prentice's rule), so the plan rates {} tiring at best; consider \
                 slab-off prism or separate near lenses centred for the task.",
                o.option.label,
                names(&tasks),
                if tasks.len() == 1 { "is" } else { "are" },
                worst.near_vision.vertical_imbalance.0,
                worst.task.name,
                if tasks.len() == 1 { "it" } else { "them" },
            ),
            tasks,
            options: vec![o.option.clone()],
        });
    }
}

fn posture(options: &[OptionPlan], out: &mut Vec<Caution>) {
    let Some(best) = options.first() else { return };
    let strained: Vec<_> = best
        .tasks
        .iter()
        .filter(|t| {
            t.posture.reachable
                && (t.posture.strain == Strain::NotSustainable
                    || t.field.turn_strain == Strain::NotSustainable)
        })
        .collect();
    if strained.is_empty() {
        return;
    }
    let words: Vec<String> = strained
        .iter()
        .map(|t| {
            let held = t.field.held_turn.0;
            let sweep = t.field.head_turn.0 - held;
            let mut parts = vec![t.posture.to_string()];
            if held >= 0.5 {
                parts.push(format!("head turned {held:.0}°"));
            }
            if sweep >= 0.5 {
                parts.push(format!("sweeping {sweep:.0}° more across it"));
            }
            format!("\"{}\" ({})", t.task.name, parts.join(", "))
        })
        .collect();
    out.push(Caution {
        kind: CautionKind::Posture,
        tasks: strained.iter().map(|t| t.task.clone()).collect(),
        options: vec![best.option.clone()],
        text: format!(
            "With the recommended \"{}\", {} {} a head posture beyond what ergonomic \
             guidance accepts for sustained work (ISO 11226): move the task, or plan a \
             design or a separate pair that brings the right power to it.",
            best.option.label,
            words.join(", "),
            if strained.len() == 1 { "needs" } else { "need" }
        ),
    });
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
    out.push(caution(
        CautionKind::HighPower,
        format!(
            "A meridian of {power} makes the vertex distance matter: fitted {:.0} mm further \
             from the eye the lens would need {moved} for the same effect. Measure the vertex \
             distance of the chosen frame and compensate.",
            VERTEX_CHANGE_M * 1000.0
        ),
    ));
}

fn model_range(ctx: &Context, out: &mut Vec<Caution>) {
    for (model, quantity, given, used) in &ctx.clamped {
        out.push(caution(
            CautionKind::ModelRange,
            format!(
                "The {quantity} {given} lies outside the range {model} was fitted to; the plan \
                 used {used} instead."
            ),
        ));
    }
}
