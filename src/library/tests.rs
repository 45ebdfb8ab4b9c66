//! The library's fault cases, each asserting what is kept and what the user
//! is told: corrupt, foreign and future entries, full and unavailable
//! storage, two tabs writing one entry, name clashes and broken imports.
//! Two "tabs" are two libraries over clones of one shared memory store.

use super::*;
use crate::scenario::Scenario;
use serde_json::{json, Value};
use std::cell::RefCell;
use std::rc::Rc;

const ENTRY_V1: &str = include_str!("../../tests/fixtures/saved/entry-v1.json");

fn sample(name: &str) -> Scenario {
    let mut s = read_entry(ENTRY_V1).expect("fixture loads").scenario;
    s.name = name.to_string();
    s
}

fn shared() -> SharedMemoryStore {
    Rc::new(RefCell::new(MemoryStore::new()))
}

fn names<S: KeyValueStore>(lib: &Library<S>) -> Vec<String> {
    lib.list("").into_iter().map(|s| s.name).collect()
}

fn contains(message: &str, part: &str) {
    assert!(message.contains(part), "expected {part:?} in {message:?}");
}

/// A library holding scenarios "A" (t=1), "B" (t=2) over a shared store.
fn two_entries() -> (
    Library<SharedMemoryStore>,
    SharedMemoryStore,
    EntryId,
    EntryId,
) {
    let store = shared();
    let (mut lib, _) = Library::open(Rc::clone(&store));
    let (a, r) = lib.create(sample("A"), "", 1);
    assert_eq!(r, Ok(Persisted::Stored));
    let (b, r) = lib.create(sample("B"), "", 2);
    assert_eq!(r, Ok(Persisted::Stored));
    (lib, store, a, b)
}

#[test]
fn entries_survive_a_reopen_sorted_by_last_change() {
    let (mut lib, store, a, _) = two_entries();
    assert_eq!(lib.rename(&a, "A renamed", 3), Ok(Persisted::Stored));
    let (again, report) = Library::open(store);
    assert_eq!(
        report,
        LoadReport {
            loaded: 2,
            ..LoadReport::default()
        }
    );
    assert!(report.messages().is_empty());
    assert_eq!(names(&again), ["A renamed", "B"]);
    assert_eq!(again.get(&a).map(|e| e.revision), Some(2));
}

#[test]
fn list_filter_matches_every_word_in_name_note_and_tasks() {
    let (mut lib, _, a, _) = two_entries();
    assert_eq!(
        lib.set_note(&a, "Workstation 4, night shift", 5),
        Ok(Persisted::Stored)
    );
    let check = |filter: &str, expected: &[&str]| {
        let found: Vec<String> = lib.list(filter).into_iter().map(|s| s.name).collect();
        assert_eq!(found, expected, "filter {filter:?}");
    };
    check("", &["A", "B"]);
    check("night", &["A"]);
    check("WORKSTATION shift", &["A"]);
    check("wall clock", &["A", "B"]);
    check("night book", &["A"]);
    check("nothing like this", &[]);
}

#[test]
fn corrupt_foreign_and_future_entries_are_set_aside_and_the_rest_load() {
    let (_, store, a, _) = two_entries();
    let future = ENTRY_V1.replace("\"version\": 1", "\"version\": 9");
    let cases = [
        (
            "clearspan/scenario/broken",
            "{\"format\": \"clearspan-sc",
            "not valid JSON",
        ),
        (
            "clearspan/scenario/foreign",
            "{\"todo\": [\"milk\"]}",
            "not written by clearspan",
        ),
        (
            "clearspan/scenario/future",
            future.as_str(),
            "newer clearspan (format version 9)",
        ),
        (
            "clearspan/scenario/Bad Key",
            ENTRY_V1,
            "storage key is not one clearspan makes",
        ),
    ];
    for (key, raw, _) in &cases {
        store.borrow_mut().insert_raw(key, raw);
    }
    store.borrow_mut().insert_raw("someone-else/setting", "x");
    let (mut lib, report) = Library::open(Rc::clone(&store));
    assert_eq!(report.loaded, 2, "both good entries load");
    assert_eq!(report.set_aside.len(), cases.len());
    for (key, raw, reason) in &cases {
        let found = report
            .set_aside
            .iter()
            .find(|s| s.key == *key)
            .expect("reported");
        assert_eq!(found.raw, *raw, "raw text kept for recovery");
        contains(&found.to_string(), reason);
        contains(
            &found.to_string(),
            "Its text is kept unchanged; download it",
        );
        assert_eq!(
            store.borrow().raw(key),
            Some(*raw),
            "left untouched in storage"
        );
    }
    // Work goes on around them, and a new entry never takes their keys.
    assert_eq!(lib.save(&a, sample("A2"), 9), Ok(Persisted::Stored));
    assert_eq!(lib.discard_set_aside("clearspan/scenario/broken"), Ok(()));
    assert_eq!(store.borrow().raw("clearspan/scenario/broken"), None);
    assert_eq!(lib.set_aside().len(), cases.len() - 1);
}

