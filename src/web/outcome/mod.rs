//! The outcome panel: the recommended option with its reasons, the cautions,
//! tasks no option serves, the comparison table, the range chart, the lens
//! map, a task's numbers in detail and the order sheet. It re-renders from
//! the plan memo on every edit; a stale plan stays visible and says so.

mod lens_map;
mod marks;
mod matrix;
mod order_sheet;
mod range_chart;

use crate::plan::text::{amplitude_line, family_name, pupil_line, refraction_line};
use crate::plan::{OptionPlan, Plan};
use crate::web::state::use_app_state;
use crate::web::walkthrough::WalkthroughLauncher;
use lens_map::LensMap;
use leptos::prelude::*;
use marks::verdict_mark;

/// The recommended (best-ranked) option with its parameters and reasons.
fn recommendation(best: &OptionPlan) -> impl IntoView {
    let parameters = best
        .parameters
        .iter()
        .map(|p| view! { <li>{format!("{} {} ({})", p.kind, p.value, p.source)}</li> })
        .collect_view();
    view! {
        <div class="recommendation" data-testid="recommendation">
            <h3>{format!("Recommended: {} · {}", best.option.label, family_name(&best.design))}</h3>
            <ul class="parameters">{parameters}</ul>
            <p>{best.describe_choice()}</p>
            {best.prescribed_addition.map(|c| view! { <p class="detail">{format!("Prescribed: {c}.")}</p> })}
            <p class="detail">
                {format!(
                    "Comfortable {:.1} h, in focus but tiring {:.1} h, blurred {:.1} h of the working day.",
                    best.score.comfortable_hours,
                    best.score.tiring_hours,
                    best.score.blurred_hours
                )}
            </p>
        </div>
    }
}

/// The cautions drawn from the scenario, planning-aid note included.
fn cautions(plan: &Plan) -> impl IntoView {
    let items = plan
        .cautions
        .iter()
        .map(|c| view! { <li><strong>{c.kind.to_string()}</strong>": "{c.text.clone()}</li> })
        .collect_view();
    view! {
        <section class="cautions" aria-labelledby="cautions-heading" data-testid="cautions">
            <h3 id="cautions-heading">"Cautions"</h3>
            <ul>{items}</ul>
        </section>
    }
}

/// Tasks that no option makes comfortable.
fn unserved(plan: &Plan) -> impl IntoView {
    (!plan.unserved.is_empty()).then(|| {
        let items = plan
            .unserved
            .iter()
            .map(|u| view! { <li>{u.describe()}</li> })
            .collect_view();
        view! {
            <section class="unserved" data-testid="unserved">
                <h3>"Tasks no option makes comfortable"</h3>
                <ul>{items}</ul>
            </section>
        }
    })
}

/// The numbers of task `t` through every option.
fn task_detail(plan: &Plan, t: usize) -> impl IntoView {
    let Some(ctx) = plan.tasks.iter().find(|c| c.task.index == t) else {
        return ().into_any();
    };
    let rows = plan
        .options
        .iter()
        .filter_map(|o| o.tasks.iter().find(|tp| tp.task.index == t).map(|tp| (o, tp)))
        .map(|(o, tp)| {
            let (symbol, class, words) = verdict_mark(tp.verdict);
            let share = tp
                .share_of_amplitude
                .map(|s| format!("{:.0} %", s * 100.0))
                .unwrap_or_else(|| "n/a".into());
            view! {
                <tr>
                    <th scope="row">{format!("#{} {}", o.rank, o.option.label)}</th>
                    <td class=format!("verdict {class}")><span aria-hidden="true">{symbol}</span>" "{words}</td>
                    <td>{tp.local_power.to_string()}</td>
                    <td>{format!("{} ({share})", tp.accommodation)}</td>
                    <td>{format!("{:.1}′, −{:.2} logMAR", tp.blur.blur_disc_arcmin, tp.blur.acuity_loss_logmar)}</td>
                    <td>{tp.posture.to_string()}</td>
                    <td>{format!("{:.1} mm, {:.1} Δ", tp.near_vision.near_pd.0, tp.near_vision.convergence.0)}</td>
                </tr>
            }
        })
        .collect_view();
    view! {
        <section class="task-detail" data-testid="task-detail">
            <h3>{format!("{}. {} in detail", t + 1, ctx.task.name)}</h3>
            <div class="table-scroll">
                <table>
                    <thead>
                        <tr>
                            <th scope="col">"Option"</th>
                            <th scope="col">"Verdict"</th>
                            <th scope="col">"Local power"</th>
                            <th scope="col">"Accommodation (share)"</th>
                            <th scope="col">"Blur, acuity loss"</th>
                            <th scope="col">"Head posture"</th>
                            <th scope="col">"Near PD, convergence"</th>
                        </tr>
                    </thead>
                    <tbody>{rows}</tbody>
                </table>
            </div>
        </section>
    }
    .into_any()
}

