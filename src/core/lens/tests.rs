//! Checks of the lens families: values worked by hand from each family's
//! documented model, errors for bad parameters, the catalogue's grids, and
//! property tests over random valid designs.

use super::*;
use crate::core::units::{Dioptres, Millimetres};
use proptest::prelude::*;

const TOL: f64 = 1e-4;

fn progressive(add: f64, length: f64, inset: f64) -> LensDesign {
    LensDesign::Progressive(
        Progressive::new(Dioptres(add), Millimetres(length), Millimetres(inset)).unwrap(),
    )
}

fn degressive(near: f64, degression: f64) -> LensDesign {
    LensDesign::Degressive(Degressive::new(Dioptres(near), Dioptres(degression)).unwrap())
}

fn extent() -> VerticalExtent {
    // Fitting height 22 mm in a 40 mm deep lens: bottom -22 mm, top +18 mm.
    VerticalExtent::from_frame(Millimetres(22.0), Millimetres(40.0)).unwrap()
}

/// Checks the addition and zone of `design` at (x, y) against the expected values.
fn check(design: &LensDesign, x: f64, y: f64, addition: f64, zone: Zone) {
    let s = design.evaluate(LensPoint::new(x, y));
    assert!(
        (s.addition.0 - addition).abs() < TOL,
        "{:?} at ({x}, {y}): addition {} expected {addition}",
        design.family(),
        s.addition.0
    );
    assert_eq!(s.zone, zone, "{:?} at ({x}, {y})", design.family());
}

#[test]
fn progressive_profile_matches_hand_working() {
    // Raised-cosine ramp from -2 mm to -18 mm (length 16 mm), +2.00 D.
    // At -6 mm: t = 4/16 = 0.25, p = (1 - cos(pi/4))/2 = 0.146447, add = 0.292893 D.
    // At -10 mm: t = 0.5, p = 0.5, add = 1.00 D.
    let d = progressive(2.0, 18.0, 2.5);
    check(&d, 0.0, 5.0, 0.0, Zone::Distance);
    check(&d, 0.0, -2.0, 0.0, Zone::Distance);
    check(&d, 0.0, -6.0, 0.292893, Zone::Progression);
    check(&d, 1.0, -10.0, 1.0, Zone::Progression);
    check(&d, 0.0, -18.0, 2.0, Zone::Near);
    check(&d, -9.0, -25.0, 2.0, Zone::Near);
    // Peak gradient pi/2 x 2.00 D / 16 mm = 0.196350 D/mm (downward growth, so negative).
    let g = d.ramp().unwrap().peak_gradient();
    assert!((g.0 + 0.196350).abs() < 1e-6, "{g:?}");
    // The corridor reaches half its 2.5 mm inset half-way down the ramp.
    assert!((d.corridor_x(Millimetres(-10.0)).unwrap().0 - 1.25).abs() < 1e-12);
}

#[test]
fn degressive_profile_matches_hand_working() {
    // Near +1.75 D at -14 mm, degression 1.00 D over 20 mm (to +6 mm).
    // At -4 mm: t = (6 - (-4))/20 = 0.5, p = 0.5, add = 0.75 + 1.00 x 0.5 = 1.25 D.
    // At +1 mm: t = 0.25, p = 0.146447, add = 0.75 + 0.146447 = 0.896447 D.
    let d = degressive(1.75, 1.0);
    check(&d, 0.0, -20.0, 1.75, Zone::Near);
    check(&d, 0.0, -14.0, 1.75, Zone::Near);
    check(&d, 0.0, -4.0, 1.25, Zone::Progression);
    check(&d, 0.0, 1.0, 0.896447, Zone::Progression);
    check(&d, 0.0, 6.0, 0.75, Zone::Intermediate);
    check(&d, 0.0, 15.0, 0.75, Zone::Intermediate);
}

