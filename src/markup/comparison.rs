//! The comparison table: one row per task, one column per lens option (best
//! first), each cell the verdict with its symbol, the local addition and any
//! head posture or head turn the task forces; below, what each option's
//! score is made of, its fitness for driving, and when two options are
//! practically equal. An option's heading is a button that chooses it for
//! the order (`data-option`); a task's heading is a button that opens the
//! task's detail beside it (`data-mark`). Each row is written apart, so the
//! app replaces only the rows whose text changed.

use super::html::Html;
use super::marks::{verdict_mark, Mark};
use crate::plan::{DrivingFitness, OptionPlan, Plan, TaskPlan};

/// The caption above the table.
pub const CAPTION: &str = "Each task through each lens option (best first). Choose an option to write the order for it and draw its lens.";

/// The table's rows as HTML text, each the content of one `<tr>`.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct ComparisonRows {
    /// The head row: "Task" and each option's heading button and score.
    pub head: String,
    /// One row per task: its heading button and one cell per option.
    pub tasks: Vec<String>,
    /// The score breakdown, one row per component.
    pub foot: Vec<String>,
}

/// One cell: how a task fares through one option.
fn cell(html: &mut Html, tp: &TaskPlan) {
    let (symbol, class, words) = verdict_mark(tp.verdict);
    html.open("td", &[("class", &format!("verdict {class}"))])
        .element(
            "span",
            &[("class", "mark"), ("aria-hidden", "true")],
            symbol,
        )
        .element("span", &[("class", "words")], words)
        .element(
            "span",
            &[("class", "detail")],
            &format!("{} zone, addition {}", tp.zone, tp.local_power.addition),
        );
    let posture = tp.posture.to_string();
    if posture != "natural" {
        html.element("span", &[("class", "detail posture")], &posture);
    }
    let turn = tp.field.head_turn.0;
    if turn >= 1.0 {
        html.element(
            "span",
            &[("class", "detail")],
            &format!("head turn {turn:.0}°"),
        );
    }
    html.close("td");
}

/// A line of the score breakdown: its label and each option's text.
type BreakdownLine = (&'static str, fn(&OptionPlan) -> String);

/// What each option's score is made of, one row per component.
fn breakdown(plan: &Plan) -> Vec<String> {
    let lines: [BreakdownLine; 5] = [
        ("Score (weighted hours a day)", |o| {
            format!("{:.2} h", o.score.total)
        }),
        ("Comfortable, tiring, blurred", |o| {
            format!(
                "{:.1} h, {:.1} h, {:.1} h",
                o.score.comfortable_hours, o.score.tiring_hours, o.score.blurred_hours
            )
        }),
        ("Deducted: posture, prism, missing power, addition", |o| {
            format!(
                "{:.2} h, {:.2} h, {:.2} h, {:.2} h",
                o.score.posture_penalty,
                o.score.prism_penalty,
                o.score.gap_penalty,
                o.score.addition_penalty
            )
        }),
        ("Driving", |o| {
            match &o.driving {
                None => "no driving task",
                Some(DrivingFitness::Fit) => "fit for driving",
                Some(DrivingFitness::Unfit { .. }) => "not for driving",
            }
            .to_string()
        }),
        ("Note", |o| {
            o.near_tie
                .as_ref()
                .map_or(String::new(), ToString::to_string)
        }),
    ];
    lines
        .into_iter()
        .map(|(label, value)| {
            let mut html = Html::new();
            html.element("th", &[("scope", "row")], label);
            for o in &plan.options {
                html.element("td", &[], &value(o));
            }
            html.finish()
        })
        .collect()
}

/// The rows of the comparison table of `plan`, with the option at input
/// index `chosen` (the dispenser's choice, if any) pressed and the task at
/// input index `open` (whose detail is shown, if any) expanded.
pub fn comparison(plan: &Plan, chosen: Option<usize>, open: Option<usize>) -> ComparisonRows {
    let mut head = Html::new();
    head.element("th", &[("scope", "col")], "Task");
    for o in &plan.options {
        let rank = if o.rank == 1 {
            "#1 recommended".to_string()
        } else {
            format!("#{}", o.rank)
        };
        let pressed = if chosen == Some(o.option.index) {
            "true"
        } else {
            "false"
        };
        head.open("th", &[("scope", "col")])
            .open(
                "button",
                &[
                    ("type", "button"),
                    ("class", "option-head"),
                    ("aria-pressed", pressed),
                    ("data-option", &o.option.index.to_string()),
                ],
            )
            .element("span", &[("class", "rank")], &rank)
            .element("span", &[], &o.option.label)
            .close("button")
            .element(
                "span",
                &[("class", "score")],
                &format!("{:.1} h comfortable", o.score.comfortable_hours),
            )
            .close("th");
    }
    let tasks = plan
        .tasks
        .iter()
        .enumerate()
        .map(|(t, ctx)| {
            let index = ctx.task.index;
            let mut html = Html::new();
            html.open("th", &[("scope", "row")])
                .element(
                    "button",
                    &[
                        ("type", "button"),
                        ("class", "task-head-button"),
                        ("data-mark", &Mark::Row.id(index)),
                        ("aria-haspopup", "dialog"),
                        ("aria-expanded", Mark::expanded(index, open)),
                    ],
                    &format!("{}. {}", index + 1, ctx.task.name),
                )
                .element(
                    "span",
                    &[("class", "detail")],
                    &format!("{:.1} h", ctx.hours_per_day),
                )
                .close("th");
            for tp in plan.options.iter().filter_map(|o| o.tasks.get(t)) {
                cell(&mut html, tp);
            }
            html.finish()
        })
        .collect();
    ComparisonRows {
        head: head.finish(),
        tasks,
        foot: breakdown(plan),
    }
}
