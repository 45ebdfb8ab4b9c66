//! What every view opened from a button or a mark shares (the wearer's
//! walkthrough, the workplace-vision view, a task's detail): keyboard focus
//! moves into the view when it opens and back to what opened it when it
//! closes.

use leptos::html;
use leptos::prelude::*;
use wasm_bindgen::JsCast;

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

/// Moves keyboard focus to `element`, an HTML element or an SVG one (a
/// chart mark that takes focus).
pub fn focus_element(element: &web_sys::Element) {
    if let Some(html) = element.dyn_ref::<web_sys::HtmlElement>() {
        let _ = html.focus();
    } else if let Some(svg) = element.dyn_ref::<web_sys::SvgElement>() {
        let _ = svg.focus();
    }
}
