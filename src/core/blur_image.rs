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
//! The disc is applied exactly (every pixel whose centre lies within the
//! radius weighs the same) for small radii. A large disc leaves nothing finer
//! than about a sixth of its radius in the picture, so there the picture is
//! first averaged down by an integer factor, blurred with the correspondingly
//! smaller disc and interpolated back up; a test checks the shortcut against
//! the exact convolution.

use super::depth_of_field::blur_angle;
use super::error::OpticsError;
use super::units::{Dioptres, Millimetres};

/// Minutes of arc in one radian (180 x 60 / π).
pub const ARCMIN_PER_RADIAN: f64 = 180.0 * 60.0 / std::f64::consts::PI;

/// Disc radius, in pixels, up to which the convolution is done exactly;
/// beyond it the picture is reduced first (see the module note).
const EXACT_RADIUS_PX: f64 = 6.0;

/// A grey picture, luminance 0 (black) to 255 (white), stored row by row
/// from the top left.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct GreyImage {
    width: usize,
    height: usize,
    pixels: Vec<u8>,
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

    /// The picture as RGBA bytes (grey in each colour, fully opaque), the
    /// layout a browser canvas takes.
    pub fn to_rgba(&self) -> Vec<u8> {
        let mut rgba = vec![255u8; self.pixels.len() * 4];
        for (out, &g) in rgba.chunks_exact_mut(4).zip(&self.pixels) {
            out[0] = g;
            out[1] = g;
            out[2] = g;
        }
        rgba
    }

    /// The mean over `factor` x `factor` blocks (the last blocks may be
    /// smaller): the picture reduced by `factor` in each direction.
    fn reduced(&self, factor: usize) -> GreyImage {
        let width = self.width.div_ceil(factor);
        let height = self.height.div_ceil(factor);
        let mut sums = vec![0u32; width * height];
        let mut counts = vec![0u32; width * height];
        for y in 0..self.height {
            let row = (y / factor) * width;
            for x in 0..self.width {
                sums[row + x / factor] += u32::from(self.pixels[y * self.width + x]);
                counts[row + x / factor] += 1;
            }
        }
        let pixels = sums
            .iter()
            .zip(&counts)
            .map(|(&s, &c)| ((s + c / 2) / c) as u8)
            .collect();
        GreyImage {
            width,
            height,
            pixels,
        }
    }

    /// This reduced picture interpolated (bilinearly) back up to `width` by
    /// `height`, each of its pixels covering `factor` x `factor` pixels there.
    /// Weights are in 1/256ths, so the arithmetic stays in integers.
    fn enlarged(&self, factor: usize, width: usize, height: usize) -> GreyImage {
        let sample = |i: usize, n: usize| {
            let at = ((i as f64 + 0.5) / factor as f64 - 0.5).clamp(0.0, (n - 1) as f64);
            let lo = at.floor() as usize;
            (
                lo,
                (lo + 1).min(n - 1),
                ((at - lo as f64) * 256.0).round() as u32,
            )
        };
        let columns: Vec<_> = (0..width).map(|x| sample(x, self.width)).collect();
        let mut pixels = vec![0u8; width * height];
        for (y, out) in pixels.chunks_exact_mut(width).enumerate() {
            let (y0, y1, fy) = sample(y, self.height);
            let top = &self.pixels[y0 * self.width..(y0 + 1) * self.width];
            let bottom = &self.pixels[y1 * self.width..(y1 + 1) * self.width];
            // Blend the two source rows once, then interpolate along the row.
            let row: Vec<u32> = top
                .iter()
                .zip(bottom)
                .map(|(&a, &b)| u32::from(a) * (256 - fy) + u32::from(b) * fy)
                .collect();
            for (o, &(x0, x1, fx)) in out.iter_mut().zip(&columns) {
                let v = row[x0] * (256 - fx) + row[x1] * fx;
                *o = ((v + (1 << 15)) >> 16) as u8;
            }
        }
        GreyImage {
            width,
            height,
            pixels,
        }
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
    /// the radius. A radius under half a pixel is the single centre pixel.
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
    /// repeat). A disc under half a pixel in radius leaves the picture
    /// unchanged.
    pub fn apply(&self, image: &GreyImage) -> GreyImage {
        if self.radius_px <= EXACT_RADIUS_PX || image.width < 2 || image.height < 2 {
            return convolve_disc(image, self.radius_px);
        }
        let factor = (self.radius_px / EXACT_RADIUS_PX).ceil() as usize;
        let small = image.reduced(factor);
        convolve_disc(&small, self.radius_px / factor as f64).enlarged(
            factor,
            image.width,
            image.height,
        )
    }
}

