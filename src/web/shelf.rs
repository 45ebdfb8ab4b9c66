//! The scenario shelf: the session's side of the scenario library. It opens
//! the library at start (importing the fictional demos on a first visit),
//! autosaves every edit of the open scenario, follows changes made in other
//! tabs, and turns every outcome the library reports into a notice the user
//! sees. Storage faults never lose the open work: it stays in memory, marked,
//! the notice offers an export, and every later write and every return of
//! the tab into view tries again. Every write takes the app's write lock, so
//! tabs write one at a time.

use super::locks::with_write_lock;
use super::storage::BrowserStore;
use crate::display::LengthUnit;
use crate::library::{
    id_for_key, parse_import, Conflict, EntryId, ImportReport, KeyValueStore, Library,
    LibraryError, Persisted, Reloaded, SaveStatus, APP_PREFIX, DEMO_FILES,
};
use crate::scenario::Scenario;
use leptos::prelude::*;
use serde::{Deserialize, Serialize};
use std::sync::atomic::{AtomicU64, Ordering};

/// The storage key of the user's settings (under the app prefix, so that
/// erasing the app's data removes it too).
const SETTINGS_KEY: &str = "clearspan/settings";

/// How many lines the list behind an import notice shows; the rest are counted.
const NOTICE_LIST_LINES: usize = 200;

/// What the app remembers between visits besides the scenarios.
#[derive(Debug, Clone, Default, Serialize, Deserialize)]
struct Settings {
    /// The entry that was open.
    current: Option<String>,
    /// The length unit last chosen.
    #[serde(default)]
    unit: LengthUnit,
}

/// The milliseconds since the Unix epoch, from the browser clock.
pub fn now_ms() -> u64 {
    js_sys::Date::now().max(0.0) as u64
}

/// A message for the user, with an optional action and an optional list.
#[derive(Debug, Clone, PartialEq)]
pub struct Notice {
    /// Identifies the notice while it is shown (lists are keyed by it).
    pub id: u64,
    /// The words shown.
    pub text: String,
    /// Whether something went wrong (shown as a warning) or is information.
    pub warning: bool,
    /// A button offered with the notice.
    pub action: Option<NoticeAction>,
    /// Lines the user can open under the notice (empty: none).
    pub details: Vec<String>,
    /// How many further lines exist beyond `details`.
    pub more: usize,
}

impl Notice {
    /// A notice without a list, with a fresh id.
    fn new(text: String, warning: bool, action: Option<NoticeAction>) -> Self {
        static NEXT: AtomicU64 = AtomicU64::new(0);
        Notice {
            id: NEXT.fetch_add(1, Ordering::Relaxed),
            text,
            warning,
            action,
            details: Vec::new(),
            more: 0,
        }
    }
}

/// Buttons a notice can carry.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum NoticeAction {
    /// Restore the scenario just deleted.
    UndoDelete,
    /// Save every scenario to a file (offered when storage refuses work).
    ExportAll,
}

/// The shelf's signals; cheap to copy.
#[derive(Clone, Copy)]
pub struct Shelf {
    /// Every scenario on the device.
    pub library: RwSignal<Library<BrowserStore>>,
    /// The entry open in the editor (`None`: not stored yet; the next edit stores it).
    pub current: RwSignal<Option<EntryId>>,
    /// Messages waiting for the user, newest last.
    pub notices: RwSignal<Vec<Notice>>,
    /// A change made in another tab that clashes with this tab's edits.
    pub conflict: RwSignal<Option<Conflict>>,
}

/// The opened shelf, the scenario to show first and the unit to show it in.
pub struct Opening {
    /// The shelf.
    pub shelf: Shelf,
    /// The scenario to open in the editor.
    pub scenario: Scenario,
    /// The length unit remembered from the last visit.
    pub unit: LengthUnit,
}