#[test]
fn full_storage_keeps_changes_in_memory_and_says_to_export() {
    let (mut lib, store, a, _) = two_entries();
    let used = store.borrow().used_bytes();
    store.borrow_mut().set_capacity(Some(used + 10));
    let mut bigger = sample("A");
    bigger.tasks.push(bigger.tasks[0].clone());
    let result = lib.save(&a, bigger.clone(), 5);
    assert_eq!(result, Ok(Persisted::KeptInMemory(StoreError::Full)));
    assert_eq!(
        lib.get(&a).map(|e| &e.scenario),
        Some(&bigger),
        "kept in memory"
    );
    assert_eq!(lib.unsaved_ids(), vec![a.clone()]);
    assert_eq!(lib.storage_problem(), Some(StoreError::Full));
    contains(
        &StoreError::Full.to_string(),
        "storage for this app is full",
    );
    contains(
        &StoreError::Full.to_string(),
        "export your scenarios to a file now",
    );
    // Export still works from memory, with the unsaved change in it.
    let file = lib.export_all(6).expect("exports");
    let batch = parse_import(&file).expect("export reads back");
    assert_eq!(batch.accepted.len(), 2);
    assert!(batch.accepted.iter().any(|i| i.scenario == bigger));
    // Once space is freed the pending change is written.
    store.borrow_mut().set_capacity(None);
    let retried = lib.save_unsaved();
    assert_eq!(retried, [(a.clone(), Ok(Persisted::Stored))]);
    assert!(lib.unsaved_ids().is_empty());
    assert_eq!(lib.storage_problem(), None);
}

#[test]
fn unavailable_storage_runs_from_memory_and_says_so() {
    let store = shared();
    store.borrow_mut().set_unavailable(true);
    let (mut lib, report) = Library::open(Rc::clone(&store));
    assert_eq!(report.storage, Some(StoreError::Unavailable));
    contains(
        &report.messages()[0],
        "does not let this app use its storage",
    );
    contains(
        &report.messages()[0],
        "export your scenarios to a file before closing it",
    );
    let (id, result) = lib.create(sample("Offline"), "", 1);
    assert_eq!(result, Ok(Persisted::KeptInMemory(StoreError::Unavailable)));
    assert_eq!(names(&lib), ["Offline"]);
    assert_eq!(
        lib.delete(&id),
        Ok(Persisted::KeptInMemory(StoreError::Unavailable))
    );
    assert_eq!(lib.undo_delete().map(|(i, _)| i), Ok(id.clone()));
    assert!(lib.export(&[id], 2).is_ok());
    assert_eq!(lib.erase_all_local_data(), Err(StoreError::Unavailable));
    assert_eq!(
        names(&lib),
        ["Offline"],
        "a failed erase loses nothing in memory"
    );
}

