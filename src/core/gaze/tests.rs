//! Checks of the gaze model: the vector crossing against closed-form
//! sagittal and small-angle formulas, near centration and convergence
//! against the gaze model's own eye rotations, Prentice's rule at the
//! crossing points, and the head-posture solver on hand-worked cases.

use super::*;
use crate::approx::close_for;
use crate::core::lens::{Bifocal, LensDesign, Progressive, SegmentShape, Zone};
use crate::core::units::Dioptres;

fn fitting(tilt: f64, wrap: f64) -> Fitting {
    Fitting::new(FittingParams {
        pd_right: Millimetres(32.0),
        pd_left: Millimetres(32.0),
        vertex: Millimetres(13.5),
        cor_behind_cornea: Millimetres(COR_BEHIND_CORNEA_MM),
        pantoscopic_tilt: Degrees(tilt),
        face_form: Degrees(wrap),
        extent: VerticalExtent::from_frame(Millimetres(22.0), Millimetres(40.0)).unwrap(),
    })
    .unwrap()
}

fn task(distance: f64, vertical: TaskVertical, sideways: f64) -> TaskPosition {
    TaskPosition {
        distance: Metres(distance),
        vertical,
        sideways: Metres(sideways),
    }
}

fn cross(f: &Fitting, eye: Eye, t: TaskPosition, pitch: f64) -> LensCrossing {
    let point = f.locate(&t).unwrap();
    f.crossing(eye, &point, Degrees(pitch)).unwrap()
}

#[test]
fn vector_crossing_matches_the_sagittal_closed_form() {
    // In the eye's own sagittal plane (task offset sideways by the monocular
    // PD), a plane at c in front of the CoR tilted by t is crossed by a line
    // of sight at elevation e at height y = c sin e / cos(e + t), from the
    // CoR distance c cos t / cos(e + t) (plane geometry, worked in
    // gaze.rs's terms). Example: c = 27 mm, t = 10 deg, e = -20 deg:
    // y = 27 x (-0.342020) / 0.984808 = -9.377002 mm.
    let c = 27.0;
    for tilt in [0.0, 10.0, 20.0] {
        let f = fitting(tilt, 0.0);
        for height in [-0.4, -0.2, -0.05, 0.0, 0.1] {
            let t = task(0.6, TaskVertical::Height(Metres(height)), 0.032);
            let k = cross(&f, Eye::Right, t, 0.0);
            let e = k.elevation.to_radians();
            let tr = tilt.to_radians();
            close_for(k.point.y.0, c * e.sin() / (e + tr).cos(), 1e-9, "height");
            close_for(k.point.x.0, 0.0, 1e-9, "sideways");
            close_for(
                k.cor_to_lens.0,
                c * tr.cos() / (e + tr).cos(),
                1e-9,
                "distance",
            );
        }
    }
    // For the worked example the task sits where the right eye looks exactly
    // 20 degrees down: with r = 627 mm from the midpoint and the eye 32 mm
    // aside, its height is -sqrt(r^2 - 32^2) sin 20.
    let f = fitting(10.0, 0.0);
    let r: f64 = 600.0 + c;
    let h = -(r * r - 32.0 * 32.0).sqrt() * 20.0f64.to_radians().sin();
    let k = cross(
        &f,
        Eye::Right,
        task(0.6, TaskVertical::Height(Metres(h / 1000.0)), 0.032),
        0.0,
    );
    close_for(k.point.y.0, -9.377002, 1e-6, "worked example");
}

#[test]
fn small_angles_follow_the_linear_formula() {
    // For small elevations e (radians), y ~ c e / cos t: the sagittal
    // formula's first-order term. At 3 degrees the neglected terms are
    // about e tan t (under 1 % for t = 10 deg), so 2 % is required.
    for (tilt, angle) in [(0.0, 3.0), (10.0, -3.0), (10.0, 2.0)] {
        let f = fitting(tilt, 0.0);
        let k = cross(
            &f,
            Eye::Right,
            task(2.0, TaskVertical::GazeAngle(Degrees(angle)), 0.0),
            0.0,
        );
        let e = k.elevation.to_radians();
        let linear = 27.0 * e / tilt.to_radians().cos();
        assert!(
            (k.point.y.0 - linear).abs() <= 0.02 * linear.abs(),
            "{tilt}, {angle}"
        );
    }
}

