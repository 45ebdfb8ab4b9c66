//! The planner's answer, as plain serialisable values: for every lens option
//! (ranked best first) the parameters it resolved, why, a score, the ranges of
//! clear vision of its zones and, per task, the lens point, power, focus
//! verdict, head posture, field and centration; and for the whole plan the
//! amplitude used, unserved tasks, cautions and an order summary.
//!
//! These types are a contract with the screens and the command line: every
//! quantity carries its unit in its type or field name, every outcome that
//! could be a word is an enum, and each enum has a plain-English
//! [`fmt::Display`] (or a `describe` method) that both front ends share.
//! Nothing here is NaN or infinite: an infinite far limit is
//! [`FarEnd::Infinite`], an undefined share is `None`.

pub use crate::core::gaze::Strain;
use crate::core::units::{Degrees, Dioptres, Metres, Millimetres, PrismDioptres};
use crate::scenario::{AmplitudeMethod, FamilyChoice, ReferencePlane};
use serde::Serialize;
use std::fmt;

/// The complete plan for one scenario.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Plan {
    /// The scenario's name, as the user gave it.
    pub scenario_name: String,
    /// The amplitude of accommodation the plan used and where it came from.
    pub amplitude: AmplitudeUsed,
    /// The distance refraction the vergence calculations used.
    pub refraction: RefractionUsed,
    /// The pupil diameter the depth of field used and where it came from.
    pub pupil: PupilUsed,
    /// Half depth of field used for the zone ranges, in dioptres: the
    /// clinical tolerance, or with the detail rule the strictest task's.
    pub zone_half_depth: Dioptres,
    /// Distance from the back of the lens to the eye's centre of rotation
    /// the gaze geometry used, in millimetres (the lens map draws the usable
    /// zone edges with it).
    pub lens_to_cor: Millimetres,
    /// What the plan knows about each task independently of any lens, in input order.
    pub tasks: Vec<TaskContext>,
    /// The lens options, best first.
    pub options: Vec<OptionPlan>,
    /// Tasks that no option makes comfortable, with the reason.
    pub unserved: Vec<UnservedTask>,
    /// Warnings drawn from the scenario, most important first.
    pub cautions: Vec<Caution>,
    /// Which option the order is written for, and how it stands against the
    /// planner's recommendation; `None` when there are no options.
    pub choice: Option<Choice>,
    /// What to order for the chosen option (the best-ranked unless the
    /// dispenser chose another); `None` when there are no options.
    pub order: Option<OrderSummary>,
}

/// The dispenser's choice beside the planner's recommendation.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Choice {
    /// The option the order is written for.
    pub chosen: OptionRef,
    /// The planner's recommendation (the best-ranked option).
    pub recommended: OptionRef,
    /// Whether the dispenser chose it (rather than following the recommendation).
    pub by_dispenser: bool,
    /// How the recommendation scores against the chosen option, when they differ.
    pub difference: Option<ChoiceDifference>,
}

/// How the recommended option scores against a different chosen one.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ChoiceDifference {
    /// Recommended minus chosen score, in hours of the working day.
    pub score_h: f64,
    /// Comfortable hours of the recommended option.
    pub recommended_comfortable_h: f64,
    /// Comfortable hours of the chosen option.
    pub chosen_comfortable_h: f64,
    /// The chosen option is not fit for driving on a day that includes driving.
    pub chosen_unfit_for_driving: bool,
}

impl fmt::Display for Choice {
    /// "Chosen by the dispenser; the planner recommends "X": ..." or nothing to add.
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let Some(d) = self.difference else {
            return if self.by_dispenser {
                f.write_str("chosen by the dispenser, as the planner recommends")
            } else {
                f.write_str("the planner's recommendation")
            };
        };
        write!(
            f,
            "chosen by the dispenser; the planner recommends \"{}\", which scores {:.2} h a \
             day more (comfortable {:.1} h against {:.1} h)",
            self.recommended.label, d.score_h, d.recommended_comfortable_h, d.chosen_comfortable_h
        )?;
        if d.chosen_unfit_for_driving {
            write!(f, "; \"{}\" is not fit for driving", self.chosen.label)?;
        }
        Ok(())
    }
}

