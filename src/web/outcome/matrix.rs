//! The comparison table: one row per task, one column per lens option (best
//! first), each cell the verdict with its symbol, the local addition and any
//! head posture or head turn the task forces; below, what each option's
//! score is made of, its fitness for driving, and when two options are
//! practically equal. Choosing an option's heading writes the order for it;
//! choosing a task's heading opens the task's detail beside it.
//!
//! The table is drawn from rows of display text keyed by their content, so
//! an edit rebuilds only the rows whose text changed (usually the edited
//! task's row and the score lines), not the whole table.

use super::detail::{use_task_detail, Mark};
use super::marks::verdict_mark;
use crate::plan::{DrivingFitness, OptionPlan, Plan};
use crate::web::state::use_app_state;
use leptos::prelude::*;

/// One cell as shown: how one task fares through one option.
#[derive(Clone, PartialEq, Eq, Hash)]
struct Cell {
    symbol: &'static str,
    class: &'static str,
    words: &'static str,
    zone: String,
    posture: Option<String>,
    turn: Option<String>,
}

/// One task's row as shown.
#[derive(Clone, PartialEq, Eq, Hash)]
struct Row {
    index: usize,
    title: String,
    hours: String,
    cells: Vec<Cell>,
}

/// One option's column heading as shown.
#[derive(Clone, PartialEq, Eq, Hash)]
struct Head {
    index: usize,
    rank: String,
    label: String,
    score: String,
}

/// One line of the score breakdown as shown, one text per option.
#[derive(Clone, PartialEq, Eq, Hash)]
struct FootRow {
    label: &'static str,
    cells: Vec<String>,
}

/// The whole table as display text.
#[derive(Clone, PartialEq, Default)]
struct Table {
    heads: Vec<Head>,
    rows: Vec<Row>,
    foot: Vec<FootRow>,
}

/// How task `t` fares through option `o`.
fn cell(o: &OptionPlan, t: usize) -> Option<Cell> {
    let tp = o.tasks.get(t)?;
    let (symbol, class, words) = verdict_mark(tp.verdict);
    let posture = tp.posture.to_string();
    let turn = tp.field.head_turn.0;
    Some(Cell {
        symbol,
        class,
        words,
        zone: format!("{} zone, addition {}", tp.zone, tp.local_power.addition),
        posture: (posture != "natural").then_some(posture),
        turn: (turn >= 1.0).then(|| format!("head turn {turn:.0}°")),
    })
}

/// What each option's score is made of, one line per component.
fn breakdown(plan: &Plan) -> Vec<FootRow> {
    let row = |label: &'static str, value: fn(&OptionPlan) -> String| FootRow {
        label,
        cells: plan.options.iter().map(value).collect(),
    };
    vec![
        row("Score (weighted hours a day)", |o| {
            format!("{:.2} h", o.score.total)
        }),
        row("Comfortable, tiring, blurred", |o| {
            format!(
                "{:.1} h, {:.1} h, {:.1} h",
                o.score.comfortable_hours, o.score.tiring_hours, o.score.blurred_hours
            )
        }),
        row("Deducted: posture, prism, missing power, addition", |o| {
            format!(
                "{:.2} h, {:.2} h, {:.2} h, {:.2} h",
                o.score.posture_penalty,
                o.score.prism_penalty,
                o.score.gap_penalty,
                o.score.addition_penalty
            )
        }),
        row("Driving", |o| match &o.driving {
            None => "no driving task".to_string(),
            Some(DrivingFitness::Fit) => "fit for driving".to_string(),
            Some(DrivingFitness::Unfit { .. }) => "not for driving".to_string(),
        }),
        row("Note", |o| {
            o.near_tie
                .as_ref()
                .map_or(String::new(), ToString::to_string)
        }),
    ]
}

/// The table for `plan` as display text.
fn table(plan: &Plan) -> Table {
    let heads = plan
        .options
        .iter()
        .map(|o| Head {
            index: o.option.index,
            rank: if o.rank == 1 {
                "#1 recommended".to_string()
            } else {
                format!("#{}", o.rank)
            },
            label: o.option.label.clone(),
            score: format!("{:.1} h comfortable", o.score.comfortable_hours),
        })
        .collect();
    let rows = plan
        .tasks
        .iter()
        .enumerate()
        .map(|(t, ctx)| Row {
            index: ctx.task.index,
            title: format!("{}. {}", ctx.task.index + 1, ctx.task.name),
            hours: format!("{:.1} h", ctx.hours_per_day),
            cells: plan.options.iter().filter_map(|o| cell(o, t)).collect(),
        })
        .collect();
    Table {
        heads,
        rows,
        foot: breakdown(plan),
    }
}

/// One cell of a task's row.
fn cell_view(c: Cell) -> impl IntoView {
    view! {
        <td class=format!("verdict {}", c.class)>
            <span class="mark" aria-hidden="true">{c.symbol}</span>
            <span class="words">{c.words}</span>
            <span class="detail">{c.zone}</span>
            {c.posture.map(|p| view! { <span class="detail posture">{p}</span> })}
            {c.turn.map(|t| view! { <span class="detail">{t}</span> })}
        </td>
    }
}

/// The comparison table of the plan on screen.
#[component]
pub fn Comparison() -> impl IntoView {
    let state = use_app_state();
    let shown = Memo::new(move |_| {
        state
            .outcome
            .with(|o| o.plan.as_ref().map(table).unwrap_or_default())
    });
    let head = move |h: Head| {
        let index = h.index;
        let pressed = move || {
            if state.chosen_option() == Some(index) {
                "true"
            } else {
                "false"
            }
        };
        view! {
            <th scope="col">
                <button type="button" class="option-head" aria-pressed=pressed on:click=move |_| state.choose_option(index)>
                    <span class="rank">{h.rank}</span>
                    <span>{h.label}</span>
                </button>
                <span class="score">{h.score}</span>
            </th>
        }
    };
    let detail = use_task_detail();
    let row = move |r: Row| {
        let index = r.index;
        view! {
            <tr>
                <th scope="row">
                    <button
                        type="button"
                        class="task-head-button"
                        data-mark=Mark::Row.id(index)
                        aria-haspopup="dialog"
                        aria-expanded=move || detail.is_open_for(index).to_string()
                        on:click=move |_| detail.open(Mark::Row, index)
                    >
                        {r.title}
                    </button>
                    <span class="detail">{r.hours}</span>
                </th>
                {r.cells.into_iter().map(cell_view).collect_view()}
            </tr>
        }
    };
    let foot = |f: FootRow| {
        view! {
            <tr>
                <th scope="row">{f.label}</th>
                {f.cells.into_iter().map(|c| view! { <td>{c}</td> }).collect_view()}
            </tr>
        }
    };
    view! {
        <h3 class="comparison-heading">"Comparison"</h3>
        <div class="table-scroll comparison-block">
            <table class="comparison" data-testid="comparison">
                <caption>"Each task through each lens option (best first). Choose an option to write the order for it and draw its lens."</caption>
                <thead>
                    <tr>
                        <th scope="col">"Task"</th>
                        <For each=move || shown.with(|t| t.heads.clone()) key=Head::clone children=head />
                    </tr>
                </thead>
                <tbody>
                    <For each=move || shown.with(|t| t.rows.clone()) key=Row::clone children=row />
                </tbody>
                <tfoot>
                    <For each=move || shown.with(|t| t.foot.clone()) key=FootRow::clone children=foot />
                </tfoot>
            </table>
        </div>
    }
}
