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

impl Parameter {
    /// The value a practitioner fits when nothing else decides, used to
    /// break ties between designs that serve the day equally (in the
    /// parameter's unit); `None` for powers, where the smaller wins.
    ///
    /// Segment tops at the lower lid margin, about 4 mm below the pupil
    /// centre; a trifocal intermediate of half the addition; a progression
    /// length of 14 mm, a usual standard corridor; an upper segment starting
    /// 10 mm above the pupil centre, clear of the distance view (all common
    /// practice, from memory).
    pub fn clinical_default(self) -> Option<f64> {
        match self {
            Parameter::SegmentTop | Parameter::LowerSegmentTop => Some(-4.0),
            Parameter::IntermediateRatio => Some(0.5),
            Parameter::ProgressionLength => Some(14.0),
            Parameter::UpperSegmentBottom => Some(10.0),
            Parameter::Addition | Parameter::NearAddition | Parameter::Degression => None,
        }
    }
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
