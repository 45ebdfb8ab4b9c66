//! Tests of the migration: every shipped version's fixtures load, and every
//! kind of foreign or damaged document is refused with a message that says why.

use super::*;
use crate::library::format::{encode_entry, Entry, EntryId};
use crate::library::read::{read_document, read_entry};
use serde_json::json;
use std::path::PathBuf;

fn fixture(name: &str) -> String {
    let path = PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("tests/fixtures/saved")
        .join(name);
    std::fs::read_to_string(&path).unwrap_or_else(|e| panic!("fixture {}: {e}", path.display()))
}

/// Invariant: a fixture of every version ever shipped loads into the current
/// types. A new format version adds its fixtures and an entry to
/// `SHIPPED_VERSIONS`; this test then covers it without change.
#[test]
fn fixtures_of_every_shipped_version_load() {
    assert_eq!(SHIPPED_VERSIONS.last().copied(), Some(CURRENT_VERSION));
    for v in SHIPPED_VERSIONS {
        let entry = read_entry(&fixture(&format!("entry-v{v}.json")))
            .unwrap_or_else(|e| panic!("entry-v{v}.json: {e}"));
        assert!(
            !entry.scenario.tasks.is_empty(),
            "entry-v{v}.json holds tasks"
        );
        let doc = read_document(&fixture(&format!("export-v{v}.json")))
            .unwrap_or_else(|e| panic!("export-v{v}.json: {e}"));
        assert!(!doc.items.is_empty(), "export-v{v}.json holds scenarios");
        for item in &doc.items {
            let item = item
                .item
                .as_ref()
                .unwrap_or_else(|e| panic!("export-v{v}.json: {e:?}"));
            let valid = crate::scenario::validate(item.scenario.clone());
            assert!(valid.is_ok(), "export-v{v}.json: {valid:?}");
        }
    }
}

#[test]
fn version_1_fixture_keeps_its_values() {
    let entry = read_entry(&fixture("entry-v1.json")).expect("fixture loads");
    assert_eq!(
        (entry.revision, entry.created_ms, entry.changed_ms),
        (7, 1_767_225_600_000, 1_767_312_000_000)
    );
    assert_eq!(entry.scenario.name, "Fixture — fictional reader at a desk");
    assert_eq!(entry.scenario.tasks[1].distance_m, 4.0);
    assert_eq!(entry.scenario.options.len(), 3);
}

#[test]
fn version_1_safety_flag_becomes_the_impact_hazard() {
    // Version 1's one flag "needs safety eyewear" was worded as impact-rated
    // eyewear; version 2 names the hazard. Prism and settings take defaults.
    let v1: Value = serde_json::from_str(&fixture("export-v1.json")).expect("fixture is JSON");
    let flagged = |doc: &Value| -> Vec<bool> {
        doc["scenarios"][0]["scenario"]["tasks"]
            .as_array()
            .map(|ts| {
                ts.iter()
                    .map(|t| t["flags"]["needs_safety_eyewear"] == json!(true))
                    .collect()
            })
            .unwrap_or_default()
    };
    let doc = read_document(&fixture("export-v1.json")).expect("fixture loads");
    let item = doc.items[0].item.as_ref().expect("decodes");
    let impact: Vec<bool> = item
        .scenario
        .tasks
        .iter()
        .map(|t| t.flags.hazards.impact)
        .collect();
    assert_eq!(impact, flagged(&v1));
    assert_eq!(item.scenario.wearer.right.prism, Default::default());
    assert_eq!(item.scenario.settings, Default::default());
}

#[test]
fn version_2_fixture_keeps_its_prism_hazards_and_settings() {
    let entry = read_entry(&fixture("entry-v2.json")).expect("fixture loads");
    let s = &entry.scenario;
    assert_eq!(s.wearer.left.prism.vertical_pd, 1.5);
    assert_eq!(
        s.wearer.left.prism.vertical_base,
        crate::scenario::VerticalBase::Down
    );
    assert_eq!(s.settings.driving_acuity_decimal, 0.6);
    assert!(s.tasks.iter().any(|t| t.flags.hazards.dust));
    assert!(s.tasks.iter().any(|t| t.flags.moving_machinery));
}

#[test]
fn written_entries_read_back_unchanged() {
    let body = read_entry(&fixture("entry-v1.json")).expect("fixture loads");
    let entry = body
        .clone()
        .into_entry(EntryId::from_time_and_counter(1, 2));
    let text = encode_entry(&entry).expect("encodes");
    let again: Entry = read_entry(&text)
        .expect("reads back")
        .into_entry(entry.id.clone());
    assert_eq!(again, entry);
}

/// Runs the entry migration on `value` and checks the error and its message.
fn check_refused(value: Value, expected: FormatError, message_part: &str) {
    let err = migrate_entry(&value).expect_err("must be refused");
    assert_eq!(err, expected);
    let message = err.to_string();
    assert!(message.contains(message_part), "{message}");
}

