//! One tab's session with the scenario library: which entry is open, what
//! the user is told, and the conflict waiting for a choice. It opens the
//! library at start (on a first visit importing the first fictional demo,
//! which opens, and leaving the others for [`Session::import_waiting_demos`],
//! so the first plan is not kept waiting for them),
//! stores every edit of the open scenario, follows changes made in other
//! tabs, and turns every outcome the [`Library`] reports into a [`Notice`]
//! or the [`Conflict`] banner. Storage faults never lose the open work: it
//! stays in memory, marked, the notice offers an export, and every later
//! write tries again. Operations that open another scenario return it, for
//! the editor to show. Nothing here knows the browser: storage is a
//! [`KeyValueStore`], time a number of milliseconds given by the caller,
//! and taking turns with other tabs is the caller's job.

use super::collection::{id_for_key, Library};
use super::demos::{DemoFile, DEMO_FILES};
use super::format::EntryId;
use super::notice::{Notice, NoticeAction, Notices, NOTICE_LIST_LINES};
use super::report::{Conflict, LibraryError, Persisted, SetAside, Summary};
use super::status::SaveStatus;
use super::store::KeyValueStore;
use super::sync::Reloaded;
use super::transfer::{parse_import, ImportReport};
use super::APP_PREFIX;
use crate::display::{file_name_for, LengthUnit};
use crate::scenario::Scenario;
use serde::{Deserialize, Serialize};

/// The storage key of the user's settings (under the app prefix, so that
/// erasing the app's data removes it too).
const SETTINGS_KEY: &str = "clearspan/settings";

/// What the app remembers between visits besides the scenarios.
#[derive(Debug, Clone, Default, Serialize, Deserialize)]
struct Settings {
    /// The entry that was open.
    current: Option<String>,
    /// The length unit last chosen.
    #[serde(default)]
    unit: LengthUnit,
}

/// A session as started: the scenario to show first and the unit to show it in.
#[derive(Debug)]
pub struct Started<S: KeyValueStore> {
    /// The session.
    pub session: Session<S>,
    /// The scenario to open in the editor.
    pub scenario: Scenario,
    /// The length unit remembered from the last visit.
    pub unit: LengthUnit,
}

/// One tab's use of the library.
#[derive(Debug)]
pub struct Session<S: KeyValueStore> {
    library: Library<S>,
    /// The entry open in the editor (`None`: not stored yet; the next edit stores it).
    current: Option<EntryId>,
    notices: Notices,
    /// A change made in another tab that clashes with this tab's edits.
    conflict: Option<Conflict>,
    /// The demo files still to import on this first visit (the first one
    /// is imported at start), in the order they are offered.
    waiting_demos: &'static [DemoFile],
}

impl<S: KeyValueStore> Session<S> {
    /// Opens the library over `store` at `now_ms` (milliseconds since the
    /// Unix epoch). Entries that cannot be read are set aside and reported;
    /// an empty library gets the first fictional demo, which opens, and the
    /// others wait for [`Session::import_waiting_demos`]. The entry open at
    /// the last visit opens again.
    pub fn start(store: S, now_ms: u64) -> Started<S> {
        let (library, report) = Library::open(store);
        let mut session = Session {
            library,
            current: None,
            notices: Notices::default(),
            conflict: None,
            waiting_demos: &[],
        };
        let action = report.storage.map(|_| NoticeAction::ExportAll);
        for text in report.messages() {
            session.notices.tell(text, true, action);
        }
        let settings = session.settings();
        let mut current = settings
            .current
            .as_deref()
            .and_then(EntryId::parse)
            .filter(|id| session.library.get(id).is_some());
        let listed = session.library.list("");
        if listed.is_empty() {
            let (first, others) = DEMO_FILES.split_at(DEMO_FILES.len().min(1));
            current = session.import_demos(first, now_ms).or(current);
            session.waiting_demos = others;
        }
        session.current = current.or_else(|| listed.first().map(|s| s.id.clone()));
        let scenario = session
            .current
            .as_ref()
            .and_then(|id| session.library.get(id))
            .map(|e| e.scenario.clone())
            .unwrap_or_else(Scenario::untitled);
        // A reload opens the same scenario, the first visit's demo included.
        session.remember(None);
        Started {
            session,
            scenario,
            unit: settings.unit,
        }
    }

    /// The entry open in the editor (`None`: the scenario on screen is in no
    /// entry yet; the next edit stores it).
    pub fn current(&self) -> Option<&EntryId> {
        self.current.as_ref()
    }

    /// What the save indicator says, worked out from the library each time,
    /// so it is never "Saved" while anything waits.
    pub fn status(&self) -> SaveStatus {
        self.library.save_status(self.current.as_ref())
    }

