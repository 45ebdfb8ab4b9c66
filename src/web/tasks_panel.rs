//! The working-day panel: one card per task with its distance, position,
//! size, detail, hours and safety flags; adding a task is one action.

use super::bind::number_field;
use super::fields::{CheckField, ChoiceField, TextField};
use super::state::use_app_state;
use crate::scenario::{fields, Task, TaskFlags, VerticalPosition, MAX_TASKS};
use leptos::prelude::*;

/// The task last removed, where it stood, and the era of the list after
/// the removal (an undo is offered only while the list keeps that shape).
#[derive(Debug, Clone)]
struct Removed {
    index: usize,
    task: Task,
    era: u64,
}

/// Moves the keyboard focus to the element with test id `id` once the
/// next frame has drawn it.
fn focus_test_id(id: &str) {
    let selector = format!("[data-testid=\"{id}\"]");
    request_animation_frame(move || {
        let element = web_sys::window()
            .and_then(|w| w.document())
            .and_then(|d| d.query_selector(&selector).ok().flatten())
            .and_then(|e| wasm_bindgen::JsCast::dyn_into::<web_sys::HtmlElement>(e).ok());
        if let Some(element) = element {
            let _ = element.focus();
        }
    });
}

/// A check box bound to one flag of task `i`.
fn flag_field(
    i: usize,
    label: &'static str,
    flag: fn(&mut TaskFlags) -> &mut bool,
) -> impl IntoView {
    let state = use_app_state();
    let checked = Signal::derive(move || {
        state
            .scenario
            .with(|s| {
                s.tasks.get(i).map(|t| {
                    let mut flags = t.flags;
                    *flag(&mut flags)
                })
            })
            .unwrap_or(false)
    });
    let on_change = Callback::new(move |v: bool| {
        state.edit(|s| {
            if let Some(t) = s.tasks.get_mut(i) {
                *flag(&mut t.flags) = v;
            }
        })
    });
    view! { <CheckField label=label checked=checked on_change=on_change /> }
}

/// The vertical position of task `i`: a gaze angle or a height from the eyes.
fn position_fields(i: usize) -> impl IntoView {
    let state = use_app_state();
    let by_angle = move || {
        state.scenario.with(|s| {
            s.tasks
                .get(i)
                .is_none_or(|t| matches!(t.vertical, VerticalPosition::GazeAngle { .. }))
        })
    };
    let on_kind = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(t) = s.tasks.get_mut(i) {
                t.vertical = if v == "height" {
                    VerticalPosition::HeightFromEyes {
                        metres: fields::TASK_HEIGHT.start(),
                    }
                } else {
                    VerticalPosition::GazeAngle {
                        degrees: fields::TASK_ANGLE.start(),
                    }
                };
            }
        })
    });
    view! {
        <ChoiceField
            label="Position given as"
            choices=vec![("angle", "Gaze angle"), ("height", "Height from eyes")]
            value=Signal::derive(move || if by_angle() { "angle" } else { "height" })
            on_change=on_kind
        />
        {move || {
            if by_angle() {
                number_field(&fields::TASK_ANGLE, i).into_any()
            } else {
                number_field(&fields::TASK_HEIGHT, i).into_any()
            }
        }}
    }
}

