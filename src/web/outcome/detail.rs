//! A task's numbers in detail, opened beside the mark it was chosen from (a
//! row of the comparison, a range-chart marker or a lens-map point) instead
//! of in a fixed place of the plan: a small non-modal dialog placed under
//! the mark, or above it where there is no room below, and kept inside the
//! visible part of the plan. Focus moves into it when it opens and back to
//! the mark when it closes (Escape or its close button). It follows the
//! task it was opened for while the plan is edited and closes when that
//! task is gone (removed, or another scenario opened). It is a screen aid
//! only: the printed plan sheet has its own table of the tasks.

use crate::markup::marks::Mark;
use crate::markup::task_detail::task_detail;
use crate::web::dialog::focus_element;
use crate::web::state::{use_app_state, AppState};
use leptos::html;
use leptos::prelude::*;
use wasm_bindgen::JsCast;
use web_sys::{Element, HtmlElement};

/// Space between a mark and its detail, and between the detail and the
/// edges of what is visible, in CSS pixels.
const GAP: f64 = 8.0;

/// The least height the detail is cut to where the room beside its mark is
/// short (its heading and two rows), in CSS pixels; it is then scrolled
/// into view instead.
const MIN_HEIGHT: f64 = 160.0;

/// Which task's detail is open and beside which mark: the task's input
/// index is the app state's `chosen_task`; its row id tells whether the
/// task at that index is still the one chosen.
#[derive(Clone, Copy, PartialEq, Debug)]
struct Opened {
    mark: Mark,
    row: u64,
}

/// Opening and closing the detail, shared by the marks (context).
#[derive(Clone, Copy)]
pub struct TaskDetail {
    state: AppState,
    opened: RwSignal<Option<Opened>>,
}

/// Provides the detail's opener to the parts of the outcome panel.
pub fn provide_task_detail() -> TaskDetail {
    let detail = TaskDetail {
        state: use_app_state(),
        opened: RwSignal::new(None),
    };
    provide_context(detail);
    detail
}

/// The detail's opener provided by [`provide_task_detail`].
pub fn use_task_detail() -> TaskDetail {
    expect_context::<TaskDetail>()
}

/// The mark with `data-mark` value `id`, if it is on the page.
fn mark_element(id: &str) -> Option<Element> {
    document()
        .query_selector(&format!("[data-mark=\"{id}\"]"))
        .ok()
        .flatten()
}

impl TaskDetail {
    /// Opens the detail of the task at input index `t` beside its `mark`
    /// and moves focus into it once it is drawn.
    pub fn open(self, mark: Mark, t: usize) {
        let Some(row) = self
            .state
            .rows
            .with_untracked(|r| r.tasks().get(t).copied())
        else {
            return;
        };
        self.state.chosen_task.set(Some(t));
        self.opened.set(Some(Opened { mark, row }));
        request_animation_frame(move || {
            if let Some((popover, anchor)) = detail_element().zip(mark_element(&mark.id(t))) {
                place(&popover, &anchor);
                bring_into_view(&popover);
                let _ = popover.focus();
            }
        });
    }

    /// Closes the detail and returns focus to the mark it was opened from.
    fn close(self) {
        let mark = self.opened.get_untracked().map(|o| o.mark);
        let task = self.state.chosen_task.get_untracked();
        self.opened.set(None);
        self.state.chosen_task.set(None);
        // The marks are written again without the detail open: focus goes
        // to the mark on the page once they are.
        request_animation_frame(move || {
            if let Some(anchor) = mark.zip(task).and_then(|(m, t)| mark_element(&m.id(t))) {
                focus_element(&anchor);
            }
        });
    }

    /// The mark and the task's input index of the open detail, while the
    /// task at that index is still the one it was opened for (reactive).
    fn open_at(self) -> Option<(Mark, usize)> {
        let t = self.state.chosen_task.get()?;
        let opened = self.opened.get()?;
        self.state
            .rows
            .with(|r| r.tasks().get(t) == Some(&opened.row))
            .then_some((opened.mark, t))
    }

    /// The input index of the task whose detail is open, if any
    /// (reactive; for the marks' `aria-expanded`).
    pub fn open_task(self) -> Option<usize> {
        self.open_at().map(|(_, t)| t)
    }
}

/// The open detail on the page, if any.
fn detail_element() -> Option<HtmlElement> {
    document()
        .query_selector("[data-testid=\"task-detail\"]")
        .ok()
        .flatten()
        .and_then(|e| e.dyn_into::<HtmlElement>().ok())
}

/// Scrolls `popover` into view by the least amount (nothing when it is in
/// view already).
fn bring_into_view(popover: &HtmlElement) {
    let options = web_sys::ScrollIntoViewOptions::new();
    options.set_block(web_sys::ScrollLogicalPosition::Nearest);
    popover.scroll_into_view_with_scroll_into_view_options(&options);
}