    /// Whether closing the tab now would lose a change.
    pub fn has_unsaved(&self) -> bool {
        self.library.has_unsaved()
    }

    /// The entries whose name, note or task names contain every word of
    /// `filter`, most recently changed first.
    pub fn list(&self, filter: &str) -> Vec<Summary> {
        self.library.list(filter)
    }

    /// Stored values that could not be loaded, with their raw text.
    pub fn set_aside(&self) -> &[SetAside] {
        self.library.set_aside()
    }

    /// The messages waiting for the user, oldest first.
    pub fn notices(&self) -> &[Notice] {
        self.notices.all()
    }

    /// The conflict waiting for the user's choice, if any.
    pub fn conflict(&self) -> Option<&Conflict> {
        self.conflict.as_ref()
    }

    /// Adds a notice (for faults met outside the library, such as a file
    /// the browser could not download).
    pub fn tell(&mut self, text: impl Into<String>, warning: bool) {
        self.notices.tell(text.into(), warning, None);
    }

    /// Removes the notice `id`.
    pub fn dismiss(&mut self, id: u64) {
        self.notices.dismiss(id);
    }

    /// Takes the edited scenario into memory at `now_ms`: into the open
    /// entry, or into a new entry when none is open (or the open one is
    /// gone). Storage takes it with the next [`Session::write_waiting`].
    pub fn stage(&mut self, scenario: &Scenario, now_ms: u64) {
        let staged = match &self.current {
            Some(id) => self.library.stage(id, scenario.clone(), now_ms).is_ok(),
            None => false,
        };
        if !staged {
            let id = self.library.create_unwritten(scenario.clone(), "", now_ms);
            self.current = Some(id);
            self.remember(None);
        }
    }

    /// Writes every change waiting in memory or refused before, and says
    /// what went wrong, if anything.
    pub fn write_waiting(&mut self) {
        for (_, result) in self.library.save_unsaved() {
            self.show_persisted(result);
        }
    }

    /// After the tab comes back into view: writes what waits, and reloads
    /// every open entry in case the browser did not report another tab's
    /// write. Returns the scenario to show if the open one changed.
    pub fn catch_up(&mut self) -> Option<Scenario> {
        self.write_waiting();
        let (changed, conflicts) = self.library.reload_open();
        if let Some(c) = conflicts.into_iter().next() {
            self.conflict = Some(c);
        }
        let current = self.current.clone()?;
        let (id, outcome) = changed.into_iter().find(|(id, _)| *id == current)?;
        self.show_reloaded(&id, outcome)
    }

    /// Follows a change another tab made to storage key `key` (`None`: the
    /// whole storage was cleared); keys of other apps are ignored. Returns
    /// the scenario to show if the open one changed.
    pub fn follow_other_tab(&mut self, key: Option<&str>) -> Option<Scenario> {
        let Some(key) = key else {
            for text in self.library.load_all().messages() {
                self.notices.tell(text, true, None);
            }
            return None;
        };
        if !key.starts_with(APP_PREFIX) {
            return None;
        }
        let id = id_for_key(key)?;
        match self.library.reload(&id) {
            Ok(outcome) => self.show_reloaded(&id, outcome),
            Err(LibraryError::Conflict(c)) => {
                self.conflict = Some(c);
                None
            }
            Err(e) => {
                self.notices.tell(e.to_string(), true, None);
                None
            }
        }
    }

    /// Remembers the open entry and, when given, the unit, for the next visit.
    pub fn remember(&mut self, unit: Option<LengthUnit>) {
        let mut settings = self.settings();
        settings.current = self.current.as_ref().map(EntryId::to_string);
        if let Some(unit) = unit {
            settings.unit = unit;
        }
        if let Ok(text) = serde_json::to_string(&settings) {
            // Settings are a convenience: a refused write loses nothing the user made.
            let _ = self.library.store_mut().set(SETTINGS_KEY, &text);
        }
    }

    /// Opens entry `id`; returns its scenario, or `None` (and nothing
    /// changes) when there is no such entry.
    pub fn open_entry(&mut self, id: &EntryId) -> Option<Scenario> {
        let scenario = self.library.get(id)?.scenario.clone();
        self.current = Some(id.clone());
        self.remember(None);
        Some(scenario)
    }

    /// Creates an untitled scenario at `now_ms` and opens it.
    pub fn create_untitled(&mut self, now_ms: u64) -> Option<Scenario> {
        let (id, persisted) = self.library.create(Scenario::untitled(), "", now_ms);
        self.show_persisted(persisted);
        self.open_entry(&id)
    }

