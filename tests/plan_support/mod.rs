//! Builders shared by the planner's scenario tests: a plain wearer and task
//! that each test changes field by field, so a change of the scenario model
//! touches one place. All people and workplaces here are invented.
#![allow(dead_code)]

#[path = "../../src/approx.rs"]
mod approx;
#[allow(unused_imports)] // not every test file compares numbers
pub use approx::close_for;

use clearspan::plan::{plan, Plan};
use clearspan::scenario::*;

/// An emmetrope in plano spectacles idealised at vertex 0 (so vergence is
/// plain addition), a measured ocular amplitude (subjective: it holds the
/// depth of focus at the near end), half usable, a clinical half depth of
/// field and a measured 4 mm pupil.
pub fn wearer(amplitude_d: f64, half_depth_d: f64) -> Wearer {
    Wearer {
        age_years: 50.0,
        measured_amplitude: Some(MeasuredAmplitude {
            dioptres: amplitude_d,
            method: AmplitudeMethod::MinusLens,
            plane: ReferencePlane::Ocular,
        }),
        right: rx(0.0),
        left: rx(0.0),
        prescribed_addition_d: None,
        correction: Correction::Spectacles { vertex_mm: 0.0 },
        pd_right_mm: 32.0,
        pd_left_mm: 32.0,
        fitting_height_mm: 22.0,
        lens_height_mm: 38.0,
        pantoscopic_tilt_deg: 8.0,
        pupil: PupilSource::Measured { diameter_mm: 4.0 },
        usable_fraction: 0.5,
        blur_tolerance: BlurTolerance::Clinical { half_depth_d },
    }
}

/// A spherical prescription.
pub fn rx(sphere: f64) -> Prescription {
    Prescription {
        sphere_d: sphere,
        cylinder_d: 0.0,
        axis_deg: 0.0,
        prism: Default::default(),
    }
}

/// A task straight ahead at `distance_m`, `gaze_deg` below (negative) or above eye level.
pub fn task(name: &str, distance_m: f64, gaze_deg: f64, hours: f64) -> Task {
    Task {
        name: name.to_string(),
        distance_m,
        vertical: VerticalPosition::GazeAngle { degrees: gaze_deg },
        sideways_m: 0.0,
        width_m: 0.05,
        detail_mm: 1.0,
        hours_per_day: hours,
        flags: TaskFlags::default(),
    }
}

/// A lens option.
pub fn option(label: &str, family: FamilyChoice) -> LensOption {
    LensOption {
        label: label.to_string(),
        family,
    }
}

/// A progressive-lens option with its addition and progression length
/// fixed (`Some`) or left to the planner (`None`).
pub fn progressive(addition_d: Option<f64>, progression_length_mm: Option<f64>) -> LensOption {
    option(
        "progressive",
        FamilyChoice::Progressive {
            addition_d,
            progression_length_mm,
        },
    )
}

/// Validates and plans; panics with the problems if the test scenario is invalid.
pub fn plan_of(wearer: Wearer, tasks: Vec<Task>, options: Vec<LensOption>) -> Plan {
    plan_with(wearer, PlanSettings::default(), tasks, options)
}

/// Like [`plan_of`], with the plan settings given.
pub fn plan_with(
    wearer: Wearer,
    settings: PlanSettings,
    tasks: Vec<Task>,
    options: Vec<LensOption>,
) -> Plan {
    let s = Scenario {
        name: "test".to_string(),
        settings,
        wearer,
        tasks,
        options,
        chosen_option: None,
        current_glasses: None,
    };
    let valid = validate(s).unwrap_or_else(|e| panic!("invalid test scenario: {e:?}"));
    plan(&valid).unwrap_or_else(|e| panic!("plan failed: {e}"))
}

/// Every lens family with every parameter open.
pub fn all_families_open() -> Vec<LensOption> {
    let labels = [
        "sv",
        "bifocal",
        "trifocal",
        "progressive",
        "degressive",
        "double segment",
    ];
    labels
        .into_iter()
        .zip(FamilyChoice::ALL_OPEN)
        .map(|(label, family)| option(label, family))
        .collect()
}