/// The inset of the near visual point found by tracing the ray from the
/// task to the centre of rotation with exact angles: the ray meets the lens
/// `i` mm nasal of the optical centre, is deviated by Prentice's rule
/// (δ = decentration (cm) x F prism dioptres, towards the base: outwards for
/// plus lenses seen nasally of their centre), and must end at the centre of
/// rotation. Solved by bisection, independently of the closed form.
fn traced_inset(pd_mono: f64, l_mm: f64, c_mm: f64, power: f64) -> f64 {
    let miss = |i: f64| {
        let into_lens = ((pd_mono - i) / l_mm).atan();
        let deviation = (i / 10.0 * power / 100.0).atan();
        let out = into_lens + deviation;
        i - c_mm * out.tan()
    };
    let (mut lo, mut hi) = (0.0, pd_mono);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if miss(lo) * miss(mid) <= 0.0 {
            hi = mid;
        } else {
            lo = mid;
        }
    }
    0.5 * (lo + hi)
}

#[test]
fn near_inset_through_powered_lenses_follows_the_traced_ray() {
    // Plus lenses move the near visual points nasally and minus lenses
    // temporally (Jalie, Principles of Ophthalmic Lenses; from memory: about
    // 0.7 mm a pair at 6 D and 40 cm). Checked against an exact-angle trace.
    let f = fitting(0.0, 0.0);
    let c = f.lens_to_cor().0;
    let l = Metres(0.4);
    let plano = f.near_inset(Eye::Right, l).unwrap().0;
    for power in [-9.0, -6.0, -2.0, 0.0, 2.0, 6.0, 9.0] {
        let inset = f
            .near_inset_through(Eye::Right, l, Dioptres(power))
            .unwrap()
            .0;
        let traced = traced_inset(32.0, 400.0, c, power);
        close_for(inset, traced, 0.02, &format!("inset at {power} D"));
        assert_eq!(inset > plano, power > 0.0, "{power} D");
    }
    let pair_shift = 2.0
        * (f.near_inset_through(Eye::Right, l, Dioptres(6.0))
            .unwrap()
            .0
            - plano);
    assert!((0.5..=0.9).contains(&pair_shift), "{pair_shift} mm a pair");
}

#[test]
fn near_inset_and_convergence_agree_with_the_gaze_model() {
    // Near PD = PD l / (l + c): 64 x 400 / 427 = 59.953 mm; inset per eye
    // 32 x 27 / 427 = 2.023 mm; convergence 100 x 0.032 / 0.427 = 7.494
    // prism dioptres (formulas as in the domain brief; values worked by hand).
    let f = fitting(0.0, 0.0);
    let l = Metres(0.4);
    close_for(f.near_pd(l).unwrap().0, 59.953162, 1e-6, "near PD");
    let straight = task(0.4, TaskVertical::GazeAngle(Degrees(0.0)), 0.0);
    for eye in [Eye::Right, Eye::Left] {
        let inset = f.near_inset(eye, l).unwrap().0;
        close_for(inset, 2.023419, 1e-6, "inset");
        let k = cross(&f, eye, straight, 0.0);
        close_for(k.point.x.0, inset, 1e-9, "crossing is the inset");
        let demand = f.convergence_demand(eye, l).unwrap().0;
        close_for(demand, 7.494145, 1e-6, "convergence");
        close_for(
            100.0 * k.azimuth_nasal.to_radians().tan(),
            demand,
            1e-9,
            "eye rotation",
        );
    }
    let insets = f.near_inset(Eye::Right, l).unwrap().0 + f.near_inset(Eye::Left, l).unwrap().0;
    close_for(64.0 - f.near_pd(l).unwrap().0, insets, 1e-9, "insets sum");
}

