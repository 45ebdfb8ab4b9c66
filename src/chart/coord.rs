//! A drawn coordinate: an SVG position rounded to a tenth of a unit (below a
//! pixel at every width the charts are drawn), so that two drawings of the
//! same marks compare equal and a changed mark can be told from an
//! unchanged one. The app keys its chart rows by such values and redraws
//! only the rows that moved.

/// An SVG coordinate in tenths of a unit.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
pub struct Coord(i64);

impl Coord {
    /// The coordinate `value` (SVG units), rounded to a tenth.
    pub fn of(value: f64) -> Coord {
        Coord((value * 10.0).round() as i64)
    }

    /// The coordinate in SVG units.
    pub fn get(self) -> f64 {
        self.0 as f64 / 10.0
    }

    /// The coordinate moved by `offset` SVG units.
    pub fn plus(self, offset: f64) -> f64 {
        self.get() + offset
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn coordinates_round_to_a_tenth() {
        assert_eq!(Coord::of(12.34), Coord::of(12.3));
        assert_ne!(Coord::of(12.36), Coord::of(12.3));
        assert_eq!(Coord::of(-0.04).get(), 0.0);
        assert_eq!(Coord::of(7.25).plus(0.5), 7.8);
    }
}
