//! The open parameters of a lens option in the field table, one entry per
//! [`Parameter`] of the core's catalogue: which parameters a family has is
//! the catalogue's answer (`core::lens::option_axes`), never listed here
//! again. Every entry is optional: empty leaves the value to the planner.

use super::{Field, Help, Scope, Unit};
use crate::core::lens::Parameter;
use crate::core::limits;
use crate::scenario::model::Scenario;

/// Parameter `p` of option `index`, if the option exists, has it and fixes it.
fn read(s: &Scenario, index: usize, p: Parameter) -> Option<f64> {
    s.options
        .get(index)
        .and_then(|o| o.family.parameter(p))
        .flatten()
}

/// Fixes parameter `p` of option `index` at `value` (`None` leaves it open).
fn write(s: &mut Scenario, index: usize, p: Parameter, value: Option<f64>) {
    if let Some(o) = s.options.get_mut(index) {
        o.family.set_parameter(p, value);
    }
}

/// How a segment's placement is chosen, for both segment tops.
const SEGMENT_TOP_HELP: Help = Help {
    what:
        "The height of the segment's top line relative to the fitting point; negative is below it.",
    how: "Set at fitting, usually at the lower lid margin; leave it empty and the planner chooses.",
    usual:
        "From 8 mm below to level with the fitting point, often about 4 mm below (common practice).",
};

/// The addition of any family.
pub const ADDITION: Field = Field {
    scope: Scope::Lens(Parameter::Addition),
    key: "addition_d",
    label: "Addition",
    unit: Unit::Dioptres,
    bounds: limits::ADDITION,
    default: None,
    optional: true,
    help: Help {
        what: "The plus power the near zone adds to the distance power (for single vision: the power added everywhere).",
        how: "Leave it empty and the planner chooses it from the tasks; fix it to compare one you have in mind.",
        usual: "Multifocals +0.75 to +3.50 D, task lenses up to +4.00 D, in 0.25 D steps (common practice).",
    },
    get: |s, i| read(s, i, Parameter::Addition),
    set: |s, i, v| write(s, i, Parameter::Addition, v),
};

/// The segment top of a bifocal or trifocal.
pub const SEGMENT_TOP: Field = Field {
    scope: Scope::Lens(Parameter::SegmentTop),
    key: "segment_top_mm",
    label: "Segment top from fitting point",
    unit: Unit::Millimetres,
    bounds: limits::SEGMENT_TOP,
    default: None,
    optional: true,
    help: SEGMENT_TOP_HELP,
    get: |s, i| read(s, i, Parameter::SegmentTop),
    set: |s, i, v| write(s, i, Parameter::SegmentTop, v),
};

/// The intermediate share of a trifocal.
pub const INTERMEDIATE_RATIO: Field = Field {
    scope: Scope::Lens(Parameter::IntermediateRatio),
    key: "intermediate_ratio",
    label: "Intermediate share of addition",
    unit: Unit::Ratio,
    bounds: limits::INTERMEDIATE_RATIO,
    default: None,
    optional: true,
    help: Help {
        what: "The power of the trifocal's intermediate band as a share of the near addition.",
        how: "A property of the lens as made; leave it empty and the planner chooses.",
        usual: "Usually 0.5, half the addition; 0.6 and 0.7 are also made (from memory).",
    },
    get: |s, i| read(s, i, Parameter::IntermediateRatio),
    set: |s, i, v| write(s, i, Parameter::IntermediateRatio, v),
};

/// The progression length of a progressive lens.
pub const PROGRESSION_LENGTH: Field = Field {
    scope: Scope::Lens(Parameter::ProgressionLength),
    key: "progression_length_mm",
    label: "Progression length",
    unit: Unit::Millimetres,
    bounds: limits::PROGRESSION_LENGTH,
    default: None,
    optional: true,
    help: Help {
        what: "The distance from the fitting point down to where the progressive lens reaches its full addition.",
        how: "Given by the lens design; leave it empty and the planner chooses one that fits the frame.",
        usual: "Short designs about 11 to 14 mm, standard ones 14 to 18 mm (common practice).",
    },
    get: |s, i| read(s, i, Parameter::ProgressionLength),
    set: |s, i, v| write(s, i, Parameter::ProgressionLength, v),
};

