//! A bare scenario: a file holding only the scenario object, without the
//! format envelope, as people write by hand for the command line. It is
//! decoded with the same field-path messages as an import, and its unknown
//! fields are listed; checking the values is left to
//! [`crate::scenario::validate`], as for every scenario.

use super::field_path::decode_at;
use super::unknown::{as_value, unknown_fields};
use crate::scenario::{FieldError, Scenario};
use serde_json::Value;

/// A bare scenario as decoded, before validation.
#[derive(Debug, Clone, PartialEq)]
pub struct BareScenario {
    /// The scenario.
    pub scenario: Scenario,
    /// Paths of the members clearspan does not read (for example
    /// `wearer.measured_amplitud`), in document order.
    pub unknown_fields: Vec<String>,
}

/// Decodes a parsed bare scenario; a member of the wrong type, or a missing
/// one, is named by its path (`tasks[0].distance_m`).
pub fn read_bare_scenario(value: &Value) -> Result<BareScenario, FieldError> {
    let scenario: Scenario = decode_at(value, "")?;
    let unknown_fields = unknown_fields(value, &as_value(&scenario), "");
    Ok(BareScenario {
        scenario,
        unknown_fields,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use serde_json::json;

    /// A bare file holds a scenario in the current shape: the newest fixture.
    const ENTRY_V2: &str = include_str!("../../tests/fixtures/saved/entry-v2.json");

    fn bare() -> Value {
        let entry: Value = serde_json::from_str(ENTRY_V2).expect("fixture is JSON");
        entry["scenario"].clone()
    }

    #[test]
    fn a_clean_bare_scenario_has_no_unknown_field() {
        let read = read_bare_scenario(&bare()).expect("decodes");
        assert_eq!(read.scenario.tasks.len(), 2);
        assert!(read.unknown_fields.is_empty());
    }

    #[test]
    fn current_glasses_and_the_screen_flag_are_known_fields() {
        let mut value = bare();
        value["current_glasses"] = json!({
            "label": "own varifocals",
            "family": {"family": "progressive", "addition_d": 1.5, "progression_length_mm": null}
        });
        value["tasks"][0]["flags"]["screen"] = json!(true);
        let read = read_bare_scenario(&value).expect("a known shape");
        assert!(read.unknown_fields.is_empty(), "{:?}", read.unknown_fields);
        assert!(read.scenario.current_glasses.is_some());
        assert!(read.scenario.tasks[0].flags.screen);
    }

    #[test]
    fn a_misspelt_member_is_listed_and_a_wrong_type_named() {
        let mut value = bare();
        value["wearer"]["measured_amplitud"] = json!({"dioptres": 2});
        value["tasks"][1]["flags"]["drivng"] = json!(true);
        let read = read_bare_scenario(&value).expect("decodes");
        assert_eq!(
            read.unknown_fields,
            ["tasks[1].flags.drivng", "wearer.measured_amplitud"]
        );
        value["tasks"][1]["distance_m"] = json!("far");
        let err = read_bare_scenario(&value).expect_err("wrong type");
        assert_eq!(
            err.to_string(),
            "tasks[1].distance_m: invalid type: string \"far\", expected f64"
        );
    }
}
