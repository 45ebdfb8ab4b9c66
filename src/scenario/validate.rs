//! The one gate between raw input (form fields, saved files) and the optics:
//! every number of a [`Scenario`] is checked for finiteness and for a range
//! that is physically possible and supported by the models. A scenario that
//! passes becomes a [`ValidScenario`], the only form the planner accepts.

use super::model::*;
use std::fmt;

/// A problem with one field of a scenario, addressed by its path
/// (for example `tasks[2].distance_m`) with a message a user can act on.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct FieldError {
    /// Dotted path of the field, as in the saved JSON.
    pub path: String,
    /// What is wrong and what is allowed.
    pub message: String,
}

impl fmt::Display for FieldError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}: {}", self.path, self.message)
    }
}

impl std::error::Error for FieldError {}

/// A scenario whose every field has been checked; only [`validate`] makes one.
#[derive(Debug, Clone, PartialEq)]
pub struct ValidScenario(Scenario);

impl ValidScenario {
    /// The checked scenario.
    pub fn get(&self) -> &Scenario {
        &self.0
    }
}

/// The most tasks one scenario may hold (a working day, not a database).
pub const MAX_TASKS: usize = 40;
/// The most lens options one scenario may compare.
pub const MAX_OPTIONS: usize = 12;
/// The longest name or label, in characters.
pub const MAX_NAME_CHARS: usize = 120;

/// An inclusive range of allowed values with its unit, for messages.
struct Bounds {
    min: f64,
    max: f64,
    unit: &'static str,
}

const fn b(min: f64, max: f64, unit: &'static str) -> Bounds {
    Bounds { min, max, unit }
}

/// Age range the amplitude models are applied over, in years.
const AGE: Bounds = b(5.0, 100.0, "years");
const AMPLITUDE: Bounds = b(0.0, 25.0, "D");
const SPHERE: Bounds = b(-30.0, 30.0, "D");
const CYLINDER: Bounds = b(-10.0, 10.0, "D");
const AXIS: Bounds = b(0.0, 180.0, "°");
const ADDITION: Bounds = b(0.0, 4.0, "D");
const VERTEX: Bounds = b(0.0, 25.0, "mm");
const PD: Bounds = b(20.0, 45.0, "mm");
const FITTING_HEIGHT: Bounds = b(8.0, 45.0, "mm");
const LENS_HEIGHT: Bounds = b(15.0, 70.0, "mm");
const TILT: Bounds = b(-5.0, 25.0, "°");
const PUPIL: Bounds = b(1.0, 9.0, "mm");
const LUMINANCE: Bounds = b(0.001, 100_000.0, "cd/m²");
const USABLE_FRACTION: Bounds = b(0.2, 1.0, "");
const HALF_DEPTH: Bounds = b(0.05, 1.5, "D");
const DISTANCE: Bounds = b(0.1, 1000.0, "m");
const GAZE_ANGLE: Bounds = b(-80.0, 80.0, "°");
const HEIGHT: Bounds = b(-5.0, 5.0, "m");
const SIDEWAYS: Bounds = b(-20.0, 20.0, "m");
const WIDTH: Bounds = b(0.0, 20.0, "m");
const DETAIL: Bounds = b(0.01, 1000.0, "mm");
const HOURS: Bounds = b(0.0, 24.0, "h");
const SEGMENT_TOP: Bounds = b(-20.0, 5.0, "mm");
const INTERMEDIATE_RATIO: Bounds = b(0.3, 0.8, "");
const PROGRESSION: Bounds = b(10.0, 24.0, "mm");
const NEAR_ADDITION: Bounds = b(0.5, 4.0, "D");
const DEGRESSION: Bounds = b(0.5, 2.5, "D");
const UPPER_BOTTOM: Bounds = b(3.0, 25.0, "mm");

/// Collects field errors while walking a scenario.
struct Checker {
    errors: Vec<FieldError>,
}

impl Checker {
    fn fail(&mut self, path: &str, message: String) {
        self.errors.push(FieldError {
            path: path.to_string(),
            message,
        });
    }

