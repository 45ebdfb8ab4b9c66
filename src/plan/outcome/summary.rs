//! The plan-level summaries: tasks no option serves (with what would serve
//! them), the cautions, and the order for the chosen option.

use super::*;
use crate::core::units::{Degrees, Dioptres, Metres, Millimetres, PrismDioptres};
use crate::display::metric_length;
use crate::scenario::FamilyChoice;
use serde::Serialize;
use std::fmt;

/// A task no option makes comfortable.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct UnservedTask {
    /// The task.
    pub task: TaskRef,
    /// The best verdict any option achieved.
    pub best_verdict: Verdict,
    /// The option that came closest, if there are options.
    pub closest_option: Option<OptionRef>,
    /// Why.
    pub reason: UnservedReason,
    /// What would serve it, most direct first.
    pub remedies: Vec<Remedy>,
}

/// Something that would make an unserved task comfortable.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum Remedy {
    /// A lens with this addition where the task is seen (rounded up to
    /// 0.25 D); `beyond_made` when it exceeds the strongest addition the
    /// catalogue makes.
    Addition {
        /// The addition needed, in dioptres.
        needed: Dioptres,
        /// More than any lens in the catalogue carries.
        beyond_made: bool,
    },
    /// A hand or stand magnifier, for detail the lenses made cannot bring close enough.
    Magnifier,
    /// Moving the task to this distance, where the closest option's power
    /// at its lens point makes it comfortable.
    MoveTask {
        /// The distance to move it to, from the spectacle plane.
        to: Metres,
    },
    /// A task above eye level: a design with an upper segment, or a separate
    /// pair made for it, instead of a head held back.
    UpperSegmentOrSeparatePair,
}

/// Why no option makes a task comfortable.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum UnservedReason {
    /// The scenario has no lens options.
    NoOptions,
    /// Even the closest option leaves the task short of plus power by this
    /// much beyond comfort, in dioptres.
    NeedsMorePlus {
        /// Missing plus, in dioptres.
        short_by: Dioptres,
    },
    /// Even the closest option gives too much plus by this much, in dioptres.
    NeedsLessPlus {
        /// Excess plus, in dioptres.
        excess: Dioptres,
    },
    /// The right power exists on the lens but only at a head posture beyond
    /// the range the planner allows.
    PowerOutOfReach,
    /// The power where the task is seen brings it into comfortable focus,
    /// but only at a head pitch graded tiring for work held long.
    TiringPosture {
        /// The head pitch needed, in degrees (chin up positive).
        chin_up: Degrees,
    },
    /// The power where the task is seen brings it into comfortable focus,
    /// but the eyes' unequal vertical powers give more vertical prism
    /// difference there than the plan's limit (Prentice's rule).
    VerticalImbalance {
        /// The vertical prism difference between the eyes at the task's
        /// lens point, in prism dioptres.
        difference: PrismDioptres,
    },
}

/// A warning drawn from the scenario.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Caution {
    /// What kind of warning.
    pub kind: CautionKind,
    /// The tasks it concerns (empty when it concerns the whole plan).
    pub tasks: Vec<TaskRef>,
    /// The options it concerns (empty when it concerns every option).
    pub options: Vec<OptionRef>,
    /// The warning in plain English, with the numbers.
    pub text: String,
}

/// The kinds of warnings the planner gives.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum CautionKind {
    /// A planning aid only: a licensed eye-care practitioner confirms powers
    /// and designs under local rules. Always present.
    PlanningAid,
    /// The options are pairs worn over contact lenses.
    OverContactLenses,
    /// A design unfit for driving on a day that includes driving.
    NotForDriving,
    /// A task watches or operates moving machinery.
    MovingMachinery,
    /// A task exposes the eyes to a hazard, so rated protective eyewear applies.
    SafetyEyewear,
    /// The eyes' spectacle powers differ markedly: image size and prism.
    Anisometropia,
    /// Unequal vertical powers give a vertical prism difference at the reading level.
    VerticalImbalance,
    /// A high power makes the vertex distance and fitting matter.
    HighPower,
    /// An input lies outside the range a model was fitted to; the plan clamps it.
    ModelRange,
    /// A measured amplitude from an older wearer already contains depth of field.
    ApparentAmplitude,
    /// The recommended option asks for a head posture that cannot be sustained.
    Posture,
}

