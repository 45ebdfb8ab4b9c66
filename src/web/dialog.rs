//! What every full-screen view opened from a button shares (the wearer's
//! walkthrough, the workplace-vision view): keyboard focus moves into the
//! view when it opens and back to the button that opened it when it closes.

use leptos::html;
use leptos::prelude::*;

/// Makes focus follow `open`: into `dialog` once it is drawn, back to
/// `opener` when it closes.
pub fn focus_follows(
    open: RwSignal<bool>,
    dialog: NodeRef<html::Div>,
    opener: NodeRef<html::Button>,
) {
    Effect::new(move |was_open: Option<bool>| {
        let is_open = open.get();
        if is_open {
            request_animation_frame(move || {
                if let Some(d) = dialog.get_untracked() {
                    let _ = d.focus();
                }
            });
        } else if was_open == Some(true) {
            if let Some(b) = opener.get_untracked() {
                let _ = b.focus();
            }
        }
        is_open
    });
}
