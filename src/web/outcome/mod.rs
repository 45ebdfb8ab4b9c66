//! The outcome panel: the recommended option with its reasons, the cautions,
//! tasks no option serves, the comparison table, the range chart, the lens
//! map, a task's numbers in detail (beside the mark it was chosen from)
//! and the order sheet. The read-only parts are written as HTML text
//! (`crate::markup`) from memos over the plan, so a part whose text did not
//! change is not touched and a changed part is replaced in one step; a
//! stale plan stays visible and says so.

mod detail;
mod lens_map;
mod order_sheet;
mod peek;
mod written;

use crate::markup::comparison::{comparison, ComparisonRows, CAPTION};
use crate::markup::range_chart::{range_chart, RangeChartMarks};
use crate::markup::summary::{cautions, chosen_note, recommendation, unserved};
use crate::plan::text::{amplitude_line, pupil_line, refraction_line};
use crate::plan::{OptionPlan, Plan};
use crate::web::startup::drawn_after_first_paint;
use crate::web::state::use_app_state;
use crate::web::walkthrough::WalkthroughLauncher;
use detail::{provide_task_detail, TaskDetailPopover};
use lens_map::LensMap;
use leptos::prelude::*;
use order_sheet::OrderSheet;
use written::{on_choose, on_choose_key, written_body, written_foot, written_marks};

pub use peek::PlanPeek;

/// The option the charts, the lens map and the order show: the plan's
/// chosen option (the dispenser's choice, else the recommendation).
fn shown_option(plan: &Plan) -> Option<&OptionPlan> {
    let chosen = plan.choice.as_ref().map(|c| &c.chosen);
    chosen
        .and_then(|c| plan.options.iter().find(|o| &o.option == c))
        .or_else(|| plan.options.first())
}

/// The plan's opening parts, each written apart: the cautions, the
/// recommendation, the dispenser's choice and the tasks no option serves.
const OPENING: [fn(&Plan) -> String; 4] = [
    |p| cautions(&p.cautions, shown_option(p).map(|o| &o.option)),
    |p| p.options.first().map(recommendation).unwrap_or_default(),
    |p| chosen_note(p.choice.as_ref()),
    |p| unserved(&p.unserved),
];

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
    let detail = provide_task_detail();
    let later = drawn_after_first_paint();
    let open = move || detail.open_task();
    let opening = OPENING.map(|write| {
        Memo::new(move |_| {
            state
                .outcome
                .with(|o| o.plan.as_ref().map(write).unwrap_or_default())
        })
    });
    let line = Memo::new(move |_| {
        state.outcome.with(|o| {
            o.plan.as_ref().map(|p| {
                format!(
                    "{} · {} · {}",
                    amplitude_line(&p.amplitude),
                    refraction_line(&p.refraction),
                    pupil_line(&p.pupil)
                )
            })
        })
    });
    // Each table and chart takes the rows it would write the same from
    // the one before.
    let table = Memo::new(move |before: Option<&ComparisonRows>| {
        let (chosen, open) = (state.chosen_option(), open());
        state.outcome.with(|o| {
            o.plan
                .as_ref()
                .map(|p| comparison(p, chosen, open, before))
                .unwrap_or_default()
        })
    });
    let table_head = Memo::new(move |_| table.with(|t| t.head.clone()));
    let chart = Memo::new(move |before: Option<&RangeChartMarks>| {
        let (unit, open) = (state.unit.get(), open());
        state.outcome.with(|o| {
            o.plan
                .as_ref()
                .and_then(|p| Some(range_chart(p, shown_option(p)?, unit, open, before)))
                .unwrap_or_default()
        })
    });
    let view_box = Memo::new(move |_| chart.with(|c| c.view_box.clone()));
    let shift = Memo::new(move |_| chart.with(|c| c.shift.clone()));
    let caption = Memo::new(move |_| chart.with(|c| c.caption.clone()));
    let planned = move || {
        view! {
            <Show when=move || stale.get()>
                <p class="stale" role="status" data-testid="stale">
                    "This plan is from before the last change: correct the marked fields to update it."
                    {move || error.get().map(|e| format!(" ({e})"))}
                </p>
            </Show>
            <div class="plan" class:is-stale=move || stale.get() data-testid="plan">
                {opening.map(|text| view! { <div class="part" inner_html=move || text.get()></div> })}
                <p class="detail">{move || line.get()}</p>
                <h3 class="comparison-heading">"Comparison"</h3>
                <div class="table-scroll comparison-block">
                    <table class="comparison" data-testid="comparison">
                        <caption>{CAPTION}</caption>
                        <thead>
                            <tr inner_html=move || table_head.get()></tr>
                        </thead>
                        {written_body(move || table.with(|t| t.tasks.clone()))}
                        {written_foot(move || table.with(|t| t.foot.clone()))}
                    </table>
                </div>
                <TaskDetailPopover />
                <h3 class="range-heading">"Range of clear vision"</h3>
                <figure class="range-chart">
                    <svg
                        viewBox=move || view_box.get()
                        role="img"
                        aria-labelledby="range-chart-caption"
                        data-testid="range-chart"
                    >
                        <g transform=move || shift.get()>
                            {written_marks(move || chart.with(|c| c.ticks.clone()))}
                            {written_marks(move || chart.with(|c| c.rows.clone()))}
                            {written_marks(move || chart.with(|c| c.markers.clone()))}
                        </g>
                    </svg>
                    <figcaption id="range-chart-caption" inner_html=move || caption.get()></figcaption>
                </figure>
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
    view! {
        <section
            class="panel outcome"
            aria-labelledby="outcome-heading"
            data-testid="outcome"
            on:click=on_choose(state, detail)
            on:keydown=on_choose_key(state, detail)
        >
            <h2 id="outcome-heading">"Plan"</h2>
            <WalkthroughLauncher />
            {body}
            {move || later.get().then(|| view! {
                <LensMap />
                <OrderSheet />
            })}
        </section>
    }
}
