//! The geometry of the lens map: a frame mapping lens millimetres (from the
//! fitting point, nasal right, up positive) to SVG units, the local addition
//! sampled over the lens as shaded cells, and the edges of the usable zone
//! where unwanted astigmatism reaches the tolerance.

use crate::core::astigmatism::{usable_width, ZoneWidth};
use crate::core::lens::{LensDesign, LensPoint};
use crate::core::units::{Dioptres, Millimetres};

/// Half the lens width drawn, in millimetres: the typical lens the planner
/// also assumes, since the scenario records only heights.
pub const HALF_WIDTH_MM: f64 = crate::core::gaze::TYPICAL_LENS_HALF_WIDTH_MM;

/// Maps lens millimetres to SVG units.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LensFrame {
    /// Lowest lens point, in mm from the fitting point (negative).
    pub bottom_mm: f64,
    /// Highest lens point, in mm from the fitting point.
    pub top_mm: f64,
    /// SVG units per millimetre.
    pub scale: f64,
    /// Margin around the lens, in SVG units.
    pub margin: f64,
}

/// Shades the map is drawn in: the local addition is rounded to one of this
/// many equal steps of the design's largest addition (under 0.13 D a step
/// for additions up to 4 D, finer than the 0.25 D steps additions come in).
pub const SHADE_STEPS: usize = 32;

/// A run of neighbouring cells of one row that share a shade: one
/// rectangle to fill, in SVG units.
#[derive(Debug, Clone, PartialEq)]
pub struct ShadeRun {
    /// SVG x of the left edge.
    pub x: f64,
    /// SVG y of the top edge.
    pub y: f64,
    /// Width, in SVG units.
    pub width: f64,
    /// Height, in SVG units.
    pub height: f64,
    /// The fill colour (see [`shade`]).
    pub colour: String,
}

/// One shaded cell of the map.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Cell {
    /// SVG x of the left edge.
    pub x: f64,
    /// SVG y of the top edge.
    pub y: f64,
    /// Width and height, in SVG units.
    pub size: f64,
    /// The local addition at the cell centre, in dioptres.
    pub addition_d: f64,
}

impl LensFrame {
    /// A frame for a lens whose fitting point is `fitting_height_mm` above
    /// its lowest point, `lens_height_mm` tall, drawn `width` SVG units wide.
    pub fn new(fitting_height_mm: f64, lens_height_mm: f64, width: f64) -> LensFrame {
        let margin = 12.0;
        LensFrame {
            bottom_mm: -fitting_height_mm,
            top_mm: lens_height_mm - fitting_height_mm,
            scale: (width - 2.0 * margin) / (2.0 * HALF_WIDTH_MM),
            margin,
        }
    }

    /// SVG x of a lens x in millimetres.
    pub fn x(&self, mm: f64) -> f64 {
        self.margin + (mm + HALF_WIDTH_MM) * self.scale
    }

    /// SVG y of a lens y in millimetres (up on the lens is up on screen).
    pub fn y(&self, mm: f64) -> f64 {
        self.margin + (self.top_mm - mm) * self.scale
    }

    /// The SVG width and height of the whole drawing.
    pub fn size(&self) -> (f64, f64) {
        (
            2.0 * self.margin + 2.0 * HALF_WIDTH_MM * self.scale,
            2.0 * self.margin + (self.top_mm - self.bottom_mm) * self.scale,
        )
    }

    /// The lens outline as SVG path data: a rectangle with rounded corners
    /// (radius a quarter of the height), the shape of a plain frame.
    pub fn outline(&self) -> String {
        let (x0, x1) = (self.x(-HALF_WIDTH_MM), self.x(HALF_WIDTH_MM));
        let (y0, y1) = (self.y(self.top_mm), self.y(self.bottom_mm));
        let r = ((y1 - y0) / 4.0).min((x1 - x0) / 4.0);
        format!(
            "M{:.1} {y0:.1}H{:.1}Q{x1:.1} {y0:.1} {x1:.1} {:.1}V{:.1}Q{x1:.1} {y1:.1} {:.1} {y1:.1}H{:.1}Q{x0:.1} {y1:.1} {x0:.1} {:.1}V{:.1}Q{x0:.1} {y0:.1} {:.1} {y0:.1}Z",
            x0 + r,
            x1 - r,
            y0 + r,
            y1 - r,
            x1 - r,
            x0 + r,
            y1 - r,
            y0 + r,
            x0 + r
        )
    }

