//! The rows of the range chart: for one lens option, one row per task with
//! the in-focus and comfortable bands of the power at the point of the lens
//! where that task is seen (the very ranges its verdict is decided by) and
//! the task's own distance on the row; and a marker for every task at its
//! distance.

use super::dioptric_axis::DioptricAxis;
use crate::plan::{FarLimit, OptionPlan, Plan, Verdict, ZoneKind, ZoneRange};

/// A horizontal extent on the chart, in SVG x units, near end first.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Span {
    /// SVG x of the near limit.
    pub x_near: f64,
    /// SVG x of the far limit.
    pub x_far: f64,
}

/// One row of the chart: one task seen through one option.
#[derive(Debug, Clone, PartialEq)]
pub struct RangeRow {
    /// The task's position in the scenario (0-based).
    pub index: usize,
    /// The task's name.
    pub task: String,
    /// The zone of the lens point where the task is seen.
    pub zone: ZoneKind,
    /// The addition at that point, in dioptres.
    pub addition_d: f64,
    /// SVG x of the task's distance.
    pub x_task: f64,
    /// The task's focus verdict there.
    pub focus: Verdict,
    /// Distances in focus with the full amplitude; `None` when nothing is.
    pub in_focus: Option<Span>,
    /// Distances comfortable for sustained work; `None` when nothing is.
    pub comfortable: Option<Span>,
    /// The ranges in words, for the tooltip and the table ("31 cm to infinity").
    pub words: String,
}

/// A task's place on the chart.
#[derive(Debug, Clone, PartialEq)]
pub struct TaskMarker {
    /// The task's position in the scenario (0-based); the chart labels it `index + 1`.
    pub index: usize,
    /// The task's name.
    pub name: String,
    /// SVG x of the task distance.
    pub x: f64,
    /// The task distance, in metres.
    pub distance_m: f64,
    /// The marker's lane above the rows, 0 nearest: markers closer than
    /// [`MARKER_SPACING`] to one on a lower lane move up a lane, so none
    /// covers another.
    pub lane: usize,
}

/// The least distance between the centres of two markers on one lane, in
/// SVG units: a marker's diameter and a little air.
pub const MARKER_SPACING: f64 = 30.0;

/// Lanes for markers at `xs` (SVG x, any order): each marker takes the
/// lowest lane whose markers all stand at least [`MARKER_SPACING`] away.
fn lanes(xs: &[f64]) -> Vec<usize> {
    let mut order: Vec<usize> = (0..xs.len()).collect();
    order.sort_by(|&a, &b| xs[a].total_cmp(&xs[b]));
    // The x of the last marker placed on each lane, left to right.
    let mut last: Vec<f64> = Vec::new();
    let mut lane_of = vec![0; xs.len()];
    for i in order {
        let lane = last
            .iter()
            .position(|&x| xs[i] - x >= MARKER_SPACING)
            .unwrap_or(last.len());
        if lane == last.len() {
            last.push(xs[i]);
        } else {
            last[lane] = xs[i];
        }
        lane_of[i] = lane;
    }
    lane_of
}

fn span(range: &ZoneRange, axis: &DioptricAxis) -> Option<Span> {
    match range {
        ZoneRange::Clear { near, far } => Some(Span {
            x_near: axis.x_of_distance(Some(near.0)),
            x_far: axis.x_of_distance(match far {
                FarLimit::Finite(m) => Some(m.0),
                FarLimit::Infinite => None,
            }),
        }),
        ZoneRange::NeedsMorePlus | ZoneRange::NeedsLessPlus => None,
    }
}

/// Every task of `option` (a plan of `plan`), in task order, with the
/// ranges at its lens point placed on `axis`.
pub fn range_rows(plan: &Plan, option: &OptionPlan, axis: &DioptricAxis) -> Vec<RangeRow> {
    option
        .tasks
        .iter()
        .map(|t| {
            let r = &t.range_here;
            let distance = plan.tasks.get(t.task.index).map(|c| c.distance.0);
            RangeRow {
                index: t.task.index,
                task: t.task.name.clone(),
                zone: t.zone,
                addition_d: r.addition.0,
                x_task: axis.x_of_distance(distance),
                focus: t.focus,
                in_focus: span(&r.in_focus, axis),
                comfortable: span(&r.comfortable, axis),
                words: format!("comfortable {}; in focus {}", r.comfortable, r.in_focus),
            }
        })
        .collect()
}

/// A marker for every task of `plan`, in task order, placed on `axis`.
pub fn task_markers(plan: &Plan, axis: &DioptricAxis) -> Vec<TaskMarker> {
    let xs: Vec<f64> = plan
        .tasks
        .iter()
        .map(|t| axis.x_of_distance(Some(t.distance.0)))
        .collect();
    plan.tasks
        .iter()
        .zip(xs.iter().zip(lanes(&xs)))
        .map(|(t, (&x, lane))| TaskMarker {
            index: t.task.index,
            name: t.task.name.clone(),
            x,
            distance_m: t.distance.0,
            lane,
        })
        .collect()
}

/// Width of one character of a row label, in SVG units, for the chart's
/// 12-unit sans-serif type: about 0.6 of the size, wider than the average
/// letter so that a label estimated to fit does fit.
const CHAR_WIDTH: f64 = 7.2;

