//! The scenario: one wearer, the tasks of their working day and the lens
//! options to compare. These are the plain, serialisable types of the current
//! saved-format version; every number carries its unit in its field name.
//! They are checked once by [`crate::scenario::validate`] before any optics
//! runs on them.

pub use crate::core::lens::FamilyChoice;
use serde::{Deserialize, Serialize};

/// One planning case: a wearer, a working day of tasks and lens options.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Scenario {
    /// A name the user gives the case (a wearer's initials, a workstation).
    pub name: String,
    /// The limits the plan judges against (local driving rules, prism tolerance).
    #[serde(default)]
    pub settings: PlanSettings,
    /// The person who will wear the lenses.
    pub wearer: Wearer,
    /// The tasks of the working day, in the order the user entered them.
    pub tasks: Vec<Task>,
    /// The lens options to compare.
    pub options: Vec<LensOption>,
    /// The option the dispenser chose (its position in `options`); `None`
    /// follows the planner's recommendation. The order and the printed
    /// sheet are written for it.
    #[serde(default)]
    pub chosen_option: Option<usize>,
    /// The glasses the wearer has today, if entered: the task-demand sheet
    /// judges every task through them before anything new is considered.
    /// They are not an option and are never ranked.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub current_glasses: Option<CurrentGlasses>,
}

/// Limits a plan is judged against that local rules or the practitioner may
/// set differently from the defaults.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct PlanSettings {
    /// Smallest binocular visual acuity that driving must leave, as a decimal
    /// acuity (0.5, about 6/12 or 20/40, is the EU minimum for ordinary
    /// licences: Directive 2006/126/EC, Annex III).
    pub driving_acuity_decimal: f64,
    /// Vertical prism difference between the eyes above which a sustained
    /// task counts as tiring, in prism dioptres (about 1 Δ; common practice).
    pub vertical_imbalance_limit_pd: f64,
    /// How an addition between two 0.25 D steps is rounded.
    #[serde(default)]
    pub addition_rounding: AdditionRounding,
    /// Plan every near addition from the prescribed addition (fixed) rather
    /// than letting the planner choose it.
    #[serde(default)]
    pub use_prescribed_addition: bool,
}

/// How the planner rounds the addition a task needs to the 0.25 D steps
/// lenses are made in (the classical rule rounds to the nearest step;
/// Millodot, Dictionary of Optometry).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum AdditionRounding {
    /// Up to the next step: never less plus than the task needs, beyond a
    /// shortfall of 0.03 D that lies far below clinical precision (so that
    /// the small difference between spectacle-plane and ocular figures does
    /// not push a value that lands on a step up to the next one).
    #[default]
    Up,
    /// To the nearest step: up to 0.125 D less plus than the task needs
    /// still counts as comfortable.
    Nearest,
}

impl AdditionRounding {
    /// The shortfall of plus, in dioptres, that still counts as comfortable.
    pub fn tolerated_shortfall(self) -> f64 {
        match self {
            AdditionRounding::Up => 0.03,
            AdditionRounding::Nearest => 0.125,
        }
    }
}

impl Default for PlanSettings {
    fn default() -> PlanSettings {
        PlanSettings {
            driving_acuity_decimal: super::fields::DRIVING_ACUITY.start(),
            vertical_imbalance_limit_pd: super::fields::IMBALANCE_LIMIT.start(),
            addition_rounding: AdditionRounding::Up,
            use_prescribed_addition: false,
        }
    }
}

/// The wearer's eyes, prescription and fitting data.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Wearer {
    /// Age in years, used for the amplitude of accommodation when none was measured.
    pub age_years: f64,
    /// A measured amplitude of accommodation, which takes precedence over age.
    pub measured_amplitude: Option<MeasuredAmplitude>,
    /// Distance prescription of the right eye: the spectacle prescription at
    /// the vertex distance of `correction` when spectacles are worn, the
    /// contact lens power (at the cornea) when contact lenses are.
    pub right: Prescription,
    /// Distance prescription of the left eye, at the same plane as `right`.
    pub left: Prescription,
    /// Near addition found at the eye examination, in dioptres, if any.
    pub prescribed_addition_d: Option<f64>,
    /// Spectacles (with their vertex distance) or contact lenses.
    pub correction: Correction,
    /// Monocular distance pupillary distance of the right eye, in millimetres.
    pub pd_right_mm: f64,
    /// Monocular distance pupillary distance of the left eye, in millimetres.
    pub pd_left_mm: f64,
    /// Fitting-point height above the lowest point of the lens, in millimetres.
    pub fitting_height_mm: f64,
    /// Lens height of the frame (box B dimension), in millimetres.
    pub lens_height_mm: f64,
    /// Pantoscopic tilt of the frame front, in degrees (lower rim towards the face is positive).
    pub pantoscopic_tilt_deg: f64,
    /// How the pupil diameter is known.
    pub pupil: PupilSource,
    /// Share of the amplitude of accommodation used for sustained work (0.5 keeps half in reserve).
    pub usable_fraction: f64,
    /// How much defocus each task tolerates.
    pub blur_tolerance: BlurTolerance,
}