/// The card of task `i`.
fn task_card(i: usize, removed: RwSignal<Option<Removed>>) -> impl IntoView {
    let state = use_app_state();
    let name = Signal::derive(move || {
        state
            .scenario
            .with(|s| s.tasks.get(i).map(|t| t.name.clone()).unwrap_or_default())
    });
    let on_name = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(t) = s.tasks.get_mut(i) {
                t.name = v;
            }
        })
    });
    let name_problem = Signal::derive(move || {
        state
            .problem_at(&format!("tasks[{i}].name"))
            .map(|p| p.to_string())
    });
    let remove = move |_| {
        let mut taken = None;
        state.reshape(|s| taken = s.remove_task(i));
        if let Some(task) = taken {
            removed.set(Some(Removed {
                index: i,
                task,
                era: state.era.get_untracked(),
            }));
            // Focus lands on the undo button, so a second Enter puts the
            // task back instead of removing the next one.
            focus_test_id("undo-remove");
        }
    };
    view! {
        <li class="task-card" data-testid="task-card">
            <div class="task-head">
                <TextField label="Task" value=name on_input=on_name problem=name_problem test_id=format!("task-{i}-name") />
                <button
                    type="button"
                    class="quiet"
                    aria-label=move || format!("Remove task {}", name.get())
                    on:click=remove
                >
                    "Remove"
                </button>
            </div>
            <div class="grid">
                {number_field(&fields::TASK_DISTANCE, i)}
                {position_fields(i)}
                {[
                    &fields::TASK_SIDEWAYS,
                    &fields::TASK_WIDTH,
                    &fields::TASK_DETAIL,
                    &fields::TASK_HOURS,
                ]
                    .map(|f| number_field(f, i))
                    .collect_view()}
            </div>
            <div class="flags">
                {flag_field(i, "Driving (road, mirrors, dashboard)", |f| &mut f.driving)}
                {flag_field(i, "Moving machinery", |f| &mut f.moving_machinery)}
                {flag_field(i, "Overhead", |f| &mut f.overhead)}
                {flag_field(i, "Screen text (detail is the character height)", |f| &mut f.screen)}
            </div>
            <fieldset class="flags">
                <legend>"Eye hazards"</legend>
                {flag_field(i, "Impact", |f| &mut f.hazards.impact)}
                {flag_field(i, "Splash or aerosol", |f| &mut f.hazards.splash_or_aerosol)}
                {flag_field(i, "Dust", |f| &mut f.hazards.dust)}
                {flag_field(i, "Optical radiation", |f| &mut f.hazards.optical_radiation)}
            </fieldset>
        </li>
    }
}

/// The working-day panel.
#[component]
pub fn TasksPanel() -> impl IntoView {
    let state = use_app_state();
    let removed: RwSignal<Option<Removed>> = RwSignal::new(None);
    let count = move || state.scenario.with(|s| s.tasks.len());
    let add = move |_: leptos::ev::MouseEvent| {
        state.edit(|s| {
            if s.tasks.len() < MAX_TASKS {
                let name = format!("Task {}", s.tasks.len() + 1);
                s.tasks.push(Task::desk_screen(&name));
            }
        });
        // Put the cursor in the new task's name once it is drawn.
        let last = state
            .scenario
            .with_untracked(|s| s.tasks.len())
            .saturating_sub(1);
        focus_test_id(&format!("task-{last}-name"));
    };
    let undo = move |_| {
        if let Some(r) = removed.get_untracked() {
            // Only while nothing else reshaped the list (another removal, a
            // scenario opened, the unit switched) does the place still fit.
            if r.era == state.era.get_untracked() {
                state.reshape(|s| s.restore_task(r.index, r.task.clone()));
                focus_test_id(&format!("task-{}-name", r.index));
            }
        }
        removed.set(None);
    };
    let undo_label = move || {
        removed.with(|r| {
            r.as_ref()
                .filter(|r| r.era == state.era.get())
                .map(|r| format!("Put back \"{}\"", r.task.name))
        })
    };
    let tasks_problem = move || state.problem_at("tasks").map(|p| p.to_string());
    view! {
        <section class="panel tasks" aria-labelledby="tasks-heading">
            <h2 id="tasks-heading">"Working day"</h2>
            <p class="message" role="status">{tasks_problem}</p>
            {move || undo_label().map(|label| view! {
                <p class="undo" role="status">
                    "Task removed. "
                    <button type="button" class="quiet" data-testid="undo-remove" on:click=undo>{label}</button>
                </p>
            })}
            <ol class="task-list">
                <For each=move || 0..count() key=|i| *i let:i>
                    {task_card(i, removed)}
                </For>
            </ol>
            <button
                type="button"
                class="primary"
                data-testid="add-task"
                disabled=move || { count() >= MAX_TASKS }
                on:click=add
            >
                "Add task"
            </button>
        </section>
    }
}
