//! Bifocal lenses: a distance portion with a straight-top near segment whose
//! top sits at a chosen height relative to the fitting point; the full
//! addition everywhere inside the segment.

use super::error::LensError;
use super::limits::{ADDITION, SEGMENT_TOP};
use super::segment::SegmentShape;
use super::{BandSearch, HeightBand, LensPoint, LensSample, Zone};
use crate::core::units::{Dioptres, Millimetres};

/// A straight-top bifocal.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Bifocal {
    addition: f64,
    top: f64,
    shape: SegmentShape,
}

impl Bifocal {
    /// A bifocal adding `addition` dioptres (0 to 4 D) inside a segment of
    /// `shape` whose straight top lies `segment_top` millimetres from the
    /// fitting point (-20 to +5 mm, negative is below).
    pub fn new(
        addition: Dioptres,
        segment_top: Millimetres,
        shape: SegmentShape,
    ) -> Result<Bifocal, LensError> {
        Ok(Bifocal {
            addition: ADDITION.check(addition.0)?,
            top: SEGMENT_TOP.check(segment_top.0)?,
            shape,
        })
    }

    /// The segment addition, in dioptres.
    pub fn addition(&self) -> Dioptres {
        Dioptres(self.addition)
    }

    /// Height of the segment top, in millimetres from the fitting point.
    pub fn segment_top(&self) -> Millimetres {
        Millimetres(self.top)
    }

    /// The segment outline.
    pub fn shape(&self) -> SegmentShape {
        self.shape
    }

    /// The addition and zone at a lens point.
    pub fn evaluate(&self, point: LensPoint) -> LensSample {
        match self.shape.depth_below(self.top, point) {
            Some(_) => LensSample {
                addition: Dioptres(self.addition),
                zone: Zone::Near,
            },
            None => LensSample::DISTANCE,
        }
    }

    /// Heights, along the segment's centre line, of the segment and of the
    /// distance portion above and below it, offered to `search`.
    pub(crate) fn offer_bands(&self, search: &mut BandSearch) {
        let top = Millimetres(self.top);
        let bottom = top - self.shape.depth();
        search.offer(0.0, &self.shape.distance_around(top, search.extent()));
        search.offer(self.addition, &[HeightBand::new(bottom, top, Zone::Near)]);
    }
}
