//! What a defocused eye sees: a grey picture convolved with the geometric
//! blur disc of the defocus, so the wearer walkthrough can show a task as it
//! will look through a lens point the planner chose.
//!
//! In geometric optics a defocus of ΔD dioptres seen through a pupil of
//! diameter p metres spreads each object point into a uniform disc of angular
//! diameter β = p |ΔD| radians (Atchison & Smith, *Optics of the Human Eye*,
//! 2000, chapter on defocus and depth of field; from memory; the same relation
//! as [`crate::core::depth_of_field::blur_angle`], which this file calls). A
//! picture drawn at a known angular scale (pixels per minute of arc) is
//! therefore blurred by convolving it with a uniform disc whose diameter in
//! pixels is β times that scale. The model ignores diffraction, aberrations
//! and the eye's neural tolerance, as the planner's depth of field does; it
//! shows the size of the blur, not the subjective experience of it.
//!
//! The disc is a union of horizontal runs of pixels, one per row offset, so
//! each run is the difference of two running sums along its source row: the
//! work grows with the pixels times the disc's *diameter*, not its area, and
//! only the running sums of the rows the disc spans are kept at a time. Up
//! to [`SAMPLED_FROM_RADIUS_PX`] every pixel is computed so (exactly: every
//! pixel whose centre lies within the radius weighs the same). A larger disc
//! leaves a picture that changes little over two fifths of its radius, so
//! there the same exact sums are taken only on a grid of pixels at most that
//! far apart (and the last row and column) and the pixels between are
//! interpolated bilinearly; the tests bound how far that strays from a
//! direct convolution ([`SAMPLED_MEAN_ERROR`], [`SAMPLED_MAX_ERROR`]).
//! Either way the last pass writes the output pixels directly, opaque RGBA
//! for a browser canvas if asked, with no grey copy in between.

use super::depth_of_field::blur_angle;
use super::error::OpticsError;
use super::units::{Dioptres, Millimetres};

/// Minutes of arc in one radian (180 x 60 / π).
pub const ARCMIN_PER_RADIAN: f64 = 180.0 * 60.0 / std::f64::consts::PI;

/// Disc radius, in pixels, from which the blurred picture is computed on a
/// grid and interpolated (see the module note); below it every pixel is
/// computed exactly.
pub const SAMPLED_FROM_RADIUS_PX: f64 = 4.0;

/// Largest spacing of the grid, as a share of the disc radius: two fifths.
const GRID_SHARE_OF_RADIUS: f64 = 0.4;

/// Largest mean difference, in grey levels (of 255), between a picture
/// blurred on the grid and the direct convolution with the same disc, over
/// a test card of one- to four-pixel strokes, for radii from
/// [`SAMPLED_FROM_RADIUS_PX`] to 22 px (checked by the tests; 2.7 at the
/// smallest radius, 1.4 to 2.1 from 6 px on): a product choice, about 1 %
/// of the scale.
pub const SAMPLED_MEAN_ERROR: f64 = 3.0;

/// Largest difference at any one pixel, in grey levels, between the grid
/// and the direct convolution on the same card (a product choice: a faint
/// shift at the steepest edge of a blurred stroke).
pub const SAMPLED_MAX_ERROR: u8 = 20;

/// One opaque RGBA pixel (red, green, blue, alpha), the layout a browser
/// canvas takes.
pub type Rgba = [u8; 4];

/// A grey picture, luminance 0 (black) to 255 (white), stored row by row
/// from the top left.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct GreyImage {
    width: usize,
    height: usize,
    pixels: Vec<u8>,
}

/// How a blurred grey value is stored in an output picture.
trait Pixel: Copy {
    fn from_grey(grey: u8) -> Self;
}

impl Pixel for u8 {
    fn from_grey(grey: u8) -> u8 {
        grey
    }
}

impl Pixel for Rgba {
    fn from_grey(grey: u8) -> Rgba {
        [grey, grey, grey, 255]
    }
}

