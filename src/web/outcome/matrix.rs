//! The comparison table: one row per task, one column per lens option (best
//! first), each cell the verdict with its symbol, the local addition and any
//! head posture or head turn the task forces; below, what each option's
//! score is made of, its fitness for driving, and when two options are
//! practically equal. Choosing an option's heading writes the order for it.

use super::marks::verdict_mark;
use crate::plan::{DrivingFitness, OptionPlan, Plan};
use crate::web::state::use_app_state;
use leptos::prelude::*;

/// One cell: how task `t` fares through option `o`.
fn cell(o: &OptionPlan, t: usize) -> impl IntoView {
    let Some(tp) = o.tasks.get(t) else {
        return view! { <td>"—"</td> }.into_any();
    };
    let (symbol, class, words) = verdict_mark(tp.verdict);
    let posture = tp.posture.to_string();
    let turn = tp.field.head_turn.0;
    view! {
        <td class=format!("verdict {class}")>
            <span class="mark" aria-hidden="true">{symbol}</span>
            <span class="words">{words}</span>
            <span class="detail">{format!("{} zone, add {}", tp.zone, tp.local_power.addition)}</span>
            {(posture != "natural").then(|| view! { <span class="detail posture">{posture}</span> })}
            {(turn >= 1.0).then(|| view! { <span class="detail">{format!("head turn {turn:.0}°")}</span> })}
        </td>
    }
    .into_any()
}

/// The rows under the table: what each option's score is made of.
fn breakdown(plan: &Plan) -> impl IntoView {
    let row = |label: &'static str, value: fn(&OptionPlan) -> String| {
        let cells = plan
            .options
            .iter()
            .map(|o| view! { <td class="detail">{value(o)}</td> })
            .collect_view();
        view! {
            <tr>
                <th scope="row">{label}</th>
                {cells}
            </tr>
        }
    };
    view! {
        <tfoot>
            {row("Score (weighted hours a day)", |o| format!("{:.2} h", o.score.total))}
            {row("Comfortable, tiring, blurred", |o| {
                format!(
                    "{:.1} h, {:.1} h, {:.1} h",
                    o.score.comfortable_hours, o.score.tiring_hours, o.score.blurred_hours
                )
            })}
            {row("Deducted: posture, prism, missing power, addition", |o| {
                format!(
                    "{:.2} h, {:.2} h, {:.2} h, {:.2} h",
                    o.score.posture_penalty,
                    o.score.prism_penalty,
                    o.score.gap_penalty,
                    o.score.addition_penalty
                )
            })}
            {row("Driving", |o| match &o.driving {
                None => "no driving task".to_string(),
                Some(DrivingFitness::Fit) => "fit for driving".to_string(),
                Some(DrivingFitness::Unfit { .. }) => "not for driving".to_string(),
            })}
            {row("Note", |o| o.near_tie.as_ref().map_or(String::new(), ToString::to_string))}
        </tfoot>
    }
}

/// The comparison table for `plan`.
pub fn comparison(plan: &Plan) -> impl IntoView {
    let state = use_app_state();
    let headers = plan
        .options
        .iter()
        .map(|o| {
            let index = o.option.index;
            let label = o.option.label.clone();
            let pressed = move || {
                let chosen = state.chosen_option();
                if chosen == Some(index) { "true" } else { "false" }
            };
            view! {
                <th scope="col">
                    <button type="button" class="option-head" aria-pressed=pressed on:click=move |_| state.choose_option(index)>
                        <span class="rank">
                            {if o.rank == 1 { "#1 recommended".to_string() } else { format!("#{}", o.rank) }}
                        </span>
                        <span>{label}</span>
                    </button>
                    <span class="score">{format!("{:.1} h comfortable", o.score.comfortable_hours)}</span>
                </th>
            }
        })
        .collect_view();
    let rows = plan
        .tasks
        .iter()
        .enumerate()
        .map(|(t, ctx)| {
            let index = ctx.task.index;
            let cells = plan.options.iter().map(|o| cell(o, t)).collect_view();
            view! {
                <tr>
                    <th scope="row">
                        <button type="button" class="task-head-button" on:click=move |_| state.chosen_task.set(Some(index))>
                            {format!("{}. {}", index + 1, ctx.task.name)}
                        </button>
                        <span class="detail">{format!("{:.1} h", ctx.hours_per_day)}</span>
                    </th>
                    {cells}
                </tr>
            }
        })
        .collect_view();
    view! {
        <h3 class="comparison-heading">"Comparison"</h3>
        <div class="table-scroll comparison-block">
            <table class="comparison" data-testid="comparison">
                <caption>"Each task through each lens option (best first). Choose an option to write the order for it and draw its lens."</caption>
                <thead>
                    <tr>
                        <th scope="col">"Task"</th>
                        {headers}
                    </tr>
                </thead>
                <tbody>{rows}</tbody>
                {breakdown(plan)}
            </table>
        </div>
    }
}
