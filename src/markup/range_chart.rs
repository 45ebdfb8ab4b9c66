//! The range chart: for the option shown, one row per task with the
//! distances in focus (light band) and comfortable (dark band) through the
//! power at the point where that task is seen, on a dioptric distance
//! axis, and the task's own distance as a dot on its row; every task is
//! also marked by its number above, a mark that opens the task's detail
//! (`data-mark`). Hovering shows the numbers. All geometry comes from
//! `chart`; this writes the figure's marks, each grid line, row and marker
//! apart, so the app replaces only the marks whose text changed. The marks
//! are placed from the top of the first row, and the whole figure is moved
//! down by the height the markers' lanes take (`shift`): a task whose
//! marker changes lane then rewrites its own marker, not every row.

use super::html::{number, Html};
use super::marks::{verdict_mark, Mark};
use super::reuse::reused;
use crate::chart::coord::Coord;
use crate::chart::range_rows::{
    axis_for, range_rows, row_label, task_markers, RangeRow, Span, TaskMarker, MARKER_SPACING,
};
use crate::core::units::Metres;
use crate::display::{trim_number, LengthUnit};
use crate::plan::{OptionPlan, Plan};

/// Width of the chart, in SVG units.
const WIDTH: f64 = 820.0;
/// Where the task labels end (right-aligned), in SVG units.
const LABEL_END: f64 = 250.0;
/// Where the dioptric axis starts (the nearest distance) and ends (the
/// farthest), in SVG units.
const X_NEAR: f64 = 270.0;
const X_FAR: f64 = 800.0;
/// Top of the first row when every task marker fits on one lane.
const TOP: f64 = 70.0;
/// Where a marker on the first lane sits, from the top of the first row.
const MARKER_Y: f64 = -40.0;
/// Side of the square that takes a tap on a task marker, in SVG units: about
/// 44 px or more at the widths the chart is drawn (touch-target size, WCAG 2.5.5).
const HIT: f64 = 76.0;
/// Height of one task's row, in SVG units.
const ROW: f64 = 26.0;

/// An SVG coordinate rounded to a tenth (below a pixel at every width the
/// chart is drawn), moved by `offset`, as written.
fn at(value: f64, offset: f64) -> String {
    Coord::of(value).moved(offset).written()
}

/// A band of a row whose top edge is at `y`, inset by `inset` above and below.
fn band(html: &mut Html, class: &str, span: Option<Span>, y: f64, inset: f64) {
    if let Some(s) = span {
        html.shape(
            "rect",
            &[
                ("class", class),
                ("x", &at(s.x_near, 0.0)),
                ("y", &at(y, inset)),
                ("width", &at((s.x_far - s.x_near).max(1.0), 0.0)),
                ("height", &number(ROW - 2.0 * inset)),
            ],
        );
    }
}

/// The marks of row `i` (its label, bands and distance dot), written from `r`.
fn row_text(i: usize, r: &RangeRow) -> String {
    let y = i as f64 * ROW;
    let (symbol, class, _) = verdict_mark(r.focus);
    let (x, text_y) = (at(r.x_task, 0.0), at(y, ROW / 2.0 + 4.0));
    let mut html = Html::new();
    html.open("g", &[("class", "range-row")])
        .element(
            "title",
            &[],
            &format!(
                "{}. {} · {} {:+.2}: {}, {}",
                r.index + 1,
                r.task,
                r.zone,
                r.addition_d,
                r.words,
                r.focus
            ),
        )
        .element(
            "text",
            &[
                ("class", "row-label"),
                ("x", &number(LABEL_END)),
                ("y", &text_y),
                ("text-anchor", "end"),
            ],
            &row_label(r, LABEL_END - 4.0),
        );
    band(&mut html, "band-focus", r.in_focus, y, 5.0);
    band(&mut html, "band-comfort", r.comfortable, y, 9.0);
    html.shape(
        "circle",
        &[
            ("class", &format!("task-dot {class}")),
            ("cx", &x),
            ("cy", &at(y, ROW / 2.0)),
            ("r", "6"),
        ],
    )
    .element(
        "text",
        &[
            ("class", "dot-symbol"),
            ("x", &x),
            ("y", &text_y),
            ("text-anchor", "middle"),
            ("aria-hidden", "true"),
        ],
        symbol,
    )
    .close("g");
    html.finish()
}

/// The marker of `m` written for its place: the rows' `bottom` its line
/// reaches, the `unit` of its label and whether its detail is open.
fn marker_text(m: &TaskMarker, place: &MarkerPlace) -> String {
    let MarkerPlace {
        unit,
        expanded,
        bottom,
    } = *place;
    let label = format!(
        "{}. {} at {} {}",
        m.index + 1,
        m.name,
        trim_number(unit.from_metres(Metres(m.distance_m)), 0),
        unit.symbol()
    );
    let y = MARKER_Y - m.lane as f64 * MARKER_SPACING;
    let x = at(m.x, 0.0);
    let mut html = Html::new();
    html.open(
        "g",
        &[
            ("class", "task-marker"),
            ("tabindex", "0"),
            ("role", "button"),
            ("aria-label", &label),
            ("aria-haspopup", "dialog"),
            ("aria-expanded", expanded),
            ("data-mark", &Mark::Marker.id(m.index)),
        ],
    )
    .element("title", &[], &label)
    .shape(
        "rect",
        &[
            ("class", "hit"),
            ("x", &at(m.x, -HIT / 2.0)),
            ("y", &at(y, -HIT / 2.0 - 6.0)),
            ("width", &number(HIT)),
            ("height", &number(HIT)),
        ],
    )
    .shape(
        "line",
        &[
            ("x1", &x),
            ("x2", &x),
            ("y1", &at(y, 13.0)),
            ("y2", &at(bottom, 0.0)),
        ],
    )
    .shape("circle", &[("cx", &x), ("cy", &at(y, 0.0)), ("r", "13")])
    .element(
        "text",
        &[("x", &x), ("y", &at(y, 5.0)), ("text-anchor", "middle")],
        &(m.index + 1).to_string(),
    )
    .close("g");
    html.finish()
}

