//! What the library reports and refuses, as values: entries set aside on
//! loading and why, the load report, whether a change reached storage, a
//! conflict with another tab's write, the errors of library operations, and
//! one line of the library list. The [`super::Library`] itself lives in
//! `collection.rs`.

use super::format::EntryId;
use super::read::ReadError;
use super::store::StoreError;
use crate::scenario::{FieldError, MAX_NAME_CHARS};
use std::fmt;

/// Why a stored value was set aside instead of loaded.
#[derive(Debug, Clone, PartialEq)]
pub enum EntryProblem {
    /// The key is under the scenario prefix but does not name a valid id.
    BadKey,
    /// The text cannot be read: damaged, foreign, or from a newer version.
    Unreadable(ReadError),
}

impl fmt::Display for EntryProblem {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            EntryProblem::BadKey => f.write_str("its storage key is not one clearspan makes"),
            EntryProblem::Unreadable(e) => e.fmt(f),
        }
    }
}

impl std::error::Error for EntryProblem {}

/// A stored value that could not be loaded. Its text stays untouched in
/// storage (a newer clearspan may have written it) and is kept here too, so
/// the user can download it for recovery or discard it deliberately.
#[derive(Debug, Clone, PartialEq)]
pub struct SetAside {
    /// The storage key it was found under.
    pub key: String,
    /// Its raw text, exactly as stored.
    pub raw: String,
    /// Why it could not be loaded.
    pub problem: EntryProblem,
}

impl fmt::Display for SetAside {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(
            f,
            "A saved scenario ({}) could not be opened: {}. Its text is kept unchanged; \
             download it to keep a copy, or discard it.",
            self.key, self.problem
        )
    }
}

/// What loading found, for the UI to show once after start.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct LoadReport {
    /// How many scenarios loaded.
    pub loaded: usize,
    /// Stored values that could not be loaded, kept for recovery.
    pub set_aside: Vec<SetAside>,
    /// Set if the store could not be read at all or in part.
    pub storage: Option<StoreError>,
}

impl LoadReport {
    /// One plain-language line per problem (empty when all went well).
    pub fn messages(&self) -> Vec<String> {
        let mut lines: Vec<String> = self.storage.iter().map(StoreError::to_string).collect();
        lines.extend(self.set_aside.iter().map(SetAside::to_string));
        lines
    }
}

/// Whether a change reached storage.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Persisted {
    /// Written to storage.
    Stored,
    /// Kept in memory only, because storage refused it; the UI should offer export.
    KeptInMemory(StoreError),
}

/// What another tab or program did to an entry this tab was about to write.
#[derive(Debug, Clone, PartialEq)]
pub enum Theirs {
    /// Someone wrote a different revision.
    Newer {
        /// The revision found in storage.
        revision: u64,
        /// The scenario name in that revision.
        name: String,
    },
    /// Someone deleted the entry.
    Removed,
    /// Someone wrote something this version cannot read.
    Unreadable(ReadError),
}

/// A write refused because storage no longer holds the revision this tab
/// started from. This tab's version stays in memory until the user chooses
/// [`Library::keep_mine_as_copy`] or [`Library::take_theirs`].
#[derive(Debug, Clone, PartialEq)]
pub struct Conflict {
    /// The entry concerned.
    pub id: EntryId,
    /// The scenario name in this tab.
    pub name: String,
    /// What is in storage now.
    pub theirs: Theirs,
}

impl fmt::Display for Conflict {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let name = &self.name;
        match &self.theirs {
            Theirs::Newer {
                revision,
                name: their_name,
            } => write!(
                f,
                "\"{name}\" was changed in another tab or window (now revision {revision}, named \
                 \"{their_name}\") while you edited it here. Keep yours as a copy, or take theirs."
            ),
            Theirs::Removed => write!(
                f,
                "\"{name}\" was deleted in another tab or window while you edited it here. Keep \
                 yours as a copy, or let it go."
            ),
            Theirs::Unreadable(e) => write!(
                f,
                "\"{name}\" was overwritten elsewhere with something this version cannot read \
                 ({e}). Keep yours as a copy; the other text is kept for recovery."
            ),
        }
    }
}

/// Why a library operation was refused.
#[derive(Debug, Clone, PartialEq)]
pub enum LibraryError {
    /// No entry has this id (it may have been deleted).
    NotFound(EntryId),
    /// A name longer than [`MAX_NAME_CHARS`] characters.
    NameTooLong,
    /// Another tab changed the entry; nothing was overwritten.
    Conflict(Conflict),
    /// There is no deleted entry to restore.
    NothingToUndo,
    /// The scenario holds a value that would not read back (such as a number
    /// that is not finite); it is kept in memory, not written.
    NotStorable(Vec<FieldError>),
    /// Storage could not be read for an operation that needs it.
    Storage(StoreError),
}

impl fmt::Display for LibraryError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            LibraryError::NotFound(id) => {
                write!(
                    f,
                    "no scenario with id {id} is open; it may have been deleted"
                )
            }
            LibraryError::NameTooLong => {
                write!(
                    f,
                    "the name is longer than {MAX_NAME_CHARS} characters; shorten it"
                )
            }
            LibraryError::Conflict(c) => c.fmt(f),
            LibraryError::NothingToUndo => f.write_str("there is no deleted scenario to restore"),
            LibraryError::NotStorable(errors) => write!(
                f,
                "this scenario cannot be saved until a value is corrected ({}); it is kept in \
                 this tab",
                errors
                    .iter()
                    .map(FieldError::to_string)
                    .collect::<Vec<_>>()
                    .join("; ")
            ),
            LibraryError::Storage(e) => e.fmt(f),
        }
    }
}

impl std::error::Error for LibraryError {}

/// One line of the library list.
#[derive(Debug, Clone, PartialEq)]
pub struct Summary {
    /// The entry.
    pub id: EntryId,
    /// The scenario name.
    pub name: String,
    /// The entry's note.
    pub note: String,
    /// Last change, in milliseconds since the Unix epoch.
    pub changed_ms: u64,
    /// Number of tasks in the scenario.
    pub task_count: usize,
    /// True while a change is held in memory only because storage refused
    /// it, a conflict waits or it cannot be stored; not for an edit merely
    /// waiting a moment for its write ("Saving…").
    pub unsaved: bool,
    /// True while the scenario cannot be planned yet (a draft with a value to correct).
    pub draft: bool,
}