    /// The local addition of `design` sampled on a grid of `step_mm` cells
    /// covering the lens box.
    pub fn cells(&self, design: &LensDesign, step_mm: f64) -> Vec<Cell> {
        let columns = (2.0 * HALF_WIDTH_MM / step_mm).ceil() as usize;
        let rows = ((self.top_mm - self.bottom_mm) / step_mm).ceil() as usize;
        let mut cells = Vec::with_capacity(columns * rows);
        for row in 0..rows {
            let top = self.top_mm - row as f64 * step_mm;
            for column in 0..columns {
                let left = -HALF_WIDTH_MM + column as f64 * step_mm;
                let centre = LensPoint {
                    x: Millimetres(left + step_mm / 2.0),
                    y: Millimetres(top - step_mm / 2.0),
                };
                cells.push(Cell {
                    x: self.x(left),
                    y: self.y(top),
                    size: step_mm * self.scale,
                    addition_d: design.addition_at(centre).0,
                });
            }
        }
        cells
    }

    /// The map of `design` sampled every `step_mm` ([`LensFrame::cells`]),
    /// rounded to [`SHADE_STEPS`] shades, with neighbouring cells of a row
    /// that share a shade merged into one rectangle: a few hundred
    /// rectangles to fill instead of one per cell.
    pub fn shade_runs(&self, design: &LensDesign, step_mm: f64) -> Vec<ShadeRun> {
        let max_d = design.max_addition().0;
        let step_of = |addition_d: f64| {
            let t = if max_d > 0.0 {
                (addition_d / max_d).clamp(0.0, 1.0)
            } else {
                0.0
            };
            (t * SHADE_STEPS as f64).round() as usize
        };
        let cells = self.cells(design, step_mm);
        let mut runs = Vec::new();
        let mut i = 0;
        while i < cells.len() {
            let first = cells[i];
            let step = step_of(first.addition_d);
            let mut end = i + 1;
            while end < cells.len()
                && cells[end].y == first.y
                && step_of(cells[end].addition_d) == step
            {
                end += 1;
            }
            let last = cells[end - 1];
            runs.push(ShadeRun {
                x: first.x,
                y: first.y,
                width: last.x + last.size - first.x,
                height: first.size,
                colour: shade(step as f64 / SHADE_STEPS as f64, 1.0),
            });
            i = end;
        }
        runs
    }

    /// The left and right edges of the usable zone of `design` as SVG path
    /// data: where unwanted astigmatism reaches `tolerance`, sampled every
    /// millimetre of height. Heights where the design does not limit the
    /// width break the path. Empty for designs without a corridor.
    pub fn zone_edges(
        &self,
        design: &LensDesign,
        tolerance: Dioptres,
        cor_to_lens: Millimetres,
    ) -> String {
        let mut path = String::new();
        for side in [-1.0, 1.0] {
            let mut pen_down = false;
            let mut y = self.bottom_mm;
            while y <= self.top_mm {
                let centre = design.corridor_x(Millimetres(y));
                let width = usable_width(design, Millimetres(y), tolerance, cor_to_lens);
                match (centre, width) {
                    (Some(cx), Ok(ZoneWidth::Limited { width, .. })) => {
                        let x = (cx.0 + side * width.0 / 2.0).clamp(-HALF_WIDTH_MM, HALF_WIDTH_MM);
                        let command = if pen_down { 'L' } else { 'M' };
                        path.push_str(&format!("{command}{:.1} {:.1}", self.x(x), self.y(y)));
                        pen_down = true;
                    }
                    _ => pen_down = false,
                }
                y += 1.0;
            }
        }
        path
    }
}