    fn number(&mut self, path: &str, value: f64, bounds: &Bounds) {
        if !value.is_finite() {
            self.fail(path, "must be a number".to_string());
        } else if value < bounds.min || value > bounds.max {
            let unit = if bounds.unit.is_empty() {
                String::new()
            } else {
                format!(" {}", bounds.unit)
            };
            self.fail(
                path,
                format!(
                    "{value} is outside the allowed range {} to {}{unit}",
                    bounds.min, bounds.max
                ),
            );
        }
    }

    fn optional(&mut self, path: &str, value: Option<f64>, bounds: &Bounds) {
        if let Some(v) = value {
            self.number(path, v, bounds);
        }
    }

    fn name(&mut self, path: &str, value: &str, required: bool) {
        if required && value.trim().is_empty() {
            self.fail(path, "must not be empty".to_string());
        } else if value.chars().count() > MAX_NAME_CHARS {
            self.fail(path, format!("is longer than {MAX_NAME_CHARS} characters"));
        }
    }

    fn prescription(&mut self, path: &str, rx: &Prescription) {
        self.number(&format!("{path}.sphere_d"), rx.sphere_d, &SPHERE);
        self.number(&format!("{path}.cylinder_d"), rx.cylinder_d, &CYLINDER);
        self.number(&format!("{path}.axis_deg"), rx.axis_deg, &AXIS);
    }

    fn wearer(&mut self, w: &Wearer) {
        self.number("wearer.age_years", w.age_years, &AGE);
        if let Some(m) = &w.measured_amplitude {
            self.number("wearer.measured_amplitude.dioptres", m.dioptres, &AMPLITUDE);
        }
        self.prescription("wearer.right", &w.right);
        self.prescription("wearer.left", &w.left);
        self.optional(
            "wearer.prescribed_addition_d",
            w.prescribed_addition_d,
            &ADDITION,
        );
        if let Correction::Spectacles { vertex_mm } = w.correction {
            self.number("wearer.correction.vertex_mm", vertex_mm, &VERTEX);
        }
        self.number("wearer.pd_right_mm", w.pd_right_mm, &PD);
        self.number("wearer.pd_left_mm", w.pd_left_mm, &PD);
        self.number(
            "wearer.fitting_height_mm",
            w.fitting_height_mm,
            &FITTING_HEIGHT,
        );
        self.number("wearer.lens_height_mm", w.lens_height_mm, &LENS_HEIGHT);
        if w.fitting_height_mm.is_finite()
            && w.lens_height_mm.is_finite()
            && w.fitting_height_mm >= w.lens_height_mm
        {
            self.fail(
                "wearer.fitting_height_mm",
                "must be less than the lens height".to_string(),
            );
        }
        self.number("wearer.pantoscopic_tilt_deg", w.pantoscopic_tilt_deg, &TILT);
        match w.pupil {
            PupilSource::Measured { diameter_mm } => {
                self.number("wearer.pupil.diameter_mm", diameter_mm, &PUPIL)
            }
            PupilSource::FromLighting { luminance_cd_m2 } => {
                self.number("wearer.pupil.luminance_cd_m2", luminance_cd_m2, &LUMINANCE)
            }
        }
        self.number(
            "wearer.usable_fraction",
            w.usable_fraction,
            &USABLE_FRACTION,
        );
        if let BlurTolerance::Clinical { half_depth_d } = w.blur_tolerance {
            self.number(
                "wearer.blur_tolerance.half_depth_d",
                half_depth_d,
                &HALF_DEPTH,
            );
        }
    }

    fn task(&mut self, i: usize, t: &Task) {
        let p = |field: &str| format!("tasks[{i}].{field}");
        self.name(&p("name"), &t.name, true);
        self.number(&p("distance_m"), t.distance_m, &DISTANCE);
        match t.vertical {
            VerticalPosition::GazeAngle { degrees } => {
                self.number(&p("vertical.degrees"), degrees, &GAZE_ANGLE)
            }
            VerticalPosition::HeightFromEyes { metres } => {
                self.number(&p("vertical.metres"), metres, &HEIGHT);
                if metres.is_finite() && t.distance_m.is_finite() && metres.abs() >= t.distance_m {
                    self.fail(
                        &p("vertical.metres"),
                        "must be smaller than the viewing distance".to_string(),
                    );
                }
            }
        }
        self.number(&p("sideways_m"), t.sideways_m, &SIDEWAYS);
        if t.sideways_m.is_finite()
            && t.distance_m.is_finite()
            && t.sideways_m.abs() >= t.distance_m
        {
            self.fail(
                &p("sideways_m"),
                "must be smaller than the viewing distance".to_string(),
            );
        }
        self.number(&p("width_m"), t.width_m, &WIDTH);
        self.number(&p("detail_mm"), t.detail_mm, &DETAIL);
        self.number(&p("hours_per_day"), t.hours_per_day, &HOURS);
    }

