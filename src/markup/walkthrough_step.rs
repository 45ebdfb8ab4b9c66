//! The words of the wearer's walkthrough as HTML text: a task step's
//! distance, time and sentences, the caption under each of its pictures and
//! the note on the pictures' scale; the closing step (the choice, why,
//! getting used to it, the cautions); and the line shown when there is no
//! plan. The words come from `plan::walkthrough`; the pictures themselves
//! are drawn on canvases by the app. Task names and option labels are
//! escaped like every text.

use super::html::Html;
use crate::chart::scene::SceneKind;
use crate::core::units::{Metres, Millimetres};
use crate::display::{trim_number, LengthUnit};
use crate::plan::walkthrough::{Closing, Picture, Sharpness, TaskStep};

/// A distance for the wearer: centimetres or inches near by, metres or feet
/// beyond 2 m.
fn distance_words(distance: Metres, unit: LengthUnit) -> String {
    match unit {
        LengthUnit::Centimetres if distance.0 >= 2.0 => {
            format!("{} m", trim_number(distance.0, 1))
        }
        LengthUnit::Inches if distance.0 >= 2.0 => {
            format!("{} ft", trim_number(unit.from_metres(distance) / 12.0, 0))
        }
        _ => format!("{} {}", unit.format(distance), unit.symbol()),
    }
}

/// Time a day for the wearer: minutes below an hour, hours above.
fn hours_figure(hours: f64) -> String {
    if hours < 1.0 {
        format!("{} min", trim_number(hours * 60.0, 0))
    } else {
        format!("{} h", trim_number(hours, 1))
    }
}

/// The class that colours a sharpness (the words always say it too).
fn sharpness_class(s: Sharpness) -> &'static str {
    match s {
        Sharpness::Sharp => "sharp",
        Sharpness::SharpWithEffort => "effort",
        Sharpness::ALittleSoft => "soft",
        Sharpness::Blurred => "blurred",
    }
}

/// How a picture looks, and the letter chart lines lost when there are any
/// worth saying.
fn sharpness_words(p: &Picture) -> String {
    let lines = if p.chart_lines_lost >= 0.5 {
        format!(
            " (about {} {} lower on a letter chart)",
            trim_number(p.chart_lines_lost.round(), 0),
            if p.chart_lines_lost.round() == 1.0 {
                "line"
            } else {
                "lines"
            }
        )
    } else {
        String::new()
    };
    format!("{}{lines}", p.sharpness.words())
}

/// A list of sentences, one item each, in a `<ul>` with `attributes`.
fn sentences(html: &mut Html, attributes: &[(&str, &str)], items: &[String]) {
    html.open("ul", attributes);
    for s in items {
        html.element("li", &[], s);
    }
    html.close("ul");
}

/// A task step's opening: how far and how long (distance in `unit`), then
/// its sentences.
pub fn task_words(step: &TaskStep, unit: LengthUnit) -> String {
    let mut html = Html::new();
    html.element(
        "p",
        &[("class", "walk-facts")],
        &format!(
            "{} away · {} a day",
            distance_words(step.distance, unit),
            hours_figure(step.hours_per_day)
        ),
    );
    sentences(&mut html, &[("class", "walk-words")], &step.sentences);
    html.finish()
}

/// The content of a picture's caption: whose lenses (marked when they are
/// the option `planned`, by input index), and how the picture looks.
pub fn picture_caption(p: &Picture, planned: Option<usize>) -> String {
    let mut html = Html::new();
    html.element("strong", &[], &p.label);
    if p.option.is_some() && p.option == planned {
        html.text(" (planned for you)");
    }
    html.element(
        "span",
        &[(
            "class",
            &format!("walk-sharpness {}", sharpness_class(p.sharpness)),
        )],
        &sharpness_words(p),
    );
    html.finish()
}

/// The note under a step's pictures: what they show of a scene of `kind`
/// with its finest detail `detail`, seen from the step's distance (in
/// `unit`), and how they are scaled.
pub fn scale_words(
    kind: SceneKind,
    detail: Millimetres,
    step: &TaskStep,
    unit: LengthUnit,
) -> String {
    format!(
        "The pictures show {} as seen from {}, drawn larger so that its finest detail ({} mm) is three dots wide; the blur is enlarged to match. Tap a picture to see it bigger.",
        kind.describe(),
        distance_words(step.distance, unit),
        trim_number(detail.0, 1)
    )
}

/// The closing step: the choice, why, getting used to it, the cautions.
pub fn closing_step(c: &Closing) -> String {
    let mut html = Html::new();
    html.element("p", &[("class", "walk-what")], &format!("{}.", c.what))
        .element("h3", &[], "Why these");
    sentences(&mut html, &[("class", "walk-words")], &c.why);
    html.element("h3", &[], "Getting used to them");
    sentences(&mut html, &[("class", "walk-words")], &c.adapting);
    html.element("h3", &[], "Please keep in mind");
    sentences(
        &mut html,
        &[
            ("class", "walk-words walk-cautions"),
            ("data-testid", "walk-cautions"),
        ],
        &c.cautions,
    );
    html.finish()
}

/// The line shown in place of the steps when there is nothing to walk
/// through.
pub fn no_plan() -> String {
    let mut html = Html::new();
    html.element(
        "p",
        &[("class", "walk-words")],
        "There is no plan to show yet: the planner needs a valid scenario with at least one lens option.",
    );
    html.finish()
}