/// A reference to one task: its input index and its name, so a message can
/// name it without looking it up.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct TaskRef {
    /// Position of the task in the scenario's task list (0-based).
    pub index: usize,
    /// The task's name.
    pub name: String,
}

/// A reference to one lens option: its input index and label.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct OptionRef {
    /// Position of the option in the scenario's option list (0-based).
    pub index: usize,
    /// The option's label.
    pub label: String,
}

// ---------------------------------------------------------------- wearer-level

/// The amplitude of accommodation behind every verdict.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct AmplitudeUsed {
    /// Where the figure came from.
    pub source: AmplitudeSource,
    /// The amplitude as given or as the age model gives it, in dioptres, at `stated_plane`.
    pub stated: Dioptres,
    /// The plane `stated` refers to.
    pub stated_plane: ReferencePlane,
    /// The same amplitude referred to the eye (ocular accommodation), in dioptres.
    pub ocular: Dioptres,
    /// The share of the amplitude used for sustained work (0.2 to 1).
    pub usable_fraction: f64,
    /// The ocular accommodation available for sustained work, in dioptres.
    pub usable_ocular: Dioptres,
}

/// Where the amplitude of accommodation came from.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum AmplitudeSource {
    /// A clinical measurement, which takes precedence over age.
    Measured {
        /// The clinical method.
        method: AmplitudeMethod,
    },
    /// An age model.
    AgeModel {
        /// The published model used.
        model: AgeModelName,
        /// The age the model was evaluated at, in years (the wearer's age,
        /// clamped to the model's supported range).
        age_years: f64,
    },
}

/// The age models of the amplitude of accommodation the planner may use.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum AgeModelName {
    /// Hofstetter (1950) lower bound, 15 - 0.25 x age: the conservative
    /// expectation for planning additions.
    HofstetterMinimum,
}

/// The distance refraction the vergence calculations used.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct RefractionUsed {
    /// Spherical equivalent of the right eye at the spectacle plane, in dioptres.
    pub right_equivalent: Dioptres,
    /// Spherical equivalent of the left eye at the spectacle plane, in dioptres.
    pub left_equivalent: Dioptres,
    /// The power used for both eyes (the mean of the two equivalents), in dioptres.
    pub used: Dioptres,
    /// How `used` was formed.
    pub basis: RefractionBasis,
    /// Vertex distance of the options, in millimetres (over contact lenses,
    /// the nominal vertex distance of the over-pair).
    pub vertex: Millimetres,
}

/// How the planner turns two eyes' prescriptions into one vergence model.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum RefractionBasis {
    /// The mean of both eyes' spherical equivalents: accommodation is yoked
    /// (both eyes accommodate by the same amount), so one demand must serve
    /// both; a difference between the eyes is reported as a caution.
    MeanOfBothEyes,
    /// The wearer's contact lenses correct the distance vision; the options
    /// are pairs worn over them, plano at distance (`used` is 0), and the
    /// equivalents are those of the contact lenses.
    OverContactLenses,
}

/// The pupil diameter used for depth of field and blur.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PupilUsed {
    /// Pupil diameter, in millimetres.
    pub diameter: Millimetres,
    /// Where it came from.
    pub source: PupilOrigin,
}

/// Where the pupil diameter came from.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum PupilOrigin {
    /// Measured by the practitioner.
    Measured,
    /// Watson & Yellott (2012) unified formula, both eyes adapted.
    WatsonYellott {
        /// Adapting luminance, in cd/m².
        luminance_cd_m2: f64,
        /// Adapting field diameter assumed, in degrees.
        field: Degrees,
        /// Age the formula was evaluated at, in years (clamped to 20 to 83).
        age_years: f64,
    },
}

/// What the plan knows about a task before any lens is chosen.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct TaskContext {
    /// The task.
    pub task: TaskRef,
    /// Viewing distance from the spectacle plane, in metres.
    pub distance: Metres,
    /// Hours per working day.
    pub hours_per_day: f64,
    /// Vertical gaze direction to the task centre, from the eye; negative is down.
    pub gaze_elevation: Degrees,
    /// Half depth of field allowed for the task, in dioptres.
    pub half_depth: Dioptres,
    /// How `half_depth` was set.
    pub half_depth_basis: HalfDepthBasis,
    /// Angle the task's width spans at the eye, in degrees.
    pub width_angle: Degrees,
}