impl GreyImage {
    /// A picture `width` by `height` pixels filled with the grey `value`.
    pub fn filled(width: usize, height: usize, value: u8) -> GreyImage {
        GreyImage {
            width,
            height,
            pixels: vec![value; width * height],
        }
    }

    /// Width in pixels.
    pub fn width(&self) -> usize {
        self.width
    }

    /// Height in pixels.
    pub fn height(&self) -> usize {
        self.height
    }

    /// The grey values, row by row.
    pub fn pixels(&self) -> &[u8] {
        &self.pixels
    }

    /// The grey value at column `x`, row `y`; `None` outside the picture.
    pub fn get(&self, x: usize, y: usize) -> Option<u8> {
        (x < self.width && y < self.height).then(|| self.pixels[y * self.width + x])
    }

    /// Paints the rectangle from (`x0`, `y0`) to (`x1`, `y1`), in pixels
    /// (fractions round to the nearest pixel edge, the part outside the
    /// picture is dropped), with the grey `value`.
    pub fn fill_rect(&mut self, x0: f64, y0: f64, x1: f64, y1: f64, value: u8) {
        let clamp = |v: f64, max: usize| v.round().clamp(0.0, max as f64) as usize;
        let (xa, xb) = (clamp(x0.min(x1), self.width), clamp(x0.max(x1), self.width));
        let (ya, yb) = (
            clamp(y0.min(y1), self.height),
            clamp(y0.max(y1), self.height),
        );
        for y in ya..yb {
            self.pixels[y * self.width + xa..y * self.width + xb].fill(value);
        }
    }

    /// The picture as opaque RGBA pixels (grey in each colour), written
    /// into `out` (its old contents replaced, its allocation reused).
    pub fn write_rgba(&self, out: &mut Vec<Rgba>) {
        out.clear();
        out.extend(self.pixels.iter().map(|&g| Rgba::from_grey(g)));
    }

    /// Row `y`.
    fn row(&self, y: usize) -> &[u8] {
        &self.pixels[y * self.width..(y + 1) * self.width]
    }
}

/// The geometric blur disc of a defocus, sized for a picture drawn at a
/// known angular scale.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct BlurDisc {
    /// Angular diameter of the disc, in minutes of arc.
    pub diameter_arcmin: f64,
    /// Radius of the disc in the picture, in pixels.
    pub radius_px: f64,
}

impl BlurDisc {
    /// The blur disc of a defocus `defocus` (either sign) through a pupil
    /// `pupil`, for a picture drawn at `px_per_arcmin` pixels per minute of
    /// arc: angular diameter β = p |ΔD| (see the module note).
    ///
    /// ```
    /// use clearspan::core::blur_image::BlurDisc;
    /// use clearspan::core::units::{Dioptres, Millimetres};
    /// // 1.00 D through 4 mm: 0.004 rad = 13.75 arcmin; at 2 px per arcmin
    /// // the disc is 27.5 px across, radius 13.75 px.
    /// let disc = BlurDisc::from_defocus(Dioptres(1.0), Millimetres(4.0), 2.0).unwrap();
    /// assert!((disc.diameter_arcmin - 13.751).abs() < 1e-3);
    /// assert!((disc.radius_px - 13.751).abs() < 1e-3);
    /// ```
    ///
    /// An error when the defocus or pupil is outside the optics core's
    /// ranges, or the scale is not a positive finite number.
    pub fn from_defocus(
        defocus: Dioptres,
        pupil: Millimetres,
        px_per_arcmin: f64,
    ) -> Result<BlurDisc, OpticsError> {
        let scale =
            OpticsError::in_range("picture scale", px_per_arcmin, 1e-3, 1e3, "px per arcmin")?;
        let diameter_arcmin = blur_angle(defocus, pupil)? * ARCMIN_PER_RADIAN;
        Ok(BlurDisc {
            diameter_arcmin,
            radius_px: diameter_arcmin * scale / 2.0,
        })
    }

