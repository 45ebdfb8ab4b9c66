//! Property tests that feed arbitrary JSON values, strings and bytes to the
//! import reader and the migration: they must never panic, and every
//! refusal must carry a non-empty message.

use super::bare::read_bare_scenario;
use super::migrate::{migrate_entry, migrate_export};
use super::read::read_entry;
use super::transfer::{parse_import, parse_import_bytes, ImportBatch};
use super::{ReadError, ENTRY_FORMAT, EXPORT_FORMAT};
use proptest::prelude::*;
use serde_json::{Map, Value};

/// Arbitrary JSON, biased towards clearspan's own field names and tags so
/// the migration gets past the envelope often.
fn json() -> impl Strategy<Value = Value> {
    let key = prop_oneof![
        Just("format".to_string()),
        Just("version".to_string()),
        Just("scenarios".to_string()),
        Just("scenario".to_string()),
        Just("tasks".to_string()),
        Just("name".to_string()),
        "[a-z_]{0,8}",
    ];
    let leaf = prop_oneof![
        Just(Value::Null),
        any::<bool>().prop_map(Value::Bool),
        any::<i64>().prop_map(Value::from),
        any::<f64>().prop_map(Value::from),
        Just(Value::from(ENTRY_FORMAT)),
        Just(Value::from(EXPORT_FORMAT)),
        Just(Value::from(1)),
        ".{0,12}".prop_map(Value::String),
    ];
    leaf.prop_recursive(6, 64, 6, move |inner| {
        prop_oneof![
            prop::collection::vec(inner.clone(), 0..6).prop_map(Value::Array),
            prop::collection::vec((key.clone(), inner), 0..6)
                .prop_map(|pairs| Value::Object(pairs.into_iter().collect::<Map<_, _>>())),
        ]
    })
}

fn check_outcome(result: Result<ImportBatch, ReadError>) {
    match result {
        Ok(batch) => {
            assert!(batch.unknown_fields.iter().all(|p| !p.is_empty()));
            for item in &batch.rejected {
                assert!(!item.problems.is_empty());
                for p in &item.problems {
                    assert!(
                        !p.path.is_empty() && !p.problem.to_string().is_empty(),
                        "{p:?}"
                    );
                }
            }
        }
        Err(e) => assert!(!e.to_string().is_empty()),
    }
}

proptest! {
    #[test]
    fn arbitrary_json_never_panics_and_refusals_explain(value in json()) {
        if let Err(e) = migrate_entry(&value) {
            prop_assert!(!e.to_string().is_empty());
        }
        if let Err(e) = migrate_export(&value) {
            prop_assert!(!e.to_string().is_empty());
        }
        match read_bare_scenario(&value) {
            Ok(bare) => prop_assert!(bare.unknown_fields.iter().all(|p| !p.is_empty())),
            Err(e) => prop_assert!(!e.path.is_empty() && !e.problem.to_string().is_empty()),
        }
        let text = value.to_string();
        check_outcome(parse_import(&text));
        if let Err(e) = read_entry(&text) {
            prop_assert!(!e.to_string().is_empty());
        }
    }

    #[test]
    fn arbitrary_text_never_panics(text in ".{0,200}") {
        check_outcome(parse_import(&text));
    }

    #[test]
    fn arbitrary_bytes_never_panic(bytes in prop::collection::vec(any::<u8>(), 0..200)) {
        check_outcome(parse_import_bytes(&bytes));
    }

    #[test]
    fn bracket_soup_never_panics(text in "[\\[\\]{}\":,0-9a ]{0,400}") {
        check_outcome(parse_import(&text));
    }
}
