//! Unknown fields: members of an input document that clearspan does not
//! read. serde passes over them in silence, so a misspelt
//! `measured_amplitud` would leave the amplitude unset without a word. The
//! input is compared with the decoded value written back by the same serde
//! model: every member of an input object that the written-back object
//! lacks is unknown. Internally tagged enums write their tag back, so they
//! need no special case.
//!
//! The comparison is with the current types, which is right while version 1
//! is the only version shipped; the fixtures of every shipped version are
//! checked to have no unknown fields, so a new version that renames a field
//! fails that test until its documents are compared with their own types.

use super::field_path::join;
use super::format::{encode_entry, encode_export, Entry, EntryId, ExportItem, ENTRY_FORMAT};
use serde::Serialize;
use serde_json::Value;

/// The longest part of an unknown member's name kept in its path, in characters.
const MAX_KEY_CHARS: usize = 40;

/// Every member of `input` (at `path` in its document) that `written_back`
/// lacks, as full paths (`tasks[2].flags.drivng`), in document order.
/// Objects are compared member by member and lists element by element;
/// anything else, or a `written_back` of another shape, is not looked into.
/// A member whose value is `null` says nothing, so it is not reported even
/// if unknown: that keeps fields the writer leaves out when empty
/// (`skip_serializing_if`) from being reported.
pub fn unknown_fields(input: &Value, written_back: &Value, path: &str) -> Vec<String> {
    let mut found = Vec::new();
    walk(input, written_back, path, &mut found);
    found
}

fn walk(input: &Value, written_back: &Value, path: &str, found: &mut Vec<String>) {
    match (input, written_back) {
        (Value::Object(input), Value::Object(back)) => {
            for (key, value) in input {
                match back.get(key) {
                    Some(back_value) => walk(value, back_value, &join(path, key), found),
                    None if value.is_null() => {}
                    None => found.push(join(path, &shown_key(key))),
                }
            }
        }
        (Value::Array(input), Value::Array(back)) => {
            for (i, (value, back_value)) in input.iter().zip(back).enumerate() {
                walk(value, back_value, &format!("{path}[{i}]"), found);
            }
        }
        _ => {}
    }
}

/// An unknown member's name as it appears in a path: as written when it is
/// made of letters, digits and `_` like every clearspan field, otherwise
/// quoted and escaped as a JSON string (so no control character or dot
/// reaches a message), and cut to [`MAX_KEY_CHARS`] characters.
fn shown_key(key: &str) -> String {
    let plain = !key.is_empty()
        && key.chars().count() <= MAX_KEY_CHARS
        && key.chars().all(|c| c.is_ascii_alphanumeric() || c == '_');
    if plain {
        return key.to_string();
    }
    let cut: String = key.chars().take(MAX_KEY_CHARS).collect();
    let more = if cut.len() < key.len() { "…" } else { "" };
    format!("{}{more}", Value::from(cut))
}

/// The unknown fields of an import `document` whose scenarios decoded to
/// `items`, in document order (`None` for a scenario that was not taken;
/// its fields are not looked into, it is refused anyway).
pub(super) fn in_document(document: &Value, items: &[Option<&ExportItem>]) -> Vec<String> {
    let current = in_current_shape(document);
    unknown_fields(&current, &written_back(document, items), "")
}

/// `document` with every scenario of an older format version rewritten in
/// the current shape by the migration, so that a field the old version had
/// and the current one renamed is not reported as unknown.
fn in_current_shape(document: &Value) -> Value {
    let mut doc = document.clone();
    if doc.get("version").and_then(Value::as_u64) != Some(1) {
        return doc;
    }
    let upgrade = |slot: &mut Value| *slot = super::migrate::upgrade_v1_scenario(slot);
    if let Some(scenario) = doc.get_mut("scenario") {
        upgrade(scenario);
    }
    let items = doc.get_mut("scenarios").and_then(Value::as_array_mut);
    for item in items.into_iter().flatten() {
        if let Some(scenario) = item.get_mut("scenario") {
            upgrade(scenario);
        }
    }
    doc
}

/// What this build would write for `document`: a stored entry's envelope
/// around its one scenario, or an export envelope around `items`. `null`
/// (which hides nothing) where a value cannot be written.
fn written_back(document: &Value, items: &[Option<&ExportItem>]) -> Value {
    if document.get("format").and_then(Value::as_str) == Some(ENTRY_FORMAT) {
        return match items {
            [Some(item)] => entry_written_back(item),
            _ => Value::Null,
        };
    }
    let mut back = parse(encode_export(&[], 0));
    if let Some(scenarios) = back.get_mut("scenarios") {
        *scenarios = items
            .iter()
            .map(|item| item.map_or(Value::Null, as_value))
            .collect();
    }
    back
}

/// A stored entry holding `item`; its id and revision are not compared.
fn entry_written_back(item: &ExportItem) -> Value {
    parse(encode_entry(&Entry {
        id: EntryId::from_time_and_counter(0, 0),
        revision: 0,
        created_ms: item.created_ms.unwrap_or_default(),
        changed_ms: item.changed_ms.unwrap_or_default(),
        note: item.note.clone(),
        scenario: item.scenario.clone(),
    }))
}

/// `value` written as JSON, or `null` if it cannot be.
pub(super) fn as_value<T: Serialize>(value: &T) -> Value {
    serde_json::to_value(value).unwrap_or(Value::Null)
}