    /// Copies the open entry at `now_ms` under the next free name and opens
    /// the copy (nothing when no entry is open).
    pub fn duplicate(&mut self, now_ms: u64) -> Option<Scenario> {
        let id = self.current.clone()?;
        match self.library.duplicate(&id, now_ms) {
            Ok((copy, persisted)) => {
                self.show_persisted(persisted);
                self.open_entry(&copy)
            }
            Err(e) => self.refused(e),
        }
    }

    /// Deletes the open entry, offering an undo, and opens the most recent
    /// remaining scenario (a new untitled one when none is left).
    pub fn delete(&mut self) -> Option<Scenario> {
        let id = self.current.clone()?;
        let name = self.library.get(&id).map(|e| e.scenario.name.clone());
        match self.library.delete(&id) {
            Ok(persisted) => {
                self.show_persisted(Ok(persisted));
                let name = name.unwrap_or_default();
                self.notices.tell(
                    format!("Deleted \"{name}\"."),
                    false,
                    Some(NoticeAction::UndoDelete),
                );
                match self.library.list("").first().map(|s| s.id.clone()) {
                    Some(next) => self.open_entry(&next),
                    None => Some(self.close()),
                }
            }
            Err(e) => self.refused(e),
        }
    }

    /// Restores the scenario deleted last and opens it.
    pub fn undo_delete(&mut self) -> Option<Scenario> {
        match self.library.undo_delete() {
            Ok((id, persisted)) => {
                self.show_persisted(persisted);
                self.open_entry(&id)
            }
            Err(e) => self.refused(e),
        }
    }

    /// Takes the waiting conflict off the banner, for the user's choice of
    /// [`Session::keep_mine`] or [`Session::take_theirs`].
    pub fn take_conflict(&mut self) -> Option<Conflict> {
        self.conflict.take()
    }

    /// Resolves `conflict` by saving this tab's version as a copy at
    /// `now_ms`, and opens the copy.
    pub fn keep_mine(&mut self, conflict: &Conflict, now_ms: u64) -> Option<Scenario> {
        match self.library.keep_mine_as_copy(&conflict.id, now_ms) {
            Ok((id, persisted)) => {
                self.show_persisted(persisted);
                self.open_entry(&id)
            }
            Err(e) => self.refused(e),
        }
    }

    /// Resolves `conflict` by taking what storage holds, and opens it.
    pub fn take_theirs(&mut self, conflict: &Conflict) -> Option<Scenario> {
        match self.library.take_theirs(&conflict.id) {
            Ok(_) => self.open_entry(&conflict.id),
            Err(e) => self.refused(e),
        }
    }

    /// Imports the file `text` at `now_ms`, sums it up in one notice with
    /// the list behind it, and opens the first scenario it added.
    pub fn import(&mut self, text: &str, now_ms: u64) -> Option<Scenario> {
        match parse_import(text) {
            Ok(batch) => {
                let report = self.library.import(batch, now_ms);
                self.tell_import(&report);
                let first = report.added.first()?.id.clone();
                self.open_entry(&first)
            }
            Err(e) => {
                self.notices
                    .tell(format!("Nothing was imported: {e}"), true, None);
                None
            }
        }
    }

    /// Says that a file could not be read at all, so nothing was imported.
    pub fn import_unreadable(&mut self, reason: &str) {
        self.notices
            .tell(format!("Nothing was imported: {reason}."), true, None);
    }

    /// Erases every key of the app from storage and memory, and opens a new
    /// untitled scenario (nothing changes if storage refuses).
    pub fn erase_all(&mut self) -> Option<Scenario> {
        match self.library.erase_all_local_data() {
            Ok(count) => {
                self.waiting_demos = &[];
                self.notices.tell(
                    format!(
                        "Erased all of clearspan's data on this device ({count} stored items)."
                    ),
                    false,
                    None,
                );
                Some(self.close())
            }
            Err(e) => {
                self.notices.tell(e.to_string(), true, None);
                None
            }
        }
    }

    /// Sets the note of the open entry at `now_ms`.
    pub fn set_note(&mut self, note: &str, now_ms: u64) {
        let Some(id) = self.current.clone() else {
            self.tell(
                "Edit the scenario once so it is stored, then add a note.",
                false,
            );
            return;
        };
        let result = self.library.set_note(&id, note, now_ms);
        self.show_persisted(result);
    }

    /// The open entry as an export file at `now_ms`: its file name and text.
    pub fn export_current(&mut self, now_ms: u64) -> Option<(String, String)> {
        let Some(id) = self.current.clone() else {
            self.tell(
                "Edit the scenario once so it is stored, then export it.",
                false,
            );
            return None;
        };
        let name = self.library.get(&id)?.scenario.name.clone();
        match self.library.export(&[id], now_ms) {
            Ok(text) => Some((file_name_for(&name), text)),
            Err(e) => self.refused(e),
        }
    }

