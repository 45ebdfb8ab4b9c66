//! Degressive-power (occupational) lenses: the full near addition at the near
//! reference point and below, decreasing upwards by the degression so the top
//! of the lens serves intermediate or room distances. Not for driving.
//!
//! The profile is this product's model, not any maker's design: a
//! raised-cosine ramp (see [`Ramp`]) from the near addition at the near
//! reference point, [`NEAR_REFERENCE_MM`] below the fitting point, up to the
//! near addition less the degression, [`DEGRESSION_HEIGHT_MM`] higher. The
//! corridor moves nasally with the addition, as for progressive lenses.

use super::error::{LensError, NamedBounds};
use super::limits::{CORRIDOR_INSET, DEGRESSION, NEAR_ADDITION};
use super::ramp::{Corridor, Ramp};
use super::{LensPoint, LensSample, Zone};
use crate::core::units::{Dioptres, Millimetres};

/// Default height of the near reference point, in millimetres from the
/// fitting point (negative is below): this model's choice, of the order of
/// the progression lengths of progressive lenses (common practice).
pub const NEAR_REFERENCE_MM: f64 = -14.0;

/// Default height over which the degression is spread, in millimetres: this
/// model's choice, so the power keeps falling to a few millimetres above the
/// fitting point.
pub const DEGRESSION_HEIGHT_MM: f64 = 20.0;

/// Allowed heights of the near reference point, in millimetres.
const NEAR_REFERENCE: NamedBounds =
    NamedBounds::new("near reference point height", -24.0, -6.0, "mm");

/// Allowed heights over which the degression is spread, in millimetres.
const DEGRESSION_HEIGHT: NamedBounds = NamedBounds::new("degression height", 8.0, 36.0, "mm");

/// A degressive-power lens: near addition, degression and the model's layout.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Degressive {
    corridor: Corridor,
}

impl Degressive {
    /// A degressive lens with the model's default layout: `near_addition`
    /// (0.50 to 4.00 D) at the near reference point, `degression` (0.50 to
    /// 2.50 D, at most the near addition) lost upwards, near inset 2.5 mm.
    pub fn new(near_addition: Dioptres, degression: Dioptres) -> Result<Degressive, LensError> {
        Degressive::with_layout(
            near_addition,
            degression,
            Millimetres(NEAR_REFERENCE_MM),
            Millimetres(DEGRESSION_HEIGHT_MM),
            Millimetres(super::progressive::DEFAULT_NEAR_INSET_MM),
        )
    }

    /// A degressive lens with its near reference point at `near_reference`
    /// millimetres from the fitting point (-24 to -6 mm), the degression
    /// spread over `degression_height` millimetres above it (8 to 36 mm) and
    /// the near reference point inset `near_inset` millimetres (0 to 5 mm).
    pub fn with_layout(
        near_addition: Dioptres,
        degression: Dioptres,
        near_reference: Millimetres,
        degression_height: Millimetres,
        near_inset: Millimetres,
    ) -> Result<Degressive, LensError> {
        let near = NEAR_ADDITION.check(near_addition.0)?;
        let degression = DEGRESSION.check(degression.0)?;
        if degression > near {
            return Err(LensError::DegressionExceedsAddition {
                degression_d: degression,
                near_addition_d: near,
            });
        }
        let bottom = NEAR_REFERENCE.check(near_reference.0)?;
        let height = DEGRESSION_HEIGHT.check(degression_height.0)?;
        let inset = CORRIDOR_INSET.check(near_inset.0)?;
        Ok(Degressive {
            corridor: Corridor::new(
                Ramp::new(
                    Millimetres(bottom + height),
                    Millimetres(bottom),
                    Dioptres(near - degression),
                    Dioptres(near),
                ),
                inset,
            ),
        })
    }

    /// The addition at the near reference point and below, in dioptres.
    pub fn near_addition(&self) -> Dioptres {
        self.ramp().bottom_value()
    }

    /// The power lost from the near reference point to the top, in dioptres.
    pub fn degression(&self) -> Dioptres {
        self.ramp().bottom_value() - self.ramp().top_value()
    }

    /// The addition of the upper zone (near addition less degression), in dioptres.
    pub fn upper_addition(&self) -> Dioptres {
        self.ramp().top_value()
    }

    /// The power profile along the corridor.
    pub fn ramp(&self) -> &Ramp {
        self.corridor.ramp()
    }

    /// The corridor centre line's nasal offset at height `y`, in millimetres.
    pub fn corridor_x(&self, y: Millimetres) -> Millimetres {
        self.corridor.x_at(y)
    }

    /// The addition and zone at a lens point (the addition depends on the height only).
    pub fn evaluate(&self, point: LensPoint) -> LensSample {
        self.corridor.sample(point, Zone::Intermediate)
    }
}
