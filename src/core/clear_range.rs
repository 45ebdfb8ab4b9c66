//! The range of clear vision of a lens zone and the focus state of one task.
//!
//! A task is **in focus** when the ocular accommodation it needs, A, lies
//! within [-dof, amplitude + dof], and **comfortable** when it lies within
//! [-dof, usable share x amplitude + dof], dof being the half depth of field.
//! Since A falls steadily as the object moves away (dA/dL = -1/(1 - vL')² < 0
//! in [`crate::core::vergence`]), each bound gives one limit in closed form:
//! the far limit is the object vergence needing exactly -dof, the near limit
//! the one needing exactly the upper bound.
//!
//! Physical outcomes are values:
//! - a far limit at or beyond infinity is [`FarLimit::Infinite`];
//! - a zone where even distant objects need more accommodation than the
//!   bound (an under-corrected hyperope or presbyope) is [`ZoneRange::NeedsMorePlus`];
//! - a zone with so much plus that everything it focuses lies closer than
//!   2 cm is [`ZoneRange::NeedsLessPlus`]. Too much plus for a myope does not
//!   by itself leave nothing in focus: the myope's far point and the zone's
//!   plus add up, so the range moves very close to the eye but exists.

use super::accommodation::UsableShare;
use super::depth_of_field::MAX_HALF_DEPTH_D;
use super::error::OpticsError;
use super::units::{Dioptres, Metres};
use super::vergence::{
    check_power, object_vergence, CorrectedEye, MAX_OBJECT_DISTANCE_M, MIN_OBJECT_DISTANCE_M,
};
use serde::Serialize;
use std::fmt;

/// Largest ocular amplitude of accommodation accepted, in dioptres.
pub const MAX_AMPLITUDE_D: f64 = super::limits::AMPLITUDE.max;

/// One eye as the planner sees it: its distance correction, its ocular
/// amplitude of accommodation, the share usable for sustained work, and
/// whether the amplitude already contains the eye's depth of focus.
///
/// **Depth of field counted once.** A subjective amplitude (a push-up or
/// minus-lens measurement, or an age norm built from them such as
/// Hofstetter's lines from Duane's push-up data) is read to the first
/// noticeable blur, so it already includes the eye's depth of focus at the
/// near end. For such a viewer the near end of every range is the amplitude
/// itself, and depth of field widens only the far end; for an objective
/// amplitude (Anderson et al. 2008, autorefractor) it widens both ends
/// (Atchison & Smith, Optics of the Human Eye, on subjective and objective
/// amplitudes; from memory).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Viewer {
    eye: CorrectedEye,
    amplitude: Dioptres,
    usable: UsableShare,
    includes_depth_of_focus: bool,
    rounding_tolerance: Dioptres,
}

impl Viewer {
    /// A viewer with ocular amplitude `ocular_amplitude` (dioptres, 0 to 25);
    /// convert a spectacle-plane amplitude first with
    /// [`crate::core::accommodation::ocular_from_spectacle`].
    pub fn new(
        eye: CorrectedEye,
        ocular_amplitude: Dioptres,
        usable: UsableShare,
    ) -> Result<Viewer, OpticsError> {
        let amplitude = OpticsError::in_range(
            "amplitude of accommodation",
            ocular_amplitude.0,
            0.0,
            MAX_AMPLITUDE_D,
            "D",
        )?;
        Ok(Viewer {
            eye,
            amplitude: Dioptres(amplitude),
            usable,
            includes_depth_of_focus: false,
            rounding_tolerance: Dioptres(0.0),
        })
    }

    /// The same viewer accepting `tolerance` dioptres of accommodation
    /// beyond the (usable) amplitude at the near end: the shortfall of plus
    /// that rounding an addition to the nearest 0.25 D step leaves (at most
    /// 0.125 D; 0 when additions are rounded up).
    pub fn with_rounding_tolerance(self, tolerance: Dioptres) -> Viewer {
        Viewer {
            rounding_tolerance: Dioptres(tolerance.0.clamp(0.0, 0.125)),
            ..self
        }
    }

    /// The same viewer, its amplitude marked as subjective: it already
    /// contains the depth of focus at the near end.
    pub fn with_subjective_amplitude(self) -> Viewer {
        Viewer {
            includes_depth_of_focus: true,
            ..self
        }
    }

