//! The command line: plans every demo file in `scenarios/` (when present),
//! prints JSON with `--json`, and refuses bad files with a message naming
//! the field and the problem and a non-zero exit status: unknown and
//! wrong-typed fields by their full path, oversized and endless input,
//! unknown options and files with nothing to plan. Names are written to the
//! terminal without their control characters.

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
    // Rule (issue 14, point 9): the message is a full sentence naming the
    // field, its range in readable units and the value the file gives.
    assert!(
        err.contains("Distance must be between 10 cm and 1,000 m. The file gives -3 m."),
        "{err}"
    );
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
    for (file, text) in demo_plans() {
        assert!(text.contains("Cautions:"), "{file}");
    }
}

/// `scenario` (JSON text) in a version-1 export envelope.
fn export_of(scenario: &str) -> String {
    format!(
        r#"{{"format": "clearspan-scenario-export", "version": 1, "scenarios": [{{"scenario": {scenario}}}]}}"#
    )
}

/// Runs `plan` on a temporary file holding `text`; returns (ok, stdout, stderr).
fn plan_text(name: &str, text: &str, extra: &[&str]) -> (bool, String, String) {
    let path = temp_file(name, text);
    let p = path.to_string_lossy().into_owned();
    let mut args = vec!["plan", p.as_str()];
    args.extend_from_slice(extra);
    let result = run(&args);
    let _ = std::fs::remove_file(path);
    result
}

fn good() -> String {
    BARE.replace("DISTANCE", "0.4")
}

#[test]
fn a_misspelt_field_is_refused_here_and_imported_with_a_warning() {
    let typo = good().replace(
        r#""measured_amplitude": null"#,
        r#""measured_amplitud": {"dioptres": 2.5, "method": "push_up", "plane": "spectacle"}"#,
    );
    let (ok, _, err) = plan_text("typo-bare.json", &typo, &[]);
    assert!(!ok);
    assert!(
        err.contains("wearer.measured_amplitud: clearspan does not know this field"),
        "{err}"
    );
    let file = export_of(&typo);
    let (ok, _, err) = plan_text("typo-export.json", &file, &[]);
    assert!(!ok);
    assert!(
        err.contains("scenarios[0].scenario.wearer.measured_amplitud"),
        "{err}"
    );
    // The browser's import takes the same file and says what it ignored.
    let batch = clearspan::library::parse_import(&file).expect("reads");
    assert_eq!(batch.accepted.len(), 1);
    assert_eq!(batch.accepted[0].scenario.wearer.measured_amplitude, None);
    assert_eq!(
        batch.unknown_fields,
        ["scenarios[0].scenario.wearer.measured_amplitud"]
    );
}