fn parse(text: Result<String, serde_json::Error>) -> Value {
    text.ok()
        .and_then(|t| serde_json::from_str(&t).ok())
        .unwrap_or(Value::Null)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::library::{parse_import, DEMO_FILES, SHIPPED_VERSIONS};
    use serde_json::json;

    fn fixture(name: &str) -> String {
        let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR"))
            .join("tests/fixtures/saved")
            .join(name);
        std::fs::read_to_string(&path).unwrap_or_else(|e| panic!("{}: {e}", path.display()))
    }

    /// An export file holding the version-1 fixture's scenario, changed by `change`.
    fn export_with(change: impl FnOnce(&mut Value)) -> String {
        let mut value: Value = serde_json::from_str(&fixture("export-v1.json")).expect("JSON");
        change(&mut value);
        value.to_string()
    }

    fn unknown_in(text: &str) -> Vec<String> {
        parse_import(text).expect("reads").unknown_fields
    }

    #[test]
    fn every_shipped_fixture_and_demo_has_no_unknown_field() {
        for v in SHIPPED_VERSIONS {
            for name in [format!("entry-v{v}.json"), format!("export-v{v}.json")] {
                let batch = parse_import(&fixture(&name)).expect("fixture reads");
                assert!(!batch.accepted.is_empty(), "{name}");
                assert_eq!(batch.unknown_fields, Vec::<String>::new(), "{name}");
            }
        }
        for demo in DEMO_FILES {
            let batch = parse_import(demo.text).expect("demo reads");
            assert_eq!(
                batch.unknown_fields,
                Vec::<String>::new(),
                "{}",
                demo.file_name
            );
        }
    }

    #[test]
    fn misspelt_members_are_named_by_their_full_path() {
        let text = export_with(|v| {
            let wearer = &mut v["scenarios"][0]["scenario"]["wearer"];
            let amplitude = wearer["measured_amplitude"].take();
            wearer["measured_amplitud"] = if amplitude.is_null() {
                json!({"dioptres": 2, "method": "push_up", "plane": "spectacle"})
            } else {
                amplitude
            };
            v["scenarios"][1]["scenario"]["tasks"][0]["flags"]["drivng"] = json!(true);
            v["scenarios"][1]["notes"] = json!("typo of note");
            v["exported_at"] = json!(5);
        });
        assert_eq!(
            unknown_in(&text),
            [
                "exported_at",
                "scenarios[0].scenario.wearer.measured_amplitud",
                "scenarios[1].notes",
                "scenarios[1].scenario.tasks[0].flags.drivng",
            ]
        );
    }

    #[test]
    fn members_of_tagged_enums_are_checked_against_their_variant() {
        let text = export_with(|v| {
            let s = &mut v["scenarios"][0]["scenario"];
            s["wearer"]["correction"] = json!({"kind": "contact_lenses", "vertex_mm": 12});
            s["wearer"]["pupil"] =
                json!({"kind": "from_lighting", "luminance_cd_m2": 200, "luminance": 1});
            s["tasks"][0]["vertical"] = json!({"kind": "gaze_angle", "degrees": -20, "metres": 1});
            s["options"][0]["family"]["adition_d"] = json!(2);
        });
        assert_eq!(
            unknown_in(&text),
            [
                "scenarios[0].scenario.options[0].family.adition_d",
                "scenarios[0].scenario.tasks[0].vertical.metres",
                "scenarios[0].scenario.wearer.correction.vertex_mm",
                "scenarios[0].scenario.wearer.pupil.luminance",
            ]
        );
    }

    #[test]
    fn a_stored_entry_is_checked_with_its_envelope() {
        let mut value: Value = serde_json::from_str(&fixture("entry-v1.json")).expect("JSON");
        value["revison"] = json!(3);
        value["scenario"]["tasks"][0]["width"] = json!(0.3);
        assert_eq!(
            unknown_in(&value.to_string()),
            ["revison", "scenario.tasks[0].width"]
        );
    }

    #[test]
    fn rejected_scenarios_and_null_members_are_not_reported() {
        let text = export_with(|v| {
            v["scenarios"][0]["scenario"]["wearer"]["age_years"] = json!("old");
            v["scenarios"][0]["scenario"]["wearer"]["agee"] = json!(4);
            v["scenarios"][1]["created_ms"] = Value::Null;
            v["scenarios"][1]["scenario"]["wearer"]["retired"] = Value::Null;
        });
        let batch = parse_import(&text).expect("reads");
        assert_eq!(batch.rejected.len(), 1);
        assert_eq!(batch.unknown_fields, Vec::<String>::new());
    }

    #[test]
    fn odd_member_names_are_quoted_escaped_and_cut() {
        let input = json!({"a": {"b.c": 1, "\u{1b}[31m": 2, "x": 3, "é": 4}, "long": {"k": 0}});
        let back = json!({"a": {"x": 0}, "long": {}});
        let mut long = input.clone();
        long["long"]["y".repeat(50)] = json!(1);
        assert_eq!(
            unknown_fields(&input, &back, "top"),
            [
                "top.a.\"\\u001b[31m\"",
                "top.a.\"b.c\"",
                "top.a.\"é\"",
                "top.long.k",
            ]
        );
        let cut = unknown_fields(&long, &back, "");
        assert!(
            cut.contains(&format!("long.\"{}\"…", "y".repeat(MAX_KEY_CHARS))),
            "{cut:?}"
        );
    }

    #[test]
    fn lists_are_compared_element_by_element() {
        let input = json!([{"a": 1}, {"b": 2}, {"c": 3}]);
        let back = json!([{"a": 1}, {"a": 1}]);
        assert_eq!(unknown_fields(&input, &back, "tasks"), ["tasks[1].b"]);
        assert!(unknown_fields(&input, &json!("other shape"), "").is_empty());
    }
}
