//! The ranges of design parameters the lens models accept, named for their
//! messages: the scenario gate's own ranges from [`crate::core::limits`], so
//! a checked scenario builds a design, and the model-only ranges (band
//! height, corridor inset). The narrower grids of what is usually made live
//! in `catalogue`.

use super::error::NamedBounds;
use crate::core::limits;

/// Any addition over the distance power, in dioptres.
pub(crate) const ADDITION: NamedBounds = NamedBounds::of("addition", limits::ADDITION);

/// Near addition of a degressive lens, in dioptres.
pub(crate) const NEAR_ADDITION: NamedBounds =
    NamedBounds::of("near addition", limits::NEAR_ADDITION);

/// Degression of a degressive lens, in dioptres.
pub(crate) const DEGRESSION: NamedBounds = NamedBounds::of("degression", limits::DEGRESSION);

/// Progression length, fitting point to near reference point, in millimetres.
pub(crate) const PROGRESSION_LENGTH: NamedBounds =
    NamedBounds::of("progression length", limits::PROGRESSION_LENGTH);

/// Segment top relative to the fitting point, in millimetres.
pub(crate) const SEGMENT_TOP: NamedBounds = NamedBounds::of("segment top", limits::SEGMENT_TOP);

/// Bottom edge of an upper segment relative to the fitting point, in millimetres.
pub(crate) const UPPER_BOTTOM: NamedBounds =
    NamedBounds::of("upper segment bottom", limits::UPPER_BOTTOM);

/// Trifocal intermediate power as a share of the near addition.
pub(crate) const INTERMEDIATE_RATIO: NamedBounds =
    NamedBounds::of("intermediate ratio", limits::INTERMEDIATE_RATIO);

/// Height of a trifocal intermediate band, in millimetres.
pub(crate) const BAND_HEIGHT: NamedBounds =
    NamedBounds::new("intermediate band height", 4.0, 12.0, "mm");

/// Nasal inset of a corridor's near end, in millimetres.
pub(crate) const CORRIDOR_INSET: NamedBounds = NamedBounds::new("near inset", 0.0, 5.0, "mm");
