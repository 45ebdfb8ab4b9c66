//! The range chart: for the option shown (the one chosen in the comparison,
//! the best by default), one row per task with the distances in focus
//! (light band) and comfortable (dark band) through the power at the point
//! where that task is seen, on a dioptric distance axis, and the task's own
//! distance as a dot on its row; every task is also marked by its number
//! above. Hovering shows the numbers; choosing a task marker shows them
//! below the chart. All geometry comes from `chart`.

use super::marks::verdict_mark;
use crate::chart::range_rows::{axis_for, range_rows, task_markers};
use crate::display::trim_number;
use crate::plan::{OptionPlan, Plan};
use crate::web::state::use_app_state;
use leptos::prelude::*;

const WIDTH: f64 = 820.0;
const LABEL_END: f64 = 250.0;
const X_NEAR: f64 = 270.0;
const X_FAR: f64 = 800.0;
const TOP: f64 = 70.0;
/// Side of the square that takes a tap on a task marker, in SVG units: about
/// 44 px or more at the widths the chart is drawn (touch-target size, WCAG 2.5.5).
const HIT: f64 = 76.0;
const ROW: f64 = 26.0;

/// The range chart for `option`, one of `plan`'s options.
pub fn range_chart(plan: &Plan, option: &OptionPlan) -> impl IntoView {
    let state = use_app_state();
    let unit = state.unit.get();
    let axis = axis_for(plan, X_NEAR, X_FAR);
    let rows = range_rows(plan, option, &axis);
    let markers = task_markers(plan, &axis);
    let height = TOP + rows.len() as f64 * ROW + 36.0;
    let bottom = TOP + rows.len() as f64 * ROW;
    let ticks = axis
        .ticks(unit)
        .into_iter()
        .map(|t| {
            view! {
                <line class="grid" x1=t.x x2=t.x y1={TOP - 4.0} y2={bottom} />
                <text class="tick" x=t.x y={bottom + 18.0} text-anchor="middle">{t.label}</text>
            }
        })
        .collect_view();
    let bands = rows
        .iter()
        .enumerate()
        .map(|(i, r)| {
            let y = TOP + i as f64 * ROW;
            let label = format!("{}. {} · {} {:+.2}", r.index + 1, r.task, r.zone, r.addition_d);
            let tooltip = format!("{label}: {}, {}", r.words, r.focus);
            let (symbol, class, _) = verdict_mark(r.focus);
            let focus = r.in_focus.map(|s| view! {
                <rect class="band-focus" x=s.x_near y={y + 5.0} width={(s.x_far - s.x_near).max(1.0)} height={ROW - 10.0} />
            });
            let comfort = r.comfortable.map(|s| view! {
                <rect class="band-comfort" x=s.x_near y={y + 9.0} width={(s.x_far - s.x_near).max(1.0)} height={ROW - 18.0} />
            });
            view! {
                <g class="range-row">
                    <title>{tooltip}</title>
                    <text class="row-label" x=LABEL_END y={y + ROW / 2.0 + 4.0} text-anchor="end">{label}</text>
                    {focus}
                    {comfort}
                    <circle class=format!("task-dot {class}") cx=r.x_task cy={y + ROW / 2.0} r="6" />
                    <text class="dot-symbol" x=r.x_task y={y + ROW / 2.0 + 4.0} text-anchor="middle" aria-hidden="true">{symbol}</text>
                </g>
            }
        })
        .collect_view();
    let marks = markers
        .into_iter()
        .map(|m| {
            let index = m.index;
            let distance = format!(
                "{} {}",
                trim_number(
                    unit.from_metres(crate::core::units::Metres(m.distance_m)),
                    0
                ),
                unit.symbol()
            );
            let tooltip = format!("{}. {} at {distance}", index + 1, m.name);
            let label = tooltip.clone();
            view! {
                <g
                    class="task-marker"
                    tabindex="0"
                    role="button"
                    aria-label=label
                    on:click=move |_| state.chosen_task.set(Some(index))
                    on:keydown=move |ev| {
                        if ev.key() == "Enter" || ev.key() == " " {
                            state.chosen_task.set(Some(index));
                        }
                    }
                >
                    <title>{tooltip}</title>
                    <rect class="hit" x={m.x - HIT / 2.0} y={TOP - 8.0 - HIT} width=HIT height=HIT />
                    <line x1=m.x x2=m.x y1={TOP - 10.0} y2={bottom} />
                    <circle cx=m.x cy={TOP - 40.0} r="13" />
                    <text x=m.x y={TOP - 35.0} text-anchor="middle">{(index + 1).to_string()}</text>
                </g>
            }
        })
        .collect_view();
    view! {
        <h3 class="range-heading">"Range of clear vision"</h3>
        <figure class="range-chart">
            <svg
                viewBox=format!("0 0 {WIDTH} {height}")
                role="img"
                aria-labelledby="range-chart-caption"
                data-testid="range-chart"
            >
                {ticks}
                {bands}
                {marks}
            </svg>
            <figcaption id="range-chart-caption">
                {format!("#{} {}: ", option.rank, option.option.label)}
                "range of clear vision at the point of the lens where each task is seen, on a dioptric scale (equal steps are equal changes of focus). "
                <span class="key key-focus">"Light: in focus with full effort."</span>
                " "
                <span class="key key-comfort">"Dark: comfortable for sustained work."</span>
                " Dots: each task's own distance, marked by its focus verdict. Numbered lines: the tasks."
            </figcaption>
        </figure>
    }
}