#[test]
fn foreign_and_unreadable_envelopes_are_refused_with_reasons() {
    let entry = |format: Value, version: Value| json!({"format": format, "version": version});
    check_refused(
        json!([1, 2]),
        FormatError::NotAnObject { found: "a list" },
        "this is a list, not a clearspan",
    );
    check_refused(
        json!("text"),
        FormatError::NotAnObject { found: "a text" },
        "not a clearspan scenario document",
    );
    check_refused(
        json!({"name": "someone else's"}),
        FormatError::NoFormatTag,
        "not written by clearspan",
    );
    check_refused(
        entry(json!("spreadsheet"), json!(1)),
        FormatError::WrongFormat {
            found: "spreadsheet".into(),
            expected: &[ENTRY_FORMAT],
        },
        "format is \"spreadsheet\", but here only \"clearspan-scenario-entry\" can be read",
    );
    check_refused(
        entry(json!(EXPORT_FORMAT), json!(1)),
        FormatError::WrongFormat {
            found: EXPORT_FORMAT.into(),
            expected: &[ENTRY_FORMAT],
        },
        "only \"clearspan-scenario-entry\"",
    );
    check_refused(
        json!({"format": ENTRY_FORMAT}),
        FormatError::NoVersion,
        "no \"version\" field",
    );
    check_refused(
        entry(json!(ENTRY_FORMAT), json!("1")),
        FormatError::BadVersion {
            found: "\"1\"".into(),
        },
        "must be a whole number",
    );
    check_refused(
        entry(json!(ENTRY_FORMAT), json!(1.5)),
        FormatError::BadVersion {
            found: "1.5".into(),
        },
        "must be a whole number",
    );
    check_refused(
        entry(json!(ENTRY_FORMAT), json!(0)),
        FormatError::BadVersion { found: "0".into() },
        "must be a whole number",
    );
    check_refused(
        entry(json!(ENTRY_FORMAT), json!(3)),
        FormatError::FutureVersion { found: 3 },
        "written by a newer clearspan (format version 3); this one reads format versions up to 2",
    );
}

#[test]
fn entry_field_problems_name_their_paths() {
    let mut value: Value =
        serde_json::from_str(&fixture("entry-v1.json")).expect("fixture is JSON");
    value["revision"] = json!(-1);
    value["scenario"]["tasks"][1]["distance_m"] = json!("far");
    value["scenario"]["wearer"] = json!({});
    let Err(FormatError::Fields(errors)) = migrate_entry(&value) else {
        panic!("field problems expected")
    };
    let paths: Vec<&str> = errors.iter().map(|e| e.path.as_str()).collect();
    assert_eq!(
        paths,
        [
            "revision",
            "scenario.wearer",
            "scenario.tasks[1].distance_m"
        ]
    );
    assert!(
        errors[0].problem.to_string().contains("-1"),
        "{}",
        errors[0]
    );
    assert!(
        errors[1]
            .problem
            .to_string()
            .contains("missing field `age_years`"),
        "{}",
        errors[1]
    );
    assert!(
        errors[2]
            .problem
            .to_string()
            .contains("invalid type: string \"far\", expected f64"),
        "{}",
        errors[2]
    );
}

#[test]
fn one_broken_scenario_in_an_export_leaves_the_others_readable() {
    let mut value: Value =
        serde_json::from_str(&fixture("export-v1.json")).expect("fixture is JSON");
    value["scenarios"][0]["scenario"]["options"][0]["family"]["family"] = json!("monocle");
    value["scenarios"]
        .as_array_mut()
        .expect("a list")
        .push(json!(42));
    let doc = migrate_export(&value).expect("the envelope is fine");
    assert_eq!(doc.items.len(), 3);
    let first = doc.items[0].item.as_ref().expect_err("broken option");
    assert_eq!(
        first[0].path,
        "scenarios[0].scenario.options[0].family.family"
    );
    assert!(
        first[0]
            .problem
            .to_string()
            .contains("unknown variant `monocle`"),
        "{}",
        first[0]
    );
    assert_eq!(
        doc.items[0].name.as_deref(),
        Some("Fixture — fictional reader at a desk")
    );
    assert!(doc.items[1].item.is_ok());
    let third = doc.items[2].item.as_ref().expect_err("not an object");
    assert_eq!(
        third[0].to_string(),
        "scenarios[2]: must be an object holding a scenario, found a number"
    );
}

#[test]
fn export_envelope_problems_refuse_the_whole_file() {
    let cases = [
        (
            json!({"format": EXPORT_FORMAT, "version": 1}),
            "scenarios: is missing",
        ),
        (
            json!({"format": EXPORT_FORMAT, "version": 1, "scenarios": {}}),
            "scenarios: must be a list of scenarios, found an object",
        ),
        (
            json!({"format": EXPORT_FORMAT, "version": 1, "scenarios": [], "exported_ms": "x"}),
            "exported_ms: invalid type",
        ),
        (
            json!({"format": EXPORT_FORMAT, "version": 7, "scenarios": []}),
            "newer clearspan (format version 7)",
        ),
    ];
    for (value, expected) in cases {
        let message = migrate_export(&value).expect_err("refused").to_string();
        assert!(message.contains(expected), "{message}");
    }
}

#[test]
fn a_single_entry_reads_as_a_one_scenario_document() {
    let doc = read_document(&fixture("entry-v1.json")).expect("an entry is importable");
    assert_eq!(doc.items.len(), 1);
    let item = doc.items[0].item.as_ref().expect("decodes");
    assert_eq!(item.changed_ms, Some(1_767_312_000_000));
}