    /// Whether the amplitude already contains the depth of focus.
    pub fn includes_depth_of_focus(&self) -> bool {
        self.includes_depth_of_focus
    }

    /// How far beyond the (usable) amplitude the near end of a range reaches
    /// for a half depth of field `half_depth`: the rounding tolerance, plus
    /// `half_depth` unless the amplitude already contains it.
    pub fn near_end_allowance(&self, half_depth: Dioptres) -> Dioptres {
        let depth = if self.includes_depth_of_focus {
            0.0
        } else {
            half_depth.0
        };
        Dioptres(depth + self.rounding_tolerance.0)
    }

    /// The corrected eye.
    pub fn eye(&self) -> &CorrectedEye {
        &self.eye
    }

    /// The ocular amplitude of accommodation, in dioptres.
    pub fn amplitude(&self) -> Dioptres {
        self.amplitude
    }

    /// The share of the amplitude usable for sustained work.
    pub fn usable(&self) -> UsableShare {
        self.usable
    }
}

/// The far limit of a range of clear vision.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind", content = "metres")]
pub enum FarLimit {
    /// The far limit lies this many metres in front of the spectacle plane.
    Finite(Metres),
    /// Objects are clear out to infinity.
    Infinite,
}

impl FarLimit {
    /// The far limit as a vergence magnitude 1/l in dioptres (0 for
    /// infinity), which orders limits without infinities.
    pub fn reciprocal(self) -> Dioptres {
        match self {
            FarLimit::Finite(m) => Dioptres(1.0 / m.0),
            FarLimit::Infinite => Dioptres(0.0),
        }
    }
}

/// The range of clear vision of a zone under one criterion.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum ZoneRange {
    /// Objects from `near` to `far` (metres from the spectacle plane) are clear.
    /// Near limits closer than 2 cm are reported as 2 cm.
    Clear {
        /// Nearest clear distance, in metres.
        near: Metres,
        /// Farthest clear distance.
        far: FarLimit,
    },
    /// Nothing is clear: even an object at infinity needs more accommodation
    /// than the criterion allows. The zone needs more plus.
    NeedsMorePlus,
    /// Nothing farther than 2 cm is clear: the zone has far too much plus.
    NeedsLessPlus,
}

impl fmt::Display for FarLimit {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            FarLimit::Finite(m) => write!(f, "{:.0} cm", m.to_cm()),
            FarLimit::Infinite => f.write_str("infinity"),
        }
    }
}

impl fmt::Display for ZoneRange {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            ZoneRange::Clear { near, far } => write!(f, "{:.0} cm to {far}", near.to_cm()),
            ZoneRange::NeedsMorePlus => f.write_str("nothing clear (needs more plus)"),
            ZoneRange::NeedsLessPlus => f.write_str("nothing clear (needs less plus)"),
        }
    }
}

/// The ranges of clear vision of one zone.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ZoneRanges {
    /// Using the full amplitude: the task can be seen clearly, briefly.
    pub in_focus: ZoneRange,
    /// Using only the usable share of the amplitude: clear for sustained work.
    pub comfortable: ZoneRange,
}

fn check_half_depth(half_depth: Dioptres) -> Result<f64, OpticsError> {
    OpticsError::in_range(
        "half depth of field",
        half_depth.0,
        0.0,
        MAX_HALF_DEPTH_D,
        "D",
    )
}

/// Solves lo ≤ A(L) ≤ hi for the object vergence L and turns it into distances.
fn solve(eye: &CorrectedEye, power: f64, lo: f64, hi: f64) -> ZoneRange {
    let closest = -1.0 / MIN_OBJECT_DISTANCE_M;
    let farthest = -1.0 / MAX_OBJECT_DISTANCE_M;
    // A(L) ≥ lo holds for L at or below the far-limit vergence; `None` would
    // mean no object in front of the eye needs that little (never within the
    // accepted inputs, but handled as nothing clear).
    let power = Dioptres(power);
    let far_vergence = match eye.vergence_for_accommodation(Dioptres(lo), power) {
        Some(v) if v.0 >= closest => v.0,
        _ => return ZoneRange::NeedsLessPlus,
    };
    // A(L) ≤ hi holds at or above the near-limit vergence; `None` means every
    // object in front of the eye needs less than hi.
    let near_vergence = eye
        .vergence_for_accommodation(Dioptres(hi), power)
        .map_or(closest, |v| v.0)
        .max(closest);
    if near_vergence > 0.0 {
        return ZoneRange::NeedsMorePlus;
    }
    let far = if far_vergence >= farthest {
        FarLimit::Infinite
    } else {
        FarLimit::Finite(Metres(-1.0 / far_vergence))
    };
    ZoneRange::Clear {
        near: Metres(-1.0 / near_vergence.min(farthest)),
        far,
    }
}

