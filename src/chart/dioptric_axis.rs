//! The distance axis of the range chart. Distances are placed by their
//! vergence (1 / distance), so optical infinity sits at a finite place and
//! equal steps on the axis are equal steps of accommodation or addition;
//! the labels still read as distances, in the user's unit.

use crate::display::LengthUnit;

/// A horizontal axis mapping viewing distance to an SVG x coordinate:
/// optical infinity (0 D) at `x_far`, `max_vergence_d` dioptres at `x_near`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DioptricAxis {
    /// Dioptres at the near end of the axis (the closest distance shown).
    pub max_vergence_d: f64,
    /// SVG x of the near end, in user units.
    pub x_near: f64,
    /// SVG x of optical infinity, in user units.
    pub x_far: f64,
}

/// One labelled mark on the axis.
#[derive(Debug, Clone, PartialEq)]
pub struct Tick {
    /// SVG x of the mark.
    pub x: f64,
    /// The distance written for a reader ("50 cm", "∞").
    pub label: String,
}

/// Candidate tick distances in centimetres: round distances whose vergences
/// spread evenly (5, 4, 3, 2.5, 2, 1.5, 1, 0.5 D, and infinity).
const CM_TICKS: [f64; 8] = [20.0, 25.0, 33.0, 40.0, 50.0, 67.0, 100.0, 200.0];
/// Candidate tick distances in inches, chosen the same way.
const INCH_TICKS: [f64; 8] = [8.0, 10.0, 13.0, 16.0, 20.0, 26.0, 40.0, 80.0];

impl DioptricAxis {
    /// An axis that shows everything from optical infinity to at least
    /// `closest_m` metres, with a margin, and never less than 0.25 m (4 D).
    pub fn covering(closest_m: f64, x_near: f64, x_far: f64) -> DioptricAxis {
        let needed = if closest_m.is_finite() && closest_m > 0.0 {
            1.15 / closest_m
        } else {
            0.0
        };
        DioptricAxis {
            max_vergence_d: needed.clamp(4.0, 10.0),
            x_near,
            x_far,
        }
    }

    /// SVG x of a vergence in dioptres, clamped to the axis.
    pub fn x_of_vergence(&self, dioptres: f64) -> f64 {
        let t = (dioptres / self.max_vergence_d).clamp(0.0, 1.0);
        self.x_far + (self.x_near - self.x_far) * t
    }

    /// SVG x of a distance in metres; `None` stands for optical infinity.
    pub fn x_of_distance(&self, metres: Option<f64>) -> f64 {
        match metres {
            Some(m) if m > 0.0 => self.x_of_vergence(1.0 / m),
            Some(_) => self.x_near,
            None => self.x_far,
        }
    }

    /// The labelled marks that fit on this axis, for the user's unit,
    /// infinity included, ordered from far to near.
    pub fn ticks(&self, unit: LengthUnit) -> Vec<Tick> {
        let candidates: &[f64] = match unit {
            LengthUnit::Centimetres => &CM_TICKS,
            LengthUnit::Inches => &INCH_TICKS,
        };
        let mut ticks = vec![Tick {
            x: self.x_far,
            label: "∞".to_string(),
        }];
        for &value in candidates.iter().rev() {
            let metres = value * unit.metres_per_unit();
            if 1.0 / metres <= self.max_vergence_d + 1e-9 {
                ticks.push(Tick {
                    x: self.x_of_distance(Some(metres)),
                    label: distance_label(value, unit),
                });
            }
        }
        ticks
    }
}

/// A round distance written with its unit; metres or feet past a metre or a yard.
fn distance_label(value: f64, unit: LengthUnit) -> String {
    match unit {
        LengthUnit::Centimetres if value >= 100.0 => format!("{} m", value / 100.0),
        LengthUnit::Centimetres => format!("{value} cm"),
        LengthUnit::Inches => format!("{value} in"),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn axis() -> DioptricAxis {
        DioptricAxis {
            max_vergence_d: 5.0,
            x_near: 0.0,
            x_far: 500.0,
        }
    }

    #[test]
    fn distances_are_placed_by_vergence() {
        // Vergence = 1 / distance (ISO 13666 vocabulary): 1 m is 1 D, 50 cm is 2 D,
        // so on a 5 D axis 100 units wide per dioptre they sit 100 units apart.
        let a = axis();
        let check = |metres: Option<f64>, x: f64| {
            assert!((a.x_of_distance(metres) - x).abs() < 1e-9, "{metres:?}");
        };
        check(None, 500.0);
        check(Some(1.0), 400.0);
        check(Some(0.5), 300.0);
        check(Some(0.2), 0.0);
        check(Some(0.05), 0.0);
    }

    #[test]
    fn ticks_stay_on_the_axis_and_run_far_to_near() {
        let a = axis();
        for unit in [LengthUnit::Centimetres, LengthUnit::Inches] {
            let ticks = a.ticks(unit);
            assert_eq!(ticks[0].label, "∞");
            assert!(ticks.windows(2).all(|w| w[1].x < w[0].x));
            assert!(ticks.iter().all(|t| t.x >= 0.0 && t.x <= 500.0));
        }
        let labels: Vec<String> = a
            .ticks(LengthUnit::Centimetres)
            .into_iter()
            .map(|t| t.label)
            .collect();
        assert_eq!(
            labels,
            ["∞", "2 m", "1 m", "67 cm", "50 cm", "40 cm", "33 cm", "25 cm", "20 cm"]
        );
    }

    #[test]
    fn axis_covers_the_closest_task() {
        assert_eq!(DioptricAxis::covering(0.5, 0.0, 1.0).max_vergence_d, 4.0);
        assert!((DioptricAxis::covering(0.2, 0.0, 1.0).max_vergence_d - 5.75).abs() < 1e-9);
        assert_eq!(
            DioptricAxis::covering(f64::NAN, 0.0, 1.0).max_vergence_d,
            4.0
        );
    }
}
