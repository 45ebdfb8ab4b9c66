//! The wearer-level figures of a plan: the amplitude of accommodation, the
//! refraction and the pupil the plan used, and what it knows about each task
//! before any lens is chosen.

use super::*;
use crate::core::units::{Degrees, Dioptres, Metres, Millimetres};
use crate::scenario::{AmplitudeMethod, ReferencePlane};
use serde::Serialize;

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
        model: AgeModel,
        /// The age the model was evaluated at, in years (the wearer's age,
        /// clamped to the model's supported range).
        age_years: f64,
    },
}

/// The age models of the amplitude of accommodation: the core's own (the
/// planner uses Hofstetter's minimum, the conservative expectation for
/// planning additions).
pub use crate::core::accommodation::AgeModel;

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
