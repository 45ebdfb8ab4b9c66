//! The one gate between raw input (form fields, saved files) and the optics:
//! every number of a [`Scenario`] is checked for finiteness and for a range
//! that is physically possible and supported by the models. A scenario that
//! passes becomes a [`ValidScenario`] (with its values in the core's types),
//! the only form the planner accepts.

use super::fields::{self, Field};
use super::model::*;
use super::valid::ValidScenario;
use crate::core::bounds::{unit_suffix, Bounds, RangeFault};
use crate::core::lens::{option_axes, MIN_LENS_ABOVE_FITTING_MM};
use crate::core::limits::HOURS;
use crate::core::vergence::MAX_VERTEX_TIMES_POWER;
use std::fmt;

/// A problem with one field of a scenario, addressed by its path
/// (for example `tasks[2].distance_m`).
#[derive(Debug, Clone, PartialEq)]
pub struct FieldError {
    /// Dotted path of the field, as in the saved JSON.
    pub path: String,
    /// What is wrong with the value.
    pub problem: Problem,
}

/// What is wrong with one field, with what is allowed, so that a form can
/// restate the allowed range in the unit the user types in.
#[derive(Debug, Clone, PartialEq)]
pub enum Problem {
    /// The value is NaN or infinite.
    NotANumber,
    /// The value lies outside `min..=max`, in the stored unit `unit`.
    OutOfRange {
        /// The value given, in the stored unit.
        value: f64,
        /// Smallest allowed value, in the stored unit.
        min: f64,
        /// Largest allowed value, in the stored unit.
        max: f64,
        /// The stored unit's symbol ("m", "mm", "D", "°"; empty for a ratio).
        unit: &'static str,
    },
    /// A name that must be given is empty.
    Empty,
    /// A name is longer than the allowed number of characters.
    TooLong(usize),
    /// A rule linking two fields is broken; the text says which.
    Inconsistent(&'static str),
    /// The value could not be read at all (wrong type, missing, unknown
    /// variant in a file); the text is the reader's own explanation.
    Unreadable(String),
    /// A core model refused a value the checks above let through (a defect:
    /// the gate and the models share one bounds table); the text is the
    /// model's own message.
    Refused(String),
}

impl fmt::Display for Problem {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Problem::NotANumber => f.write_str("must be a number"),
            Problem::OutOfRange {
                value,
                min,
                max,
                unit,
            } => {
                let unit = unit_suffix(unit);
                write!(
                    f,
                    "{value} is outside the allowed range {min} to {max}{unit}"
                )
            }
            Problem::Empty => f.write_str("must not be empty"),
            Problem::TooLong(max) => write!(f, "is longer than {max} characters"),
            Problem::Inconsistent(rule) => f.write_str(rule),
            Problem::Unreadable(why) | Problem::Refused(why) => f.write_str(why),
        }
    }
}

impl fmt::Display for FieldError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}: {}", self.path, self.problem)
    }
}

impl std::error::Error for FieldError {}

/// The most tasks one scenario may hold (a working day, not a database).
pub const MAX_TASKS: usize = 40;
/// The most lens options one scenario may compare.
pub const MAX_OPTIONS: usize = 12;
/// The longest name or label, in characters.
pub const MAX_NAME_CHARS: usize = 120;

/// The largest difference between the eyes' spherical equivalents accepted,
/// in dioptres. Anisometropia beyond about 20 D (a unilateral aphakic eye
/// beside a high myope) is exceedingly rare, while a sign typed wrongly is
/// common, so a larger difference is refused with a message (a product choice).
pub const MAX_ANISOMETROPIA_D: f64 = 20.0;

/// Collects field errors while walking a scenario.
struct Checker {
    errors: Vec<FieldError>,
}

impl Checker {
    fn fail(&mut self, path: &str, problem: Problem) {
        self.errors.push(FieldError {
            path: path.to_string(),
            problem,
        });
    }

    fn number(&mut self, path: &str, value: f64, bounds: &Bounds) {
        match bounds.check(value) {
            Ok(_) => {}
            Err(RangeFault::NotFinite) => self.fail(path, Problem::NotANumber),
            Err(RangeFault::OutOfRange) => self.fail(
                path,
                Problem::OutOfRange {
                    value,
                    min: bounds.min,
                    max: bounds.max,
                    unit: bounds.unit,
                },
            ),
        }
    }