#[test]
fn segment_families_follow_their_outlines() {
    // The 28 mm outline: disc of radius 14 mm, centre 5 mm inside the
    // straight edge, 2 mm nasal inset (see SegmentShape::STRAIGHT_TOP_28).
    let shape = SegmentShape::STRAIGHT_TOP_28;
    let bifocal =
        LensDesign::Bifocal(Bifocal::new(Dioptres(2.5), Millimetres(-4.0), shape).unwrap());
    check(&bifocal, 2.0, -4.5, 2.5, Zone::Near);
    check(&bifocal, 2.0, -3.9, 0.0, Zone::Distance);
    check(&bifocal, 15.5, -9.0, 2.5, Zone::Near);
    check(&bifocal, 16.5, -9.0, 0.0, Zone::Distance);
    check(&bifocal, 2.0, -23.5, 0.0, Zone::Distance);

    let trifocal = LensDesign::Trifocal(
        Trifocal::new(
            Dioptres(2.0),
            0.5,
            Millimetres(-2.0),
            Millimetres(7.0),
            shape,
        )
        .unwrap(),
    );
    check(&trifocal, 2.0, 0.0, 0.0, Zone::Distance);
    check(&trifocal, 2.0, -5.0, 1.0, Zone::Intermediate);
    check(&trifocal, 2.0, -10.0, 2.0, Zone::Near);

    let double = LensDesign::DoubleSegment(
        DoubleSegment::new(Dioptres(1.5), Millimetres(-5.0), Millimetres(10.0), shape).unwrap(),
    );
    check(&double, 2.0, 12.0, 1.5, Zone::UpperSegment);
    check(&double, 2.0, 0.0, 0.0, Zone::Distance);
    check(&double, 2.0, -6.0, 1.5, Zone::Near);

    let sv = LensDesign::SingleVision(SingleVision::new(Dioptres(1.25)).unwrap());
    check(&sv, -30.0, 20.0, 1.25, Zone::SingleVision);
}

#[test]
fn bad_parameters_get_typed_errors() {
    let shape = SegmentShape::STRAIGHT_TOP_28;
    assert!(matches!(
        Degressive::new(Dioptres(1.0), Dioptres(1.5)),
        Err(LensError::DegressionExceedsAddition { .. })
    ));
    assert!(matches!(
        DoubleSegment::new(Dioptres(1.5), Millimetres(5.0), Millimetres(4.0), shape),
        Err(LensError::SegmentsOverlap { .. })
    ));
    assert!(matches!(
        Progressive::new(Dioptres(f64::NAN), Millimetres(18.0), Millimetres(2.5)),
        Err(LensError::NotFinite { .. })
    ));
    assert!(matches!(
        Progressive::new(Dioptres(2.0), Millimetres(8.0), Millimetres(2.5)),
        Err(LensError::OutOfRange { .. })
    ));
    assert!(matches!(
        VerticalExtent::from_frame(Millimetres(40.0), Millimetres(30.0)),
        Err(LensError::OutOfRange { .. })
    ));
    let open = FamilyChoice::Progressive {
        addition_d: Some(2.0),
        progression_length_mm: None,
    };
    assert_eq!(
        LensDesign::from_choice(&open),
        Err(LensError::MissingParameter {
            parameter: "progression length"
        })
    );
    let fixed = FamilyChoice::Progressive {
        addition_d: Some(2.0),
        progression_length_mm: Some(18.0),
    };
    assert_eq!(
        LensDesign::from_choice(&fixed),
        Ok(progressive(2.0, 18.0, 2.5))
    );
}

#[test]
fn candidates_cover_the_grids() {
    // Progressive with both open: 12 additions (0.75..3.50 by 0.25) x 10 lengths (11..20).
    let all = FamilyChoice::Progressive {
        addition_d: None,
        progression_length_mm: None,
    };
    assert_eq!(Candidates::new(&all).unwrap().count(), 120);
    // Degressive with both open: additions 0.75, 1.00, 1.25, 1.50 and 1.75 D allow
    // 2, 3, 4, 5 and 6 of the degressions 0.50..2.00 D; the 7 additions from
    // 2.00 D up allow all 7: 2 + 3 + 4 + 5 + 6 + 49 = 69 of 84 combinations.
    let deg = FamilyChoice::Degressive {
        near_addition_d: None,
        degression_d: None,
    };
    let c = Candidates::new(&deg).unwrap();
    assert_eq!(c.combinations(), 84);
    assert_eq!(c.count(), 69);
    let bad = FamilyChoice::Bifocal {
        addition_d: Some(9.0),
        segment_top_mm: None,
    };
    assert!(matches!(
        Candidates::new(&bad),
        Err(LensError::OutOfRange { .. })
    ));
    assert_eq!(ADDITION_GRID.len(), 12);
    assert_eq!(ADDITION_GRID.get(11), Some(3.5));
    assert_eq!(ADDITION_GRID.get(12), None);
}

