//! Pictures of a task for the wearer walkthrough, drawn by the app in grey:
//! a screen with text, a printed page, a bench with small parts, a road with
//! a sign, a vehicle's instrument panel, or a notice on a wall. Everything is measured in *cells*, the
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

/// Distance beyond which a task that is not driving is drawn as something
/// across the room, in metres: past the reach of the arms (common practice).
pub const ACROSS_THE_ROOM_M: f64 = 1.0;

/// Distance beyond which a driving task is drawn as the road (what is seen
/// ahead or in a mirror) rather than the instrument panel, in metres (a
/// product choice: the panel and controls lie within about a metre).
pub const ROAD_BEYOND_M: f64 = 2.0;

/// Distance up to which an unflagged task is drawn as something held in the
/// hands (a page or a phone), in metres (common practice: near work at
/// 40 cm, reaching to about 55 cm).
pub const HELD_WITHIN_M: f64 = 0.55;

/// Detail finer than this is drawn as parts on a bench, in millimetres (a
/// product choice: finer than the strokes of small print).
pub const FINE_WORK_DETAIL_MM: f64 = 0.3;

/// The kinds of picture the walkthrough can draw.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum SceneKind {
    /// A display with lines of text under an "INBOX" title bar (monitor,
    /// laptop, phone or tablet read as a screen).
    Screen,
    /// A printed page or a phone held close, with lines of text.
    Page,
    /// A work surface with small parts, wires and a printed label.
    Bench,
    /// A road with a sign beside it (ahead, or behind in a mirror).
    Road,
    /// A vehicle's instrument panel: dials with needles and figures, and a
    /// small display.
    Dashboard,
    /// A notice on a wall across the room.
    Wall,
}

/// Every scene kind, in a fixed order (for tests and listings).
pub const SCENE_KINDS: [SceneKind; 6] = [
    SceneKind::Screen,
    SceneKind::Page,
    SceneKind::Bench,
    SceneKind::Road,
    SceneKind::Dashboard,
    SceneKind::Wall,
];