    fn name(&mut self, path: &str, value: &str, required: bool) {
        if required && value.trim().is_empty() {
            self.fail(path, Problem::Empty);
        } else if value.chars().count() > MAX_NAME_CHARS {
            self.fail(path, Problem::TooLong(MAX_NAME_CHARS));
        }
    }

    /// Checks field `f` at `index`, when it applies.
    fn field(&mut self, scenario: &Scenario, f: &Field, index: usize) {
        if let Some(value) = (f.get)(scenario, index) {
            self.number(&f.path(index), value, &f.bounds);
        }
    }

    /// Checks every number of the wearer and the plan's limits, then the
    /// rules that link them.
    fn wearer(&mut self, scenario: &Scenario) {
        for f in fields::WEARER {
            for i in f.indices(scenario) {
                self.field(scenario, f, i);
            }
        }
        let w = &scenario.wearer;
        let equivalent = |rx: &Prescription| rx.sphere_d + 0.5 * rx.cylinder_d;
        if (equivalent(&w.right) - equivalent(&w.left)).abs() > MAX_ANISOMETROPIA_D {
            self.fail(
                "wearer.left.sphere_d",
                Problem::Inconsistent(
                    "differs from the right eye by more than 20 D, which no eye-care \
                     practitioner would expect; check the signs of both prescriptions",
                ),
            );
        }
        if let Correction::Spectacles { vertex_mm } = w.correction {
            // The vergence relations hold while vertex x power stays small
            // (the core's limit); a stronger lens needs a shorter vertex.
            let strongest = [&w.right, &w.left]
                .iter()
                .flat_map(|rx| [rx.sphere_d, rx.sphere_d + rx.cylinder_d])
                .map(f64::abs)
                .fold(0.0, f64::max);
            if vertex_mm / 1000.0 * strongest >= MAX_VERTEX_TIMES_POWER {
                self.fail(
                    "wearer.correction.vertex_mm",
                    Problem::Inconsistent(
                        "is too long for so strong a prescription (vertex distance in metres x \
                         the strongest power must stay below 0.5); measure it again",
                    ),
                );
            }
        }
        if w.fitting_height_mm.is_finite()
            && w.lens_height_mm.is_finite()
            && w.fitting_height_mm > w.lens_height_mm - MIN_LENS_ABOVE_FITTING_MM
        {
            self.fail(
                "wearer.fitting_height_mm",
                Problem::Inconsistent("must be at least 1 mm less than the lens height"),
            );
        }
    }

    fn task(&mut self, scenario: &Scenario, i: usize) {
        let t = &scenario.tasks[i];
        let p = |field: &str| format!("tasks[{i}].{field}");
        self.name(&p("name"), &t.name, true);
        for f in fields::TASK {
            self.field(scenario, f, i);
        }
        if let VerticalPosition::HeightFromEyes { metres } = t.vertical {
            if metres.is_finite() && t.distance_m > 0.0 && metres.abs() >= t.distance_m {
                self.fail(
                    &p("vertical.metres"),
                    Problem::Inconsistent("must be smaller than the viewing distance"),
                );
            }
        }
        // The gaze geometry places the task on a sphere around the eyes:
        // its sideways offset must fit within the horizontal part of the
        // viewing distance left by its height or gaze angle.
        let horizontal = match t.vertical {
            VerticalPosition::GazeAngle { degrees } => t.distance_m * degrees.to_radians().cos(),
            VerticalPosition::HeightFromEyes { metres } => (t.distance_m * t.distance_m
                - metres * metres)
                .max(0.0)
                .sqrt(),
        };
        // (A height beyond the distance is reported on its own field.)
        if t.sideways_m.is_finite() && horizontal > 0.0 && t.sideways_m.abs() >= horizontal {
            self.fail(
                &p("sideways_m"),
                Problem::Inconsistent(
                    "must be smaller than the task's horizontal distance (the viewing distance \
                     less what its height or gaze angle takes up)",
                ),
            );
        }
    }

    fn option(&mut self, i: usize, o: &LensOption) {
        let prefix = format!("options[{i}]");
        self.name(&format!("{prefix}.label"), &o.label, true);
        self.family(&prefix, &o.family);
    }

    fn current_glasses(&mut self, g: &CurrentGlasses) {
        self.name("current_glasses.label", &g.label, true);
        self.family("current_glasses", &g.family);
        if !g.powers_given() {
            self.fail(
                "current_glasses.family",
                Problem::Inconsistent(
                    "give every power the glasses carry (their addition; 0 for distance glasses)",
                ),
            );
        }
    }

