//! The session as a tab lives it: start with and without demos, edits
//! staged and written, storage refusing and taking work again, another tab
//! changing or deleting the open scenario, delete with undo, erase, import
//! and export, each asserting what the user is shown (notices, the conflict
//! banner, the save indicator) and which scenario opens. Two "tabs" are two
//! sessions over clones of one shared memory store.

use super::*;
use crate::library::{
    key_for, MemoryStore, SharedMemoryStore, StoreError, Theirs, Unsaved, SCENARIO_PREFIX,
};
use std::cell::RefCell;
use std::rc::Rc;

fn shared() -> SharedMemoryStore {
    Rc::new(RefCell::new(MemoryStore::new()))
}

/// A session over an empty shared store, started at t=1, with the demos in
/// (those left waiting at start imported at t=1 too).
fn first_visit() -> (Session<SharedMemoryStore>, SharedMemoryStore, Scenario) {
    let store = shared();
    let mut started = Session::start(Rc::clone(&store), 1);
    started.session.import_waiting_demos(1);
    (started.session, store, started.scenario)
}

/// The notices' words, oldest first.
fn words<S: KeyValueStore>(session: &Session<S>) -> Vec<String> {
    session.notices().iter().map(|n| n.text.clone()).collect()
}

/// The open entry's name in the library.
fn open_name<S: KeyValueStore>(session: &Session<S>) -> Option<String> {
    let id = session.current()?;
    session
        .list("")
        .into_iter()
        .find(|s| s.id == *id)
        .map(|s| s.name)
}

/// `scenario` renamed.
fn named(scenario: &Scenario, name: &str) -> Scenario {
    let mut s = scenario.clone();
    s.name = name.to_string();
    s
}

#[test]
fn a_first_visit_brings_the_demos_and_opens_the_first_and_a_reload_opens_it_again() {
    let (session, store, scenario) = first_visit();
    let first_demo = parse_import(DEMO_FILES[0].text)
        .expect("demo reads")
        .accepted[0]
        .scenario
        .clone();
    assert_eq!(session.list("").len(), DEMO_FILES.len());
    assert_eq!(scenario, first_demo);
    assert_eq!(open_name(&session), Some(first_demo.name.clone()));
    assert!(session.notices().is_empty(), "{:?}", words(&session));
    assert_eq!(session.status().to_string(), "Saved on this device");

    let again = Session::start(store, 2);
    assert_eq!(
        again.session.list("").len(),
        DEMO_FILES.len(),
        "no second import"
    );
    assert_eq!(again.session.current(), session.current());
    assert_eq!(again.scenario, first_demo);
    assert_eq!(again.unit, LengthUnit::Centimetres, "the default unit");
}

#[test]
fn a_first_visit_opens_the_first_demo_at_once_and_imports_the_others_after() {
    let store = shared();
    let started = Session::start(Rc::clone(&store), 1);
    let mut a = started.session;
    assert_eq!(
        a.list("").len(),
        1,
        "only the demo shown is imported at start"
    );
    assert_eq!(open_name(&a), Some(started.scenario.name.clone()));
    assert!(a.has_waiting_demos());
    assert_eq!(a.status().to_string(), "Saved on this device");

    // A second tab opening meanwhile finds the first demo stored and
    // imports nothing itself.
    let mut b = Session::start(Rc::clone(&store), 2).session;
    assert!(!b.has_waiting_demos());
    assert_eq!(b.list("").len(), 1);
    assert_eq!(b.current(), a.current(), "the same demo opens");

    a.import_waiting_demos(3);
    assert!(!a.has_waiting_demos());
    assert_eq!(a.list("").len(), DEMO_FILES.len());
    assert!(a.notices().is_empty(), "{:?}", words(&a));
    assert_eq!(a.status().to_string(), "Saved on this device");
    a.import_waiting_demos(4);
    assert_eq!(a.list("").len(), DEMO_FILES.len(), "imported once");

    // The second tab follows the writes, as the browser reports them.
    let keys: Vec<String> = store
        .borrow()
        .keys()
        .expect("keys")
        .into_iter()
        .filter(|k| k.starts_with(SCENARIO_PREFIX))
        .collect();
    for key in &keys {
        assert_eq!(
            b.follow_other_tab(Some(key)),
            None,
            "the open one is unchanged"
        );
    }
    let names = |s: &Session<SharedMemoryStore>| -> Vec<String> {
        s.list("").into_iter().map(|e| e.name).collect()
    };
    assert_eq!(names(&b), names(&a));
}

