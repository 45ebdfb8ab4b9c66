//! A scenario that passed the gate, with the values the planner reads
//! built once into the core's own types: each eye's sphero-cylinder, the
//! lens's vertical extent in the frame, the usable share of the amplitude
//! and each task's position. The planner takes these instead of
//! reading and checking the raw numbers again, so a scenario the gate
//! accepts cannot fail there.

use super::model::{Prescription, Scenario};
use super::validate::{FieldError, Problem};
use crate::core::accommodation::UsableShare;
use crate::core::gaze::TaskPosition;
use crate::core::lens::VerticalExtent;
use crate::core::prescription::SpheroCylinder;
use crate::core::units::{Degrees, Dioptres, Millimetres};

/// A scenario whose every field has been checked, with its typed values;
/// only [`crate::scenario::validate`] makes one.
#[derive(Debug, Clone, PartialEq)]
pub struct ValidScenario {
    scenario: Scenario,
    right: SpheroCylinder,
    left: SpheroCylinder,
    extent: VerticalExtent,
    usable: UsableShare,
    positions: Vec<TaskPosition>,
}

/// A core model's refusal of a checked value, as a problem of `path`: the
/// gate's ranges come from the same bounds table as the models', so this
/// is a defect to report, never a state to plan from.
fn refused(path: &str, why: impl ToString) -> FieldError {
    FieldError {
        path: path.to_string(),
        problem: Problem::Refused(why.to_string()),
    }
}

/// The sphero-cylinder of a checked prescription at `path`.
fn sphero_cylinder(rx: &Prescription, path: &str) -> Result<SpheroCylinder, FieldError> {
    SpheroCylinder::new(
        Dioptres(rx.sphere_d),
        Dioptres(rx.cylinder_d),
        Degrees(rx.axis_deg),
    )
    .map_err(|e| refused(path, e))
}

impl ValidScenario {
    /// Builds the typed values of `scenario`, whose every field the gate
    /// has checked; a value a core model still refuses is reported on its field.
    pub(super) fn build(scenario: Scenario) -> Result<ValidScenario, Vec<FieldError>> {
        let w = &scenario.wearer;
        let right = sphero_cylinder(&w.right, "wearer.right.sphere_d");
        let left = sphero_cylinder(&w.left, "wearer.left.sphere_d");
        let extent = VerticalExtent::from_frame(
            Millimetres(w.fitting_height_mm),
            Millimetres(w.lens_height_mm),
        )
        .map_err(|e| refused("wearer.fitting_height_mm", e));
        let usable =
            UsableShare::new(w.usable_fraction).map_err(|e| refused("wearer.usable_fraction", e));
        match (right, left, extent, usable) {
            (Ok(right), Ok(left), Ok(extent), Ok(usable)) => Ok(ValidScenario {
                positions: scenario.tasks.iter().map(|t| t.position()).collect(),
                scenario,
                right,
                left,
                extent,
                usable,
            }),
            (right, left, extent, usable) => {
                Err([right.err(), left.err(), extent.err(), usable.err()]
                    .into_iter()
                    .flatten()
                    .collect())
            }
        }
    }

    /// The checked scenario.
    pub fn get(&self) -> &Scenario {
        &self.scenario
    }

    /// The right eye's distance prescription as entered: at the spectacle
    /// plane for spectacles, the contact lens power for contact lenses.
    pub fn right(&self) -> SpheroCylinder {
        self.right
    }

    /// The left eye's distance prescription, at the same plane as [`Self::right`].
    pub fn left(&self) -> SpheroCylinder {
        self.left
    }

    /// The lens's vertical extent in the frame around the fitting point.
    pub fn extent(&self) -> VerticalExtent {
        self.extent
    }

    /// The share of the amplitude of accommodation used for sustained work.
    pub fn usable(&self) -> UsableShare {
        self.usable
    }

    /// Where each task sits in front of the wearer, in the order of the tasks.
    pub fn positions(&self) -> &[TaskPosition] {
        &self.positions
    }
}

#[cfg(test)]
mod tests {
    use crate::scenario::{validate, Scenario};

    /// The typed values are the entered ones: -2.00 / -0.75 x 180 stays so
    /// (transposition aside), and a 20 mm fitting height in a 34 mm lens
    /// leaves 20 mm below and 14 mm above the fitting point.
    #[test]
    fn typed_values_are_the_entered_ones() {
        let mut s = Scenario::untitled();
        s.wearer.right.sphere_d = -2.0;
        s.wearer.right.cylinder_d = -0.75;
        s.wearer.right.axis_deg = 180.0;
        let v = validate(s).expect("a valid scenario");
        assert_eq!(
            (v.right().sphere().0, v.right().cylinder().0),
            (-2.0, -0.75)
        );
        assert_eq!(v.left().sphere().0, 0.0);
        assert_eq!((v.extent().bottom().0, v.extent().top().0), (-20.0, 14.0));
        assert_eq!(v.usable().get(), 0.5);
        assert_eq!(v.positions()[0].distance.0, v.get().tasks[0].distance_m);
    }
}