/// How a task's half depth of field was set.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum HalfDepthBasis {
    /// The clinical tolerance the user entered, the same for every task.
    Clinical,
    /// Derived from the task's critical detail and the pupil (blur disc no
    /// larger than the detail).
    FromDetail,
    /// A driving task: the defocus a comfortable view of the road allows,
    /// whatever the detail (the in-focus limit follows the driving acuity standard).
    DrivingStandard,
}

// ---------------------------------------------------------------- per option

/// One lens option as planned.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct OptionPlan {
    /// Rank among the options, 1 for the best.
    pub rank: usize,
    /// The option as the user entered it.
    pub option: OptionRef,
    /// The design with every parameter resolved (all `Some`): the screen
    /// samples its local addition over the lens for the lens map.
    pub design: FamilyChoice,
    /// Each parameter of the family, with who set it.
    pub parameters: Vec<ResolvedParameter>,
    /// Why the planner chose the open parameters, in order of importance.
    pub explanation: Vec<ChoiceNote>,
    /// The value of the solver's objective for this design.
    pub score: Score,
    /// Ranges of clear vision of the design's fixed-power zones.
    pub zones: Vec<ZoneRangePlan>,
    /// How each task fares through this option, in task input order.
    pub tasks: Vec<TaskPlan>,
    /// Whether the design may be worn for driving; `None` when the day has no driving task.
    pub driving: Option<DrivingFitness>,
    /// The design's near addition beside the prescribed one; `None` when
    /// no addition was prescribed or the design carries none (a distance lens).
    pub prescribed_addition: Option<AdditionComparison>,
    /// Set when this option scores practically the same as the one ranked
    /// just above it: by how much, and why that one is listed first.
    pub near_tie: Option<NearTie>,
    /// Height of the optical centres above (positive) or below the fitting
    /// point, in millimetres: the point single-vision task lenses are made
    /// centred on, 0 for multifocal and corridor designs.
    pub optical_centre_height: Millimetres,
}

/// Two options ranked next to each other that serve the day practically equally.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct NearTie {
    /// The option ranked just above.
    pub above: OptionRef,
    /// The difference of their scores, in hours of the working day.
    pub margin_h: f64,
    /// Why the other one is listed first.
    pub reason: TieReason,
}

/// Why, of two practically equal options, one is listed first.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum TieReason {
    /// Only the one above is fit for driving.
    AboveFitForDriving,
    /// The one above scores slightly higher.
    AboveScoresHigher,
    /// Their scores are equal; the one above was entered first.
    AboveEnteredFirst,
}

impl fmt::Display for NearTie {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let why = match self.reason {
            TieReason::AboveFitForDriving => "only that one is fit for driving",
            TieReason::AboveScoresHigher => "it scores slightly higher",
            TieReason::AboveEnteredFirst => "it was entered first",
        };
        let apart = if self.margin_h < 0.005 {
            "less than 0.01 h a day apart".to_string()
        } else {
            format!("{:.2} h a day apart", self.margin_h)
        };
        write!(
            f,
            "practically equal to \"{}\" ({apart}); listed after it because {why}",
            self.above.label
        )
    }
}

/// A design's near addition beside the addition found at the eye examination.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct AdditionComparison {
    /// The prescribed addition, in dioptres.
    pub prescribed: Dioptres,
    /// The design's near addition (a single-vision lens: its whole power
    /// over the distance power), in dioptres.
    pub planned: Dioptres,
    /// Planned minus prescribed, in dioptres.
    pub difference: Dioptres,
}

impl fmt::Display for AdditionComparison {
    /// "+1.75 D against the prescribed +2.00 D (0.25 D less: the tasks sit
    /// further away than reading distance)".
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let d = self.difference.0;
        let why = if d.abs() < 0.005 {
            "the same".to_string()
        } else if d < 0.0 {
            format!(
                "{:.2} D less: the day's tasks need less plus than the examination's reading distance",
                -d
            )
        } else {
            format!(
                "{d:.2} D more: the day's nearest tasks need more plus than the examination's reading distance"
            )
        };
        write!(
            f,
            "addition {} against the prescribed {} ({why})",
            self.planned.signed(),
            self.prescribed.signed()
        )
    }
}