#[test]
fn prentice_at_the_reading_level() {
    // Reading at 40 cm, 25 degrees down, no tilt: each eye crosses its lens
    // at y = -27 tan 25 = -12.590307 mm (the sight line's slope dy/dz is
    // tan 25 for both eyes). R +1.00 D, L +3.00 D vertical meridians, optical
    // centres at the fitting points: Prentice gives 1.259031 and 3.777092
    // prism dioptres base up, an imbalance of 2.518061 (left base up).
    let f = fitting(0.0, 0.0);
    let t = task(0.4, TaskVertical::GazeAngle(Degrees(-25.0)), 0.0);
    let r = cross(&f, Eye::Right, t, 0.0);
    let l = cross(&f, Eye::Left, t, 0.0);
    close_for(r.point.y.0, -12.590307, 1e-6, "right height");
    close_for(l.point.y.0, -12.590307, 1e-6, "left height");
    let v = vertical_imbalance(r.point.y, Dioptres(1.0), l.point.y, Dioptres(3.0)).unwrap();
    close_for(v.right.0, 1.259031, 1e-6, "right prism");
    close_for(v.left.0, 3.777092, 1e-6, "left prism");
    close_for(v.difference.0, -2.518061, 1e-6, "imbalance");
    // Below a minus lens the base is down; nasal of a plus lens it is out.
    assert!(vertical_prism(Millimetres(-5.0), Dioptres(-2.0)).unwrap().0 < 0.0);
    close_for(
        horizontal_prism(Millimetres(5.0), Dioptres(2.0)).unwrap().0,
        -1.0,
        1e-12,
        "base out",
    );
    assert!(prentice(Millimetres(f64::NAN), Dioptres(1.0)).is_err());
}

#[test]
fn wrap_keeps_the_fitting_point_and_mirrors_the_eyes() {
    let f = fitting(8.0, 15.0);
    let far = task(1000.0, TaskVertical::GazeAngle(Degrees(0.0)), 0.0);
    for eye in [Eye::Right, Eye::Left] {
        let k = cross(&f, eye, far, 0.0);
        close_for(k.point.x.0, 0.0, 1e-3, "far task at the fitting point");
        close_for(k.point.y.0, 0.0, 1e-9, "far task level");
    }
    // A task to the right: the right eye turns to its temple, the left to its nose.
    let right_side = task(0.6, TaskVertical::GazeAngle(Degrees(-10.0)), 0.2);
    assert!(cross(&f, Eye::Right, right_side, 0.0).point.x.0 < 0.0);
    assert!(cross(&f, Eye::Left, right_side, 0.0).point.x.0 > 0.0);
    let near = task(0.4, TaskVertical::GazeAngle(Degrees(-20.0)), 0.0);
    let (r, l) = (
        cross(&f, Eye::Right, near, 0.0),
        cross(&f, Eye::Left, near, 0.0),
    );
    close_for(r.point.x.0, l.point.x.0, 1e-9, "symmetric x");
    close_for(r.point.y.0, l.point.y.0, 1e-9, "symmetric y");
}

#[test]
fn fields_and_head_turns() {
    // 2 atan(W / 2d): a 0.60 m monitor at 0.627 m from the CoR spans
    // 2 atan(0.3 / 0.627) = 51.139330 degrees; a 5 mm corridor at 27 mm
    // spans 2 atan(2.5 / 27) = 10.580162 degrees; the head turns
    // (51.139330 - 10.580162) / 2 = 20.279584 degrees each way.
    let task_angle = subtended_angle(Millimetres(600.0), Millimetres(627.0)).unwrap();
    let zone_angle = subtended_angle(Millimetres(5.0), Millimetres(27.0)).unwrap();
    close_for(task_angle.0, 51.139330, 1e-6, "task angle");
    close_for(zone_angle.0, 10.580162, 1e-6, "zone angle");
    close_for(
        head_turn_per_side(task_angle, zone_angle).0,
        20.279584,
        1e-6,
        "head turn",
    );
    assert_eq!(head_turn_per_side(zone_angle, task_angle), Degrees(0.0));
    assert!(subtended_angle(Millimetres(5.0), Millimetres(0.0)).is_err());
}

