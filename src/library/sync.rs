//! Writing entries safely when several tabs share one storage. Every entry
//! carries a revision counter; a tab writes only if storage still holds the
//! revision it last read or wrote, so a newer revision from another tab is
//! never silently overwritten but reported as a [`Conflict`]. This file also
//! reloads an entry after the browser reports an external change.

use super::collection::{
    key_for, Conflict, EntryProblem, Library, LibraryError, Persisted, SetAside, Theirs,
};
use super::format::{encode_entry, EntryId, StoredEntry};
use super::read::{read_entry, ReadError};
use super::store::{KeyValueStore, StoreError};
use crate::scenario::{FieldError, Problem, Scenario};

/// What storage holds under an entry's key right now.
pub(super) enum StoredState {
    Missing,
    Readable(Box<StoredEntry>),
    Unreadable { raw: String, error: ReadError },
}

impl StoredState {
    /// True if storage holds exactly the revision `base` this tab started from.
    pub(super) fn matches(&self, base: Option<u64>) -> bool {
        match self {
            StoredState::Missing => base.is_none(),
            StoredState::Readable(body) => base == Some(body.revision),
            StoredState::Unreadable { .. } => false,
        }
    }
}

/// What reloading an entry after an external change did.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Reloaded {
    /// Storage holds the revision this tab already has.
    Unchanged,
    /// Another tab's newer revision replaced this tab's copy.
    Updated,
    /// Another tab created the entry; it is now open here too.
    Added,
    /// Another tab deleted the entry; it is closed here too.
    Removed,
    /// Storage now holds something unreadable; it is set aside and closed here.
    SetAside,
}

impl<S: KeyValueStore> Library<S> {
    /// Autosave: replaces the scenario of entry `id` (changed at `now_ms`) and
    /// writes it unless another tab wrote a newer revision meanwhile. The new
    /// scenario is kept in memory in every case.
    pub fn save(
        &mut self,
        id: &EntryId,
        scenario: Scenario,
        now_ms: u64,
    ) -> Result<Persisted, LibraryError> {
        let slot = self.slot_mut(id)?;
        if slot.entry.scenario == scenario && !slot.unsaved {
            return Ok(Persisted::Stored);
        }
        slot.entry.scenario = scenario;
        slot.entry.changed_ms = now_ms;
        slot.unsaved = true;
        self.persist(id)
    }

    /// Sets the note of entry `id` at `now_ms` and writes it.
    pub fn set_note(
        &mut self,
        id: &EntryId,
        note: &str,
        now_ms: u64,
    ) -> Result<Persisted, LibraryError> {
        let slot = self.slot_mut(id)?;
        slot.entry.note = note.to_string();
        slot.entry.changed_ms = now_ms;
        slot.unsaved = true;
        self.persist(id)
    }

    /// Tries again to write every entry held in memory only (after the user
    /// freed space or storage came back).
    pub fn save_unsaved(&mut self) -> Vec<(EntryId, Result<Persisted, LibraryError>)> {
        self.unsaved_ids()
            .into_iter()
            .map(|id| {
                let result = self.persist(&id);
                (id, result)
            })
            .collect()
    }

    /// Reloads entry `id` from storage after another tab changed it (the
    /// browser's `storage` event; use [`super::id_for_key`] on the event's key,
    /// and [`Library::load_all`] when the event names no key). Unsaved changes
    /// here are never dropped: they make a [`Conflict`] instead.
    pub fn reload(&mut self, id: &EntryId) -> Result<Reloaded, LibraryError> {
        let state = self.stored_state(id).map_err(LibraryError::Storage)?;
        let (open, base, unsaved) = match self.slots.get(id) {
            Some(slot) => (true, slot.base, slot.unsaved),
            None => (false, None, false),
        };
        if open && state.matches(base) {
            return Ok(Reloaded::Unchanged);
        }
        if unsaved {
            return Err(LibraryError::Conflict(self.conflict(id, state)));
        }
        Ok(self.adopt(id, state, open))
    }

    /// Resolves a conflict by dropping this tab's version of `id` and taking
    /// whatever storage holds (which may be nothing, if it was deleted).
    pub fn take_theirs(&mut self, id: &EntryId) -> Result<Reloaded, LibraryError> {
        let open = self.slots.contains_key(id);
        let state = self.stored_state(id).map_err(LibraryError::Storage)?;
        Ok(self.adopt(id, state, open))
    }