/// Whether a design may be worn for driving.
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum DrivingFitness {
    /// No plus power where the road and mirrors are seen.
    Fit,
    /// Not for driving, for these reasons.
    Unfit {
        /// Every reason found.
        reasons: Vec<DrivingUnfit>,
    },
}

impl DrivingFitness {
    /// Whether the design is fit for driving.
    pub fn is_fit(&self) -> bool {
        matches!(self, DrivingFitness::Fit)
    }
}

/// Why a design is not fit for driving.
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum DrivingUnfit {
    /// An occupational (degressive) lens: intermediate power at the top.
    OccupationalDesign,
    /// A plus segment at the top of the lens, where mirrors and signs are seen.
    UpperSegment,
    /// A single-vision lens with an addition: the road is seen through it.
    NearSingleVision {
        /// The lens's addition, in dioptres.
        addition: Dioptres,
    },
    /// A road or mirror task meets plus power at or just below its line of sight.
    PlusWhereRoadIsSeen {
        /// The task.
        task: TaskRef,
        /// The largest addition met there, in dioptres.
        addition: Dioptres,
    },
}

/// One parameter of a lens family after solving.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ResolvedParameter {
    /// Which parameter.
    pub kind: ParameterKind,
    /// Its value.
    pub value: ParameterValue,
    /// Whether the user fixed it or the planner chose it.
    pub source: ParameterSource,
}

/// The parameters a lens family can have: the lens core's parameter names,
/// which carry the report's serialized name and display words.
pub use crate::core::lens::Parameter as ParameterKind;

/// The value of one lens parameter, with its unit in the variant.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "unit", content = "value")]
pub enum ParameterValue {
    /// A power, in dioptres.
    Power(Dioptres),
    /// A height or length on the lens, in millimetres.
    Length(Millimetres),
    /// A ratio of two powers (no unit).
    Ratio(f64),
}

/// Who set a lens parameter.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum ParameterSource {
    /// The user fixed it in the lens option.
    FixedByUser,
    /// The user left it open and the planner chose it.
    ChosenByPlanner,
    /// The user left it open and the plan took the prescribed addition.
    FromPrescription,
}

/// The solver's objective for one design, in hours of the working day.
///
/// `total = comfortable_hours + tiring_hours - prism_penalty - (1 -
/// TIRING_WEIGHT) x (tiring hours not due to prism) - gap_penalty -
/// posture_penalty - addition_penalty`: each task counts its hours times 1
/// when comfortable, 1 - prism share when only the vertical prism makes it
/// tiring, TIRING_WEIGHT when its focus is tiring and 0 when blurred. The
/// weights are defined in the planner's objective module.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Score {
    /// The objective, in weighted hours (higher is better).
    pub total: f64,
    /// Hours per day of tasks that are comfortable.
    pub comfortable_hours: f64,
    /// Hours per day of tasks in focus but tiring.
    pub tiring_hours: f64,
    /// Hours per day of tasks that are blurred.
    pub blurred_hours: f64,
    /// Deduction for head posture (chin lift or drop, head turn), in weighted hours.
    pub posture_penalty: f64,
    /// Deduction for tasks whose focus is comfortable but whose vertical
    /// prism difference exceeds the limit, in weighted hours (counted
    /// against a comfortable hour; they are listed among the tiring hours).
    pub prism_penalty: f64,
    /// Deduction for addition missing (or in excess) for comfort, in weighted hours.
    pub gap_penalty: f64,
    /// Deduction for the design's addition (so that, of designs serving the
    /// tasks equally, the one with least addition wins), in weighted hours.
    pub addition_penalty: f64,
}