#[test]
fn two_tabs_writing_one_entry_make_a_conflict_not_a_loss() {
    let (mut tab1, store, a, _) = two_entries();
    let (mut tab2, _) = Library::open(Rc::clone(&store));
    assert_eq!(
        tab2.save(&a, sample("A from tab 2"), 10),
        Ok(Persisted::Stored)
    );
    let Err(LibraryError::Conflict(conflict)) = tab1.save(&a, sample("A from tab 1"), 11) else {
        panic!("tab 1 must not overwrite tab 2's newer revision")
    };
    assert_eq!(
        conflict.theirs,
        Theirs::Newer {
            revision: 2,
            name: "A from tab 2".to_string()
        }
    );
    contains(
        &conflict.to_string(),
        "\"A from tab 1\" was changed in another tab or window",
    );
    contains(
        &conflict.to_string(),
        "Keep yours as a copy, or take theirs",
    );
    assert_eq!(
        tab1.get(&a).map(|e| e.scenario.name.as_str()),
        Some("A from tab 1")
    );
    let stored = read_entry(store.borrow().raw(&key_for(&a)).expect("stored")).expect("reads");
    assert_eq!(
        stored.scenario.name, "A from tab 2",
        "storage still holds tab 2's version"
    );
    // A reload while the change is unsaved is refused the same way.
    assert!(matches!(tab1.reload(&a), Err(LibraryError::Conflict(_))));
    // Keep mine as a copy: both versions survive.
    let (copy, result) = tab1.keep_mine_as_copy(&a, 12).expect("resolves");
    assert_eq!(result, Ok(Persisted::Stored));
    assert_eq!(
        tab1.get(&copy).map(|e| e.scenario.name.as_str()),
        Some("A from tab 1")
    );
    assert_eq!(
        tab1.get(&a).map(|e| e.scenario.name.as_str()),
        Some("A from tab 2")
    );
    assert!(tab1.unsaved_ids().is_empty());
}

#[test]
fn take_theirs_drops_mine_and_follows_storage() {
    let (mut tab1, store, a, _) = two_entries();
    let (mut tab2, _) = Library::open(Rc::clone(&store));
    assert_eq!(tab2.save(&a, sample("theirs"), 10), Ok(Persisted::Stored));
    assert!(tab1.save(&a, sample("mine"), 11).is_err());
    assert_eq!(tab1.take_theirs(&a), Ok(Reloaded::Updated));
    assert_eq!(
        tab1.get(&a).map(|e| e.scenario.name.as_str()),
        Some("theirs")
    );
    assert_eq!(
        tab1.save(&a, sample("mine again"), 12),
        Ok(Persisted::Stored)
    );
}

#[test]
fn storage_events_reload_one_entry() {
    let (mut tab1, store, a, b) = two_entries();
    let (mut tab2, _) = Library::open(Rc::clone(&store));
    assert_eq!(tab1.reload(&a), Ok(Reloaded::Unchanged));
    assert_eq!(tab2.save(&a, sample("A edited"), 10), Ok(Persisted::Stored));
    assert_eq!(tab1.reload(&a), Ok(Reloaded::Updated));
    assert_eq!(
        tab1.get(&a).map(|e| e.scenario.name.as_str()),
        Some("A edited")
    );
    let (c, _) = tab2.create(sample("C"), "", 11);
    assert_eq!(id_for_key(&key_for(&c)), Some(c.clone()));
    assert_eq!(tab1.reload(&c), Ok(Reloaded::Added));
    assert_eq!(tab2.delete(&b), Ok(Persisted::Stored));
    assert_eq!(tab1.reload(&b), Ok(Reloaded::Removed));
    store.borrow_mut().insert_raw(&key_for(&a), "garbage");
    assert_eq!(tab1.reload(&a), Ok(Reloaded::SetAside));
    assert_eq!(tab1.set_aside()[0].raw, "garbage");
    assert_eq!(names(&tab1), ["C"]);
    assert_eq!(id_for_key("other/key"), None);
}

#[test]
fn deleted_elsewhere_while_editing_here_is_a_conflict() {
    let (mut tab1, store, a, _) = two_entries();
    let (mut tab2, _) = Library::open(Rc::clone(&store));
    assert_eq!(tab2.delete(&a), Ok(Persisted::Stored));
    let Err(LibraryError::Conflict(c)) = tab1.save(&a, sample("still mine"), 5) else {
        panic!("must not recreate silently")
    };
    assert_eq!(c.theirs, Theirs::Removed);
    contains(&c.to_string(), "was deleted in another tab or window");
    let (copy, _) = tab1.keep_mine_as_copy(&a, 6).expect("resolves");
    assert_eq!(tab1.get(&a), None);
    assert_eq!(
        tab1.get(&copy).map(|e| e.scenario.name.as_str()),
        Some("still mine")
    );
}

