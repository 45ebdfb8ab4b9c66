//! The plan's opening parts: the cautions (the planning-aid note among
//! them), the recommended option with its parameters and reasons, the
//! dispenser's choice where it differs, and the tasks no option serves.

use super::html::Html;
use crate::plan::text::family_name;
use crate::plan::{Caution, Choice, OptionPlan, OptionRef, UnservedTask};

/// The recommended (best-ranked) option with its parameters and reasons.
pub fn recommendation(best: &OptionPlan) -> String {
    let mut html = Html::new();
    html.open(
        "div",
        &[
            ("class", "recommendation"),
            ("data-testid", "recommendation"),
        ],
    )
    .element(
        "h3",
        &[],
        &format!(
            "Recommended: {} · {}",
            best.option.label,
            family_name(&best.design)
        ),
    )
    .open("ul", &[("class", "parameters")]);
    for p in &best.parameters {
        html.element("li", &[], &format!("{} {} ({})", p.kind, p.value, p.source));
    }
    html.close("ul").element("p", &[], &best.describe_choice());
    if let Some(c) = best.prescribed_addition {
        html.element("p", &[("class", "detail")], &format!("Prescribed: {c}."));
    }
    html.element(
        "p",
        &[("class", "detail")],
        &format!(
            "Comfortable {:.1} h, in focus but tiring {:.1} h, blurred {:.1} h of the working day.",
            best.score.comfortable_hours, best.score.tiring_hours, best.score.blurred_hours
        ),
    )
    .close("div");
    html.finish()
}

/// The cautions drawn from the scenario, planning-aid note included.
/// Cautions that concern only options other than `shown` are marked, so
/// the printed sheet carries only those of the option it orders.
pub fn cautions(cautions: &[Caution], shown: Option<&OptionRef>) -> String {
    let mut html = Html::new();
    html.open(
        "section",
        &[
            ("class", "cautions"),
            ("aria-labelledby", "cautions-heading"),
            ("data-testid", "cautions"),
        ],
    )
    .element("h3", &[("id", "cautions-heading")], "Cautions")
    .open("ul", &[]);
    for c in cautions {
        let other = !c.options.is_empty() && shown.is_some_and(|s| !c.options.contains(s));
        let class: &[(&str, &str)] = if other {
            &[("class", "other-option")]
        } else {
            &[]
        };
        html.open("li", class)
            .element("strong", &[], &c.kind.to_string())
            .text(": ")
            .text(&c.text)
            .close("li");
    }
    html.close("ul").close("section");
    html.finish()
}

/// The dispenser's choice when it differs from the recommendation, and why
/// the planner ranks another option first; nothing otherwise.
pub fn chosen_note(choice: Option<&Choice>) -> String {
    let mut html = Html::new();
    if let Some(choice) = choice.filter(|c| c.by_dispenser) {
        html.open(
            "p",
            &[("class", "chosen-note"), ("data-testid", "chosen-note")],
        )
        .element("strong", &[], &format!("Chosen: {}", choice.chosen.label))
        .text(&format!(" — {choice}."))
        .close("p");
    }
    html.finish()
}

/// The tasks no option makes comfortable, with why; nothing when every
/// task is served.
pub fn unserved(unserved: &[UnservedTask]) -> String {
    let mut html = Html::new();
    if !unserved.is_empty() {
        html.open(
            "section",
            &[("class", "unserved"), ("data-testid", "unserved")],
        )
        .element("h3", &[], "Tasks no option makes comfortable")
        .open("ul", &[]);
        for u in unserved {
            html.element("li", &[], &u.describe());
        }
        html.close("ul").close("section");
    }
    html.finish()
}
