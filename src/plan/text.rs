//! Plain-text rendering of a plan for the command line: the wearer-level
//! figures, then each option (best first) with its parameters, the reason
//! for the choice, its zones' ranges of clear vision and a table of tasks,
//! then unserved tasks, cautions and the order. All words come from the
//! outcome types' `Display`, shared with the screens.

use super::outcome::*;
use crate::display::{lens_point_words, readable_number, zone_range_words};
use crate::scenario::{AmplitudeMethod, ReferencePlane};
use std::fmt::Write;

fn plane(p: ReferencePlane) -> &'static str {
    match p {
        ReferencePlane::Spectacle => "at the spectacle plane",
        ReferencePlane::Ocular => "ocular",
    }
}

/// The amplitude used and where it came from, as one line.
pub fn amplitude_line(a: &AmplitudeUsed) -> String {
    let source = match a.source {
        AmplitudeSource::Measured { method } => format!(
            "measured, {}",
            match method {
                AmplitudeMethod::PushUp => "push-up",
                AmplitudeMethod::MinusLens => "minus lens",
            }
        ),
        AmplitudeSource::AgeModel { age_years, .. } => {
            format!("Hofstetter minimum, 15 - 0.25 x {age_years:.0} years")
        }
    };
    format!(
        "Amplitude: {} {} ({source}) = {} ocular; usable {:.0} % = {}",
        a.stated,
        plane(a.stated_plane),
        a.ocular,
        a.usable_fraction * 100.0,
        a.usable_ocular
    )
}

/// The refraction the vergence used, as one line.
pub fn refraction_line(r: &RefractionUsed) -> String {
    match r.basis {
        RefractionBasis::MeanOfBothEyes => format!(
            "Refraction: {} used for vergence, the mean of both eyes' spherical equivalents \
             (R {}, L {}); vertex distance {:.0} mm",
            r.used, r.right_equivalent, r.left_equivalent, r.vertex.0
        ),
        RefractionBasis::OverContactLenses => format!(
            "Refraction: corrected by contact lenses (spherical equivalents R {}, L {}); the \
             options are worn over them, plano at distance, at a vertex distance of {:.0} mm",
            r.right_equivalent, r.left_equivalent, r.vertex.0
        ),
    }
}

/// The pupil diameter used and where it came from, as one line.
pub fn pupil_line(p: &PupilUsed) -> String {
    match p.source {
        PupilOrigin::Measured => format!("Pupil: {:.1} mm (measured)", p.diameter.0),
        PupilOrigin::WatsonYellott {
            luminance_cd_m2,
            field,
            age_years,
        } => format!(
            "Pupil: {:.1} mm (Watson & Yellott 2012: {} cd/m², {:.0}° field, age {age_years:.0} years)",
            p.diameter.0,
            readable_number(luminance_cd_m2, 0),
            field.0
        ),
    }
}

/// Characters of a task's name shown in the table's first column.
const NAME_COLUMN: usize = 30;

/// `text` cut to `width` characters, ending in "…" when cut.
fn column_text(text: &str, width: usize) -> String {
    if text.chars().count() <= width {
        text.to_string()
    } else {
        let kept: String = text.chars().take(width - 1).collect();
        format!("{kept}…")
    }
}

fn share(s: Option<f64>) -> String {
    s.map_or("n/a".to_string(), |s| format!("{:.0} %", s * 100.0))
}