#[test]
fn delete_keeps_the_entry_until_undo_or_discard() {
    let (mut lib, store, a, _) = two_entries();
    assert_eq!(lib.delete(&a), Ok(Persisted::Stored));
    assert_eq!(store.borrow().raw(&key_for(&a)), None);
    assert_eq!(names(&lib), ["B"]);
    assert_eq!(
        lib.last_deleted().map(|e| e.scenario.name.as_str()),
        Some("A")
    );
    let (restored, result) = lib.undo_delete().expect("undo");
    assert_eq!(
        (restored.clone(), result),
        (a.clone(), Ok(Persisted::Stored))
    );
    assert_eq!(names(&lib), ["B", "A"]);
    assert!(store.borrow().raw(&key_for(&a)).is_some());
    assert_eq!(lib.delete(&a), Ok(Persisted::Stored));
    lib.discard_deleted();
    assert_eq!(lib.undo_delete(), Err(LibraryError::NothingToUndo));
    contains(
        &LibraryError::NothingToUndo.to_string(),
        "no deleted scenario",
    );
}

#[test]
fn rename_and_duplicate_check_names() {
    let (mut lib, _, a, _) = two_entries();
    let long = "x".repeat(crate::scenario::MAX_NAME_CHARS + 1);
    assert_eq!(lib.rename(&a, &long, 3), Err(LibraryError::NameTooLong));
    let (copy, result) = lib.duplicate(&a, 4).expect("duplicates");
    assert_eq!(result, Ok(Persisted::Stored));
    assert_eq!(
        lib.get(&copy).map(|e| e.scenario.name.as_str()),
        Some("A (2)")
    );
    let gone = EntryId::from_time_and_counter(0, 99);
    assert_eq!(
        lib.rename(&gone, "x", 5),
        Err(LibraryError::NotFound(gone.clone()))
    );
}

#[test]
fn a_value_that_would_not_read_back_is_never_written() {
    let (mut lib, store, a, _) = two_entries();
    let before = store.borrow().raw(&key_for(&a)).map(str::to_string);
    let mut bad = sample("A");
    bad.tasks[0].distance_m = f64::NAN;
    let Err(LibraryError::NotStorable(errors)) = lib.save(&a, bad, 5) else {
        panic!("NaN must not be written as null")
    };
    assert_eq!(errors[0].path, "scenario.tasks[0].distance_m");
    contains(
        &LibraryError::NotStorable(errors).to_string(),
        "cannot be saved until a value is corrected",
    );
    assert_eq!(store.borrow().raw(&key_for(&a)).map(str::to_string), before);
    assert_eq!(lib.unsaved_ids(), [a]);
}

#[test]
fn erase_removes_only_the_apps_own_keys() {
    let (mut lib, store, _, _) = two_entries();
    store.borrow_mut().insert_raw("clearspan/settings", "{}");
    store
        .borrow_mut()
        .insert_raw("clearspan/scenario/junk", "junk");
    store.borrow_mut().insert_raw("another-app/data", "keep me");
    assert_eq!(lib.erase_all_local_data(), Ok(4));
    assert!(lib.list("").is_empty());
    assert_eq!(
        store.borrow().keys(),
        Ok(vec!["another-app/data".to_string()])
    );
}

#[test]
fn import_renames_clashes_takes_drafts_as_drafts_and_refuses_what_does_not_decode() {
    let (mut lib, store, _, _) = two_entries();
    let mut draft = sample("Draft one");
    draft.tasks[0].distance_m = -3.0;
    let items: Vec<ExportItem> = [sample("A"), draft, sample("A"), sample("New")]
        .into_iter()
        .map(|scenario| ExportItem {
            note: "n".into(),
            created_ms: Some(7),
            changed_ms: None,
            scenario,
        })
        .collect();
    let mut file: Value =
        serde_json::from_str(&encode_export(&items, 20).expect("encodes")).expect("JSON");
    file["scenarios"]
        .as_array_mut()
        .expect("a list")
        .push(json!({"scenario": {"name": "Not one", "tasks": 3}}));
    let batch = parse_import(&file.to_string()).expect("reads");
    assert_eq!(batch.accepted.len(), 4);
    assert_eq!(batch.numbers, [1, 2, 3, 4]);
    assert_eq!(batch.rejected.len(), 1);
    let rejected = batch.rejected[0].to_string();
    contains(
        &rejected,
        "Scenario 5 (\"Not one\") was not imported: scenarios[4].scenario",
    );
    let report = lib.import(batch, 30);
    let added: Vec<(&str, Option<&str>, bool)> = report
        .added
        .iter()
        .map(|i| (i.name.as_str(), i.renamed_from.as_deref(), i.is_draft()))
        .collect();
    assert_eq!(
        added,
        [
            ("A (2)", Some("A"), false),
            ("Draft one", None, true),
            ("A (3)", Some("A"), false),
            ("New", None, false)
        ]
    );
    let lines = report.messages();
    assert_eq!(
        lines[0],
        "Imported \"A\" as \"A (2)\" because that name was already taken"
    );
    assert_eq!(
        lines[1],
        "Imported \"Draft one\" as a draft to correct (tasks[0].distance_m: -3 is outside the \
         allowed range 0.1 to 1000 m)"
    );
    assert_eq!(lines[3], "Imported \"New\"");
    assert_eq!(lines[4], rejected);
    assert_eq!(
        report.headline(),
        "Imported 4 scenarios (1 as a draft to correct); 2 renamed because the name was taken; \
         1 was not imported."
    );
    assert!(report.needs_attention());
    // The original "A" is untouched, the import is stored, the draft marked.
    assert_eq!(
        names(&lib),
        ["A (2)", "A (3)", "Draft one", "New", "B", "A"]
    );
    assert!(lib.list("Draft").iter().all(|s| s.draft));
    let (reopened, _) = Library::open(store);
    assert_eq!(reopened.list("").len(), 6);
    assert_eq!(
        reopened.get(&report.added[3].id).map(|e| e.created_ms),
        Some(7)
    );
}

