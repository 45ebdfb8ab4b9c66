//! Field paths in the style every message uses
//! (`scenarios[0].scenario.tasks[2].distance_m`), and decoding that names the
//! wrong field itself rather than the object holding it. Inside plain structs
//! and lists serde can say where it failed (through `serde_path_to_error`);
//! inside an internally tagged enum (`#[serde(tag = "kind")]`) it cannot,
//! because serde buffers the whole object to find the tag before decoding the
//! variant. There the member at fault is found by trying the object without
//! each of its members in turn.

use crate::scenario::{FieldError, Problem};
use serde::de::DeserializeOwned;
use serde_json::Value;
use serde_path_to_error::Segment;

/// The path of member `field` of the object at `path` (`field` at the top).
pub fn join(path: &str, field: &str) -> String {
    if path.is_empty() {
        field.to_string()
    } else {
        format!("{path}.{field}")
    }
}

/// A problem with the value at `path` that kept it from being read; the
/// document itself is named when `path` is empty.
pub fn problem(path: &str, message: String) -> FieldError {
    FieldError {
        path: if path.is_empty() {
            "(document)".to_string()
        } else {
            path.to_string()
        },
        problem: Problem::Unreadable(message),
    }
}

/// Decodes `value`, found at `path` in its document, as a `T`. When it does
/// not decode, the problem is addressed by the path of the innermost value
/// at fault (for example `wearer.correction.vertex_mm`, not `wearer`).
pub fn decode_at<T: DeserializeOwned>(value: &Value, path: &str) -> Result<T, FieldError> {
    let failure = match attempt::<T>(value) {
        Ok(decoded) => return Ok(decoded),
        Err(failure) => failure,
    };
    let mut full = path.to_string();
    for step in &failure.steps {
        full = match step {
            Step::Key(key) => join(&full, key),
            Step::Index(i) => format!("{full}[{i}]"),
        };
    }
    if let Some(member) = member_at_fault::<T>(value, &failure) {
        full = join(&full, &member);
    }
    Err(problem(&full, failure.message))
}

/// One step down a JSON document: a member of an object or an element of a list.
#[derive(Debug, Clone, PartialEq)]
enum Step {
    Key(String),
    Index(usize),
}

/// A failed decoding: where serde stopped, from the decoded value, and what it said.
#[derive(Debug, Clone, PartialEq)]
struct Failure {
    steps: Vec<Step>,
    message: String,
}

/// Decodes `value` as a `T`, keeping only whether it worked when it did.
fn attempt<T: DeserializeOwned>(value: &Value) -> Result<T, Failure> {
    serde_path_to_error::deserialize(value).map_err(|e| Failure {
        steps: e
            .path()
            .iter()
            .filter_map(|segment| match segment {
                Segment::Seq { index } => Some(Step::Index(*index)),
                Segment::Map { key } | Segment::Enum { variant: key } => {
                    Some(Step::Key(key.clone()))
                }
                // Only a map with keys that are not text has such a segment;
                // JSON keys are always text.
                Segment::Unknown => None,
            })
            .collect(),
        message: e.inner().to_string(),
    })
}

/// Serde's words for a value that is present but wrong (as opposed to a
/// missing one), from the default messages of `serde::de::Error`.
const WRONG_VALUE: [&str; 3] = ["invalid type: ", "invalid value: ", "unknown variant "];

/// The member of the object where `failure` stopped that the failure is
/// about, when serde stopped at the object because it is an internally
/// tagged enum. Each member is left out in turn: leaving out a member that
/// is not at fault changes nothing, so at most two members change the
/// failure, the one at fault and the tag (without which nothing decodes).
/// Of two, the tag is the one whose absence fails alike whether or not the
/// other is there too. `None` when the object is not at fault through one
/// member, or the failure is about a member that is missing.
fn member_at_fault<T: DeserializeOwned>(root: &Value, failure: &Failure) -> Option<String> {
    if !WRONG_VALUE.iter().any(|w| failure.message.starts_with(w)) {
        return None;
    }
    let object = locate(root, &failure.steps)?.as_object()?;
    let without = |keys: &[&str]| -> Result<(), Failure> {
        let mut trial = root.clone();
        if let Some(Value::Object(o)) = locate_mut(&mut trial, &failure.steps) {
            for key in keys {
                o.remove(*key);
            }
        }
        attempt::<T>(&trial).map(drop)
    };
    let unchanged = Err(failure.clone());
    let changed: Vec<&str> = object
        .keys()
        .map(String::as_str)
        .filter(|key| without(&[key]) != unchanged)
        .collect();
    let at_fault = match changed.as_slice() {
        [only] => *only,
        [a, b] => {
            let both = without(&[a, b]);
            match (both == without(&[a]), both == without(&[b])) {
                (true, false) => *b,
                (false, true) => *a,
                _ => return None,
            }
        }
        _ => return None,
    };
    Some(at_fault.to_string())
}

/// The value reached from `root` by `steps`.
fn locate<'v>(root: &'v Value, steps: &[Step]) -> Option<&'v Value> {
    steps.iter().try_fold(root, |v, step| match step {
        Step::Key(key) => v.get(key),
        Step::Index(i) => v.get(i),
    })
}