fn option_block(out: &mut String, o: &OptionPlan, plan_half_depth: f64) {
    let s = &o.score;
    let _ = writeln!(
        out,
        "\n#{} \"{}\" ({})  score {:.2} h: comfortable {:.1} h, tiring {:.1} h, blurred {:.1} h",
        o.rank,
        o.option.label,
        family_name(&o.design),
        s.total,
        s.comfortable_hours,
        s.tiring_hours,
        s.blurred_hours
    );
    let params: Vec<String> = o
        .parameters
        .iter()
        .map(|p| format!("{} {} ({})", p.kind, p.value, p.source))
        .collect();
    let _ = writeln!(out, "   Parameters: {}", params.join(", "));
    let _ = writeln!(out, "   Why: {}", o.describe_choice());
    if let Some(c) = &o.prescribed_addition {
        let _ = writeln!(out, "   Prescribed: {c}");
    }
    if let Some(t) = &o.near_tie {
        let _ = writeln!(out, "   Note: {t}");
    }
    for z in &o.zones {
        let _ = writeln!(
            out,
            "   {} zone (addition {}): comfortable {}; in focus {} (at ±{:.2} D; each task's own range is in its row)",
            z.zone,
            z.addition,
            zone_range_words(&z.comfortable),
            zone_range_words(&z.in_focus),
            plan_half_depth
        );
    }
    let _ = writeln!(
        out,
        "   {:<30} {:<13} {:>14} {:<40} {:>13} {:>6} {:<20} {:<22} {:>9} {:<24} {:>9} {:>8} {:>11}",
        "task",
        "zone",
        "lens point",
        "local power",
        "accommodation",
        "share",
        "verdict",
        "comfortable here",
        "blur disc",
        "head posture",
        "head turn",
        "near PD",
        "convergence"
    );
    for t in &o.tasks {
        let name = column_text(&t.task.name, NAME_COLUMN);
        let _ = writeln!(
            out,
            "   {:<30} {:<13} {:>14} {:<40} {:>13} {:>6} {:<20} {:<22} {:>9} {:<24} {:>9} {:>8} {:>11}",
            name,
            t.zone.to_string(),
            lens_point_words(t.lens_point.x.0, t.lens_point.y.0),
            t.local_power.to_string(),
            t.accommodation.to_string(),
            share(t.share_of_amplitude),
            t.verdict.to_string(),
            zone_range_words(&t.range_here.comfortable),
            format!("{:.1}′", t.blur.blur_disc_arcmin),
            t.posture.to_string(),
            format!("{:.0}°", t.field.head_turn.0),
            format!("{:.1} mm", t.near_vision.near_pd.0),
            format!("{:.1} Δ", t.near_vision.convergence.0)
        );
    }
}

/// The name of a design's family for headings.
pub fn family_name(design: &crate::scenario::FamilyChoice) -> &'static str {
    use crate::scenario::FamilyChoice as F;
    match design {
        F::SingleVision { .. } => "single vision",
        F::Bifocal { .. } => "bifocal",
        F::Trifocal { .. } => "trifocal",
        F::Progressive { .. } => "progressive",
        F::Degressive { .. } => "degressive (occupational)",
        F::DoubleSegment { .. } => "double segment",
    }
}

/// The whole plan as readable text.
pub fn render(plan: &Plan) -> String {
    let mut out = String::new();
    let _ = writeln!(out, "Plan for \"{}\"", plan.scenario_name);
    let _ = writeln!(out, "{}", amplitude_line(&plan.amplitude));
    let _ = writeln!(out, "{}", refraction_line(&plan.refraction));
    let _ = writeln!(out, "{}", pupil_line(&plan.pupil));
    let _ = writeln!(
        out,
        "Half depth of field for zone ranges: ±{:.2} D",
        plan.zone_half_depth.0
    );
    for o in &plan.options {
        option_block(&mut out, o, plan.zone_half_depth.0);
    }
    if !plan.unserved.is_empty() {
        let _ = writeln!(out, "\nTasks no option makes comfortable:");
        for u in &plan.unserved {
            let _ = writeln!(out, "   {}", u.describe());
        }
    }
    let _ = writeln!(out, "\nCautions:");
    for c in &plan.cautions {
        let _ = writeln!(out, "   [{}] {}", c.kind, c.text);
    }
    if let Some(o) = &plan.order {
        let _ = writeln!(
            out,
            "\nOrder for \"{}\" ({}){}:",
            o.option.label,
            family_name(&o.design),
            plan.choice
                .as_ref()
                .map_or(String::new(), |c| format!(", {c}"))
        );
        for line in order_lines(o) {
            let _ = writeln!(out, "   {line}");
        }
    }
    out
}