    /// Checks the fixed parameters of a lens specification, those the core
    /// catalogue lists for its family, each against its field's bounds.
    fn family(&mut self, prefix: &str, family: &FamilyChoice) {
        for axis in option_axes(family).1.iter().flatten() {
            let f = fields::lens_field(axis.kind);
            if let Some(value) = axis.fixed {
                self.number(&format!("{prefix}.{}", f.key), value, &f.bounds);
            }
        }
        if let FamilyChoice::Degressive {
            near_addition_d: Some(a),
            degression_d: Some(d),
        } = *family
        {
            if d > a {
                self.fail(
                    &format!("{prefix}.degression_d"),
                    Problem::Inconsistent("must not exceed the near addition"),
                );
            }
        }
    }
}

/// Checks every field of `scenario`; returns the checked scenario, or every
/// problem found (not only the first), each addressed by its field path.
pub fn validate(scenario: Scenario) -> Result<ValidScenario, Vec<FieldError>> {
    let mut c = Checker { errors: Vec::new() };
    c.name("name", &scenario.name, false);
    c.wearer(&scenario);
    if scenario.tasks.len() > MAX_TASKS {
        c.fail(
            "tasks",
            Problem::Inconsistent("holds more tasks than a scenario may (40)"),
        );
    }
    for i in 0..scenario.tasks.len() {
        c.task(&scenario, i);
    }
    // The day's total is only worth a message when every task's hours are sane.
    let each_sane = scenario
        .tasks
        .iter()
        .all(|t| (HOURS.min..=HOURS.max).contains(&t.hours_per_day));
    let total_hours: f64 = scenario.tasks.iter().map(|t| t.hours_per_day).sum();
    if each_sane && total_hours > HOURS.max {
        c.fail(
            "tasks",
            Problem::Inconsistent("hours per day add up to more than 24"),
        );
    }
    if each_sane && !scenario.tasks.is_empty() && total_hours <= 0.0 {
        c.fail(
            "tasks",
            Problem::Inconsistent(
                "every task takes 0 hours a day, so nothing can be weighed; give each task \
                 the hours it takes",
            ),
        );
    }
    if scenario.options.len() > MAX_OPTIONS {
        c.fail(
            "options",
            Problem::Inconsistent("holds more lens options than a scenario may (12)"),
        );
    }
    for (i, o) in scenario.options.iter().enumerate() {
        c.option(i, o);
    }
    if scenario
        .chosen_option
        .is_some_and(|i| i >= scenario.options.len())
    {
        c.fail(
            "chosen_option",
            Problem::Inconsistent("names a lens option the scenario does not have"),
        );
    }
    if let Some(g) = &scenario.current_glasses {
        c.current_glasses(g);
    }
    if c.errors.is_empty() {
        ValidScenario::build(scenario)
    } else {
        Err(c.errors)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Validates `untitled()` changed by `edit`, and returns the paths of the problems found.
    fn problems_after(edit: impl Fn(&mut Scenario)) -> Vec<String> {
        let mut s = Scenario::untitled();
        edit(&mut s);
        match validate(s) {
            Ok(_) => Vec::new(),
            Err(errors) => errors.into_iter().map(|e| e.path).collect(),
        }
    }

    #[test]
    fn current_glasses_must_carry_their_powers() {
        let glasses = |family| {
            move |s: &mut Scenario| {
                s.current_glasses = Some(CurrentGlasses {
                    label: "own varifocals".to_string(),
                    family,
                })
            }
        };
        let open = FamilyChoice::Progressive {
            addition_d: None,
            progression_length_mm: None,
        };
        assert_eq!(
            problems_after(glasses(open)),
            vec!["current_glasses.family".to_string()]
        );
        let made = FamilyChoice::Progressive {
            addition_d: Some(1.5),
            progression_length_mm: None,
        };
        assert!(problems_after(glasses(made)).is_empty());
        let too_strong = FamilyChoice::SingleVision {
            addition_d: Some(9.0),
        };
        assert_eq!(
            problems_after(glasses(too_strong)),
            vec!["current_glasses.addition_d".to_string()]
        );
    }

    #[test]
    fn impossible_values_are_refused_by_field() {
        let check = |edit: &dyn Fn(&mut Scenario), path: &str| {
            assert_eq!(problems_after(edit), vec![path.to_string()]);
        };
        check(&|s| s.wearer.age_years = 300.0, "wearer.age_years");
        check(&|s| s.wearer.age_years = f64::NAN, "wearer.age_years");
        check(&|s| s.tasks[0].distance_m = -0.4, "tasks[0].distance_m");
        check(
            &|s| s.tasks[0].distance_m = f64::INFINITY,
            "tasks[0].distance_m",
        );
        check(&|s| s.tasks[0].name = "  ".into(), "tasks[0].name");
        check(
            &|s| s.tasks[0].vertical = VerticalPosition::HeightFromEyes { metres: -0.9 },
            "tasks[0].vertical.metres",
        );
        check(
            &|s| s.tasks[0].hours_per_day = 25.0,
            "tasks[0].hours_per_day",
        );
        check(
            &|s| s.wearer.fitting_height_mm = 40.0,
            "wearer.fitting_height_mm",
        );
        check(
            &|s| {
                s.options[1].family = FamilyChoice::Degressive {
                    near_addition_d: Some(1.0),
                    degression_d: Some(1.5),
                }
            },
            "options[1].degression_d",
        );
    }

    #[test]
    fn implausible_combinations_are_refused() {
        // R -30 / L +30: a 60 D difference is a typing error, not a wearer.
        let paths = problems_after(|s| {
            s.wearer.right.sphere_d = -30.0;
            s.wearer.left.sphere_d = 30.0;
        });
        assert_eq!(paths, ["wearer.left.sphere_d"]);
        // 12 D of anisometropia (a unilateral aphakic eye, common practice) is accepted.
        assert!(problems_after(|s| {
            s.wearer.right.sphere_d = 12.0;
            s.wearer.left.sphere_d = 0.0;
        })
        .is_empty());
        let paths = problems_after(|s| {
            for t in &mut s.tasks {
                t.hours_per_day = 0.0;
            }
        });
        assert_eq!(paths, ["tasks"]);
        let paths = problems_after(|s| s.wearer.right.prism.vertical_pd = 40.0);
        assert_eq!(paths, ["wearer.right.prism.vertical_pd"]);
        let paths = problems_after(|s| s.settings.driving_acuity_decimal = 2.0);
        assert_eq!(paths, ["settings.driving_acuity_decimal"]);
        // A fitting point 0.5 mm under the top of a 35 mm lens leaves no lens above it.
        let paths = problems_after(|s| {
            s.wearer.lens_height_mm = 35.0;
            s.wearer.fitting_height_mm = 34.5;
        });
        assert_eq!(paths, ["wearer.fitting_height_mm"]);
        // 40 cm away and 30 cm up leaves 26.5 cm of horizontal distance: a
        // 30 cm sideways offset cannot fit.
        let paths = problems_after(|s| {
            s.tasks[0].distance_m = 0.4;
            s.tasks[0].vertical = VerticalPosition::HeightFromEyes { metres: 0.3 };
            s.tasks[0].sideways_m = 0.3;
        });
        assert_eq!(paths, ["tasks[0].sideways_m"]);
        // +25 D at 25 mm: vertex x power 0.625, beyond the vergence relations.
        let paths = problems_after(|s| {
            s.wearer.right.sphere_d = 25.0;
            s.wearer.left.sphere_d = 25.0;
            s.wearer.correction = Correction::Spectacles { vertex_mm: 25.0 };
        });
        assert_eq!(paths, ["wearer.correction.vertex_mm"]);
    }

    #[test]
    fn every_problem_is_reported_at_once() {
        let paths = problems_after(|s| {
            s.wearer.pd_left_mm = 5.0;
            s.tasks.push(s.tasks[0].clone());
            s.tasks[0].hours_per_day = 20.0;
            s.tasks[1].hours_per_day = 20.0;
        });
        assert_eq!(paths, ["wearer.pd_left_mm", "tasks"]);
    }

    #[test]
    fn messages_say_what_is_allowed() {
        let mut s = Scenario::untitled();
        s.tasks[0].distance_m = 0.05;
        let errors = validate(s).expect_err("5 cm is closer than any task");
        assert_eq!(
            errors[0].to_string(),
            "tasks[0].distance_m: 0.05 is outside the allowed range 0.1 to 1000 m"
        );
    }
}