#[test]
fn demos_left_waiting_are_not_imported_after_an_erase() {
    let store = shared();
    let mut session = Session::start(Rc::clone(&store), 1).session;
    session.erase_all().expect("an untitled scenario");
    assert!(!session.has_waiting_demos());
    session.import_waiting_demos(2);
    assert!(session.list("").is_empty());
}

#[test]
fn the_unit_and_the_open_scenario_are_remembered_for_the_next_visit() {
    let (mut session, store, _) = first_visit();
    let last = session
        .list("")
        .last()
        .map(|s| s.id.clone())
        .expect("demos");
    let opened = session.open_entry(&last).expect("an entry to open");
    session.remember(Some(LengthUnit::Inches));
    let again = Session::start(store, 2);
    assert_eq!(again.unit, LengthUnit::Inches);
    assert_eq!(again.session.current(), Some(&last));
    assert_eq!(again.scenario, opened);
}

#[test]
fn an_edit_waits_in_memory_then_is_written_and_a_new_scenario_gets_an_entry() {
    let (mut session, store, scenario) = first_visit();
    let open = session.current().cloned().expect("a demo is open");
    session.stage(&named(&scenario, "Edited"), 5);
    assert_eq!(session.status().to_string(), "Saving…");
    assert!(session.has_unsaved(), "closing now would lose the edit");
    assert!(
        session.list("").iter().all(|line| !line.unsaved),
        "a write waiting a moment is not called \"not stored\" in the list"
    );
    session.write_waiting();
    assert_eq!(session.status().to_string(), "Saved on this device");
    assert!(!session.has_unsaved());
    let stored = store.borrow().raw(&key_for(&open)).map(str::to_string);
    assert!(stored.is_some_and(|text| text.contains("\"Edited\"")));

    // After an erase nothing is open: the next edit makes a new entry.
    session.erase_all().expect("a fresh scenario to show");
    assert_eq!(session.current(), None);
    assert_eq!(
        session.status().open,
        Some(Unsaved::NoEntry),
        "the indicator says the scenario is in no entry"
    );
    session.stage(&Scenario::untitled(), 6);
    session.write_waiting();
    assert_eq!(session.list("").len(), 1);
    assert_eq!(open_name(&session).as_deref(), Some("Untitled scenario"));
    assert_eq!(session.status().open, None);
}

#[test]
fn refused_writes_keep_the_work_say_so_once_and_are_retried() {
    let (mut session, store, scenario) = first_visit();
    store.borrow_mut().set_capacity(Some(0));
    for (i, name) in ["One", "Two", "Three"].into_iter().enumerate() {
        session.stage(&named(&scenario, name), 10 + i as u64);
        session.write_waiting();
    }
    let notices = session.notices();
    assert_eq!(
        notices.len(),
        1,
        "one notice for the same fault: {notices:?}"
    );
    assert_eq!(notices[0].text, StoreError::Full.to_string());
    assert!(notices[0].warning);
    let line = session.list("").into_iter().find(|l| l.name == "Three");
    assert!(line.is_some_and(|l| l.unsaved), "a refused write is");
    assert_eq!(notices[0].action, Some(NoticeAction::ExportAll));
    assert_eq!(
        session.status().open,
        Some(Unsaved::Refused(StoreError::Full))
    );
    assert_eq!(
        open_name(&session).as_deref(),
        Some("Three"),
        "kept in memory"
    );

    // Room again: the next write takes the refused edit with it.
    store.borrow_mut().set_capacity(None);
    session.write_waiting();
    assert_eq!(session.status().open, None);
    let id = session.current().cloned().expect("open");
    let stored = store.borrow().raw(&key_for(&id)).map(str::to_string);
    assert!(stored.is_some_and(|text| text.contains("\"Three\"")));
}