#[test]
fn bands_invert_the_profile() {
    // +2.00 D over -2..-18 mm, wanted +1.00 +/- 0.25 D.
    // 0.75 D: p = 0.375, t = acos(0.25)/pi = 0.419569, y = -2 - 16 t = -8.713109 mm.
    // 1.25 D: p = 0.625, t = acos(-0.25)/pi = 0.580431, y = -2 - 16 t = -11.286891 mm.
    let d = progressive(2.0, 18.0, 2.5);
    let bands = d.bands_for_addition(Dioptres(1.0), Dioptres(0.25), extent());
    let b: Vec<_> = bands.iter().copied().collect();
    assert_eq!(b.len(), 1);
    assert!((b[0].top.0 + 8.713109).abs() < 1e-5, "{b:?}");
    assert!((b[0].bottom.0 + 11.286891).abs() < 1e-5, "{b:?}");
    assert_eq!(b[0].zone, Zone::Progression);
    // The full addition is found from the near reference point to the lens bottom.
    let near: Vec<_> = d
        .bands_for_addition(Dioptres(2.0), Dioptres(0.0), extent())
        .iter()
        .copied()
        .collect();
    assert_eq!(near.len(), 1);
    assert!((near[0].top.0 + 18.0).abs() < 1e-9 && (near[0].bottom.0 + 22.0).abs() < 1e-9);
    assert_eq!(near[0].zone, Zone::Near);
    // A double-segment lens gives its addition in two bands.
    let double = LensDesign::DoubleSegment(
        DoubleSegment::new(
            Dioptres(1.5),
            Millimetres(-5.0),
            Millimetres(10.0),
            SegmentShape::STRAIGHT_TOP_28,
        )
        .unwrap(),
    );
    assert_eq!(
        double
            .bands_for_addition(Dioptres(1.5), Dioptres(0.1), extent())
            .iter()
            .count(),
        2
    );
    assert!(d
        .bands_for_addition(Dioptres(3.0), Dioptres(0.25), extent())
        .is_empty());
    let p = d.corridor_point_for(Dioptres(1.0)).unwrap();
    assert!((p.y.0 + 10.0).abs() < 1e-9 && (p.x.0 - 1.25).abs() < 1e-9);
}

fn any_design() -> impl Strategy<Value = LensDesign> {
    let shape = SegmentShape::STRAIGHT_TOP_28;
    prop_oneof![
        (0.0..=4.0f64)
            .prop_map(|a| LensDesign::SingleVision(SingleVision::new(Dioptres(a)).unwrap())),
        (0.0..=4.0f64, -20.0..=5.0f64).prop_map(move |(a, t)| LensDesign::Bifocal(
            Bifocal::new(Dioptres(a), Millimetres(t), shape).unwrap()
        )),
        (0.0..=4.0f64, 0.3..=0.8f64, -20.0..=5.0f64, 4.0..=12.0f64).prop_map(
            move |(a, r, t, h)| LensDesign::Trifocal(
                Trifocal::new(Dioptres(a), r, Millimetres(t), Millimetres(h), shape).unwrap()
            )
        ),
        (0.0..=4.0f64, 10.0..=24.0f64, 0.0..=5.0f64).prop_map(|(a, l, i)| progressive(a, l, i)),
        (0.5..=4.0f64, 0.0..=1.0f64).prop_map(|(n, share)| {
            let degression = 0.5 + share * (n.min(2.5) - 0.5);
            degressive(n, degression)
        }),
        (0.0..=4.0f64, -20.0..=5.0f64, 0.0..=20.0f64).prop_map(move |(a, lo, gap)| {
            let up = (lo + 0.5 + gap).clamp(3.0, 25.0).max(lo + 0.5);
            LensDesign::DoubleSegment(
                DoubleSegment::new(Dioptres(a), Millimetres(lo), Millimetres(up), shape).unwrap(),
            )
        }),
    ]
}

