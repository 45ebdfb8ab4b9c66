//! The solver against brute force: for every family with every parameter
//! open, the design the solver picks must score as well as the best of all
//! designs the lens catalogue's own candidate iterator yields over the same
//! grids; and the solver's fast verdicts (from precomputed addition bands)
//! must agree with the optics core's direct task evaluation in the report.

mod plan_support;

use clearspan::core::lens::Candidates;
use clearspan::plan::context::Context;
use clearspan::plan::objective::score;
use clearspan::plan::solver::solve;
use clearspan::plan::*;
use clearspan::scenario::*;
use plan_support::*;

fn day() -> Vec<Task> {
    let mut wide = task("wide drawing", 0.7, -15.0, 2.0);
    wide.width_m = 0.8;
    let mut side = task("side screen", 0.8, -5.0, 1.5);
    side.sideways_m = 0.35;
    vec![
        task("monitor", 0.65, -10.0, 3.0),
        task("papers", 0.38, -32.0, 1.5),
        task("shelf overhead", 0.5, 25.0, 0.5),
        task("room", 5.0, 0.0, 1.0),
        wide,
        side,
    ]
}

fn valid(w: Wearer) -> ValidScenario {
    validate(Scenario {
        name: "brute force".to_string(),
        settings: PlanSettings::default(),
        wearer: w,
        tasks: day(),
        options: all_families_open(),
        chosen_option: None,
        current_glasses: None,
    })
    .unwrap_or_else(|e| panic!("{e:?}"))
}

fn wearers() -> Vec<Wearer> {
    let mut myope = wearer(1.2, 0.3);
    myope.right = rx(-4.5);
    myope.left = rx(-4.0);
    myope.correction = Correction::Spectacles { vertex_mm: 13.0 };
    myope.blur_tolerance = BlurTolerance::FromDetail;
    let mut older = wearer(0.0, 0.25);
    older.measured_amplitude = None;
    older.age_years = 66.0;
    older.right = rx(2.0);
    older.left = rx(2.25);
    vec![wearer(1.0, 0.25), myope, older]
}

#[test]
fn solver_matches_brute_force_over_the_catalogue_candidates() {
    for w in wearers() {
        let v = valid(w);
        let ctx = Context::new(&v).expect("plannable");
        for o in &v.get().options {
            let solved = solve(&o.family, &ctx.tasks, ctx.extent).expect("solvable");
            let brute = Candidates::new(&o.family)
                .expect("valid option")
                .map(|d| score(&d, &ctx.tasks, ctx.extent, None).total)
                .fold(f64::NEG_INFINITY, f64::max);
            assert!(
                (solved.score.total - brute).abs() < 1e-9,
                "{}: solver {} vs brute force {brute}",
                o.label,
                solved.score.total
            );
        }
    }
}

#[test]
fn fast_verdicts_agree_with_the_optics_core() {
    for w in wearers() {
        let p = plan(&valid(w)).expect("plannable");
        for o in &p.options {
            for t in &o.tasks {
                let comfort = t.blur.short_of_comfort.0 == 0.0;
                let focus = t.blur.beyond_tolerance.0 == 0.0;
                let expected = match (comfort, focus) {
                    (true, _) => Verdict::Comfortable,
                    (false, true) => Verdict::InFocusButTiring,
                    (false, false) => Verdict::Blurred,
                };
                // The focus verdict: the verdict itself may be lowered
                // further by the posture or the prism difference.
                assert_eq!(
                    t.focus, expected,
                    "{} / {}: {t:?}",
                    o.option.label, t.task.name
                );
            }
        }
    }
}