#[test]
fn without_storage_the_session_runs_from_memory_and_offers_export() {
    let mut store = MemoryStore::new();
    store.set_unavailable(true);
    let started = Session::start(store, 1);
    let mut session = started.session;
    session.import_waiting_demos(1);
    assert_eq!(words(&session), [StoreError::Unavailable.to_string()]);
    assert_eq!(
        session.notices()[0].action,
        Some(NoticeAction::ExportAll),
        "the load notice offers an export"
    );
    assert_eq!(
        session.list("").len(),
        DEMO_FILES.len(),
        "the demos are there to try, in memory"
    );
    assert!(
        session.status().others.is_some(),
        "and marked as not stored"
    );
    session.stage(&named(&started.scenario, "Kept"), 2);
    session.write_waiting();
    assert_eq!(session.notices().len(), 1, "the same fault is said once");
    assert_eq!(
        session.status().open,
        Some(Unsaved::Refused(StoreError::Unavailable))
    );
    let file = session.export_all(3).expect("memory exports");
    assert!(file.contains("\"Kept\""));
}

#[test]
fn another_tabs_edit_of_the_open_scenario_is_followed_or_becomes_a_conflict() {
    let (mut a, store, scenario) = first_visit();
    let mut b = Session::start(Rc::clone(&store), 2).session;
    let id = a.current().cloned().expect("open");
    let key = key_for(&id);

    // Tab A writes; tab B, with nothing unsaved, follows.
    a.stage(&named(&scenario, "From A"), 3);
    a.write_waiting();
    let shown = b
        .follow_other_tab(Some(&key))
        .expect("the open scenario changed");
    assert_eq!(shown.name, "From A");
    assert_eq!(b.follow_other_tab(Some("another-app/key")), None);

    // Both edit: the second write finds A's text and asks.
    a.stage(&named(&scenario, "A again"), 4);
    a.write_waiting();
    b.stage(&named(&scenario, "B's edit"), 5);
    b.write_waiting();
    let conflict = b.conflict().cloned().expect("a conflict");
    assert_eq!(conflict.id, id);
    assert!(matches!(&conflict.theirs, Theirs::Newer { name, .. } if name == "A again"));
    assert_eq!(b.status().open, Some(Unsaved::Conflict));

    // Keeping mine makes a copy and opens it; the original takes A's version.
    let taken = b.take_conflict().expect("the banner's conflict");
    assert_eq!(b.conflict(), None);
    let copy = b.keep_mine(&taken, 6).expect("the copy opens");
    assert_eq!(copy.name, "B's edit");
    assert_ne!(b.current(), Some(&id));
    let names: Vec<String> = b.list("").into_iter().map(|s| s.name).collect();
    assert!(names.contains(&"A again".to_string()), "{names:?}");
    assert_eq!(b.status().open, None);
}

#[test]
fn taking_theirs_drops_this_tabs_edit_and_opens_the_stored_version() {
    let (mut a, store, scenario) = first_visit();
    let mut b = Session::start(Rc::clone(&store), 2).session;
    a.stage(&named(&scenario, "Theirs"), 3);
    a.write_waiting();
    b.stage(&named(&scenario, "Mine"), 4);
    b.write_waiting();
    let conflict = b.take_conflict().expect("a conflict");
    let shown = b.take_theirs(&conflict).expect("their version opens");
    assert_eq!(shown.name, "Theirs");
    assert!(!b.has_unsaved());
}

