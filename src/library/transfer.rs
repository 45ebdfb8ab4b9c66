//! Files in and out: export of one, some or all scenarios as one JSON file,
//! and import of untrusted files. Import reads with the size and nesting
//! caps, migrates, runs the scenario validation on each scenario, and takes
//! the good ones even when others are bad; fields it does not know are
//! listed so the user can be told. A name already in the library is never
//! overwritten but gets the next free "… (2)".

use super::collection::{Library, LibraryError, Persisted};
use super::format::{encode_export, EntryId, ExportItem};
use super::migrate::{migrate_export, ExportDocument};
use super::read::{document_text, parse_limited, ReadError};
use super::store::KeyValueStore;
use super::unknown;
use crate::scenario::{validate, FieldError, Problem};
use serde_json::Value;
use std::fmt;

/// A scenario of an import file that was not taken, with every problem found.
#[derive(Debug, Clone, PartialEq)]
pub struct RejectedItem {
    /// Position in the file, counting from 1, for messages.
    pub number: usize,
    /// The scenario's name, if readable.
    pub name: Option<String>,
    /// Every problem, addressed by its full path in the file
    /// (for example `scenarios[1].scenario.tasks[0].distance_m`).
    pub problems: Vec<FieldError>,
}

impl fmt::Display for RejectedItem {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "Scenario {}", self.number)?;
        if let Some(name) = &self.name {
            write!(f, " (\"{name}\")")?;
        }
        f.write_str(" was not imported: ")?;
        let problems: Vec<String> = self.problems.iter().map(FieldError::to_string).collect();
        f.write_str(&problems.join("; "))
    }
}

/// An import file read and checked, before anything is added to the library.
#[derive(Debug, Clone, PartialEq)]
pub struct ImportBatch {
    /// Scenarios that passed every check, in file order.
    pub accepted: Vec<ExportItem>,
    /// Scenarios that did not, with their problems.
    pub rejected: Vec<RejectedItem>,
    /// Paths of the fields clearspan does not know, in the envelope and in
    /// the accepted scenarios (for example
    /// `scenarios[0].scenario.wearer.measured_amplitud`), in file order.
    /// They were ignored; a misspelt field leaves its value unset.
    pub unknown_fields: Vec<String>,
}

/// Reads an import file's text: caps, JSON, format, version, types,
/// validation, unknown fields.
pub fn parse_import(text: &str) -> Result<ImportBatch, ReadError> {
    parse_import_value(&parse_limited(text)?)
}

/// Like [`parse_import`], from the file's raw bytes.
pub fn parse_import_bytes(bytes: &[u8]) -> Result<ImportBatch, ReadError> {
    parse_import(document_text(bytes)?)
}

/// Like [`parse_import`], from a document already parsed by [`parse_limited`].
pub fn parse_import_value(document: &Value) -> Result<ImportBatch, ReadError> {
    Ok(check_items(document, migrate_export(document)?))
}

/// Runs the scenario validation on every decoded item of `doc`, and looks
/// for unknown fields in the `document` it was decoded from.
fn check_items(document: &Value, doc: ExportDocument) -> ImportBatch {
    let mut batch = ImportBatch {
        accepted: Vec::new(),
        rejected: Vec::new(),
        unknown_fields: Vec::new(),
    };
    // Where each scenario of the file went in `accepted`, if it was taken.
    let mut taken: Vec<Option<usize>> = Vec::new();
    for (i, item) in doc.items.into_iter().enumerate() {
        let problems = match item.item {
            Ok(decoded) => match validate(decoded.scenario.clone()) {
                Ok(_) => {
                    taken.push(Some(batch.accepted.len()));
                    batch.accepted.push(decoded);
                    continue;
                }
                Err(errors) => {
                    let prefix = if item.path.is_empty() {
                        "scenario".to_string()
                    } else {
                        format!("{}.scenario", item.path)
                    };
                    errors
                        .into_iter()
                        .map(|e| FieldError {
                            path: format!("{prefix}.{}", e.path),
                            problem: e.problem,
                        })
                        .collect()
                }
            },
            Err(errors) => errors,
        };
        taken.push(None);
        batch.rejected.push(RejectedItem {
            number: i + 1,
            name: item.name,
            problems,
        });
    }
    let items: Vec<Option<&ExportItem>> = taken
        .iter()
        .map(|t| t.and_then(|a| batch.accepted.get(a)))
        .collect();
    batch.unknown_fields = unknown::in_document(document, &items);
    batch
}

