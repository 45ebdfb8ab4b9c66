//! The shelf panel: the scenarios kept on this device, with new, duplicate,
//! delete (with undo), export, import, recovery of set-aside entries and
//! erasing all local data; and the notice bar that reports what happened.
//! Every action that writes runs in this tab's turn to write
//! ([`with_write_lock`]).

use super::fields::TextField;
use super::files::{download_json, read_text};
use super::locks::with_write_lock;
use super::shelf::{now_ms, NoticeAction, Shelf};
use super::state::{use_app_state, AppState};
use crate::display::{file_name_for, thousands};
use crate::library::{parse_import, EntryId, MAX_DOCUMENT_BYTES};
use crate::scenario::Scenario;
use leptos::prelude::*;
use wasm_bindgen::JsCast;

/// Opens entry `id` in the editor.
pub fn open_entry(state: AppState, id: EntryId) {
    let shelf = state.shelf;
    let scenario = shelf
        .library
        .with_untracked(|lib| lib.get(&id).map(|e| e.scenario.clone()));
    if let Some(scenario) = scenario {
        shelf.current.set(Some(id));
        state.replace_scenario(scenario);
        shelf.remember(None);
    }
}

/// Downloads every scenario as one file.
pub fn export_all(shelf: Shelf) {
    let result = shelf
        .library
        .with_untracked(|lib| lib.export_all(now_ms()))
        .map_err(|e| e.to_string())
        .and_then(|text| download_json("clearspan-all-scenarios.json", &text));
    if let Err(e) = result {
        shelf.tell(e, true, None);
    }
}

/// Restores the scenario deleted last and opens it.
pub fn undo_delete(state: AppState) {
    let shelf = state.shelf;
    with_write_lock(
        move || match shelf.library.try_update(|lib| lib.undo_delete()) {
            Some(Ok((id, persisted))) => {
                shelf.show_persisted(persisted);
                open_entry(state, id);
            }
            Some(Err(e)) => shelf.tell(e.to_string(), true, None),
            None => {}
        },
    );
}

/// Deletes entry `id` (offering Undo) and opens the next scenario.
fn delete_entry(state: AppState, id: EntryId) {
    let shelf = state.shelf;
    let name = state.scenario.with_untracked(|s| s.name.clone());
    match shelf.library.try_update(|lib| lib.delete(&id)) {
        Some(Ok(persisted)) => {
            shelf.show_persisted(Ok(persisted));
            shelf.tell(
                format!("Deleted \"{name}\"."),
                false,
                Some(NoticeAction::UndoDelete),
            );
            let next = shelf
                .library
                .with_untracked(|lib| lib.list("").first().map(|s| s.id.clone()));
            match next {
                Some(next) => open_entry(state, next),
                None => {
                    shelf.current.set(None);
                    state.replace_scenario(Scenario::untitled());
                }
            }
        }
        Some(Err(e)) => shelf.tell(e.to_string(), true, None),
        None => {}
    }
}

/// A local date and time for a timestamp in milliseconds.
fn when(ms: u64) -> String {
    js_sys::Date::new(&(ms as f64).into())
        .to_locale_string("default", &wasm_bindgen::JsValue::UNDEFINED)
        .as_string()
        .unwrap_or_default()
}

/// The notice bar: messages with their actions and a dismiss button, and the
/// conflict banner when another tab changed the open scenario.
#[component]
pub fn NoticeBar() -> impl IntoView {
    let state = use_app_state();
    let shelf = state.shelf;
    let keep_mine = move |_| {
        let Some(c) = shelf.conflict.get_untracked() else {
            return;
        };
        shelf.conflict.set(None);
        with_write_lock(move || {
            match shelf
                .library
                .try_update(|lib| lib.keep_mine_as_copy(&c.id, now_ms()))
            {
                Some(Ok((id, persisted))) => {
                    shelf.show_persisted(persisted);
                    open_entry(state, id);
                }
                Some(Err(e)) => shelf.tell(e.to_string(), true, None),
                None => {}
            }
        });
    };
    let take_theirs = move |_| {
        let Some(c) = shelf.conflict.get_untracked() else {
            return;
        };
        shelf.conflict.set(None);
        match shelf.library.try_update(|lib| lib.take_theirs(&c.id)) {
            Some(Ok(_)) => open_entry(state, c.id.clone()),
            Some(Err(e)) => shelf.tell(e.to_string(), true, None),
            None => {}
        }
    };
    view! {
        <div class="notices" role="status" aria-live="polite" data-testid="notices">
            <Show when=move || shelf.conflict.with(Option::is_some)>
                <div class="notice warning" data-testid="conflict">
                    <p>{move || shelf.conflict.get().map(|c| c.to_string())}</p>
                    <button type="button" on:click=keep_mine>"Keep mine as a copy"</button>
                    <button type="button" on:click=take_theirs>"Take theirs"</button>
                </div>
            </Show>
            <For
                each=move || shelf.notices.get()
                key=|n| n.id
                let:notice
            >
                {
                    let id = notice.id;
                    let action = notice.action.map(|a| {
                        let (words, run): (&str, Box<dyn Fn() + Send + Sync>) = match a {
                            NoticeAction::UndoDelete => ("Undo", Box::new(move || undo_delete(state))),
                            NoticeAction::ExportAll => ("Export all scenarios", Box::new(move || export_all(shelf))),
                        };
                        view! {
                            <button type="button" on:click=move |_| {
                                run();
                                shelf.dismiss(id);
                            }>{words}</button>
                        }
                    });
                    let more = notice.more;
                    let list = (!notice.details.is_empty()).then(|| view! {
                        <details class="notice-list">
                            <summary>"Show the list"</summary>
                            <ul>
                                {notice.details.into_iter().map(|line| view! { <li>{line}</li> }).collect_view()}
                            </ul>
                            {(more > 0).then(|| view! {
                                <div class="hint">{format!("and {} more, not listed here", thousands(more))}</div>
                            })}
                        </details>
                    });
                    view! {
                        <div class="notice" class:warning=notice.warning data-testid="notice">
                            <p>{notice.text}</p>
                            {list}
                            {action}
                            <button type="button" class="quiet" aria-label="Dismiss this message" on:click=move |_| shelf.dismiss(id)>
                                "Dismiss"
                            </button>
                        </div>
                    }
                }
            </For>
        </div>
    }
}

