//! Progressive-power lenses, modelled as a distance zone, a corridor in which
//! the addition rises smoothly, and a near zone.
//!
//! The profile along the corridor is this product's model, not any maker's
//! design: the addition starts to rise [`PROGRESSION_START_MM`] below the
//! fitting point and follows a raised-cosine ramp (see [`Ramp`]) to the full
//! addition at the near reference point, the progression length below the
//! fitting point. The corridor centre line moves nasally with the ramp's
//! progress, reaching the near inset at the near reference point, as the eyes
//! converge on nearer work.

use super::error::LensError;
use super::limits::{ADDITION, CORRIDOR_INSET, PROGRESSION_LENGTH};
use super::ramp::{Corridor, Ramp};
use super::{LensPoint, LensSample, Zone};
use crate::core::units::{Dioptres, Millimetres};

/// How far below the fitting point the addition starts to rise, in
/// millimetres. Common practice places the start of the progression at or
/// just below the fitting cross; 2 mm is this model's choice.
pub const PROGRESSION_START_MM: f64 = 2.0;

/// The usual nasal inset of the near reference point, in millimetres: about
/// 2 to 3 mm (common practice); 2.5 mm is used when none is given.
pub const DEFAULT_NEAR_INSET_MM: f64 = 2.5;

/// Lens needed below the near reference point for a usable near zone, in
/// millimetres: makers quote a minimum fitting height of about the
/// progression length plus 4 mm (common practice, from memory).
pub const NEAR_ZONE_BELOW_NRP_MM: f64 = 4.0;

/// A progressive-power lens: addition, progression length and near inset.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Progressive {
    corridor: Corridor,
}

impl Progressive {
    /// A progressive lens with `addition` dioptres (0 to 4 D) reached at the
    /// near reference point `progression_length` millimetres (10 to 24 mm)
    /// below the fitting point, inset `near_inset` millimetres nasally (0 to 5 mm).
    pub fn new(
        addition: Dioptres,
        progression_length: Millimetres,
        near_inset: Millimetres,
    ) -> Result<Progressive, LensError> {
        let addition = ADDITION.check(addition.0)?;
        let length = PROGRESSION_LENGTH.check(progression_length.0)?;
        let inset = CORRIDOR_INSET.check(near_inset.0)?;
        Ok(Progressive {
            corridor: Corridor::new(
                Ramp::new(
                    Millimetres(-PROGRESSION_START_MM),
                    Millimetres(-length),
                    Dioptres(0.0),
                    Dioptres(addition),
                ),
                inset,
            ),
        })
    }

    /// The full addition, reached at the near reference point, in dioptres.
    pub fn addition(&self) -> Dioptres {
        self.ramp().bottom_value()
    }

    /// Fitting point to near reference point, in millimetres.
    pub fn progression_length(&self) -> Millimetres {
        -self.ramp().bottom()
    }

    /// The smallest fitting height (fitting point above the lowest point of
    /// the lens) that leaves a usable near zone, in millimetres.
    pub fn minimum_fitting_height(&self) -> Millimetres {
        Millimetres(self.progression_length().0 + NEAR_ZONE_BELOW_NRP_MM)
    }

    /// Nasal inset of the near reference point, in millimetres.
    pub fn near_inset(&self) -> Millimetres {
        Millimetres(self.corridor.inset())
    }

    /// The near reference point on the lens.
    pub fn near_reference_point(&self) -> LensPoint {
        LensPoint {
            x: Millimetres(self.corridor.inset()),
            y: self.ramp().bottom(),
        }
    }

    /// The power profile along the corridor.
    pub fn ramp(&self) -> &Ramp {
        self.corridor.ramp()
    }

    /// The corridor centre line's nasal offset at height `y`, in millimetres.
    pub fn corridor_x(&self, y: Millimetres) -> Millimetres {
        self.corridor.x_at(y)
    }

    /// The addition and zone at a lens point: the addition depends on the
    /// height only (the model's simplification; see [`crate::core::astigmatism`]
    /// for the lateral limit of the corridor).
    pub fn evaluate(&self, point: LensPoint) -> LensSample {
        self.corridor.sample(point, Zone::Distance)
    }
}