/// A prescribed prism in prescription notation ("1.50 Δ base in, 0.50 Δ base up").
fn prism_words(p: &crate::scenario::Prism) -> String {
    use crate::scenario::{HorizontalBase, VerticalBase};
    let mut parts = Vec::new();
    if p.horizontal_pd > 0.0 {
        let base = match p.horizontal_base {
            HorizontalBase::In => "in",
            HorizontalBase::Out => "out",
        };
        parts.push(format!("{:.2} Δ base {base}", p.horizontal_pd));
    }
    if p.vertical_pd > 0.0 {
        let base = match p.vertical_base {
            VerticalBase::Up => "up",
            VerticalBase::Down => "down",
        };
        parts.push(format!("{:.2} Δ base {base}", p.vertical_pd));
    }
    parts.join(", ")
}

/// The lines of a lab order: powers, prism, addition or degression, and fitting data.
pub fn order_lines(o: &OrderSummary) -> Vec<String> {
    let mut lines = Vec::new();
    if o.over_contact_lenses {
        lines.push(
            "FOR WEAR OVER CONTACT LENSES: plano at distance; the powers below are the \
             over-pair's own"
                .to_string(),
        );
    }
    lines.push(format!("R {}   L {}", o.right, o.left));
    for (eye, prism) in [("R", &o.right_prism), ("L", &o.left_prism)] {
        if let Some(p) = prism {
            lines.push(format!("prism {eye} {}", prism_words(p)));
        }
    }
    if let Some(a) = o.addition {
        let name = if o.degression.is_some() {
            "near addition"
        } else {
            "addition"
        };
        lines.push(format!("{name} {a}"));
    }
    if let Some(d) = o.degression {
        lines.push(format!("degression {d}"));
    }
    lines.push(format!(
        "fitting height {:.1} mm, PD R {:.1} / L {:.1} mm{}, {}, pantoscopic tilt {:.0}°",
        o.fitting_height.0,
        o.pd_right.0,
        o.pd_left.0,
        o.near_pd.map_or(String::new(), |n| format!(
            ", near PD {:.1} mm at the nearest task",
            n.0
        )),
        o.vertex.map_or(
            "vertex as fitted over the contact lenses".to_string(),
            |v| { format!("vertex distance {:.0} mm", v.0) }
        ),
        o.pantoscopic_tilt.0
    ));
    let above = "mm above the lowest point of the lens";
    if let Some(h) = o.optical_centre_height {
        lines.push(format!("optical centres {:.1} {above}", h.0));
    }
    if let Some(h) = o.segment_top_height {
        lines.push(format!("segment top {:.1} {above}", h.0));
    }
    if let Some(p) = o.intermediate_percent {
        lines.push(format!("intermediate {p:.0} % of the near addition"));
    }
    if let Some(h) = o.upper_segment_bottom_height {
        lines.push(format!("upper segment bottom edge {:.1} {above}", h.0));
    }
    if let (Some(pl), Some(min)) = (o.progression_length, o.minimum_fitting_height) {
        lines.push(format!(
            "progression length {:.0} mm (needs a fitting height of at least {:.0} mm)",
            pl.0, min.0
        ));
    }
    if let Some(i) = o.near_inset_per_eye {
        lines.push(format!(
            "near inset {:.1} mm per eye at the nearest task",
            i.0
        ));
    }
    lines.push(format!("frame lens height (B) {:.1} mm", o.lens_height.0));
    let limits: Vec<String> = o
        .tolerances
        .iter()
        .map(|t| format!("{} {}", t.quantity, t.limit))
        .collect();
    lines.push(format!(
        "verify against ANSI Z80.1-2020 (from memory): {}",
        limits.join("; ")
    ));
    lines
}
