//! Starting values for a new scenario, a new task and a new lens option.
//! They are typical adult values of the trade (common practice), meant to be
//! overwritten with the wearer's own measurements; each number is its
//! field's starting value in the field table ([`super::fields`]).

use super::fields as f;
use super::model::*;

/// The prescription of eye fields at their starting values (plano, no prism).
fn plano() -> Prescription {
    Prescription {
        sphere_d: f::SPHERE.start(),
        cylinder_d: f::CYLINDER.start(),
        axis_deg: f::AXIS.start(),
        prism: Prism {
            horizontal_pd: f::PRISM_HORIZONTAL.start(),
            vertical_pd: f::PRISM_VERTICAL.start(),
            ..Prism::default()
        },
    }
}

impl Wearer {
    /// A wearer with typical fitting data and a plano prescription, to be
    /// replaced by the real figures: 12 mm vertex distance, 32 mm monocular
    /// PDs, 8° pantoscopic tilt (common practice), half the amplitude kept in
    /// reserve (common practice, see the domain notes).
    pub fn typical(age_years: f64) -> Wearer {
        let plano = plano();
        Wearer {
            age_years,
            measured_amplitude: None,
            right: plano,
            left: plano,
            prescribed_addition_d: None,
            correction: Correction::Spectacles {
                vertex_mm: f::VERTEX.start(),
            },
            pd_right_mm: f::PD_RIGHT.start(),
            pd_left_mm: f::PD_LEFT.start(),
            fitting_height_mm: f::FITTING_HEIGHT.start(),
            lens_height_mm: f::LENS_HEIGHT.start(),
            pantoscopic_tilt_deg: f::TILT.start(),
            pupil: PupilSource::FromLighting {
                luminance_cd_m2: f::LUMINANCE.start(),
            },
            usable_fraction: f::USABLE_FRACTION.start(),
            blur_tolerance: BlurTolerance::FromDetail,
        }
    }
}

impl Task {
    /// A desk-top screen task named `name`: the first of the task kinds
    /// ([`super::task_kinds::TASK_KINDS`]), with its sourced figures.
    pub fn desk_screen(name: &str) -> Task {
        super::task_kinds::TASK_KINDS[0].task(name)
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
            wearer: Wearer::typical(f::AGE.start()),
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