/// What to order for the best-ranked option.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct OrderSummary {
    /// The option.
    pub option: OptionRef,
    /// The resolved design.
    pub design: FamilyChoice,
    /// The pair is worn over contact lenses: its distance part is plano.
    pub over_contact_lenses: bool,
    /// Right-eye power to order: the distance power of a multifocal or
    /// corridor lens, the power to make of a single-vision lens.
    pub right: SpectaclePower,
    /// Left-eye power to order, as `right`.
    pub left: SpectaclePower,
    /// Prism prescribed for the right eye, ground into the lens; `None` when
    /// none is prescribed or the pair is worn over contact lenses.
    pub right_prism: Option<crate::scenario::Prism>,
    /// Prism prescribed for the left eye, as `right_prism`.
    pub left_prism: Option<crate::scenario::Prism>,
    /// Near addition of multifocal and corridor lenses, in dioptres; `None`
    /// for single-vision lenses, whose powers already include it.
    pub addition: Option<Dioptres>,
    /// Degression of an occupational lens, in dioptres.
    pub degression: Option<Dioptres>,
    /// Fitting height above the lowest point of the lens, in millimetres.
    pub fitting_height: Millimetres,
    /// Monocular distance PDs, right and left, in millimetres.
    pub pd_right: Millimetres,
    /// Left monocular distance PD, in millimetres.
    pub pd_left: Millimetres,
    /// Near PD at the nearest task the lens serves, in millimetres; `None` without near tasks.
    pub near_pd: Option<Millimetres>,
    /// Vertex distance, in millimetres; `None` for contact lenses.
    pub vertex: Option<Millimetres>,
    /// Pantoscopic tilt, in degrees.
    pub pantoscopic_tilt: Degrees,
    /// Height of the optical centres of a single-vision lens above the
    /// lowest point of the lens, in millimetres; `None` for other designs.
    pub optical_centre_height: Option<Millimetres>,
    /// Lens height of the frame (boxed B dimension), in millimetres.
    pub lens_height: Millimetres,
    /// Segment top above the lowest point of the lens (bifocal, trifocal,
    /// lower segment of a double segment), in millimetres.
    pub segment_top_height: Option<Millimetres>,
    /// Bottom edge of the upper segment above the lowest point of the lens, in millimetres.
    pub upper_segment_bottom_height: Option<Millimetres>,
    /// Trifocal intermediate power as a percentage of the near addition.
    pub intermediate_percent: Option<f64>,
    /// Progression length, fitting point to near reference point, in millimetres.
    pub progression_length: Option<Millimetres>,
    /// The smallest fitting height that progression length needs, in millimetres.
    pub minimum_fitting_height: Option<Millimetres>,
    /// Near inset per eye at the nearest task, in millimetres.
    pub near_inset_per_eye: Option<Millimetres>,
    /// What the made pair must meet on verification.
    pub tolerances: Vec<VerificationTolerance>,
}

/// One verification tolerance of a made pair.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct VerificationTolerance {
    /// The quantity checked ("cylinder axis").
    pub quantity: String,
    /// The limit, with its unit ("±0.13 D").
    pub limit: String,
}

impl fmt::Display for UnservedReason {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            UnservedReason::NoOptions => f.write_str("the scenario has no lens options"),
            UnservedReason::NeedsMorePlus { short_by } => write!(
                f,
                "even the closest option is {} D short of the plus needed for comfort",
                short_by.signed().trim_start_matches('+')
            ),
            UnservedReason::NeedsLessPlus { excess } => write!(
                f,
                "even the closest option gives {} D too much plus for comfort",
                excess.signed().trim_start_matches('+')
            ),
            UnservedReason::PowerOutOfReach => f.write_str(
                "the right power is on the lens only at a head posture beyond what is reasonable",
            ),
            UnservedReason::TiringPosture { chin_up } => write!(
                f,
                "the right power is on the lens only with the chin {} {:.0}°, a posture that tires the neck over a working day (ISO 11226)",
                if chin_up.0 >= 0.0 { "up" } else { "down" },
                chin_up.0.abs()
            ),
            UnservedReason::VerticalImbalance { difference } => write!(
                f,
                "the power there is right, but the unequal vertical powers of the two lenses give {:.2} Δ of vertical prism difference between the eyes where it is seen (Prentice's rule), above the plan's limit",
                difference.0
            ),
        }
    }
}

impl fmt::Display for Remedy {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Remedy::Addition {
                needed,
                beyond_made: false,
            } => write!(f, "an addition of {needed} where it is seen"),
            Remedy::Addition {
                needed,
                beyond_made: true,
            } => write!(
                f,
                "an addition of {needed}, beyond the lenses in the catalogue"
            ),
            Remedy::Magnifier => f.write_str("a magnifier for the finest detail"),
            Remedy::MoveTask { to } => write!(f, "moving it to {}", metric_length(to.0)),
            Remedy::UpperSegmentOrSeparatePair => {
                f.write_str("an upper segment or a separate pair made for work above eye level")
            }
        }
    }
}

impl fmt::Display for CautionKind {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            CautionKind::PlanningAid => "planning aid",
            CautionKind::OverContactLenses => "over contact lenses",
            CautionKind::NotForDriving => "not for driving",
            CautionKind::MovingMachinery => "moving machinery",
            CautionKind::SafetyEyewear => "protective eyewear",
            CautionKind::Anisometropia => "anisometropia",
            CautionKind::VerticalImbalance => "vertical imbalance",
            CautionKind::HighPower => "high power",
            CautionKind::ModelRange => "outside a model's range",
            CautionKind::ApparentAmplitude => "apparent amplitude",
            CautionKind::Posture => "head posture",
        })
    }
}

impl UnservedTask {
    /// One paragraph of plain English: the best verdict, the closest
    /// option, why, and what would serve the task.
    pub fn describe(&self) -> String {
        let closest = self
            .closest_option
            .as_ref()
            .map_or(String::new(), |o| format!(" (closest: \"{}\")", o.label));
        let mut text = format!(
            "\"{}\": at best {}{closest}; {}.",
            self.task.name, self.best_verdict, self.reason
        );
        if !self.remedies.is_empty() {
            let words: Vec<String> = self.remedies.iter().map(ToString::to_string).collect();
            text.push_str(&format!(" It would be served by {}.", words.join(", or ")));
        }
        text
    }
}