impl SceneKind {
    /// The picture for a task, from what the scenario says of it, first
    /// rule that applies: driving is the road beyond [`ROAD_BEYOND_M`] and
    /// the instrument panel within it; a task marked as reading a screen is
    /// a screen at any distance; anything from [`ACROSS_THE_ROOM_M`] on is a
    /// notice across the room; work with an eye hazard, overhead or at moving
    /// machinery
    /// and detail finer than [`FINE_WORK_DETAIL_MM`] are parts on a bench;
    /// within [`HELD_WITHIN_M`] a page; a screen otherwise (the usual task
    /// at arm's length).
    pub fn for_task(task: &Task) -> SceneKind {
        let flags = task.flags;
        let workshop = flags.hazards.any()
            || flags.overhead
            || flags.moving_machinery
            || task.detail_mm < FINE_WORK_DETAIL_MM;
        if flags.driving {
            if task.distance_m > ROAD_BEYOND_M {
                SceneKind::Road
            } else {
                SceneKind::Dashboard
            }
        } else if flags.screen {
            SceneKind::Screen
        } else if task.distance_m >= ACROSS_THE_ROOM_M {
            SceneKind::Wall
        } else if workshop {
            SceneKind::Bench
        } else if task.distance_m <= HELD_WITHIN_M {
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
            SceneKind::Road => "the road with a sign",
            SceneKind::Dashboard => "the dials and display of a dashboard",
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

    /// Fills a disc centred at (`cx`, `cy`) of radius `r`, all in cells, one
    /// pixel row at a time.
    fn disc(&mut self, cx: f64, cy: f64, r: f64, value: u8) {
        let row = 1.0 / self.cell;
        let mut y = cy - r;
        while y < cy + r {
            let dy = y + row / 2.0 - cy;
            let half = (r * r - dy * dy).max(0.0).sqrt();
            self.rect(cx - half, y, 2.0 * half, row, value);
            y += row;
        }
    }

    /// A line one cell wide from (`x`, `y`) for `length` cells at `angle`
    /// radians (counter-clockwise from the right), as cells along it.
    fn ray(&mut self, x: f64, y: f64, angle: f64, from: f64, length: f64, value: u8) {
        let mut k = from;
        while k < from + length {
            let (px, py) = (x + k * angle.cos(), y - k * angle.sin());
            self.rect(px - 0.5, py - 0.5, 1.0, 1.0, value);
            k += 0.5;
        }
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
        SceneKind::Dashboard => dashboard(&mut canvas),
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

/// An instrument panel, light on dark: a speed dial and a rev dial, each
/// with tick marks, a needle and figures one detail in stroke, and a small
/// display with a line of text between them.
fn dashboard(c: &mut Canvas) {
    let (w, h) = c.size();
    c.rect(0.0, 0.0, w, h, 45);
    let radius = (w * 0.21).min(h * 0.4);
    let cy = h * 0.46;
    // Dials sweep 270 degrees, from 225 degrees (lower left) clockwise.
    let sweep = |share: f64| (225.0 - 270.0 * share).to_radians();
    for (cx, ticks, needle, figure) in [(w * 0.27, 8, 0.4, "64 KMH"), (w * 0.73, 7, 0.3, "2 RPM")] {
        c.disc(cx, cy, radius, 15);
        for i in 0..=ticks {
            c.ray(
                cx,
                cy,
                sweep(f64::from(i) / f64::from(ticks)),
                radius - 5.0,
                3.5,
                230,
            );
        }
        c.ray(cx, cy, sweep(needle), 0.0, radius - 7.0, 245);
        let width = figure.len() as f64 * ADVANCE - 1.0;
        c.text(
            cx - width / 2.0,
            cy + radius * 0.4,
            cx + radius,
            figure,
            230,
        );
    }
    // The display between the dials.
    let (dw, dh) = ((w * 0.2).max(26.0), 11.0);
    let (dx, dy) = ((w - dw) / 2.0, cy + radius - dh);
    c.rect(dx, dy, dw, dh, 25);
    c.text(dx + 2.0, dy + 2.0, dx + dw - 1.0, "RANGE 310 KM", 220);
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
    use crate::scenario::{Hazards, Task, TaskFlags};

    /// A task at `distance_m` with `detail_mm` detail and no flags but
    /// those `flags` sets.
    fn task(distance_m: f64, detail_mm: f64, flags: impl Fn(&mut Task)) -> Task {
        let mut t = Task::desk_screen("task");
        t.flags = TaskFlags::default();
        t.distance_m = distance_m;
        t.detail_mm = detail_mm;
        flags(&mut t);
        t
    }

    // One case per rule of the picker, each at the kind of task the demo
    // days hold (tests/walkthrough_words.rs walks every demo task).
    #[test]
    fn the_picker_follows_its_rules_in_order() {
        let driving = |t: &mut Task| t.flags.driving = true;
        let screen = |t: &mut Task| t.flags.screen = true;
        let impact = |t: &mut Task| t.flags.hazards.impact = true;
        let plain = |_: &mut Task| {};
        let cases: [(&str, Task, SceneKind); 14] = [
            ("road ahead", task(30.0, 100.0, driving), SceneKind::Road),
            ("door mirror", task(8.0, 10.0, driving), SceneKind::Road),
            ("dashboard", task(0.75, 3.0, driving), SceneKind::Dashboard),
            (
                "dashboard at the limit",
                task(ROAD_BEYOND_M, 3.0, driving),
                SceneKind::Dashboard,
            ),
            (
                "inbox on a monitor",
                task(0.65, 2.5, screen),
                SceneKind::Screen,
            ),
            (
                "phone read as a screen",
                task(0.35, 1.2, screen),
                SceneKind::Screen,
            ),
            (
                "meeting-room screen",
                task(4.0, 15.0, screen),
                SceneKind::Screen,
            ),
            (
                "drawers on the wall",
                task(ACROSS_THE_ROOM_M, 3.0, plain),
                SceneKind::Wall,
            ),
            (
                "colleague across the desk",
                task(1.5, 20.0, plain),
                SceneKind::Wall,
            ),
            ("soldering", task(0.28, 0.2, impact), SceneKind::Bench),
            (
                "fine parts, no hazard",
                task(0.3, 0.2, plain),
                SceneKind::Bench,
            ),
            (
                "lathe",
                task(0.6, 1.0, |t| t.flags.moving_machinery = true),
                SceneKind::Bench,
            ),
            (
                "notes on paper",
                task(HELD_WITHIN_M, 1.5, plain),
                SceneKind::Page,
            ),
            (
                "monitor without the screen mark",
                task(0.7, 1.5, plain),
                SceneKind::Screen,
            ),
        ];
        for (what, t, kind) in cases {
            assert_eq!(SceneKind::for_task(&t), kind, "{what}");
        }
        // A screen at a hazardous bench is still read as a screen; welding
        // (optical radiation) is bench work.
        let guarded = task(0.5, 3.0, |t| {
            t.flags.screen = true;
            t.flags.hazards = Hazards {
                impact: true,
                ..Hazards::default()
            };
        });
        assert_eq!(SceneKind::for_task(&guarded), SceneKind::Screen);
        let welding = task(0.5, 1.0, |t| t.flags.hazards.optical_radiation = true);
        assert_eq!(SceneKind::for_task(&welding), SceneKind::Bench);
    }

    /// Pixels of `value` within the rows `top..bottom` of `image`.
    fn count_in_rows(image: &GreyImage, value: u8, top: usize, bottom: usize) -> usize {
        image.pixels()[top * image.width()..bottom * image.width()]
            .iter()
            .filter(|&&p| p == value)
            .count()
    }

    #[test]
    fn a_screen_shows_lines_of_text_under_its_title_bar() {
        let cell = 3.0;
        let image = draw(SceneKind::Screen, 480, 300, cell);
        // The title bar (cells 4 to 16) holds the word INBOX in ink.
        let title = count_in_rows(&image, INK, (4.0 * cell) as usize, (16.0 * cell) as usize);
        // Dots counted by hand on the 5 x 7 letters: I 11, N 17, B 20, O 16, X 13.
        let inbox_dots = 11 + 17 + 20 + 16 + 13;
        assert_eq!(title, inbox_dots * 9, "INBOX, 3 x 3 px a dot");
        // Below it, one text line every 11 cells, each with ink.
        for line in 0..5 {
            let top = ((22.0 + 11.0 * f64::from(line)) * cell) as usize;
            let ink = count_in_rows(&image, INK, top, top + (7.0 * cell) as usize);
            assert!(ink > 200, "line {line} has letters ({ink} ink pixels)");
        }
    }

    #[test]
    fn a_dashboard_shows_dials_and_figures_light_on_dark() {
        let image = draw(SceneKind::Dashboard, 480, 300, 3.0);
        let count_at_least = |value: u8| image.pixels().iter().filter(|&&p| p >= value).count();
        let dark = image.pixels().iter().filter(|&&p| p <= 45).count();
        assert!(dark > image.pixels().len() / 2, "a dark panel");
        assert!(
            count_at_least(220) > 1000,
            "light ticks, needles and figures"
        );
        // The dial faces are darker than the panel, one either side.
        assert_eq!(image.get(480 * 27 / 100, 300 * 46 / 100 + 20), Some(15));
        assert_eq!(image.get(480 * 73 / 100, 300 * 46 / 100 + 20), Some(15));
    }

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