/// The exact convolution of `image` with the uniform pixel disc of radius
/// `radius_px`, the picture extended beyond its edges by repeating the edge
/// pixels: running sums along each (extended) row make each disc row two
/// look-ups, accumulated a whole output row at a time.
fn convolve_disc(image: &GreyImage, radius_px: f64) -> GreyImage {
    let widths = BlurDisc::half_widths(radius_px);
    if widths.len() == 1 && widths[0] == 0 {
        return image.clone();
    }
    let (w, h) = (image.width, image.height);
    let reach = widths.len() / 2;
    // Row y's running sums over its pixels extended by `reach` on each side:
    // sums[x'] is the sum of extended pixels before x' (x' = x + reach).
    let stride = w + 2 * reach + 1;
    let mut running = vec![0u32; stride * h];
    for (y, sums) in running.chunks_exact_mut(stride).enumerate() {
        let row = &image.pixels[y * w..(y + 1) * w];
        let mut total = 0u32;
        for i in 0..stride - 1 {
            let x = i.saturating_sub(reach).min(w - 1);
            total += u32::from(row[x]);
            sums[i + 1] = total;
        }
    }
    let count: u32 = widths.iter().map(|&hw| 2 * hw as u32 + 1).sum();
    // The mean as a multiplication: 255 x 2^23 stays within u32.
    let inverse = (1u32 << 23) / count;
    let mut pixels = vec![0u8; w * h];
    let mut acc = vec![0u32; w];
    for (y, out) in pixels.chunks_exact_mut(w).enumerate() {
        acc.fill(0);
        for (d, &half) in widths.iter().enumerate() {
            let yy = (y + d).saturating_sub(reach).min(h - 1);
            let sums = &running[yy * stride..(yy + 1) * stride];
            let (left, right) = (&sums[reach - half..], &sums[reach + half + 1..]);
            for ((a, &r), &l) in acc.iter_mut().zip(right).zip(left) {
                *a += r - l;
            }
        }
        for (o, &a) in out.iter_mut().zip(&acc) {
            *o = ((a * inverse + (1 << 22)) >> 23).min(255) as u8;
        }
    }
    GreyImage {
        width: w,
        height: h,
        pixels,
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
        let spread = convolve_disc(&point, 6.5);
        let lit = (0..41).filter(|&x| spread.get(x, 20) != Some(0)).count();
        assert_eq!(lit, 13, "a 13 px disc lights 13 px of its middle row");
        let tall = (0..41).filter(|&y| spread.get(20, y) != Some(0)).count();
        assert_eq!(tall, 13);
    }

    #[test]
    fn zero_defocus_leaves_the_scene_unchanged() {
        let scene = card(120, 60);
        let disc = BlurDisc::from_defocus(Dioptres(0.0), Millimetres(4.0), 3.0).unwrap();
        assert_eq!(disc.radius_px, 0.0);
        assert_eq!(disc.apply(&scene), scene);
        // A disc under half a pixel across is still the single pixel.
        let tiny = BlurDisc::from_defocus(Dioptres(0.05), Millimetres(3.0), 1.0).unwrap();
        assert!(tiny.radius_px < 0.5);
        assert_eq!(tiny.apply(&scene), scene);
    }

    #[test]
    fn blur_keeps_the_mean_and_lowers_the_contrast() {
        let scene = card(160, 80);
        let blurred = BlurDisc {
            diameter_arcmin: 0.0,
            radius_px: 2.5,
        }
        .apply(&scene);
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

    // Cross-check of the two methods for the same quantity: the reduced
    // shortcut for a large disc against the exact convolution.
    #[test]
    fn the_reduced_shortcut_matches_the_exact_disc() {
        let scene = card(200, 120);
        for radius in [3.5, 6.5, 9.0, 14.0, 25.0] {
            let disc = BlurDisc {
                diameter_arcmin: 0.0,
                radius_px: radius,
            };
            let fast = disc.apply(&scene);
            let exact = convolve_disc(&scene, radius);
            let differences: Vec<f64> = fast
                .pixels()
                .iter()
                .zip(exact.pixels())
                .map(|(&a, &b)| (f64::from(a) - f64::from(b)).abs())
                .collect();
            let mean = differences.iter().sum::<f64>() / differences.len() as f64;
            // Within 7 grey levels (2.7 % of the scale) on average: a product
            // choice, below what shows at the picture's size.
            assert!(mean < 7.0, "radius {radius}: mean difference {mean}");
        }
    }

    #[test]
    fn a_scale_out_of_range_is_an_error_not_a_panic() {
        assert!(BlurDisc::from_defocus(Dioptres(1.0), Millimetres(4.0), 0.0).is_err());
        assert!(BlurDisc::from_defocus(Dioptres(1.0), Millimetres(4.0), f64::NAN).is_err());
        assert!(BlurDisc::from_defocus(Dioptres(f64::INFINITY), Millimetres(4.0), 1.0).is_err());
    }
}
