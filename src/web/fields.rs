//! Form fields that keep what the user typed: a number field shows the
//! user's own text until the value changes from elsewhere, refuses text that
//! is not a number with a message, and passes only parsed numbers on. A
//! field's typed text lives as long as the field: rows are keyed by stable
//! ids, and a scenario opened or a unit switch draws fresh rows. Every field
//! has a visible label.

use super::state::use_app_state;
use crate::display::{parse_number, trim_number};
use leptos::prelude::*;
use std::sync::atomic::{AtomicUsize, Ordering};

/// A fresh element id for pairing labels and messages with inputs.
pub fn unique_id(prefix: &str) -> String {
    static NEXT: AtomicUsize = AtomicUsize::new(0);
    format!("{prefix}-{}", NEXT.fetch_add(1, Ordering::Relaxed))
}

/// Moves the keyboard focus to the element with test id `id` once the
/// next frame has drawn it.
pub fn focus_test_id(id: &str) {
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

/// Whether two field values are the same number, allowing for the rounding of
/// a unit conversion there and back.
fn same_value(a: Option<f64>, b: Option<f64>) -> bool {
    match (a, b) {
        (Some(a), Some(b)) => (a - b).abs() <= 1e-9 * a.abs().max(1.0),
        (None, None) => true,
        _ => false,
    }
}

/// A number as a field shows it: at most `decimals` decimals, and with an
/// explicit sign on powers (two decimals, as prescriptions are written).
fn written(value: f64, decimals: usize, signed: bool) -> String {
    if signed {
        crate::core::units::Dioptres(value).signed()
    } else {
        trim_number(value, decimals)
    }
}

/// A labelled number input with its unit and a message line.
#[component]
pub fn NumberField(
    /// The visible label.
    #[prop(into)]
    label: String,
    /// The unit written after the input ("cm", "D", "mm").
    #[prop(into)]
    unit: Signal<String>,
    /// The current value in the unit shown; `None` is an empty optional field.
    #[prop(into)]
    value: Signal<Option<f64>>,
    /// Receives every accepted value, in the unit shown.
    on_input: Callback<Option<f64>>,
    /// The validation message for the current value, if any.
    #[prop(into)]
    problem: Signal<Option<String>>,
    /// Whether an empty field is allowed (it then means "not given").
    #[prop(optional)]
    optional: bool,
    /// Placeholder shown in an empty optional field.
    #[prop(optional, into)]
    placeholder: String,
    /// Decimals shown when the value is written from elsewhere.
    #[prop(default = 2)]
    decimals: usize,
    /// Whether a value written from elsewhere shows its sign, as powers are
    /// written on prescriptions ("+0.75").
    #[prop(optional)]
    signed: bool,
    /// A short help text (what the number is, how it is measured, the
    /// usual range), opened by a button beside the label and read out as
    /// the input's description.
    #[prop(optional, into)]
    help: String,
    /// A test id for the browser journeys (it follows a row that moves).
    #[prop(optional, into)]
    test_id: Signal<String>,
) -> impl IntoView {
    let id = unique_id("field");
    let message_id = format!("{id}-msg");
    let help_id = format!("{id}-help");
    let help_open = RwSignal::new(false);
    let has_help = !help.is_empty();
    let described_by = if help.is_empty() {
        message_id.clone()
    } else {
        format!("{help_id} {message_id}")
    };
    let state = use_app_state();
    // What the user typed and the value the field held then.
    let typed: RwSignal<Option<(String, Option<f64>)>> = RwSignal::new(None);
    let own = move |at: Option<f64>| same_value(at, value.get());
    let text = move || {
        let current = value.get();
        typed
            .with(|t| match t {
                Some((text, at)) if own(*at) => Some(text.clone()),
                _ => None,
            })
            .unwrap_or_else(|| {
                current
                    .map(|v| written(v, decimals, signed))
                    .unwrap_or_default()
            })
    };
    let parse_message = move || {
        typed.with(|t| match t {
            Some((text, at)) if own(*at) => {
                if optional && text.trim().is_empty() {
                    None
                } else {
                    parse_number(text).err().map(|e| e.to_string())
                }
            }
            _ => None,
        })
    };
    // One memo for the three places that show it: a keystroke that leaves
    // the message as it was re-runs none of them.
    let message = Memo::new(move |_| parse_message().or_else(|| problem.get()));
    let invalid = move || message.with(Option::is_some);
    let unparsed_key = id.clone();
    // Only a change of the set is told to its readers: most keystrokes
    // leave it as it was.
    let mark_unparsed = move |bad: bool| {
        state.unparsed.maybe_update(|set| {
            if bad {
                set.insert(unparsed_key.clone())
            } else {
                set.remove(&unparsed_key)
            }
        })
    };
    let on_text = move |ev| {
        let text = event_target_value(&ev);
        let parsed = if optional && text.trim().is_empty() {
            Ok(None)
        } else {
            parse_number(&text).map(Some)
        };
        mark_unparsed(parsed.is_err());
        match parsed {
            Ok(v) => {
                typed.set(Some((text, v)));
                on_input.run(v);
            }
            Err(_) => typed.set(Some((text, value.get_untracked()))),
        }
    };
    let forget_key = id.clone();
    on_cleanup(move || {
        state.unparsed.update(|set| {
            set.remove(&forget_key);
        })
    });
    view! {
        <div class="field" class:invalid=invalid>
            <span class="label-row">
                <label for=id.clone()>{label}</label>
                {(!help.is_empty())
                    .then(|| {
                        view! {
                            // Out of the Tab order, so that Tab goes from number to
                            // number: from the keyboard, "?" in the field opens
                            // the help, and a screen reader reads it with the
                            // field (it is the input's description).
                            <button
                                type="button"
                                class="help-toggle"
                                tabindex="-1"
                                title="Help (or press ? in the field)"
                                aria-label="Help"
                                aria-controls=help_id.clone()
                                aria-expanded=move || help_open.get().to_string()
                                on:click=move |_| help_open.update(|open| *open = !*open)
                            >
                                <span aria-hidden="true">"?"</span>
                            </button>
                        }
                    })}
            </span>
            <span class="entry">
                <input
                    id=id
                    type="text"
                    inputmode="decimal"
                    autocomplete="off"
                    placeholder=placeholder
                    data-testid=test_id
                    prop:value=text
                    aria-invalid=move || if invalid() { "true" } else { "false" }
                    aria-describedby=described_by
                    on:input=on_text
                    on:keydown=move |ev: web_sys::KeyboardEvent| {
                        if has_help && ev.key() == "?" {
                            ev.prevent_default();
                            help_open.update(|open| *open = !*open);
                        }
                    }
                    aria-keyshortcuts=has_help.then_some("?")
                />
                <span class="unit">{unit}</span>
            </span>
            {(!help.is_empty())
                .then(|| {
                    view! {
                        <small class="help" id=help_id hidden=move || !help_open.get()>
                            {help}
                        </small>
                    }
                })}
            <span class="message" id=message_id aria-live="polite">
                {message}
            </span>
        </div>
    }
}

/// A labelled single-line text input.
#[component]
pub fn TextField(
    /// The visible label.
    #[prop(into)]
    label: String,
    /// The current text.
    #[prop(into)]
    value: Signal<String>,
    /// Receives every edit.
    on_input: Callback<String>,
    /// The validation message, if any.
    #[prop(into)]
    problem: Signal<Option<String>>,
    /// A test id for the browser journeys (it follows a row that moves).
    #[prop(optional, into)]
    test_id: Signal<String>,
) -> impl IntoView {
    let id = unique_id("text");
    let message_id = format!("{id}-msg");
    view! {
        <div class="field" class:invalid=move || problem.get().is_some()>
            <label for=id.clone()>{label}</label>
            <input
                id=id
                type="text"
                autocomplete="off"
                data-testid=test_id
                prop:value=move || value.get()
                aria-describedby=message_id.clone()
                on:input=move |ev| on_input.run(event_target_value(&ev))
            />
            <span class="message" id=message_id aria-live="polite">
                {move || problem.get()}
            </span>
        </div>
    }
}

/// A labelled choice among fixed options, each a (value, words) pair.
#[component]
pub fn ChoiceField(
    /// The visible label.
    #[prop(into)]
    label: String,
    /// The options: machine value and the words shown.
    choices: Vec<(&'static str, &'static str)>,
    /// The machine value currently chosen.
    #[prop(into)]
    value: Signal<&'static str>,
    /// Receives the machine value of a new choice.
    on_change: Callback<String>,
    /// A test id for the browser journeys.
    #[prop(optional, into)]
    test_id: String,
) -> impl IntoView {
    let id = unique_id("choice");
    view! {
        <div class="field">
            <label for=id.clone()>{label}</label>
            <select
                id=id
                data-testid=test_id
                on:change=move |ev| on_change.run(event_target_value(&ev))
            >
                {choices
                    .into_iter()
                    .map(|(v, words)| {
                        view! {
                            <option value=v selected=move || value.get() == v>
                                {words}
                            </option>
                        }
                    })
                    .collect_view()}
            </select>
        </div>
    }
}

/// A labelled check box.
#[component]
pub fn CheckField(
    /// The visible label.
    #[prop(into)]
    label: String,
    /// Whether the box is ticked.
    #[prop(into)]
    checked: Signal<bool>,
    /// Receives the new state.
    on_change: Callback<bool>,
) -> impl IntoView {
    let id = unique_id("check");
    view! {
        <div class="check">
            <input
                id=id.clone()
                type="checkbox"
                prop:checked=move || checked.get()
                on:change=move |ev| on_change.run(event_target_checked(&ev))
            />
            <label for=id>{label}</label>
        </div>
    }
}
