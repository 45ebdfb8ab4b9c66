//! The shelf panel: the scenarios kept on this device, with new, duplicate,
//! delete (with undo), export, import, recovery of set-aside entries and
//! erasing all local data; and the notice bar that reports what happened.
//! Every decision is the [`crate::library::Session`]'s; this file calls it
//! and draws. Every action that writes runs in this tab's turn to write
//! ([`Shelf::in_turn`]).

use super::clock::{now_ms, when};
use super::fields::{focus_test_id, TextField};
use super::files::{download_json, picked_file, read_text};
use super::shelf::{BrowserSession, Shelf};
use super::state::{use_app_state, AppState};
use crate::display::thousands;
use crate::library::{EntryId, NoticeAction, Summary, MAX_DOCUMENT_BYTES};
use crate::scenario::{Problem, Scenario};
use leptos::prelude::*;

/// One line of the shelf list as drawn. A line is drawn afresh only when
/// what it shows changes: an edit stages the scenario every keystroke, but
/// its time is written to the minute.
#[derive(Clone, PartialEq, Eq, Hash)]
struct ShelfLine {
    /// The entry.
    id: EntryId,
    /// The scenario's name.
    name: String,
    /// What is written under the name: tasks, last change, state.
    meta: String,
}

impl ShelfLine {
    /// The line of the library's `summary`.
    fn of(summary: Summary) -> ShelfLine {
        let meta = format!(
            "{} task{} · {}{}{}",
            summary.task_count,
            if summary.task_count == 1 { "" } else { "s" },
            when(summary.changed_ms),
            if summary.draft { " · draft" } else { "" },
            if summary.unsaved {
                " · not stored"
            } else {
                ""
            },
        );
        ShelfLine {
            id: summary.id,
            name: summary.name,
            meta,
        }
    }
}

/// Runs a session operation in this tab's turn to write and shows the
/// scenario it opens, if any.
fn act(state: AppState, op: impl FnOnce(&mut BrowserSession, u64) -> Option<Scenario> + 'static) {
    state.shelf.in_turn(op, move |shown| state.show(shown));
}

/// Opens entry `id` in the editor.
fn open_entry(state: AppState, id: &EntryId) {
    state.show(state.shelf.run(|s| s.open_entry(id)).flatten());
}

/// Downloads a file (name and text), saying so if the browser refuses.
fn download(shelf: Shelf, file: Option<(String, String)>) {
    if let Some((file_name, text)) = file {
        if let Err(e) = download_json(&file_name, &text) {
            shelf.tell(e, true);
        }
    }
}

/// Downloads every scenario as one file.
fn export_all(shelf: Shelf) {
    let text = shelf.run(|s| s.export_all(now_ms())).flatten();
    download(
        shelf,
        text.map(|text| ("clearspan-all-scenarios.json".to_string(), text)),
    );
}

