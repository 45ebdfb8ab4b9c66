//! The wearer panel: age or measured amplitude, distance prescription,
//! fitting data, pupil and blur tolerance.

use super::bind::number_field;
use super::fields::{CheckField, ChoiceField};
use super::state::use_app_state;
use crate::scenario::fields;
use crate::scenario::{
    AdditionRounding, AmplitudeMethod, BlurTolerance, Correction, HorizontalBase,
    MeasuredAmplitude, Prescription, PupilSource, ReferencePlane, Scenario, VerticalBase,
};
use leptos::prelude::*;

/// The fields of one eye's distance prescription (`index` 0 right, 1 left):
/// sphere, cylinder, axis, and the prism with its bases.
fn eye_fields(
    eye: &'static str,
    index: usize,
    pick: fn(&Scenario) -> &Prescription,
    pick_mut: fn(&mut Scenario) -> &mut Prescription,
) -> impl IntoView {
    view! {
        <fieldset class="eye">
            <legend>{format!("{eye} eye")}</legend>
            {number_field(&fields::SPHERE, index)}
            {number_field(&fields::CYLINDER, index)}
            {number_field(&fields::AXIS, index)}
            {number_field(&fields::PRISM_HORIZONTAL, index)}
            {scenario_choice(
                format!("{eye} horizontal base"),
                [("in", "Base in", HorizontalBase::In), ("out", "Base out", HorizontalBase::Out)],
                move |s| pick(s).prism.horizontal_base,
                move |s, v| pick_mut(s).prism.horizontal_base = v,
            )}
            {number_field(&fields::PRISM_VERTICAL, index)}
            {scenario_choice(
                format!("{eye} vertical base"),
                [("up", "Base up", VerticalBase::Up), ("down", "Base down", VerticalBase::Down)],
                move |s| pick(s).prism.vertical_base,
                move |s, v| pick_mut(s).prism.vertical_base = v,
            )}
        </fieldset>
    }
}

/// A choice between two values of a scenario field: each a machine name,
/// the words shown and the value; `get` reads the field, `set` writes it.
fn scenario_choice<T: Copy + PartialEq + Send + Sync + 'static>(
    label: String,
    choices: [(&'static str, &'static str, T); 2],
    get: impl Fn(&Scenario) -> T + Copy + Send + Sync + 'static,
    set: impl Fn(&mut Scenario, T) + Copy + Send + Sync + 'static,
) -> impl IntoView {
    let state = use_app_state();
    let current = state.part(get);
    let value = Signal::derive(move || {
        let current = current.get();
        choices
            .iter()
            .find(|c| c.2 == current)
            .map_or(choices[0].0, |c| c.0)
    });
    let on_change = Callback::new(move |name: String| {
        if let Some(c) = choices.iter().find(|c| c.0 == name) {
            state.edit(|s| set(s, c.2));
        }
    });
    view! {
        <ChoiceField
            label=label
            choices=choices.iter().map(|c| (c.0, c.1)).collect()
            value=value
            on_change=on_change
        />
    }
}

/// How additions are rounded, and whether the prescribed addition is planned from.
fn addition_settings() -> impl IntoView {
    let state = use_app_state();
    let from_prescription = state.part(|s| s.settings.use_prescribed_addition);
    let on_prescription =
        Callback::new(move |v: bool| state.edit(|s| s.settings.use_prescribed_addition = v));
    view! {
        {scenario_choice(
            "Round additions".to_string(),
            [
                ("up", "Up to the next 0.25 D", AdditionRounding::Up),
                ("nearest", "To the nearest 0.25 D", AdditionRounding::Nearest),
            ],
            |s| s.settings.addition_rounding,
            |s, v| s.settings.addition_rounding = v,
        )}
        <CheckField
            label="Plan near additions from the prescribed addition"
            checked=from_prescription
            on_change=on_prescription
        />
    }
}

/// The amplitude source: estimated from age, or a measurement with its method and plane.
fn amplitude_fields() -> impl IntoView {
    let state = use_app_state();
    let measured = state.part(|s| s.wearer.measured_amplitude);
    let source = Signal::derive(move || match measured.get() {
        None => "age",
        Some(m) if m.method == AmplitudeMethod::PushUp => "push_up",
        Some(_) => "minus_lens",
    });
    let on_source = Callback::new(move |v: String| {
        state.edit(|s| {
            let method = match v.as_str() {
                "push_up" => Some(AmplitudeMethod::PushUp),
                "minus_lens" => Some(AmplitudeMethod::MinusLens),
                _ => None,
            };
            s.wearer.measured_amplitude = method.map(|method| MeasuredAmplitude {
                dioptres: s
                    .wearer
                    .measured_amplitude
                    .map_or(fields::MEASURED_AMPLITUDE.start(), |m| m.dioptres),
                method,
                plane: s
                    .wearer
                    .measured_amplitude
                    .map_or(ReferencePlane::Spectacle, |m| m.plane),
            });
        })
    });
    let plane = Signal::derive(move || match measured.get().map(|m| m.plane) {
        Some(ReferencePlane::Ocular) => "ocular",
        _ => "spectacle",
    });
    let on_plane = Callback::new(move |v: String| {
        state.edit(|s| {
            if let Some(m) = s.wearer.measured_amplitude.as_mut() {
                m.plane = if v == "ocular" {
                    ReferencePlane::Ocular
                } else {
                    ReferencePlane::Spectacle
                };
            }
        })
    });
    view! {
        {number_field(&fields::AGE, 0)}
        <ChoiceField
            label="Amplitude of accommodation"
            choices=vec![
                ("age", "Estimate from age"),
                ("push_up", "Measured: push-up"),
                ("minus_lens", "Measured: minus lens"),
            ]
            value=source
            on_change=on_source
            test_id="amplitude-source"
        />
        <Show when=move || measured.get().is_some()>
            {number_field(&fields::MEASURED_AMPLITUDE, 0)}
            <ChoiceField
                label="Measured at"
                choices=vec![("spectacle", "Spectacle plane"), ("ocular", "The eye (ocular)")]
                value=plane
                on_change=on_plane
            />
        </Show>
    }
}