#[test]
fn a_backup_comes_back_whole_drafts_and_times_included() {
    let (mut lib, _, a, _) = two_entries();
    let mut draft = sample("x".repeat(crate::scenario::MAX_NAME_CHARS + 7).as_str());
    draft.wearer.age_years = 130.0;
    draft.tasks[0].name = String::new();
    assert_eq!(lib.save(&a, draft, 3), Ok(Persisted::Stored));
    assert_eq!(lib.set_note(&a, "kept as typed", 4), Ok(Persisted::Stored));
    let backup = lib.export_all(5).expect("exports");

    let (mut restored, _) = Library::open(MemoryStore::new());
    let report = restored.import(parse_import(&backup).expect("reads"), 99);
    assert_eq!(report.added.len(), 2);
    assert!(report.rejected.is_empty());
    assert_eq!(report.added.iter().filter(|i| i.is_draft()).count(), 1);
    assert_eq!(
        restored.export_all(5).expect("exports"),
        backup,
        "byte for byte"
    );
}

#[test]
fn import_refusals_say_what_is_wrong() {
    let deep = format!("{}{}", "[".repeat(40), "]".repeat(40));
    let big = " ".repeat(MAX_DOCUMENT_BYTES + 1);
    let cases: [(&str, &str); 6] = [
        (&deep, "more than 32 levels deep"),
        (&big, "more than the 2 MiB allowed"),
        ("[1, 2", "not valid JSON"),
        ("{\"rows\": []}", "not written by clearspan"),
        (
            "{\"format\": \"clearspan-scenario-export\", \"version\": 4, \"scenarios\": []}",
            "newer clearspan (format version 4)",
        ),
        (
            "{\"format\": \"picture\", \"version\": 1}",
            "format is \"picture\"",
        ),
    ];
    for (text, expected) in cases {
        contains(
            &parse_import(text).expect_err("refused").to_string(),
            expected,
        );
    }
    let empty = parse_import(
        "{\"format\": \"clearspan-scenario-export\", \"version\": 1, \"scenarios\": []}",
    )
    .expect("an empty export is fine");
    let (mut lib, _) = Library::open(MemoryStore::new());
    assert_eq!(
        lib.import(empty, 1).messages(),
        ["The file holds no scenarios."]
    );
}

#[test]
fn an_import_into_full_storage_reports_each_scenario_kept_in_memory() {
    let store = shared();
    store.borrow_mut().set_capacity(Some(10));
    let (mut lib, _) = Library::open(Rc::clone(&store));
    let file = encode_export(
        &[ExportItem {
            note: String::new(),
            created_ms: None,
            changed_ms: None,
            scenario: sample("X"),
        }],
        1,
    )
    .expect("encodes");
    let report = lib.import(parse_import(&file).expect("reads"), 2);
    assert_eq!(
        report.added[0].persisted,
        Ok(Persisted::KeptInMemory(StoreError::Full))
    );
    contains(
        &report.messages()[0],
        "Imported \"X\", but the browser's storage for this app is full",
    );
    assert_eq!(names(&lib), ["X"]);
}

