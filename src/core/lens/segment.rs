//! The outline of a straight-top fused or moulded segment (bifocal, trifocal
//! and double-segment lenses): a disc cut by a straight edge, placed on the
//! lens with a nasal inset. It answers "is this lens point inside the
//! segment?" and "how wide is the segment at this height?".

use super::error::{LensError, NamedBounds};
use super::{HeightBand, LensPoint, VerticalExtent, Zone};
use crate::core::units::Millimetres;

/// Allowed segment widths, in millimetres. Straight-top segments are commonly
/// made 22 to 45 mm wide (28 mm the most usual): from memory.
const WIDTH: NamedBounds = NamedBounds::new("segment width", 20.0, 45.0, "mm");

/// Allowed nasal insets of the segment centre, in millimetres.
const INSET: NamedBounds = NamedBounds::new("segment inset", 0.0, 5.0, "mm");

/// The shape and placement of a straight-top segment.
///
/// The outline is modelled as a disc whose diameter is the nominal segment
/// width, cut by the straight edge; the disc centre lies `edge_to_centre`
/// millimetres from the straight edge, inside the segment. The segment's
/// vertical centre line is inset nasally from the fitting point.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SegmentShape {
    width: f64,
    edge_to_centre: f64,
    inset: f64,
}

impl SegmentShape {
    /// A 28 mm straight-top segment, the most usual width (from memory), with
    /// its widest point 5 mm below the straight edge (from memory) and a
    /// 2 mm nasal inset. The inset is what the near-PD formula gives for a
    /// 32 mm monocular PD at 40 cm with 27 mm from lens to centre of rotation:
    /// 32 x 27 / 427 = 2.02 mm.
    pub const STRAIGHT_TOP_28: SegmentShape = SegmentShape {
        width: 28.0,
        edge_to_centre: 5.0,
        inset: 2.0,
    };

    /// A segment `width` millimetres wide whose widest point lies
    /// `edge_to_centre` millimetres from its straight edge, with its centre
    /// line `inset` millimetres nasal of the fitting point.
    pub fn new(
        width: Millimetres,
        edge_to_centre: Millimetres,
        inset: Millimetres,
    ) -> Result<SegmentShape, LensError> {
        let width = WIDTH.check(width.0)?;
        let edge_to_centre = NamedBounds::new(
            "distance from the segment edge to its widest point",
            0.0,
            0.5 * width,
            "mm",
        )
        .check(edge_to_centre.0)?;
        let inset = INSET.check(inset.0)?;
        Ok(SegmentShape {
            width,
            edge_to_centre,
            inset,
        })
    }

    /// The nominal (largest) width of the segment, in millimetres.
    pub fn width(&self) -> Millimetres {
        Millimetres(self.width)
    }

    /// Nasal inset of the segment centre line from the fitting point, in millimetres.
    pub fn inset(&self) -> Millimetres {
        Millimetres(self.inset)
    }

    /// How far the segment reaches from its straight edge, in millimetres
    /// (the edge-to-centre distance plus the disc radius).
    pub fn depth(&self) -> Millimetres {
        Millimetres(self.edge_to_centre + 0.5 * self.width)
    }

    /// Width of the segment at `depth` millimetres inside its straight edge
    /// (0 at the edge), in millimetres; zero outside the segment.
    pub fn chord_at_depth(&self, depth: f64) -> Millimetres {
        let radius = 0.5 * self.width;
        let from_centre = depth - self.edge_to_centre;
        if depth < 0.0 || from_centre.abs() > radius {
            return Millimetres(0.0);
        }
        Millimetres(2.0 * (radius * radius - from_centre * from_centre).sqrt())
    }

    /// Whether the lens point (`x` nasal, in millimetres) at `depth` millimetres
    /// inside the straight edge lies in the segment.
    pub fn contains(&self, x: f64, depth: f64) -> bool {
        let half = 0.5 * self.chord_at_depth(depth).0;
        depth >= 0.0 && half > 0.0 && (x - self.inset).abs() <= half
    }

    /// How far, in millimetres, `point` lies below a straight top at height
    /// `top` (millimetres from the fitting point) when it is inside a segment
    /// of this shape hanging from that top; `None` outside it.
    pub(crate) fn depth_below(&self, top: f64, point: LensPoint) -> Option<f64> {
        let depth = top - point.y.0;
        self.contains(point.x.0, depth).then_some(depth)
    }

    /// Whether `point` is inside an inverted segment of this shape standing
    /// on a straight bottom edge at height `bottom` (millimetres from the
    /// fitting point).
    pub(crate) fn covers_above(&self, bottom: f64, point: LensPoint) -> bool {
        self.contains(point.x.0, point.y.0 - bottom)
    }

    /// The distance portion around a segment hanging from a straight top at
    /// height `top`: from the top up to the lens top, and from the segment's
    /// lowest point down to the lens bottom (heights in millimetres from the
    /// fitting point).
    pub(crate) fn distance_around(
        &self,
        top: Millimetres,
        extent: VerticalExtent,
    ) -> [HeightBand; 2] {
        let bottom = top - self.depth();
        [
            HeightBand::new(top, extent.top(), Zone::Distance),
            HeightBand::new(extent.bottom(), bottom, Zone::Distance),
        ]
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn chord_of_the_disc_outline() {
        // Chord of a circle of radius r at distance d from its centre:
        // 2 sqrt(r^2 - d^2). For the 28 mm outline with the centre 5 mm inside
        // the edge: at the edge 2 sqrt(196 - 25) = 26.153 mm; at 5 mm it is
        // the full 28 mm; at 19 mm (the bottom of the disc) it is zero.
        let s = SegmentShape::STRAIGHT_TOP_28;
        let check = |depth: f64, expected: f64| {
            let got = s.chord_at_depth(depth).0;
            assert!(
                (got - expected).abs() < 1e-3,
                "depth {depth}: {got} vs {expected}"
            );
        };
        check(0.0, 26.153);
        check(5.0, 28.0);
        check(19.0, 0.0);
        check(-0.1, 0.0);
        assert!(s.contains(2.0 + 13.9, 5.0));
        assert!(!s.contains(2.0 + 14.1, 5.0));
        assert!(!s.contains(2.0, -0.5));
    }

    #[test]
    fn invalid_shapes_are_refused() {
        let e = SegmentShape::new(Millimetres(28.0), Millimetres(15.0), Millimetres(2.0));
        assert!(matches!(e, Err(LensError::OutOfRange { .. })));
        let e = SegmentShape::new(Millimetres(f64::NAN), Millimetres(5.0), Millimetres(2.0));
        assert!(matches!(e, Err(LensError::NotFinite { .. })));
        assert!(SegmentShape::new(Millimetres(25.0), Millimetres(4.0), Millimetres(1.5)).is_ok());
    }
}