/// The notice bar: messages with their actions and a dismiss button, and the
/// conflict banner when another tab changed the open scenario.
#[component]
pub fn NoticeBar() -> impl IntoView {
    let state = use_app_state();
    let shelf = state.shelf;
    let resolve = move |keep: bool| {
        let Some(Some(conflict)) = shelf.run(BrowserSession::take_conflict) else {
            return;
        };
        if keep {
            act(state, move |s, now| s.keep_mine(&conflict, now));
        } else {
            state.show(shelf.run(|s| s.take_theirs(&conflict)).flatten());
        }
    };
    view! {
        <div class="notices" role="status" aria-live="polite" data-testid="notices">
            <Show when=move || shelf.conflict.with(Option::is_some)>
                <div class="notice warning" data-testid="conflict">
                    <p>{move || shelf.conflict.get().map(|c| c.to_string())}</p>
                    <button type="button" on:click=move |_| resolve(true)>"Keep mine as a copy"</button>
                    <button type="button" on:click=move |_| resolve(false)>"Take theirs"</button>
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
                            NoticeAction::UndoDelete => ("Undo", Box::new(move || act(state, |s, _| s.undo_delete()))),
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
    let summaries = move || {
        let words = filter.get();
        let list = if words.trim().is_empty() {
            shelf.list.get()
        } else {
            shelf.list.track();
            shelf.read(|s| s.list(&words)).unwrap_or_default()
        };
        list.into_iter().map(ShelfLine::of).collect::<Vec<_>>()
    };
    let current = move || shelf.current.get();
    // A new scenario is named first: focus goes to its name.
    let new_scenario = move |_| {
        state.shelf.in_turn(
            |s, now| s.create_untitled(now),
            move |shown| {
                state.show(shown);
                focus_test_id("scenario-name");
            },
        )
    };
    let duplicate = move |_| act(state, |s, now| s.duplicate(now));
    let delete = move |_| act(state, |s, _| s.delete());
    let export_current = move |_| {
        let file = shelf.run(|s| s.export_current(now_ms())).flatten();
        download(shelf, file);
    };
    let import = move |ev: leptos::ev::Event| {
        let Some(file) = picked_file(&ev) else {
            return;
        };
        leptos::task::spawn_local(async move {
            match read_text(file, MAX_DOCUMENT_BYTES).await {
                Ok(text) => act(state, move |s, now| s.import(&text, now)),
                Err(e) => {
                    shelf.run(|s| s.import_unreadable(&e));
                }
            }
        });
    };
    let erase = move |_| {
        confirming_erase.set(false);
        act(state, |s, _| s.erase_all());
    };
    let set_aside = move || shelf.set_aside.get();
    // Memos, not derived signals: every edit changes the scenario and the
    // list (its time), and the fields are written only when their text does.
    let name = state.part(|s| s.name.clone());
    let on_name = Callback::new(move |v: String| state.edit(|s| s.name = v));
    let name_problem = state.problem_at(Signal::stored("name".to_string()), Problem::to_string);
    let stored_note = Memo::new(move |_| {
        let id = shelf.current.get();
        shelf.list.with(|list| {
            list.iter()
                .find(|s| Some(&s.id) == id.as_ref())
                .map(|s| s.note.clone())
                .unwrap_or_default()
        })
    });
    // A note is stored in this tab's turn to write, a moment after each
    // keystroke: until every write asked is done, the field shows what was
    // typed, so that a write catching up never puts an older text (and the
    // caret at its end) back under the user's fingers.
    let note_typed = RwSignal::new(String::new());
    let note_writes = RwSignal::new(0_u32);
    let note = Memo::new(move |_| {
        if note_writes.get() > 0 {
            note_typed.get()
        } else {
            stored_note.get()
        }
    });
    let no_problem = Signal::derive(|| None::<String>);
    let on_note = Callback::new(move |v: String| {
        note_typed.set(v.clone());
        note_writes.update(|n| *n += 1);
        shelf.in_turn(
            move |s, now| s.set_note(&v, now),
            move |()| note_writes.update(|n| *n = n.saturating_sub(1)),
        );
    });

    let wide_at_start = window()
        .match_media("(min-width: 1201px)")
        .ok()
        .flatten()
        .is_none_or(|m| m.matches());
    view! {
        <aside class="panel shelf" aria-labelledby="shelf-heading" data-testid="shelf">
            <h2 id="shelf-heading">"Scenario shelf"</h2>
            <p class="save-state" data-testid="save-state">
                {move || shelf.status.with(ToString::to_string)}
            </p>
            <TextField label="Scenario name" value=name on_input=on_name problem=name_problem test_id="scenario-name" />
            <TextField label="Note" value=note on_input=on_note problem=no_problem test_id="scenario-note" />
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
                                        download(shelf, Some((name.clone(), raw.clone())));
                                    }>"Download its text"</button>
                                    <button type="button" on:click=move |_| {
                                        let key = key.clone();
                                        shelf.in_turn(move |s, _| s.discard_set_aside(&key), |()| {});
                                    }>"Discard"</button>
                                </li>
                            }
                        }
                    </For>
                </ul>
            </Show>
            // Out of the way on a tablet until wanted (open beside the form on
            // wide screens): the scenarios kept here and what to do with them.
            <details class="shelf-more" open=wide_at_start data-testid="shelf-more">
                <summary>{move || format!("Scenarios on this device ({})", shelf.list.with(Vec::len))}</summary>
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
                    <For each=summaries key=|line| line.clone() let:line>
                        {
                            let id = line.id.clone();
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
                                        on:click=move |_| open_entry(state, &id)
                                    >
                                        <span class="shelf-name">{line.name}</span>
                                        <span class="shelf-meta">{line.meta}</span>
                                    </button>
                                </li>
                            }
                        }
                    </For>
                </ul>
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
            </details>
        </aside>
    }
}
