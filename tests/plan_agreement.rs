//! One model decides both the verdicts and the drawn ranges: for every task
//! of every option of every demo, the focus verdict is comfortable exactly
//! when the task's distance lies in the comfortable range of the power at
//! its lens point (the range the chart draws), and in focus exactly when
//! it lies in the in-focus range. The numbers are the planner's own; the
//! check is that two routes through them (the addition bands the solver
//! compares and the ranges of clear vision the report solves) agree.

use clearspan::library::{parse_import, DEMO_FILES};
use clearspan::plan::*;
use clearspan::scenario::validate;

/// Whether `distance` (metres) lies in `range`, and how close it is to an
/// end (a relative margin, to tell rounding at an exact edge from a real
/// disagreement).
fn inside(range: &ClearRange, distance: f64) -> (bool, f64) {
    match range {
        ClearRange::Clear { near, far } => {
            let far = match far {
                FarEnd::Finite(m) => m.0,
                FarEnd::Infinite => f64::INFINITY,
            };
            let inside = distance >= near.0 && distance <= far;
            let to_edge = ((distance - near.0) / distance)
                .abs()
                .min(((far - distance) / distance).abs());
            (inside, to_edge)
        }
        ClearRange::NeedsMorePlus | ClearRange::NeedsLessPlus => (false, f64::INFINITY),
    }
}

#[test]
fn verdicts_agree_with_the_ranges_drawn_for_every_demo() {
    let mut checked = 0;
    for demo in DEMO_FILES {
        let batch = parse_import(demo.text).expect("demo reads");
        for item in batch.accepted {
            let plan = plan(&validate(item.scenario).expect("demo is valid")).expect("demo plans");
            for o in &plan.options {
                for t in o.tasks.iter().filter(|t| t.posture.reachable) {
                    let distance = plan.tasks[t.task.index].distance.0;
                    for (range, expected, what) in [
                        (
                            &t.range_here.comfortable,
                            t.focus == Verdict::Comfortable,
                            "comfortable",
                        ),
                        (
                            &t.range_here.in_focus,
                            t.focus >= Verdict::InFocusButTiring,
                            "in focus",
                        ),
                    ] {
                        let (inside, to_edge) = inside(range, distance);
                        assert!(
                            inside == expected || to_edge < 1e-6,
                            "{}: \"{}\" through \"{}\" is {:?} but {distance} m is {} its {what} range {range}",
                            demo.file_name,
                            t.task.name,
                            o.option.label,
                            t.focus,
                            if inside { "inside" } else { "outside" },
                        );
                        checked += 1;
                    }
                }
            }
        }
    }
    assert!(checked > 100, "{checked} checks");
}