/// An interval along one axis of the window, in CSS pixels.
#[derive(Clone, Copy)]
struct Span {
    start: f64,
    end: f64,
}

/// Where a box of `size` goes along one axis next to a mark spanning `mark`
/// within `room` (all in window coordinates), and how long it may be there:
/// after the mark when it fits there, else before it when it fits there,
/// else on the side with more room, cut to that room. With `across` it
/// starts level with the mark instead, moved back inside `room`.
fn beside(mark: Span, size: f64, room: Span, across: bool) -> (f64, f64) {
    if across {
        let last = (room.end - GAP - size).max(room.start + GAP);
        return (mark.start.min(last).max(room.start + GAP), size);
    }
    let after = room.end - GAP - (mark.end + GAP);
    let before = mark.start - GAP - (room.start + GAP);
    if size <= after || (size > before && after >= before) {
        (mark.end + GAP, size.min(after))
    } else {
        let size = size.min(before);
        (mark.start - GAP - size, size)
    }
}

/// Places `popover`, positioned absolutely in the plan, under `anchor` (or
/// above it where the visible part of the plan has no room below), its
/// left edge level with the mark's and moved back inside the plan and the
/// window.
fn place(popover: &HtmlElement, anchor: &Element) {
    let Some(parent) = popover.offset_parent() else {
        return;
    };
    let Some(page) = document().document_element() else {
        return;
    };
    // Measured at its own height (the style sheet's cap), not the height
    // it was cut to where it was placed before.
    let style = popover.style();
    let _ = style.remove_property("max-height");
    let frame = parent.get_bounding_client_rect();
    let mark = anchor.get_bounding_client_rect();
    let left = frame.left() + f64::from(parent.client_left());
    let top = frame.top() + f64::from(parent.client_top());
    // The visible part of the plan: the plan's own box where it scrolls by
    // itself (wide screens), cut to the window.
    let across = Span {
        start: left.max(0.0),
        end: (left + f64::from(parent.client_width())).min(f64::from(page.client_width())),
    };
    let down = Span {
        start: top.max(0.0),
        end: (top + f64::from(parent.client_height())).min(f64::from(page.client_height())),
    };
    let (x, _) = beside(
        Span {
            start: mark.left(),
            end: mark.right(),
        },
        f64::from(popover.offset_width()),
        across,
        true,
    );
    let (y, height) = beside(
        Span {
            start: mark.top(),
            end: mark.bottom(),
        },
        f64::from(popover.offset_height()),
        down,
        false,
    );
    // Through the style object, not a style attribute: the
    // Content-Security-Policy refuses inline style attributes.
    let px = |v: f64| format!("{v:.0}px");
    let _ = style.set_property("left", &px(x - left + f64::from(parent.scroll_left())));
    let _ = style.set_property("top", &px(y - top + f64::from(parent.scroll_top())));
    let _ = style.set_property("max-height", &px(height.max(MIN_HEIGHT)));
}

/// The detail of the chosen task, beside the mark it was chosen from.
#[component]
pub fn TaskDetailPopover() -> impl IntoView {
    let detail = use_task_detail();
    let state = detail.state;
    let shown = Memo::new(move |_| {
        let (mark, t) = detail.open_at()?;
        let (heading, table) = state
            .outcome
            .with(|o| o.plan.as_ref().and_then(|p| task_detail(p, t)))?;
        Some((mark.id(t), heading, table))
    });
    let node = NodeRef::<html::Div>::new();
    let replace = move || {
        if let Some((id, _, _)) = shown.get_untracked() {
            if let Some((popover, anchor)) = node.get_untracked().zip(mark_element(&id)) {
                place(&popover, &anchor);
            }
        }
    };
    // The plan moves under the detail as it is edited (rows come and go,
    // the charts change height): it is placed again after every change,
    // without taking the focus.
    Effect::new(move |_| {
        shown.track();
        request_animation_frame(replace);
    });
    let resized = window_event_listener(leptos::ev::resize, move |_| replace());
    on_cleanup(move || resized.remove());
    let on_key = move |ev: leptos::ev::KeyboardEvent| {
        if ev.key() == "Escape" {
            ev.prevent_default();
            detail.close();
        }
    };
    move || {
        shown.get().map(|(_, heading, table)| {
            view! {
                <div
                    node_ref=node
                    class="task-detail"
                    role="dialog"
                    aria-labelledby="task-detail-heading"
                    tabindex="-1"
                    data-testid="task-detail"
                    on:keydown=on_key
                >
                    <div class="task-detail-head">
                        <h3 id="task-detail-heading">{heading}</h3>
                        <button
                            type="button"
                            class="task-detail-close"
                            aria-label="Close the task detail"
                            data-testid="task-detail-close"
                            on:click=move |_| detail.close()
                        >
                            "Close"
                        </button>
                    </div>
                    <div class="part" inner_html=table></div>
                </div>
            }
        })
    }
}