/// The value reached from `root` by `steps`, to change it.
fn locate_mut<'v>(root: &'v mut Value, steps: &[Step]) -> Option<&'v mut Value> {
    steps.iter().try_fold(root, |v, step| match step {
        Step::Key(key) => v.get_mut(key),
        Step::Index(i) => v.get_mut(i),
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::scenario::{LensOption, Scenario, Task, Wearer};
    use serde_json::json;

    const ENTRY_V1: &str = include_str!("../../tests/fixtures/saved/entry-v1.json");

    /// The fixture's scenario as JSON, with `change` applied.
    fn scenario_with(change: impl FnOnce(&mut Value)) -> Value {
        let entry: Value = serde_json::from_str(ENTRY_V1).expect("fixture is JSON");
        let mut scenario = entry["scenario"].clone();
        change(&mut scenario);
        scenario
    }

    /// Decodes the changed fixture scenario at `prefix`; checks the path and
    /// a part of the message.
    fn check(change: impl FnOnce(&mut Value), prefix: &str, path: &str, message: &str) {
        let value = scenario_with(change);
        let err = decode_at::<Scenario>(&value, prefix).expect_err("must not decode");
        assert_eq!(err.path, path, "{err}");
        let text = err.problem.to_string();
        assert!(text.contains(message), "{text}");
    }

    #[test]
    fn the_fixture_decodes() {
        let value = scenario_with(|_| {});
        assert!(decode_at::<Scenario>(&value, "").is_ok());
    }

    #[test]
    fn a_wrong_type_in_a_plain_struct_names_the_field() {
        check(
            |s| s["wearer"]["age_years"] = json!("old"),
            "",
            "wearer.age_years",
            "invalid type: string \"old\", expected f64",
        );
        check(
            |s| s["tasks"][1]["flags"]["driving"] = json!(1),
            "scenarios[0].scenario",
            "scenarios[0].scenario.tasks[1].flags.driving",
            "expected a boolean",
        );
        check(
            |s| {
                s["wearer"]["measured_amplitude"] =
                    json!({"dioptres": 3, "method": "push_upp", "plane": "ocular"})
            },
            "",
            "wearer.measured_amplitude.method",
            "unknown variant `push_upp`",
        );
    }

    #[test]
    fn a_wrong_type_inside_a_tagged_enum_names_the_field() {
        check(
            |s| s["wearer"]["correction"] = json!({"kind": "spectacles", "vertex_mm": "12"}),
            "",
            "wearer.correction.vertex_mm",
            "invalid type: string \"12\", expected f64",
        );
        check(
            |s| s["wearer"]["pupil"] = json!({"kind": "measured", "diameter_mm": [3]}),
            "",
            "wearer.pupil.diameter_mm",
            "invalid type: sequence",
        );
        check(
            |s| s["tasks"][0]["vertical"] = json!({"degrees": true, "kind": "gaze_angle"}),
            "",
            "tasks[0].vertical.degrees",
            "invalid type: boolean `true`",
        );
        // An optional member: leaving it out decodes.
        check(
            |s| s["options"][0]["family"] = json!({"family": "progressive", "addition_d": "2"}),
            "",
            "options[0].family.addition_d",
            "invalid type: string \"2\"",
        );
    }

    #[test]
    fn an_unknown_tag_names_the_tag() {
        check(
            |s| s["options"][0]["family"] = json!({"family": "monocle", "addition_d": 2}),
            "",
            "options[0].family.family",
            "unknown variant `monocle`",
        );
        check(
            |s| s["wearer"]["blur_tolerance"] = json!({"kind": "strict"}),
            "",
            "wearer.blur_tolerance.kind",
            "unknown variant `strict`",
        );
    }

    #[test]
    fn a_missing_field_names_the_object_that_lacks_it() {
        check(
            |s| {
                s["wearer"]["correction"] = json!({"kind": "spectacles"});
            },
            "",
            "wearer.correction",
            "missing field `vertex_mm`",
        );
        check(
            |s| {
                let task = s["tasks"][0].as_object_mut().expect("an object");
                task.remove("distance_m");
            },
            "",
            "tasks[0]",
            "missing field `distance_m`",
        );
        check(
            |s| *s = json!({"name": "x"}),
            "",
            "(document)",
            "missing field `wearer`",
        );
    }

    #[test]
    fn parts_decode_with_their_own_prefix() {
        let wearer = json!({"age_years": 40});
        let err = decode_at::<Wearer>(&wearer, "scenario.wearer").expect_err("incomplete");
        assert_eq!(err.path, "scenario.wearer");
        let task = scenario_with(|_| {})["tasks"][0].clone();
        assert!(decode_at::<Task>(&task, "tasks[0]").is_ok());
        let option = json!({"label": 3, "family": {"family": "single_vision", "addition_d": null}});
        let err = decode_at::<LensOption>(&option, "options[2]").expect_err("label is a number");
        assert_eq!(err.path, "options[2].label");
    }

    #[test]
    fn paths_join_in_the_message_style() {
        assert_eq!(join("", "tasks"), "tasks");
        assert_eq!(
            join("scenarios[1].scenario", "name"),
            "scenarios[1].scenario.name"
        );
        assert_eq!(problem("", "x".into()).path, "(document)");
    }
}
