//! The wearer walkthrough: a read-only presentation over the whole screen,
//! opened from the plan, one task per step and a closing step, with next and
//! back by tap, swipe and the left and right arrow keys, and Escape to
//! close. The lenses the words are about start as the planned option; the
//! wearer may look at any other option planned (a tap on its name, or the
//! up and down arrow keys), which changes only what this presentation shows.
//! The words come from `plan::walkthrough`, written as HTML text by
//! `markup::walkthrough_step`; the pictures from the core's scene and blur
//! disc; this layer only reads the app state, draws and puts the text on
//! the page.
//! Nothing here edits the scenario.

mod picture;

use crate::chart::scene::SceneKind;
use crate::core::units::Millimetres;
use crate::markup::walkthrough_step::{
    closing_step, no_plan, picture_caption, scale_words, task_words,
};
use crate::plan::walkthrough::{current_glasses_plan, walkthrough, TaskStep, Walkthrough};
use crate::web::dialog::focus_follows;
use crate::web::state::{use_app_state, AppState};
use leptos::html;
use leptos::prelude::*;
use picture::{PictureSpec, ScenePicture};

/// Thumbnail canvas size, in pixels (16:10, sharp at the grid's widest cell).
const THUMB: (u32, u32) = (480, 300);
/// Horizontal travel of a pointer, in CSS pixels, that counts as a swipe.
const SWIPE_PX: i32 = 60;

/// The scene and detail of task `index` in the scenario being shown.
fn scene_of(state: AppState, index: usize) -> Option<(SceneKind, Millimetres)> {
    state.scenario.with(|s| {
        s.tasks
            .get(index)
            .map(|t| (SceneKind::for_task(t), Millimetres(t.detail_mm)))
    })
}

/// One task step: facts and words (written as HTML text), then the
/// pictures side by side.
fn task_view(
    state: AppState,
    step: &TaskStep,
    pupil: Millimetres,
    planned: Option<usize>,
    enlarged: RwSignal<Option<(PictureSpec, String)>>,
) -> impl IntoView {
    let unit = state.unit.get_untracked();
    let scene = scene_of(state, step.task_index);
    let pictures = scene.map(|(kind, detail)| {
        let figures = step
            .pictures
            .iter()
            .map(|p| {
                let spec = PictureSpec {
                    kind,
                    detail,
                    distance: step.distance,
                    defocus: p.defocus,
                    pupil,
                };
                let words = format!(
                    "{} through {}: {}",
                    kind.describe(),
                    p.label,
                    p.sharpness.words()
                );
                let open_words = words.clone();
                view! {
                    <figure class="walk-figure" class:chosen=p.chosen>
                        <button
                            type="button"
                            class="walk-zoom"
                            aria-label=format!("Show bigger: {words}")
                            on:click=move |_| enlarged.set(Some((spec, open_words.clone())))
                        >
                            <ScenePicture spec=spec width=THUMB.0 height=THUMB.1 label=words.clone() />
                        </button>
                        <figcaption inner_html=picture_caption(p, planned)></figcaption>
                    </figure>
                }
            })
            .collect_view();
        view! {
            <div class="walk-pictures">{figures}</div>
            <p class="walk-scale">{scale_words(kind, detail, step, unit)}</p>
        }
    });
    view! {
        <div class="part" inner_html=task_words(step, unit)></div>
        {pictures}
    }
}