/// A measured amplitude of accommodation and how it was measured.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct MeasuredAmplitude {
    /// The amplitude found, in dioptres.
    pub dioptres: f64,
    /// The clinical method used.
    pub method: AmplitudeMethod,
    /// Whether the figure refers to the spectacle plane or to the eye.
    pub plane: ReferencePlane,
}

/// Clinical methods for measuring the amplitude of accommodation.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum AmplitudeMethod {
    /// Push-up to the near point with the distance correction worn.
    PushUp,
    /// Minus lenses added in front of a fixed near target until it blurs.
    MinusLens,
}

/// Where a vergence or power is referred to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum ReferencePlane {
    /// The back vertex of the spectacle lens.
    Spectacle,
    /// The cornea (ocular value).
    Ocular,
}

/// A sphero-cylindrical prescription in the notation the practitioner wrote.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct Prescription {
    /// Sphere power, in dioptres.
    pub sphere_d: f64,
    /// Cylinder power, in dioptres (either sign).
    pub cylinder_d: f64,
    /// Cylinder axis, in degrees (0 to 180, TABO convention).
    pub axis_deg: f64,
    /// Prism prescribed for this eye (none when absent).
    #[serde(default)]
    pub prism: Prism,
}

/// A prescribed prism for one eye, split into its horizontal and vertical
/// parts with their base directions, as prescriptions write it.
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize, Deserialize)]
pub struct Prism {
    /// Horizontal prism, in prism dioptres (0 for none).
    pub horizontal_pd: f64,
    /// Base direction of the horizontal prism.
    pub horizontal_base: HorizontalBase,
    /// Vertical prism, in prism dioptres (0 for none).
    pub vertical_pd: f64,
    /// Base direction of the vertical prism.
    pub vertical_base: VerticalBase,
}

impl Prism {
    /// Whether any prism is prescribed.
    pub fn any(&self) -> bool {
        self.horizontal_pd > 0.0 || self.vertical_pd > 0.0
    }
}

/// Base direction of a horizontal prism.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum HorizontalBase {
    /// Base towards the nose.
    #[default]
    In,
    /// Base towards the temple.
    Out,
}

/// Base direction of a vertical prism.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum VerticalBase {
    /// Base up.
    #[default]
    Up,
    /// Base down.
    Down,
}

/// How the distance correction is worn.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum Correction {
    /// Spectacle lenses at a vertex distance from the cornea.
    Spectacles {
        /// Back vertex of the lens to the cornea, in millimetres.
        vertex_mm: f64,
    },
    /// Contact lenses (vertex distance zero).
    ContactLenses,
}

/// How the pupil diameter is known.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum PupilSource {
    /// Measured pupil diameter, in millimetres.
    Measured {
        /// Pupil diameter, in millimetres.
        diameter_mm: f64,
    },
    /// Estimated from the task lighting and the wearer's age.
    FromLighting {
        /// Adapting luminance, in candelas per square metre.
        luminance_cd_m2: f64,
    },
}

/// How much defocus a task tolerates before it counts as blurred.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum BlurTolerance {
    /// Derived from each task's critical detail size and the pupil.
    FromDetail,
    /// A clinical half depth of field, the same for every task, in dioptres.
    Clinical {
        /// Half depth of field, in dioptres (0.25 strict, 0.50 lenient).
        half_depth_d: f64,
    },
}

/// One task of the working day.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Task {
    /// What the task is ("main monitor", "bench vice").
    pub name: String,
    /// Viewing distance from the spectacle plane along the line of sight, in metres.
    pub distance_m: f64,
    /// Where the task sits vertically relative to the eyes.
    pub vertical: VerticalPosition,
    /// Sideways offset of the task centre from straight ahead, in metres (right positive).
    pub sideways_m: f64,
    /// Width of the task area, in metres.
    pub width_m: f64,
    /// Size of the smallest detail that must be seen, in millimetres.
    pub detail_mm: f64,
    /// Hours per working day spent on the task.
    pub hours_per_day: f64,
    /// Safety-relevant facts about the task.
    pub flags: TaskFlags,
}

