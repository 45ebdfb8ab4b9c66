//! The outcome panel: the recommended option with its reasons, the cautions,
//! tasks no option serves, the comparison table, the range chart, the lens
//! map, a task's numbers in detail (beside the mark it was chosen from)
//! and the order sheet. Each part redraws
//! only when its own share of the plan changes (a memo per part, keyed rows
//! in the tables and charts), so an edit touches little of the page; a
//! stale plan stays visible and says so.

mod detail;
mod lens_map;
mod marks;
mod matrix;
mod order_sheet;
mod peek;
mod range_chart;

use crate::plan::text::{amplitude_line, family_name, pupil_line, refraction_line};
use crate::plan::{Caution, Choice, OptionPlan, OptionRef, Plan, UnservedTask};
use crate::web::state::use_app_state;
use crate::web::walkthrough::WalkthroughLauncher;
use detail::{provide_task_detail, TaskDetailPopover};
use lens_map::LensMap;
use leptos::prelude::*;
use matrix::Comparison;
use range_chart::RangeChart;

pub use peek::PlanPeek;

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
/// Cautions that concern only options other than `shown` are marked, so
/// the printed sheet carries only those of the option it orders.
fn cautions((cautions, shown): (Vec<Caution>, Option<OptionRef>)) -> impl IntoView {
    let items = cautions
        .into_iter()
        .map(|c| {
            let other = !c.options.is_empty() && shown.as_ref().is_some_and(|s| !c.options.contains(s));
            view! { <li class:other-option=other><strong>{c.kind.to_string()}</strong>": "{c.text}</li> }
        })
        .collect_view();
    view! {
        <section class="cautions" aria-labelledby="cautions-heading" data-testid="cautions">
            <h3 id="cautions-heading">"Cautions"</h3>
            <ul>{items}</ul>
        </section>
    }
}

/// Tasks that no option makes comfortable.
fn unserved(unserved: Vec<UnservedTask>) -> impl IntoView {
    (!unserved.is_empty()).then(|| {
        let items = unserved
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
fn chosen_note(choice: Option<Choice>) -> Option<impl IntoView> {
    let choice = choice?;
    choice.by_dispenser.then(|| {
        view! {
            <p class="chosen-note" data-testid="chosen-note">
                <strong>{format!("Chosen: {}", choice.chosen.label)}</strong>
                {format!(" — {choice}.")}
            </p>
        }
    })
}

/// What the panel shows besides the plan's parts.
#[derive(Clone, Copy, PartialEq)]
enum Stage {
    /// No scenario so far could be planned.
    NoPlan,
    /// The scenario has no tasks.
    NoTasks,
    /// A plan is on screen.
    Planned,
}

/// A part of the panel drawn from its own share of the plan: `share` takes
/// it out of the plan on every edit, and `draw` runs only when it changed.
fn part<T, V>(share: fn(&Plan) -> T, draw: fn(T) -> V) -> impl IntoView
where
    T: PartialEq + Clone + Send + Sync + 'static,
    V: IntoView + 'static,
{
    let state = use_app_state();
    let shown = Memo::new(move |_| state.outcome.with(|o| o.plan.as_ref().map(share)));
    move || shown.get().map(draw)
}

/// The outcome panel.
#[component]
pub fn OutcomePanel() -> impl IntoView {
    let state = use_app_state();
    let stale = Memo::new(move |_| {
        state.outcome.with(|o| o.stale) || state.unparsed.with(|set| !set.is_empty())
    });
    let stage = Memo::new(move |_| {
        state.outcome.with(|o| match &o.plan {
            None => Stage::NoPlan,
            Some(p) if p.tasks.is_empty() && !stale.get() => Stage::NoTasks,
            Some(_) => Stage::Planned,
        })
    });
    let error = Memo::new(move |_| state.outcome.with(|o| o.error.clone()));
    provide_task_detail();
    let planned = move || {
        view! {
            <Show when=move || stale.get()>
                <p class="stale" role="status" data-testid="stale">
                    "This plan is from before the last change: correct the marked fields to update it."
                    {move || error.get().map(|e| format!(" ({e})"))}
                </p>
            </Show>
            <div class="plan" class:is-stale=move || stale.get() data-testid="plan">
                {part(|p| (p.cautions.clone(), shown_option(p).map(|o| o.option.clone())), cautions)}
                {part(|p| p.options.first().cloned(), |best| best.map(|b| recommendation(&b)))}
                {part(|p| p.choice.clone(), chosen_note)}
                {part(|p| p.unserved.clone(), unserved)}
                <p class="detail">
                    {part(|p| {
                        format!(
                            "{} · {} · {}",
                            amplitude_line(&p.amplitude),
                            refraction_line(&p.refraction),
                            pupil_line(&p.pupil)
                        )
                    }, |line| line)}
                </p>
                <Comparison />
                <TaskDetailPopover />
                <RangeChart />
            </div>
        }
    };
    let body = move || match stage.get() {
        Stage::NoPlan => view! {
            <p class="hint" data-testid="no-plan">
                "Correct the marked fields to see a plan."
            </p>
        }
        .into_any(),
        Stage::NoTasks => view! {
            <p class="hint" data-testid="no-tasks">
                "Add the tasks of the working day (\"Add task\") to see which lenses serve them."
            </p>
        }
        .into_any(),
        Stage::Planned => planned().into_any(),
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