/// One scenario added by an import.
#[derive(Debug, Clone, PartialEq)]
pub struct Imported {
    /// The new entry.
    pub id: EntryId,
    /// The name it got.
    pub name: String,
    /// The name in the file, when it clashed and was changed.
    pub renamed_from: Option<String>,
    /// Whether it reached storage.
    pub persisted: Result<Persisted, LibraryError>,
}

impl fmt::Display for Imported {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match &self.renamed_from {
            Some(old) => write!(
                f,
                "Imported \"{old}\" as \"{}\" because that name was already taken",
                self.name
            )?,
            None => write!(f, "Imported \"{}\"", self.name)?,
        }
        match &self.persisted {
            Ok(Persisted::Stored) => Ok(()),
            Ok(Persisted::KeptInMemory(e)) => write!(f, ", but {e}"),
            Err(e) => write!(f, ", but {e}"),
        }
    }
}

/// What an import did.
#[derive(Debug, Clone, PartialEq)]
pub struct ImportReport {
    /// Scenarios added, in file order.
    pub added: Vec<Imported>,
    /// Scenarios not taken.
    pub rejected: Vec<RejectedItem>,
    /// Paths of the fields that were ignored because clearspan does not know them.
    pub unknown_fields: Vec<String>,
}

/// How many unknown fields a notice names before it only counts the rest.
const NAMED_UNKNOWN_FIELDS: usize = 5;

impl ImportReport {
    /// One plain-language line per scenario of the file.
    pub fn messages(&self) -> Vec<String> {
        let mut lines: Vec<String> = self.added.iter().map(Imported::to_string).collect();
        lines.extend(self.rejected.iter().map(RejectedItem::to_string));
        if lines.is_empty() {
            lines.push("The file holds no scenarios.".to_string());
        }
        lines
    }

    /// One warning naming the fields that were ignored, or `None` when there
    /// were none: their number and the first few paths.
    pub fn unknown_fields_notice(&self) -> Option<String> {
        let count = self.unknown_fields.len();
        let (head, guess) = match count {
            0 => return None,
            1 => (
                "1 field in the file is not part of clearspan's format, so it was ignored"
                    .to_string(),
                "a misspelling?",
            ),
            n => (
                format!(
                    "{n} fields in the file are not part of clearspan's format, so they were \
                     ignored"
                ),
                "misspellings?",
            ),
        };
        let named: Vec<&str> = self
            .unknown_fields
            .iter()
            .take(NAMED_UNKNOWN_FIELDS)
            .map(String::as_str)
            .collect();
        let named = named.join(", ");
        let rest = match count.saturating_sub(NAMED_UNKNOWN_FIELDS) {
            0 => String::new(),
            more => format!(" and {more} more"),
        };
        Some(format!("{head} ({guess}): {named}{rest}."))
    }
}

impl<S: KeyValueStore> Library<S> {
    /// Adds every accepted scenario of `batch` as a new entry at `now_ms`,
    /// renaming any whose name is already taken (in the library or earlier in
    /// the batch). The creation time in the file is kept; the change time is
    /// the import, so imported scenarios head the list.
    pub fn import(&mut self, batch: ImportBatch, now_ms: u64) -> ImportReport {
        let added = batch
            .accepted
            .into_iter()
            .map(|item| {
                let mut scenario = item.scenario;
                let wanted = scenario.name.clone();
                scenario.name = self.free_name(&wanted);
                let name = scenario.name.clone();
                let created_ms = item.created_ms.unwrap_or(now_ms);
                let (id, persisted) = self.insert_new(scenario, &item.note, created_ms, now_ms);
                Imported {
                    id,
                    renamed_from: (name != wanted).then_some(wanted),
                    name,
                    persisted,
                }
            })
            .collect();
        ImportReport {
            added,
            rejected: batch.rejected,
            unknown_fields: batch.unknown_fields,
        }
    }

    /// An export file of the entries `ids` (in that order), written at `now_ms`.
    pub fn export(&self, ids: &[EntryId], now_ms: u64) -> Result<String, LibraryError> {
        let items = ids
            .iter()
            .map(|id| self.slot(id).map(|s| ExportItem::from(&s.entry)))
            .collect::<Result<Vec<_>, _>>()?;
        encode_export(&items, now_ms).map_err(|e| {
            LibraryError::NotStorable(vec![FieldError {
                path: "scenarios".to_string(),
                problem: Problem::Unreadable(e.to_string()),
            }])
        })
    }

    /// An export file of every entry, most recently changed first, written at `now_ms`.
    pub fn export_all(&self, now_ms: u64) -> Result<String, LibraryError> {
        let ids: Vec<EntryId> = self.list("").into_iter().map(|s| s.id).collect();
        self.export(&ids, now_ms)
    }
}