/// The vertical position of a task, as the user knows it.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum VerticalPosition {
    /// Gaze angle below (negative) or above (positive) the horizontal, in degrees.
    GazeAngle {
        /// Angle in degrees; negative is downward.
        degrees: f64,
    },
    /// Height of the task centre relative to eye level, in metres (negative is below).
    HeightFromEyes {
        /// Height in metres; negative is below eye level.
        metres: f64,
    },
}

/// Safety-relevant facts about a task.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
pub struct TaskFlags {
    /// The task is part of driving a road vehicle (the road, mirrors,
    /// dashboard): judged against the driving vision standard.
    pub driving: bool,
    /// The task is watching or operating moving machinery at a working
    /// distance (a lathe, a press): its own distance must be clear.
    #[serde(default)]
    pub moving_machinery: bool,
    /// The task sits overhead.
    pub overhead: bool,
    /// The task is reading text on a display screen, so the character-height
    /// guidance for displays applies to its detail size.
    #[serde(default)]
    pub screen: bool,
    /// What the task exposes the eyes to, so that protective eyewear applies.
    #[serde(default)]
    pub hazards: Hazards,
}

/// The eye hazards of a task; each calls for eyewear rated against it.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
pub struct Hazards {
    /// Flying particles or fragments (grinding, cutting, hammering).
    pub impact: bool,
    /// Liquid splashes or aerosols (chemicals, body fluids).
    pub splash_or_aerosol: bool,
    /// Dust or fine particles.
    pub dust: bool,
    /// Optical radiation: welding arcs, lasers, ultraviolet lamps.
    pub optical_radiation: bool,
}

impl Hazards {
    /// Whether the task has any eye hazard.
    pub fn any(&self) -> bool {
        self.impact || self.splash_or_aerosol || self.dust || self.optical_radiation
    }
}

/// A lens option the user wants compared.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct LensOption {
    /// The user's label for the option.
    pub label: String,
    /// The lens family and the parameters fixed by the user (`None` lets the planner choose).
    pub family: FamilyChoice,
}

/// The glasses the wearer has today. Their distance part is taken to be the
/// wearer's distance prescription (`wearer.right` / `left`); the family says
/// what is added to it where. Every power of the family must be given (it is
/// what the glasses carry, not a choice); a length left open (a segment top,
/// a progression length) is taken at its usual fitting.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CurrentGlasses {
    /// The user's words for them ("own varifocals", "reading glasses").
    pub label: String,
    /// The lens family with its additions as made.
    pub family: FamilyChoice,
}

impl CurrentGlasses {
    /// The family as worn: each open length of the design at its usual
    /// fitting ([`crate::core::lens::Parameter::clinical_default`]); powers
    /// stay as given.
    pub fn as_worn(&self) -> FamilyChoice {
        use crate::core::lens::Parameter;
        let usual = |value: Option<f64>, p: Parameter| value.or(p.clinical_default());
        match self.family {
            FamilyChoice::Bifocal {
                addition_d,
                segment_top_mm,
            } => FamilyChoice::Bifocal {
                addition_d,
                segment_top_mm: usual(segment_top_mm, Parameter::SegmentTop),
            },
            FamilyChoice::Trifocal {
                addition_d,
                intermediate_ratio,
                segment_top_mm,
            } => FamilyChoice::Trifocal {
                addition_d,
                intermediate_ratio: usual(intermediate_ratio, Parameter::IntermediateRatio),
                segment_top_mm: usual(segment_top_mm, Parameter::SegmentTop),
            },
            FamilyChoice::Progressive {
                addition_d,
                progression_length_mm,
            } => FamilyChoice::Progressive {
                addition_d,
                progression_length_mm: usual(progression_length_mm, Parameter::ProgressionLength),
            },
            FamilyChoice::DoubleSegment {
                addition_d,
                lower_top_mm,
                upper_bottom_mm,
            } => FamilyChoice::DoubleSegment {
                addition_d,
                lower_top_mm: usual(lower_top_mm, Parameter::LowerSegmentTop),
                upper_bottom_mm: usual(upper_bottom_mm, Parameter::UpperSegmentBottom),
            },
            other => other,
        }
    }

    /// Whether every power of the family is given (the planner must not
    /// choose what glasses already made carry).
    pub fn powers_given(&self) -> bool {
        match self.family {
            FamilyChoice::SingleVision { addition_d }
            | FamilyChoice::Bifocal { addition_d, .. }
            | FamilyChoice::Trifocal { addition_d, .. }
            | FamilyChoice::Progressive { addition_d, .. }
            | FamilyChoice::DoubleSegment { addition_d, .. } => addition_d.is_some(),
            FamilyChoice::Degressive {
                near_addition_d,
                degression_d,
            } => near_addition_d.is_some() && degression_d.is_some(),
        }
    }
}
