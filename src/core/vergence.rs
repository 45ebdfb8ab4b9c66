//! Vergence through a spectacle or contact lens to the eye: ocular refraction
//! from a spectacle power at a vertex distance, effectivity (the power needed
//! at another vertex distance), and the ocular accommodation an object needs
//! when seen through a given local power of a lens. All vergences are reduced
//! vergences in air, in dioptres; the spectacle plane is the back vertex of
//! the lens and the eye's reference plane is the corneal vertex.
//!
//! The formulas are the standard thin-lens vergence relations of visual
//! optics (for example Keating, *Geometric, Physical and Visual Optics*, and
//! Bennett & Rabbetts' *Clinical Visual Optics*, chapters on ocular
//! refraction and ocular accommodation):
//!
//! - ocular refraction K = F / (1 - vF);
//! - object vergence L = -1/l for a real object l metres in front of the lens;
//! - after the lens L' = L + P, at the cornea L'e = L' / (1 - vL');
//! - ocular accommodation needed A = K - L'e (contact lenses: v = 0).

use super::error::OpticsError;
use super::units::{Dioptres, Metres};

/// Largest lens power (any meridian, including an addition) the model accepts, in dioptres.
pub const MAX_POWER_D: f64 = 45.0;
/// Largest vertex distance accepted, in metres (30 mm; spectacles sit at 10-20 mm).
pub const MAX_VERTEX_M: f64 = 0.030;
/// Closest object distance from the spectacle plane, in metres. No task is
/// viewed closer than 2 cm; near limits closer than this are reported as this.
pub const MIN_OBJECT_DISTANCE_M: f64 = 0.02;
/// Farthest finite object distance accepted, in metres; farther objects are
/// treated as at infinity (their vergence is below 0.00001 D).
pub const MAX_OBJECT_DISTANCE_M: f64 = 100_000.0;
/// The vergence transfer L / (1 - dL) is refused when its denominator falls
/// below this: the lens would then form its image within a few millimetres
/// of the eye, far outside spectacle practice.
const MIN_TRANSFER_DENOMINATOR: f64 = 0.1;
/// `vF` above this is refused for a distance correction (K would exceed 2F).
pub const MAX_VERTEX_TIMES_POWER: f64 = 0.5;

/// Checks a vertex distance: finite, 0 to 30 mm.
pub fn check_vertex(vertex: Metres) -> Result<Metres, OpticsError> {
    OpticsError::in_range("vertex distance", vertex.0, 0.0, MAX_VERTEX_M, "m").map(Metres)
}

/// Checks a lens power: finite, within ±45 D.
pub fn check_power(quantity: &'static str, power: Dioptres) -> Result<Dioptres, OpticsError> {
    OpticsError::in_range(quantity, power.0, -MAX_POWER_D, MAX_POWER_D, "D").map(Dioptres)
}

/// The vergence of light from a real object `distance` metres in front of the
/// spectacle plane: L = -1/l (negative: the light diverges).
///
/// ```
/// use clearspan::core::{units::Metres, vergence::object_vergence};
/// // 40 cm: L = -1 / 0.40 = -2.50 D.
/// assert!((object_vergence(Metres(0.4)).unwrap().0 + 2.5).abs() < 1e-12);
/// ```
pub fn object_vergence(distance: Metres) -> Result<Dioptres, OpticsError> {
    let l = OpticsError::in_range(
        "viewing distance",
        distance.0,
        MIN_OBJECT_DISTANCE_M,
        MAX_OBJECT_DISTANCE_M,
        "m",
    )?;
    Ok(Dioptres(-1.0 / l))
}

/// The vergence `vergence` becomes after travelling `gap` metres to the right
/// in air: L / (1 - gap L); `None` when the light comes to a focus too close
/// to the reference plane for the result to be meaningful.
fn transfer(vergence: f64, gap: f64) -> Option<f64> {
    let denominator = 1.0 - gap * vergence;
    (denominator >= MIN_TRANSFER_DENOMINATOR).then(|| vergence / denominator)
}