impl Shelf {
    /// Opens the library from local storage. Entries that cannot be read are
    /// set aside and reported; an empty library gets the fictional demos.
    pub fn open() -> Opening {
        let (mut library, report) = Library::open(BrowserStore::probe());
        let mut notices: Vec<Notice> = report
            .messages()
            .into_iter()
            .map(|text| Notice::new(text, true, report.storage.map(|_| NoticeAction::ExportAll)))
            .collect();
        let settings = read_settings(&library);
        let mut current = settings
            .current
            .as_deref()
            .and_then(EntryId::parse)
            .filter(|id| library.get(id).is_some());
        if library.list("").is_empty() {
            current = import_demos(&mut library, &mut notices).or(current);
        }
        let current = current.or_else(|| library.list("").first().map(|s| s.id.clone()));
        let scenario = current
            .as_ref()
            .and_then(|id| library.get(id))
            .map(|e| e.scenario.clone())
            .unwrap_or_else(Scenario::untitled);
        let shelf = Shelf {
            library: RwSignal::new(library),
            current: RwSignal::new(current),
            notices: RwSignal::new(notices),
            conflict: RwSignal::new(None),
        };
        // A reload opens the same scenario, the first visit's demo included.
        shelf.remember(None);
        Opening {
            shelf,
            scenario,
            unit: settings.unit,
        }
    }

    /// What the save indicator says (reactive): worked out from the library
    /// each time, so it is never "Saved" while anything waits.
    pub fn status(&self) -> SaveStatus {
        let current = self.current.get();
        self.library.with(|lib| lib.save_status(current.as_ref()))
    }

    /// Whether closing the tab now would lose a change.
    pub fn has_unsaved(&self) -> bool {
        self.library.with_untracked(Library::has_unsaved)
    }

    /// Adds a notice.
    pub fn tell(&self, text: impl Into<String>, warning: bool, action: Option<NoticeAction>) {
        let notice = Notice::new(text.into(), warning, action);
        self.notices.update(|n| n.push(notice));
    }

    /// Adds a notice unless one with the same words is already shown.
    fn tell_once(&self, text: String, warning: bool, action: Option<NoticeAction>) {
        let shown = self
            .notices
            .with_untracked(|n| n.iter().any(|notice| notice.text == text));
        if !shown {
            self.tell(text, warning, action);
        }
    }

    /// Removes the notice `id`.
    pub fn dismiss(&self, id: u64) {
        self.notices.update(|n| n.retain(|notice| notice.id != id));
    }

    /// Sums an import up in one notice, with the list behind it.
    pub fn tell_import(&self, report: &ImportReport) {
        let (details, more) = report.details(NOTICE_LIST_LINES);
        let kept = report.added.iter().any(|a| !a.is_stored());
        let mut notice = Notice::new(
            report.headline(),
            report.needs_attention(),
            kept.then_some(NoticeAction::ExportAll),
        );
        notice.details = details;
        notice.more = more;
        self.notices.update(|n| n.push(notice));
    }

    /// Stores the edited scenario: into its entry, or as a new entry when
    /// none is open. Memory takes the change at once (the indicator says
    /// "Saving…"); storage takes it when this tab's turn to write comes.
    pub fn autosave(&self, scenario: &Scenario) {
        let now = now_ms();
        let current = self.current.get_untracked();
        let staged = current.as_ref().and_then(|id| {
            self.library
                .try_update(|lib| lib.stage(id, scenario.clone(), now).ok())
                .flatten()
        });
        if staged.is_none() {
            let created = self
                .library
                .try_update(|lib| lib.create_unwritten(scenario.clone(), "", now));
            if let Some(id) = created {
                self.current.set(Some(id));
                self.remember(None);
            }
        }
        let shelf = *self;
        with_write_lock(move || shelf.write_waiting());
    }

    /// Writes every change waiting in memory or refused before, and says
    /// what went wrong, if anything.
    pub fn write_waiting(&self) {
        let results = self
            .library
            .try_update(|lib| lib.save_unsaved())
            .unwrap_or_default();
        for (_, result) in results {
            self.show_persisted(result);
        }
    }

    /// After the tab comes back into view: writes what waits, and reloads
    /// every open entry in case the browser did not report another tab's
    /// write. Returns the scenario to show if the open one changed.
    pub fn catch_up(&self) -> Option<Scenario> {
        self.write_waiting();
        let (changed, conflicts) = self
            .library
            .try_update(|lib| lib.reload_open())
            .unwrap_or_default();
        if let Some(c) = conflicts.into_iter().next() {
            self.conflict.set(Some(c));
        }
        let current = self.current.get_untracked()?;
        changed
            .into_iter()
            .find(|(id, _)| *id == current)
            .and_then(|(id, outcome)| self.show_reloaded(&id, outcome))
    }

