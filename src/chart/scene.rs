//! Pictures of a task for the wearer walkthrough, drawn by the app in grey:
//! a screen with text, a printed page, a bench with small parts, a road with
//! a sign, or a notice on a wall. Everything is measured in *cells*, the
//! size of the task's critical detail in the picture: the strokes of the
//! letters (a 5 x 7 dot matrix, so a letter is 7 details high) and the
//! smallest parts are one cell wide, so blurring the picture with the blur
//! disc at the same scale shows what the defocus does to that detail.

use crate::core::blur_image::{GreyImage, ARCMIN_PER_RADIAN};
use crate::core::units::{Metres, Millimetres};
use crate::scenario::Task;

/// How large a task's critical detail is drawn, in pixels: large enough for
/// a letter stroke to show on a tablet held at arm's length (a product choice).
pub const DETAIL_PX: f64 = 3.0;

/// The angular scale of a picture: how many pixels one minute of arc at the
/// eye takes, when a critical detail of `detail` seen at `distance` is drawn
/// [`DETAIL_PX`] pixels wide. The detail subtends 2 atan(detail / 2 distance).
///
/// ```
/// use clearspan::chart::scene::px_per_arcmin;
/// use clearspan::core::units::{Metres, Millimetres};
/// // 1.5 mm at 65 cm: 2.308 mrad = 7.93 arcmin, drawn 3 px: 0.378 px per arcmin.
/// let scale = px_per_arcmin(Millimetres(1.5), Metres(0.65));
/// assert!((scale - 0.3781).abs() < 1e-3);
/// ```
pub fn px_per_arcmin(detail: Millimetres, distance: Metres) -> f64 {
    let angle = 2.0 * (detail.to_m().0 / (2.0 * distance.0)).atan();
    DETAIL_PX / (angle * ARCMIN_PER_RADIAN)
}

/// The kinds of picture the walkthrough can draw.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum SceneKind {
    /// A display with lines of text (monitor, laptop, dashboard, instrument).
    Screen,
    /// A printed page or a phone held close, with lines of text.
    Page,
    /// A work surface with small parts, wires and a printed label.
    Bench,
    /// A road ahead with a sign beside it.
    Road,
    /// A notice on a wall across the room.
    Wall,
}

/// Every scene kind, in a fixed order (for tests and listings).
pub const SCENE_KINDS: [SceneKind; 5] = [
    SceneKind::Screen,
    SceneKind::Page,
    SceneKind::Bench,
    SceneKind::Road,
    SceneKind::Wall,
];

impl SceneKind {
    /// The picture for a task, from what the scenario says of it: a road
    /// for driving beyond 2 m, a notice for anything else beyond 1.2 m,
    /// parts on a bench for hazardous or overhead work and for detail
    /// finer than 0.3 mm, a page for text within 55 cm, a screen otherwise.
    pub fn for_task(task: &Task) -> SceneKind {
        let hazards = task.flags.hazards;
        let workshop = hazards.impact
            || hazards.splash_or_aerosol
            || hazards.dust
            || task.flags.overhead
            || task.detail_mm < 0.3;
        if task.flags.driving && task.distance_m > 2.0 {
            SceneKind::Road
        } else if task.distance_m > 1.2 {
            SceneKind::Wall
        } else if workshop {
            SceneKind::Bench
        } else if task.distance_m <= 0.55 {
            SceneKind::Page
        } else {
            SceneKind::Screen
        }
    }

    /// A few plain words naming what the picture shows.
    pub fn describe(self) -> &'static str {
        match self {
            SceneKind::Screen => "a screen with text",
            SceneKind::Page => "a page of print",
            SceneKind::Bench => "small parts on a work surface",
            SceneKind::Road => "the road ahead with a sign",
            SceneKind::Wall => "a notice across the room",
        }
    }
}

const INK: u8 = 30;
const PAPER: u8 = 248;
const LETTER_ROWS: usize = 7;
const LETTER_COLUMNS: usize = 5;
/// Cells from the start of one letter to the next (5 wide, one apart).
const ADVANCE: f64 = 6.0;
/// Cells from one line of text to the next.
const LINE: f64 = 11.0;