#[test]
fn a_field_of_the_wrong_type_is_named_by_its_own_path() {
    let (ok, _, err) = plan_text("type-bare.json", &BARE.replace("DISTANCE", "\"far\""), &[]);
    assert!(!ok);
    assert!(
        err.contains("tasks[0].distance_m: invalid type: string \"far\", expected f64"),
        "{err}"
    );
    let tagged = good().replace(r#""vertex_mm": 12"#, r#""vertex_mm": "12""#);
    let (ok, _, err) = plan_text("type-export.json", &export_of(&tagged), &[]);
    assert!(!ok);
    assert!(
        err.contains("scenarios[0].scenario.wearer.correction.vertex_mm: invalid type"),
        "{err}"
    );
}

#[test]
fn a_byte_order_mark_is_accepted() {
    let (ok, out, err) = plan_text("bom.json", &format!("\u{feff}{}", good()), &[]);
    assert!(ok, "{err}");
    assert!(out.contains("Plan for \"Fictional test reader\""), "{out}");
    let (ok, _, err) = plan_text(
        "bom-export.json",
        &format!("\u{feff}{}", export_of(&good())),
        &[],
    );
    assert!(ok, "{err}");
}

#[test]
fn oversized_and_endless_input_is_refused_without_reading_it_whole() {
    let big = format!("{}{}", good(), " ".repeat(2 * 1024 * 1024));
    let (ok, _, err) = plan_text("big.json", &big, &[]);
    assert!(!ok);
    assert!(
        err.contains("2.0 MiB, more than the 2 MiB allowed"),
        "{err}"
    );
    // A device that never ends: only the limit and one byte are read.
    if Path::new("/dev/zero").exists() {
        let (ok, _, err) = run(&["plan", "/dev/zero"]);
        assert!(!ok);
        assert!(err.contains("goes on past the 2 MiB allowed"), "{err}");
    }
}

#[test]
fn control_characters_in_names_are_shown_not_obeyed() {
    let named = good()
        .replace("Fictional test reader", r"Red\u001b[31m reader\nline two")
        .replace(r#""name": "book""#, r#""name": "bell\u0007book""#);
    let (ok, out, err) = plan_text("control.json", &named, &[]);
    assert!(ok, "{err}");
    assert!(
        out.contains("Plan for \"Red␛[31m reader␊line two\""),
        "{out}"
    );
    assert!(out.contains("bell␇book"), "{out}");
    assert!(!out.chars().any(|c| c.is_control() && c != '\n'), "{out:?}");
    // JSON keeps the names as written; JSON escapes them itself.
    let (ok, out, err) = plan_text("control-json.json", &named, &["--json"]);
    assert!(ok, "{err}");
    let json: serde_json::Value = serde_json::from_str(&out).expect("valid JSON");
    assert_eq!(json[0]["scenario_name"], "Red\u{1b}[31m reader\nline two");
    // Text quoted from the file in an error message is not obeyed either.
    let bad = good().replace("single_vision", r"single\u001b[2Jvision");
    let (ok, _, err) = plan_text("control-error.json", &bad, &[]);
    assert!(!ok);
    assert!(err.contains("single␛[2Jvision"), "{err}");
    assert!(!err.chars().any(|c| c.is_control() && c != '\n'), "{err:?}");
}

#[test]
fn unknown_options_are_refused_with_the_usage_line() {
    let (ok, _, err) = plan_text("option.json", &good(), &["--jsno"]);
    assert!(!ok);
    assert!(err.contains("unknown option \"--jsno\""), "{err}");
    assert!(
        err.contains("usage: clearspan plan FILE.json [--json]"),
        "{err}"
    );
    let (ok, _, err) = run(&["plan", "-j", "x.json"]);
    assert!(!ok && err.contains("unknown option \"-j\""), "{err}");
}

#[test]
fn an_export_without_scenarios_says_there_is_nothing_to_plan() {
    let empty = r#"{"format": "clearspan-scenario-export", "version": 1, "scenarios": []}"#;
    let (ok, out, err) = plan_text("empty.json", empty, &[]);
    assert!(!ok);
    assert!(out.is_empty(), "{out}");
    assert!(err.contains("the file holds no scenarios"), "{err}");
}

/// The plan text of every demo file, by file name.
fn demo_plans() -> Vec<(String, String)> {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("scenarios");
    let mut plans = Vec::new();
    for entry in std::fs::read_dir(&dir)
        .expect("scenarios/ is listable")
        .flatten()
    {
        let path = entry.path();
        if path.extension().is_some_and(|e| e == "json") {
            let (ok, out, err) = run(&["plan", &path.to_string_lossy()]);
            assert!(ok, "{}: {err}", path.display());
            plans.push((path.display().to_string(), out));
        }
    }
    assert!(plans.len() >= 5, "only {} demo files planned", plans.len());
    plans
}

/// Units a number may carry, written after it with a space.
const UNITS: [&str; 14] = [
    "D", "DS", "mm", "cm", "m", "in", "ft", "h", "years", "°", "Δ", "%", "cd/m²", "decimal",
];
/// Units written straight after the number.
const ATTACHED_UNITS: [char; 4] = ['°', '′', '%', 'Δ'];
/// Units of length.
const LENGTH_UNITS: [&str; 5] = ["mm", "cm", "m", "in", "ft"];

/// Words between numbers that share the unit written after the last of them
/// ("PD R 32.0 / L 31.5 mm", "1.2, -4.6 mm").
const SHARED_UNIT_LINKS: [&str; 3] = ["/", "R", "L"];

/// Cited sources and formulas whose numbers are no quantities: an author's
/// year, a standard's number, the coefficients of Hofstetter's line.
const CITATIONS: [&str; 4] = [
    "Watson & Yellott 2012",
    "ISO 11226",
    "Directive 2006/126/EC",
    "Hofstetter minimum, 15 - 0.25 x",
];

/// `token` without the brackets and punctuation around it.
fn bare(token: &str) -> &str {
    token
        .trim_start_matches('(')
        .trim_end_matches([',', ';', ':', ')', '.'])
}

/// The number `token` starts with, its sign kept, and what follows it in
/// the token; `None` when the token is no number.
fn number_in(token: &str) -> Option<(&str, &str)> {
    let digits_from = token
        .char_indices()
        .find(|(_, c)| !matches!(c, '+' | '-' | '±'))
        .map(|(i, _)| i)?;
    let rest = &token[digits_from..];
    if !rest.starts_with(|c: char| c.is_ascii_digit()) {
        return None;
    }
    let end = rest
        .char_indices()
        .find(|(_, c)| !(c.is_ascii_digit() || *c == '.' || *c == ','))
        .map_or(rest.len(), |(i, _)| i);
    let number = rest[..end].trim_end_matches(['.', ',']);
    Some((
        &token[..digits_from + number.len()],
        &token[digits_from + number.len()..],
    ))
}

/// Every number of `text` that breaks a wording rule, with the rule's name.
/// Text in straight quotes (names the user chose) is not checked.
fn wording_faults(text: &str) -> Vec<String> {
    let mut faults = Vec::new();
    for line in text.lines() {
        let mut checked: String = line.split('"').step_by(2).collect::<Vec<_>>().join(" ");
        for citation in CITATIONS {
            checked = checked.replace(citation, " ");
        }
        let tokens: Vec<&str> = checked.split_whitespace().map(bare).collect();
        let mut i = 0;
        while i < tokens.len() {
            let Some((number, attached)) = number_in(tokens[i]) else {
                i += 1;
                continue;
            };
            // Prescription notation (sphere / cylinder x axis) writes the
            // dioptres and the axis degrees unnamed (ISO 13666 vocabulary,
            // common practice on every prescription).
            let prescription = tokens.get(i + 1) == Some(&"/")
                && tokens.get(i + 2).and_then(|t| number_in(t)).is_some()
                && tokens.get(i + 3) == Some(&"x")
                && tokens.get(i + 4).and_then(|t| number_in(t)).is_some();
            if prescription {
                i += 5;
                continue;
            }
            let digits = number.trim_start_matches(['+', '-', '±']);
            let whole = digits.split('.').next().unwrap_or(digits);
            if whole.len() > 3 && !whole.contains(',') {
                faults.push(format!(
                    "large numbers carry thousands separators: {number} in {line:?}"
                ));
            }
            let unit = if attached.is_empty() {
                let mut j = i + 1;
                while j < tokens.len()
                    && (SHARED_UNIT_LINKS.contains(&tokens[j])
                        || number_in(tokens[j]).is_some_and(|(_, a)| a.is_empty()))
                {
                    j += 1;
                }
                tokens.get(j).copied().filter(|u| UNITS.contains(u))
            } else {
                attached.starts_with(ATTACHED_UNITS).then_some(attached)
            };
            match unit {
                None => faults.push(format!("every number carries a unit: {number} in {line:?}")),
                Some(u) if number.starts_with('+') && LENGTH_UNITS.contains(&u) => faults.push(
                    format!("lengths carry no plus sign: {number} {u} in {line:?}"),
                ),
                Some(_) => {}
            }
            i += 1;
        }
        for short in ["accomm.", "conv.", "nearPD", "(add "] {
            if line.contains(short) {
                faults.push(format!("words, not abbreviations: {short:?} in {line:?}"));
            }
        }
    }
    faults
}

#[test]
fn every_number_of_every_demo_plan_carries_a_unit_and_no_length_a_plus_sign() {
    // The wording rules of issue 14, point 9, over the whole command-line
    // plan of every demo: every number carries a unit, no length carries a
    // plus sign, large numbers carry thousands separators, and no column
    // is abbreviated ("accommodation", not "accomm.").
    for (file, text) in demo_plans() {
        let faults = wording_faults(&text);
        assert!(faults.is_empty(), "{file}:\n{}", faults.join("\n"));
    }
}

#[test]
fn the_wording_check_finds_what_it_looks_for() {
    // The checker itself, on lines that break each rule and lines that keep
    // them, so that a check passing over every demo means something.
    let check = |line: &str, broken: &[&str]| {
        let faults = wording_faults(line);
        assert_eq!(faults.len(), broken.len(), "{line}: {faults:?}");
        for (fault, rule) in faults.iter().zip(broken) {
            assert!(fault.starts_with(rule), "{fault}");
        }
    };
    check("near PD 60.9 mm, convergence 9.8 Δ, head turn 30°", &[]);
    check("R +0.75 / -0.25 x 180   L +0.50 DS", &[]);
    check("PD R 32.0 / L 31.5 mm; lens point 1.2, -4.6 mm", &[]);
    check("\"Degressive 1.50\" (degressive)", &[]);
    check("Pupil: 2.5 mm (Watson & Yellott 2012: 1,000 cd/m²)", &[]);
    check("near PD 60.9", &["every number carries a unit"]);
    check("lens point +1.2 mm", &["lengths carry no plus sign"]);
    check(
        "comfortable 48 cm to 1000 m",
        &["large numbers carry thousands separators"],
    );
    check("accomm. +0.50 D", &["words, not abbreviations"]);
}
