//! The scenario shelf: this tab's [`Session`] with the library, kept in a
//! [`StoredValue`], and the signals the views draw from it (the list, the
//! save state, the notices, the conflict, the open entry), updated after
//! every call and only where they changed. The session decides; this file
//! only gives it local storage, the clock and this tab's turn to write.

use super::clock::now_ms;
use super::locks::with_write_lock;
use super::startup::after_first_paint;
use super::storage::BrowserStore;
use crate::display::LengthUnit;
use crate::library::{Conflict, EntryId, Notice, SaveStatus, Session, SetAside, Summary};
use crate::scenario::Scenario;
use leptos::prelude::*;

/// How long the write of an edit waits for the edits that follow it, in
/// milliseconds: a number typed is written once, not once a keystroke,
/// and the keystroke does not wait for storage. The edit is in memory at
/// once (the indicator says "Saving…"); hiding or leaving the tab writes
/// it without waiting.
const WRITE_DELAY_MS: u64 = 250;

/// The session with local storage.
pub type BrowserSession = Session<BrowserStore>;

/// The session and what the views draw from it; cheap to copy.
#[derive(Clone, Copy)]
pub struct Shelf {
    session: StoredValue<BrowserSession>,
    /// Every scenario on the device, most recently changed first.
    pub list: RwSignal<Vec<Summary>>,
    /// What the save indicator says.
    pub status: RwSignal<SaveStatus>,
    /// The entry open in the editor (`None`: not stored yet; the next edit stores it).
    pub current: RwSignal<Option<EntryId>>,
    /// Messages waiting for the user, newest last.
    pub notices: RwSignal<Vec<Notice>>,
    /// A change made in another tab that clashes with this tab's edits.
    pub conflict: RwSignal<Option<Conflict>>,
    /// Stored values that could not be opened.
    pub set_aside: RwSignal<Vec<SetAside>>,
    /// Whether a delayed write of staged edits is already scheduled.
    write_scheduled: StoredValue<bool>,
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

/// Sets `signal` to `value` unless it holds that already, so nothing that
/// draws it redraws for nothing.
fn set_if_changed<T: PartialEq + Send + Sync + 'static>(signal: RwSignal<T>, value: T) {
    signal.maybe_update(|old| {
        let changed = *old != value;
        if changed {
            *old = value;
        }
        changed
    });
}

impl Shelf {
    /// Opens the library from local storage (see [`Session::start`]). On
    /// a first visit the demos besides the one shown are imported, in this
    /// tab's turn to write, after the first plan is painted.
    pub fn open() -> Opening {
        let started = Session::start(BrowserStore::probe(), now_ms());
        let shelf = Shelf {
            session: StoredValue::new(started.session),
            list: RwSignal::new(Vec::new()),
            status: RwSignal::new(SaveStatus {
                open: None,
                others: None,
            }),
            current: RwSignal::new(None),
            notices: RwSignal::new(Vec::new()),
            conflict: RwSignal::new(None),
            set_aside: RwSignal::new(Vec::new()),
            write_scheduled: StoredValue::new(false),
        };
        shelf.refresh();
        if shelf.read(|s| s.has_waiting_demos()).unwrap_or(false) {
            after_first_paint(move || shelf.in_turn(|s, now| s.import_waiting_demos(now), |()| {}));
        }
        Opening {
            shelf,
            scenario: started.scenario,
            unit: started.unit,
        }
    }

    /// Runs `op` on the session now, then updates the signals.
    pub fn run<T>(&self, op: impl FnOnce(&mut BrowserSession) -> T) -> Option<T> {
        let out = self.session.try_update_value(op);
        self.refresh();
        out
    }

    /// Reads the session without changing it.
    pub fn read<T>(&self, read: impl FnOnce(&BrowserSession) -> T) -> Option<T> {
        self.session.try_with_value(read)
    }

    /// Runs `op` on the session in this tab's turn to write, with the time
    /// then; `then` gets what it returned.
    pub fn in_turn<T: 'static>(
        &self,
        op: impl FnOnce(&mut BrowserSession, u64) -> T + 'static,
        then: impl FnOnce(T) + 'static,
    ) {
        let shelf = *self;
        with_write_lock(move || {
            if let Some(out) = shelf.run(|s| op(s, now_ms())) {
                then(out);
            }
        });
    }

    /// Stores the edited scenario: memory takes it at once (the indicator
    /// says "Saving…"), storage [`WRITE_DELAY_MS`] later in this tab's turn
    /// to write, with every edit made meanwhile.
    pub fn autosave(&self, scenario: &Scenario) {
        let now = now_ms();
        self.run(|s| s.stage(scenario, now));
        if self.write_scheduled.get_value() {
            return;
        }
        self.write_scheduled.set_value(true);
        let shelf = *self;
        set_timeout(
            move || shelf.write_now(),
            std::time::Duration::from_millis(WRITE_DELAY_MS),
        );
    }

    /// Writes every staged edit in this tab's turn, without waiting (the
    /// tab is being hidden or left, or the delay is over), after importing
    /// the demos a first visit still leaves waiting (a tab left within its
    /// first frame keeps them).
    pub fn write_now(&self) {
        self.write_scheduled.set_value(false);
        self.in_turn(
            |s, now| {
                s.import_waiting_demos(now);
                s.write_waiting();
            },
            |()| {},
        );
    }

    /// Adds a notice.
    pub fn tell(&self, text: impl Into<String>, warning: bool) {
        let text = text.into();
        self.run(|s| s.tell(text, warning));
    }

    /// Removes the notice `id`.
    pub fn dismiss(&self, id: u64) {
        self.run(|s| s.dismiss(id));
    }

    /// Copies what the views draw out of the session, where it changed.
    fn refresh(&self) {
        let Some((list, status, current, notices, conflict, set_aside)) = self.read(|s| {
            (
                s.list(""),
                s.status(),
                s.current().cloned(),
                s.notices().to_vec(),
                s.conflict().cloned(),
                s.set_aside().to_vec(),
            )
        }) else {
            return;
        };
        set_if_changed(self.list, list);
        set_if_changed(self.status, status);
        set_if_changed(self.current, current);
        set_if_changed(self.notices, notices);
        set_if_changed(self.conflict, conflict);
        set_if_changed(self.set_aside, set_aside);
    }
}
