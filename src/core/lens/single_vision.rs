//! Single-vision lenses: one power over the whole lens, the distance power
//! plus a fixed addition (zero for distance lenses, an intermediate or near
//! power for task lenses).

use super::error::LensError;
use super::limits::ADDITION;
use super::{BandSearch, HeightBand, LensPoint, LensSample, Zone};
use crate::core::units::Dioptres;

/// A single-vision lens with one addition over the distance power everywhere.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SingleVision {
    addition: f64,
}

impl SingleVision {
    /// A lens whose whole area adds `addition` dioptres (0 to 4 D) to the distance power.
    pub fn new(addition: Dioptres) -> Result<SingleVision, LensError> {
        Ok(SingleVision {
            addition: ADDITION.check(addition.0)?,
        })
    }

    /// The addition over the distance power, in dioptres.
    pub fn addition(&self) -> Dioptres {
        Dioptres(self.addition)
    }

    /// The addition and zone at any lens point: the same everywhere.
    pub fn evaluate(&self, _point: LensPoint) -> LensSample {
        LensSample {
            addition: Dioptres(self.addition),
            zone: Zone::SingleVision,
        }
    }

    /// The whole lens height, offered to `search` with the lens's addition.
    pub(crate) fn offer_bands(&self, search: &mut BandSearch) {
        let extent = search.extent();
        search.offer(
            self.addition,
            &[HeightBand::new(
                extent.bottom(),
                extent.top(),
                Zone::SingleVision,
            )],
        );
    }

    /// The largest addition anywhere on the lens, in dioptres.
    pub fn max_addition(&self) -> Dioptres {
        Dioptres(self.addition)
    }
}