/// Why a parameter has the value the planner chose, found by trying the
/// neighbouring values on its grid.
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum ChoiceNote {
    /// Every parameter was fixed by the user; nothing was chosen.
    AllFixed,
    /// The neighbouring value would make a task worse.
    NeighbourHurtsTask {
        /// The parameter.
        parameter: ParameterKind,
        /// The neighbouring value tried.
        neighbour: ParameterValue,
        /// The task that would suffer.
        task: TaskRef,
        /// The task's verdict with the chosen value.
        verdict_chosen: Verdict,
        /// The task's verdict with the neighbouring value.
        verdict_neighbour: Verdict,
    },
    /// The neighbouring value serves every task equally but costs more head
    /// posture or addition, so the objective prefers the chosen value.
    NeighbourOnlyCostsMore {
        /// The parameter.
        parameter: ParameterKind,
        /// The neighbouring value tried.
        neighbour: ParameterValue,
        /// What the neighbour costs.
        cost: PenaltyKind,
    },
    /// The neighbouring value scores the same; the planner keeps the lower value.
    NeighbourEqual {
        /// The parameter.
        parameter: ParameterKind,
        /// The neighbouring value tried.
        neighbour: ParameterValue,
    },
    /// The neighbouring value would make the design unfit for driving.
    NeighbourNotForDriving {
        /// The parameter.
        parameter: ParameterKind,
        /// The neighbouring value tried.
        neighbour: ParameterValue,
    },
    /// The chosen value is at the end of the range lenses are made in.
    EndOfMadeRange {
        /// The parameter.
        parameter: ParameterKind,
        /// Which end.
        end: RangeEnd,
    },
}

/// A deduction in the solver's objective.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum PenaltyKind {
    /// More chin lift, chin drop or head turn.
    HeadPosture,
    /// More addition than the tasks need.
    ExcessAddition,
}

/// An end of a manufactured range.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum RangeEnd {
    /// The smallest value made.
    Lowest,
    /// The largest value made.
    Highest,
}

/// The named region of a lens: the lens core's zone, which carries the
/// report's serialized name and display words.
pub use crate::core::lens::Zone as ZoneKind;

/// The range of clear vision of one zone of a design.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ZoneRangePlan {
    /// The zone.
    pub zone: ZoneKind,
    /// The zone's addition over the distance power, in dioptres.
    pub addition: Dioptres,
    /// Range using the full amplitude (in focus, possibly tiring).
    pub in_focus: ClearRange,
    /// Range using only the usable share of the amplitude (comfortable).
    pub comfortable: ClearRange,
}

/// The range of distances seen clearly through one power under one criterion.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum ClearRange {
    /// Clear from `near` to `far`, measured from the spectacle plane.
    Clear {
        /// Nearest clear distance, in metres.
        near: Metres,
        /// Farthest clear distance.
        far: FarEnd,
    },
    /// Nothing is clear: the power needs more plus.
    NeedsMorePlus,
    /// Nothing beyond 2 cm is clear: the power needs less plus.
    NeedsLessPlus,
}

/// The far limit of a range of clear vision.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind", content = "metres")]
pub enum FarEnd {
    /// Clear out to this many metres.
    Finite(Metres),
    /// Clear out to infinity.
    Infinite,
}

// ---------------------------------------------------------------- per task

/// How one task fares through one option.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct TaskPlan {
    /// The task.
    pub task: TaskRef,
    /// Where the line of sight crosses the lens, in mm from the fitting point
    /// (x nasal positive, y up positive), after any head posture.
    pub lens_point: LensPointMm,
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

/// A point on the lens in millimetres from the fitting point.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct LensPointMm {
    /// Horizontal position, positive towards the nose.
    pub x: Millimetres,
    /// Vertical position, positive upwards.
    pub y: Millimetres,
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

// ---------------------------------------------------------------- plan-level

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

// ---------------------------------------------------------------- words

impl fmt::Display for Verdict {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            Verdict::Comfortable => "comfortable",
            Verdict::InFocusButTiring => "in focus but tiring",
            Verdict::Blurred => "blurred",
        })
    }
}

impl fmt::Display for ParameterValue {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            ParameterValue::Power(d) => write!(f, "{d}"),
            ParameterValue::Length(mm) => write!(f, "{:+.0} mm", mm.0),
            ParameterValue::Ratio(r) => write!(f, "{r:.2}"),
        }
    }
}

