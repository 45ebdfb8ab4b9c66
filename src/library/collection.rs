//! The [`Library`]: every scenario of the device in memory, loaded from and
//! written to a [`KeyValueStore`] one key per scenario. Loading never fails
//! as a whole: good entries load, unreadable ones are set aside with their
//! raw text and reported. This file covers loading, listing and the user's
//! edits (create, rename, duplicate, delete with undo, erase all); writing
//! with conflict detection lives in `sync.rs`, files in `transfer.rs`.

use super::format::{Entry, EntryId};
use super::naming::unique_name;
use super::report::{EntryProblem, LibraryError, LoadReport, Persisted, SetAside, Summary};
use super::status::Unsaved;
use super::store::{KeyValueStore, StoreError};
use crate::scenario::{validate, Scenario, MAX_NAME_CHARS};
use std::collections::BTreeMap;

/// Prefix of every storage key the app owns; erasing the app's data removes
/// exactly the keys that start with it. Other app settings belong under it too.
pub const APP_PREFIX: &str = "clearspan/";
/// Prefix of the key of each stored scenario; the entry id follows it.
pub const SCENARIO_PREFIX: &str = "clearspan/scenario/";

/// The storage key of entry `id`.
pub fn key_for(id: &EntryId) -> String {
    format!("{SCENARIO_PREFIX}{id}")
}

/// The entry a storage key belongs to, if it is a scenario key with a valid id
/// (for the browser's `storage` event, which names the changed key).
pub fn id_for_key(key: &str) -> Option<EntryId> {
    key.strip_prefix(SCENARIO_PREFIX).and_then(EntryId::parse)
}

/// What this tab last read from or wrote to storage for one entry.
#[derive(Debug, Clone, PartialEq)]
pub(super) struct Base {
    /// The stored revision.
    pub(super) revision: u64,
    /// The stored text, exactly. Two tabs that write the same revision at the
    /// same moment write different texts, so comparing texts finds a lost
    /// update where comparing revisions cannot (nor at the integer maximum).
    pub(super) text: String,
    /// Whether this tab wrote it; a later stored text with a revision no
    /// higher than this one's was written without seeing it.
    pub(super) written_here: bool,
}

/// An entry in memory with what this tab knows of its stored copy.
#[derive(Debug, Clone)]
pub(super) struct Slot {
    pub(super) entry: Entry,
    /// What storage held when this tab last read or wrote it (`None`: not stored).
    pub(super) base: Option<Base>,
    /// Why a change in memory is not in storage yet (`None`: storage holds it).
    pub(super) unsaved: Option<Unsaved>,
    /// Whether the scenario fails validation (kept up to date on every change).
    pub(super) draft: bool,
}

impl Slot {
    /// A slot for `entry`, its draft mark computed once here.
    pub(super) fn new(entry: Entry, base: Option<Base>, unsaved: Option<Unsaved>) -> Self {
        let draft = validate(entry.scenario.clone()).is_err();
        Slot {
            entry,
            base,
            unsaved,
            draft,
        }
    }

    /// Replaces the scenario, marking the change as waiting to be written.
    pub(super) fn change(&mut self, scenario: Scenario, now_ms: u64) {
        self.draft = validate(scenario.clone()).is_err();
        self.entry.scenario = scenario;
        self.touch(now_ms);
    }

    /// Records a change of the entry at `now_ms` that is not written yet.
    pub(super) fn touch(&mut self, now_ms: u64) {
        self.entry.changed_ms = now_ms;
        self.unsaved = Some(Unsaved::Waiting);
    }
}

/// Every scenario on the device, over a key-value store.
#[derive(Debug)]
pub struct Library<S: KeyValueStore> {
    pub(super) store: S,
    pub(super) slots: BTreeMap<EntryId, Slot>,
    pub(super) set_aside: Vec<SetAside>,
    /// Deleted entries, each with what storage still holds of it
    /// (`None` once its key is removed).
    pub(super) deleted: Vec<(Entry, Option<Base>)>,
    pub(super) next_seq: u64,
    pub(super) storage_problem: Option<StoreError>,
}