fn too_close_to_eye() -> OpticsError {
    OpticsError::Incompatible {
        problem: "the lens focuses the light within a few millimetres of the eye",
        remedy: "check the lens power, the vertex distance and the viewing distance",
    }
}

fn too_strong_for_vertex() -> OpticsError {
    OpticsError::Incompatible {
        problem: "the lens power is too strong for its vertex distance (vertex x power must stay below 0.5)",
        remedy: "check the prescription and the vertex distance in millimetres",
    }
}

/// Ocular refraction K in dioptres (the correcting vergence needed at the
/// cornea) of a spectacle power `spectacle` worn at `vertex`: K = F / (1 - vF).
///
/// ```
/// use clearspan::core::{units::{Dioptres, Metres}, vergence::ocular_refraction};
/// // +10.00 D at 12 mm: K = 10 / (1 - 0.012 x 10) = 10 / 0.88 = +11.364 D.
/// let k = ocular_refraction(Dioptres(10.0), Metres(0.012)).unwrap();
/// assert!((k.0 - 11.363_636).abs() < 1e-5);
/// ```
pub fn ocular_refraction(spectacle: Dioptres, vertex: Metres) -> Result<Dioptres, OpticsError> {
    let f = check_power("spectacle power", spectacle)?.0;
    let v = check_vertex(vertex)?.0;
    if v * f > MAX_VERTEX_TIMES_POWER {
        return Err(too_strong_for_vertex());
    }
    Ok(Dioptres(f / (1.0 - v * f)))
}

/// Spectacle refraction F in dioptres (the power needed at `vertex`) for an
/// ocular refraction `ocular`: F = K / (1 + vK), the inverse of
/// [`ocular_refraction`].
///
/// ```
/// use clearspan::core::{units::{Dioptres, Metres}, vergence::spectacle_refraction};
/// // K = -8.00 D at 12 mm: F = -8 / (1 - 0.096) = -8.850 D.
/// let f = spectacle_refraction(Dioptres(-8.0), Metres(0.012)).unwrap();
/// assert!((f.0 + 8.849_558).abs() < 1e-5);
/// ```
pub fn spectacle_refraction(ocular: Dioptres, vertex: Metres) -> Result<Dioptres, OpticsError> {
    // An accepted spectacle power can give an ocular refraction up to twice
    // its size (vF ≤ 0.5), so the inverse accepts that range.
    let k = OpticsError::in_range(
        "ocular refraction",
        ocular.0,
        -2.0 * MAX_POWER_D,
        2.0 * MAX_POWER_D,
        "D",
    )?;
    let v = check_vertex(vertex)?.0;
    let f = transfer(k, -v).ok_or_else(too_strong_for_vertex)?;
    if v * f > MAX_VERTEX_TIMES_POWER {
        return Err(too_strong_for_vertex());
    }
    check_power("spectacle power", Dioptres(f))
}

/// Effectivity: the power in dioptres a lens moved from vertex distance
/// `from` to `to` needs to keep the same ocular refraction.
///
/// ```
/// use clearspan::core::{units::{Dioptres, Metres}, vergence::power_at_vertex};
/// // +10.00 D at 12 mm moved onto the cornea (contact lens): +11.364 D.
/// let cl = power_at_vertex(Dioptres(10.0), Metres(0.012), Metres(0.0)).unwrap();
/// assert!((cl.0 - 11.363_636).abs() < 1e-5);
/// ```
pub fn power_at_vertex(power: Dioptres, from: Metres, to: Metres) -> Result<Dioptres, OpticsError> {
    spectacle_refraction(ocular_refraction(power, from)?, to)
}

/// An eye with its distance correction: the spectacle (or contact-lens)
/// distance power, the vertex distance and the resulting ocular refraction.
/// Built once per wearer and eye, then used for every task and lens point.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CorrectedEye {
    distance_power: Dioptres,
    vertex: Metres,
    ocular_refraction: Dioptres,
}