/// The ranges of clear vision (in focus and comfortable) of a zone of local
/// power `local_power` (dioptres: distance power plus the local addition) for
/// `viewer`, widened at both ends by the half depth of field `half_depth`.
///
/// ```
/// use clearspan::core::accommodation::UsableShare;
/// use clearspan::core::clear_range::{range_of_clear_vision, FarLimit, Viewer, ZoneRange};
/// use clearspan::core::units::{Dioptres, Metres};
/// use clearspan::core::vergence::CorrectedEye;
/// // Emmetrope (contact-lens case v = 0), amplitude 1.00 D, +2.00 D addition,
/// // no depth of field: clear from 1/(2 + 1) = 0.333 m to 1/2 = 0.50 m.
/// let viewer = Viewer::new(CorrectedEye::new(Dioptres(0.0), Metres(0.0)).unwrap(), Dioptres(1.0), UsableShare::HALF).unwrap();
/// let r = range_of_clear_vision(&viewer, Dioptres(2.0), Dioptres(0.0)).unwrap();
/// match r.in_focus {
///     ZoneRange::Clear { near, far: FarLimit::Finite(far) } => {
///         assert!((near.0 - 1.0 / 3.0).abs() < 1e-12 && (far.0 - 0.5).abs() < 1e-12);
///     }
///     other => panic!("unexpected {other:?}"),
/// }
/// ```
pub fn range_of_clear_vision(
    viewer: &Viewer,
    local_power: Dioptres,
    half_depth: Dioptres,
) -> Result<ZoneRanges, OpticsError> {
    ranges_with_allowances(viewer, local_power, half_depth, half_depth)
}

/// Like [`range_of_clear_vision`], with one half depth of field for the
/// comfortable range and another for the in-focus range (a task judged by
/// a standard that tolerates more defocus for brief viewing than for
/// sustained work). The near ends follow [`Viewer::near_end_allowance`].
pub fn ranges_with_allowances(
    viewer: &Viewer,
    local_power: Dioptres,
    comfortable: Dioptres,
    in_focus: Dioptres,
) -> Result<ZoneRanges, OpticsError> {
    let p = check_power("local lens power", local_power)?.0;
    let comfort_dof = check_half_depth(comfortable)?;
    let focus_dof = check_half_depth(in_focus)?;
    let amp = viewer.amplitude.0;
    let near = |dof: f64| viewer.near_end_allowance(Dioptres(dof)).0;
    Ok(ZoneRanges {
        in_focus: solve(&viewer.eye, p, -focus_dof, amp + near(focus_dof)),
        comfortable: solve(
            &viewer.eye,
            p,
            -comfort_dof,
            viewer.usable.of(viewer.amplitude).0 + near(comfort_dof),
        ),
    })
}

/// The corrected far point and near point of `viewer` through local power
/// `local_power`, with no depth of field: the range in which the eye itself
/// can focus, from no accommodation to the full amplitude.
pub fn far_and_near_points(
    viewer: &Viewer,
    local_power: Dioptres,
) -> Result<ZoneRange, OpticsError> {
    let p = check_power("local lens power", local_power)?.0;
    Ok(solve(&viewer.eye, p, 0.0, viewer.amplitude.0))
}

/// How one task fares through one local power.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TaskFocus {
    /// Ocular accommodation the task needs, in dioptres (negative: the task
    /// lies beyond the far point of the zone).
    pub accommodation: Dioptres,
    /// Share of the amplitude the task uses (0 when it needs none); `None`
    /// when the amplitude is 0 and the task needs accommodation.
    pub share_of_amplitude: Option<f64>,
    /// Defocus left over with the full amplitude, beyond the depth of field,
    /// in dioptres: 0 when in focus, positive when the zone needs that much
    /// more plus, negative when it needs that much less.
    pub residual_defocus: Dioptres,
    /// The same for sustained work, with only the usable share of the amplitude.
    pub residual_for_comfort: Dioptres,
}

