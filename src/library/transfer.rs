//! Files in and out: export of one, some or all scenarios as one JSON file,
//! and import of untrusted files. Import reads with the size and nesting
//! caps, migrates, and takes every scenario that decodes, even when others
//! do not; one that fails the scenario validation comes in as a draft,
//! marked with its problems, exactly as the form saved it, so whatever can
//! be saved can be imported again and a backup restores every scenario with
//! its times. Fields it does not know are listed so the user can be told.
//! A name already in the library is never overwritten but gets the next
//! free "… (2)". What an import did is summed up in one notice with counts
//! and a list the user can open, however many items the file held.

use super::collection::Library;
use super::format::{encode_export, EntryId, ExportItem};
use super::migrate::{migrate_export, ExportDocument};
use super::read::{document_text, parse_limited, ReadError};
use super::report::{LibraryError, Persisted};
use super::store::{KeyValueStore, StoreError};
use super::unknown;
use crate::display::thousands;
use crate::scenario::{validate, FieldError, Problem};
use serde_json::Value;
use std::collections::BTreeMap;
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
    /// Scenarios that decoded, in file order (drafts that fail the scenario
    /// validation included: they are imported as drafts).
    pub accepted: Vec<ExportItem>,
    /// The position in the file of each accepted scenario, counting from 1.
    pub numbers: Vec<usize>,
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
        numbers: Vec::new(),
        rejected: Vec::new(),
        unknown_fields: Vec::new(),
    };
    // Where each scenario of the file went in `accepted`, if it was taken.
    let mut taken: Vec<Option<usize>> = Vec::new();
    for (i, item) in doc.items.into_iter().enumerate() {
        match item.item {
            Ok(decoded) => {
                taken.push(Some(batch.accepted.len()));
                batch.accepted.push(decoded);
                batch.numbers.push(i + 1);
            }
            Err(problems) => {
                taken.push(None);
                batch.rejected.push(RejectedItem {
                    number: i + 1,
                    name: item.name,
                    problems,
                });
            }
        }
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
    /// Its position in the file, counting from 1.
    pub number: usize,
    /// The new entry.
    pub id: EntryId,
    /// The name it got.
    pub name: String,
    /// The name in the file, when it clashed and was changed.
    pub renamed_from: Option<String>,
    /// Whether it reached storage.
    pub persisted: Result<Persisted, LibraryError>,
    /// Why it cannot be planned yet, with paths inside the scenario
    /// (`wearer.age_years`); empty unless it came in as a draft.
    pub draft_problems: Vec<FieldError>,
}

impl Imported {
    /// Whether it came in as a draft to correct.
    pub fn is_draft(&self) -> bool {
        !self.draft_problems.is_empty()
    }