    /// Every scenario as one export file at `now_ms`.
    pub fn export_all(&mut self, now_ms: u64) -> Option<String> {
        match self.library.export_all(now_ms) {
            Ok(text) => Some(text),
            Err(e) => self.refused(e),
        }
    }

    /// Removes the set-aside value under `key` from storage for good.
    pub fn discard_set_aside(&mut self, key: &str) {
        if let Err(e) = self.library.discard_set_aside(key) {
            self.notices.tell(e.to_string(), true, None);
        }
    }

    /// Closes the open entry: the editor gets a new untitled scenario, which
    /// the next edit stores.
    fn close(&mut self) -> Scenario {
        self.current = None;
        Scenario::untitled()
    }

    /// Says why an operation was refused; nothing opens.
    fn refused<T>(&mut self, error: LibraryError) -> Option<T> {
        self.notices.tell(error.to_string(), true, None);
        None
    }

    /// Turns the outcome of a write into a notice or the conflict banner;
    /// the save indicator follows the library by itself.
    fn show_persisted(&mut self, result: Result<Persisted, LibraryError>) {
        let export = Some(NoticeAction::ExportAll);
        match result {
            Ok(Persisted::Stored) | Err(LibraryError::NotFound(_)) => {}
            Ok(Persisted::KeptInMemory(e)) => self.notices.tell_once(e.to_string(), true, export),
            Err(LibraryError::Conflict(c)) => self.conflict = Some(c),
            Err(e) => self.notices.tell_once(e.to_string(), true, export),
        }
    }

    /// Says what reloading entry `id` did; returns the scenario to show if
    /// it is the open one and changed.
    fn show_reloaded(&mut self, id: &EntryId, outcome: Reloaded) -> Option<Scenario> {
        let is_open = self.current.as_ref() == Some(id);
        match outcome {
            Reloaded::Updated if is_open => self.library.get(id).map(|e| e.scenario.clone()),
            Reloaded::Removed if is_open => {
                self.current = None;
                self.notices.tell(
                    "This scenario was deleted in another tab. It stays open here; your next \
                     edit stores it again as a new scenario."
                        .to_string(),
                    true,
                    None,
                );
                None
            }
            Reloaded::SetAside => {
                self.notices.tell(
                    "Another program wrote a scenario this version cannot read; it is kept \
                     under \"Set aside\" for recovery."
                        .to_string(),
                    true,
                    None,
                );
                None
            }
            _ => None,
        }
    }

    /// Sums an import up in one notice, with the list behind it.
    fn tell_import(&mut self, report: &ImportReport) {
        let (details, more) = report.details(NOTICE_LIST_LINES);
        let kept = report.added.iter().any(|a| !a.is_stored());
        self.notices.push(
            report.headline(),
            report.needs_attention(),
            kept.then_some(NoticeAction::ExportAll),
            details,
            more,
        );
    }

    /// Reads the settings; anything unreadable counts as no settings.
    fn settings(&self) -> Settings {
        self.library
            .store()
            .get(SETTINGS_KEY)
            .ok()
            .flatten()
            .and_then(|text| serde_json::from_str(&text).ok())
            .unwrap_or_default()
    }

    /// Whether demos of this first visit are still to be imported.
    pub fn has_waiting_demos(&self) -> bool {
        !self.waiting_demos.is_empty()
    }

    /// Imports at `now_ms` the demos a first visit left waiting (nothing
    /// when none wait, and nothing after the user erased everything: an
    /// erase is not undone behind their back). Another tab that started
    /// meanwhile found the first demo stored and imported none; it follows
    /// these writes like any other.
    pub fn import_waiting_demos(&mut self, now_ms: u64) {
        let waiting = std::mem::take(&mut self.waiting_demos);
        self.import_demos(waiting, now_ms);
    }

    /// Imports the demo files `demos` at `now_ms`; returns the first one's entry.
    fn import_demos(&mut self, demos: &[DemoFile], now_ms: u64) -> Option<EntryId> {
        let mut first = None;
        for demo in demos {
            match parse_import(demo.text) {
                Ok(batch) => {
                    let report = self.library.import(batch, now_ms);
                    if first.is_none() {
                        first = report.added.first().map(|a| a.id.clone());
                    }
                }
                Err(e) => self.notices.tell(
                    format!("The demo {} could not be read: {e}", demo.file_name),
                    true,
                    None,
                ),
            }
        }
        first
    }
}

#[cfg(test)]
mod tests;
