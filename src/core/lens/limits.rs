//! The ranges of design parameters the lens models accept. They match the
//! ranges the scenario gate allows, so a checked scenario builds a design;
//! the narrower grids of what is usually made live in `catalogue`.

use super::error::NamedBounds;

/// Any addition over the distance power, in dioptres.
pub(crate) const ADDITION: NamedBounds = NamedBounds::new("addition", 0.0, 4.0, "D");

/// Near addition of a degressive lens, in dioptres.
pub(crate) const NEAR_ADDITION: NamedBounds = NamedBounds::new("near addition", 0.5, 4.0, "D");

/// Degression of a degressive lens, in dioptres.
pub(crate) const DEGRESSION: NamedBounds = NamedBounds::new("degression", 0.5, 2.5, "D");

/// Progression length, fitting point to near reference point, in millimetres.
pub(crate) const PROGRESSION_LENGTH: NamedBounds =
    NamedBounds::new("progression length", 10.0, 24.0, "mm");

/// Segment top relative to the fitting point, in millimetres.
pub(crate) const SEGMENT_TOP: NamedBounds = NamedBounds::new("segment top", -20.0, 5.0, "mm");

/// Bottom edge of an upper segment relative to the fitting point, in millimetres.
pub(crate) const UPPER_BOTTOM: NamedBounds =
    NamedBounds::new("upper segment bottom", 3.0, 25.0, "mm");

/// Trifocal intermediate power as a share of the near addition.
pub(crate) const INTERMEDIATE_RATIO: NamedBounds =
    NamedBounds::new("intermediate ratio", 0.3, 0.8, "");

/// Height of a trifocal intermediate band, in millimetres.
pub(crate) const BAND_HEIGHT: NamedBounds =
    NamedBounds::new("intermediate band height", 4.0, 12.0, "mm");

/// Nasal inset of a corridor's near end, in millimetres.
pub(crate) const CORRIDOR_INSET: NamedBounds = NamedBounds::new("near inset", 0.0, 5.0, "mm");
