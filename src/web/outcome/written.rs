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

/// The SVG namespace, for the groups made in a chart.
const SVG: &str = "http://www.w3.org/2000/svg";

/// Keeps the children of the element `node` refers to showing `texts`:
/// one child element per text (made by `make`), in order, each rewritten
/// only when its own text changed since the last time, extra children
/// removed. Comparing the texts in place costs far less than a keyed list
/// of them (every key hashed on every edit) and leaves the unchanged rows
/// and marks untouched.
fn keep_written<E>(
    node: NodeRef<E>,
    make: fn(&web_sys::Document) -> Option<Element>,
    texts: impl Fn() -> Vec<String> + 'static,
) where
    E: leptos::html::ElementType,
    E::Output: JsCast + Clone + 'static,
{
    Effect::new(move |before: Option<Option<(Element, Vec<String>)>>| {
        let now = texts();
        let parent = node.get()?.unchecked_into::<Element>();
        // What this element shows: nothing yet if it is not the element
        // written last time.
        let before = before
            .flatten()
            .filter(|(written, _)| *written == parent)
            .map(|(_, texts)| texts)
            .unwrap_or_default();
        let children = parent.children();
        for (i, text) in now.iter().enumerate() {
            if before.get(i) == Some(text) {
                continue;
            }
            let index = u32::try_from(i).unwrap_or(u32::MAX);
            let child = children.item(index).or_else(|| {
                make(&document()).and_then(|c| parent.append_child(&c).ok()?.dyn_into().ok())
            });
            if let Some(child) = child {
                child.set_inner_html(text);
            }
        }
        while children.length() > u32::try_from(now.len()).unwrap_or(u32::MAX) {
            match parent.last_element_child() {
                Some(last) => last.remove(),
                None => break,
            }
        }
        Some((parent, now))
    });
}

/// A table body whose rows are `rows`, written as HTML text (each the
/// content of one `<tr>`), a row rewritten only when its own text changes.
pub fn written_body(rows: impl Fn() -> Vec<String> + 'static) -> impl IntoView {
    let node = NodeRef::<leptos::html::Tbody>::new();
    keep_written(node, |d| d.create_element("tr").ok(), rows);
    view! { <tbody node_ref=node></tbody> }
}

/// A table foot whose rows are `rows`, as [`written_body`].
pub fn written_foot(rows: impl Fn() -> Vec<String> + 'static) -> impl IntoView {
    let node = NodeRef::<leptos::html::Tfoot>::new();
    keep_written(node, |d| d.create_element("tr").ok(), rows);
    view! { <tfoot node_ref=node></tfoot> }
}

/// An SVG group of `marks` written as SVG text, each in a group of its
/// own, a mark rewritten only when its own text changes.
pub fn written_marks(marks: impl Fn() -> Vec<String> + 'static) -> impl IntoView {
    let node = NodeRef::<leptos::svg::G>::new();
    keep_written(node, |d| d.create_element_ns(Some(SVG), "g").ok(), marks);
    view! { <g node_ref=node></g> }
}
