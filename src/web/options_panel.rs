//! The lens-options panel: which families to compare, with each parameter
//! either fixed by the user or left empty for the planner to choose.

use super::bind::{row_field, Row};
use super::fields::{ChoiceField, TextField};
use super::state::use_app_state;
use crate::scenario::fields::lens_field;
use crate::scenario::{FamilyChoice, LensOption, Problem, Scenario, MAX_OPTIONS};
use leptos::prelude::*;

/// Machine value and words for each family, in the order of
/// [`FamilyChoice::ALL_OPEN`].
const FAMILIES: [(&str, &str); 6] = [
    ("single_vision", "Single vision"),
    ("bifocal", "Bifocal"),
    ("trifocal", "Trifocal"),
    ("progressive", "Progressive"),
    ("degressive", "Occupational (degressive)"),
    ("double_segment", "Double segment"),
];

/// The machine value of a family choice.
fn family_key(f: &FamilyChoice) -> &'static str {
    let same = |o: &FamilyChoice| std::mem::discriminant(o) == std::mem::discriminant(f);
    let at = FamilyChoice::ALL_OPEN.iter().position(same).unwrap_or(0);
    FAMILIES[at].0
}

/// The family with machine value `key`, every parameter left to the planner.
fn open_family(key: &str) -> FamilyChoice {
    let at = FAMILIES.iter().position(|(k, _)| *k == key).unwrap_or(0);
    FamilyChoice::ALL_OPEN[at]
}

/// The option of `row`, to change it, if it still exists.
fn option_at_mut(row: Row, s: &mut Scenario) -> Option<&mut LensOption> {
    row.at.get_untracked().and_then(|i| s.options.get_mut(i))
}

/// The card of the lens option with row id `id`.
fn option_card(id: u64) -> impl IntoView {
    let state = use_app_state();
    let at = Memo::new(move |_| state.rows.with(|rows| rows.option_index(id)));
    let row = Row::listed(id, at);
    let family = row.part(|s, i| s.options.get(i).map(|o| family_key(&o.family)));
    let key = Memo::new(move |_| family.get().unwrap_or("single_vision"));
    let label = row.part(|s, i| s.options.get(i).map(|o| o.label.clone()));
    let label = Signal::derive(move || label.get().unwrap_or_default());
    let on_label = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(o) = option_at_mut(row, s) {
                o.label = v;
            }
        })
    });
    let label_path = row.path("options", "label");
    let label_problem = row.problem(label_path, Problem::to_string);
    let on_family = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(o) = option_at_mut(row, s) {
                o.family = open_family(&v);
            }
        })
    });
    let remove = move |_| state.remove_option(id);
    view! {
        <li class="option-card" data-testid="option-card">
            <div class="task-head">
                <TextField label="Option" value=label on_input=on_label problem=label_problem />
                <button
                    type="button"
                    class="quiet"
                    aria-label=move || format!("Remove option {}", label.get())
                    on:click=remove
                >
                    "Remove"
                </button>
            </div>
            <div class="grid">
                <ChoiceField label="Lens family" choices=FAMILIES.to_vec() value=key on_change=on_family />
                {move || {
                    open_family(key.get())
                        .parameters()
                        .map(|p| row_field(lens_field(p), row))
                        .collect_view()
                }}
            </div>
        </li>
    }
}

/// The lens-options panel.
#[component]
pub fn OptionsPanel() -> impl IntoView {
    let state = use_app_state();
    let count = move || state.scenario.with(|s| s.options.len());
    let add = move |_: leptos::ev::MouseEvent| {
        state.edit(|s| {
            if s.options.len() < MAX_OPTIONS {
                s.options.push(LensOption {
                    label: format!("Option {}", s.options.len() + 1),
                    family: open_family("progressive"),
                });
            }
        })
    };
    view! {
        <section class="panel options" aria-labelledby="options-heading">
            <h2 id="options-heading">"Lens options"</h2>
            <p class="hint">"Leave a parameter empty and the planner chooses it."</p>
            <ol class="option-list">
                <For each=move || state.rows.with(|rows| rows.options().to_vec()) key=|id| *id let:id>
                    {option_card(id)}
                </For>
            </ol>
            <button
                type="button"
                data-testid="add-option"
                disabled=move || { count() >= MAX_OPTIONS }
                on:click=add
            >
                "Add lens option"
            </button>
        </section>
    }
}
