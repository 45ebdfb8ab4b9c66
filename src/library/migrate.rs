//! Migration: turns a parsed JSON value of any shipped format version into
//! the current types, or says precisely why it cannot (a foreign document, a
//! wrong format tag, a version from the future, a field of the wrong type).
//! Every field problem is addressed by its path in the document.
//!
//! Version 2 is the current version. Version 1 differs only inside the
//! scenario: it had no prescribed prism, no plan settings and one task flag
//! `needs_safety_eyewear` where version 2 names the hazards; its `driving`
//! flag meant "driving or moving machinery" and stays `driving`, the stricter
//! reading. [`upgrade_v1_scenario`] rewrites a version-1 scenario into the
//! version-2 shape before it is decoded, so every shipped version keeps loading.

use super::field_path::{decode_at, join, problem};
use super::format::{
    ExportItem, StoredEntry, CURRENT_VERSION, ENTRY_FORMAT, EXPORT_FORMAT, SHIPPED_VERSIONS,
};
use crate::scenario::{FieldError, LensOption, Scenario, Task, Wearer};
use serde::de::DeserializeOwned;
use serde::Deserialize;
use serde_json::{Map, Value};
use std::fmt;

/// Why a JSON document is not a readable clearspan document.
#[derive(Debug, Clone, PartialEq)]
pub enum FormatError {
    /// The document is JSON but not an object (an array, a number, ...).
    NotAnObject {
        /// What was found instead ("an array", "a number", ...).
        found: &'static str,
    },
    /// The object has no text `format` field: some other program's JSON.
    NoFormatTag,
    /// The `format` field names something this reader does not accept here.
    WrongFormat {
        /// The tag found (cut to 80 characters).
        found: String,
        /// The tags accepted here.
        expected: &'static [&'static str],
    },
    /// The `version` field is missing.
    NoVersion,
    /// The `version` field is not a whole number of at least 1.
    BadVersion {
        /// The value found, as JSON text (cut to 80 characters).
        found: String,
    },
    /// Written by a newer clearspan than this one.
    FutureVersion {
        /// The version found.
        found: u64,
    },
    /// A version number clearspan never shipped.
    UnknownVersion {
        /// The version found.
        found: u64,
    },
    /// The envelope is right but fields are missing or of the wrong type.
    Fields(Vec<FieldError>),
}

impl fmt::Display for FormatError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            FormatError::NotAnObject { found } => write!(
                f,
                "this is {found}, not a clearspan scenario document (which is a JSON object \
                 with \"format\" and \"version\" fields)"
            ),
            FormatError::NoFormatTag => f.write_str(
                "this JSON document has no \"format\" field, so it was not written by \
                 clearspan; choose a file exported from clearspan",
            ),
            FormatError::WrongFormat { found, expected } => write!(
                f,
                "this document's format is \"{found}\", but here only {} can be read",
                expected
                    .iter()
                    .map(|e| format!("\"{e}\""))
                    .collect::<Vec<_>>()
                    .join(" or ")
            ),
            FormatError::NoVersion => {
                f.write_str("the document has no \"version\" field, so it cannot be read safely")
            }
            FormatError::BadVersion { found } => write!(
                f,
                "the document's \"version\" is {found}, but it must be a whole number such as 1"
            ),
            FormatError::FutureVersion { found } => write!(
                f,
                "this was written by a newer clearspan (format version {found}); this one reads \
                 format versions up to {CURRENT_VERSION}. Open it with the newer clearspan; it is \
                 kept unchanged"
            ),
            FormatError::UnknownVersion { found } => write!(
                f,
                "format version {found} was never released by clearspan (known versions: {}); \
                 the document may have been edited by hand",
                SHIPPED_VERSIONS
                    .iter()
                    .map(u32::to_string)
                    .collect::<Vec<_>>()
                    .join(", ")
            ),
            FormatError::Fields(errors) => {
                let parts: Vec<String> = errors.iter().map(FieldError::to_string).collect();
                write!(f, "{}", parts.join("; "))
            }
        }
    }
}