fn corridor_design() -> impl Strategy<Value = LensDesign> {
    prop_oneof![
        (0.25..=4.0f64, 10.0..=24.0f64, 0.0..=5.0f64).prop_map(|(a, l, i)| progressive(a, l, i)),
        (0.5..=4.0f64, 0.0..=1.0f64)
            .prop_map(|(n, share)| degressive(n, 0.5 + share * (n.min(2.5) - 0.5))),
    ]
}

proptest! {
    #[test]
    fn addition_stays_within_zero_and_the_maximum(
        d in any_design(), x in -40.0..40.0f64, y in -40.0..40.0f64
    ) {
        let s = d.evaluate(LensPoint::new(x, y));
        prop_assert!(s.addition.0.is_finite());
        prop_assert!(s.addition.0 >= 0.0 && s.addition.0 <= d.max_addition().0 + 1e-12);
    }

    #[test]
    fn corridor_addition_never_falls_downwards(
        d in corridor_design(), y1 in -40.0..40.0f64, dy in 0.0..20.0f64
    ) {
        let upper = d.addition_at(LensPoint::new(0.0, y1 + dy)).0;
        let lower = d.addition_at(LensPoint::new(0.0, y1)).0;
        prop_assert!(lower >= upper - 1e-12, "{lower} below {upper}");
    }

    #[test]
    fn corridor_point_inverts_the_profile(d in corridor_design(), share in 0.0..=1.0f64) {
        let ramp = *d.ramp().unwrap();
        let (lo, hi) = ramp.value_range();
        let wanted = lo + share * (hi - lo);
        let p = d.corridor_point_for(Dioptres(wanted)).unwrap();
        prop_assert!((d.addition_at(p).0 - wanted).abs() < 1e-9);
        prop_assert!(p.y.0 <= ramp.top().0 && p.y.0 >= ramp.bottom().0);
    }

    #[test]
    fn heights_inside_the_ramp_round_trip(d in corridor_design(), t in 0.05..0.95f64) {
        let ramp = *d.ramp().unwrap();
        let y = ramp.top().0 - t * (ramp.top().0 - ramp.bottom().0);
        let back = ramp.height_for(ramp.value_at(Millimetres(y))).unwrap();
        prop_assert!((back.0 - y).abs() < 1e-6, "{y} came back as {}", back.0);
    }

    #[test]
    fn bands_deliver_the_wanted_addition(
        d in any_design(), wanted in 0.0..4.0f64, tol in 0.0..0.5f64, f in 0.0..=1.0f64
    ) {
        for band in d.bands_for_addition(Dioptres(wanted), Dioptres(tol), extent()).iter() {
            prop_assert!(band.bottom.0 <= band.top.0);
            let y = band.bottom.0 + f * (band.top.0 - band.bottom.0);
            // Segment bands hold on the segment's centre line; corridor bands on the corridor.
            let x = match d {
                LensDesign::Bifocal(b) => b.shape().inset().0,
                LensDesign::Trifocal(b) => b.shape().inset().0,
                LensDesign::DoubleSegment(b) => b.shape().inset().0,
                _ => d.corridor_x(Millimetres(y)).map_or(0.0, |m| m.0),
            };
            let add = d.addition_at(LensPoint::new(x, y)).0;
            // Segment edges are shared by two bands; step just inside at the ends.
            let inside = |yy: f64| d.addition_at(LensPoint::new(x, yy)).0;
            let ok = (add - wanted).abs() <= tol + 1e-9
                || (inside(y - 1e-6) - wanted).abs() <= tol + 1e-9
                || (inside(y + 1e-6) - wanted).abs() <= tol + 1e-9;
            prop_assert!(ok, "{:?}: {add} at y {y}, wanted {wanted} +/- {tol}", d.family());
        }
    }
}