/// Height of a point label's box, in SVG units (12-unit bold type).
const LABEL_HEIGHT: f64 = 14.0;
/// Width of one character of a point label, in SVG units (bold, generous).
const LABEL_CHAR_WIDTH: f64 = 7.8;
/// Half the side of the square kept clear around the fitting cross.
const CROSS_CLEARANCE: f64 = 10.0;

/// Where to write the labels of task points so that no label covers
/// another or the fitting cross: each point is `(x, y, characters)` in SVG
/// units, the cross is at `cross`; the result is each label's left end and
/// baseline. A label goes right of its dot when it can, else left of it,
/// moved up or down a line at a time until it is clear (after six lines
/// either way it is written where it first would be).
pub fn label_places(points: &[(f64, f64, usize)], cross: (f64, f64)) -> Vec<(f64, f64)> {
    /// A box as left, top, right, bottom.
    type Box = (f64, f64, f64, f64);
    let overlaps = |a: Box, b: Box| a.0 < b.2 && b.0 < a.2 && a.1 < b.3 && b.1 < a.3;
    let mut taken: Vec<Box> = vec![(
        cross.0 - CROSS_CLEARANCE,
        cross.1 - CROSS_CLEARANCE,
        cross.0 + CROSS_CLEARANCE,
        cross.1 + CROSS_CLEARANCE,
    )];
    // Every dot is taken too, so no label covers another task's dot.
    taken.extend(
        points
            .iter()
            .map(|&(x, y, _)| (x - 5.0, y - 5.0, x + 5.0, y + 5.0)),
    );
    let mut places = Vec::with_capacity(points.len());
    for &(x, y, characters) in points {
        let width = characters as f64 * LABEL_CHAR_WIDTH;
        let candidate = |line: i32, right: bool| {
            let left = if right { x + 8.0 } else { x - 8.0 - width };
            let baseline = y + 4.0 + f64::from(line) * LABEL_HEIGHT;
            (
                left,
                baseline,
                (left, baseline - 11.0, left + width, baseline + 3.0),
            )
        };
        let lines = (0..=6).flat_map(|n: i32| if n == 0 { vec![0] } else { vec![n, -n] });
        let found = lines
            .flat_map(|line| [candidate(line, true), candidate(line, false)])
            .find(|&(_, _, b)| taken.iter().all(|&t| !overlaps(b, t)));
        let (left, baseline, b) = found.unwrap_or_else(|| candidate(0, true));
        taken.push(b);
        places.push((left, baseline));
    }
    places
}