/// The button that opens the walkthrough, and the walkthrough itself.
#[component]
pub fn WalkthroughLauncher() -> impl IntoView {
    let state = use_app_state();
    let open = RwSignal::new(false);
    let step = RwSignal::new(0usize);
    let enlarged = RwSignal::new(None::<(PictureSpec, String)>);
    let dialog = NodeRef::<html::Div>::new();
    let opener = NodeRef::<html::Button>::new();
    let swipe_from = StoredValue::new(None::<(i32, i32)>);

    let current = Memo::new(move |_| {
        open.get()
            .then(|| {
                state
                    .checked
                    .with(|c| c.as_ref().ok().and_then(current_glasses_plan))
            })
            .flatten()
    });
    // The option the order is written for: the dispenser's choice or the
    // recommendation (the first option ranked).
    let planned = Memo::new(move |_| {
        state.outcome.with(|o| {
            o.plan.as_ref().and_then(|p| {
                p.choice
                    .as_ref()
                    .map(|c| c.chosen.index)
                    .or_else(|| p.options.first().map(|o| o.option.index))
            })
        })
    });
    // The options planned, by input index and label, for the lens switch.
    let lenses = Memo::new(move |_| {
        if !open.get() {
            return Vec::new();
        }
        state.outcome.with(|o| {
            o.plan.as_ref().map_or_else(Vec::new, |p| {
                p.options
                    .iter()
                    .map(|o| (o.option.index, o.option.label.clone()))
                    .collect::<Vec<_>>()
            })
        })
    });
    // The option the wearer is looking at: only this presentation's own
    // state, never written to the scenario.
    let shown = RwSignal::new(None::<usize>);
    let showing = move || shown.get().or_else(|| planned.get());
    let walk = Memo::new(move |_| {
        if !open.get() {
            return None;
        }
        let index = showing();
        state.outcome.with(|o| {
            o.plan
                .as_ref()
                .and_then(|p| current.with(|now| walkthrough(p, now.as_ref(), index)))
        })
    });
    // The lenses at `position` in the list (from the number keys, 0 first).
    let show_at = move |position: usize| {
        if let Some(index) = lenses.with_untracked(|l| l.get(position).map(|(i, _)| *i)) {
            shown.set(Some(index));
        }
    };
    let count = move || walk.with(|w| w.as_ref().map_or(1, |w| w.steps.len() + 1));
    let at = move || step.get().min(count() - 1);
    let close = move || {
        enlarged.set(None);
        open.set(false);
    };
    let next = move || {
        if at() + 1 < count() {
            step.set(at() + 1);
        } else {
            close();
        }
    };
    let back = move || step.set(at().saturating_sub(1));

    let _keys = window_event_listener(leptos::ev::keydown, move |ev| {
        if !open.get_untracked() {
            return;
        }
        match ev.key().as_str() {
            "Escape" if enlarged.get_untracked().is_some() => enlarged.set(None),
            "Escape" => close(),
            "ArrowRight" | "PageDown" if enlarged.get_untracked().is_none() => next(),
            "ArrowLeft" | "PageUp" if enlarged.get_untracked().is_none() => back(),
            key if enlarged.get_untracked().is_none()
                && key.len() == 1
                && key.as_bytes()[0].is_ascii_digit()
                && key != "0" =>
            {
                show_at(usize::from(key.as_bytes()[0] - b'1'))
            }
            _ => return,
        }
        ev.prevent_default();
    });
    // Focus follows the dialog: into it on opening, back to the opener on closing.
    focus_follows(open, dialog, opener);

    let body = move || {
        walk.with(|w| {
            let step = w.as_ref().and_then(|w| w.steps.get(at()).map(|s| (w, s)));
            match step {
                Some((w, s)) => task_view(state, s, w.pupil, planned.get(), enlarged).into_any(),
                None => {
                    let text = w
                        .as_ref()
                        .map_or_else(no_plan, |w| closing_step(&w.closing));
                    view! { <div class="part" inner_html=text></div> }.into_any()
                }
            }
        })
    };
    let title = move || {
        walk.with(|w| {
            w.as_ref().map_or_else(
                || "Walkthrough".to_string(),
                |w: &Walkthrough| match w.steps.get(at()) {
                    Some(s) => s.name.clone(),
                    None if Some(w.closing.option.index) == planned.get() => {
                        format!("Your choice: {}", w.closing.option.label)
                    }
                    None => format!("Another choice: {}", w.closing.option.label),
                },
            )
        })
    };
    let progress = move || format!("Step {} of {}", at() + 1, count());
    let last = move || at() + 1 >= count();

    let on_down = move |ev: leptos::ev::PointerEvent| {
        swipe_from.set_value(Some((ev.client_x(), ev.client_y())));
    };
    let on_up = move |ev: leptos::ev::PointerEvent| {
        let Some((x, y)) = swipe_from.get_value() else {
            return;
        };
        swipe_from.set_value(None);
        let (dx, dy) = (ev.client_x() - x, ev.client_y() - y);
        if dx.abs() >= SWIPE_PX && dx.abs() > dy.abs() && enlarged.get_untracked().is_none() {
            if dx < 0 {
                next();
            } else {
                back();
            }
        }
    };

    view! {
        <button
            type="button"
            class="primary walk-open"
            node_ref=opener
            data-testid="walk-open"
            on:click=move |_| {
                step.set(0);
                shown.set(None);
                open.set(true);
            }
        >
            "Show the wearer"
        </button>
        <Show when=move || open.get()>
            <div
                class="walkthrough"
                role="dialog"
                aria-modal="true"
                aria-labelledby="walk-title"
                tabindex="-1"
                node_ref=dialog
                data-testid="walkthrough"
                on:pointerdown=on_down
                on:pointerup=on_up
                on:pointercancel=move |_| swipe_from.set_value(None)
            >
                <header class="walk-head">
                    <p class="walk-progress" data-testid="walk-progress">{progress}</p>
                    <h2 id="walk-title" data-testid="walk-title">{title}</h2>
                    <button type="button" class="walk-close" data-testid="walk-close" on:click=move |_| close()>
                        "Close"
                    </button>
                </header>
                <div class="walk-lenses" role="group" aria-label="Lenses shown" data-testid="walk-lenses">
                    <span class="walk-lenses-label">"Lenses shown:"</span>
                    {move || {
                        lenses
                            .get()
                            .into_iter()
                            .enumerate()
                            .map(|(position, (index, label))| {
                                view! {
                                    <button
                                        type="button"
                                        aria-pressed=move || (showing() == Some(index)).to_string()
                                        aria-keyshortcuts=(position < 9).then(|| (position + 1).to_string())
                                        data-testid="walk-lens"
                                        on:click=move |_| shown.set(Some(index))
                                    >
                                        {label}
                                    </button>
                                }
                            })
                            .collect_view()
                    }}
                </div>
                <div class="walk-body" aria-live="polite">{body}</div>
                <nav class="walk-nav" aria-label="Walkthrough steps">
                    <button
                        type="button"
                        data-testid="walk-back"
                        disabled=move || at() == 0
                        on:click=move |_| back()
                    >
                        "Back"
                    </button>
                    <p class="walk-hint">"Swipe, or use the arrow keys; number keys pick the lenses"</p>
                    <button type="button" class="primary" data-testid="walk-next" on:click=move |_| next()>
                        {move || if last() { "Done" } else { "Next" }}
                    </button>
                </nav>
                {move || {
                    enlarged
                        .get()
                        .map(|(spec, words)| {
                            let (w, h) = viewport();
                            view! {
                                <div class="walk-enlarged" data-testid="walk-enlarged">
                                    <ScenePicture spec=spec width=w height=h label=words.clone() />
                                    <p class="walk-enlarged-caption">{words}</p>
                                    <button
                                        type="button"
                                        class="walk-close"
                                        data-testid="walk-enlarged-close"
                                        on:click=move |_| enlarged.set(None)
                                    >
                                        "Close picture"
                                    </button>
                                </div>
                            }
                        })
                }}
            </div>
        </Show>
    }
}

/// The window's inner size in CSS pixels (a tablet's 1024 x 768 when
/// unknown), for a picture that fills the screen.
fn viewport() -> (u32, u32) {
    let size = web_sys::window().and_then(|w| {
        let width = w.inner_width().ok()?.as_f64()?;
        let height = w.inner_height().ok()?.as_f64()?;
        Some((width.max(1.0) as u32, height.max(1.0) as u32))
    });
    size.unwrap_or((1024, 768))
}