impl fmt::Display for ParameterSource {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            ParameterSource::FixedByUser => "fixed",
            ParameterSource::ChosenByPlanner => "chosen",
            ParameterSource::FromPrescription => "prescribed",
        })
    }
}

impl fmt::Display for PenaltyKind {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            PenaltyKind::HeadPosture => "more head posture",
            PenaltyKind::ExcessAddition => "more addition than the tasks need",
        })
    }
}

impl fmt::Display for ChoiceNote {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            ChoiceNote::AllFixed => f.write_str("every parameter was fixed by the user"),
            ChoiceNote::NeighbourHurtsTask {
                parameter,
                neighbour,
                task,
                verdict_chosen,
                verdict_neighbour,
            } => write!(
                f,
                "{parameter} {neighbour} would leave \"{}\" {verdict_neighbour} instead of {verdict_chosen}",
                task.name
            ),
            ChoiceNote::NeighbourOnlyCostsMore {
                parameter,
                neighbour,
                cost,
            } => write!(f, "{parameter} {neighbour} serves no task better and costs {cost}"),
            ChoiceNote::NeighbourEqual {
                parameter,
                neighbour,
            } => write!(
                f,
                "{parameter} {neighbour} would serve the tasks equally; {} is kept",
                if parameter.clinical_default().is_some() {
                    "the value nearer the usual fitting"
                } else {
                    "the lower value"
                }
            ),
            ChoiceNote::NeighbourNotForDriving {
                parameter,
                neighbour,
            } => write!(
                f,
                "{parameter} {neighbour} would put plus power where the road or mirrors are seen"
            ),
            ChoiceNote::EndOfMadeRange { parameter, end } => write!(
                f,
                "{parameter} is at the {} value made",
                match end {
                    RangeEnd::Lowest => "lowest",
                    RangeEnd::Highest => "highest",
                }
            ),
        }
    }
}

impl fmt::Display for FarEnd {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            FarEnd::Finite(m) => write!(f, "{:.0} cm", m.to_cm()),
            FarEnd::Infinite => f.write_str("infinity"),
        }
    }
}

impl fmt::Display for ClearRange {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            ClearRange::Clear { near, far } => write!(f, "{:.0} cm to {far}", near.to_cm()),
            ClearRange::NeedsMorePlus => f.write_str("nothing clear (needs more plus)"),
            ClearRange::NeedsLessPlus => f.write_str("nothing clear (needs less plus)"),
        }
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
            "R {}  L {}  (add {})",
            self.right,
            self.left,
            self.addition.signed()
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

impl fmt::Display for UnservedReason {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            UnservedReason::NoOptions => f.write_str("the scenario has no lens options"),
            UnservedReason::NeedsMorePlus { short_by } => write!(
                f,
                "even the closest option is {} short of the plus needed for comfort",
                short_by.signed().trim_start_matches('+')
            ),
            UnservedReason::NeedsLessPlus { excess } => write!(
                f,
                "even the closest option gives {} too much plus for comfort",
                excess.signed().trim_start_matches('+')
            ),
            UnservedReason::PowerOutOfReach => f.write_str(
                "the right power is on the lens only at a head posture beyond what is reasonable",
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
            Remedy::MoveTask { to } => write!(f, "moving it to {:.0} cm", to.to_cm()),
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

impl OptionPlan {
    /// The explanation of the choice as one paragraph of plain English.
    pub fn describe_choice(&self) -> String {
        let notes: Vec<String> = self.explanation.iter().map(ToString::to_string).collect();
        let mut text = notes.join("; ");
        if let Some(first) = text.get(0..1) {
            let upper = first.to_uppercase();
            text.replace_range(0..1, &upper);
        }
        text.push('.');
        text
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

impl TaskPlan {
    /// One line of plain English on how the task fares.
    pub fn describe(&self) -> String {
        format!(
            "\"{}\": {} zone at ({:+.1}, {:+.1}) mm, {}, {}; posture {}",
            self.task.name,
            self.zone,
            self.lens_point.x.0,
            self.lens_point.y.0,
            self.local_power,
            self.verdict,
            self.posture
        )
    }
}
