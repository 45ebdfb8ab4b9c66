//! The lens-options panel: which families to compare, with each parameter
//! either fixed by the user or left empty for the planner to choose.

use super::bind::row_field;
use super::fields::{ChoiceField, TextField};
use super::state::use_app_state;
use crate::scenario::fields::lens_field;
use crate::scenario::{FamilyChoice, LensOption, Scenario, MAX_OPTIONS};
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

/// Where an option's row stands in the list now (`None` once it is gone).
type At = Memo<Option<usize>>;

/// The path of `field` of the option at `at` (`options[1].label`),
/// following the option as it moves in the list.
fn option_path(at: At, field: &'static str) -> Signal<String> {
    Signal::derive(move || {
        at.get()
            .map(|i| format!("options[{i}].{field}"))
            .unwrap_or_default()
    })
}

/// The option at `at` (reactive), if it still exists.
fn option_at(at: At, s: &Scenario) -> Option<&LensOption> {
    at.get().and_then(|i| s.options.get(i))
}

/// The option at `at`, to change it, if it still exists.
fn option_at_mut(at: At, s: &mut Scenario) -> Option<&mut LensOption> {
    at.get_untracked().and_then(|i| s.options.get_mut(i))
}

/// The card of the lens option with row id `id`.
fn option_card(id: u64) -> impl IntoView {
    let state = use_app_state();
    let at: At = Memo::new(move |_| state.rows.with(|rows| rows.option_index(id)));
    let key = Memo::new(move |_| {
        state.scenario.with(|s| {
            option_at(at, s)
                .map(|o| family_key(&o.family))
                .unwrap_or("single_vision")
        })
    });
    let label = Signal::derive(move || {
        state.scenario.with(|s| {
            option_at(at, s)
                .map(|o| o.label.clone())
                .unwrap_or_default()
        })
    });
    let on_label = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(o) = option_at_mut(at, s) {
                o.label = v;
            }
        })
    });
    let label_path = option_path(at, "label");
    let label_problem = Signal::derive(move || {
        label_path
            .with(|p| state.problem_at(p))
            .map(|p| p.to_string())
    });
    let on_family = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(o) = option_at_mut(at, s) {
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
                        .map(|p| row_field(lens_field(p), at.into()))
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
