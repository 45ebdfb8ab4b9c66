//! A numerical cross-check of the Minkwitz width: a smooth lens surface whose
//! mean power along an umbilic corridor follows a design's ramp, with its
//! curvatures found by finite differences of the sag, so the width where the
//! cylinder reaches a tolerance can be compared with `T / |G|`.

use super::{minkwitz_width, unwanted_astigmatism};
use crate::core::lens::{Degressive, LensDesign, LensPoint, Progressive, Ramp};
use crate::core::units::{Dioptres, Millimetres};
use nalgebra::Matrix2;
use std::f64::consts::PI;

/// Refractive index of the surface's material (crown glass / CR-39 order, common practice).
const INDEX: f64 = 1.5;
/// Base (distance) surface power, in dioptres.
const BASE_D: f64 = 4.0;
/// Finite-difference step, in millimetres.
const STEP: f64 = 0.05;

/// The sag `z(x, y)` (mm) of a surface whose curvature `k(y)` in both
/// principal directions along `x = 0` gives the power `BASE_D + ramp(y)`:
/// `z = (BASE_D y^2 / 2 + g(y)) / (1000 (n - 1)) + k(y) x^2 / 2`, where
/// `g'' = ramp(y)` is integrated in closed form.
struct Surface {
    ramp: Ramp,
}

impl Surface {
    /// The double integral of the ramp's addition, `g` with `g'' = ramp`,
    /// `g = g' = 0` at the ramp's bottom. With `u = y - bottom`, `D` the
    /// ramp length, `a` the bottom value and `d` the change to the top value:
    /// inside the ramp `g = a u^2/2 + d/2 (u^2/2 + (D/pi)^2 (cos(pi u/D) - 1))`;
    /// below it `a u^2 / 2`; above it the quadratic continuation with the top value.
    fn double_integral(&self, y: f64) -> f64 {
        let a = self.ramp.bottom_value().0;
        let b = self.ramp.top_value().0;
        let d = b - a;
        let len = self.ramp.top().0 - self.ramp.bottom().0;
        let u = y - self.ramp.bottom().0;
        let inside = |u: f64| {
            a * u * u / 2.0
                + d / 2.0 * (u * u / 2.0 + (len / PI).powi(2) * ((PI * u / len).cos() - 1.0))
        };
        if u <= 0.0 {
            a * u * u / 2.0
        } else if u <= len {
            inside(u)
        } else {
            let slope = a * len + d * len / 2.0;
            inside(len) + slope * (u - len) + b * (u - len).powi(2) / 2.0
        }
    }

    fn sag(&self, x: f64, y: f64) -> f64 {
        let scale = 1000.0 * (INDEX - 1.0);
        let curvature = (BASE_D + self.ramp.value_at(Millimetres(y)).0) / scale;
        (BASE_D * y * y / 2.0 + self.double_integral(y)) / scale + curvature * x * x / 2.0
    }

    /// The Hessian of the sag by central differences, per millimetre.
    fn hessian(&self, x: f64, y: f64) -> Matrix2<f64> {
        let h = STEP;
        let z = |dx: f64, dy: f64| self.sag(x + dx, y + dy);
        let zxx = (z(h, 0.0) - 2.0 * z(0.0, 0.0) + z(-h, 0.0)) / (h * h);
        let zyy = (z(0.0, h) - 2.0 * z(0.0, 0.0) + z(0.0, -h)) / (h * h);
        let zxy = (z(h, h) - z(h, -h) - z(-h, h) + z(-h, -h)) / (4.0 * h * h);
        Matrix2::new(zxx, zxy, zxy, zyy)
    }

    /// Mean surface power and cylinder (dioptres) from the Hessian's
    /// eigenvalues (small-slope principal curvatures) times `1000 (n - 1)`.
    fn powers(&self, x: f64, y: f64) -> (f64, f64) {
        let e = self.hessian(x, y).symmetric_eigenvalues();
        let scale = 1000.0 * (INDEX - 1.0);
        (scale * (e[0] + e[1]) / 2.0, scale * (e[0] - e[1]).abs())
    }

