//! One lens option as planned: its resolved parameters and why, its score,
//! its fitness for driving, its zones' ranges of clear vision, and how it
//! stands against the prescribed addition and the option ranked above it.

use super::*;
use crate::core::units::{Dioptres, Millimetres};
use crate::scenario::FamilyChoice;
use serde::Serialize;
use std::fmt;

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
            TieReason::AboveScoresHigher => "that one scores slightly higher",
            TieReason::AboveEnteredFirst => "that one was entered first",
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
            self.planned, self.prescribed
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
    /// A length on the lens, in millimetres.
    Length(Millimetres),
    /// A height on the lens above (positive) or below the fitting point, in millimetres.
    Height(Millimetres),
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
    /// Tasks further from the addition each needs for comfort.
    AdditionGap,
    /// More vertical prism difference between the eyes where tasks are seen.
    VerticalPrism,
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

pub use crate::core::clear_range::{FarLimit, ZoneRange};

/// The range of clear vision of one zone of a design.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ZoneRangePlan {
    /// The zone.
    pub zone: ZoneKind,
    /// The zone's addition over the distance power, in dioptres.
    pub addition: Dioptres,
    /// Range using the full amplitude (in focus, possibly tiring).
    pub in_focus: ZoneRange,
    /// Range using only the usable share of the amplitude (comfortable).
    pub comfortable: ZoneRange,
}

impl fmt::Display for ParameterValue {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            ParameterValue::Power(d) => write!(f, "{d}"),
            ParameterValue::Length(mm) => write!(f, "{:.0} mm", mm.0),
            ParameterValue::Height(mm) if mm.0 > 0.0 => {
                write!(f, "{:.0} mm above the fitting point", mm.0)
            }
            ParameterValue::Height(mm) if mm.0 < 0.0 => {
                write!(f, "{:.0} mm below the fitting point", -mm.0)
            }
            ParameterValue::Height(_) => f.write_str("level with the fitting point"),
            ParameterValue::Ratio(r) => write!(f, "{:.0} % of the addition", r * 100.0),
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
            PenaltyKind::HeadPosture => "asks more of the head and neck",
            PenaltyKind::ExcessAddition => "adds addition the tasks do not need",
            PenaltyKind::AdditionGap => {
                "leaves tasks further from the addition each needs for comfort"
            }
            PenaltyKind::VerticalPrism => "adds vertical prism difference between the eyes",
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
            } => write!(f, "{parameter} {neighbour} changes no task's verdict but {cost}"),
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
