//! The scenario shelf: the session's side of the scenario library. It opens
//! the library at start (importing the fictional demos on a first visit),
//! autosaves every edit of the open scenario, follows changes made in other
//! tabs, and turns every outcome the library reports into a notice the user
//! sees. Storage faults never lose the open work: it stays in memory and the
//! notice offers an export.

use super::storage::BrowserStore;
use crate::display::LengthUnit;
use crate::library::{
    id_for_key, parse_import, Conflict, EntryId, KeyValueStore, Library, LibraryError, Persisted,
    Reloaded, StoreError, APP_PREFIX, DEMO_FILES,
};
use crate::scenario::Scenario;
use leptos::prelude::*;
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

/// The milliseconds since the Unix epoch, from the browser clock.
pub fn now_ms() -> u64 {
    js_sys::Date::now().max(0.0) as u64
}

/// A message for the user, with an optional action.
#[derive(Debug, Clone, PartialEq)]
pub struct Notice {
    /// The words shown.
    pub text: String,
    /// Whether something went wrong (shown as a warning) or is information.
    pub warning: bool,
    /// A button offered with the notice.
    pub action: Option<NoticeAction>,
}

/// Buttons a notice can carry.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum NoticeAction {
    /// Restore the scenario just deleted.
    UndoDelete,
    /// Save every scenario to a file (offered when storage refuses work).
    ExportAll,
}

/// Whether the open scenario is safely stored.
#[derive(Debug, Clone, PartialEq)]
pub enum SaveState {
    /// Storage holds the latest edit.
    Saved,
    /// The latest edit is in this tab only, for the reason given.
    InMemoryOnly(String),
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
    /// Whether the open scenario is stored.
    pub save_state: RwSignal<SaveState>,
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
        let (mut library, report) = Library::open(BrowserStore);
        let mut notices: Vec<Notice> = report
            .messages()
            .into_iter()
            .map(|text| Notice {
                text,
                warning: true,
                action: report.storage.map(|_| NoticeAction::ExportAll),
            })
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
            save_state: RwSignal::new(SaveState::Saved),
        };
        // A reload opens the same scenario, the first visit's demo included.
        shelf.remember(None);
        Opening {
            shelf,
            scenario,
            unit: settings.unit,
        }
    }

    /// Adds a notice.
    pub fn tell(&self, text: impl Into<String>, warning: bool, action: Option<NoticeAction>) {
        let notice = Notice {
            text: text.into(),
            warning,
            action,
        };
        self.notices.update(|n| n.push(notice));
    }

    /// Stores the edited scenario: into its entry, or as a new entry when none is open.
    pub fn autosave(&self, scenario: &Scenario) {
        let now = now_ms();
        let result = match self.current.get_untracked() {
            Some(id) => self
                .library
                .try_update(|lib| lib.save(&id, scenario.clone(), now))
                .unwrap_or(Err(LibraryError::NotFound(id))),
            None => {
                let created = self
                    .library
                    .try_update(|lib| lib.create(scenario.clone(), "", now));
                match created {
                    Some((id, result)) => {
                        self.current.set(Some(id));
                        self.remember(None);
                        result
                    }
                    None => Err(LibraryError::Storage(StoreError::Unavailable)),
                }
            }
        };
        self.show_persisted(result);
    }

    /// Turns the outcome of a write into the save state and notices.
    pub fn show_persisted(&self, result: Result<Persisted, LibraryError>) {
        match result {
            Ok(Persisted::Stored) => self.save_state.set(SaveState::Saved),
            Ok(Persisted::KeptInMemory(e)) => {
                let first_time = self.save_state.get_untracked() == SaveState::Saved;
                self.save_state.set(SaveState::InMemoryOnly(e.to_string()));
                if first_time {
                    self.tell(e.to_string(), true, Some(NoticeAction::ExportAll));
                }
            }
            Err(LibraryError::Conflict(c)) => {
                self.save_state.set(SaveState::InMemoryOnly(
                    "another tab changed this scenario".into(),
                ));
                self.conflict.set(Some(c));
            }
            Err(LibraryError::NotFound(_)) => {
                // The entry went away (deleted here or elsewhere): the work
                // stays open and the next edit stores it as a new scenario.
                self.current.set(None);
                self.save_state
                    .set(SaveState::InMemoryOnly("not stored yet".into()));
            }
            Err(e) => {
                self.save_state.set(SaveState::InMemoryOnly(e.to_string()));
                self.tell(e.to_string(), true, Some(NoticeAction::ExportAll));
            }
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
        let current = self.current.get_untracked();
        let Some(key) = key else {
            let report = self.library.try_update(|lib| lib.load_all())?;
            for text in report.messages() {
                self.tell(text, true, None);
            }
            return None;
        };
        let id = id_for_key(&key)?;
        let outcome = self.library.try_update(|lib| lib.reload(&id))?;
        let is_open = current.as_ref() == Some(&id);
        match outcome {
            Ok(Reloaded::Updated) if is_open => self
                .library
                .with_untracked(|lib| lib.get(&id).map(|e| e.scenario.clone())),
            Ok(Reloaded::Removed) if is_open => {
                self.current.set(None);
                self.tell(
                    "This scenario was deleted in another tab. It stays open here; your next \
                     edit stores it again as a new scenario.",
                    true,
                    None,
                );
                None
            }
            Ok(Reloaded::SetAside) => {
                self.tell(
                    "Another program wrote a scenario this version cannot read; it is kept \
                     under \"Set aside\" for recovery.",
                    true,
                    None,
                );
                None
            }
            Ok(_) => None,
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
            Err(e) => notices.push(Notice {
                text: format!("The demo {} could not be read: {e}", demo.file_name),
                warning: true,
                action: None,
            }),
        }
    }
    first
}

/// Whether a storage key belongs to this app.
pub fn is_own_key(key: &str) -> bool {
    key.starts_with(APP_PREFIX)
}
