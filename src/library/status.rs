//! What the save indicator says: whether the open scenario is in storage,
//! why not when it is not, and how many other scenarios wait in this tab
//! only. It is worked out from the library each time, never remembered
//! apart from it, so opening another scenario can never show a false
//! "Saved" while an edit still waits.

use super::collection::Library;
use super::format::EntryId;
use super::store::{KeyValueStore, StoreError};
use std::fmt;

/// Why a change is held in this tab only.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Unsaved {
    /// Not written yet: the write waits for its turn (another tab may be writing).
    Waiting,
    /// Storage refused it; it is tried again on every later write and when
    /// the tab comes back into view.
    Refused(StoreError),
    /// Another tab changed or deleted the stored copy, or wrote over this
    /// tab's write; the user chooses which version to keep.
    Conflict,
    /// It holds a value that would not read back; it is written once corrected.
    NotStorable,
    /// The scenario on screen is in no entry (its entry was deleted, or all
    /// data erased); the next edit stores it as a new scenario.
    NoEntry,
}

impl Unsaved {
    /// Whether a retry may write it without the user doing anything.
    pub(super) fn retryable(self) -> bool {
        matches!(self, Unsaved::Waiting | Unsaved::Refused(_))
    }
}

impl fmt::Display for Unsaved {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Unsaved::Waiting => f.write_str("waiting to be written"),
            Unsaved::Refused(e) => e.fmt(f),
            Unsaved::Conflict => f.write_str("another tab changed this scenario"),
            Unsaved::NotStorable => {
                f.write_str("a value must be corrected before this scenario can be stored")
            }
            Unsaved::NoEntry => f.write_str("not stored yet; your next edit stores it"),
        }
    }
}

/// The state of the open scenario and of the rest of the library.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct SaveStatus {
    /// The open scenario: `None` when storage holds it, the reason otherwise.
    pub open: Option<Unsaved>,
    /// How many other scenarios are held in this tab only, and why the first is.
    pub others: Option<(usize, Unsaved)>,
}

/// "1 other scenario is" or "3 other scenarios are".
fn others_phrase(count: usize) -> String {
    if count == 1 {
        "1 other scenario is".to_string()
    } else {
        format!("{count} other scenarios are")
    }
}

impl fmt::Display for SaveStatus {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match (self.open, self.others) {
            (None, None) => f.write_str("Saved on this device"),
            (None, Some((count, why))) => write!(
                f,
                "Saved on this device; {} kept in this tab only: {why}",
                others_phrase(count)
            ),
            (Some(Unsaved::Waiting), _) => f.write_str("Saving…"),
            (Some(why), None) => write!(f, "Kept in this tab only: {why}"),
            (Some(why), Some((count, _))) => write!(
                f,
                "Kept in this tab only: {why} ({} too)",
                others_phrase(count)
            ),
        }
    }
}

impl<S: KeyValueStore> Library<S> {
    /// The save indicator for the open entry `open` (`None`: the scenario on
    /// screen is not in the library yet).
    pub fn save_status(&self, open: Option<&EntryId>) -> SaveStatus {
        let open_state = match open.and_then(|id| self.slots.get(id)) {
            Some(slot) => slot.unsaved,
            None => Some(Unsaved::NoEntry),
        };
        let mut others = self
            .slots
            .iter()
            .filter(|(id, _)| Some(*id) != open)
            .filter_map(|(_, slot)| slot.unsaved);
        let others = others.next().map(|first| (1 + others.count(), first));
        SaveStatus {
            open: open_state,
            others,
        }
    }

    /// Whether any entry holds a change that storage does not have: closing
    /// the tab now would lose it.
    pub fn has_unsaved(&self) -> bool {
        self.slots.values().any(|slot| slot.unsaved.is_some())
    }
}