/// The 5 x 7 dot-matrix letters, each row's dots as the low five bits (the
/// leftmost dot the highest bit). Unknown characters draw as a space.
const GLYPHS: [(char, [u8; LETTER_ROWS]); 36] = [
    ('A', [14, 17, 17, 31, 17, 17, 17]),
    ('B', [30, 17, 17, 30, 17, 17, 30]),
    ('C', [14, 17, 16, 16, 16, 17, 14]),
    ('D', [30, 17, 17, 17, 17, 17, 30]),
    ('E', [31, 16, 16, 30, 16, 16, 31]),
    ('F', [31, 16, 16, 30, 16, 16, 16]),
    ('G', [14, 17, 16, 23, 17, 17, 15]),
    ('H', [17, 17, 17, 31, 17, 17, 17]),
    ('I', [14, 4, 4, 4, 4, 4, 14]),
    ('J', [7, 2, 2, 2, 2, 18, 12]),
    ('K', [17, 18, 20, 24, 20, 18, 17]),
    ('L', [16, 16, 16, 16, 16, 16, 31]),
    ('M', [17, 27, 21, 21, 17, 17, 17]),
    ('N', [17, 17, 25, 21, 19, 17, 17]),
    ('O', [14, 17, 17, 17, 17, 17, 14]),
    ('P', [30, 17, 17, 30, 16, 16, 16]),
    ('Q', [14, 17, 17, 17, 21, 18, 13]),
    ('R', [30, 17, 17, 30, 20, 18, 17]),
    ('S', [15, 16, 16, 14, 1, 1, 30]),
    ('T', [31, 4, 4, 4, 4, 4, 4]),
    ('U', [17, 17, 17, 17, 17, 17, 14]),
    ('V', [17, 17, 17, 17, 17, 10, 4]),
    ('W', [17, 17, 17, 21, 21, 21, 10]),
    ('X', [17, 17, 10, 4, 10, 17, 17]),
    ('Y', [17, 17, 10, 4, 4, 4, 4]),
    ('Z', [31, 1, 2, 4, 8, 16, 31]),
    ('0', [14, 17, 19, 21, 25, 17, 14]),
    ('1', [4, 12, 4, 4, 4, 4, 14]),
    ('2', [14, 17, 1, 2, 4, 8, 31]),
    ('3', [31, 2, 4, 2, 1, 17, 14]),
    ('4', [2, 6, 10, 18, 31, 2, 2]),
    ('5', [31, 16, 30, 1, 1, 17, 14]),
    ('6', [6, 8, 16, 30, 17, 17, 14]),
    ('7', [31, 1, 2, 4, 8, 8, 8]),
    ('8', [14, 17, 17, 14, 17, 17, 14]),
    ('9', [14, 17, 17, 15, 1, 2, 12]),
];

/// Invented lines of text the screens, pages and notices show.
const TEXT: [&str; 8] = [
    "ORDER 4077 READY FOR PACKING",
    "MEETING MOVED TO ROOM 12",
    "CHECK THE VALUES BEFORE NOON",
    "SAMPLE 38 LABEL AND STORE COLD",
    "QUARTERLY FIGURES DUE FRIDAY",
    "NEW PARTS ARRIVE ON MONDAY",
    "KEEP THE DOOR CLOSED",
    "CALL BACK AFTER 3",
];

/// A picture being drawn, in cells of `cell` pixels.
struct Canvas {
    image: GreyImage,
    cell: f64,
}

impl Canvas {
    /// Width and height of the picture in cells.
    fn size(&self) -> (f64, f64) {
        (
            self.image.width() as f64 / self.cell,
            self.image.height() as f64 / self.cell,
        )
    }

    /// Fills the rectangle at (`x`, `y`), `w` by `h`, all in cells.
    fn rect(&mut self, x: f64, y: f64, w: f64, h: f64, value: u8) {
        let c = self.cell;
        self.image
            .fill_rect(x * c, y * c, (x + w) * c, (y + h) * c, value);
    }