    /// Turns the outcome of a write into notices and the conflict banner;
    /// the save indicator follows the library by itself.
    pub fn show_persisted(&self, result: Result<Persisted, LibraryError>) {
        match result {
            Ok(Persisted::Stored) | Err(LibraryError::NotFound(_)) => {}
            Ok(Persisted::KeptInMemory(e)) => {
                self.tell_once(e.to_string(), true, Some(NoticeAction::ExportAll));
            }
            Err(LibraryError::Conflict(c)) => self.conflict.set(Some(c)),
            Err(e) => self.tell_once(e.to_string(), true, Some(NoticeAction::ExportAll)),
        }
    }

    /// Remembers the open entry and, when given, the unit, for the next visit.
    pub fn remember(&self, unit: Option<LengthUnit>) {
        let current = self.current.get_untracked().map(|id| id.to_string());
        // Only the settings key changes, so nothing that lists scenarios needs to redraw.
        self.library.update_untracked(|lib| {
            let mut settings = read_settings(lib);
            settings.current = current;
            if let Some(unit) = unit {
                settings.unit = unit;
            }
            if let Ok(text) = serde_json::to_string(&settings) {
                // Settings are a convenience: a refused write loses nothing the user made.
                let _ = lib.store_mut().set(SETTINGS_KEY, &text);
            }
        });
    }

    /// Follows a change another tab made to `key` (the browser's storage
    /// event); returns the scenario to show if the open one changed.
    pub fn follow_other_tab(&self, key: Option<String>) -> Option<Scenario> {
        let Some(key) = key else {
            let report = self.library.try_update(|lib| lib.load_all())?;
            for text in report.messages() {
                self.tell(text, true, None);
            }
            return None;
        };
        let id = id_for_key(&key)?;
        match self.library.try_update(|lib| lib.reload(&id))? {
            Ok(outcome) => self.show_reloaded(&id, outcome),
            Err(LibraryError::Conflict(c)) => {
                self.conflict.set(Some(c));
                None
            }
            Err(e) => {
                self.tell(e.to_string(), true, None);
                None
            }
        }
    }

    /// Says what reloading entry `id` did; returns the scenario to show if
    /// it is the open one and changed.
    fn show_reloaded(&self, id: &EntryId, outcome: Reloaded) -> Option<Scenario> {
        let is_open = self.current.get_untracked().as_ref() == Some(id);
        match outcome {
            Reloaded::Updated if is_open => self
                .library
                .with_untracked(|lib| lib.get(id).map(|e| e.scenario.clone())),
            Reloaded::Removed if is_open => {
                self.current.set(None);
                self.tell(
                    "This scenario was deleted in another tab. It stays open here; your next \
                     edit stores it again as a new scenario.",
                    true,
                    None,
                );
                None
            }
            Reloaded::SetAside => {
                self.tell(
                    "Another program wrote a scenario this version cannot read; it is kept \
                     under \"Set aside\" for recovery.",
                    true,
                    None,
                );
                None
            }
            _ => None,
        }
    }
}

/// Reads the settings; anything unreadable counts as no settings.
fn read_settings(library: &Library<BrowserStore>) -> Settings {
    library
        .store()
        .get(SETTINGS_KEY)
        .ok()
        .flatten()
        .and_then(|text| serde_json::from_str(&text).ok())
        .unwrap_or_default()
}

/// Imports every demo file; returns the first demo's entry.
fn import_demos(library: &mut Library<BrowserStore>, notices: &mut Vec<Notice>) -> Option<EntryId> {
    let now = now_ms();
    let mut first = None;
    for demo in DEMO_FILES {
        match parse_import(demo.text) {
            Ok(batch) => {
                let report = library.import(batch, now);
                if first.is_none() {
                    first = report.added.first().map(|a| a.id.clone());
                }
            }
            Err(e) => notices.push(Notice::new(
                format!("The demo {} could not be read: {e}", demo.file_name),
                true,
                None,
            )),
        }
    }
    first
}

/// Whether a storage key belongs to this app.
pub fn is_own_key(key: &str) -> bool {
    key.starts_with(APP_PREFIX)
}
