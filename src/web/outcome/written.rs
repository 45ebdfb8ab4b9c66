//! The plan's parts written as HTML text (`crate::markup`) on the page: a
//! part is an element whose content is replaced in one step when its text
//! changes, and choosing in it (a click, or Enter or Space on a chart
//! mark) is read from the chosen element's `data-option` (an option's
//! heading: choose it for the order) or `data-mark` (a task's mark: open
//! its detail beside it) by one handler on the panel.

use super::detail::TaskDetail;
use crate::markup::marks::Mark;
use crate::web::state::AppState;
use leptos::ev::{KeyboardEvent, MouseEvent};
use leptos::prelude::*;
use wasm_bindgen::JsCast;
use web_sys::{Element, Event};

/// The element chosen by `ev`: the nearest around its target with a
/// `data-option` or `data-mark` attribute.
fn chosen(ev: &Event) -> Option<Element> {
    ev.target()?
        .dyn_into::<Element>()
        .ok()?
        .closest("[data-option],[data-mark]")
        .ok()
        .flatten()
}

/// Acts on the choice of `element`: chooses its option, or opens its
/// task's detail beside it.
fn act(state: AppState, detail: TaskDetail, element: &Element) {
    if let Some(option) = element
        .get_attribute("data-option")
        .and_then(|o| o.parse().ok())
    {
        state.choose_option(option);
    } else if let Some((mark, t)) = element
        .get_attribute("data-mark")
        .and_then(|m| Mark::parse(&m))
    {
        detail.open(mark, t);
    }
}

/// The click handler for the written parts inside an element.
pub fn on_choose(state: AppState, detail: TaskDetail) -> impl Fn(MouseEvent) + 'static {
    move |ev| {
        if let Some(element) = chosen(&ev) {
            act(state, detail, &element);
        }
    }
}

/// The key handler for the written parts inside an element: Enter or
/// Space on a chart mark drawn as a button (an SVG group with the button
/// role) chooses it; real buttons act on their own click.
pub fn on_choose_key(state: AppState, detail: TaskDetail) -> impl Fn(KeyboardEvent) + 'static {
    move |ev| {
        if ev.key() != "Enter" && ev.key() != " " {
            return;
        }
        if let Some(element) = chosen(&ev).filter(|e| e.tag_name() != "BUTTON") {
            ev.prevent_default();
            act(state, detail, &element);
        }
    }
}

/// Table rows written as HTML text (each the content of one `<tr>`), in
/// order: a row is replaced only when its own text or its place changes.
pub fn written_rows(rows: impl Fn() -> Vec<String> + Send + Sync + 'static) -> impl IntoView {
    view! {
        <For
            each=move || rows().into_iter().enumerate()
            key=|row| row.clone()
            children=|(_, row)| view! { <tr inner_html=row></tr> }
        />
    }
}

/// SVG marks written as text, each in a group of its own, in order: a mark
/// is replaced only when its own text or its place changes.
pub fn written_marks(marks: impl Fn() -> Vec<String> + Send + Sync + 'static) -> impl IntoView {
    view! {
        <For
            each=move || marks().into_iter().enumerate()
            key=|mark| mark.clone()
            children=|(_, mark)| view! { <g inner_html=mark></g> }
        />
    }
}
