//! A lens specification as the planner receives it: a lens family with each
//! of its design parameters fixed or left open (`None`) for the planner to
//! choose. It is also the saved shape of a lens option's family, so its
//! serialized names are a compatibility promise of the saved format.

use serde::{Deserialize, Serialize};

/// A lens family with each parameter fixed or left to the planner (`None`).
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case", tag = "family")]
pub enum FamilyChoice {
    /// One power everywhere: the distance power plus `addition_d`.
    SingleVision {
        /// Addition over the distance power, in dioptres (0 for distance lenses).
        addition_d: Option<f64>,
    },
    /// A near segment whose top sits at a height relative to the fitting point.
    Bifocal {
        /// Near addition, in dioptres.
        addition_d: Option<f64>,
        /// Segment top relative to the fitting point, in millimetres (negative is below).
        segment_top_mm: Option<f64>,
    },
    /// An intermediate band above a near segment.
    Trifocal {
        /// Near addition, in dioptres.
        addition_d: Option<f64>,
        /// Intermediate power as a share of the near addition.
        intermediate_ratio: Option<f64>,
        /// Top of the intermediate band relative to the fitting point, in millimetres.
        segment_top_mm: Option<f64>,
    },
    /// Progressive-power lens.
    Progressive {
        /// Near addition, in dioptres.
        addition_d: Option<f64>,
        /// Fitting point to near reference point, in millimetres.
        progression_length_mm: Option<f64>,
    },
    /// Degressive-power (occupational) lens.
    Degressive {
        /// Near addition at the near reference point, in dioptres.
        near_addition_d: Option<f64>,
        /// Power lost from the near reference point to the top of the degression, in dioptres.
        degression_d: Option<f64>,
    },
    /// A near segment below and a second add segment at the top for overhead work.
    DoubleSegment {
        /// Near addition of both segments, in dioptres.
        addition_d: Option<f64>,
        /// Lower segment top relative to the fitting point, in millimetres.
        lower_top_mm: Option<f64>,
        /// Upper segment bottom relative to the fitting point, in millimetres.
        upper_bottom_mm: Option<f64>,
    },
}