/// A row's label, "n. task · zone +a.aa", that fits in `width` SVG units:
/// the task name is shortened with an ellipsis when the whole would not
/// fit (the row's tooltip keeps the full name).
pub fn row_label(row: &RangeRow, width: f64) -> String {
    let whole = |name: &str| {
        format!(
            "{}. {name} · {} {:+.2}",
            row.index + 1,
            row.zone,
            row.addition_d
        )
    };
    let fits = |text: &str| text.chars().count() as f64 * CHAR_WIDTH <= width;
    let label = whole(&row.task);
    if fits(&label) {
        return label;
    }
    let spare = (width / CHAR_WIDTH) as usize;
    let used = whole("").chars().count() + 1;
    let keep = spare.saturating_sub(used);
    let short: String = row.task.chars().take(keep).collect();
    whole(&format!("{}…", short.trim_end()))
}

/// The axis that shows every task of `plan` between `x_near` and `x_far`.
pub fn axis_for(plan: &Plan, x_near: f64, x_far: f64) -> DioptricAxis {
    let closest = plan
        .tasks
        .iter()
        .map(|t| t.distance.0)
        .fold(f64::INFINITY, f64::min);
    DioptricAxis::covering(closest, x_near, x_far)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::core::units::Metres;

    fn row(task: &str) -> RangeRow {
        RangeRow {
            index: 1,
            task: task.to_string(),
            zone: ZoneKind::Near,
            addition_d: 1.5,
            x_task: 0.0,
            focus: Verdict::Comfortable,
            in_focus: None,
            comfortable: None,
            words: String::new(),
        }
    }

    #[test]
    fn markers_too_close_take_separate_lanes() {
        // 67 cm and 70 cm sit a few units apart: the second goes up a lane;
        // a marker far from both comes back to the lowest lane.
        assert_eq!(lanes(&[100.0, 110.0, 300.0]), vec![0, 1, 0]);
        assert_eq!(lanes(&[110.0, 100.0, 105.0]), vec![2, 0, 1]);
        assert_eq!(lanes(&[0.0, 30.0, 60.0]), vec![0, 0, 0]);
        assert!(lanes(&[]).is_empty());
    }

    #[test]
    fn long_task_names_are_shortened_to_fit_the_label_column() {
        let short = row_label(&row("Phone"), 250.0);
        assert!(
            short.starts_with("2. Phone · ") && short.ends_with(" +1.50"),
            "{short}"
        );
        let long = row_label(&row("Second monitor, to the right of the keyboard"), 250.0);
        assert!(long.chars().count() as f64 * CHAR_WIDTH <= 250.0, "{long}");
        assert!(
            long.starts_with("2. Second monitor") && long.contains("… · "),
            "{long}"
        );
        assert!(long.ends_with(" +1.50"), "{long}");
    }

    fn axis() -> DioptricAxis {
        DioptricAxis {
            max_vergence_d: 4.0,
            x_near: 0.0,
            x_far: 400.0,
        }
    }

    #[test]
    fn a_range_becomes_a_span_by_vergence() {
        // 50 cm is 2 D and infinity 0 D (vergence = 1 / distance): on a 4 D axis
        // 400 units wide they sit at x = 200 and x = 400.
        let clear = ZoneRange::Clear {
            near: Metres(0.5),
            far: FarLimit::Infinite,
        };
        assert_eq!(
            span(&clear, &axis()),
            Some(Span {
                x_near: 200.0,
                x_far: 400.0
            })
        );
        let finite = ZoneRange::Clear {
            near: Metres(0.25),
            far: FarLimit::Finite(Metres(1.0)),
        };
        assert_eq!(
            span(&finite, &axis()),
            Some(Span {
                x_near: 0.0,
                x_far: 300.0
            })
        );
        assert_eq!(span(&ZoneRange::NeedsMorePlus, &axis()), None);
    }

    #[test]
    fn rows_and_markers_follow_a_real_plan() {
        let text = crate::library::DEMO_FILES[0].text;
        let batch = crate::library::parse_import(text).expect("demo reads");
        let scenario = batch.accepted[0].scenario.clone();
        let plan = crate::plan::plan(&crate::scenario::validate(scenario).expect("demo is valid"))
            .expect("demo plans");
        let axis = axis_for(&plan, 0.0, 400.0);
        let best = &plan.options[0];
        let rows = range_rows(&plan, best, &axis);
        assert_eq!(rows.len(), plan.tasks.len());
        for row in &rows {
            for s in [row.in_focus, row.comfortable].into_iter().flatten() {
                assert!(s.x_near <= s.x_far, "near end left of far end: {row:?}");
            }
            // A comfortable task's distance lies on its own comfortable band.
            if row.focus == Verdict::Comfortable {
                let s = row.comfortable.expect("a comfortable task has a band");
                assert!(s.x_near - 1e-6 <= row.x_task && row.x_task <= s.x_far + 1e-6);
            }
        }
        let markers = task_markers(&plan, &axis);
        assert_eq!(markers.len(), plan.tasks.len());
        assert!(markers.iter().all(|m| (0.0..=400.0).contains(&m.x)));
    }
}
