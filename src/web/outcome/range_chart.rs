//! The range chart: for the option shown (the one chosen in the comparison,
//! the best by default), one row per task with the distances in focus
//! (light band) and comfortable (dark band) through the power at the point
//! where that task is seen, on a dioptric distance axis, and the task's own
//! distance as a dot on its row; every task is also marked by its number
//! above. Hovering shows the numbers; choosing a task marker opens the
//! task's detail beside it. All geometry comes from `chart`.

use super::detail::{use_task_detail, Mark};
use super::marks::verdict_mark;
use crate::chart::coord::Coord;
use crate::chart::range_rows::{
    axis_for, range_rows, row_label, task_markers, Span, MARKER_SPACING,
};
use crate::core::units::Metres;
use crate::display::{trim_number, LengthUnit};
use crate::plan::{OptionPlan, Plan};
use crate::web::state::use_app_state;
use leptos::prelude::*;

const WIDTH: f64 = 820.0;
const LABEL_END: f64 = 250.0;
const X_NEAR: f64 = 270.0;
const X_FAR: f64 = 800.0;
/// Top of the first row when every task marker fits on one lane.
const TOP: f64 = 70.0;
/// Side of the square that takes a tap on a task marker, in SVG units: about
/// 44 px or more at the widths the chart is drawn (touch-target size, WCAG 2.5.5).
const HIT: f64 = 76.0;
const ROW: f64 = 26.0;

/// A grid line with its distance label, as drawn.
#[derive(Clone, PartialEq, Eq, Hash)]
struct TickMark {
    x: Coord,
    label: String,
}

/// A band as drawn: its left edge and width, in SVG units.
#[derive(Clone, PartialEq, Eq, Hash)]
struct BandMark {
    x: Coord,
    width: Coord,
}

/// One task's row as drawn; `y` is the row's top edge.
#[derive(Clone, PartialEq, Eq, Hash)]
struct RowMark {
    y: Coord,
    label: String,
    tooltip: String,
    symbol: &'static str,
    class: &'static str,
    in_focus: Option<BandMark>,
    comfortable: Option<BandMark>,
    x_task: Coord,
}

/// A numbered task marker above the rows, as drawn; `y` is its centre.
#[derive(Clone, PartialEq, Eq, Hash)]
struct TaskMark {
    index: usize,
    x: Coord,
    y: Coord,
    label: String,
}

/// The whole chart as drawn, for the option the plan shows.
#[derive(Clone, PartialEq, Default)]
struct Drawing {
    caption: String,
    height: Coord,
    top: Coord,
    bottom: Coord,
    ticks: Vec<TickMark>,
    rows: Vec<RowMark>,
    markers: Vec<TaskMark>,
}

fn band(span: Option<Span>) -> Option<BandMark> {
    span.map(|s| BandMark {
        x: Coord::of(s.x_near),
        width: Coord::of((s.x_far - s.x_near).max(1.0)),
    })
}

/// The chart of `option` (one of `plan`'s options) with distances in `unit`.
fn drawing(plan: &Plan, option: &OptionPlan, unit: LengthUnit) -> Drawing {
    let axis = axis_for(plan, X_NEAR, X_FAR);
    let rows = range_rows(plan, option, &axis);
    let markers = task_markers(plan, &axis);
    let lanes = markers.iter().map(|m| m.lane).max().unwrap_or(0);
    let top = TOP + lanes as f64 * MARKER_SPACING;
    let bottom = top + rows.len() as f64 * ROW;
    let ticks = axis
        .ticks(unit)
        .into_iter()
        .map(|t| TickMark {
            x: Coord::of(t.x),
            label: t.label,
        })
        .collect();
    let rows = rows
        .into_iter()
        .enumerate()
        .map(|(i, r)| {
            let y = top + i as f64 * ROW;
            let (symbol, class, _) = verdict_mark(r.focus);
            RowMark {
                y: Coord::of(y),
                tooltip: format!(
                    "{}. {} · {} {:+.2}: {}, {}",
                    r.index + 1,
                    r.task,
                    r.zone,
                    r.addition_d,
                    r.words,
                    r.focus
                ),
                label: row_label(&r, LABEL_END - 4.0),
                symbol,
                class,
                in_focus: band(r.in_focus),
                comfortable: band(r.comfortable),
                x_task: Coord::of(r.x_task),
            }
        })
        .collect();
    let markers = markers
        .into_iter()
        .map(|m| TaskMark {
            index: m.index,
            x: Coord::of(m.x),
            y: Coord::of(top - 40.0 - m.lane as f64 * MARKER_SPACING),
            label: format!(
                "{}. {} at {} {}",
                m.index + 1,
                m.name,
                trim_number(unit.from_metres(Metres(m.distance_m)), 0),
                unit.symbol()
            ),
        })
        .collect();
    Drawing {
        caption: format!("#{} {}: ", option.rank, option.option.label),
        height: Coord::of(bottom + 36.0),
        top: Coord::of(top),
        bottom: Coord::of(bottom),
        ticks,
        rows,
        markers,
    }
}

