//! How one task fares through one option: lens point, local power, focus
//! verdict, residual blur, head posture, field and centration.

use super::*;
use crate::core::units::{Degrees, Dioptres, Millimetres, PrismDioptres};
use crate::display::lens_point_words;
use serde::Serialize;
use std::fmt;

pub use crate::core::gaze::Strain;
pub use crate::core::lens::LensPoint;

/// How one task fares through one option.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct TaskPlan {
    /// The task.
    pub task: TaskRef,
    /// Where the line of sight crosses the lens, in mm from the fitting point
    /// (x nasal positive, y up positive), after any head posture.
    pub lens_point: LensPoint,
    /// The zone at that point.
    pub zone: ZoneKind,
    /// The local power there, written as a prescription.
    pub local_power: LocalPower,
    /// Ocular accommodation the task needs through that power, in dioptres
    /// (negative: the task lies beyond the far point of that power).
    pub accommodation: Dioptres,
    /// Share of the amplitude used (0 when none is needed); `None` when the
    /// amplitude is zero and the task needs accommodation.
    pub share_of_amplitude: Option<f64>,
    /// The verdict: the focus verdict, lowered to tiring when the vertical
    /// prism difference exceeds the limit.
    pub verdict: Verdict,
    /// The verdict of focus alone: comfortable exactly when the task's
    /// distance lies in `range_here.comfortable`, in focus exactly when it
    /// lies in `range_here.in_focus` (blurred when no posture brings the
    /// line of sight to the lens).
    pub focus: Verdict,
    /// The defocus left over and what it does to the image.
    pub blur: ResidualBlur,
    /// The range of clear vision at the task's lens point.
    pub range_here: ZoneRangePlan,
    /// The head posture the task forces.
    pub posture: HeadPosture,
    /// Whether the zone is wide enough for the task.
    pub field: FieldFit,
    /// Centration and convergence at the task distance.
    pub near_vision: Centration,
    /// Against the driving vision standard, for a driving task.
    pub driving_vision: Option<DrivingVision>,
    /// The vertical prism difference at the lens point exceeds the limit of
    /// the plan settings, which lowers a comfortable focus to tiring.
    pub prism_over_limit: bool,
}

/// A driving task's vision against the driving standard.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct DrivingVision {
    /// Estimated decimal acuity left by the defocus at the lens point, for
    /// an eye that sees 1.0 (6/6) when fully corrected (Smith 1991).
    pub acuity_decimal: f64,
    /// The standard of the plan settings, decimal.
    pub standard_decimal: f64,
    /// Whether the estimate meets the standard with one line to spare.
    pub meets_standard: bool,
}

/// A local lens power written the way a prescription is.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct LocalPower {
    /// The local addition over the distance power, in dioptres.
    pub addition: Dioptres,
    /// Right eye: distance prescription plus the local addition.
    pub right: SpectaclePower,
    /// Left eye: distance prescription plus the local addition.
    pub left: SpectaclePower,
}

/// A sphero-cylindrical spectacle power.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct SpectaclePower {
    /// Sphere, in dioptres.
    pub sphere: Dioptres,
    /// Cylinder, in dioptres (the sign the prescription was written in).
    pub cylinder: Dioptres,
    /// Cylinder axis, in degrees (TABO).
    pub axis: Degrees,
}

/// How well a task is seen.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Hash, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Verdict {
    /// Out of focus even with the full amplitude.
    Blurred,
    /// In focus, but only with more than the usable share of the amplitude.
    InFocusButTiring,
    /// In focus within the usable share: fine for sustained work.
    Comfortable,
}

/// Direction of a defocus that accommodation cannot remove.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum DefocusDirection {
    /// No defocus beyond what accommodation removes.
    None,
    /// The task is too close for the power: more plus would help.
    NeedsMorePlus,
    /// The task is too far for the power: less plus would help.
    NeedsLessPlus,
}