/// The near addition of a degressive lens.
pub const NEAR_ADDITION: Field = Field {
    scope: Scope::Lens(Parameter::NearAddition),
    key: "near_addition_d",
    label: "Near addition",
    unit: Unit::Dioptres,
    bounds: limits::NEAR_ADDITION,
    default: None,
    optional: true,
    help: Help {
        what: "The occupational lens's addition at its near point, low in the lens.",
        how: "Usually the prescribed reading addition; leave it empty and the planner chooses.",
        usual: "+0.75 to +3.50 D in 0.25 D steps (common practice).",
    },
    get: |s, i| read(s, i, Parameter::NearAddition),
    set: |s, i, v| write(s, i, Parameter::NearAddition, v),
};

/// The degression of a degressive lens.
pub const DEGRESSION: Field = Field {
    scope: Scope::Lens(Parameter::Degression),
    key: "degression_d",
    label: "Degression",
    unit: Unit::Dioptres,
    bounds: limits::DEGRESSION,
    default: None,
    optional: true,
    help: Help {
        what: "How much power the occupational lens loses from its near point to its top; the larger, the further the top sees.",
        how: "Given by the lens design; leave it empty and the planner chooses.",
        usual: "0.50 to 2.00 D (common practice).",
    },
    get: |s, i| read(s, i, Parameter::Degression),
    set: |s, i, v| write(s, i, Parameter::Degression, v),
};

/// The lower segment top of a double-segment lens.
pub const LOWER_SEGMENT_TOP: Field = Field {
    scope: Scope::Lens(Parameter::LowerSegmentTop),
    key: "lower_top_mm",
    label: "Lower segment top",
    unit: Unit::Millimetres,
    bounds: limits::SEGMENT_TOP,
    default: None,
    optional: true,
    help: SEGMENT_TOP_HELP,
    get: |s, i| read(s, i, Parameter::LowerSegmentTop),
    set: |s, i, v| write(s, i, Parameter::LowerSegmentTop, v),
};

/// The upper segment bottom of a double-segment lens.
pub const UPPER_SEGMENT_BOTTOM: Field = Field {
    scope: Scope::Lens(Parameter::UpperSegmentBottom),
    key: "upper_bottom_mm",
    label: "Upper segment bottom",
    unit: Unit::Millimetres,
    bounds: limits::UPPER_BOTTOM,
    default: None,
    optional: true,
    help: Help {
        what: "The height of the upper segment's lower edge above the fitting point, for work overhead.",
        how: "Set at fitting, clear of the straight-ahead view; leave it empty and the planner chooses.",
        usual: "About 6 to 16 mm above the fitting point (common practice).",
    },
    get: |s, i| read(s, i, Parameter::UpperSegmentBottom),
    set: |s, i, v| write(s, i, Parameter::UpperSegmentBottom, v),
};

/// Every lens parameter field.
pub const LENS: [&Field; 8] = [
    &ADDITION,
    &SEGMENT_TOP,
    &INTERMEDIATE_RATIO,
    &PROGRESSION_LENGTH,
    &NEAR_ADDITION,
    &DEGRESSION,
    &LOWER_SEGMENT_TOP,
    &UPPER_SEGMENT_BOTTOM,
];

/// The field of lens parameter `p`.
pub fn lens_field(p: Parameter) -> &'static Field {
    match p {
        Parameter::Addition => &ADDITION,
        Parameter::SegmentTop => &SEGMENT_TOP,
        Parameter::IntermediateRatio => &INTERMEDIATE_RATIO,
        Parameter::ProgressionLength => &PROGRESSION_LENGTH,
        Parameter::NearAddition => &NEAR_ADDITION,
        Parameter::Degression => &DEGRESSION,
        Parameter::LowerSegmentTop => &LOWER_SEGMENT_TOP,
        Parameter::UpperSegmentBottom => &UPPER_SEGMENT_BOTTOM,
    }
}
