//! The browser app: a thin leptos layer over the pure core. Components read
//! the app state, call the core and draw; no optics lives here.

mod app;
mod bind;
mod fields;
mod files;
mod options_panel;
mod outcome;
mod shelf;
mod shelf_panel;
mod state;
mod storage;
mod tasks_panel;
mod walkthrough;
mod wearer_panel;

use leptos::prelude::*;

/// Installs the panic hook and mounts the app into the document body.
pub fn start() {
    console_error_panic_hook::set_once();
    mount_to_body(app::App);
}