    fn option(&mut self, i: usize, o: &LensOption) {
        let p = |field: &str| format!("options[{i}].{field}");
        self.name(&p("label"), &o.label, true);
        match o.family {
            FamilyChoice::SingleVision { addition_d } => {
                self.optional(&p("addition_d"), addition_d, &ADDITION)
            }
            FamilyChoice::Bifocal {
                addition_d,
                segment_top_mm,
            } => {
                self.optional(&p("addition_d"), addition_d, &ADDITION);
                self.optional(&p("segment_top_mm"), segment_top_mm, &SEGMENT_TOP);
            }
            FamilyChoice::Trifocal {
                addition_d,
                intermediate_ratio,
                segment_top_mm,
            } => {
                self.optional(&p("addition_d"), addition_d, &ADDITION);
                self.optional(
                    &p("intermediate_ratio"),
                    intermediate_ratio,
                    &INTERMEDIATE_RATIO,
                );
                self.optional(&p("segment_top_mm"), segment_top_mm, &SEGMENT_TOP);
            }
            FamilyChoice::Progressive {
                addition_d,
                progression_length_mm,
            } => {
                self.optional(&p("addition_d"), addition_d, &ADDITION);
                self.optional(
                    &p("progression_length_mm"),
                    progression_length_mm,
                    &PROGRESSION,
                );
            }
            FamilyChoice::Degressive {
                near_addition_d,
                degression_d,
            } => {
                self.optional(&p("near_addition_d"), near_addition_d, &NEAR_ADDITION);
                self.optional(&p("degression_d"), degression_d, &DEGRESSION);
                if let (Some(a), Some(d)) = (near_addition_d, degression_d) {
                    if d > a {
                        self.fail(
                            &p("degression_d"),
                            "must not exceed the near addition".to_string(),
                        );
                    }
                }
            }
            FamilyChoice::DoubleSegment {
                addition_d,
                lower_top_mm,
                upper_bottom_mm,
            } => {
                self.optional(&p("addition_d"), addition_d, &ADDITION);
                self.optional(&p("lower_top_mm"), lower_top_mm, &SEGMENT_TOP);
                self.optional(&p("upper_bottom_mm"), upper_bottom_mm, &UPPER_BOTTOM);
            }
        }
    }
}

/// Checks every field of `scenario`; returns the checked scenario, or every
/// problem found (not only the first), each addressed by its field path.
pub fn validate(scenario: Scenario) -> Result<ValidScenario, Vec<FieldError>> {
    let mut c = Checker { errors: Vec::new() };
    c.name("name", &scenario.name, false);
    c.wearer(&scenario.wearer);
    if scenario.tasks.len() > MAX_TASKS {
        c.fail("tasks", format!("holds more than {MAX_TASKS} tasks"));
    }
    for (i, t) in scenario.tasks.iter().enumerate() {
        c.task(i, t);
    }
    let total_hours: f64 = scenario.tasks.iter().map(|t| t.hours_per_day).sum();
    if total_hours.is_finite() && total_hours > HOURS.max {
        c.fail(
            "tasks",
            format!("hours per day add up to {total_hours}, more than 24"),
        );
    }
    if scenario.options.len() > MAX_OPTIONS {
        c.fail("options", format!("holds more than {MAX_OPTIONS} options"));
    }
    for (i, o) in scenario.options.iter().enumerate() {
        c.option(i, o);
    }
    if c.errors.is_empty() {
        Ok(ValidScenario(scenario))
    } else {
        Err(c.errors)
    }
}