    /// Resolves a conflict by giving `id` storage's version and saving this
    /// tab's version as a new entry with the next free name. Returns the new
    /// entry. If storage cannot be read, `id` keeps this tab's version too.
    pub fn keep_mine_as_copy(
        &mut self,
        id: &EntryId,
        now_ms: u64,
    ) -> Result<(EntryId, Result<Persisted, LibraryError>), LibraryError> {
        let mine = self.slot(id)?.entry.clone();
        // Storage's version takes the original entry first, so the copy's
        // name is checked against the name it brings.
        if let Ok(state) = self.stored_state(id) {
            self.adopt(id, state, true);
        }
        let mut scenario = mine.scenario;
        scenario.name = self.free_name(&scenario.name);
        Ok(self.create(scenario, &mine.note, now_ms))
    }

    /// Writes entry `id` as the next revision if storage still holds the
    /// revision this tab knows; the entry stays in memory whatever happens.
    pub(super) fn persist(&mut self, id: &EntryId) -> Result<Persisted, LibraryError> {
        let slot = self.slot(id)?;
        let base = slot.base;
        let mut next = slot.entry.clone();
        next.revision = slot.entry.revision.max(base.unwrap_or(0)).saturating_add(1);
        let text = writable_text(&next)?;
        let state = match self.stored_state(id) {
            Ok(state) => state,
            Err(e) => return Ok(self.refused(e)),
        };
        if !state.matches(base) {
            return Err(LibraryError::Conflict(self.conflict(id, state)));
        }
        match self.store.set(&key_for(id), &text) {
            Ok(()) => {
                let slot = self.slot_mut(id)?;
                slot.entry.revision = next.revision;
                slot.base = Some(next.revision);
                slot.unsaved = false;
                self.storage_problem = None;
                Ok(Persisted::Stored)
            }
            Err(e) => Ok(self.refused(e)),
        }
    }

    /// Reads what storage holds under `id`'s key.
    pub(super) fn stored_state(&self, id: &EntryId) -> Result<StoredState, StoreError> {
        Ok(match self.store.get(&key_for(id))? {
            None => StoredState::Missing,
            Some(raw) => match read_entry(&raw) {
                Ok(body) => StoredState::Readable(Box::new(body)),
                Err(error) => StoredState::Unreadable { raw, error },
            },
        })
    }

    /// Describes a conflict on `id` with what storage holds.
    pub(super) fn conflict(&self, id: &EntryId, state: StoredState) -> Conflict {
        let name = self
            .slots
            .get(id)
            .map(|s| s.entry.scenario.name.clone())
            .unwrap_or_default();
        let theirs = match state {
            StoredState::Missing => Theirs::Removed,
            StoredState::Readable(body) => Theirs::Newer {
                revision: body.revision,
                name: body.scenario.name,
            },
            StoredState::Unreadable { error, .. } => Theirs::Unreadable(error),
        };
        Conflict {
            id: id.clone(),
            name,
            theirs,
        }
    }

    /// Replaces this tab's copy of `id` with what storage holds.
    fn adopt(&mut self, id: &EntryId, state: StoredState, was_open: bool) -> Reloaded {
        match state {
            StoredState::Missing => {
                self.slots.remove(id);
                if was_open {
                    Reloaded::Removed
                } else {
                    Reloaded::Unchanged
                }
            }
            StoredState::Readable(body) => {
                let base = Some(body.revision);
                self.slots.insert(
                    id.clone(),
                    super::collection::Slot {
                        entry: body.into_entry(id.clone()),
                        base,
                        unsaved: false,
                    },
                );
                if was_open {
                    Reloaded::Updated
                } else {
                    Reloaded::Added
                }
            }
            StoredState::Unreadable { raw, error } => {
                self.slots.remove(id);
                let key = key_for(id);
                self.set_aside.retain(|s| s.key != key);
                self.set_aside.push(SetAside {
                    key,
                    raw,
                    problem: EntryProblem::Unreadable(error),
                });
                Reloaded::SetAside
            }
        }
    }
}

/// The stored text of `entry`, checked to read back, so nothing is ever
/// written that a later load would have to set aside (a number that is not
/// finite, for example, would be written as `null`).
fn writable_text(entry: &super::format::Entry) -> Result<String, LibraryError> {
    let text = encode_entry(entry).map_err(|e| {
        LibraryError::NotStorable(vec![FieldError {
            path: "scenario".to_string(),
            problem: Problem::Unreadable(e.to_string()),
        }])
    })?;
    // Only readability is checked, not float equality: the JSON parser may
    // round the last digit of a decimal differently, which is not a loss.
    match read_entry(&text) {
        Ok(_) => Ok(text),
        Err(ReadError::Format(super::migrate::FormatError::Fields(errors))) => {
            Err(LibraryError::NotStorable(errors))
        }
        Err(e) => Err(LibraryError::NotStorable(vec![FieldError {
            path: "scenario".to_string(),
            problem: Problem::Unreadable(e.to_string()),
        }])),
    }
}