/// The range chart of the option the plan shows.
#[component]
pub fn RangeChart() -> impl IntoView {
    let state = use_app_state();
    let shown = Memo::new(move |_| {
        let unit = state.unit.get();
        state.outcome.with(|o| {
            o.plan
                .as_ref()
                .and_then(|p| super::shown_option(p).map(|option| drawing(p, option, unit)))
                .unwrap_or_default()
        })
    });
    let top = move |offset: f64| shown.with(|d| d.top.plus(offset));
    let bottom = move |offset: f64| shown.with(|d| d.bottom.plus(offset));
    let tick = move |t: TickMark| {
        let x = t.x.get();
        view! {
            <line class="grid" x1=x x2=x y1=move || top(-4.0) y2=move || bottom(0.0) />
            <text class="tick" x=x y=move || bottom(18.0) text-anchor="middle">{t.label}</text>
        }
    };
    let row = |r: RowMark| {
        let focus = r.in_focus.map(|b| view! {
            <rect class="band-focus" x=b.x.get() y=r.y.plus(5.0) width=b.width.get() height={ROW - 10.0} />
        });
        let comfort = r.comfortable.map(|b| view! {
            <rect class="band-comfort" x=b.x.get() y=r.y.plus(9.0) width=b.width.get() height={ROW - 18.0} />
        });
        let (x, text_y) = (r.x_task.get(), r.y.plus(ROW / 2.0 + 4.0));
        view! {
            <g class="range-row">
                <title>{r.tooltip}</title>
                <text class="row-label" x=LABEL_END y=text_y text-anchor="end">{r.label}</text>
                {focus}
                {comfort}
                <circle class=format!("task-dot {}", r.class) cx=x cy=r.y.plus(ROW / 2.0) r="6" />
                <text class="dot-symbol" x=x y=text_y text-anchor="middle" aria-hidden="true">{r.symbol}</text>
            </g>
        }
    };
    let detail = use_task_detail();
    let marker = move |m: TaskMark| {
        let index = m.index;
        let name = m.label.clone();
        view! {
            <g
                class="task-marker"
                tabindex="0"
                role="button"
                aria-label=name
                aria-haspopup="dialog"
                aria-expanded=move || detail.is_open_for(index).to_string()
                data-mark=Mark::Marker.id(index)
                on:click=move |_| detail.open(Mark::Marker, index)
                on:keydown=detail.on_key(Mark::Marker, index)
            >
                <title>{m.label}</title>
                <rect class="hit" x=m.x.plus(-HIT / 2.0) y=m.y.plus(-HIT / 2.0 - 6.0) width=HIT height=HIT />
                <line x1=m.x.get() x2=m.x.get() y1=m.y.plus(13.0) y2=move || bottom(0.0) />
                <circle cx=m.x.get() cy=m.y.get() r="13" />
                <text x=m.x.get() y=m.y.plus(5.0) text-anchor="middle">{(index + 1).to_string()}</text>
            </g>
        }
    };
    view! {
        <h3 class="range-heading">"Range of clear vision"</h3>
        <figure class="range-chart">
            <svg
                viewBox=move || shown.with(|d| format!("0 0 {WIDTH} {}", d.height.get()))
                role="img"
                aria-labelledby="range-chart-caption"
                data-testid="range-chart"
            >
                <For each=move || shown.with(|d| d.ticks.clone()) key=TickMark::clone children=tick />
                <For each=move || shown.with(|d| d.rows.clone()) key=RowMark::clone children=row />
                <For each=move || shown.with(|d| d.markers.clone()) key=TaskMark::clone children=marker />
            </svg>
            <figcaption id="range-chart-caption">
                {move || shown.with(|d| d.caption.clone())}
                "range of clear vision at the point of the lens where each task is seen, on a dioptric scale (equal steps are equal changes of focus). "
                <span class="key key-focus">"Light: in focus with full effort."</span>
                " "
                <span class="key key-comfort">"Dark: comfortable for sustained work."</span>
                " Dots: each task's own distance, marked by its focus verdict. Numbered lines: the tasks."
            </figcaption>
        </figure>
    }
}