    /// Writes `text` with its top left at (`x`, `y`) cells, one cell per
    /// dot, stopping at `right` cells.
    fn text(&mut self, x: f64, y: f64, right: f64, text: &str, value: u8) {
        for (i, ch) in text.chars().enumerate() {
            let left = x + i as f64 * ADVANCE;
            if left + LETTER_COLUMNS as f64 > right {
                break;
            }
            let Some((_, rows)) = GLYPHS.iter().find(|(g, _)| *g == ch) else {
                continue;
            };
            for (r, bits) in rows.iter().enumerate() {
                for col in 0..LETTER_COLUMNS {
                    if bits >> (LETTER_COLUMNS - 1 - col) & 1 == 1 {
                        self.rect(left + col as f64, y + r as f64, 1.0, 1.0, value);
                    }
                }
            }
        }
    }

    /// Lines of text from `TEXT`, starting with line `first`, inside the
    /// box from (`x`, `y`) to (`right`, `bottom`) cells.
    fn paragraph(&mut self, x: f64, y: f64, right: f64, bottom: f64, first: usize) {
        let mut top = y;
        let mut line = first;
        while top + LETTER_ROWS as f64 <= bottom {
            self.text(x, top, right, TEXT[line % TEXT.len()], INK);
            top += LINE;
            line += 1;
        }
    }
}

/// Draws a picture of `kind`, `width` by `height` pixels, with the task's
/// critical detail `cell_px` pixels wide (at least one pixel).
pub fn draw(kind: SceneKind, width: usize, height: usize, cell_px: f64) -> GreyImage {
    let mut canvas = Canvas {
        image: GreyImage::filled(width, height, PAPER),
        cell: cell_px.max(1.0),
    };
    match kind {
        SceneKind::Screen => screen(&mut canvas),
        SceneKind::Page => page(&mut canvas),
        SceneKind::Bench => bench(&mut canvas),
        SceneKind::Road => road(&mut canvas),
        SceneKind::Wall => wall(&mut canvas),
    }
    canvas.image
}

/// A dark frame around a bright display with a title bar and text.
fn screen(c: &mut Canvas) {
    let (w, h) = c.size();
    c.rect(0.0, 0.0, w, h, 60);
    c.rect(4.0, 4.0, w - 8.0, h - 8.0, PAPER);
    c.rect(4.0, 4.0, w - 8.0, 12.0, 200);
    c.text(7.0, 6.5, w - 6.0, "INBOX", INK);
    c.paragraph(8.0, 22.0, w - 6.0, h - 6.0, 0);
}

/// A page lying on a desk, with a heading and lines of print.
fn page(c: &mut Canvas) {
    let (w, h) = c.size();
    c.rect(0.0, 0.0, w, h, 150);
    c.rect(6.0, 3.0, w - 12.0, h, PAPER);
    c.text(12.0, 8.0, w - 10.0, "NOTES", INK);
    c.rect(12.0, 17.0, w - 24.0, 1.0, 120);
    c.paragraph(12.0, 21.0, w - 10.0, h - 2.0, 2);
}

/// A board with wires, pads, striped parts and a printed chip.
fn bench(c: &mut Canvas) {
    let (w, h) = c.size();
    c.rect(0.0, 0.0, w, h, 170);
    let mut y = 5.0;
    let mut row = 0usize;
    while y + 8.0 < h {
        // A wire the width of the detail across the board.
        c.rect(0.0, y + 3.0, w, 1.0, 90);
        let mut x = 3.0 + (row % 3) as f64 * 4.0;
        let mut part = row;
        while x + 12.0 < w {
            match part % 3 {
                0 => {
                    // A resistor: a body with stripes one detail wide.
                    c.rect(x, y + 1.0, 10.0, 5.0, 210);
                    for s in 0..4 {
                        c.rect(x + 2.0 + 2.0 * s as f64, y + 1.0, 1.0, 5.0, 40);
                    }
                }
                1 => {
                    // Two solder pads.
                    c.rect(x, y + 2.0, 3.0, 3.0, 235);
                    c.rect(x + 6.0, y + 2.0, 3.0, 3.0, 235);
                }
                _ => {
                    // A chip with pins and a printed mark.
                    c.rect(x, y, 18.0, 9.0, 45);
                    for p in 0..6 {
                        c.rect(x + 1.0 + 3.0 * p as f64, y - 1.0, 1.0, 1.0, 220);
                        c.rect(x + 1.0 + 3.0 * p as f64, y + 9.0, 1.0, 1.0, 220);
                    }
                    c.text(x + 2.0, y + 1.0, x + 18.0, "U7", 230);
                }
            }
            x += 22.0;
            part += 1;
        }
        y += 16.0;
        row += 1;
    }
}