/// The option the charts, the lens map and the order show: the plan's
/// chosen option (the dispenser's choice, else the recommendation).
fn shown_option(plan: &Plan) -> Option<&OptionPlan> {
    let chosen = plan.choice.as_ref().map(|c| &c.chosen);
    chosen
        .and_then(|c| plan.options.iter().find(|o| &o.option == c))
        .or_else(|| plan.options.first())
}

/// The dispenser's choice when it differs from the recommendation, and why
/// the planner ranks another option first.
fn chosen_note(plan: &Plan) -> Option<impl IntoView> {
    let choice = plan.choice.as_ref()?;
    choice.by_dispenser.then(|| {
        view! {
            <p class="chosen-note" data-testid="chosen-note">
                <strong>{format!("Chosen: {}", choice.chosen.label)}</strong>
                {format!(" — {choice}.")}
            </p>
        }
    })
}

/// The outcome panel.
#[component]
pub fn OutcomePanel() -> impl IntoView {
    let state = use_app_state();
    let body = move || {
        let outcome = state.outcome.get();
        let unparsed = state.unparsed.with(|set| !set.is_empty());
        let stale = outcome.stale || unparsed;
        let Some(plan) = outcome.plan else {
            return view! {
                <p class="hint" data-testid="no-plan">
                    "Correct the marked fields to see a plan."
                </p>
            }
            .into_any();
        };
        if plan.tasks.is_empty() && !stale {
            return view! {
                <p class="hint" data-testid="no-tasks">
                    "Add the tasks of the working day (\"Add task\") to see which lenses serve them."
                </p>
            }
            .into_any();
        }
        let detail = state.chosen_task.get().map(|t| task_detail(&plan, t));
        view! {
            <Show when=move || stale>
                <p class="stale" role="status" data-testid="stale">
                    "This plan is from before the last change: correct the marked fields to update it."
                    {outcome.error.clone().map(|e| format!(" ({e})"))}
                </p>
            </Show>
            <div class="plan" class:is-stale=stale data-testid="plan">
                {cautions(&plan)}
                {plan.options.first().map(recommendation)}
                {chosen_note(&plan)}
                {unserved(&plan)}
                <p class="detail">
                    {amplitude_line(&plan.amplitude)}" · "{refraction_line(&plan.refraction)}" · "
                    {pupil_line(&plan.pupil)}
                </p>
                {matrix::comparison(&plan)}
                {detail}
                {shown_option(&plan).map(|o| range_chart::range_chart(&plan, o))}
            </div>
        }
        .into_any()
    };
    let sheet = move || {
        state
            .outcome
            .with(|o| o.plan.as_ref().map(order_sheet::order_sheet))
    };
    view! {
        <section class="panel outcome" aria-labelledby="outcome-heading" data-testid="outcome">
            <h2 id="outcome-heading">"Plan"</h2>
            <WalkthroughLauncher />
            {body}
            <LensMap />
            {sheet}
        </section>
    }
}
