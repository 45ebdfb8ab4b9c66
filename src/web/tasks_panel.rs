//! The working-day panel: one card per task with its distance, position,
//! size, detail, hours and safety flags; adding a task is one action.

use super::bind::row_field;
use super::fields::{focus_test_id, CheckField, ChoiceField, TextField};
use super::state::use_app_state;
use crate::scenario::task_kinds::{task_kind, TASK_KINDS};
use crate::scenario::{fields, Scenario, Task, TaskFlags, VerticalPosition, MAX_TASKS};
use leptos::prelude::*;

/// Where a task's row stands in the list now (`None` once it is gone).
type At = Memo<Option<usize>>;

/// The task at `at` (reactive), if it still exists.
fn task_at(at: At, s: &Scenario) -> Option<&Task> {
    at.get().and_then(|i| s.tasks.get(i))
}

/// The path of `field` of the task at `at` (`tasks[1].name`), following
/// the task as it moves in the list.
fn task_path(at: At, field: &'static str) -> Signal<String> {
    Signal::derive(move || {
        at.get()
            .map(|i| format!("tasks[{i}].{field}"))
            .unwrap_or_default()
    })
}

/// The task at `at`, to change it, if it still exists.
fn task_at_mut(at: At, s: &mut Scenario) -> Option<&mut Task> {
    at.get_untracked().and_then(|i| s.tasks.get_mut(i))
}

/// A check box bound to one flag of the task at `at`.
fn flag_field(at: At, label: &'static str, flag: fn(&mut TaskFlags) -> &mut bool) -> impl IntoView {
    let state = use_app_state();
    let checked = Signal::derive(move || {
        state
            .scenario
            .with(|s| {
                task_at(at, s).map(|t| {
                    let mut flags = t.flags;
                    *flag(&mut flags)
                })
            })
            .unwrap_or(false)
    });
    let on_change = Callback::new(move |v: bool| {
        state.edit(|s| {
            if let Some(t) = task_at_mut(at, s) {
                *flag(&mut t.flags) = v;
            }
        })
    });
    view! { <CheckField label=label checked=checked on_change=on_change /> }
}

/// The vertical position of the task at `at`: a gaze angle or a height from the eyes.
fn position_fields(at: At) -> impl IntoView {
    let state = use_app_state();
    let by_angle = move || {
        state.scenario.with(|s| {
            task_at(at, s).is_none_or(|t| matches!(t.vertical, VerticalPosition::GazeAngle { .. }))
        })
    };
    let on_kind = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(t) = task_at_mut(at, s) {
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
                row_field(&fields::TASK_ANGLE, at.into()).into_any()
            } else {
                row_field(&fields::TASK_HEIGHT, at.into()).into_any()
            }
        }}
    }
}

/// The card of the task with row id `id`.
fn task_card(id: u64) -> impl IntoView {
    let state = use_app_state();
    let at: At = Memo::new(move |_| state.rows.with(|rows| rows.task_index(id)));
    let name = Signal::derive(move || {
        state
            .scenario
            .with(|s| task_at(at, s).map(|t| t.name.clone()).unwrap_or_default())
    });
    let on_name = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(t) = task_at_mut(at, s) {
                t.name = v;
            }
        })
    });
    let name_path = task_path(at, "name");
    let name_problem = Signal::derive(move || {
        name_path
            .with(|p| state.problem_at(p))
            .map(|p| p.to_string())
    });
    let name_test_id = Signal::derive(move || {
        at.get()
            .map(|i| format!("task-{i}-name"))
            .unwrap_or_default()
    });
    let remove = move |_| {
        // Focus lands on the undo button, so a second Enter puts the task
        // back instead of removing the next one.
        if state.remove_task(id) {
            focus_test_id("undo-remove");
        }
    };
    view! {
        <li class="task-card" data-testid="task-card">
            <div class="task-head">
                <TextField label="Task" value=name on_input=on_name problem=name_problem test_id=name_test_id />
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
                {row_field(&fields::TASK_DISTANCE, at.into())}
                {position_fields(at)}
                {[
                    &fields::TASK_SIDEWAYS,
                    &fields::TASK_WIDTH,
                    &fields::TASK_DETAIL,
                    &fields::TASK_HOURS,
                ]
                    .map(|f| row_field(f, at.into()))
                    .collect_view()}
            </div>
            <div class="flags">
                {flag_field(at, "Driving (road, mirrors, dashboard)", |f| &mut f.driving)}
                {flag_field(at, "Moving machinery", |f| &mut f.moving_machinery)}
                {flag_field(at, "Overhead", |f| &mut f.overhead)}
                {flag_field(at, "Screen text (detail is the character height)", |f| &mut f.screen)}
            </div>
            <fieldset class="flags">
                <legend>"Eye hazards"</legend>
                {flag_field(at, "Impact", |f| &mut f.hazards.impact)}
                {flag_field(at, "Splash or aerosol", |f| &mut f.hazards.splash_or_aerosol)}
                {flag_field(at, "Dust", |f| &mut f.hazards.dust)}
                {flag_field(at, "Optical radiation", |f| &mut f.hazards.optical_radiation)}
            </fieldset>
        </li>
    }
}

/// The working-day panel.
#[component]
pub fn TasksPanel() -> impl IntoView {
    let state = use_app_state();
    let count = move || state.scenario.with(|s| s.tasks.len());
    // The kind a new task starts from, with its sourced figures.
    let kind = RwSignal::new(&TASK_KINDS[0]);
    let kind_key = Signal::derive(move || kind.get().key);
    let on_kind = Callback::new(move |v: String| {
        if let Some(k) = task_kind(&v) {
            kind.set(k);
        }
    });
    let kinds: Vec<(&'static str, &'static str)> =
        TASK_KINDS.iter().map(|k| (k.key, k.label)).collect();
    let add = move |_: leptos::ev::MouseEvent| {
        let kind = kind.get_untracked();
        state.edit(|s| {
            if s.tasks.len() < MAX_TASKS {
                let name = format!("Task {}", s.tasks.len() + 1);
                s.tasks.push(kind.task(&name));
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
        if let Some(at) = state.put_back_task() {
            focus_test_id(&format!("task-{at}-name"));
        }
    };
    let undo_label = move || {
        state.rows.with(|rows| {
            rows.removed_task()
                .map(|task| format!("Put back \"{}\"", task.name))
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
                <For each=move || state.rows.with(|rows| rows.tasks().to_vec()) key=|id| *id let:id>
                    {task_card(id)}
                </For>
            </ol>
            <div class="add-task">
                <ChoiceField label="Kind of task to add" choices=kinds value=kind_key on_change=on_kind test_id="task-kind" />
                <p class="hint" data-testid="task-kind-source">
                    {move || format!("Starts from typical figures, to be measured on the job: {}.", kind.get().source)}
                </p>
            </div>
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