    /// Whether storage holds it.
    pub fn is_stored(&self) -> bool {
        self.persisted == Ok(Persisted::Stored)
    }
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
        if self.is_draft() {
            let problems: Vec<String> = self
                .draft_problems
                .iter()
                .map(FieldError::to_string)
                .collect();
            write!(f, " as a draft to correct ({})", problems.join("; "))?;
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
    /// One plain-language line per scenario of the file, in file order.
    pub fn messages(&self) -> Vec<String> {
        let mut added = self.added.iter().peekable();
        let mut rejected = self.rejected.iter().peekable();
        let mut lines = Vec::with_capacity(self.added.len() + self.rejected.len());
        loop {
            let line = match (added.peek(), rejected.peek()) {
                (Some(a), Some(r)) if a.number < r.number => added.next().map(|a| a.to_string()),
                (Some(_), Some(_)) | (None, Some(_)) => rejected.next().map(|r| r.to_string()),
                (Some(_), None) => added.next().map(|a| a.to_string()),
                (None, None) => break,
            };
            lines.extend(line);
        }
        if lines.is_empty() {
            lines.push("The file holds no scenarios.".to_string());
        }
        lines
    }

    /// The one line that sums the import up: how many scenarios came in
    /// (and how many of them as drafts, or renamed), how many did not, how
    /// many storage refused, and how many unknown fields were ignored.
    pub fn headline(&self) -> String {
        let added = self.added.len();
        let mut text = match added {
            0 => "Nothing was imported".to_string(),
            1 => "Imported 1 scenario".to_string(),
            n => format!("Imported {} scenarios", thousands(n)),
        };
        let drafts = self.added.iter().filter(|a| a.is_draft()).count();
        match drafts {
            0 => {}
            1 => text.push_str(" (1 as a draft to correct)"),
            n => text.push_str(&format!(" ({} as drafts to correct)", thousands(n))),
        }
        let renamed = self
            .added
            .iter()
            .filter(|a| a.renamed_from.is_some())
            .count();
        if renamed > 0 {
            text.push_str(&format!(
                "; {} renamed because the name was taken",
                thousands(renamed)
            ));
        }
        match self.rejected.len() {
            0 => {}
            1 => text.push_str("; 1 was not imported"),
            n => text.push_str(&format!("; {} were not imported", thousands(n))),
        }
        let kept = self.added.iter().filter(|a| !a.is_stored()).count();
        if kept > 0 {
            text.push_str(&format!(
                "; {} kept in this tab only until storage takes them",
                thousands(kept)
            ));
        }
        match self.unknown_fields.len() {
            0 => {}
            1 => text.push_str("; 1 unknown field ignored"),
            n => text.push_str(&format!("; {} unknown fields ignored", thousands(n))),
        }
        if added == 0 && self.rejected.is_empty() {
            text.push_str(": the file holds no scenarios");
        }
        text.push('.');
        text
    }

    /// Whether something needs the user's attention (a scenario not taken, a
    /// draft, storage refusing, unknown fields).
    pub fn needs_attention(&self) -> bool {
        !self.rejected.is_empty()
            || !self.unknown_fields.is_empty()
            || self.added.iter().any(|a| a.is_draft() || !a.is_stored())
    }

    /// The first `limit` lines of the list behind the headline (the unknown
    /// fields first, then one line per scenario in file order) and how many
    /// more there are, so a file of any size gives a list a page can show.
    pub fn details(&self, limit: usize) -> (Vec<String>, usize) {
        let mut lines: Vec<String> = self.unknown_fields_notice().into_iter().collect();
        let messages = self.messages();
        let total = lines.len() + messages.len();
        lines.extend(messages.into_iter().take(limit.saturating_sub(lines.len())));
        let more = total - lines.len();
        (lines, more)
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
    /// the batch), and writes them. The times in the file are kept (a backup
    /// comes back as it was); a scenario without them gets `now_ms`. A
    /// scenario that fails validation comes in as a draft with its problems.
    pub fn import(&mut self, batch: ImportBatch, now_ms: u64) -> ImportReport {
        let mut added: Vec<Imported> = batch
            .accepted
            .into_iter()
            .zip(batch.numbers)
            .map(|(item, number)| {
                let draft_problems = validate(item.scenario.clone()).err().unwrap_or_default();
                let mut scenario = item.scenario;
                let wanted = scenario.name.clone();
                scenario.name = self.free_name(&wanted);
                let name = scenario.name.clone();
                let changed_ms = item.changed_ms.unwrap_or(now_ms);
                let created_ms = item.created_ms.unwrap_or(changed_ms);
                let id = self.insert_new(scenario, &item.note, created_ms, changed_ms);
                Imported {
                    number,
                    id,
                    renamed_from: (name != wanted).then_some(wanted),
                    name,
                    persisted: Ok(Persisted::Stored),
                    draft_problems,
                }
            })
            .collect();
        // One round of writes: a refusal stops it, and whatever storage
        // refused waits in memory, marked, for the next write.
        let mut written: BTreeMap<EntryId, Result<Persisted, LibraryError>> =
            self.save_unsaved().into_iter().collect();
        let refusal = self.storage_problem.unwrap_or(StoreError::Full);
        for item in &mut added {
            item.persisted = written
                .remove(&item.id)
                .unwrap_or(Ok(Persisted::KeptInMemory(refusal)));
        }
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
