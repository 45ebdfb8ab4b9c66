//! Files in and out: export of one, some or all scenarios as one JSON file,
//! and import of untrusted files. Import reads with the size and nesting
//! caps, migrates, runs the scenario validation on each scenario, and takes
//! the good ones even when others are bad; a name already in the library is
//! never overwritten but gets the next free "… (2)".

use super::collection::{Library, LibraryError, Persisted};
use super::format::{encode_export, EntryId, ExportItem};
use super::migrate::ExportDocument;
use super::read::{read_document, read_document_bytes, ReadError};
use super::store::KeyValueStore;
use crate::scenario::{validate, FieldError, Problem};
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
}

/// Reads an import file's text: caps, JSON, format, version, types, validation.
pub fn parse_import(text: &str) -> Result<ImportBatch, ReadError> {
    Ok(check_items(read_document(text)?))
}

/// Like [`parse_import`], from the file's raw bytes.
pub fn parse_import_bytes(bytes: &[u8]) -> Result<ImportBatch, ReadError> {
    Ok(check_items(read_document_bytes(bytes)?))
}

/// Runs the scenario validation on every decoded item of `doc`.
fn check_items(doc: ExportDocument) -> ImportBatch {
    let mut batch = ImportBatch {
        accepted: Vec::new(),
        rejected: Vec::new(),
    };
    for (i, item) in doc.items.into_iter().enumerate() {
        let problems = match item.item {
            Ok(decoded) => match validate(decoded.scenario.clone()) {
                Ok(_) => {
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
        batch.rejected.push(RejectedItem {
            number: i + 1,
            name: item.name,
            problems,
        });
    }
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
}

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