/// Every source file of the library, with its text.
fn library_sources() -> Vec<(std::path::PathBuf, String)> {
    fn walk(dir: &std::path::Path, out: &mut Vec<(std::path::PathBuf, String)>) {
        let entries = std::fs::read_dir(dir).expect("source folder is listable");
        for path in entries.filter_map(|e| e.ok()).map(|e| e.path()) {
            if path.is_dir() {
                walk(&path, out);
            } else if path.extension().is_some_and(|x| x == "rs") {
                let text = std::fs::read_to_string(&path).expect("source is readable");
                out.push((path, text));
            }
        }
    }
    let mut out = Vec::new();
    walk(
        &std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("src/library"),
        &mut out,
    );
    out
}

/// Invariant: the library is pure; only the browser adapter touches the
/// browser. The crate names are assembled here so this file passes its own check.
#[test]
fn library_sources_name_no_browser_crate_and_open_with_a_doc_paragraph() {
    let forbidden: Vec<String> = [
        ["lep", "tos"],
        ["web", "_sys"],
        ["wasm", "_bindgen"],
        ["js", "_sys"],
        ["glo", "o"],
    ]
    .iter()
    .map(|parts| parts.concat())
    .collect();
    let sources = library_sources();
    assert!(sources.len() >= 10, "found the sources");
    for (path, text) in sources {
        for name in &forbidden {
            assert!(
                !text.contains(name.as_str()),
                "{} mentions {name}",
                path.display()
            );
        }
        assert!(
            text.starts_with("//!"),
            "{} opens with a //! paragraph",
            path.display()
        );
    }
}

#[test]
fn undo_of_a_delete_that_storage_refused_does_not_conflict_with_itself() {
    let (mut lib, store, a, _) = two_entries();
    store.borrow_mut().set_unavailable(true);
    assert_eq!(
        lib.delete(&a),
        Ok(Persisted::KeptInMemory(StoreError::Unavailable))
    );
    store.borrow_mut().set_unavailable(false);
    let (restored, result) = lib.undo_delete().expect("undo");
    assert_eq!((restored, result), (a.clone(), Ok(Persisted::Stored)));
    assert_eq!(lib.save(&a, sample("A again"), 9), Ok(Persisted::Stored));
}

#[test]
fn a_misspelt_field_is_imported_with_a_warning_naming_its_path() {
    // Written here from the starting scenario, so no fixture hides the typo.
    let item = ExportItem {
        note: String::new(),
        created_ms: None,
        changed_ms: None,
        scenario: Scenario::untitled(),
    };
    let text = encode_export(&[item], 1).expect("encodes");
    let mut file: Value = serde_json::from_str(&text).expect("JSON");
    let wearer = &mut file["scenarios"][0]["scenario"]["wearer"];
    if let Some(w) = wearer.as_object_mut() {
        w.remove("measured_amplitude");
    }
    wearer["measured_amplitud"] =
        json!({"dioptres": 2.5, "method": "push_up", "plane": "spectacle"});
    let batch = parse_import(&file.to_string()).expect("reads");
    assert_eq!(batch.accepted.len(), 1);
    assert_eq!(batch.accepted[0].scenario.wearer.measured_amplitude, None);
    assert_eq!(
        batch.unknown_fields,
        ["scenarios[0].scenario.wearer.measured_amplitud"]
    );
    let (mut lib, _) = Library::open(MemoryStore::new());
    let report = lib.import(batch, 2);
    assert_eq!(report.messages(), ["Imported \"Untitled scenario\""]);
    assert_eq!(
        report.unknown_fields_notice().as_deref(),
        Some(
            "1 field in the file is not part of clearspan's format, so it was ignored \
             (a misspelling?): scenarios[0].scenario.wearer.measured_amplitud."
        )
    );
}

