//! Starting values for a new scenario, a new task and a new lens option.
//! They are typical adult values of the trade (common practice), meant to be
//! overwritten with the wearer's own measurements.

use super::model::*;

impl Wearer {
    /// A wearer with typical fitting data and a plano prescription, to be
    /// replaced by the real figures: 12 mm vertex distance, 32 mm monocular
    /// PDs, 8° pantoscopic tilt (common practice), half the amplitude kept in
    /// reserve (common practice, see the domain notes).
    pub fn typical(age_years: f64) -> Wearer {
        let plano = Prescription {
            sphere_d: 0.0,
            cylinder_d: 0.0,
            axis_deg: 0.0,
            prism: Prism::default(),
        };
        Wearer {
            age_years,
            measured_amplitude: None,
            right: plano,
            left: plano,
            prescribed_addition_d: None,
            correction: Correction::Spectacles { vertex_mm: 12.0 },
            pd_right_mm: 32.0,
            pd_left_mm: 32.0,
            fitting_height_mm: 20.0,
            lens_height_mm: 34.0,
            pantoscopic_tilt_deg: 8.0,
            pupil: PupilSource::FromLighting {
                luminance_cd_m2: 100.0,
            },
            usable_fraction: 0.5,
            blur_tolerance: BlurTolerance::FromDetail,
        }
    }
}

impl Task {
    /// A desk-top screen task: 65 cm away, 15° below the horizontal, 50 cm
    /// wide, 2.5 mm characters, four hours (common office layout, common practice).
    pub fn desk_screen(name: &str) -> Task {
        Task {
            name: name.to_string(),
            distance_m: 0.65,
            vertical: VerticalPosition::GazeAngle { degrees: -15.0 },
            sideways_m: 0.0,
            width_m: 0.5,
            detail_mm: 2.5,
            hours_per_day: 4.0,
            flags: TaskFlags::default(),
        }
    }
}

impl LensOption {
    /// The options offered for a new scenario: each main family with every
    /// parameter left to the planner.
    pub fn starter_set() -> Vec<LensOption> {
        let open = |label: &str, family| LensOption {
            label: label.to_string(),
            family,
        };
        vec![
            open(
                "Progressive",
                FamilyChoice::Progressive {
                    addition_d: None,
                    progression_length_mm: None,
                },
            ),
            open(
                "Occupational",
                FamilyChoice::Degressive {
                    near_addition_d: None,
                    degression_d: None,
                },
            ),
            open(
                "Single vision",
                FamilyChoice::SingleVision { addition_d: None },
            ),
        ]
    }
}

impl Scenario {
    /// A new, untitled scenario: a typical wearer of 50, one screen task and
    /// the starter lens options.
    pub fn untitled() -> Scenario {
        Scenario {
            name: "Untitled scenario".to_string(),
            settings: PlanSettings::default(),
            wearer: Wearer::typical(50.0),
            tasks: vec![Task::desk_screen("Screen")],
            options: LensOption::starter_set(),
            chosen_option: None,
            current_glasses: None,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::scenario::validate;

    #[test]
    fn the_starting_values_pass_validation() {
        assert!(validate(Scenario::untitled()).is_ok());
    }
}