    /// Half-widths of the pixel disc of radius `radius_px`, one per row from
    /// the top row to the bottom row: row offset dy has the pixels
    /// -w..=w with w = ⌊√(r² - dy²)⌋, the pixels whose centres lie within
    /// the radius. A radius under one pixel is the single centre pixel.
    fn half_widths(radius_px: f64) -> Vec<usize> {
        let reach = radius_px.max(0.0).floor() as isize;
        (-reach..=reach)
            .map(|dy| {
                let dy = dy as f64;
                (radius_px * radius_px - dy * dy).max(0.0).sqrt().floor() as usize
            })
            .collect()
    }

    /// Number of pixels in the pixel disc (its area in pixels).
    pub fn pixel_count(&self) -> usize {
        Self::half_widths(self.radius_px)
            .iter()
            .map(|w| 2 * w + 1)
            .sum()
    }

    /// `image` as seen through this blur: each pixel becomes the mean of the
    /// pixels under the disc centred on it (beyond the edges the edge pixels
    /// repeat). A disc under one pixel in radius leaves the picture
    /// unchanged.
    pub fn apply(&self, image: &GreyImage) -> GreyImage {
        let mut pixels = Vec::new();
        self.blur_into(image, &mut pixels);
        GreyImage {
            width: image.width,
            height: image.height,
            pixels,
        }
    }

    /// The same picture as [`BlurDisc::apply`], written as opaque RGBA
    /// pixels into `out` (its old contents replaced, its allocation reused),
    /// the layout a browser canvas takes, without a grey copy in between.
    pub fn apply_rgba(&self, image: &GreyImage, out: &mut Vec<Rgba>) {
        self.blur_into(image, out);
    }

    /// The blurred picture, row by row, into `out`: every pixel for small
    /// discs, on a grid for large ones (see the module note).
    fn blur_into<P: Pixel>(&self, image: &GreyImage, out: &mut Vec<P>) {
        out.clear();
        out.reserve(image.pixels.len());
        let disc = DiscRows::new(self.radius_px);
        if disc.widths.len() == 1 || image.width == 0 || image.height == 0 {
            out.extend(image.pixels.iter().map(|&g| P::from_grey(g)));
        } else if self.radius_px < SAMPLED_FROM_RADIUS_PX {
            convolve_every_pixel(image, &disc, out);
        } else {
            let step = ((self.radius_px * GRID_SHARE_OF_RADIUS).floor() as usize).max(2);
            convolve_on_grid(image, &disc, step, out);
        }
    }
}

/// The pixel disc as runs along rows, and the fixed-point inverse of its
/// pixel count that turns a sum into a mean.
struct DiscRows {
    /// Half-width of each run, from the top row to the bottom row.
    widths: Vec<usize>,
    /// Rows above (and below) the centre row.
    reach: usize,
    /// 2^23 / the pixel count: a sum of at most 255 per pixel times this
    /// stays within u32.
    inverse: u32,
}

impl DiscRows {
    fn new(radius_px: f64) -> DiscRows {
        let widths = BlurDisc::half_widths(radius_px);
        let count: u32 = widths.iter().map(|&half| 2 * half as u32 + 1).sum();
        DiscRows {
            reach: widths.len() / 2,
            inverse: (1u32 << 23) / count,
            widths,
        }
    }

    /// The source row under disc row `d` for the disc centred on row `y`
    /// of a picture `height` rows high (edge rows repeat beyond the edges).
    fn source_row(&self, y: usize, d: usize, height: usize) -> usize {
        (y + d).saturating_sub(self.reach).min(height - 1)
    }

    /// A sum under the disc as a mean in 1/256ths of a grey level.
    fn mean_256(&self, sum: u32) -> u32 {
        (sum * self.inverse + (1 << 14)) >> 15
    }

    /// A sum under the disc as a mean grey level.
    fn mean(&self, sum: u32) -> u8 {
        ((sum * self.inverse + (1 << 22)) >> 23).min(255) as u8
    }
}

/// Running sums of the picture's rows, each row extended by the disc's
/// reach on both sides with copies of its edge pixels, kept for the last
/// rows the disc spans (a ring), each row summed once, top to bottom.
struct RowSums<'a> {
    image: &'a GreyImage,
    reach: usize,
    /// Length of one row's sums: sums[i] is the sum of the extended pixels
    /// before i.
    stride: usize,
    ring: Vec<u32>,
    /// Rows summed so far.
    summed: usize,
}