/// Spectacles with a vertex distance, or contact lenses.
fn correction_fields() -> impl IntoView {
    let state = use_app_state();
    let is_spectacles = move || {
        state
            .scenario
            .with(|s| matches!(s.wearer.correction, Correction::Spectacles { .. }))
    };
    let on_kind = Callback::new(move |v: String| {
        state.edit(|s| {
            s.wearer.correction = if v == "contacts" {
                Correction::ContactLenses
            } else {
                Correction::Spectacles {
                    vertex_mm: fields::VERTEX.start(),
                }
            }
        })
    });
    view! {
        <ChoiceField
            label="Distance correction worn as"
            choices=vec![("spectacles", "Spectacles"), ("contacts", "Contact lenses")]
            value=Signal::derive(move || if is_spectacles() { "spectacles" } else { "contacts" })
            on_change=on_kind
        />
        <Show when=is_spectacles>
            {number_field(&fields::VERTEX, 0)}
        </Show>
    }
}

/// Pupil size (measured or from lighting) and the blur each task tolerates.
fn pupil_and_blur_fields() -> impl IntoView {
    let state = use_app_state();
    let pupil_measured = state.part(|s| matches!(s.wearer.pupil, PupilSource::Measured { .. }));
    let on_pupil = Callback::new(move |v: String| {
        state.edit(|s| {
            s.wearer.pupil = if v == "measured" {
                PupilSource::Measured {
                    diameter_mm: fields::PUPIL_DIAMETER.start(),
                }
            } else {
                PupilSource::FromLighting {
                    luminance_cd_m2: fields::LUMINANCE.start(),
                }
            }
        })
    });
    let clinical = move || {
        state
            .scenario
            .with(|s| matches!(s.wearer.blur_tolerance, BlurTolerance::Clinical { .. }))
    };
    let on_blur = Callback::new(move |v: String| {
        state.edit(|s| {
            s.wearer.blur_tolerance = if v == "clinical" {
                BlurTolerance::Clinical {
                    half_depth_d: fields::HALF_DEPTH.start(),
                }
            } else {
                BlurTolerance::FromDetail
            }
        })
    });
    view! {
        <ChoiceField
            label="Pupil size"
            choices=vec![("lighting", "Estimate from lighting and age"), ("measured", "Measured")]
            value=Signal::derive(move || if pupil_measured.get() { "measured" } else { "lighting" })
            on_change=on_pupil
        />
        {move || {
            if pupil_measured.get() {
                number_field(&fields::PUPIL_DIAMETER, 0)
                    .into_any()
            } else {
                number_field(&fields::LUMINANCE, 0)
                    .into_any()
            }
        }}
        <ChoiceField
            label="Blur tolerance"
            choices=vec![("detail", "From each task's detail size"), ("clinical", "Clinical tolerance")]
            value=Signal::derive(move || if clinical() { "clinical" } else { "detail" })
            on_change=on_blur
        />
        <Show when=clinical>
            {number_field(&fields::HALF_DEPTH, 0)}
        </Show>
    }
}

/// The wearer panel.
#[component]
pub fn WearerPanel() -> impl IntoView {
    view! {
        <section class="panel wearer" aria-labelledby="wearer-heading">
            <h2 id="wearer-heading">"Wearer"</h2>
            <div class="grid">{amplitude_fields()}</div>
            <div class="eyes">
                {eye_fields("Right", 0, |s| &s.wearer.right, |s| &mut s.wearer.right)}
                {eye_fields("Left", 1, |s| &s.wearer.left, |s| &mut s.wearer.left)}
            </div>
            <div class="grid">
                {number_field(&fields::PRESCRIBED_ADDITION, 0)}
                {correction_fields()}
            </div>
            <h3>"Fitting"</h3>
            <div class="grid">
                {fields::FITTING.iter().map(|f| number_field(f, 0)).collect_view()}
            </div>
            <h3>"Sustained work"</h3>
            <div class="grid">
                {number_field(&fields::USABLE_FRACTION, 0)}
                {pupil_and_blur_fields()}
            </div>
            <fieldset class="grid">
                <legend>"Limits the plan is judged against"</legend>
                {number_field(&fields::DRIVING_ACUITY, 0)}
                {number_field(&fields::IMBALANCE_LIMIT, 0)}
                {addition_settings()}
            </fieldset>
        </section>
    }
}
