//! The saved format: what one stored scenario and one export file look like
//! as JSON, with their format tags and version numbers, and the current
//! in-memory types they become. Writing always produces the current version;
//! reading any shipped version goes through [`crate::library::migrate`].
//!
//! Version 1 layout (the first shipped):
//!
//! ```text
//! stored entry: { "format": "clearspan-scenario-entry", "version": 1,
//!                 "revision": 3, "created_ms": .., "changed_ms": ..,
//!                 "note": "..", "scenario": { ..the scenario model.. } }
//! export file:  { "format": "clearspan-scenario-export", "version": 1,
//!                 "exported_ms": .., "scenarios": [
//!                   { "note": "..", "created_ms": .., "changed_ms": ..,
//!                     "scenario": { .. } }, .. ] }
//! ```
//!
//! Version 2 (current) keeps that layout; inside the scenario it adds
//! `settings` (driving acuity, vertical prism limit), a `prism` in each eye's
//! prescription, and in each task's `flags` a `moving_machinery` flag and a
//! `hazards` object in place of `needs_safety_eyewear`.
//!
//! A stored entry does not hold its own id: the storage key names it, so a
//! copied value can never claim to be another entry.

use crate::scenario::Scenario;
use serde::{Deserialize, Serialize};
use std::fmt;

/// Format tag of one scenario stored under its own key.
pub const ENTRY_FORMAT: &str = "clearspan-scenario-entry";
/// Format tag of an export file holding one or many scenarios.
pub const EXPORT_FORMAT: &str = "clearspan-scenario-export";
/// The version this build writes.
pub const CURRENT_VERSION: u32 = 2;
/// Every format version ever shipped, oldest first.
///
/// Invariant: every version listed here still loads. Each has the fixtures
/// `tests/fixtures/saved/entry-v{N}.json` and `tests/fixtures/saved/export-v{N}.json`,
/// which a native test loads through the migration. A new version is appended
/// (never replaces an old one), gets its own fixtures, and the old fixtures stay.
pub const SHIPPED_VERSIONS: &[u32] = &[1, 2];

/// A stable, storage-safe identifier of a library entry (lowercase letters,
/// digits and `-`), made from the creation time and a counter, never random.
#[derive(Debug, Clone, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub struct EntryId(String);

/// The longest id accepted from a storage key, in bytes.
const MAX_ID_LEN: usize = 64;

impl EntryId {
    /// The id for creation time `now_ms` (milliseconds since the Unix epoch)
    /// and a per-library counter `seq`.
    pub fn from_time_and_counter(now_ms: u64, seq: u64) -> Self {
        EntryId(format!("{now_ms:x}-{seq:x}"))
    }

    /// Accepts `text` as an id if it is 1 to 64 characters of `a-z`, `0-9`, `-`.
    pub fn parse(text: &str) -> Option<Self> {
        let ok = !text.is_empty()
            && text.len() <= MAX_ID_LEN
            && text
                .bytes()
                .all(|c| c.is_ascii_lowercase() || c.is_ascii_digit() || c == b'-');
        ok.then(|| EntryId(text.to_string()))
    }

    /// The id as text.
    pub fn as_str(&self) -> &str {
        &self.0
    }
}

impl fmt::Display for EntryId {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.0)
    }
}

/// One scenario of the library with its bookkeeping.
#[derive(Debug, Clone, PartialEq)]
pub struct Entry {
    /// Identifier; also names the storage key.
    pub id: EntryId,
    /// How many times this entry has been written to storage (0: never).
    /// Another tab that finds a different revision in storage knows someone
    /// else wrote it meanwhile.
    pub revision: u64,
    /// When the entry was created, in milliseconds since the Unix epoch.
    pub created_ms: u64,
    /// When the scenario or its name last changed, in milliseconds since the Unix epoch.
    pub changed_ms: u64,
    /// A free-text note (who, which workstation, "fictional demo").
    pub note: String,
    /// The scenario itself, possibly still incomplete (autosave keeps work in progress).
    pub scenario: Scenario,
}

/// The stored body of an entry in the current version, without its id.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct StoredEntry {
    /// See [`Entry::revision`].
    pub revision: u64,
    /// See [`Entry::created_ms`].
    pub created_ms: u64,
    /// See [`Entry::changed_ms`].
    pub changed_ms: u64,
    /// See [`Entry::note`].
    #[serde(default)]
    pub note: String,
    /// See [`Entry::scenario`].
    pub scenario: Scenario,
}

impl StoredEntry {
    /// The in-memory entry this stored body becomes under `id`.
    pub fn into_entry(self, id: EntryId) -> Entry {
        Entry {
            id,
            revision: self.revision,
            created_ms: self.created_ms,
            changed_ms: self.changed_ms,
            note: self.note,
            scenario: self.scenario,
        }
    }
}

/// One scenario of an export file in the current version.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct ExportItem {
    /// See [`Entry::note`].
    #[serde(default)]
    pub note: String,
    /// When the scenario was first created, if the exporter knew.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub created_ms: Option<u64>,
    /// When the scenario last changed, if the exporter knew.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub changed_ms: Option<u64>,
    /// The scenario.
    pub scenario: Scenario,
}

impl From<&Entry> for ExportItem {
    fn from(e: &Entry) -> Self {
        ExportItem {
            note: e.note.clone(),
            created_ms: Some(e.created_ms),
            changed_ms: Some(e.changed_ms),
            scenario: e.scenario.clone(),
        }
    }
}

/// The whole current-version envelope of a stored entry, as written.
#[derive(Serialize)]
struct EntryEnvelope<'a> {
    format: &'static str,
    version: u32,
    #[serde(flatten)]
    body: &'a StoredEntry,
}

/// The whole current-version envelope of an export file, as written.
#[derive(Serialize)]
struct ExportEnvelope<'a> {
    format: &'static str,
    version: u32,
    exported_ms: u64,
    scenarios: &'a [ExportItem],
}

/// The text stored under an entry's key: the current-version envelope.
pub fn encode_entry(entry: &Entry) -> Result<String, serde_json::Error> {
    let body = StoredEntry {
        revision: entry.revision,
        created_ms: entry.created_ms,
        changed_ms: entry.changed_ms,
        note: entry.note.clone(),
        scenario: entry.scenario.clone(),
    };
    serde_json::to_string(&EntryEnvelope {
        format: ENTRY_FORMAT,
        version: CURRENT_VERSION,
        body: &body,
    })
}

/// The text of an export file holding `items`, written at `exported_ms`
/// (milliseconds since the Unix epoch); indented so a person can read it.
pub fn encode_export(items: &[ExportItem], exported_ms: u64) -> Result<String, serde_json::Error> {
    serde_json::to_string_pretty(&ExportEnvelope {
        format: EXPORT_FORMAT,
        version: CURRENT_VERSION,
        exported_ms,
        scenarios: items,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ids_accept_only_storage_safe_text() {
        let check =
            |text: &str, ok: bool| assert_eq!(EntryId::parse(text).is_some(), ok, "{text:?}");
        check("18c1f0a2b00-1", true);
        check("", false);
        check("A", false);
        check("a/b", false);
        check(&"a".repeat(65), false);
        check(&"a".repeat(64), true);
        assert_eq!(EntryId::from_time_and_counter(255, 16).as_str(), "ff-10");
    }
}
