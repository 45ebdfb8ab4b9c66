//! Writing entries safely when several tabs share one storage. A tab writes
//! only if storage still holds exactly the text it last read or wrote, so a
//! change from another tab is never silently overwritten but reported as a
//! [`Conflict`]. Because local storage is not updated atomically across
//! tabs, two tabs can still write at the same instant; the browser then
//! tells each about the other's write, and [`Library::reload`] finds the
//! lost update (a stored text that replaced this tab's write without having
//! seen it) and reports it the same way. Every successful write retries the
//! entries still waiting. This file also reloads an entry after the browser
//! reports an external change.

use super::collection::{key_for, Base, Library, Slot};
use super::format::{encode_entry, EntryId, StoredEntry};
use super::read::{read_entry, ReadError};
use super::report::{Conflict, EntryProblem, LibraryError, Persisted, SetAside, Theirs};
use super::status::Unsaved;
use super::store::{KeyValueStore, StoreError};
use crate::scenario::{FieldError, Problem, Scenario};

/// What storage holds under an entry's key right now.
pub(super) enum StoredState {
    Missing,
    Readable { body: Box<StoredEntry>, raw: String },
    Unreadable { raw: String, error: ReadError },
}

impl StoredState {
    /// What a stored text (or its absence) is to this tab.
    fn from_raw(raw: Option<String>) -> Self {
        match raw {
            None => StoredState::Missing,
            Some(raw) => match read_entry(&raw) {
                Ok(body) => StoredState::Readable {
                    body: Box::new(body),
                    raw,
                },
                Err(error) => StoredState::Unreadable { raw, error },
            },
        }
    }

    /// True if storage holds exactly the text `base` this tab last read or wrote.
    pub(super) fn matches(&self, base: Option<&Base>) -> bool {
        match (self, base) {
            (StoredState::Missing, None) => true,
            (StoredState::Readable { raw, .. }, Some(base)) => *raw == base.text,
            _ => false,
        }
    }