impl<S: KeyValueStore> Library<S> {
    /// Opens the library over `store` and loads every entry.
    pub fn open(store: S) -> (Self, LoadReport) {
        let mut library = Library {
            store,
            slots: BTreeMap::new(),
            set_aside: Vec::new(),
            deleted: Vec::new(),
            next_seq: 0,
            storage_problem: None,
        };
        let report = library.load_all();
        (library, report)
    }

    /// Reads every scenario key again (after start, or when another tab
    /// cleared storage). Entries with unsaved changes in memory are kept as
    /// they are; entries gone from storage are dropped unless unsaved.
    pub fn load_all(&mut self) -> LoadReport {
        let mut report = LoadReport::default();
        let keys = match self.store.keys() {
            Ok(keys) => keys,
            Err(e) => {
                self.storage_problem = Some(e);
                report.storage = Some(e);
                report.loaded = self.slots.len();
                return report;
            }
        };
        let mut found: BTreeMap<EntryId, (Entry, String)> = BTreeMap::new();
        let mut set_aside = Vec::new();
        for key in keys.iter().filter(|k| k.starts_with(SCENARIO_PREFIX)) {
            let raw = match self.store.get(key) {
                Ok(Some(raw)) => raw,
                Ok(None) => continue,
                Err(e) => {
                    report.storage = Some(e);
                    continue;
                }
            };
            let Some(id) = id_for_key(key) else {
                set_aside.push(SetAside {
                    key: key.clone(),
                    raw,
                    problem: EntryProblem::BadKey,
                });
                continue;
            };
            match super::read::read_entry(&raw) {
                Ok(body) => {
                    found.insert(id.clone(), (body.into_entry(id), raw));
                }
                Err(e) => set_aside.push(SetAside {
                    key: key.clone(),
                    raw,
                    problem: EntryProblem::Unreadable(e),
                }),
            }
        }
        // After a partial read failure an entry missing from `found` may
        // still be stored, so nothing is dropped from memory then.
        if report.storage.is_none() {
            self.slots
                .retain(|id, slot| slot.unsaved.is_some() || found.contains_key(id));
        }
        for (id, (entry, text)) in found {
            if self.slots.get(&id).is_some_and(|s| s.unsaved.is_some()) {
                continue;
            }
            let base = Some(Base {
                revision: entry.revision,
                text,
                written_here: false,
            });
            self.slots.insert(id, Slot::new(entry, base, None));
        }
        self.set_aside = set_aside;
        self.storage_problem = report.storage;
        report.loaded = self.slots.len();
        report.set_aside = self.set_aside.clone();
        report
    }

    /// The entry `id`, if open.
    pub fn get(&self, id: &EntryId) -> Option<&Entry> {
        self.slots.get(id).map(|s| &s.entry)
    }

    /// The entries whose name, note or task names contain every word of
    /// `filter` (ignoring case), most recently changed first.
    pub fn list(&self, filter: &str) -> Vec<Summary> {
        let words: Vec<String> = filter.split_whitespace().map(str::to_lowercase).collect();
        let mut rows: Vec<Summary> = self
            .slots
            .values()
            .filter(|slot| {
                if words.is_empty() {
                    return true;
                }
                let e = &slot.entry;
                let mut text = format!("{}\n{}", e.scenario.name, e.note);
                for t in &e.scenario.tasks {
                    text.push('\n');
                    text.push_str(&t.name);
                }
                let text = text.to_lowercase();
                words.iter().all(|w| text.contains(w.as_str()))
            })
            .map(|slot| Summary {
                id: slot.entry.id.clone(),
                name: slot.entry.scenario.name.clone(),
                note: slot.entry.note.clone(),
                changed_ms: slot.entry.changed_ms,
                task_count: slot.entry.scenario.tasks.len(),
                unsaved: slot
                    .unsaved
                    .as_ref()
                    .is_some_and(|u| *u != Unsaved::Waiting),
                draft: slot.draft,
            })
            .collect();
        rows.sort_by(|a, b| {
            b.changed_ms
                .cmp(&a.changed_ms)
                .then_with(|| a.name.cmp(&b.name))
                .then_with(|| a.id.cmp(&b.id))
        });
        rows
    }

