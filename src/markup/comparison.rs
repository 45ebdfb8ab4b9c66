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
use super::reuse::reused;
use crate::core::units::Dioptres;
use crate::plan::{DrivingFitness, HeadPosture, OptionPlan, Plan, TaskPlan, Verdict, ZoneKind};

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
    /// What each task's row was written from.
    tasks_from: Vec<RowInput>,
}

/// What a cell shows of a task seen through one option.
#[derive(Debug, Clone, Copy, PartialEq)]
struct CellInput {
    verdict: Verdict,
    zone: ZoneKind,
    addition: Dioptres,
    posture: HeadPosture,
    head_turn_deg: f64,
}

impl CellInput {
    fn of(tp: &TaskPlan) -> CellInput {
        CellInput {
            verdict: tp.verdict,
            zone: tp.zone,
            addition: tp.local_power.addition,
            posture: tp.posture,
            head_turn_deg: tp.field.head_turn.0,
        }
    }
}

/// What a task's row is written from: the task's number, name and hours,
/// its detail's `aria-expanded` value and each option's cell.
#[derive(Debug, Clone, PartialEq)]
struct RowInput {
    index: usize,
    name: String,
    hours_per_day: f64,
    expanded: &'static str,
    cells: Vec<CellInput>,
}

/// One cell: how a task fares through one option.
fn cell(html: &mut Html, tp: &CellInput) {
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
            &format!("{} zone, addition {}", tp.zone, tp.addition),
        );
    let posture = tp.posture.to_string();
    if posture != "natural" {
        html.element("span", &[("class", "detail posture")], &posture);
    }
    let turn = tp.head_turn_deg;
    if turn >= 1.0 {
        html.element(
            "span",
            &[("class", "detail")],
            &format!("head turn {turn:.0}°"),
        );
    }
    html.close("td");
}

/// A task's row: its heading button, its hours and one cell per option.
fn row_text(row: &RowInput) -> String {
    let mut html = Html::new();
    html.open("th", &[("scope", "row")])
        .element(
            "button",
            &[
                ("type", "button"),
                ("class", "task-head-button"),
                ("data-mark", &Mark::Row.id(row.index)),
                ("aria-haspopup", "dialog"),
                ("aria-expanded", row.expanded),
            ],
            &format!("{}. {}", row.index + 1, row.name),
        )
        .element(
            "span",
            &[("class", "detail")],
            &format!("{:.1} h", row.hours_per_day),
        )
        .close("th");
    for c in &row.cells {
        cell(&mut html, c);
    }
    html.finish()
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
/// input index `open` (whose detail is shown, if any) expanded; the task
/// rows written from the same inputs as in the rows `before` are taken
/// from them as they are.
pub fn comparison(
    plan: &Plan,
    chosen: Option<usize>,
    open: Option<usize>,
    before: Option<&ComparisonRows>,
) -> ComparisonRows {
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
    let tasks_from: Vec<RowInput> = plan
        .tasks
        .iter()
        .enumerate()
        .map(|(t, ctx)| RowInput {
            index: ctx.task.index,
            name: ctx.task.name.clone(),
            hours_per_day: ctx.hours_per_day,
            expanded: Mark::expanded(ctx.task.index, open),
            cells: plan
                .options
                .iter()
                .filter_map(|o| o.tasks.get(t))
                .map(CellInput::of)
                .collect(),
        })
        .collect();
    let tasks = tasks_from
        .iter()
        .enumerate()
        .map(|(t, row)| {
            reused(
                before.map(|b| (&b.tasks_from[..], &b.tasks[..])),
                t,
                row,
                || row_text(row),
            )
        })
        .collect();
    ComparisonRows {
        head: head.finish(),
        tasks,
        foot: breakdown(plan),
        tasks_from,
    }
}