#[test]
fn the_unknown_field_notice_names_the_first_few_and_counts_the_rest() {
    let report = |count: usize| ImportReport {
        added: Vec::new(),
        rejected: Vec::new(),
        unknown_fields: (0..count).map(|i| format!("f{i}")).collect(),
    };
    assert_eq!(report(0).unknown_fields_notice(), None);
    assert_eq!(
        report(5).unknown_fields_notice().as_deref(),
        Some(
            "5 fields in the file are not part of clearspan's format, so they were ignored \
             (misspellings?): f0, f1, f2, f3, f4."
        )
    );
    assert_eq!(
        report(7).unknown_fields_notice().as_deref(),
        Some(
            "7 fields in the file are not part of clearspan's format, so they were ignored \
             (misspellings?): f0, f1, f2, f3, f4 and 2 more."
        )
    );
}

#[test]
fn a_refused_edit_stays_marked_whatever_is_open_and_the_next_write_retries_it() {
    let (mut lib, store, a, b) = two_entries();
    assert_eq!(
        lib.save_status(Some(&a)).to_string(),
        "Saved on this device"
    );
    store.borrow_mut().set_capacity(Some(0));
    assert_eq!(
        lib.save(&a, sample("A edited"), 5),
        Ok(Persisted::KeptInMemory(StoreError::Full))
    );
    let status = lib.save_status(Some(&a));
    assert_eq!(status.open, Some(Unsaved::Refused(StoreError::Full)));
    contains(
        &status.to_string(),
        "Kept in this tab only: the browser's storage",
    );
    // Opening B must not say "Saved" without a word about A.
    let status = lib.save_status(Some(&b)).to_string();
    contains(
        &status,
        "Saved on this device; 1 other scenario is kept in this tab only: the browser's storage",
    );
    assert!(lib.has_unsaved());
    assert_eq!(
        lib.save_status(None).to_string(),
        "Kept in this tab only: not stored yet; your next edit stores it (1 other scenario is too)"
    );

    // Room again: a write of B writes A too.
    store.borrow_mut().set_capacity(None);
    assert_eq!(lib.save(&b, sample("B edited"), 6), Ok(Persisted::Stored));
    assert!(!lib.has_unsaved());
    let stored = read_entry(store.borrow().raw(&key_for(&a)).expect("stored")).expect("reads");
    assert_eq!(stored.scenario.name, "A edited");
}

#[test]
fn staged_changes_wait_until_written_and_a_refusal_stops_the_round() {
    let (mut lib, store, a, b) = two_entries();
    lib.stage(&a, sample("A staged"), 5).expect("open");
    let c = lib.create_unwritten(sample("C staged"), "", 6);
    assert_eq!(lib.save_status(Some(&a)).to_string(), "Saving…");
    assert_eq!(
        lib.stage(&b, sample("B"), 7),
        Ok(()),
        "unchanged: nothing to write"
    );
    assert_eq!(lib.unsaved_ids().len(), 2);

    store.borrow_mut().set_capacity(Some(0));
    let round = lib.save_unsaved();
    assert_eq!(
        round.len(),
        1,
        "storage refused the first, so the rest wait"
    );
    assert_eq!(lib.unsaved_ids().len(), 2);
    assert_eq!(
        lib.save_status(Some(&c)).open,
        Some(Unsaved::Refused(StoreError::Full)),
        "the one not tried is marked with the same refusal"
    );

    store.borrow_mut().set_capacity(None);
    let round = lib.save_unsaved();
    assert_eq!(
        round,
        [
            (a.clone(), Ok(Persisted::Stored)),
            (c, Ok(Persisted::Stored))
        ]
    );
    let (reopened, _) = Library::open(store);
    assert_eq!(names(&reopened), ["C staged", "A staged", "B"]);
}