/// Sky, verge and road narrowing to the horizon, a dashed centre line, and
/// a sign with white letters on a dark board.
fn road(c: &mut Canvas) {
    let (w, h) = c.size();
    let horizon = h * 0.45;
    c.rect(0.0, 0.0, w, horizon, 215);
    c.rect(0.0, horizon, w, h - horizon, 120);
    // The road as horizontal slices widening towards the viewer.
    let mut y = horizon;
    while y < h {
        let depth = (y - horizon) / (h - horizon);
        let half = 2.0 + depth * w * 0.45;
        c.rect(w * 0.45 - half, y, 2.0 * half, 1.0, 70);
        if (depth * 12.0).fract() < 0.5 {
            c.rect(w * 0.45 - 0.5 - depth, y, 1.0 + 2.0 * depth, 1.0, 235);
        }
        y += 1.0;
    }
    // The sign, on a post, to the right.
    let (sx, sy) = (w * 0.62, h * 0.12);
    c.rect(sx + 14.0, sy + 20.0, 2.0, h * 0.5, 90);
    c.rect(sx, sy, 32.0, 22.0, 40);
    c.text(sx + 4.0, sy + 3.0, sx + 30.0, "EXIT", 245);
    c.text(sx + 4.0, sy + 12.0, sx + 30.0, "4 KM", 245);
}

/// A wall with a framed notice of a few lines.
fn wall(c: &mut Canvas) {
    let (w, h) = c.size();
    c.rect(0.0, 0.0, w, h, 205);
    let (nx, ny) = (w * 0.2, h * 0.15);
    let (nw, nh) = (w * 0.6, h * 0.7);
    c.rect(nx - 1.0, ny - 1.0, nw + 2.0, nh + 2.0, 110);
    c.rect(nx, ny, nw, nh, PAPER);
    c.text(nx + 3.0, ny + 3.0, nx + nw - 2.0, "NOTICE", INK);
    c.paragraph(nx + 3.0, ny + 14.0, nx + nw - 2.0, ny + nh - 2.0, 5);
}

#[cfg(test)]
mod tests {
    use super::*;

    fn count(image: &GreyImage, value: u8) -> usize {
        image.pixels().iter().filter(|&&p| p == value).count()
    }

    #[test]
    fn every_kind_draws_ink_on_a_background_at_any_size() {
        for kind in SCENE_KINDS {
            for (w, h, cell) in [
                (480, 300, 3.0),
                (1024, 768, 2.0),
                (40, 20, 0.2),
                (1, 1, 5.0),
            ] {
                let image = draw(kind, w, h, cell);
                assert_eq!((image.width(), image.height()), (w, h));
                if w >= 400 {
                    let distinct: std::collections::BTreeSet<u8> =
                        image.pixels().iter().copied().collect();
                    assert!(distinct.len() >= 3, "{kind:?} draws shapes, not a blank");
                }
            }
        }
    }

    #[test]
    fn a_letter_is_five_by_seven_cells_with_strokes_one_cell_wide() {
        let mut canvas = Canvas {
            image: GreyImage::filled(30, 30, PAPER),
            cell: 3.0,
        };
        canvas.text(1.0, 1.0, 9.0, "T", INK);
        // The bar of the T: 5 cells of 3 px; the stem: 6 more cells, 1 wide.
        assert_eq!(count(&canvas.image, INK), (5 + 6) * 9);
        assert_eq!(canvas.image.get(3, 3), Some(INK));
        assert_eq!(canvas.image.get(9, 20), Some(INK));
        assert_eq!(canvas.image.get(3, 20), Some(PAPER));
    }

    #[test]
    fn text_stops_at_the_right_edge() {
        let mut canvas = Canvas {
            image: GreyImage::filled(100, 10, PAPER),
            cell: 1.0,
        };
        canvas.text(0.0, 0.0, 10.0, "HH", INK);
        // Only the first H fits in 10 cells (the second would end at 11).
        assert_eq!(count(&canvas.image, INK), 17);
    }
}