/// The shelf panel.
#[component]
pub fn ShelfPanel() -> impl IntoView {
    let state = use_app_state();
    let shelf = state.shelf;
    let filter = RwSignal::new(String::new());
    let confirming_erase = RwSignal::new(false);
    let summaries = move || shelf.library.with(|lib| lib.list(&filter.get()));
    let current = move || shelf.current.get();

    let new_scenario = move |_| {
        with_write_lock(move || {
            let created = shelf
                .library
                .try_update(|lib| lib.create(Scenario::untitled(), "", now_ms()));
            if let Some((id, persisted)) = created {
                shelf.show_persisted(persisted);
                open_entry(state, id);
            }
        });
    };
    let duplicate = move |_| {
        let Some(id) = shelf.current.get_untracked() else {
            return;
        };
        with_write_lock(move || {
            match shelf.library.try_update(|lib| lib.duplicate(&id, now_ms())) {
                Some(Ok((copy, persisted))) => {
                    shelf.show_persisted(persisted);
                    open_entry(state, copy);
                }
                Some(Err(e)) => shelf.tell(e.to_string(), true, None),
                None => {}
            }
        });
    };
    let delete = move |_| {
        let Some(id) = shelf.current.get_untracked() else {
            return;
        };
        with_write_lock(move || delete_entry(state, id));
    };
    let export_current = move |_| {
        let Some(id) = shelf.current.get_untracked() else {
            shelf.tell(
                "Edit the scenario once so it is stored, then export it.",
                false,
                None,
            );
            return;
        };
        let name = state.scenario.with_untracked(|s| s.name.clone());
        let result = shelf
            .library
            .with_untracked(|lib| lib.export(&[id], now_ms()))
            .map_err(|e| e.to_string())
            .and_then(|text| download_json(&file_name_for(&name), &text));
        if let Err(e) = result {
            shelf.tell(e, true, None);
        }
    };
    let import = move |ev: leptos::ev::Event| {
        let Some(input) = ev
            .target()
            .and_then(|t| t.dyn_into::<web_sys::HtmlInputElement>().ok())
        else {
            return;
        };
        let Some(file) = input.files().and_then(|f| f.get(0)) else {
            return;
        };
        input.set_value("");
        leptos::task::spawn_local(async move {
            let text = match read_text(file, MAX_DOCUMENT_BYTES).await {
                Ok(text) => text,
                Err(e) => {
                    shelf.tell(format!("Nothing was imported: {e}."), true, None);
                    return;
                }
            };
            match parse_import(&text) {
                Ok(batch) => with_write_lock(move || {
                    let report = shelf.library.try_update(|lib| lib.import(batch, now_ms()));
                    if let Some(report) = report {
                        shelf.tell_import(&report);
                        if let Some(first) = report.added.first() {
                            open_entry(state, first.id.clone());
                        }
                    }
                }),
                Err(e) => shelf.tell(format!("Nothing was imported: {e}"), true, None),
            }
        });
    };
    let erase = move |_| {
        confirming_erase.set(false);
        with_write_lock(
            move || match shelf.library.try_update(|lib| lib.erase_all_local_data()) {
                Some(Ok(count)) => {
                    shelf.current.set(None);
                    state.replace_scenario(Scenario::untitled());
                    shelf.tell(
                        format!(
                            "Erased all of clearspan's data on this device ({count} stored items)."
                        ),
                        false,
                        None,
                    );
                }
                Some(Err(e)) => shelf.tell(e.to_string(), true, None),
                None => {}
            },
        );
    };
    let set_aside = move || shelf.library.with(|lib| lib.set_aside().to_vec());
    let name = Signal::derive(move || state.scenario.with(|s| s.name.clone()));
    let on_name = Callback::new(move |v: String| state.edit(|s| s.name = v));
    let name_problem = Signal::derive(move || state.problem_at("name").map(|p| p.to_string()));
    let note = Signal::derive(move || {
        let id = shelf.current.get();
        shelf
            .library
            .with(|lib| id.and_then(|id| lib.get(&id).map(|e| e.note.clone())))
            .unwrap_or_default()
    });
    let no_problem = Signal::derive(|| None::<String>);
    let on_note = Callback::new(move |v: String| {
        let Some(id) = shelf.current.get_untracked() else {
            shelf.tell(
                "Edit the scenario once so it is stored, then add a note.",
                false,
                None,
            );
            return;
        };
        with_write_lock(move || {
            if let Some(result) = shelf
                .library
                .try_update(|lib| lib.set_note(&id, &v, now_ms()))
            {
                shelf.show_persisted(result);
            }
        });
    });

    view! {
        <aside class="panel shelf" aria-labelledby="shelf-heading" data-testid="shelf">
            <h2 id="shelf-heading">"Scenario shelf"</h2>
            <p class="save-state" data-testid="save-state">
                {move || shelf.status().to_string()}
            </p>
            <TextField label="Scenario name" value=name on_input=on_name problem=name_problem test_id="scenario-name" />
            <TextField label="Note" value=note on_input=on_note problem=no_problem test_id="scenario-note" />
            <div class="actions">
                <button type="button" on:click=new_scenario data-testid="new-scenario">"New"</button>
                <button type="button" on:click=duplicate>"Duplicate"</button>
                <button type="button" on:click=delete data-testid="delete-scenario">"Delete"</button>
                <button type="button" on:click=export_current>"Export this"</button>
                <button type="button" on:click=move |_| export_all(shelf)>"Export all"</button>
                <label class="button" for="import-file">"Import…"</label>
                <input
                    id="import-file"
                    class="visually-hidden"
                    type="file"
                    accept=".json,application/json"
                    data-testid="import-file"
                    on:change=import
                />
            </div>
            <div class="field">
                <label for="shelf-filter">"Find"</label>
                <input
                    id="shelf-filter"
                    type="search"
                    placeholder="name, note or task"
                    prop:value=move || filter.get()
                    on:input=move |ev| filter.set(event_target_value(&ev))
                />
            </div>
            <ul class="shelf-list" data-testid="shelf-list">
                <For each=summaries key=|s| (s.id.clone(), s.name.clone(), s.changed_ms, s.unsaved, s.draft) let:summary>
                    {
                        let id = summary.id.clone();
                        let is_current = {
                            let id = id.clone();
                            move || current().as_ref() == Some(&id)
                        };
                        view! {
                            <li>
                                <button
                                    type="button"
                                    class="shelf-item"
                                    aria-current=move || if is_current() { "true" } else { "false" }
                                    on:click=move |_| open_entry(state, id.clone())
                                >
                                    <span class="shelf-name">{summary.name.clone()}</span>
                                    <span class="shelf-meta">
                                        {format!(
                                            "{} task{} · {}{}{}",
                                            summary.task_count,
                                            if summary.task_count == 1 { "" } else { "s" },
                                            when(summary.changed_ms),
                                            if summary.draft { " · draft" } else { "" },
                                            if summary.unsaved { " · not stored" } else { "" },
                                        )}
                                    </span>
                                </button>
                            </li>
                        }
                    }
                </For>
            </ul>
            <Show when=move || !set_aside().is_empty()>
                <h3>"Set aside"</h3>
                <p class="hint">"Stored items that could not be opened. Their text is kept unchanged."</p>
                <ul class="set-aside" data-testid="set-aside">
                    <For each=set_aside key=|s| s.key.clone() let:item>
                        {
                            let key = item.key.clone();
                            let raw = item.raw.clone();
                            let name = format!("clearspan-recovered-{}.json", key.rsplit('/').next().unwrap_or("item"));
                            view! {
                                <li>
                                    <p>{item.to_string()}</p>
                                    <button type="button" on:click=move |_| {
                                        if let Err(e) = download_json(&name, &raw) {
                                            shelf.tell(e, true, None);
                                        }
                                    }>"Download its text"</button>
                                    <button type="button" on:click=move |_| {
                                        let key = key.clone();
                                        with_write_lock(move || {
                                            let outcome = shelf.library.try_update(|lib| lib.discard_set_aside(&key));
                                            if let Some(Err(e)) = outcome {
                                                shelf.tell(e.to_string(), true, None);
                                            }
                                        });
                                    }>"Discard"</button>
                                </li>
                            }
                        }
                    </For>
                </ul>
            </Show>
            <div class="erase">
                <Show
                    when=move || confirming_erase.get()
                    fallback=move || view! {
                        <button type="button" class="danger" on:click=move |_| confirming_erase.set(true)>
                            "Erase all local data…"
                        </button>
                    }
                >
                    <p role="alert">"This deletes every scenario and setting of clearspan on this device. Export first to keep a copy."</p>
                    <button type="button" class="danger" data-testid="confirm-erase" on:click=erase>"Erase everything"</button>
                    <button type="button" on:click=move |_| confirming_erase.set(false)>"Cancel"</button>
                </Show>
            </div>
        </aside>
    }
}
