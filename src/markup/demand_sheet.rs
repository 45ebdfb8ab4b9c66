//! The task-demand sheet of occupational health as HTML text, after a note
//! on what it is: who and through what glasses, each task's demands
//! against what the worker has, its flag with the reasons in numbers and
//! what would clear it, the display-screen rule, the date and a line for
//! the nurse's name and signature; or, when there is no sheet, why. Every figure and word comes
//! from `plan::demands`, `plan::demand_words` and `plan::roster`; the
//! scenario's and the tasks' names are escaped like every text.

use super::html::Html;
use crate::display::{trim_number, LengthUnit};
use crate::plan::demands::{DemandSheet, FlagKind, TaskDemand};
use crate::plan::ergonomics::DISPLAY_SCREEN_RULE;
use crate::plan::roster::advice;
use crate::plan::text::amplitude_line;

/// The sheet table's column heads.
const COLUMNS: [&str; 5] = [
    "Task, distance, hours",
    "Focusing (ocular)",
    "Gaze, posture, convergence",
    "Detail size",
    "Flag, reasons, what would help",
];

/// The class that marks a flag on screen and on paper (never by colour
/// alone: the words are always there).
fn flag_class(kind: FlagKind) -> &'static str {
    match kind {
        FlagKind::Fine => "wv-flag fine",
        FlagKind::WorkstationChange => "wv-flag change",
        FlagKind::TaskEyewear => "wv-flag eyewear",
        FlagKind::Refer => "wv-flag refer",
    }
}

/// One task's row: figures (distance in `unit`), flag, reasons and advice.
fn task_row(html: &mut Html, t: &TaskDemand, unit: LengthUnit) {
    let kind = t.flag.kind();
    html.open(
        "tr",
        &[("data-testid", &format!("wv-task-{}", t.task.index))],
    )
    .open("th", &[("scope", "row")])
    .text(&t.task.name)
    .element(
        "span",
        &[("class", "detail")],
        &format!(
            "{} {} · {} h a day",
            unit.format(t.distance),
            unit.symbol(),
            trim_number(t.hours_per_day, 1)
        ),
    )
    .close("th")
    .element("td", &[], &t.focus_words())
    .open("td", &[])
    .text(&format!("{:+.0}° gaze; {}", t.gaze.0, t.posture_words()))
    .element(
        "span",
        &[("class", "detail")],
        &format!("convergence {:.1} Δ", t.convergence.0),
    )
    .close("td")
    .element("td", &[], &t.detail_words())
    .open("td", &[("class", flag_class(kind))])
    .element("strong", &[], kind.words())
    .open("ul", &[("class", "wv-reasons")]);
    for r in t.flag.reasons() {
        html.element("li", &[], &r.to_string());
    }
    html.close("ul");
    let advice = advice(&t.flag);
    if !advice.is_empty() {
        html.element("p", &[("class", "wv-advice")], &advice);
    }
    html.close("td").close("tr");
}

/// What the tab says before the sheet: whose glasses, and that the sheet
/// screens and documents but neither examines nor prescribes.
pub fn sheet_intro() -> String {
    let mut html = Html::new();
    html.element(
        "p",
        &[("class", "hint wv-intro")],
        "Each task of the scenario on screen, seen through the worker's current glasses (the distance correction alone when none are entered). A screening aid for occupational health: it flags and documents; it does not examine or prescribe.",
    );
    html.finish()
}

/// The whole sheet, distances in `unit`, signed on `date` (as shown, for
/// example "1 April 2031").
pub fn demand_sheet(sheet: &DemandSheet, unit: LengthUnit, date: &str) -> String {
    let mut html = Html::new();
    html.open(
        "article",
        &[
            ("class", "wv-sheet"),
            ("data-testid", "wv-sheet"),
            ("aria-labelledby", "wv-sheet-title"),
        ],
    )
    .element(
        "h3",
        &[("id", "wv-sheet-title")],
        &format!("Task-demand sheet: {}", sheet.scenario_name),
    )
    .open("p", &[("class", "wv-facts")])
    .text(&format!("Seen through: {}.", sheet.glasses))
    .shape("br", &[])
    .text(&amplitude_line(&sheet.amplitude));
    if let Some(words) = sheet.age_norm_words() {
        html.shape("br", &[]).text(&words);
    }
    html.close("p")
        .element(
            "p",
            &[("class", "wv-worst"), ("data-testid", "wv-worst")],
            &format!("Most serious flag: {}.", sheet.worst_flag().words()),
        )
        .open("div", &[("class", "table-scroll")])
        .open("table", &[("class", "wv-table")])
        .column_heads(&COLUMNS)
        .open("tbody", &[]);
    for t in &sheet.tasks {
        task_row(&mut html, t, unit);
    }
    html.close("tbody")
        .close("table")
        .close("div")
        .element(
            "p",
            &[("class", "wv-rule"), ("data-testid", "wv-rule")],
            DISPLAY_SCREEN_RULE,
        )
        .open("div", &[("class", "wv-sign")])
        .element("p", &[], &format!("Date: {date}"));
    for line in ["Occupational health nurse (name): ", "Signature: "] {
        html.open("p", &[])
            .text(line)
            .element("span", &[("class", "wv-line")], "")
            .close("p");
    }
    html.close("div").close("article");
    html.finish()
}

/// Why there is no sheet yet (`reason`, a clause without its full stop),
/// announced as an alert.
pub fn sheet_problem(reason: &str) -> String {
    let mut html = Html::new();
    html.element(
        "p",
        &[
            ("class", "notice warning"),
            ("role", "alert"),
            ("data-testid", "wv-sheet-problem"),
        ],
        &format!("No sheet yet: {reason}."),
    );
    html.finish()
}