#[test]
fn a_scenario_deleted_in_another_tab_stays_open_here_and_is_stored_again_on_edit() {
    let (mut a, store, scenario) = first_visit();
    let mut b = Session::start(Rc::clone(&store), 2).session;
    let id = a.current().cloned().expect("open");
    a.delete().expect("the next scenario opens");
    assert_eq!(
        b.follow_other_tab(Some(&key_for(&id))),
        None,
        "stays on screen"
    );
    assert_eq!(b.current(), None);
    assert!(words(&b)[0].starts_with("This scenario was deleted in another tab."));
    b.stage(&scenario, 3);
    b.write_waiting();
    assert!(b.current().is_some_and(|new| *new != id));
    assert_eq!(b.status().open, None);
}

#[test]
fn a_cleared_storage_or_a_foreign_entry_is_reported_when_followed() {
    let (_, store, _) = first_visit();
    let mut b = Session::start(Rc::clone(&store), 2).session;
    let key = format!("{SCENARIO_PREFIX}not-an-id");
    store.borrow_mut().insert_raw(&key, "{}");
    assert_eq!(b.follow_other_tab(None), None);
    assert_eq!(b.set_aside().len(), 1);
    assert_eq!(b.notices().len(), 1, "{:?}", words(&b));
    assert!(b.notices()[0].warning);
}

#[test]
fn catching_up_after_the_tab_was_hidden_shows_the_other_tabs_version() {
    let (mut a, store, scenario) = first_visit();
    let mut b = Session::start(Rc::clone(&store), 2).session;
    a.stage(&named(&scenario, "Written while B was hidden"), 3);
    a.write_waiting();
    let shown = b.catch_up().expect("the open scenario changed");
    assert_eq!(shown.name, "Written while B was hidden");
    assert_eq!(b.catch_up(), None, "nothing new the second time");
}

#[test]
fn a_delete_opens_the_next_scenario_and_can_be_undone() {
    let (mut session, _, scenario) = first_visit();
    let deleted = session.current().cloned().expect("open");
    let count = session.list("").len();
    let next = session.delete().expect("the next scenario opens");
    assert_ne!(next, scenario);
    assert_eq!(session.list("").len(), count - 1);
    let notice = session.notices().last().cloned().expect("a notice");
    assert_eq!(notice.text, format!("Deleted \"{}\".", scenario.name));
    assert_eq!(notice.action, Some(NoticeAction::UndoDelete));
    assert!(!notice.warning);

    let back = session.undo_delete().expect("the deleted scenario opens");
    assert_eq!(back, scenario);
    assert_eq!(session.current(), Some(&deleted));
    assert_eq!(session.list("").len(), count);
    assert_eq!(session.undo_delete(), None, "only one delete to undo");
    assert_eq!(
        session.notices().last().map(|n| n.text.clone()),
        Some("there is no deleted scenario to restore".to_string())
    );
}

#[test]
fn deleting_the_last_scenario_opens_a_new_untitled_one() {
    let (mut session, _, _) = first_visit();
    for _ in 0..DEMO_FILES.len() - 1 {
        session.delete().expect("another demo opens");
    }
    assert_eq!(session.delete(), Some(Scenario::untitled()));
    assert_eq!(session.current(), None);
    assert_eq!(session.delete(), None, "nothing open to delete");
}

#[test]
fn erase_removes_everything_and_says_how_much() {
    let (mut session, store, _) = first_visit();
    store.borrow_mut().insert_raw("other-app/keep", "x");
    let shown = session.erase_all().expect("an untitled scenario");
    assert_eq!(shown, Scenario::untitled());
    // Seven demos and the settings.
    assert_eq!(
        words(&session),
        ["Erased all of clearspan's data on this device (8 stored items)."]
    );
    assert!(session.list("").is_empty());
    assert_eq!(store.borrow().raw("other-app/keep"), Some("x"));
    let mut again = Session::start(Rc::clone(&store), 9);
    again.session.import_waiting_demos(9);
    assert_eq!(
        again.session.list("").len(),
        DEMO_FILES.len(),
        "a first visit again"
    );

    store.borrow_mut().set_unavailable(true);
    let mut blocked = again.session;
    let before = blocked.list("").len();
    assert_eq!(blocked.erase_all(), None);
    assert_eq!(blocked.list("").len(), before, "nothing is lost by half");
    assert_eq!(
        words(&blocked).last(),
        Some(&StoreError::Unavailable.to_string())
    );
}

