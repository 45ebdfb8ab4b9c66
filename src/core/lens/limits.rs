//! The ranges of design parameters the lens models accept. They match the
//! ranges the scenario gate allows, so a checked scenario builds a design;
//! the narrower grids of what is usually made live in `catalogue`.

use super::error::Bounds;

/// Any addition over the distance power, in dioptres.
pub(crate) const ADDITION: Bounds = Bounds {
    parameter: "addition",
    min: 0.0,
    max: 4.0,
    unit: "D",
};

/// Near addition of a degressive lens, in dioptres.
pub(crate) const NEAR_ADDITION: Bounds = Bounds {
    parameter: "near addition",
    min: 0.5,
    max: 4.0,
    unit: "D",
};

/// Degression of a degressive lens, in dioptres.
pub(crate) const DEGRESSION: Bounds = Bounds {
    parameter: "degression",
    min: 0.5,
    max: 2.5,
    unit: "D",
};

/// Progression length, fitting point to near reference point, in millimetres.
pub(crate) const PROGRESSION_LENGTH: Bounds = Bounds {
    parameter: "progression length",
    min: 10.0,
    max: 24.0,
    unit: "mm",
};

/// Segment top relative to the fitting point, in millimetres.
pub(crate) const SEGMENT_TOP: Bounds = Bounds {
    parameter: "segment top",
    min: -20.0,
    max: 5.0,
    unit: "mm",
};

/// Bottom edge of an upper segment relative to the fitting point, in millimetres.
pub(crate) const UPPER_BOTTOM: Bounds = Bounds {
    parameter: "upper segment bottom",
    min: 3.0,
    max: 25.0,
    unit: "mm",
};

/// Trifocal intermediate power as a share of the near addition.
pub(crate) const INTERMEDIATE_RATIO: Bounds = Bounds {
    parameter: "intermediate ratio",
    min: 0.3,
    max: 0.8,
    unit: "",
};

/// Height of a trifocal intermediate band, in millimetres.
pub(crate) const BAND_HEIGHT: Bounds = Bounds {
    parameter: "intermediate band height",
    min: 4.0,
    max: 12.0,
    unit: "mm",
};

/// Nasal inset of a corridor's near end, in millimetres.
pub(crate) const CORRIDOR_INSET: Bounds = Bounds {
    parameter: "near inset",
    min: 0.0,
    max: 5.0,
    unit: "mm",
};