/// A fill colour for a local addition out of `max_d`: a single-hue ramp from
/// near-white (no addition) to deep blue (full addition), which reads in
/// greyscale and for every common colour-vision deficiency.
pub fn shade(addition_d: f64, max_d: f64) -> String {
    let t = if max_d > 0.0 {
        (addition_d / max_d).clamp(0.0, 1.0)
    } else {
        0.0
    };
    let mix = |from: f64, to: f64| (from + (to - from) * t).round() as u8;
    format!(
        "#{:02x}{:02x}{:02x}",
        mix(247.0, 24.0),
        mix(249.0, 78.0),
        mix(252.0, 140.0)
    )
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::core::lens::{Progressive, SingleVision};

    #[test]
    fn millimetres_map_to_the_drawing() {
        // A 32 mm lens with the fitting point 20 mm up: 12 mm above, 20 below.
        let f = LensFrame::new(20.0, 32.0, 124.0);
        assert!((f.scale - 2.0).abs() < 1e-12);
        assert!((f.x(0.0) - 62.0).abs() < 1e-12);
        assert!((f.y(12.0) - 12.0).abs() < 1e-12);
        assert!((f.y(-20.0) - 76.0).abs() < 1e-12);
        assert_eq!(f.size(), (124.0, 88.0));
        assert!(f.outline().starts_with('M') && f.outline().ends_with('Z'));
    }

    #[test]
    fn cells_sample_the_designs_own_map() {
        let f = LensFrame::new(20.0, 32.0, 124.0);
        let design = LensDesign::Progressive(
            Progressive::new(Dioptres(2.0), Millimetres(16.0), Millimetres(2.5)).expect("valid"),
        );
        let cells = f.cells(&design, 2.0);
        assert_eq!(cells.len(), 25 * 16);
        let top = cells.first().expect("cells").addition_d;
        let bottom = cells.last().expect("cells").addition_d;
        assert!(top.abs() < 1e-9, "no addition at the top: {top}");
        assert!(
            (bottom - 2.0).abs() < 1e-9,
            "full addition at the bottom: {bottom}"
        );
        assert!(!f
            .zone_edges(&design, Dioptres(0.5), Millimetres(27.0))
            .is_empty());
        let flat = LensDesign::SingleVision(SingleVision::new(Dioptres(1.0)).expect("valid"));
        assert!(f
            .zone_edges(&flat, Dioptres(0.5), Millimetres(27.0))
            .is_empty());
    }

    #[test]
    fn shade_runs_cover_every_cell_once() {
        // Every cell of the sampled grid belongs to exactly one run: the
        // runs' widths add up to the grid's width in every row, and a
        // single-vision lens (one power) is one run a row.
        let f = LensFrame::new(20.0, 32.0, 124.0);
        let design = LensDesign::Progressive(
            Progressive::new(Dioptres(2.0), Millimetres(16.0), Millimetres(2.5)).expect("valid"),
        );
        let runs = f.shade_runs(&design, 2.0);
        let rows = 16;
        let grid_width = 2.0 * HALF_WIDTH_MM * f.scale;
        let widths: f64 = runs.iter().map(|r| r.width).sum();
        assert!((widths - rows as f64 * grid_width).abs() < 1e-6);
        assert!(runs.len() >= rows);
        let (top, bottom) = (&runs[0], &runs[runs.len() - 1]);
        assert_eq!(
            (top.colour.as_str(), bottom.colour.as_str()),
            ("#f7f9fc", "#184e8c")
        );
        let flat = LensDesign::SingleVision(SingleVision::new(Dioptres(1.0)).expect("valid"));
        let flat_runs = f.shade_runs(&flat, 2.0);
        assert_eq!(flat_runs.len(), rows);
        assert!(flat_runs
            .iter()
            .all(|r| (r.width - grid_width).abs() < 1e-9));
    }

    #[test]
    fn labels_of_points_at_one_place_do_not_cover_each_other_or_the_cross() {
        // Two tasks seen at the same point of the lens, beside the fitting
        // cross: both labels are written, one a line away from the other,
        // and neither covers the cross.
        let places = label_places(&[(100.0, 50.0, 8), (100.0, 50.0, 8)], (108.0, 54.0));
        assert_eq!(places.len(), 2);
        let (a, b) = (places[0], places[1]);
        assert!((a.1 - b.1).abs() >= LABEL_HEIGHT || (a.0 - b.0).abs() >= 8.0 * LABEL_CHAR_WIDTH);
        for (left, baseline) in places {
            let clear_of_cross = left > 118.0
                || left + 8.0 * LABEL_CHAR_WIDTH < 98.0
                || baseline - 11.0 > 64.0
                || baseline + 3.0 < 44.0;
            assert!(
                clear_of_cross,
                "label at ({left}, {baseline}) covers the cross"
            );
        }
        // A lone point far from the cross keeps its label right of the dot.
        assert_eq!(
            label_places(&[(10.0, 10.0, 4)], (200.0, 200.0)),
            vec![(18.0, 14.0)]
        );
    }

    #[test]
    fn shades_run_light_to_dark() {
        assert_eq!(shade(0.0, 2.0), "#f7f9fc");
        assert_eq!(shade(2.0, 2.0), "#184e8c");
        assert_eq!(shade(5.0, 0.0), "#f7f9fc");
    }
}