#[test]
fn a_write_lost_to_another_tab_writing_the_same_revision_is_a_conflict() {
    let (mut tab1, store, a, _) = two_entries();
    assert_eq!(
        tab1.save(&a, sample("A from tab 1"), 10),
        Ok(Persisted::Stored)
    );
    // Tab 2 had not seen that write and wrote the same revision at the same
    // moment, as two browser tabs can; its text replaced tab 1's.
    let key = key_for(&a);
    let mine = store.borrow().raw(&key).expect("stored").to_string();
    let theirs = mine.replace("A from tab 1", "A from tab 2");
    store.borrow_mut().insert_raw(&key, &theirs);

    let Err(LibraryError::Conflict(c)) = tab1.reload(&a) else {
        panic!("the lost write must be reported")
    };
    assert_eq!(
        c.theirs,
        Theirs::Newer {
            revision: 2,
            name: "A from tab 2".into()
        }
    );
    assert_eq!(
        tab1.get(&a).map(|e| e.scenario.name.as_str()),
        Some("A from tab 1"),
        "this tab keeps its version"
    );
    assert_eq!(tab1.save_status(Some(&a)).open, Some(Unsaved::Conflict));
    // Its next edit does not overwrite the other tab's text either.
    assert!(matches!(
        tab1.save(&a, sample("A again"), 11),
        Err(LibraryError::Conflict(_))
    ));
    assert_eq!(store.borrow().raw(&key), Some(theirs.as_str()));
    let (copy, result) = tab1.keep_mine_as_copy(&a, 12).expect("resolves");
    assert_eq!(result, Ok(Persisted::Stored));
    assert_eq!(
        tab1.get(&copy).map(|e| e.scenario.name.as_str()),
        Some("A again")
    );

    // A later write that saw tab 1's is simply newer.
    let (mut tab3, _) = Library::open(Rc::clone(&store));
    assert_eq!(
        tab3.save(&copy, sample("copy edited"), 13),
        Ok(Persisted::Stored)
    );
    assert_eq!(tab1.reload(&copy), Ok(Reloaded::Updated));
    let (changed, conflicts) = tab1.reload_open();
    assert!(changed.is_empty() && conflicts.is_empty());
}

#[test]
fn a_stored_revision_at_the_integer_maximum_keeps_the_check_on() {
    let store = shared();
    let (mut setup, _) = Library::open(Rc::clone(&store));
    let (a, _) = setup.create(sample("A"), "", 1);
    let key = key_for(&a);
    let at_max = store
        .borrow()
        .raw(&key)
        .expect("stored")
        .replace("\"revision\":1", &format!("\"revision\":{}", u64::MAX));
    store.borrow_mut().insert_raw(&key, &at_max);

    let (mut tab1, _) = Library::open(Rc::clone(&store));
    let (mut tab2, _) = Library::open(Rc::clone(&store));
    assert_eq!(
        tab1.save(&a, sample("A from tab 1"), 2),
        Ok(Persisted::Stored)
    );
    assert_eq!(tab1.get(&a).map(|e| e.revision), Some(u64::MAX));
    assert!(
        matches!(
            tab2.save(&a, sample("A from tab 2"), 3),
            Err(LibraryError::Conflict(_))
        ),
        "the same revision number does not hide tab 1's write"
    );
    assert_eq!(tab2.take_theirs(&a), Ok(Reloaded::Updated));
    assert_eq!(
        tab2.save(&a, sample("A from tab 2"), 4),
        Ok(Persisted::Stored)
    );
    // Tab 1 cannot tell a successor from a rival at the maximum: it asks.
    assert!(matches!(tab1.reload(&a), Err(LibraryError::Conflict(_))));
}

#[test]
fn a_file_of_many_bad_items_is_summed_up_in_one_headline_and_a_bounded_list() {
    let good = ExportItem {
        note: String::new(),
        created_ms: None,
        changed_ms: None,
        scenario: sample("Good"),
    };
    let mut file: Value =
        serde_json::from_str(&encode_export(&[good], 1).expect("encodes")).expect("JSON");
    let list = file["scenarios"].as_array_mut().expect("a list");
    list.extend((0..100_000).map(|i| json!(i)));
    let (mut lib, _) = Library::open(MemoryStore::new());
    let report = lib.import(parse_import(&file.to_string()).expect("reads"), 2);
    assert_eq!(
        report.headline(),
        "Imported 1 scenario; 100,000 were not imported."
    );
    let (lines, more) = report.details(200);
    assert_eq!(lines.len(), 200);
    assert_eq!(more, 100_001 - 200);
    assert_eq!(lines[0], "Imported \"Good\"");
    contains(&lines[1], "Scenario 2 was not imported: scenarios[1]");
}

#[test]
fn headlines_count_what_happened() {
    let (mut lib, _) = Library::open(MemoryStore::new());
    let empty = parse_import(
        "{\"format\": \"clearspan-scenario-export\", \"version\": 2, \"scenarios\": []}",
    )
    .expect("reads");
    let report = lib.import(empty, 1);
    assert_eq!(
        report.headline(),
        "Nothing was imported: the file holds no scenarios."
    );
    assert!(!report.needs_attention());
    assert_eq!(
        report.details(10),
        (vec!["The file holds no scenarios.".to_string()], 0)
    );
}