    /// Stored values that could not be loaded, with their raw text.
    pub fn set_aside(&self) -> &[SetAside] {
        &self.set_aside
    }

    /// Removes a set-aside value from storage for good, at the user's request.
    pub fn discard_set_aside(&mut self, key: &str) -> Result<(), StoreError> {
        self.store.remove(key)?;
        self.set_aside.retain(|s| s.key != key);
        Ok(())
    }

    /// The last storage refusal, cleared by the next successful write; while
    /// set, the UI should say that work is kept in this tab only and offer export.
    pub fn storage_problem(&self) -> Option<StoreError> {
        self.storage_problem
    }

    /// The entries with changes held in memory only.
    pub fn unsaved_ids(&self) -> Vec<EntryId> {
        self.slots
            .iter()
            .filter(|(_, s)| s.unsaved.is_some())
            .map(|(id, _)| id.clone())
            .collect()
    }

    /// The store, for the adapter.
    pub fn store(&self) -> &S {
        &self.store
    }

    /// The store, for app settings kept beside the scenarios under
    /// [`APP_PREFIX`] (never under [`SCENARIO_PREFIX`]).
    pub fn store_mut(&mut self) -> &mut S {
        &mut self.store
    }

    /// Adds a new scenario created at `now_ms` (milliseconds since the Unix epoch).
    /// The entry exists in memory whatever storage says; the result says whether it was written.
    pub fn create(
        &mut self,
        scenario: Scenario,
        note: &str,
        now_ms: u64,
    ) -> (EntryId, Result<Persisted, LibraryError>) {
        let id = self.create_unwritten(scenario, note, now_ms);
        let result = self.persist(&id);
        (id, result)
    }

    /// Adds a new scenario created at `now_ms` to memory only, waiting for
    /// [`Library::save_unsaved`] (or any later write) to store it.
    pub fn create_unwritten(&mut self, scenario: Scenario, note: &str, now_ms: u64) -> EntryId {
        self.insert_new(scenario, note, now_ms, now_ms)
    }

    /// Adds a new entry with the given times to memory, not written yet.
    pub(super) fn insert_new(
        &mut self,
        scenario: Scenario,
        note: &str,
        created_ms: u64,
        changed_ms: u64,
    ) -> EntryId {
        let id = self.fresh_id(changed_ms);
        let entry = Entry {
            id: id.clone(),
            revision: 0,
            created_ms,
            changed_ms,
            note: note.to_string(),
            scenario,
        };
        self.slots
            .insert(id.clone(), Slot::new(entry, None, Some(Unsaved::Waiting)));
        id
    }

    /// Renames entry `id` at `now_ms`.
    pub fn rename(
        &mut self,
        id: &EntryId,
        name: &str,
        now_ms: u64,
    ) -> Result<Persisted, LibraryError> {
        if name.chars().count() > MAX_NAME_CHARS {
            return Err(LibraryError::NameTooLong);
        }
        let mut scenario = self.slot(id)?.entry.scenario.clone();
        scenario.name = name.to_string();
        self.slot_mut(id)?.change(scenario, now_ms);
        self.persist(id)
    }

    /// Copies entry `id` into a new entry with the next free name ("… (2)").
    pub fn duplicate(
        &mut self,
        id: &EntryId,
        now_ms: u64,
    ) -> Result<(EntryId, Result<Persisted, LibraryError>), LibraryError> {
        let source = self.slot(id)?.entry.clone();
        let mut scenario = source.scenario;
        scenario.name = self.free_name(&scenario.name);
        Ok(self.create(scenario, &source.note, now_ms))
    }