#[test]
fn bad_fittings_and_tasks_are_refused() {
    let mut p = *fitting(0.0, 0.0).params();
    p.pd_left = Millimetres(60.0);
    assert!(matches!(Fitting::new(p), Err(LensError::OutOfRange { .. })));
    p.pd_left = Millimetres(f64::NAN);
    assert!(matches!(Fitting::new(p), Err(LensError::NotFinite { .. })));
    let f = fitting(0.0, 0.0);
    let wide = task(0.5, TaskVertical::GazeAngle(Degrees(0.0)), 0.6);
    assert!(matches!(
        f.locate(&wide),
        Err(LensError::TaskUnreachable { .. })
    ));
    let high = task(0.5, TaskVertical::Height(Metres(0.6)), 0.0);
    assert!(matches!(
        f.locate(&high),
        Err(LensError::TaskUnreachable { .. })
    ));
    assert!(ComfortRange::new(Degrees(0.0), Degrees(-10.0)).is_err());
}

fn progressive() -> LensDesign {
    LensDesign::Progressive(
        Progressive::new(Dioptres(2.0), Millimetres(18.0), Millimetres(0.0)).unwrap(),
    )
}

fn posture(
    design: &LensDesign,
    t: TaskPosition,
    wanted: f64,
    comfort: ComfortRange,
) -> PostureOutcome {
    let f = fitting(0.0, 0.0);
    let point = f.locate(&t).unwrap();
    f.posture_for(design, &point, Dioptres(wanted), Dioptres(0.25), comfort)
        .unwrap()
}

#[test]
fn high_monitor_forces_the_chin_up() {
    // +1.00 +/- 0.25 D lies from -8.713 to -11.287 mm on this corridor (see
    // the lens tests). A monitor at eye level is seen at y = -27 tan(p) with
    // the chin up by p (no tilt), so the band's top needs
    // p = atan(8.713110 / 27) = 17.885 degrees.
    let monitor = task(0.65, TaskVertical::GazeAngle(Degrees(0.0)), 0.0);
    match posture(&progressive(), monitor, 1.0, ComfortRange::default()) {
        PostureOutcome::Found(p) => {
            close_for(p.head_pitch.0, 17.885294, 1e-6, "head pitch");
            close_for(p.right.point.y.0, -8.713110, 1e-6, "crossing");
            assert_eq!(p.zone, Zone::Progression);
        }
        other => panic!("expected a posture, got {other:?}"),
    }
}

#[test]
fn reading_low_needs_no_head_tilt() {
    // +1.75 D is reached at y = -2 - 16 acos(-0.75)/pi = -14.319 mm; reading
    // 30 degrees down crosses at -27 tan 30 = -15.588 mm, inside the band.
    let book = task(0.4, TaskVertical::GazeAngle(Degrees(-30.0)), 0.0);
    match posture(&progressive(), book, 2.0, ComfortRange::default()) {
        PostureOutcome::Found(p) => {
            assert_eq!(p.head_pitch, Degrees(0.0));
            assert_eq!(p.zone, Zone::Near);
        }
        other => panic!("expected an upright posture, got {other:?}"),
    }
    assert_eq!(
        posture(&progressive(), book, 3.0, ComfortRange::default()),
        PostureOutcome::AdditionNotOnLens
    );
    // The band starts 27.94 degrees down (atan(14.319 / 27)): with the eyes
    // limited to 10 degrees down no head pitch helps.
    let narrow = ComfortRange::new(Degrees(-10.0), Degrees(0.0)).unwrap();
    assert_eq!(
        posture(&progressive(), book, 2.0, narrow),
        PostureOutcome::NoComfortablePosture
    );
}

#[test]
fn a_task_far_to_the_side_misses_the_segment() {
    // 0.3 m to the right at 0.4 m: the eyes turn about 32 and 38 degrees, so
    // the crossings lie some 17 to 21 mm from centre, beyond the 28 mm segment.
    let bifocal = LensDesign::Bifocal(
        Bifocal::new(
            Dioptres(2.0),
            Millimetres(-4.0),
            SegmentShape::STRAIGHT_TOP_28,
        )
        .unwrap(),
    );
    let side = task(0.4, TaskVertical::GazeAngle(Degrees(-30.0)), 0.3);
    assert!(matches!(
        posture(&bifocal, side, 2.0, ComfortRange::default()),
        PostureOutcome::OutsideZoneSideways(_)
    ));
    let front = task(0.4, TaskVertical::GazeAngle(Degrees(-30.0)), 0.0);
    assert!(matches!(
        posture(&bifocal, front, 2.0, ComfortRange::default()),
        PostureOutcome::Found(_)
    ));
}

