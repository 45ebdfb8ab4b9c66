//! Property tests of the planner on random (valid) wearers and tasks: no
//! NaN or infinity anywhere in a plan, and more addition never leaves a task
//! further short of plus (the signed power missing for comfort falls as the
//! addition rises, by the monotony of A = K - L'e in the local power).

mod plan_support;

use clearspan::plan::*;
use clearspan::scenario::*;
use plan_support::*;
use proptest::prelude::*;

/// JSON keys whose value may be null because the field is an `Option`.
const OPTIONAL_KEYS: [&str; 8] = [
    "share_of_amplitude",
    "zone_angle",
    "closest_option",
    "order",
    "addition",
    "degression",
    "near_pd",
    "vertex",
];

/// Serde writes a non-finite float as null; any null outside an optional
/// field is therefore a NaN or infinity that reached the output.
fn assert_no_hidden_null(v: &serde_json::Value, key: &str) {
    match v {
        serde_json::Value::Null => assert!(OPTIONAL_KEYS.contains(&key), "null (NaN?) at {key}"),
        serde_json::Value::Array(items) => items.iter().for_each(|i| assert_no_hidden_null(i, key)),
        serde_json::Value::Object(map) => map.iter().for_each(|(k, i)| assert_no_hidden_null(i, k)),
        _ => {}
    }
}

prop_compose! {
    fn any_wearer()(
        amp in 0.0..8.0f64, dof in 0.05..1.0f64, sphere in -12.0..10.0f64, aniso in -1.5..1.5f64,
        cyl in -3.0..0.0f64, vertex in 0.0..20.0f64, age in 5.0..95.0f64, measured in any::<bool>(),
        lux in 1.0..5000.0f64, detail in any::<bool>(), tilt in -5.0..20.0f64, fh in 12.0..28.0f64,
    ) -> Wearer {
        let mut w = wearer(amp, dof);
        w.right = Prescription { sphere_d: sphere, cylinder_d: cyl, axis_deg: 90.0 };
        w.left = Prescription { sphere_d: sphere + aniso, cylinder_d: 0.0, axis_deg: 0.0 };
        w.correction = Correction::Spectacles { vertex_mm: vertex };
        w.age_years = age;
        if !measured { w.measured_amplitude = None; }
        w.pupil = PupilSource::FromLighting { luminance_cd_m2: lux };
        if detail { w.blur_tolerance = BlurTolerance::FromDetail; }
        w.pantoscopic_tilt_deg = tilt;
        w.fitting_height_mm = fh;
        w
    }
}

prop_compose! {
    fn any_task()(
        d in 0.15..20.0f64, gaze in -60.0..40.0f64, side in -0.5..0.5f64, width in 0.0..1.5f64,
        detail in 0.05..20.0f64, hours in 0.0..3.0f64,
    ) -> Task {
        let mut t = task("task", d, gaze, hours);
        t.sideways_m = side * d * 0.9;
        t.width_m = width;
        t.detail_mm = detail;
        t
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(48))]

    #[test]
    fn plans_hold_no_nan(w in any_wearer(), tasks in proptest::collection::vec(any_task(), 0..6)) {
        let p = plan_of(w, tasks, all_families_open());
        let json = serde_json::to_value(&p).expect("serialisable");
        assert_no_hidden_null(&json, "plan");
        let text = text::render(&p);
        let bad = text
            .split(|c: char| c.is_whitespace() || c == '(' || c == ')' || c == ',')
            .any(|w| matches!(w, "NaN" | "inf" | "-inf" | "+inf"));
        prop_assert!(!bad, "{text}");
    }

    #[test]
    fn more_addition_never_leaves_a_task_further_short(
        w in any_wearer(), t in any_task(), add in 0.0..3.25f64,
    ) {
        let add = (add * 4.0).round() / 4.0;
        let short = |a: f64| {
            let p = plan_of(
                w.clone(),
                vec![t.clone()],
                vec![option("sv", FamilyChoice::SingleVision { addition_d: Some(a) })],
            );
            p.options[0].tasks[0].blur.short_of_comfort.0
        };
        let (less, more) = (short(add), short(add + 0.25));
        prop_assert!(more <= less + 1e-9, "add {add}: {less} then {more}");
    }
}