    /// Deletes entry `id` from storage and keeps it in memory for
    /// [`Library::undo_delete`] until [`Library::discard_deleted`]. A newer
    /// revision written by another tab is never deleted unseen: that is a conflict.
    pub fn delete(&mut self, id: &EntryId) -> Result<Persisted, LibraryError> {
        let base = self.slot(id)?.base.clone();
        let (persisted, left_in_storage) = match self.stored_state(id) {
            Err(e) => (self.refused(e), base),
            Ok(state) if state.matches(base.as_ref()) => match self.store.remove(&key_for(id)) {
                Ok(()) => (Persisted::Stored, None),
                Err(e) => (self.refused(e), base),
            },
            Ok(state) => return Err(LibraryError::Conflict(self.conflict(id, state))),
        };
        if let Some(slot) = self.slots.remove(id) {
            self.deleted.push((slot.entry, left_in_storage));
        }
        Ok(persisted)
    }

    /// The most recently deleted entry that can still be restored.
    pub fn last_deleted(&self) -> Option<&Entry> {
        self.deleted.last().map(|(entry, _)| entry)
    }

    /// Restores the most recently deleted entry and writes it back.
    pub fn undo_delete(
        &mut self,
    ) -> Result<(EntryId, Result<Persisted, LibraryError>), LibraryError> {
        let (entry, base) = self.deleted.pop().ok_or(LibraryError::NothingToUndo)?;
        let id = entry.id.clone();
        self.slots
            .insert(id.clone(), Slot::new(entry, base, Some(Unsaved::Waiting)));
        let result = self.persist(&id);
        Ok((id, result))
    }

    /// Forgets the deleted entries for good.
    pub fn discard_deleted(&mut self) {
        self.deleted.clear();
    }

    /// Erases every key of the app from storage (and only those: keys under
    /// [`APP_PREFIX`]) and then everything in memory. Returns how many keys
    /// were removed. If storage refuses, memory is left as it was so nothing
    /// is lost by half.
    pub fn erase_all_local_data(&mut self) -> Result<usize, StoreError> {
        let keys = self.store.keys()?;
        let mut removed = 0;
        for key in keys.iter().filter(|k| k.starts_with(APP_PREFIX)) {
            self.store.remove(key)?;
            removed += 1;
        }
        self.slots.clear();
        self.set_aside.clear();
        self.deleted.clear();
        self.storage_problem = None;
        Ok(removed)
    }

    /// A scenario name not used by any open entry, based on `wanted`.
    pub(super) fn free_name(&self, wanted: &str) -> String {
        unique_name(
            wanted,
            self.slots.values().map(|s| s.entry.scenario.name.as_str()),
        )
    }

    /// A new id from `now_ms` and the counter that names no open, deleted,
    /// set-aside or stored entry.
    fn fresh_id(&mut self, now_ms: u64) -> EntryId {
        // The bound only guards against a store that claims every key; the
        // write of a taken id would then be refused as a conflict, not overwrite.
        for _ in 0..1000 {
            let id = EntryId::from_time_and_counter(now_ms, self.next_seq);
            self.next_seq = self.next_seq.wrapping_add(1);
            let key = key_for(&id);
            let taken = self.slots.contains_key(&id)
                || self.deleted.iter().any(|(e, _)| e.id == id)
                || self.set_aside.iter().any(|s| s.key == key)
                || matches!(self.store.get(&key), Ok(Some(_)));
            if !taken {
                return id;
            }
        }
        EntryId::from_time_and_counter(now_ms, self.next_seq)
    }

    pub(super) fn slot(&self, id: &EntryId) -> Result<&Slot, LibraryError> {
        self.slots
            .get(id)
            .ok_or_else(|| LibraryError::NotFound(id.clone()))
    }

    pub(super) fn slot_mut(&mut self, id: &EntryId) -> Result<&mut Slot, LibraryError> {
        self.slots
            .get_mut(id)
            .ok_or_else(|| LibraryError::NotFound(id.clone()))
    }

    /// Records a storage refusal and reports the change as kept in memory.
    pub(super) fn refused(&mut self, e: StoreError) -> Persisted {
        self.storage_problem = Some(e);
        Persisted::KeptInMemory(e)
    }
}