    /// True if storage holds a text that replaced this tab's own write
    /// `base` without having seen it: its revision is not above the one
    /// written. (At the integer maximum no revision is above, so any other
    /// text counts: a needless question is better than a silent loss.)
    fn overwrote(&self, base: &Base) -> bool {
        match self {
            StoredState::Readable { body, raw } => {
                base.written_here && *raw != base.text && body.revision <= base.revision
            }
            _ => false,
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
        self.stage(id, scenario, now_ms)?;
        if self.slot(id)?.unsaved.is_none() {
            return Ok(Persisted::Stored);
        }
        self.persist(id)
    }

    /// Replaces the scenario of entry `id` (changed at `now_ms`) in memory
    /// only; [`Library::save_unsaved`] or any later write stores it. An
    /// unchanged scenario changes nothing.
    pub fn stage(
        &mut self,
        id: &EntryId,
        scenario: Scenario,
        now_ms: u64,
    ) -> Result<(), LibraryError> {
        let slot = self.slot_mut(id)?;
        if slot.entry.scenario != scenario {
            slot.change(scenario, now_ms);
        }
        Ok(())
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
        slot.touch(now_ms);
        self.persist(id)
    }

    /// Writes every entry waiting in memory, or refused by storage before
    /// (after the user freed space, or when storage came back), and returns
    /// what each write did. Entries in conflict wait for the user's choice,
    /// and entries holding a value that would not read back for a correction.
    /// A refusal stops the round: storage would refuse the rest too, so they
    /// are marked with the same refusal without asking it.
    pub fn save_unsaved(&mut self) -> Vec<(EntryId, Result<Persisted, LibraryError>)> {
        let mut results = Vec::new();
        let mut refusal = None;
        for id in self.retryable_ids() {
            if let Some(e) = refusal {
                self.refused_write(&id, e);
                continue;
            }
            let result = self.write(&id);
            if let Ok(Persisted::KeptInMemory(e)) = result {
                refusal = Some(e);
            }
            results.push((id, result));
        }
        results
    }

    /// The entries a retry may write, in id order.
    fn retryable_ids(&self) -> Vec<EntryId> {
        self.slots
            .iter()
            .filter(|(_, s)| s.unsaved.is_some_and(Unsaved::retryable))
            .map(|(id, _)| id.clone())
            .collect()
    }

    /// Reloads entry `id` from storage after another tab changed it (the
    /// browser's `storage` event; use [`super::id_for_key`] on the event's key,
    /// and [`Library::load_all`] when the event names no key). Unsaved changes
    /// here are never dropped: they make a [`Conflict`] instead.
    pub fn reload(&mut self, id: &EntryId) -> Result<Reloaded, LibraryError> {
        let raw = self
            .store
            .get(&key_for(id))
            .map_err(LibraryError::Storage)?;
        let Some(slot) = self.slots.get(id) else {
            return Ok(self.adopt(id, StoredState::from_raw(raw), false));
        };
        // The same text as last seen needs no parsing: the common case when
        // every open entry is checked.
        if raw.as_deref() == slot.base.as_ref().map(|b| b.text.as_str()) {
            return Ok(Reloaded::Unchanged);
        }
        let state = StoredState::from_raw(raw);
        let lost_write = slot.base.as_ref().is_some_and(|b| state.overwrote(b));
        if slot.unsaved.is_some() || lost_write {
            return Err(LibraryError::Conflict(self.conflicted(id, state)));
        }
        Ok(self.adopt(id, state, true))
    }

    /// Reloads every open entry ([`Library::reload`] on each), when the
    /// browser may have missed telling this tab of another's writes (after
    /// the tab was hidden). Returns the entries that changed and every conflict.
    pub fn reload_open(&mut self) -> (Vec<(EntryId, Reloaded)>, Vec<Conflict>) {
        let mut changed = Vec::new();
        let mut conflicts = Vec::new();
        let ids: Vec<EntryId> = self.slots.keys().cloned().collect();
        for id in ids {
            match self.reload(&id) {
                Ok(Reloaded::Unchanged) => {}
                Ok(outcome) => changed.push((id, outcome)),
                Err(LibraryError::Conflict(c)) => conflicts.push(c),
                Err(_) => {}
            }
        }
        (changed, conflicts)
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

    /// Writes entry `id`, then, if that worked, every other entry still
    /// waiting or refused before: storage has room again.
    pub(super) fn persist(&mut self, id: &EntryId) -> Result<Persisted, LibraryError> {
        let result = self.write(id);
        if result == Ok(Persisted::Stored) {
            self.save_unsaved();
        }
        result
    }

    /// Writes entry `id` as the next revision if storage still holds the
    /// text this tab knows; the entry stays in memory whatever happens, and
    /// its slot records why it is not stored when it is not.
    fn write(&mut self, id: &EntryId) -> Result<Persisted, LibraryError> {
        let slot = self.slot(id)?;
        let base = slot.base.clone();
        let mut next = slot.entry.clone();
        let known = base.as_ref().map_or(0, |b| b.revision);
        next.revision = slot.entry.revision.max(known).saturating_add(1);
        let text = match writable_text(&next) {
            Ok(text) => text,
            Err(e) => return Err(self.hold(id, Unsaved::NotStorable, e)),
        };
        let stored = match self.store.get(&key_for(id)) {
            Ok(stored) => stored,
            Err(e) => return Ok(self.refused_write(id, e)),
        };
        if stored.as_deref() != base.as_ref().map(|b| b.text.as_str()) {
            let conflict = self.conflicted(id, StoredState::from_raw(stored));
            return Err(LibraryError::Conflict(conflict));
        }
        match self.store.set(&key_for(id), &text) {
            Ok(()) => {
                let slot = self.slot_mut(id)?;
                slot.entry.revision = next.revision;
                slot.base = Some(Base {
                    revision: next.revision,
                    text,
                    written_here: true,
                });
                slot.unsaved = None;
                self.storage_problem = None;
                Ok(Persisted::Stored)
            }
            Err(e) => Ok(self.refused_write(id, e)),
        }
    }

    /// Marks entry `id` as held in memory for `why` and passes `error` on.
    fn hold(&mut self, id: &EntryId, why: Unsaved, error: LibraryError) -> LibraryError {
        if let Some(slot) = self.slots.get_mut(id) {
            slot.unsaved = Some(why);
        }
        error
    }

    /// Records storage's refusal to write entry `id`.
    fn refused_write(&mut self, id: &EntryId, e: StoreError) -> Persisted {
        if let Some(slot) = self.slots.get_mut(id) {
            slot.unsaved = Some(Unsaved::Refused(e));
        }
        self.refused(e)
    }

    /// Marks entry `id` as in conflict with what storage holds, and describes it.
    fn conflicted(&mut self, id: &EntryId, state: StoredState) -> Conflict {
        if let Some(slot) = self.slots.get_mut(id) {
            slot.unsaved = Some(Unsaved::Conflict);
        }
        self.conflict(id, state)
    }

    /// Reads what storage holds under `id`'s key.
    pub(super) fn stored_state(&self, id: &EntryId) -> Result<StoredState, StoreError> {
        Ok(StoredState::from_raw(self.store.get(&key_for(id))?))
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
            StoredState::Readable { body, .. } => Theirs::Newer {
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
            StoredState::Readable { body, raw } => {
                let base = Some(Base {
                    revision: body.revision,
                    text: raw,
                    written_here: false,
                });
                self.slots.insert(
                    id.clone(),
                    Slot::new(body.into_entry(id.clone()), base, None),
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
