//! The rows of the range chart: for each lens option (best first) and each
//! of its fixed-power zones, the in-focus and comfortable bands placed on the
//! dioptric axis; and a marker for every task at its distance.

use super::dioptric_axis::DioptricAxis;
use crate::plan::{ClearRange, FarEnd, Plan, ZoneKind};

/// A horizontal extent on the chart, in SVG x units, near end first.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Span {
    /// SVG x of the near limit.
    pub x_near: f64,
    /// SVG x of the far limit.
    pub x_far: f64,
}

/// One row of the chart: one zone of one option.
#[derive(Debug, Clone, PartialEq)]
pub struct RangeRow {
    /// The option's rank, 1 for the best.
    pub rank: usize,
    /// The option's label.
    pub option: String,
    /// The zone.
    pub zone: ZoneKind,
    /// The zone's addition, in dioptres.
    pub addition_d: f64,
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
}

fn span(range: &ClearRange, axis: &DioptricAxis) -> Option<Span> {
    match range {
        ClearRange::Clear { near, far } => Some(Span {
            x_near: axis.x_of_distance(Some(near.0)),
            x_far: axis.x_of_distance(match far {
                FarEnd::Finite(m) => Some(m.0),
                FarEnd::Infinite => None,
            }),
        }),
        ClearRange::NeedsMorePlus | ClearRange::NeedsLessPlus => None,
    }
}

/// Every zone of every option of `plan`, best option first, placed on `axis`.
pub fn range_rows(plan: &Plan, axis: &DioptricAxis) -> Vec<RangeRow> {
    plan.options
        .iter()
        .flat_map(|o| {
            o.zones.iter().map(move |z| RangeRow {
                rank: o.rank,
                option: o.option.label.clone(),
                zone: z.zone,
                addition_d: z.addition.0,
                in_focus: span(&z.in_focus, axis),
                comfortable: span(&z.comfortable, axis),
                words: format!("comfortable {}; in focus {}", z.comfortable, z.in_focus),
            })
        })
        .collect()
}

/// A marker for every task of `plan`, in task order, placed on `axis`.
pub fn task_markers(plan: &Plan, axis: &DioptricAxis) -> Vec<TaskMarker> {
    plan.tasks
        .iter()
        .map(|t| TaskMarker {
            index: t.task.index,
            name: t.task.name.clone(),
            x: axis.x_of_distance(Some(t.distance.0)),
            distance_m: t.distance.0,
        })
        .collect()
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
        let clear = ClearRange::Clear {
            near: Metres(0.5),
            far: FarEnd::Infinite,
        };
        assert_eq!(
            span(&clear, &axis()),
            Some(Span {
                x_near: 200.0,
                x_far: 400.0
            })
        );
        let finite = ClearRange::Clear {
            near: Metres(0.25),
            far: FarEnd::Finite(Metres(1.0)),
        };
        assert_eq!(
            span(&finite, &axis()),
            Some(Span {
                x_near: 0.0,
                x_far: 300.0
            })
        );
        assert_eq!(span(&ClearRange::NeedsMorePlus, &axis()), None);
    }

    #[test]
    fn rows_and_markers_follow_a_real_plan() {
        let text = crate::library::DEMO_FILES[0].text;
        let batch = crate::library::parse_import(text).expect("demo reads");
        let scenario = batch.accepted[0].scenario.clone();
        let plan = crate::plan::plan(&crate::scenario::validate(scenario).expect("demo is valid"))
            .expect("demo plans");
        let axis = axis_for(&plan, 0.0, 400.0);
        let rows = range_rows(&plan, &axis);
        let zones: usize = plan.options.iter().map(|o| o.zones.len()).sum();
        assert_eq!(rows.len(), zones);
        assert!(rows.windows(2).all(|w| w[0].rank <= w[1].rank));
        for row in &rows {
            for s in [row.in_focus, row.comfortable].into_iter().flatten() {
                assert!(s.x_near <= s.x_far, "near end left of far end: {row:?}");
            }
        }
        let markers = task_markers(&plan, &axis);
        assert_eq!(markers.len(), plan.tasks.len());
        assert!(markers.iter().all(|m| (0.0..=400.0).contains(&m.x)));
    }
}