#[test]
fn an_import_is_summed_up_in_one_notice_and_opens_what_it_added() {
    let (mut session, _, _) = first_visit();
    let file = session.export_all(2).expect("exports");
    let shown = session.import(&file, 3).expect("the first import opens");
    let notice = session.notices().last().cloned().expect("a notice");
    assert_eq!(session.notices().len(), 1);
    assert_eq!(
        notice.text,
        format!(
            "Imported {} scenarios; {} renamed because the name was taken.",
            DEMO_FILES.len(),
            DEMO_FILES.len()
        )
    );
    assert_eq!(notice.details.len(), DEMO_FILES.len());
    assert_eq!(notice.more, 0);
    assert_eq!(open_name(&session), Some(shown.name.clone()));
    assert!(shown.name.ends_with("(2)"), "{}", shown.name);

    let opened = session.current().cloned();
    assert_eq!(session.import("{ not json", 4), None);
    assert!(words(&session)[1].starts_with("Nothing was imported: "));
    assert_eq!(session.current(), opened.as_ref(), "nothing else opens");
    session.import_unreadable("the file is larger than allowed");
    assert_eq!(
        words(&session)[2],
        "Nothing was imported: the file is larger than allowed."
    );
}

#[test]
fn notes_and_exports_need_a_stored_entry() {
    let (mut session, _, scenario) = first_visit();
    session.set_note("night shift", 2);
    let id = session.current().cloned().expect("open");
    let summary = session
        .list("night")
        .into_iter()
        .next()
        .expect("found by its note");
    assert_eq!((summary.id, summary.note.as_str()), (id, "night shift"));
    let (file_name, text) = session.export_current(3).expect("a file");
    assert_eq!(file_name, file_name_for(&scenario.name));
    assert!(text.contains("night shift"));

    session.erase_all();
    session.set_note("lost", 4);
    assert_eq!(session.export_current(5), None);
    assert_eq!(
        words(&session)[1..],
        [
            "Edit the scenario once so it is stored, then add a note.",
            "Edit the scenario once so it is stored, then export it.",
        ]
    );
}

#[test]
fn duplicate_opens_a_copy_with_a_free_name_and_new_opens_an_untitled_scenario() {
    let (mut session, _, scenario) = first_visit();
    let copy = session.duplicate(2).expect("the copy opens");
    assert_eq!(copy.name, format!("{} (2)", scenario.name));
    let fresh = session.create_untitled(3).expect("a new scenario opens");
    assert_eq!(fresh, Scenario::untitled());
    assert_eq!(open_name(&session).as_deref(), Some("Untitled scenario"));
    assert_eq!(session.list("").len(), DEMO_FILES.len() + 2);
    assert_eq!(session.status().open, None, "both are stored");
}

#[test]
fn a_set_aside_entry_can_be_discarded_and_notices_dismissed() {
    let store = shared();
    let key = format!("{SCENARIO_PREFIX}broken");
    store.borrow_mut().insert_raw(&key, "not json");
    let mut session = Session::start(Rc::clone(&store), 1).session;
    assert_eq!(session.set_aside().len(), 1);
    let id = session.notices()[0].id;
    session.discard_set_aside(&key);
    assert!(session.set_aside().is_empty());
    assert_eq!(store.borrow().raw(&key), None);
    session.dismiss(id);
    assert!(session.notices().is_empty());
}
