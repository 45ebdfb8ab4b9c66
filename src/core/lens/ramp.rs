//! The smooth vertical power profile shared by progressive and degressive
//! lenses: a raised-cosine ramp between two heights on the lens, with its
//! gradient and its exact inverse (the height at which a given addition is
//! reached). The shape is a model chosen for smoothness and a closed-form
//! inverse, not any maker's design. A [`Corridor`] pairs a ramp with the
//! nasal inset its centre line follows, and gives the addition and zone at
//! a lens point for both corridor families.

use super::{corridor_zone, LensPoint, LensSample, Zone};
use crate::core::units::{Dioptres, Millimetres};

/// The rate at which the addition changes along the corridor, in dioptres per
/// millimetre of lens height (positive when the addition grows upwards).
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd, Default)]
pub struct PowerGradient(pub f64);

impl PowerGradient {
    /// The size of the gradient, whatever its direction, in dioptres per millimetre.
    pub fn magnitude(self) -> f64 {
        self.0.abs()
    }
}

/// A raised-cosine change of addition from `top_value` at `top_y` down to
/// `bottom_value` at `bottom_y`; constant above and below.
///
/// With the fraction of the way down `t = (top_y - y) / (top_y - bottom_y)`
/// (clamped to 0..1), the progress is `p = (1 - cos(pi t)) / 2` and the
/// addition is `top_value + (bottom_value - top_value) p`. The gradient is
/// zero at both ends (the power joins the distance and near zones smoothly)
/// and largest, `pi/2` times the mean gradient, half-way down.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Ramp {
    top_y: f64,
    bottom_y: f64,
    top_value: f64,
    bottom_value: f64,
}

impl Ramp {
    /// A ramp from `top_value` at height `top_y` to `bottom_value` at `bottom_y`.
    /// Callers guarantee finite values and `bottom_y < top_y` (the families
    /// validate their parameters before building one).
    pub(crate) fn new(
        top_y: Millimetres,
        bottom_y: Millimetres,
        top_value: Dioptres,
        bottom_value: Dioptres,
    ) -> Ramp {
        Ramp {
            top_y: top_y.0,
            bottom_y: bottom_y.0,
            top_value: top_value.0,
            bottom_value: bottom_value.0,
        }
    }

    /// Height where the ramp starts (its upper end), in millimetres from the fitting point.
    pub fn top(&self) -> Millimetres {
        Millimetres(self.top_y)
    }

    /// Height where the ramp ends (its lower end), in millimetres from the fitting point.
    pub fn bottom(&self) -> Millimetres {
        Millimetres(self.bottom_y)
    }

    /// Addition above the ramp, in dioptres.
    pub fn top_value(&self) -> Dioptres {
        Dioptres(self.top_value)
    }

    /// Addition below the ramp, in dioptres.
    pub fn bottom_value(&self) -> Dioptres {
        Dioptres(self.bottom_value)
    }

    fn length(&self) -> f64 {
        self.top_y - self.bottom_y
    }

    fn fraction_down(&self, y: f64) -> f64 {
        ((self.top_y - y) / self.length()).clamp(0.0, 1.0)
    }

    /// Share of the power change reached at height `y`: 0 at and above the
    /// ramp's top, 1 at and below its bottom. Corridor inset follows it.
    pub fn progress(&self, y: Millimetres) -> f64 {
        let t = self.fraction_down(y.0);
        0.5 * (1.0 - (std::f64::consts::PI * t).cos())
    }

    /// The addition at height `y`, in dioptres.
    ///
    /// ```
    /// use clearspan::core::lens::Progressive;
    /// use clearspan::core::units::{Dioptres, Millimetres};
    /// // A 2.00 D progression that runs from 2 mm to 18 mm below the fitting
    /// // point reaches half its addition half-way down, at -10 mm: cos(pi/2) = 0.
    /// let lens = Progressive::new(Dioptres(2.0), Millimetres(18.0), Millimetres(0.0)).unwrap();
    /// let add = lens.ramp().value_at(Millimetres(-10.0));
    /// assert!((add.0 - 1.0).abs() < 1e-12);
    /// ```
    pub fn value_at(&self, y: Millimetres) -> Dioptres {
        Dioptres(self.top_value + (self.bottom_value - self.top_value) * self.progress(y))
    }

    /// The rate of change of the addition with height at `y` (positive when
    /// the addition grows upwards), in dioptres per millimetre.
    pub fn gradient_at(&self, y: Millimetres) -> PowerGradient {
        let t = self.fraction_down(y.0);
        if t <= 0.0 || t >= 1.0 {
            return PowerGradient(0.0);
        }
        let pi = std::f64::consts::PI;
        // dp/dy = dp/dt * dt/dy, and dt/dy = -1 / length.
        let dp_dy = -0.5 * pi * (pi * t).sin() / self.length();
        PowerGradient((self.bottom_value - self.top_value) * dp_dy)
    }

    /// The largest gradient along the ramp (half-way down), in dioptres per millimetre.
    pub fn peak_gradient(&self) -> PowerGradient {
        self.gradient_at(Millimetres(0.5 * (self.top_y + self.bottom_y)))
    }

    /// The height at which the ramp delivers `value`: the exact inverse of
    /// [`Ramp::value_at`] inside the ramp, `t = acos(1 - 2p) / pi`. `None` when
    /// `value` lies outside the ramp's range of additions. When the ramp does
    /// not change power, its top is returned for its one value.
    pub fn height_for(&self, value: Dioptres) -> Option<Millimetres> {
        let (lo, hi) = self.value_range();
        if !value.0.is_finite() || value.0 < lo || value.0 > hi {
            return None;
        }
        let change = self.bottom_value - self.top_value;
        if change == 0.0 {
            return Some(Millimetres(self.top_y));
        }
        let p = ((value.0 - self.top_value) / change).clamp(0.0, 1.0);
        let t = (1.0 - 2.0 * p).clamp(-1.0, 1.0).acos() / std::f64::consts::PI;
        Some(Millimetres(self.top_y - t * self.length()))
    }

    /// The smallest and largest addition of the ramp, in dioptres.
    pub(crate) fn value_range(&self) -> (f64, f64) {
        (
            self.top_value.min(self.bottom_value),
            self.top_value.max(self.bottom_value),
        )
    }
}

/// The corridor of a progressive or degressive lens: its power profile and
/// the nasal inset, in millimetres, that its centre line reaches at the
/// ramp's bottom, moving nasally with the ramp's progress.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Corridor {
    ramp: Ramp,
    inset: f64,
}

impl Corridor {
    /// A corridor following `ramp`, inset `inset` millimetres at its bottom.
    /// Callers check the inset before building one.
    pub(crate) fn new(ramp: Ramp, inset: f64) -> Corridor {
        Corridor { ramp, inset }
    }

    /// The power profile along the corridor.
    pub(crate) fn ramp(&self) -> &Ramp {
        &self.ramp
    }

    /// The nasal inset at the ramp's bottom, in millimetres.
    pub(crate) fn inset(&self) -> f64 {
        self.inset
    }

    /// The centre line's nasal offset at height `y`, in millimetres.
    pub(crate) fn x_at(&self, y: Millimetres) -> Millimetres {
        Millimetres(self.inset * self.ramp.progress(y))
    }

    /// The addition and zone at a lens point, which depend on its height
    /// only; `above` names the zone over the ramp.
    pub(crate) fn sample(&self, point: LensPoint, above: Zone) -> LensSample {
        LensSample {
            addition: self.ramp.value_at(point.y),
            zone: corridor_zone(&self.ramp, point.y, above),
        }
    }
}