impl CorrectedEye {
    /// An eye whose distance refraction is `distance_power` at the spectacle
    /// plane `vertex` metres in front of the cornea (0 for contact lenses).
    pub fn new(distance_power: Dioptres, vertex: Metres) -> Result<CorrectedEye, OpticsError> {
        let ocular_refraction = ocular_refraction(distance_power, vertex)?;
        Ok(CorrectedEye {
            distance_power,
            vertex,
            ocular_refraction,
        })
    }

    /// The distance refraction at the spectacle plane, in dioptres.
    pub fn distance_power(&self) -> Dioptres {
        self.distance_power
    }

    /// The vertex distance, in metres (0 for contact lenses).
    pub fn vertex(&self) -> Metres {
        self.vertex
    }

    /// The ocular refraction K, in dioptres.
    pub fn ocular_refraction(&self) -> Dioptres {
        self.ocular_refraction
    }

    /// Ocular accommodation in dioptres needed to focus an object whose
    /// vergence at the spectacle plane is `object_vergence` (0 for an object
    /// at infinity, -1/l for one at l metres) through a lens of local power
    /// `local_power`: A = K - L'e with L' = L + P and L'e = L' / (1 - vL').
    /// Negative values mean the object lies beyond the far point: the eye
    /// would have to relax further than it can.
    ///
    /// ```
    /// use clearspan::core::{units::{Dioptres, Metres}, vergence::CorrectedEye};
    /// // -10.00 D at 12 mm, object at 1/3 m (L = -3.00 D), looking through the
    /// // distance power: K = -10 / 1.12 = -8.9286; L' = -13; L'e = -13 / 1.156
    /// // = -11.2457; A = -8.9286 + 11.2457 = 2.3171 D (3.00 D with contact lenses).
    /// let eye = CorrectedEye::new(Dioptres(-10.0), Metres(0.012)).unwrap();
    /// let a = eye.accommodation_for_vergence(Dioptres(-3.0), Dioptres(-10.0)).unwrap();
    /// assert!((a.0 - 2.317_10).abs() < 1e-4);
    /// ```
    pub fn accommodation_for_vergence(
        &self,
        object_vergence: Dioptres,
        local_power: Dioptres,
    ) -> Result<Dioptres, OpticsError> {
        let l = OpticsError::in_range(
            "object vergence",
            object_vergence.0,
            -1.0 / MIN_OBJECT_DISTANCE_M,
            0.0,
            "D",
        )?;
        let p = check_power("local lens power", local_power)?.0;
        let at_eye = transfer(l + p, self.vertex.0).ok_or_else(too_close_to_eye)?;
        Ok(Dioptres(self.ocular_refraction.0 - at_eye))
    }

    /// Ocular accommodation in dioptres needed for an object `distance`
    /// metres in front of the spectacle plane through local power
    /// `local_power`; see [`CorrectedEye::accommodation_for_vergence`].
    pub fn accommodation_needed(
        &self,
        distance: Metres,
        local_power: Dioptres,
    ) -> Result<Dioptres, OpticsError> {
        self.accommodation_for_vergence(object_vergence(distance)?, local_power)
    }

