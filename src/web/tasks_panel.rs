//! The working-day panel: one card per task with its distance, position,
//! size, detail, hours and safety flags; adding a task is one action.

use super::bind::{row_field, Row};
use super::fields::{focus_test_id, CheckField, ChoiceField, TextField};
use super::state::use_app_state;
use crate::scenario::task_kinds::{task_kind, TASK_KINDS};
use crate::scenario::{fields, Problem, Scenario, Task, TaskFlags, VerticalPosition, MAX_TASKS};
use leptos::prelude::*;

/// What `read` takes from the task of `row`, re-read only when that task
/// changes; `None` once the task is gone.
fn task_part<T: Clone + PartialEq + Send + Sync + 'static>(
    row: Row,
    read: impl Fn(&Task) -> T + Send + Sync + 'static,
) -> Memo<Option<T>> {
    row.part(move |s, i| s.tasks.get(i).map(&read))
}

/// The task of `row`, to change it, if it still exists.
fn task_at_mut(row: Row, s: &mut Scenario) -> Option<&mut Task> {
    row.at.get_untracked().and_then(|i| s.tasks.get_mut(i))
}

/// One flag of a task: its label, the word the summary uses, and where it is.
type TaskFlag = (&'static str, &'static str, fn(&mut TaskFlags) -> &mut bool);

/// The flags that say what kind of task it is.
const KIND_FLAGS: [TaskFlag; 4] = [
    ("Driving (road, mirrors, dashboard)", "driving", |f| {
        &mut f.driving
    }),
    ("Moving machinery", "moving machinery", |f| {
        &mut f.moving_machinery
    }),
    ("Overhead", "overhead", |f| &mut f.overhead),
    (
        "Screen text (detail is the character height)",
        "screen text",
        |f| &mut f.screen,
    ),
];

/// The eye hazards of a task.
const HAZARD_FLAGS: [TaskFlag; 4] = [
    ("Impact", "impact", |f| &mut f.hazards.impact),
    ("Splash or aerosol", "splash or aerosol", |f| {
        &mut f.hazards.splash_or_aerosol
    }),
    ("Dust", "dust", |f| &mut f.hazards.dust),
    ("Optical radiation", "optical radiation", |f| {
        &mut f.hazards.optical_radiation
    }),
];

/// The flags set on `flags`, in words ("screen text, impact"), or "none".
fn flags_in_words(mut flags: TaskFlags) -> String {
    let set: Vec<&str> = KIND_FLAGS
        .iter()
        .chain(&HAZARD_FLAGS)
        .filter(|(_, _, flag)| *flag(&mut flags))
        .map(|(_, word, _)| *word)
        .collect();
    if set.is_empty() {
        "none".to_string()
    } else {
        set.join(", ")
    }
}

/// A check box bound to one flag of the task of `row`.
fn flag_field(
    row: Row,
    label: &'static str,
    flag: fn(&mut TaskFlags) -> &mut bool,
) -> impl IntoView {
    let state = use_app_state();
    let on = task_part(row, move |t| {
        let mut flags = t.flags;
        *flag(&mut flags)
    });
    let checked = Signal::derive(move || on.get().unwrap_or(false));
    let on_change = Callback::new(move |v: bool| {
        state.edit(|s| {
            if let Some(t) = task_at_mut(row, s) {
                *flag(&mut t.flags) = v;
            }
        })
    });
    view! { <CheckField label=label checked=checked on_change=on_change /> }
}

/// The vertical position of the task of `row`: a gaze angle or a height from the eyes.
fn position_fields(row: Row) -> impl IntoView {
    let state = use_app_state();
    let height = task_part(row, |t| {
        matches!(t.vertical, VerticalPosition::HeightFromEyes { .. })
    });
    let by_angle = Signal::derive(move || height.get() != Some(true));
    let on_kind = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(t) = task_at_mut(row, s) {
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
            value=Signal::derive(move || if by_angle.get() { "angle" } else { "height" })
            on_change=on_kind
        />
        {move || {
            if by_angle.get() {
                row_field(&fields::TASK_ANGLE, row).into_any()
            } else {
                row_field(&fields::TASK_HEIGHT, row).into_any()
            }
        }}
    }
}

/// The card of the task with row id `id`.
fn task_card(id: u64) -> impl IntoView {
    let state = use_app_state();
    let at = Memo::new(move |_| state.rows.with(|rows| rows.task_index(id)));
    let row = Row::listed(id, at);
    let name = task_part(row, |t| t.name.clone());
    let name = Signal::derive(move || name.get().unwrap_or_default());
    let on_name = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(t) = task_at_mut(row, s) {
                t.name = v;
            }
        })
    });
    let name_path = row.path("tasks", "name");
    let flags_set = task_part(row, |t| flags_in_words(t.flags));
    let flags_set = move || flags_set.get().unwrap_or_default();
    let name_problem = row.problem(name_path, Problem::to_string);
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
                {row_field(&fields::TASK_DISTANCE, row)}
                {position_fields(row)}
                {[
                    &fields::TASK_SIDEWAYS,
                    &fields::TASK_WIDTH,
                    &fields::TASK_DETAIL,
                    &fields::TASK_HOURS,
                ]
                    .map(|f| row_field(f, row))
                    .collect_view()}
            </div>
            // The flags fold away so that a task takes a few lines; the
            // summary names every flag set, so none is hidden unseen.
            <details class="task-flags">
                <summary>"Flags and eye hazards: " {flags_set}</summary>
                <div class="flags">
                    {KIND_FLAGS.map(|(label, _, flag)| flag_field(row, label, flag)).collect_view()}
                </div>
                <fieldset class="flags">
                    <legend>"Eye hazards"</legend>
                    {HAZARD_FLAGS.map(|(label, _, flag)| flag_field(row, label, flag)).collect_view()}
                </fieldset>
            </details>
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
    let tasks_problem = state.problem_at(Signal::stored("tasks".to_string()), Problem::to_string);
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