impl std::error::Error for FormatError {}

/// One scenario found in a document, decoded or not.
#[derive(Debug, Clone, PartialEq)]
pub struct DocumentItem {
    /// Path of the item in the document (`scenarios[2]`, or empty for a single entry).
    pub path: String,
    /// The scenario's name, if the document had a readable one.
    pub name: Option<String>,
    /// The decoded item, or every field problem found, with full paths.
    pub item: Result<ExportItem, Vec<FieldError>>,
}

/// A readable document: the scenarios it holds, each decoded separately so
/// one broken scenario does not hide the others.
#[derive(Debug, Clone, PartialEq)]
pub struct ExportDocument {
    /// When the export was written, if the document says.
    pub exported_ms: Option<u64>,
    /// The scenarios, in document order.
    pub items: Vec<DocumentItem>,
}

/// Migrates one stored entry (its parsed JSON) to the current stored body.
pub fn migrate_entry(value: &Value) -> Result<StoredEntry, FormatError> {
    let (obj, _, version) = envelope(value, &[ENTRY_FORMAT])?;
    entry_body(obj, "", version).map_err(FormatError::Fields)
}

/// Migrates an export file, or a single stored entry, to the current export
/// types. The envelope must be right; each scenario is then decoded on its own.
pub fn migrate_export(value: &Value) -> Result<ExportDocument, FormatError> {
    let (obj, format, version) = envelope(value, &[EXPORT_FORMAT, ENTRY_FORMAT])?;
    if format == ENTRY_FORMAT {
        return Ok(ExportDocument {
            exported_ms: None,
            items: vec![DocumentItem {
                path: String::new(),
                name: scenario_name(obj),
                item: entry_body(obj, "", version).map(|e| ExportItem {
                    note: e.note,
                    created_ms: Some(e.created_ms),
                    changed_ms: Some(e.changed_ms),
                    scenario: e.scenario,
                }),
            }],
        });
    }
    export_body(obj, version)
}

/// Checks the format tag and version; returns the object, its tag and its
/// version, which is known to be a shipped one.
fn envelope<'v>(
    value: &'v Value,
    accepted: &'static [&'static str],
) -> Result<(&'v Map<String, Value>, &'static str, u64), FormatError> {
    let obj = value
        .as_object()
        .ok_or(FormatError::NotAnObject { found: kind(value) })?;
    let tag = obj
        .get("format")
        .and_then(Value::as_str)
        .ok_or(FormatError::NoFormatTag)?;
    let format = accepted
        .iter()
        .copied()
        .find(|a| *a == tag)
        .ok_or_else(|| FormatError::WrongFormat {
            found: tag.chars().take(80).collect(),
            expected: accepted,
        })?;
    let raw_version = obj.get("version").ok_or(FormatError::NoVersion)?;
    let version =
        raw_version
            .as_u64()
            .filter(|v| *v >= 1)
            .ok_or_else(|| FormatError::BadVersion {
                found: raw_version.to_string().chars().take(80).collect(),
            })?;
    if version > u64::from(CURRENT_VERSION) {
        return Err(FormatError::FutureVersion { found: version });
    }
    if !SHIPPED_VERSIONS.iter().any(|v| u64::from(*v) == version) {
        return Err(FormatError::UnknownVersion { found: version });
    }
    Ok((obj, format, version))
}

