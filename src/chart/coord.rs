//! A drawn coordinate: an SVG position rounded to a tenth of a unit (below a
//! pixel at every width the charts are drawn), so that two drawings of the
//! same marks compare equal and a changed mark can be told from an
//! unchanged one: the app redraws only the marks whose text changed.

/// An SVG coordinate in tenths of a unit.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
pub struct Coord(i64);

impl Coord {
    /// The coordinate `value` (SVG units), rounded to a tenth.
    pub fn of(value: f64) -> Coord {
        Coord((value * 10.0).round() as i64)
    }

    /// The coordinate moved by `offset` SVG units (rounded to a tenth).
    pub fn moved(self, offset: f64) -> Coord {
        Coord(self.0 + Coord::of(offset).0)
    }

    /// The coordinate as written in an SVG attribute: whole units, or one
    /// decimal ("270", "12.5", "-0.5"). Written from the whole tenths,
    /// without the floating-point printer: a chart writes hundreds of them
    /// on every edit.
    pub fn written(self) -> String {
        let whole = (self.0 / 10).to_string();
        let tenth = (self.0 % 10).unsigned_abs();
        match (tenth, self.0 < 0 && self.0 > -10) {
            (0, _) => whole,
            (_, true) => format!("-{whole}.{tenth}"),
            (_, false) => format!("{whole}.{tenth}"),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn coordinates_round_to_a_tenth() {
        assert_eq!(Coord::of(12.34), Coord::of(12.3));
        assert_ne!(Coord::of(12.36), Coord::of(12.3));
        assert_eq!(Coord::of(-0.04), Coord::of(0.0));
        assert_eq!(Coord::of(-0.04).written(), "0");
        assert_eq!(Coord::of(7.25).moved(0.5), Coord::of(7.8));
    }

    #[test]
    fn coordinates_are_written_as_rust_prints_the_same_tenths() {
        // Checked against the standard library's printing of the same
        // number of tenths as a float (the shortest decimal that reads back).
        for tenths in [-1234, -125, -10, -5, -1, 0, 1, 5, 10, 125, 2700, 8205] {
            let expected = (tenths as f64 / 10.0).to_string();
            assert_eq!(Coord(tenths).written(), expected, "{tenths} tenths");
        }
    }
}