    /// The object vergence at the spectacle plane, in dioptres, that needs
    /// exactly `accommodation` dioptres of ocular accommodation through
    /// `local_power`: L = (K - A) / (1 + v(K - A)) - P, the inverse of
    /// [`CorrectedEye::accommodation_for_vergence`]. `None` when no object in
    /// front of the eye needs that much (the conjugate lies behind the lens
    /// plane or at it), meaning every object, however close, needs less.
    /// The result may be positive: that is a virtual object beyond infinity,
    /// which no real task can be.
    pub fn vergence_for_accommodation(
        &self,
        accommodation: Dioptres,
        local_power: Dioptres,
    ) -> Option<Dioptres> {
        transfer(self.ocular_refraction.0 - accommodation.0, -self.vertex.0)
            .map(|at_lens| Dioptres(at_lens - local_power.0))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    const TOL: f64 = 1e-4;

    use crate::approx::close;

    /// Hand-worked ocular refraction K = F / (1 - vF).
    fn check_k(f: f64, v_mm: f64, expected: f64) {
        close(
            ocular_refraction(Dioptres(f), Metres(v_mm / 1000.0))
                .unwrap()
                .0,
            expected,
            TOL,
        );
    }

    #[test]
    fn ocular_refraction_worked_examples() {
        // K = F / (1 - vF), the effectivity relation of Keating's and of Bennett &
        // Rabbetts' textbooks; each value worked by hand here.
        check_k(-10.0, 12.0, -10.0 / 1.12); // -8.9286 D
        check_k(10.0, 12.0, 10.0 / 0.88); // +11.3636 D
        check_k(-5.0, 14.0, -5.0 / 1.07); // -4.6729 D
        check_k(4.0, 0.0, 4.0); // contact lens: no vertex effect
        check_k(0.0, 14.0, 0.0);
    }

    /// Ocular accommodation through spectacles versus contact lenses for an
    /// object at `distance` m, distance correction `f` at `v_mm`.
    fn spectacle_and_contact(f: f64, v_mm: f64, distance: f64) -> (f64, f64) {
        let specs = CorrectedEye::new(Dioptres(f), Metres(v_mm / 1000.0)).unwrap();
        let k = specs.ocular_refraction();
        let contact = CorrectedEye::new(k, Metres(0.0)).unwrap();
        let a_specs = specs
            .accommodation_needed(Metres(distance), Dioptres(f))
            .unwrap();
        let a_contact = contact.accommodation_needed(Metres(distance), k).unwrap();
        (a_specs.0, a_contact.0)
    }

    #[test]
    fn myopes_accommodate_less_and_hyperopes_more_through_spectacles() {
        // Spectacle versus ocular accommodation: corrected myopes need less
        // accommodation through spectacles than through contact lenses, corrected
        // hyperopes more (Bennett & Rabbetts' Clinical Visual Optics, chapter on
        // ocular accommodation; also Keating, Geometric, Physical and Visual Optics;
        // chapter locations from memory). Values worked by hand for 1/3 m:
        // -10 D at 12 mm: A = -8.92857 + 13/1.156 = 2.31710 D;
        // +10 D at 12 mm: A = 11.36364 - 7/0.916 = 3.72172 D; contact lenses 3.00 D.
        let (myope_specs, myope_contact) = spectacle_and_contact(-10.0, 12.0, 1.0 / 3.0);
        close(myope_specs, 2.317_10, TOL);
        close(myope_contact, 3.0, 1e-9);
        let (hyperope_specs, hyperope_contact) = spectacle_and_contact(10.0, 12.0, 1.0 / 3.0);
        close(hyperope_specs, 3.721_72, TOL);
        close(hyperope_contact, 3.0, 1e-9);
        for f in [-12.0, -6.0, -2.0] {
            let (s, c) = spectacle_and_contact(f, 14.0, 0.4);
            assert!(
                s < c,
                "myope {f}: spectacles {s} should be below contact lenses {c}"
            );
        }
        for f in [2.0, 6.0, 12.0] {
            let (s, c) = spectacle_and_contact(f, 14.0, 0.4);
            assert!(
                s > c,
                "hyperope {f}: spectacles {s} should exceed contact lenses {c}"
            );
        }
    }

    #[test]
    fn distance_object_through_distance_power_needs_no_accommodation() {
        // Definition of the distance correction: the far point is at infinity.
        let eye = CorrectedEye::new(Dioptres(-6.0), Metres(0.013)).unwrap();
        close(
            eye.accommodation_for_vergence(Dioptres(0.0), Dioptres(-6.0))
                .unwrap()
                .0,
            0.0,
            1e-12,
        );
    }

    #[test]
    fn an_addition_equal_to_the_object_vergence_cancels_it() {
        // A +2.50 addition images an object at 40 cm at infinity behind the lens,
        // so no accommodation is needed whatever the vertex distance (L' = F).
        let eye = CorrectedEye::new(Dioptres(3.0), Metres(0.014)).unwrap();
        close(
            eye.accommodation_needed(Metres(0.4), Dioptres(5.5))
                .unwrap()
                .0,
            0.0,
            1e-12,
        );
    }

    #[test]
    fn inverse_recovers_the_object_vergence() {
        let eye = CorrectedEye::new(Dioptres(-4.0), Metres(0.012)).unwrap();
        let a = eye
            .accommodation_for_vergence(Dioptres(-2.0), Dioptres(-3.0))
            .unwrap();
        close(
            eye.vergence_for_accommodation(a, Dioptres(-3.0)).unwrap().0,
            -2.0,
            1e-12,
        );
    }

    #[test]
    fn invalid_input_is_a_typed_error() {
        let eye = CorrectedEye::new(Dioptres(1.0), Metres(0.012)).unwrap();
        assert!(matches!(
            eye.accommodation_needed(Metres(-0.4), Dioptres(1.0)),
            Err(OpticsError::OutOfRange { .. })
        ));
        assert!(matches!(
            eye.accommodation_needed(Metres(f64::NAN), Dioptres(1.0)),
            Err(OpticsError::NotFinite { .. })
        ));
        assert!(matches!(
            ocular_refraction(Dioptres(40.0), Metres(0.025)),
            Err(OpticsError::Incompatible { .. })
        ));
        assert!(matches!(
            ocular_refraction(Dioptres(2.0), Metres(0.05)),
            Err(OpticsError::OutOfRange { .. })
        ));
    }

    mod properties {
        use super::*;
        use proptest::prelude::*;

        proptest! {
            #[test]
            fn ocular_and_spectacle_refraction_invert(f in -25.0..25.0f64, v in 0.0..0.02f64) {
                let k = ocular_refraction(Dioptres(f), Metres(v)).unwrap();
                let back = spectacle_refraction(k, Metres(v)).unwrap();
                prop_assert!((back.0 - f).abs() < 1e-9);
            }

            #[test]
            fn effectivity_there_and_back(f in -20.0..20.0f64, v1 in 0.0..0.02f64, v2 in 0.0..0.02f64) {
                let moved = power_at_vertex(Dioptres(f), Metres(v1), Metres(v2)).unwrap();
                let back = power_at_vertex(moved, Metres(v2), Metres(v1)).unwrap();
                prop_assert!((back.0 - f).abs() < 1e-9);
            }

            #[test]
            fn accommodation_is_finite_or_an_error(
                f in proptest::num::f64::ANY,
                v in proptest::num::f64::ANY,
                l in proptest::num::f64::ANY,
                p in proptest::num::f64::ANY,
            ) {
                if let Ok(eye) = CorrectedEye::new(Dioptres(f), Metres(v)) {
                    prop_assert!(eye.ocular_refraction().0.is_finite());
                    if let Ok(a) = eye.accommodation_needed(Metres(l), Dioptres(p)) {
                        prop_assert!(a.0.is_finite());
                    }
                }
            }

            #[test]
            fn nearer_objects_need_more_accommodation(
                f in -15.0..15.0f64, v in 0.0..0.02f64, add in 0.0..3.5f64,
                near in 0.1..1.0f64, extra in 0.01..5.0f64,
            ) {
                let eye = CorrectedEye::new(Dioptres(f), Metres(v)).unwrap();
                let p = Dioptres(f + add);
                let a_near = eye.accommodation_needed(Metres(near), p).unwrap();
                let a_far = eye.accommodation_needed(Metres(near + extra), p).unwrap();
                prop_assert!(a_near.0 > a_far.0);
            }
        }
    }
}
