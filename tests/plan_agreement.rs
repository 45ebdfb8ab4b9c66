//! One model decides both the verdicts and the drawn ranges: for every task
//! of every option of every demo, the focus verdict is comfortable exactly
//! when the task's distance lies in the comfortable range of the power at
//! its lens point (the range the chart draws), and in focus exactly when
//! it lies in the in-focus range. The numbers are the planner's own; the
//! check is that two routes through them (the addition bands the solver
//! compares and the ranges of clear vision the report solves) agree.

mod plan_support;

use clearspan::library::{parse_import, DEMO_FILES};
use clearspan::plan::*;
use clearspan::scenario::{validate, BlurTolerance, Correction};
use plan_support::*;
use proptest::prelude::*;

/// Every disagreement between a task's focus verdict and the ranges at its
/// lens point, in words (empty when the plan agrees with itself).
fn disagreements(plan: &Plan) -> Vec<String> {
    let mut out = Vec::new();
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
                if inside != expected && to_edge >= 1e-6 {
                    out.push(format!(
                        "\"{}\" through \"{}\" is {:?} but {distance} m is {} its {what} range {range}",
                        t.task.name,
                        o.option.label,
                        t.focus,
                        if inside { "inside" } else { "outside" },
                    ));
                }
            }
        }
    }
    out
}

/// Whether `distance` (metres) lies in `range`, and how close it is to an
/// end (a relative margin, to tell rounding at an exact edge from a real
/// disagreement).
fn inside(range: &ZoneRange, distance: f64) -> (bool, f64) {
    match range {
        ZoneRange::Clear { near, far } => {
            let far = match far {
                FarLimit::Finite(m) => m.0,
                FarLimit::Infinite => f64::INFINITY,
            };
            let inside = distance >= near.0 && distance <= far;
            let to_edge = ((distance - near.0) / distance)
                .abs()
                .min(((far - distance) / distance).abs());
            (inside, to_edge)
        }
        ZoneRange::NeedsMorePlus | ZoneRange::NeedsLessPlus => (false, f64::INFINITY),
    }
}

#[test]
fn verdicts_agree_with_the_ranges_drawn_for_every_demo() {
    let mut plans = 0;
    for demo in DEMO_FILES {
        let batch = parse_import(demo.text).expect("demo reads");
        for item in batch.accepted {
            let plan = plan(&validate(item.scenario).expect("demo is valid")).expect("demo plans");
            let wrong = disagreements(&plan);
            assert!(wrong.is_empty(), "{}: {wrong:#?}", demo.file_name);
            plans += 1;
        }
    }
    assert_eq!(plans, DEMO_FILES.len());
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(48))]

    #[test]
    fn verdicts_agree_with_the_ranges_drawn_for_random_days(
        amp in 0.0..6.0f64, sphere in -8.0..8.0f64, age in 40.0..80.0f64, by_age in any::<bool>(),
        detail in any::<bool>(), distances in proptest::collection::vec((0.15..20.0f64, -50.0..20.0f64), 1..6),
    ) {
        let mut w = wearer(amp, 0.25);
        w.right = rx(sphere);
        w.left = rx(sphere);
        w.correction = Correction::Spectacles { vertex_mm: 12.0 };
        w.age_years = age;
        if by_age { w.measured_amplitude = None; }
        if detail { w.blur_tolerance = BlurTolerance::FromDetail; }
        let tasks = distances
            .iter()
            .enumerate()
            .map(|(i, (d, gaze))| task(&format!("task {i}"), *d, *gaze, 1.0))
            .collect();
        let p = plan_of(w, tasks, all_families_open());
        let wrong = disagreements(&p);
        prop_assert!(wrong.is_empty(), "{wrong:#?}");
    }
}
