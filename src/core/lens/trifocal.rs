//! Trifocal lenses: a straight-top segment whose upper band, of conventional
//! height, carries an intermediate power (a share of the near addition,
//! conventionally half) above the near part carrying the full addition.

use super::error::LensError;
use super::limits::{ADDITION, BAND_HEIGHT, INTERMEDIATE_RATIO, SEGMENT_TOP};
use super::segment::SegmentShape;
use super::{BandSearch, HeightBand, LensPoint, LensSample, Zone};
use crate::core::units::{Dioptres, Millimetres};

/// The usual height of a trifocal's intermediate band, in millimetres
/// (7 mm bands, as in "7 x 28" trifocals: common practice).
pub const DEFAULT_BAND_HEIGHT_MM: f64 = 7.0;

/// The conventional intermediate power as a share of the near addition (common practice).
pub const DEFAULT_INTERMEDIATE_RATIO: f64 = 0.5;

/// A straight-top trifocal.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Trifocal {
    addition: f64,
    ratio: f64,
    top: f64,
    band: f64,
    shape: SegmentShape,
}

impl Trifocal {
    /// A trifocal with `addition` dioptres (0 to 4 D) in the near part, an
    /// intermediate band of `band_height` millimetres (4 to 12 mm) at
    /// `intermediate_ratio` (0.3 to 0.8) times the addition, the segment's
    /// straight top `segment_top` millimetres from the fitting point (-20 to +5 mm).
    pub fn new(
        addition: Dioptres,
        intermediate_ratio: f64,
        segment_top: Millimetres,
        band_height: Millimetres,
        shape: SegmentShape,
    ) -> Result<Trifocal, LensError> {
        Ok(Trifocal {
            addition: ADDITION.check(addition.0)?,
            ratio: INTERMEDIATE_RATIO.check(intermediate_ratio)?,
            top: SEGMENT_TOP.check(segment_top.0)?,
            band: BAND_HEIGHT.check(band_height.0)?,
            shape,
        })
    }

    /// The near addition, in dioptres.
    pub fn addition(&self) -> Dioptres {
        Dioptres(self.addition)
    }

    /// The addition of the intermediate band, in dioptres.
    pub fn intermediate_addition(&self) -> Dioptres {
        Dioptres(self.addition * self.ratio)
    }

    /// Height of the segment top, in millimetres from the fitting point.
    pub fn segment_top(&self) -> Millimetres {
        Millimetres(self.top)
    }

    /// Height of the boundary between the intermediate band and the near part,
    /// in millimetres from the fitting point.
    pub fn near_top(&self) -> Millimetres {
        Millimetres(self.top - self.band)
    }

    /// The segment outline.
    pub fn shape(&self) -> SegmentShape {
        self.shape
    }

    /// The addition and zone at a lens point.
    pub fn evaluate(&self, point: LensPoint) -> LensSample {
        match self.shape.depth_below(self.top, point) {
            None => LensSample::DISTANCE,
            Some(depth) if depth < self.band => LensSample {
                addition: self.intermediate_addition(),
                zone: Zone::Intermediate,
            },
            Some(_) => LensSample {
                addition: Dioptres(self.addition),
                zone: Zone::Near,
            },
        }
    }

    /// Heights, along the segment's centre line, of the distance portion,
    /// intermediate band and near part, offered to `search`.
    pub(crate) fn offer_bands(&self, search: &mut BandSearch) {
        let top = Millimetres(self.top);
        let near_top = self.near_top();
        let bottom = top - self.shape.depth();
        search.offer(0.0, &self.shape.distance_around(top, search.extent()));
        search.offer(
            self.intermediate_addition().0,
            &[HeightBand::new(near_top, top, Zone::Intermediate)],
        );
        search.offer(
            self.addition,
            &[HeightBand::new(bottom, near_top, Zone::Near)],
        );
    }
}