/// Defocus left over when `needed` must lie within [lo, hi].
fn residual(needed: f64, lo: f64, hi: f64) -> f64 {
    if needed > hi {
        needed - hi
    } else if needed < lo {
        needed - lo
    } else {
        0.0
    }
}

/// The focus state of a task `distance` metres from the spectacle plane seen
/// through local power `local_power` by `viewer`, with half depth of field
/// `half_depth`. Allocation-free: the planner calls it for every task at
/// every candidate lens point.
///
/// ```
/// use clearspan::core::accommodation::UsableShare;
/// use clearspan::core::clear_range::{evaluate_task, Viewer};
/// use clearspan::core::units::{Dioptres, Metres};
/// use clearspan::core::vergence::CorrectedEye;
/// // Emmetrope with contact lenses, amplitude 2.00 D, book at 40 cm (2.50 D)
/// // through a +1.00 addition: needs 1.50 D, 75 % of the amplitude; with half
/// // usable (1.00 D) and ±0.25 D depth of field, 0.25 D short of comfort.
/// let viewer = Viewer::new(CorrectedEye::new(Dioptres(0.0), Metres(0.0)).unwrap(), Dioptres(2.0), UsableShare::HALF).unwrap();
/// let t = evaluate_task(&viewer, Metres(0.4), Dioptres(1.0), Dioptres(0.25)).unwrap();
/// assert!((t.accommodation.0 - 1.5).abs() < 1e-12);
/// assert!((t.share_of_amplitude.unwrap() - 0.75).abs() < 1e-12);
/// assert_eq!(t.residual_defocus.0, 0.0);
/// assert!((t.residual_for_comfort.0 - 0.25).abs() < 1e-12);
/// ```
pub fn evaluate_task(
    viewer: &Viewer,
    distance: Metres,
    local_power: Dioptres,
    half_depth: Dioptres,
) -> Result<TaskFocus, OpticsError> {
    let dof = check_half_depth(half_depth)?;
    let near = viewer.near_end_allowance(Dioptres(dof)).0;
    let a = viewer
        .eye
        .accommodation_for_vergence(object_vergence(distance)?, local_power)?
        .0;
    let amp = viewer.amplitude.0;
    let share = if a <= 0.0 {
        Some(0.0)
    } else if amp > 0.0 {
        Some(a / amp)
    } else {
        None
    };
    Ok(TaskFocus {
        accommodation: Dioptres(a),
        share_of_amplitude: share,
        residual_defocus: Dioptres(residual(a, -dof, amp + near)),
        residual_for_comfort: Dioptres(residual(
            a,
            -dof,
            viewer.usable.of(viewer.amplitude).0 + near,
        )),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn viewer(f: f64, v_mm: f64, amp: f64) -> Viewer {
        let eye = CorrectedEye::new(Dioptres(f), Metres(v_mm / 1000.0)).unwrap();
        Viewer::new(eye, Dioptres(amp), UsableShare::HALF).unwrap()
    }

    /// Expected range as (near, far) in metres, far `None` for infinity.
    fn check(range: ZoneRange, near: f64, far: Option<f64>) {
        let ZoneRange::Clear { near: n, far: f } = range else {
            panic!("expected a clear range, got {range:?}");
        };
        assert!((n.0 - near).abs() < 1e-4, "near {} vs {near}", n.0);
        match (f, far) {
            (FarLimit::Infinite, None) => {}
            (FarLimit::Finite(m), Some(e)) => assert!((m.0 - e).abs() < 1e-4, "far {} vs {e}", m.0),
            (got, want) => panic!("far limit {got:?}, expected {want:?}"),
        }
    }

    #[test]
    fn presbyope_with_contact_lenses_worked_by_hand() {
        // v = 0, K = 0: A = -L - P. Amplitude 1.50 D, half usable, dof 0.25 D.
        // +2.00 zone: far where A = -0.25 -> L = -1.75 -> 0.5714 m;
        // in focus near where A = 1.75 -> L = -3.75 -> 0.2667 m;
        // comfortable near where A = 1.00 -> L = -3.00 -> 0.3333 m.
        let r =
            range_of_clear_vision(&viewer(0.0, 0.0, 1.5), Dioptres(2.0), Dioptres(0.25)).unwrap();
        check(r.in_focus, 1.0 / 3.75, Some(1.0 / 1.75));
        check(r.comfortable, 1.0 / 3.0, Some(1.0 / 1.75));
        // Distance zone: in focus out to infinity, near limit at 1/1.75 m.
        let d =
            range_of_clear_vision(&viewer(0.0, 0.0, 1.5), Dioptres(0.0), Dioptres(0.25)).unwrap();
        check(d.in_focus, 1.0 / 1.75, None);
    }

    #[test]
    fn high_myope_through_spectacles_worked_by_hand() {
        // -8.00 D at 12 mm, amplitude 1.00 D (ocular), no depth of field, zone +1.00 add
        // (P = -7.00). K = -8 / 1.096 = -7.29927.
        // Far: A = 0 -> L = K / (1 + vK) - P = -8 + 7 = -1.00 -> 1.0000 m.
        // Near: K - 1 = -8.29927; / (1 - 0.0995912) = -9.21722; L = -2.21722 -> 0.45101 m.
        let v = viewer(-8.0, 12.0, 1.0);
        let r = range_of_clear_vision(&v, Dioptres(-7.0), Dioptres(0.0)).unwrap();
        check(r.in_focus, 0.451_01, Some(1.0));
        check(
            far_and_near_points(&v, Dioptres(-7.0)).unwrap(),
            0.451_01,
            Some(1.0),
        );
    }

    #[test]
    fn physical_outcomes_are_values() {
        // A +3.00 D hyperope (K = +3, contact-lens plane) looking through a plano
        // zone, amplitude 1 D, dof 0.25 D: even infinity needs 3 D > 1.25 D.
        let hyperope = viewer(3.0, 0.0, 1.0);
        let r = range_of_clear_vision(&hyperope, Dioptres(0.0), Dioptres(0.25)).unwrap();
        assert_eq!(r.in_focus, ZoneRange::NeedsMorePlus);
        // A myope of -20 D looking through +45 D: everything clear lies within 2 cm.
        let myope = viewer(-20.0, 0.0, 0.0);
        let r = range_of_clear_vision(&myope, Dioptres(45.0), Dioptres(0.0)).unwrap();
        assert_eq!(r.in_focus, ZoneRange::NeedsLessPlus);
        // Too much plus for a moderate myope still leaves a (close) range.
        let r =
            range_of_clear_vision(&viewer(-5.0, 12.0, 0.5), Dioptres(-2.0), Dioptres(0.0)).unwrap();
        assert!(matches!(
            r.in_focus,
            ZoneRange::Clear {
                far: FarLimit::Finite(_),
                ..
            }
        ));
    }

    #[test]
    fn task_outside_the_range_reports_the_missing_power() {
        // Emmetrope, v = 0, no amplitude, dof 0.25: book at 40 cm (2.50 D) through
        // +1.50 needs 1.00 D: 0.75 D more plus needed; through +3.00 it needs
        // -0.50 D: 0.25 D less plus needed.
        let v = viewer(0.0, 0.0, 0.0);
        let weak = evaluate_task(&v, Metres(0.4), Dioptres(1.5), Dioptres(0.25)).unwrap();
        assert!((weak.residual_defocus.0 - 0.75).abs() < 1e-12);
        assert_eq!(weak.share_of_amplitude, None);
        let strong = evaluate_task(&v, Metres(0.4), Dioptres(3.0), Dioptres(0.25)).unwrap();
        assert!((strong.residual_defocus.0 + 0.25).abs() < 1e-12);
        assert_eq!(strong.share_of_amplitude, Some(0.0));
    }

    #[test]
    fn task_evaluation_agrees_with_the_range() {
        // A task inside the in-focus range has no residual defocus; one just
        // outside has some (consistency of the two functions).
        let v = viewer(-3.0, 12.0, 2.0);
        let p = Dioptres(-1.5);
        let dof = Dioptres(0.3);
        let r = range_of_clear_vision(&v, p, dof).unwrap();
        let ZoneRange::Clear {
            near,
            far: FarLimit::Finite(far),
        } = r.in_focus
        else {
            panic!("expected a finite range, got {r:?}");
        };
        let at = |m: f64| {
            evaluate_task(&v, Metres(m), p, dof)
                .unwrap()
                .residual_defocus
                .0
        };
        assert!(at(near.0 * 1.001).abs() < 1e-12 && at(far.0 * 0.999).abs() < 1e-12);
        assert!(at(near.0 * 0.99) > 0.0 && at(far.0 * 1.01) < 0.0);
    }

    mod properties {
        use super::*;
        use proptest::prelude::*;

        /// Near and far limits as vergence magnitudes (1/m), or None when nothing is clear.
        fn limits(range: ZoneRange) -> Option<(f64, f64)> {
            match range {
                ZoneRange::Clear { near, far } => Some((1.0 / near.0, far.reciprocal().0)),
                _ => None,
            }
        }

        fn any_viewer() -> impl Strategy<Value = Viewer> {
            (-15.0..15.0f64, 0.0..20.0f64, 0.0..12.0f64, 0.2..1.0f64).prop_map(|(f, v, a, u)| {
                let eye = CorrectedEye::new(Dioptres(f), Metres(v / 1000.0)).unwrap();
                Viewer::new(eye, Dioptres(a), UsableShare::new(u).unwrap()).unwrap()
            })
        }

        proptest! {
            #[test]
            fn more_addition_never_moves_the_range_away(
                viewer in any_viewer(), add in 0.0..4.0f64, more in 0.0..2.0f64, dof in 0.0..1.0f64,
            ) {
                let f = viewer.eye().distance_power().0;
                let a = range_of_clear_vision(&viewer, Dioptres(f + add), Dioptres(dof)).unwrap();
                let b = range_of_clear_vision(&viewer, Dioptres(f + add + more), Dioptres(dof)).unwrap();
                for (lo, hi) in [(a.in_focus, b.in_focus), (a.comfortable, b.comfortable)] {
                    if let (Some((n1, f1)), Some((n2, f2))) = (limits(lo), limits(hi)) {
                        prop_assert!(n2 >= n1 - 1e-9 && f2 >= f1 - 1e-9);
                    }
                    prop_assert!(!(hi == ZoneRange::NeedsMorePlus && lo != ZoneRange::NeedsMorePlus));
                }
            }

            #[test]
            fn near_never_beyond_far_and_comfort_within_focus(
                viewer in any_viewer(), add in -2.0..4.0f64, dof in 0.0..1.0f64,
            ) {
                let f = viewer.eye().distance_power().0;
                let r = range_of_clear_vision(&viewer, Dioptres(f + add), Dioptres(dof)).unwrap();
                for range in [r.in_focus, r.comfortable] {
                    if let ZoneRange::Clear { near, far } = range {
                        prop_assert!(near.0.is_finite() && near.0 > 0.0);
                        prop_assert!(1.0 / near.0 >= far.reciprocal().0 - 1e-9);
                        if let FarLimit::Finite(m) = far {
                            prop_assert!(m.0.is_finite() && m.0 >= near.0 - 1e-12);
                        }
                    }
                }
                if let (Some((n_focus, _)), Some((n_comfort, _))) = (limits(r.in_focus), limits(r.comfortable)) {
                    prop_assert!(n_comfort <= n_focus + 1e-9);
                }
            }

            #[test]
            fn task_results_are_finite(
                viewer in any_viewer(), add in -3.0..4.0f64, l in 0.02..1000.0f64, dof in 0.0..2.0f64,
            ) {
                let f = viewer.eye().distance_power().0;
                if let Ok(t) = evaluate_task(&viewer, Metres(l), Dioptres(f + add), Dioptres(dof)) {
                    prop_assert!(t.accommodation.0.is_finite());
                    prop_assert!(t.residual_defocus.0.is_finite() && t.residual_for_comfort.0.is_finite());
                    prop_assert!(t.share_of_amplitude.is_none_or(|s| s.is_finite() && s >= 0.0));
                    prop_assert!(t.residual_for_comfort.0.abs() >= t.residual_defocus.0.abs() - 1e-12);
                }
            }

            #[test]
            fn garbage_input_is_an_error_not_a_panic(
                p in proptest::num::f64::ANY, l in proptest::num::f64::ANY, dof in proptest::num::f64::ANY,
            ) {
                let v = viewer(-2.0, 12.0, 1.0);
                if let Ok(r) = range_of_clear_vision(&v, Dioptres(p), Dioptres(dof)) {
                    if let ZoneRange::Clear { near, .. } = r.in_focus {
                        prop_assert!(near.0.is_finite());
                    }
                }
                if let Ok(t) = evaluate_task(&v, Metres(l), Dioptres(p), Dioptres(dof)) {
                    prop_assert!(t.accommodation.0.is_finite());
                }
            }
        }
    }
}
