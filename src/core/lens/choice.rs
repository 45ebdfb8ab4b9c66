//! A lens specification as the planner receives it: a lens family with each
//! of its design parameters fixed or left open (`None`) for the planner to
//! choose. It is also the saved shape of a lens option's family, so its
//! serialized names are a compatibility promise of the saved format.

use super::Parameter;
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

impl FamilyChoice {
    /// Every family once, each with every parameter left open for the
    /// planner: single vision, bifocal, trifocal, progressive, degressive,
    /// double segment.
    pub const ALL_OPEN: [FamilyChoice; 6] = [
        FamilyChoice::SingleVision { addition_d: None },
        FamilyChoice::Bifocal {
            addition_d: None,
            segment_top_mm: None,
        },
        FamilyChoice::Trifocal {
            addition_d: None,
            intermediate_ratio: None,
            segment_top_mm: None,
        },
        FamilyChoice::Progressive {
            addition_d: None,
            progression_length_mm: None,
        },
        FamilyChoice::Degressive {
            near_addition_d: None,
            degression_d: None,
        },
        FamilyChoice::DoubleSegment {
            addition_d: None,
            lower_top_mm: None,
            upper_bottom_mm: None,
        },
    ];

    /// The value of `parameter` in this lens specification: `None` when the
    /// family has no such parameter, `Some(None)` when it is left open (in
    /// the parameter's unit: dioptres, millimetres, or a share).
    pub fn parameter(&self, parameter: Parameter) -> Option<Option<f64>> {
        let mut copy = *self;
        copy.slot(parameter).map(|value| *value)
    }

    /// Fixes `parameter` at `value` (`None` leaves it open); nothing when the
    /// family has no such parameter.
    pub fn set_parameter(&mut self, parameter: Parameter, value: Option<f64>) {
        if let Some(slot) = self.slot(parameter) {
            *slot = value;
        }
    }

    /// Where this family keeps `parameter`, if it has it.
    fn slot(&mut self, parameter: Parameter) -> Option<&mut Option<f64>> {
        use FamilyChoice as F;
        use Parameter as P;
        match (self, parameter) {
            (F::SingleVision { addition_d }, P::Addition)
            | (F::Bifocal { addition_d, .. }, P::Addition)
            | (F::Trifocal { addition_d, .. }, P::Addition)
            | (F::Progressive { addition_d, .. }, P::Addition)
            | (F::DoubleSegment { addition_d, .. }, P::Addition) => Some(addition_d),
            (F::Bifocal { segment_top_mm, .. }, P::SegmentTop)
            | (F::Trifocal { segment_top_mm, .. }, P::SegmentTop) => Some(segment_top_mm),
            (
                F::Trifocal {
                    intermediate_ratio, ..
                },
                P::IntermediateRatio,
            ) => Some(intermediate_ratio),
            (
                F::Progressive {
                    progression_length_mm,
                    ..
                },
                P::ProgressionLength,
            ) => Some(progression_length_mm),
            (
                F::Degressive {
                    near_addition_d, ..
                },
                P::NearAddition,
            ) => Some(near_addition_d),
            (F::Degressive { degression_d, .. }, P::Degression) => Some(degression_d),
            (F::DoubleSegment { lower_top_mm, .. }, P::LowerSegmentTop) => Some(lower_top_mm),
            (
                F::DoubleSegment {
                    upper_bottom_mm, ..
                },
                P::UpperSegmentBottom,
            ) => Some(upper_bottom_mm),
            _ => None,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::core::lens::option_axes;

    /// Every parameter the catalogue lists for a family is one the
    /// specification can read and write, and no other.
    #[test]
    fn parameters_agree_with_the_catalogue() {
        let all = [
            Parameter::Addition,
            Parameter::SegmentTop,
            Parameter::IntermediateRatio,
            Parameter::ProgressionLength,
            Parameter::NearAddition,
            Parameter::Degression,
            Parameter::LowerSegmentTop,
            Parameter::UpperSegmentBottom,
        ];
        for family in FamilyChoice::ALL_OPEN {
            let listed: Vec<Parameter> = family.parameters().collect();
            for p in all {
                let mut fixed = family;
                fixed.set_parameter(p, Some(1.5));
                if listed.contains(&p) {
                    assert_eq!(family.parameter(p), Some(None), "{family:?} {p}");
                    assert_eq!(fixed.parameter(p), Some(Some(1.5)), "{family:?} {p}");
                    let axes = option_axes(&fixed).1;
                    let axis = axes.iter().flatten().find(|a| a.kind == p);
                    assert_eq!(axis.and_then(|a| a.fixed), Some(1.5), "{family:?} {p}");
                } else {
                    assert_eq!(family.parameter(p), None, "{family:?} {p}");
                    assert_eq!(fixed, family, "{family:?} {p}");
                }
            }
        }
    }
}