/// The defocus left when the eye does its best, and its effect.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ResidualBlur {
    /// Defocus accommodation cannot remove (using the full amplitude), in
    /// dioptres, before any depth-of-field allowance; 0 when none.
    pub defocus: Dioptres,
    /// Which way the power is off.
    pub direction: DefocusDirection,
    /// Defocus beyond the task's depth-of-field allowance, in dioptres (0 when in focus).
    pub beyond_tolerance: Dioptres,
    /// Power missing for comfort (using only the usable share of the
    /// amplitude), in dioptres: positive when this much more plus would make
    /// the task comfortable, negative when this much less plus would, 0 when
    /// it is comfortable.
    pub short_of_comfort: Dioptres,
    /// Geometric blur-disc diameter, in minutes of arc.
    pub blur_disc_arcmin: f64,
    /// Approximate loss of visual acuity, in logMAR (0.1 is one chart line),
    /// from Smith (1991); see the planner's acuity module.
    pub acuity_loss_logmar: f64,
}

/// The head posture a task forces.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct HeadPosture {
    /// Head tilt needed, in degrees: positive lifts the chin, negative drops
    /// it, 0 when the natural eye rotation reaches the right zone.
    pub chin_up: Degrees,
    /// Whether some posture within the allowed range serves the task at all.
    pub reachable: bool,
    /// How sustainable holding that pitch is.
    pub strain: Strain,
}

/// Whether the zone is wide enough for the task.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct FieldFit {
    /// Angle the usable zone spans at the task's height, seen from the eye's
    /// centre of rotation; `None` when the zone spans the whole lens.
    pub zone_angle: Option<Degrees>,
    /// Angle the task's width spans at the eye.
    pub task_angle: Degrees,
    /// Total head turn needed to sweep the task, in degrees (0 when the zone is wide enough).
    pub head_turn: Degrees,
    /// The part of the head turn held while the task is worked on (towards a
    /// task beyond the lens edge or beside a corridor's usable zone), in degrees.
    pub held_turn: Degrees,
    /// How sustainable the head turn is, judged at its widest excursion:
    /// the held turn plus half the sweep.
    pub turn_strain: Strain,
}

/// Centration and binocular demand at the task distance.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Centration {
    /// Near PD (both eyes) at the task distance, in millimetres.
    pub near_pd: Millimetres,
    /// Inset per eye from the distance centration, in millimetres (mean of the eyes).
    pub inset_per_eye: Millimetres,
    /// Convergence demand of both eyes together, in prism dioptres.
    pub convergence: PrismDioptres,
    /// Vertical prismatic imbalance between the eyes at the task's lens point
    /// (Prentice's rule), in prism dioptres.
    pub vertical_imbalance: PrismDioptres,
}

impl fmt::Display for Verdict {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            Verdict::Comfortable => "comfortable",
            Verdict::InFocusButTiring => "in focus but tiring",
            Verdict::Blurred => "blurred",
        })
    }
}

impl fmt::Display for SpectaclePower {
    /// Prescription notation: "+1.25 / -0.50 x 90", or "+1.25 DS" without cylinder.
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let sphere = self.sphere.signed();
        if self.cylinder.0.abs() < 0.005 {
            write!(f, "{sphere} DS")
        } else {
            // Prescriptions write a horizontal axis as 180, not 0 (common practice).
            let axis = if self.axis.0.round() == 0.0 {
                180.0
            } else {
                self.axis.0
            };
            write!(f, "{sphere} / {} x {axis:.0}", self.cylinder.signed())
        }
    }
}

impl fmt::Display for LocalPower {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(
            f,
            "R {}  L {}  (addition {})",
            self.right, self.left, self.addition
        )
    }
}

impl fmt::Display for HeadPosture {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let d = self.chin_up.0;
        if !self.reachable {
            f.write_str("no posture reaches a zone of this power")
        } else if d.abs() < 0.5 {
            f.write_str("natural")
        } else if d > 0.0 {
            write!(f, "chin up {d:.0}° ({})", self.strain)
        } else {
            write!(f, "chin down {:.0}° ({})", -d, self.strain)
        }
    }
}

impl TaskPlan {
    /// One line of plain English on how the task fares.
    pub fn describe(&self) -> String {
        format!(
            "\"{}\": {} zone at {}, {}, {}; posture {}",
            self.task.name,
            self.zone,
            lens_point_words(self.lens_point.x.0, self.lens_point.y.0),
            self.local_power,
            self.verdict,
            self.posture
        )
    }
}