/// Decodes an entry body of a shipped `version` (the envelope fields are ignored).
fn entry_body(
    obj: &Map<String, Value>,
    path: &str,
    version: u64,
) -> Result<StoredEntry, Vec<FieldError>> {
    let mut errors = Vec::new();
    let revision = required::<u64>(obj, path, "revision", &mut errors);
    let created_ms = required::<u64>(obj, path, "created_ms", &mut errors);
    let changed_ms = required::<u64>(obj, path, "changed_ms", &mut errors);
    let note = optional::<String>(obj, path, "note", &mut errors);
    let scenario = scenario_field(obj, path, version, &mut errors);
    match (revision, created_ms, changed_ms, note, scenario) {
        (Some(revision), Some(created_ms), Some(changed_ms), Some(note), Some(scenario))
            if errors.is_empty() =>
        {
            Ok(StoredEntry {
                revision,
                created_ms,
                changed_ms,
                note: note.unwrap_or_default(),
                scenario,
            })
        }
        _ => Err(errors),
    }
}

/// Decodes an export file of a shipped `version`.
fn export_body(obj: &Map<String, Value>, version: u64) -> Result<ExportDocument, FormatError> {
    let mut errors = Vec::new();
    let exported_ms = optional::<u64>(obj, "", "exported_ms", &mut errors).flatten();
    let items = match obj.get("scenarios") {
        Some(Value::Array(items)) => items,
        Some(other) => {
            errors.push(problem(
                "scenarios",
                format!("must be a list of scenarios, found {}", kind(other)),
            ));
            return Err(FormatError::Fields(errors));
        }
        None => {
            errors.push(problem("scenarios", "is missing".to_string()));
            return Err(FormatError::Fields(errors));
        }
    };
    if !errors.is_empty() {
        return Err(FormatError::Fields(errors));
    }
    let items = items
        .iter()
        .enumerate()
        .map(|(i, v)| {
            let path = format!("scenarios[{i}]");
            let item = match v.as_object() {
                Some(o) => export_item(o, &path, version),
                None => Err(vec![problem(
                    &path,
                    format!("must be an object holding a scenario, found {}", kind(v)),
                )]),
            };
            DocumentItem {
                name: v.as_object().and_then(scenario_name),
                path,
                item,
            }
        })
        .collect();
    Ok(ExportDocument { exported_ms, items })
}

fn export_item(
    obj: &Map<String, Value>,
    path: &str,
    version: u64,
) -> Result<ExportItem, Vec<FieldError>> {
    let mut errors = Vec::new();
    let note = optional::<String>(obj, path, "note", &mut errors);
    let created_ms = optional::<u64>(obj, path, "created_ms", &mut errors);
    let changed_ms = optional::<u64>(obj, path, "changed_ms", &mut errors);
    let scenario = scenario_field(obj, path, version, &mut errors);
    match (note, created_ms, changed_ms, scenario) {
        (Some(note), Some(created_ms), Some(changed_ms), Some(scenario)) if errors.is_empty() => {
            Ok(ExportItem {
                note: note.unwrap_or_default(),
                created_ms,
                changed_ms,
                scenario,
            })
        }
        _ => Err(errors),
    }
}

/// The readable name of the scenario inside an item, for messages.
fn scenario_name(obj: &Map<String, Value>) -> Option<String> {
    obj.get("scenario")?
        .get("name")?
        .as_str()
        .map(|s| s.chars().take(crate::scenario::MAX_NAME_CHARS).collect())
}

/// Decodes the `scenario` field of `obj`. The scenario model decodes itself
/// as a whole; only when that fails are its parts decoded one by one to find
/// where the problem is, so a field added to the model can never be dropped
/// by this diagnosis.
fn scenario_field(
    obj: &Map<String, Value>,
    path: &str,
    version: u64,
    errors: &mut Vec<FieldError>,
) -> Option<Scenario> {
    let path = join(path, "scenario");
    let Some(stored) = obj.get("scenario") else {
        errors.push(problem(&path, "is missing".to_string()));
        return None;
    };
    let upgraded = (version == 1).then(|| upgrade_v1_scenario(stored));
    let value = upgraded.as_ref().unwrap_or(stored);
    match Scenario::deserialize(value) {
        Ok(s) => Some(s),
        Err(whole) => {
            let before = errors.len();
            match value.as_object() {
                Some(o) => {
                    required::<String>(o, &path, "name", errors);
                    required::<Wearer>(o, &path, "wearer", errors);
                    list::<Task>(o, &path, "tasks", errors);
                    list::<LensOption>(o, &path, "options", errors);
                }
                None => errors.push(problem(
                    &path,
                    format!(
                        "must be an object with name, wearer, tasks and options, found {}",
                        kind(value)
                    ),
                )),
            }
            if errors.len() == before {
                errors.push(problem(&path, whole.to_string()));
            }
            None
        }
    }
}

