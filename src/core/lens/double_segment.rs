//! Double-segment lenses for overhead work: a straight-top near segment below
//! the fitting point and a second, inverted segment with the same addition at
//! the top of the lens, with the distance portion between them.

use super::error::LensError;
use super::limits::{ADDITION, SEGMENT_TOP, UPPER_BOTTOM};
use super::segment::SegmentShape;
use super::{BandSearch, HeightBand, LensPoint, LensSample, Zone};
use crate::core::units::{Dioptres, Millimetres};

/// A double-segment lens.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DoubleSegment {
    addition: f64,
    lower_top: f64,
    upper_bottom: f64,
    shape: SegmentShape,
}

impl DoubleSegment {
    /// A lens with `addition` dioptres (0 to 4 D) in both segments: the lower
    /// one's straight top `lower_top` millimetres from the fitting point
    /// (-20 to +5 mm), the upper one's straight bottom edge `upper_bottom`
    /// millimetres above it (3 to 25 mm, higher than the lower top), both of `shape`.
    pub fn new(
        addition: Dioptres,
        lower_top: Millimetres,
        upper_bottom: Millimetres,
        shape: SegmentShape,
    ) -> Result<DoubleSegment, LensError> {
        let addition = ADDITION.check(addition.0)?;
        let lower_top = SEGMENT_TOP.check(lower_top.0)?;
        let upper_bottom = UPPER_BOTTOM.check(upper_bottom.0)?;
        if upper_bottom <= lower_top {
            return Err(LensError::SegmentsOverlap {
                lower_top_mm: lower_top,
                upper_bottom_mm: upper_bottom,
            });
        }
        Ok(DoubleSegment {
            addition,
            lower_top,
            upper_bottom,
            shape,
        })
    }

    /// The addition of both segments, in dioptres.
    pub fn addition(&self) -> Dioptres {
        Dioptres(self.addition)
    }

    /// Height of the lower segment's top, in millimetres from the fitting point.
    pub fn lower_top(&self) -> Millimetres {
        Millimetres(self.lower_top)
    }

    /// Height of the upper segment's bottom edge, in millimetres from the fitting point.
    pub fn upper_bottom(&self) -> Millimetres {
        Millimetres(self.upper_bottom)
    }

    /// The outline of each segment.
    pub fn shape(&self) -> SegmentShape {
        self.shape
    }

    /// The addition and zone at a lens point.
    pub fn evaluate(&self, point: LensPoint) -> LensSample {
        let zone = if self.shape.depth_below(self.lower_top, point).is_some() {
            Zone::Near
        } else if self.shape.covers_above(self.upper_bottom, point) {
            Zone::UpperSegment
        } else {
            Zone::Distance
        };
        let addition = if zone == Zone::Distance {
            0.0
        } else {
            self.addition
        };
        LensSample {
            addition: Dioptres(addition),
            zone,
        }
    }

    /// Heights, along the segments' centre line, of the lower segment, the
    /// distance portion and the upper segment, offered to `search`.
    pub(crate) fn offer_bands(&self, search: &mut BandSearch) {
        let extent = search.extent();
        let lower = Millimetres(self.lower_top);
        let upper = Millimetres(self.upper_bottom);
        let depth = self.shape.depth();
        search.offer(
            self.addition,
            &[
                HeightBand::new(lower - depth, lower, Zone::Near),
                HeightBand::new(upper, upper + depth, Zone::UpperSegment),
            ],
        );
        search.offer(
            0.0,
            &[
                HeightBand::new(lower, upper, Zone::Distance),
                HeightBand::new(extent.bottom(), lower - depth, Zone::Distance),
                HeightBand::new(upper + depth, extent.top(), Zone::Distance),
            ],
        );
    }
}
