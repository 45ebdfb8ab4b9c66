//! The browser app: a thin leptos layer over the pure core. Components read
//! the app state, call the core and draw; no optics lives here.

mod app;
mod bind;
mod clock;
mod demands;
mod dialog;
mod fields;
mod files;
mod locks;
mod options_panel;
mod outcome;
mod row_watch;
mod shelf;
mod shelf_panel;
mod startup;
mod state;
mod storage;
mod tasks_panel;
mod walkthrough;
mod wearer_panel;

use leptos::prelude::*;
use startup::mark;

/// Installs the panic hook, removes the note the page shows while the app
/// loads, and mounts the app into the document body. Marks `wasm-run` when
/// the wasm starts running and `mounted` when the views are in the page.
pub fn start() {
    mark("wasm-run");
    console_error_panic_hook::set_once();
    if let Some(note) = web_sys::window()
        .and_then(|w| w.document())
        .and_then(|d| d.get_element_by_id("starting"))
    {
        note.remove();
    }
    mount_to_body(app::App);
    mark("mounted");
}
