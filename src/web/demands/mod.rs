//! The occupational-health view ("Workplace vision"): a whole-screen dialog
//! opened from the masthead, with two tabs. "This worker" shows the
//! task-demand sheet of the scenario on screen (printable on one A4 page);
//! "Team" screens a roster of pseudonymous workers against the scenario's
//! tasks. Every figure, flag and word comes from `plan::demands`,
//! `plan::demand_words` and `plan::roster`, written as HTML text by
//! `markup::demand_sheet` and `markup::team_table`; this layer reads the
//! app state, holds the controls and puts the text on the page. Nothing here edits the scenario. Escape closes the dialog and
//! focus returns to its opener.

mod sheet;
mod team;

use crate::web::dialog::focus_follows;
use leptos::html;
use leptos::prelude::*;
use sheet::SheetTab;
use team::TeamTab;

/// The two tabs of the view.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Tab {
    /// The task-demand sheet of the worker on screen.
    Worker,
    /// Team mode: a roster against the scenario's tasks.
    Team,
}

impl Tab {
    fn other(self) -> Tab {
        match self {
            Tab::Worker => Tab::Team,
            Tab::Team => Tab::Worker,
        }
    }
}

/// The button that opens the occupational-health view, and the view.
#[component]
pub fn WorkVisionLauncher() -> impl IntoView {
    let open = RwSignal::new(false);
    let tab = RwSignal::new(Tab::Worker);
    let dialog = NodeRef::<html::Div>::new();
    let opener = NodeRef::<html::Button>::new();

    let _keys = window_event_listener(leptos::ev::keydown, move |ev| {
        if open.get_untracked() && ev.key() == "Escape" {
            ev.prevent_default();
            open.set(false);
        }
    });
    // Focus follows the dialog: into it on opening, back to the opener on closing.
    focus_follows(open, dialog, opener);

    // Left and right arrows move between the tabs, as a tab list does.
    let tab_keys = move |ev: leptos::ev::KeyboardEvent| {
        if matches!(ev.key().as_str(), "ArrowLeft" | "ArrowRight") {
            ev.prevent_default();
            let next = tab.get_untracked().other();
            tab.set(next);
            let id = match next {
                Tab::Worker => "wv-tab-worker",
                Tab::Team => "wv-tab-team",
            };
            if let Some(el) = document().get_element_by_id(id) {
                if let Ok(el) = wasm_bindgen::JsCast::dyn_into::<web_sys::HtmlElement>(el) {
                    let _ = el.focus();
                }
            }
        }
    };
    let tab_button =
        move |which: Tab, id: &'static str, panel: &'static str, words: &'static str| {
            view! {
                <button
                    type="button"
                    role="tab"
                    id=id
                    aria-controls=panel
                    aria-selected=move || (tab.get() == which).to_string()
                    tabindex=move || if tab.get() == which { "0" } else { "-1" }
                    data-testid=id
                    on:click=move |_| tab.set(which)
                    on:keydown=tab_keys
                >
                    {words}
                </button>
            }
        };

    view! {
        <button
            type="button"
            class="wv-open"
            node_ref=opener
            data-testid="wv-open"
            on:click=move |_| {
                tab.set(Tab::Worker);
                open.set(true);
            }
        >
            "Workplace vision"
        </button>
        <Show when=move || open.get()>
            <div
                class="work-vision"
                role="dialog"
                aria-modal="true"
                aria-labelledby="wv-title"
                tabindex="-1"
                node_ref=dialog
                data-testid="work-vision"
            >
                <header class="wv-head">
                    <h2 id="wv-title">"Workplace vision: task demands"</h2>
                    <div class="wv-tabs" role="tablist" aria-label="Whose demands">
                        {tab_button(Tab::Worker, "wv-tab-worker", "wv-panel-worker", "This worker")}
                        {tab_button(Tab::Team, "wv-tab-team", "wv-panel-team", "Team")}
                    </div>
                    <button type="button" class="wv-close" data-testid="wv-close" on:click=move |_| open.set(false)>
                        "Close"
                    </button>
                </header>
                <div class="wv-body">
                    <div
                        id="wv-panel-worker"
                        role="tabpanel"
                        aria-labelledby="wv-tab-worker"
                        hidden=move || tab.get() != Tab::Worker
                    >
                        <Show when=move || tab.get() == Tab::Worker>
                            <SheetTab />
                        </Show>
                    </div>
                    <div
                        id="wv-panel-team"
                        class="wv-team"
                        role="tabpanel"
                        aria-labelledby="wv-tab-team"
                        hidden=move || tab.get() != Tab::Team
                    >
                        <TeamTab />
                    </div>
                </div>
            </div>
        </Show>
    }
}