impl<'a> RowSums<'a> {
    fn new(image: &'a GreyImage, disc: &DiscRows) -> RowSums<'a> {
        let stride = image.width + 2 * disc.reach + 1;
        RowSums {
            image,
            reach: disc.reach,
            stride,
            ring: vec![0; stride * disc.widths.len()],
            summed: 0,
        }
    }

    /// Sums every row up to `last`; the rows leaving the ring lie more than
    /// the disc's span above it.
    fn sum_up_to(&mut self, last: usize) {
        let span = self.ring.len() / self.stride;
        while self.summed <= last {
            let slot = self.summed % span;
            let row = self.image.row(self.summed);
            let (first, end) = (u32::from(row[0]), u32::from(row[row.len() - 1]));
            let sums = &mut self.ring[slot * self.stride..(slot + 1) * self.stride];
            sums[0] = 0;
            let (before, rest) = sums[1..].split_at_mut(self.reach);
            let (inside, after) = rest.split_at_mut(row.len());
            let mut total = 0u32;
            for sum in before {
                total += first;
                *sum = total;
            }
            for (sum, &p) in inside.iter_mut().zip(row) {
                total += u32::from(p);
                *sum = total;
            }
            for sum in after {
                total += end;
                *sum = total;
            }
            self.summed += 1;
        }
    }

    /// The running sums of row `y` (summed already and still in the ring).
    fn row(&self, y: usize) -> &[u32] {
        let slot = y % (self.ring.len() / self.stride);
        &self.ring[slot * self.stride..(slot + 1) * self.stride]
    }
}

/// The exact convolution of `image` with `disc` at every pixel, appended to
/// `out` row by row. A whole output row's sums are accumulated at once: the
/// centre row of the disc first, then the rows at equal distance above and
/// below it in pairs (their runs have the same half-width).
fn convolve_every_pixel<P: Pixel>(image: &GreyImage, disc: &DiscRows, out: &mut Vec<P>) {
    let (w, h, reach) = (image.width, image.height, disc.reach);
    let span = disc.widths.len();
    let mut sums = RowSums::new(image, disc);
    let mut acc = vec![0u32; w];
    for y in 0..h {
        sums.sum_up_to((y + reach).min(h - 1));
        let (left, right) = run_ends(
            sums.row(disc.source_row(y, reach, h)),
            reach,
            disc.widths[reach],
            w,
        );
        for ((a, &r), &l) in acc.iter_mut().zip(right).zip(left) {
            *a = r - l;
        }
        for d in 0..reach {
            let half = disc.widths[d];
            let (al, ar) = run_ends(sums.row(disc.source_row(y, d, h)), reach, half, w);
            let (bl, br) = run_ends(
                sums.row(disc.source_row(y, span - 1 - d, h)),
                reach,
                half,
                w,
            );
            let above = ar.iter().zip(al).map(|(&r, &l)| r - l);
            let below = br.iter().zip(bl).map(|(&r, &l)| r - l);
            for ((a, up), down) in acc.iter_mut().zip(above).zip(below) {
                *a += up + down;
            }
        }
        out.extend(acc.iter().map(|&a| P::from_grey(disc.mean(a))));
    }
}

/// The running sums at the left and right ends of a run of half-width
/// `half` for each of `w` output columns, in a row's sums extended by
/// `reach`: a run's sum is the right one less the left one.
fn run_ends(sums: &[u32], reach: usize, half: usize, w: usize) -> (&[u32], &[u32]) {
    (
        &sums[reach - half..reach - half + w],
        &sums[reach + half + 1..reach + half + 1 + w],
    )
}

/// Positions `0, step, 2 step, ...` up to and including `n - 1` along a
/// side of `n` pixels, and for each pixel of the side the two grid
/// positions around it with the second one's weight in 1/256ths.
fn grid_along(n: usize, step: usize) -> (Vec<usize>, Vec<(usize, usize, u32)>) {
    let at: Vec<usize> = (0..(n - 1).div_ceil(step) + 1)
        .map(|i| (i * step).min(n - 1))
        .collect();
    let weights = (0..n)
        .map(|v| {
            let i0 = (v / step).min(at.len() - 1);
            let i1 = (i0 + 1).min(at.len() - 1);
            let gap = (at[i1] - at[i0]) as u32;
            // The last pixel may be its own grid position: no gap, no weight.
            let weight = ((v - at[i0]) as u32 * 256 + gap / 2)
                .checked_div(gap)
                .unwrap_or(0);
            (i0, i1, weight)
        })
        .collect();
    (at, weights)
}

/// The exact convolution of `image` with `disc` on a grid of pixels `step`
/// apart (and the last row and column), interpolated bilinearly in between,
/// appended to `out` row by row. The grid keeps means in 1/256ths of a grey
/// level, so rounding happens once, at the end.
fn convolve_on_grid<P: Pixel>(image: &GreyImage, disc: &DiscRows, step: usize, out: &mut Vec<P>) {
    let (w, h, reach) = (image.width, image.height, disc.reach);
    let (columns, across) = grid_along(w, step);
    let (rows, down) = grid_along(h, step);
    let mut sums = RowSums::new(image, disc);
    // Each grid row's means, already interpolated along the row to every
    // column (values up to 255 x 256 fit 16 bits).
    let mut widened = Vec::with_capacity(rows.len() * w);
    let mut acc = vec![0u32; columns.len()];
    for &y in &rows {
        sums.sum_up_to((y + reach).min(h - 1));
        acc.fill(0);
        for (d, &half) in disc.widths.iter().enumerate() {
            let row = sums.row(disc.source_row(y, d, h));
            let (left, right) = (&row[reach - half..], &row[reach + half + 1..]);
            for (a, &x) in acc.iter_mut().zip(&columns) {
                *a += right[x] - left[x];
            }
        }
        let means: Vec<u32> = acc.iter().map(|&a| disc.mean_256(a)).collect();
        widened.extend(
            across
                .iter()
                .map(|&(i0, i1, fx)| ((means[i0] * (256 - fx) + means[i1] * fx + 128) >> 8) as u16),
        );
    }
    for &(j0, j1, fy) in &down {
        let top = &widened[j0 * w..(j0 + 1) * w];
        let bottom = &widened[j1 * w..(j1 + 1) * w];
        out.extend(top.iter().zip(bottom).map(|(&a, &b)| {
            let v = u32::from(a) * (256 - fy) + u32::from(b) * fy;
            P::from_grey(((v + (1 << 15)) >> 16).min(255) as u8)
        }));
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    use crate::approx::close;

    /// A test card: dark strokes of assorted widths on white.
    fn card(width: usize, height: usize) -> GreyImage {
        let mut image = GreyImage::filled(width, height, 255);
        for i in 0..width / 8 {
            let x = (i * 8) as f64;
            let stroke = 1.0 + (i % 4) as f64;
            image.fill_rect(x, 4.0, x + stroke, height as f64 - 4.0, 20);
        }
        image.fill_rect(0.0, 10.0, width as f64, 13.0, 40);
        image
    }

    fn of_radius(radius_px: f64) -> BlurDisc {
        BlurDisc {
            diameter_arcmin: 0.0,
            radius_px,
        }
    }

    /// The textbook definition, written independently of the fast code: each
    /// pixel the rounded mean of every pixel (dx, dy) with dx² + dy² ≤ r²
    /// around it, the picture's edge pixels repeated beyond it.
    fn direct_convolution(image: &GreyImage, radius: f64) -> GreyImage {
        let (w, h) = (image.width() as isize, image.height() as isize);
        let reach = radius.floor() as isize;
        let at = |x: isize, y: isize| {
            let (x, y) = (x.clamp(0, w - 1) as usize, y.clamp(0, h - 1) as usize);
            u64::from(image.get(x, y).expect("clamped inside"))
        };
        let mut out = image.clone();
        for y in 0..h {
            for x in 0..w {
                let (mut sum, mut count) = (0u64, 0u64);
                for dy in -reach..=reach {
                    for dx in -reach..=reach {
                        if ((dx * dx + dy * dy) as f64) <= radius * radius {
                            sum += at(x + dx, y + dy);
                            count += 1;
                        }
                    }
                }
                out.pixels[(y * w + x) as usize] = ((sum + count / 2) / count) as u8;
            }
        }
        out
    }

    /// Mean and largest difference between two pictures, in grey levels.
    fn differences(a: &GreyImage, b: &GreyImage) -> (f64, u8) {
        assert_eq!((a.width(), a.height()), (b.width(), b.height()));
        let each = || {
            a.pixels()
                .iter()
                .zip(b.pixels())
                .map(|(&p, &q)| p.abs_diff(q))
        };
        let mean = each().map(f64::from).sum::<f64>() / a.pixels().len() as f64;
        (mean, each().max().unwrap_or(0))
    }

    // Geometric blur disc β = p ΔD (Atchison & Smith, Optics of the Human
    // Eye, 2000, defocus chapter; from memory): known pupils and defocus.
    #[test]
    fn the_disc_diameter_is_pupil_times_defocus() {
        let check = |defocus: f64, pupil_mm: f64, arcmin: f64| {
            let disc = BlurDisc::from_defocus(Dioptres(defocus), Millimetres(pupil_mm), 1.0)
                .expect("in range");
            close(disc.diameter_arcmin, arcmin, 1e-3);
            close(disc.radius_px * 2.0, arcmin, 1e-3);
        };
        // 3 mm x 0.5 D = 1.5 mrad = 5.157 arcmin.
        check(0.5, 3.0, 5.157);
        // 4 mm x 1 D = 4 mrad = 13.751 arcmin.
        check(1.0, 4.0, 13.751);
        // 6 mm x -2 D = 12 mrad = 41.253 arcmin (the sign does not matter).
        check(-2.0, 6.0, 41.253);
        // 2 mm x 0.25 D = 0.5 mrad = 1.719 arcmin.
        check(0.25, 2.0, 1.719);
    }

    #[test]
    fn the_pixel_disc_has_the_area_and_width_of_the_blur_disc() {
        // 4 mm x 1 D at 2 px per arcmin: 27.5 px across.
        let disc = BlurDisc::from_defocus(Dioptres(1.0), Millimetres(4.0), 2.0).unwrap();
        let area_diameter = (4.0 * disc.pixel_count() as f64 / std::f64::consts::PI).sqrt();
        close(area_diameter, 2.0 * disc.radius_px, 1.0);
        // One bright point on black spreads into the disc: its widest row
        // spans 2 ⌊r⌋ + 1 pixels, the whole disc to within a pixel.
        let mut point = GreyImage::filled(41, 41, 0);
        point.fill_rect(20.0, 20.0, 21.0, 21.0, 255);
        let spread = of_radius(3.5).apply(&point);
        let lit = (0..41).filter(|&x| spread.get(x, 20) != Some(0)).count();
        assert_eq!(lit, 7, "a 7 px disc lights 7 px of its middle row");
        let tall = (0..41).filter(|&y| spread.get(20, y) != Some(0)).count();
        assert_eq!(tall, 7);
    }

    #[test]
    fn zero_defocus_leaves_the_scene_unchanged() {
        let scene = card(120, 60);
        let disc = BlurDisc::from_defocus(Dioptres(0.0), Millimetres(4.0), 3.0).unwrap();
        assert_eq!(disc.radius_px, 0.0);
        assert_eq!(disc.apply(&scene), scene);
        // A disc under a pixel in radius is still the single pixel.
        let tiny = BlurDisc::from_defocus(Dioptres(0.05), Millimetres(3.0), 1.0).unwrap();
        assert!(tiny.radius_px < 1.0);
        assert_eq!(tiny.apply(&scene), scene);
        let mut rgba = Vec::new();
        disc.apply_rgba(&scene, &mut rgba);
        assert!(rgba
            .iter()
            .zip(scene.pixels())
            .all(|(p, &g)| *p == [g, g, g, 255]));
    }

    #[test]
    fn blur_keeps_the_mean_and_lowers_the_contrast() {
        let scene = card(160, 80);
        let blurred = of_radius(2.5).apply(&scene);
        let mean = |i: &GreyImage| {
            i.pixels().iter().map(|&p| f64::from(p)).sum::<f64>() / i.pixels().len() as f64
        };
        close(mean(&blurred), mean(&scene), 3.0);
        let range = |i: &GreyImage| {
            let (lo, hi) = i
                .pixels()
                .iter()
                .fold((255, 0), |(lo, hi), &p| (lo.min(p), hi.max(p)));
            hi - lo
        };
        assert!(range(&blurred) < range(&scene));
    }

    // Cross-check of two methods for the same quantity: the running-sum
    // convolution against the definition, pixel by pixel.
    #[test]
    fn every_pixel_below_the_grid_radius_is_the_direct_disc_convolution() {
        let scene = card(96, 64);
        for radius in [1.0, 1.5, 2.5, 3.0, 3.7, 3.99] {
            let (mean, max) = differences(
                &of_radius(radius).apply(&scene),
                &direct_convolution(&scene, radius),
            );
            // Within one grey level: the fast code divides by a fixed-point
            // inverse of the pixel count, the definition by the count.
            assert!(
                max <= 1,
                "radius {radius}: {max} grey levels apart (mean {mean})"
            );
        }
    }

    // The grid for a large disc against the definition, within the
    // documented bounds.
    #[test]
    fn the_grid_stays_within_its_stated_error() {
        let scene = card(160, 96);
        for radius in [
            SAMPLED_FROM_RADIUS_PX,
            4.3,
            5.0,
            5.9,
            6.5,
            9.0,
            13.7,
            16.5,
            22.0,
        ] {
            let (mean, max) = differences(
                &of_radius(radius).apply(&scene),
                &direct_convolution(&scene, radius),
            );
            assert!(
                mean <= SAMPLED_MEAN_ERROR,
                "radius {radius}: mean difference {mean}"
            );
            assert!(
                max <= SAMPLED_MAX_ERROR,
                "radius {radius}: largest difference {max}"
            );
        }
    }

    #[test]
    fn the_rgba_picture_is_the_grey_picture_in_each_colour() {
        let scene = card(120, 60);
        let mut rgba = vec![[1, 2, 3, 4]; 7];
        for radius in [0.0, 3.7, 16.5] {
            let grey = of_radius(radius).apply(&scene);
            of_radius(radius).apply_rgba(&scene, &mut rgba);
            assert_eq!(rgba.len(), grey.pixels().len());
            assert!(rgba
                .iter()
                .zip(grey.pixels())
                .all(|(p, &g)| *p == [g, g, g, 255]));
        }
        scene.write_rgba(&mut rgba);
        assert!(rgba
            .iter()
            .zip(scene.pixels())
            .all(|(p, &g)| *p == [g, g, g, 255]));
    }

    #[test]
    fn empty_and_one_pixel_pictures_do_not_fail() {
        for (w, h) in [(0, 0), (0, 5), (1, 1), (1, 9), (9, 1)] {
            let image = GreyImage::filled(w, h, 100);
            for radius in [0.0, 2.0, 9.0] {
                assert_eq!(
                    of_radius(radius).apply(&image),
                    image,
                    "{w} x {h}, radius {radius}"
                );
            }
        }
    }

    #[test]
    fn a_scale_out_of_range_is_an_error_not_a_panic() {
        assert!(BlurDisc::from_defocus(Dioptres(1.0), Millimetres(4.0), 0.0).is_err());
        assert!(BlurDisc::from_defocus(Dioptres(1.0), Millimetres(4.0), f64::NAN).is_err());
        assert!(BlurDisc::from_defocus(Dioptres(f64::INFINITY), Millimetres(4.0), 1.0).is_err());
    }
}
