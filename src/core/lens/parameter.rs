//! The names of the design parameters a lens option can fix or leave open,
//! shared by the lens catalogue (which grid and range each one has) and the
//! planner's report (which parameter it chose, serialized in snake case).

use serde::Serialize;
use std::fmt;

/// The parameters a lens family can have.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Parameter {
    /// Near addition over the distance power (single vision: the task addition).
    Addition,
    /// Height of a segment top relative to the fitting point.
    SegmentTop,
    /// Trifocal intermediate power as a share of the near addition.
    IntermediateRatio,
    /// Fitting point to near reference point of a progressive lens.
    ProgressionLength,
    /// Near addition of a degressive lens at its near reference point.
    NearAddition,
    /// Power a degressive lens loses from its near point to its top.
    Degression,
    /// Top of the lower segment of a double-segment lens.
    LowerSegmentTop,
    /// Bottom of the upper segment of a double-segment lens.
    UpperSegmentBottom,
}

impl fmt::Display for Parameter {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(match self {
            Parameter::Addition => "addition",
            Parameter::SegmentTop => "segment top",
            Parameter::IntermediateRatio => "intermediate ratio",
            Parameter::ProgressionLength => "progression length",
            Parameter::NearAddition => "near addition",
            Parameter::Degression => "degression",
            Parameter::LowerSegmentTop => "lower segment top",
            Parameter::UpperSegmentBottom => "upper segment bottom",
        })
    }
}