/// A version-1 scenario rewritten in the version-2 shape: each task's
/// `needs_safety_eyewear` flag (whose caution spoke of impact-rated eyewear)
/// becomes the impact hazard. Prism and plan settings take their defaults
/// (none, and the default limits). Anything unexpected is left for the
/// decoder to report.
pub fn upgrade_v1_scenario(scenario: &Value) -> Value {
    let mut out = scenario.clone();
    let tasks = out.get_mut("tasks").and_then(Value::as_array_mut);
    for task in tasks.into_iter().flatten() {
        let Some(flags) = task.get_mut("flags").and_then(Value::as_object_mut) else {
            continue;
        };
        if let Some(safety) = flags.remove("needs_safety_eyewear") {
            flags.insert(
                "hazards".to_string(),
                serde_json::json!({
                    "impact": safety,
                    "splash_or_aerosol": false,
                    "dust": false,
                    "optical_radiation": false
                }),
            );
        }
    }
    out
}

/// Decodes a required field, recording a problem if it is missing or wrong.
fn required<T: DeserializeOwned>(
    obj: &Map<String, Value>,
    path: &str,
    field: &str,
    errors: &mut Vec<FieldError>,
) -> Option<T> {
    let path = join(path, field);
    match obj.get(field) {
        Some(v) => decode(v, &path, errors),
        None => {
            errors.push(problem(&path, "is missing".to_string()));
            None
        }
    }
}

/// Decodes an optional field: `Some(None)` if absent or null, `None` if wrong.
fn optional<T: DeserializeOwned>(
    obj: &Map<String, Value>,
    path: &str,
    field: &str,
    errors: &mut Vec<FieldError>,
) -> Option<Option<T>> {
    match obj.get(field) {
        None | Some(Value::Null) => Some(None),
        Some(v) => decode(v, &join(path, field), errors).map(Some),
    }
}

/// Decodes each element of a list field, addressing problems by index.
fn list<T: DeserializeOwned>(
    obj: &Map<String, Value>,
    path: &str,
    field: &str,
    errors: &mut Vec<FieldError>,
) {
    let path = join(path, field);
    match obj.get(field) {
        Some(Value::Array(items)) => {
            for (i, v) in items.iter().enumerate() {
                decode::<T>(v, &format!("{path}[{i}]"), errors);
            }
        }
        Some(other) => errors.push(problem(
            &path,
            format!("must be a list, found {}", kind(other)),
        )),
        None => errors.push(problem(&path, "is missing".to_string())),
    }
}

/// Decodes `value`, found at `path`; a problem names the innermost field at fault.
fn decode<T: DeserializeOwned>(
    value: &Value,
    path: &str,
    errors: &mut Vec<FieldError>,
) -> Option<T> {
    match decode_at(value, path) {
        Ok(v) => Some(v),
        Err(e) => {
            errors.push(e);
            None
        }
    }
}

/// A plain-language name for the kind of a JSON value.
fn kind(value: &Value) -> &'static str {
    match value {
        Value::Null => "null",
        Value::Bool(_) => "true or false",
        Value::Number(_) => "a number",
        Value::String(_) => "a text",
        Value::Array(_) => "a list",
        Value::Object(_) => "an object",
    }
}

#[cfg(test)]
mod tests;