use proptest::prelude::*;

fn any_fitting() -> impl Strategy<Value = Fitting> {
    (
        20.0..45.0f64,
        20.0..45.0f64,
        0.0..25.0f64,
        -5.0..25.0f64,
        0.0..30.0f64,
    )
        .prop_map(|(r, l, v, tilt, wrap)| {
            Fitting::new(FittingParams {
                pd_right: Millimetres(r),
                pd_left: Millimetres(l),
                vertex: Millimetres(v),
                cor_behind_cornea: Millimetres(COR_BEHIND_CORNEA_MM),
                pantoscopic_tilt: Degrees(tilt),
                face_form: Degrees(wrap),
                extent: VerticalExtent::from_frame(Millimetres(20.0), Millimetres(36.0)).unwrap(),
            })
            .unwrap()
        })
}

fn any_task() -> impl Strategy<Value = TaskPosition> {
    (-1.0..3.0f64, -80.0..80.0f64, -0.99..0.99f64).prop_map(|(log_d, angle, share)| {
        let d = 10f64.powf(log_d);
        task(d, TaskVertical::GazeAngle(Degrees(angle)), share * d)
    })
}

fn finite_crossing(k: &LensCrossing) -> bool {
    [
        k.point.x.0,
        k.point.y.0,
        k.cor_to_lens.0,
        k.elevation.0,
        k.azimuth_nasal.0,
    ]
    .iter()
    .all(|v| v.is_finite())
}

proptest! {
    #[test]
    fn crossings_are_finite_or_absent(
        f in any_fitting(), t in any_task(), pitch in -45.0..45.0f64
    ) {
        if let Ok(point) = f.locate(&t) {
            for eye in [Eye::Right, Eye::Left] {
                if let Some(k) = f.crossing(eye, &point, Degrees(pitch)) {
                    prop_assert!(finite_crossing(&k), "{k:?}");
                    prop_assert!(k.cor_to_lens.0 > 0.0);
                }
            }
        }
    }

    #[test]
    fn postures_are_finite_and_within_limits(
        f in any_fitting(), t in any_task(), wanted in 0.0..2.5f64
    ) {
        if let Ok(point) = f.locate(&t) {
            let outcome = f
                .posture_for(&progressive(), &point, Dioptres(wanted), Dioptres(0.25), ComfortRange::default())
                .unwrap();
            if let PostureOutcome::Found(p) | PostureOutcome::OutsideZoneSideways(p) = outcome {
                prop_assert!(p.head_pitch.0.abs() <= HEAD_PITCH_LIMIT_DEG);
                prop_assert!(finite_crossing(&p.right) && finite_crossing(&p.left));
                prop_assert!(p.right_addition.0.is_finite() && p.left_addition.0.is_finite());
                let comfort = ComfortRange::default();
                for k in [p.right, p.left] {
                    prop_assert!(k.elevation.0 >= comfort.lowest().0 - 1e-6);
                    prop_assert!(k.elevation.0 <= comfort.highest().0 + 1e-6);
                }
            }
        }
    }
}

#[test]
fn a_task_beyond_the_lens_edge_costs_a_head_turn() {
    // On the lens nothing changes; beyond it the head turns by the angle
    // between the eye's line of sight and the edge, both seen from the centre
    // of rotation (tan rule, worked by hand): atan(48.5 / 27) - atan(22 / 27)
    // = 60.896° - 39.174° = 21.722°.
    let check = |x: f64, expected_x: f64, expected_turn: f64| {
        let (used, turn) = keep_on_lens(Millimetres(x), Millimetres(27.0), Millimetres(22.0));
        assert!((used.0 - expected_x).abs() < 1e-9, "x {x}: {used:?}");
        assert!((turn.0 - expected_turn).abs() < 1e-3, "x {x}: {turn:?}");
    };
    check(10.0, 10.0, 0.0);
    check(-22.0, -22.0, 0.0);
    check(48.5, 22.0, 21.722);
    check(-48.5, -22.0, 21.722);
}