/// What a marker is written for besides the task's place: the unit of
/// its label, its `aria-expanded` value and the rows' bottom its line
/// reaches.
#[derive(Debug, Clone, Copy, PartialEq)]
struct MarkerPlace {
    unit: LengthUnit,
    expanded: &'static str,
    bottom: f64,
}

/// What the rows and markers of a chart were written from, so that the
/// next chart writes again only those whose inputs changed.
#[derive(Debug, Clone, PartialEq, Default)]
struct WrittenFrom {
    rows: Vec<RangeRow>,
    markers: Vec<(TaskMarker, MarkerPlace)>,
}

/// The range chart's marks as SVG text and its caption as HTML text.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct RangeChartMarks {
    /// The SVG's `viewBox`: its width and its height for the rows drawn.
    pub view_box: String,
    /// The `transform` that moves every mark down to the first row's top,
    /// below the markers' lanes.
    pub shift: String,
    /// One grid line with its distance label per tick of the axis.
    pub ticks: Vec<String>,
    /// One group per task: its label, bands and distance dot.
    pub rows: Vec<String>,
    /// One numbered marker per task, the mark that opens its detail.
    pub markers: Vec<String>,
    /// The figure's caption: the option drawn and how to read the chart.
    pub caption: String,
    /// What the rows and markers were written from.
    written_from: WrittenFrom,
}

/// The chart of `option` (one of `plan`'s options) with distances in
/// `unit`, the marker of the task at input index `open` (whose detail is
/// shown, if any) expanded; the rows and markers written from the same
/// inputs as in the chart `before` are taken from it as they are.
pub fn range_chart(
    plan: &Plan,
    option: &OptionPlan,
    unit: LengthUnit,
    open: Option<usize>,
    before: Option<&RangeChartMarks>,
) -> RangeChartMarks {
    let axis = axis_for(plan, X_NEAR, X_FAR);
    let rows = range_rows(plan, option, &axis);
    let markers = task_markers(plan, &axis);
    let lanes = markers.iter().map(|m| m.lane).max().unwrap_or(0);
    let top = TOP + lanes as f64 * MARKER_SPACING;
    // Every mark is placed from the first row's top (y = 0).
    let bottom = rows.len() as f64 * ROW;
    let ticks = axis
        .ticks(unit)
        .iter()
        .map(|tick| {
            let x = at(tick.x, 0.0);
            let mut html = Html::new();
            html.shape(
                "line",
                &[
                    ("class", "grid"),
                    ("x1", &x),
                    ("x2", &x),
                    ("y1", &number(-4.0)),
                    ("y2", &at(bottom, 0.0)),
                ],
            )
            .element(
                "text",
                &[
                    ("class", "tick"),
                    ("x", &x),
                    ("y", &at(bottom, 18.0)),
                    ("text-anchor", "middle"),
                ],
                &tick.label,
            );
            html.finish()
        })
        .collect();
    let rows_text = rows
        .iter()
        .enumerate()
        .map(|(i, r)| {
            reused(
                before.map(|b| (&b.written_from.rows[..], &b.rows[..])),
                i,
                r,
                || row_text(i, r),
            )
        })
        .collect();
    let marker_places: Vec<(TaskMarker, MarkerPlace)> = markers
        .into_iter()
        .map(|m| {
            let expanded = Mark::expanded(m.index, open);
            (
                m,
                MarkerPlace {
                    unit,
                    expanded,
                    bottom,
                },
            )
        })
        .collect();
    let markers = marker_places
        .iter()
        .enumerate()
        .map(|(i, input)| {
            reused(
                before.map(|b| (&b.written_from.markers[..], &b.markers[..])),
                i,
                input,
                || marker_text(&input.0, &input.1),
            )
        })
        .collect();
    let mut caption = Html::new();
    caption
        .text(&format!("#{} {}: ", option.rank, option.option.label))
        .text("range of clear vision at the point of the lens where each task is seen, on a dioptric scale (equal steps are equal changes of focus). ")
        .element("span", &[("class", "key key-focus")], "Light: in focus with full effort.")
        .text(" ")
        .element("span", &[("class", "key key-comfort")], "Dark: comfortable for sustained work.")
        .text(" Dots: each task's own distance, marked by its focus verdict. Numbered lines: the tasks.");
    RangeChartMarks {
        view_box: format!("0 0 {WIDTH} {}", at(top + bottom, 36.0)),
        shift: format!("translate(0 {})", number(top)),
        ticks,
        rows: rows_text,
        markers,
        caption: caption.finish(),
        written_from: WrittenFrom {
            rows,
            markers: marker_places,
        },
    }
}
