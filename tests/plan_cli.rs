//! The command line: plans every demo file in `scenarios/` (when present),
//! prints JSON with `--json`, and refuses bad files with a message naming
//! the field and the problem and a non-zero exit status.

use std::path::{Path, PathBuf};
use std::process::Command;

fn run(args: &[&str]) -> (bool, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_clearspan"))
        .args(args)
        .output()
        .expect("the binary runs");
    (
        out.status.success(),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

fn temp_file(name: &str, text: &str) -> PathBuf {
    let path =
        std::env::temp_dir().join(format!("clearspan-plan-cli-{}-{name}", std::process::id()));
    std::fs::write(&path, text).expect("temp file written");
    path
}

const BARE: &str = r#"{
  "name": "Fictional test reader",
  "wearer": {
    "age_years": 55, "measured_amplitude": null,
    "right": {"sphere_d": 0.5, "cylinder_d": 0.0, "axis_deg": 0},
    "left": {"sphere_d": 0.5, "cylinder_d": 0.0, "axis_deg": 0},
    "prescribed_addition_d": 1.75,
    "correction": {"kind": "spectacles", "vertex_mm": 12},
    "pd_right_mm": 32, "pd_left_mm": 32, "fitting_height_mm": 22, "lens_height_mm": 36,
    "pantoscopic_tilt_deg": 8,
    "pupil": {"kind": "measured", "diameter_mm": 3.5},
    "usable_fraction": 0.5,
    "blur_tolerance": {"kind": "clinical", "half_depth_d": 0.25}
  },
  "tasks": [{"name": "book", "distance_m": DISTANCE, "vertical": {"kind": "gaze_angle", "degrees": -25},
             "sideways_m": 0, "width_m": 0.2, "detail_mm": 0.5, "hours_per_day": 2,
             "flags": {"driving": false, "overhead": false}}],
  "options": [{"label": "reader", "family": {"family": "single_vision", "addition_d": null}}]
}"#;

#[test]
fn a_bare_scenario_plans_as_text_and_json() {
    let path = temp_file("ok.json", &BARE.replace("DISTANCE", "0.4"));
    let p = path.to_string_lossy().into_owned();
    let (ok, out, err) = run(&["plan", &p]);
    assert!(ok, "{err}");
    assert!(out.contains("Plan for \"Fictional test reader\"") && out.contains("reader"));
    let (ok, out, err) = run(&["plan", &p, "--json"]);
    assert!(ok, "{err}");
    let json: serde_json::Value = serde_json::from_str(&out).expect("valid JSON");
    assert_eq!(json[0]["options"][0]["option"]["label"], "reader");
    let _ = std::fs::remove_file(path);
}

#[test]
fn a_bad_file_names_the_field_and_fails() {
    let path = temp_file("bad.json", &BARE.replace("DISTANCE", "-3"));
    let (ok, _, err) = run(&["plan", &path.to_string_lossy()]);
    assert!(!ok);
    assert!(err.contains("tasks[0].distance_m"), "{err}");
    assert!(err.contains("outside the allowed range"), "{err}");
    let path2 = temp_file("broken.json", "{ not json");
    let (ok, _, err) = run(&["plan", &path2.to_string_lossy()]);
    assert!(!ok && err.contains("not valid JSON"), "{err}");
    let (ok, _, err) = run(&["plan"]);
    assert!(!ok && err.contains("usage"), "{err}");
    let _ = std::fs::remove_file(path);
    let _ = std::fs::remove_file(path2);
}

#[test]
fn every_demo_file_plans() {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("scenarios");
    let entries = std::fs::read_dir(&dir).expect("the demo folder scenarios/ exists");
    let mut planned = 0;
    for entry in entries.flatten() {
        let path = entry.path();
        if path.extension().is_some_and(|e| e == "json") {
            let (ok, out, err) = run(&["plan", &path.to_string_lossy()]);
            assert!(ok, "{}: {err}", path.display());
            assert!(out.contains("Cautions:"), "{}", path.display());
            planned += 1;
        }
    }
    assert!(planned >= 5, "only {planned} demo files planned");
}
