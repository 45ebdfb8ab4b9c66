//! Benchmark of the full plan, solver included: a fictional 20-task working
//! day with all six lens families and every family parameter left open to
//! the planner. The browser re-plans on every keystroke; the goal is under
//! 1 ms natively.

use clearspan::plan::context::Context;
use clearspan::plan::plan;
use clearspan::plan::solver::solve;
use clearspan::scenario::*;
use criterion::{black_box, criterion_main, Criterion};

fn task(i: usize) -> Task {
    let f = i as f64;
    Task {
        name: format!("task {i}"),
        distance_m: 0.3 + 0.15 * f,
        vertical: if i % 2 == 0 {
            VerticalPosition::GazeAngle {
                degrees: -30.0 + 2.5 * f,
            }
        } else {
            VerticalPosition::HeightFromEyes {
                metres: -0.2 + 0.02 * f,
            }
        },
        sideways_m: 0.01 * (f - 10.0),
        width_m: 0.1 + 0.02 * f,
        detail_mm: 0.3 + 0.1 * f,
        hours_per_day: 0.4,
        flags: TaskFlags {
            driving: i == 19,
            overhead: i == 18,
            moving_machinery: false,
            screen: false,
            hazards: Hazards {
                impact: i == 17,
                ..Hazards::default()
            },
        },
    }
}

/// A fictional wearer of 52 with a small astigmatism, and 20 tasks.
fn scenario() -> ValidScenario {
    let open = |label: &str, family| LensOption {
        label: label.to_string(),
        family,
    };
    let s = Scenario {
        name: "Benchmark: fictional 20-task day".to_string(),
        settings: PlanSettings::default(),
        wearer: Wearer {
            age_years: 52.0,
            measured_amplitude: None,
            right: Prescription {
                sphere_d: -1.25,
                cylinder_d: -0.5,
                axis_deg: 170.0,
                prism: Default::default(),
            },
            left: Prescription {
                sphere_d: -1.0,
                cylinder_d: -0.25,
                axis_deg: 10.0,
                prism: Default::default(),
            },
            prescribed_addition_d: Some(1.75),
            correction: Correction::Spectacles { vertex_mm: 13.0 },
            pd_right_mm: 32.0,
            pd_left_mm: 31.0,
            fitting_height_mm: 22.0,
            lens_height_mm: 36.0,
            pantoscopic_tilt_deg: 8.0,
            pupil: PupilSource::FromLighting {
                luminance_cd_m2: 250.0,
            },
            usable_fraction: 0.5,
            blur_tolerance: BlurTolerance::FromDetail,
        },
        tasks: (0..20).map(task).collect(),
        options: vec![
            open("sv", FamilyChoice::SingleVision { addition_d: None }),
            open(
                "bifocal",
                FamilyChoice::Bifocal {
                    addition_d: None,
                    segment_top_mm: None,
                },
            ),
            open(
                "trifocal",
                FamilyChoice::Trifocal {
                    addition_d: None,
                    intermediate_ratio: None,
                    segment_top_mm: None,
                },
            ),
            open(
                "progressive",
                FamilyChoice::Progressive {
                    addition_d: None,
                    progression_length_mm: None,
                },
            ),
            open(
                "degressive",
                FamilyChoice::Degressive {
                    near_addition_d: None,
                    degression_d: None,
                },
            ),
            open(
                "double segment",
                FamilyChoice::DoubleSegment {
                    addition_d: None,
                    lower_top_mm: None,
                    upper_bottom_mm: None,
                },
            ),
        ],
        chosen_option: None,
        current_glasses: None,
    };
    match validate(s) {
        Ok(v) => v,
        Err(errors) => panic!("benchmark scenario is invalid: {errors:?}"),
    }
}

fn bench(c: &mut Criterion) {
    let valid = scenario();
    c.bench_function("plan: 20 tasks, six families, all parameters open", |b| {
        b.iter(|| plan(black_box(&valid)))
    });
    // The parts, to see where the time goes: the per-scenario preparation,
    // and the solver alone for each family.
    c.bench_function("plan part: context", |b| {
        b.iter(|| Context::new(black_box(&valid)))
    });
    let Ok(ctx) = Context::new(&valid) else {
        return;
    };
    for o in &valid.get().options {
        c.bench_function(&format!("plan part: solve {}", o.label), |b| {
            b.iter(|| solve(black_box(&o.family), &ctx.tasks, ctx.extent))
        });
    }
}

/// The benchmark group (a module, so its generated function carries documentation).
mod group {
    criterion::criterion_group!(benches, super::bench);
}

criterion_main!(group::benches);