    /// The lateral distance (mm) at which the numerical cylinder reaches
    /// `tolerance`, by bisection (the cylinder grows with |x|).
    fn half_width(&self, y: f64, tolerance: f64) -> f64 {
        let (mut lo, mut hi) = (0.0, 40.0);
        for _ in 0..60 {
            let mid = 0.5 * (lo + hi);
            if self.powers(mid, y).1 < tolerance {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        0.5 * (lo + hi)
    }
}

fn designs() -> [LensDesign; 3] {
    [
        LensDesign::Progressive(
            Progressive::new(Dioptres(2.5), Millimetres(14.0), Millimetres(0.0)).unwrap(),
        ),
        LensDesign::Progressive(
            Progressive::new(Dioptres(1.0), Millimetres(20.0), Millimetres(0.0)).unwrap(),
        ),
        LensDesign::Degressive(
            Degressive::with_layout(
                Dioptres(2.0),
                Dioptres(1.5),
                Millimetres(-14.0),
                Millimetres(20.0),
                Millimetres(0.0),
            )
            .unwrap(),
        ),
    ]
}

/// Heights at fractions 0.25 to 0.75 of the way down a ramp.
fn heights(ramp: &Ramp) -> impl Iterator<Item = f64> + '_ {
    [0.25, 0.4, 0.5, 0.6, 0.75]
        .into_iter()
        .map(move |t| ramp.top().0 - t * (ramp.top().0 - ramp.bottom().0))
}

#[test]
fn corridor_is_umbilic_with_the_ramp_mean_power() {
    for design in designs() {
        let ramp = *design.ramp().unwrap();
        let surface = Surface { ramp };
        for y in [-30.0, -16.0, -10.0, -5.0, 0.0, 8.0] {
            let (mean, cylinder) = surface.powers(0.0, y);
            let expected = BASE_D + ramp.value_at(Millimetres(y)).0;
            assert!(
                (mean - expected).abs() < 1e-4,
                "mean {mean} vs {expected} at {y}"
            );
            assert!(
                cylinder < 1e-4,
                "cylinder {cylinder} on the corridor at {y}"
            );
        }
    }
}

#[test]
fn numerical_width_agrees_with_minkwitz() {
    // The Minkwitz width is first order in x; the surface's cylinder also has
    // the second-order term k'' x^2 / 2, which narrows the width by the factor
    // 1 / sqrt(1 + (k'' x / 4k')^2). On the raised-cosine ramp of length D,
    // k''/k' = (pi / D) cot(pi t), so where the predicted half width x is at
    // most D / 8 (and t lies in 0.25..0.75) the factor is above 0.995: the two
    // widths must agree within 3 %. Wider predictions are outside the
    // theorem's local reach; there the surface must still be no wider than
    // Minkwitz's estimate, since the neglected term only adds cylinder.
    let mut local_cases = 0;
    for design in designs() {
        let ramp = *design.ramp().unwrap();
        let length = ramp.top().0 - ramp.bottom().0;
        let surface = Surface { ramp };
        for y in heights(&ramp) {
            for tolerance in [0.25, 0.5, 1.0] {
                let numeric = 2.0 * surface.half_width(y, tolerance);
                let minkwitz =
                    minkwitz_width(ramp.gradient_at(Millimetres(y)), Dioptres(tolerance))
                        .unwrap()
                        .unwrap()
                        .0;
                let what = format!(
                    "{:?} at {y} mm, {tolerance} D: numeric {numeric} mm, Minkwitz {minkwitz} mm",
                    design.family()
                );
                if minkwitz <= length / 4.0 {
                    local_cases += 1;
                    assert!((numeric / minkwitz - 1.0).abs() < 0.03, "{what}");
                } else {
                    assert!(numeric <= minkwitz * 1.001, "{what}");
                }
            }
        }
    }
    // 23 of the 45 cases fall within reach with these designs; the count guards
    // against a change that would leave the 3 % check with nothing to test.
    assert!(
        local_cases >= 20,
        "only {local_cases} cases within the theorem's reach"
    );
}

#[test]
fn model_astigmatism_matches_the_surface_near_the_corridor() {
    // Within 1.5 mm of the corridor, the design's linear estimate and the
    // surface's cylinder agree to 3 % (same first-order argument as above).
    for design in designs() {
        let ramp = *design.ramp().unwrap();
        let surface = Surface { ramp };
        for y in heights(&ramp) {
            for x in [0.5, 1.0, 1.5] {
                let model = unwanted_astigmatism(&design, LensPoint::new(x, y)).0;
                let numeric = surface.powers(x, y).1;
                assert!(
                    (model - numeric).abs() <= 0.03 * numeric,
                    "at ({x}, {y}): model {model} D, surface {numeric} D"
                );
            }
        }
    }
}
