//! The wearer panel: age or measured amplitude, distance prescription,
//! fitting data, pupil and blur tolerance.

use super::bind::{scenario_number, Shown};
use super::fields::{CheckField, ChoiceField};
use super::state::use_app_state;
use crate::scenario::{
    AdditionRounding, AmplitudeMethod, BlurTolerance, Correction, HorizontalBase,
    MeasuredAmplitude, Prescription, PupilSource, ReferencePlane, Scenario, VerticalBase,
};
use leptos::prelude::*;

/// The three fields of one eye's distance prescription.
fn eye_fields(
    eye: &'static str,
    pick: fn(&Scenario) -> &Prescription,
    pick_mut: fn(&mut Scenario) -> &mut Prescription,
) -> impl IntoView {
    let key = eye.to_lowercase();
    view! {
        <fieldset class="eye">
            <legend>{format!("{eye} eye")}</legend>
            {scenario_number(
                "Sphere",
                format!("wearer.{key}.sphere_d"),
                Shown::As("D"),
                move |s| Some(pick(s).sphere_d),
                move |s, v| pick_mut(s).sphere_d = v.unwrap_or(0.0),
                false,
            )}
            {scenario_number(
                "Cylinder",
                format!("wearer.{key}.cylinder_d"),
                Shown::As("D"),
                move |s| Some(pick(s).cylinder_d),
                move |s, v| pick_mut(s).cylinder_d = v.unwrap_or(0.0),
                false,
            )}
            {scenario_number(
                "Axis",
                format!("wearer.{key}.axis_deg"),
                Shown::As("°"),
                move |s| Some(pick(s).axis_deg),
                move |s, v| pick_mut(s).axis_deg = v.unwrap_or(0.0),
                false,
            )}
            {prism_fields(eye, key, pick, pick_mut)}
        </fieldset>
    }
}

/// The prescribed prism of one eye: horizontal and vertical amounts with their bases.
fn prism_fields(
    eye: &'static str,
    key: String,
    pick: fn(&Scenario) -> &Prescription,
    pick_mut: fn(&mut Scenario) -> &mut Prescription,
) -> impl IntoView {
    view! {
        {scenario_number(
            "Horizontal prism",
            format!("wearer.{key}.prism.horizontal_pd"),
            Shown::As("Δ"),
            move |s| Some(pick(s).prism.horizontal_pd),
            move |s, v| pick_mut(s).prism.horizontal_pd = v.unwrap_or(0.0),
            false,
        )}
        {scenario_choice(
            format!("{eye} horizontal base"),
            [("in", "Base in", HorizontalBase::In), ("out", "Base out", HorizontalBase::Out)],
            move |s| pick(s).prism.horizontal_base,
            move |s, v| pick_mut(s).prism.horizontal_base = v,
        )}
        {scenario_number(
            "Vertical prism",
            format!("wearer.{key}.prism.vertical_pd"),
            Shown::As("Δ"),
            move |s| Some(pick(s).prism.vertical_pd),
            move |s, v| pick_mut(s).prism.vertical_pd = v.unwrap_or(0.0),
            false,
        )}
        {scenario_choice(
            format!("{eye} vertical base"),
            [("up", "Base up", VerticalBase::Up), ("down", "Base down", VerticalBase::Down)],
            move |s| pick(s).prism.vertical_base,
            move |s, v| pick_mut(s).prism.vertical_base = v,
        )}
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
    let value = Signal::derive(move || {
        let current = state.scenario.with(get);
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
    let from_prescription =
        Signal::derive(move || state.scenario.with(|s| s.settings.use_prescribed_addition));
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
    let measured = move || state.scenario.with(|s| s.wearer.measured_amplitude);
    let source = Signal::derive(move || match measured() {
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
                dioptres: s.wearer.measured_amplitude.map_or(4.0, |m| m.dioptres),
                method,
                plane: s
                    .wearer
                    .measured_amplitude
                    .map_or(ReferencePlane::Spectacle, |m| m.plane),
            });
        })
    });
    let plane = Signal::derive(move || match measured().map(|m| m.plane) {
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
        {scenario_number(
            "Age",
            "wearer.age_years".into(),
            Shown::As("years"),
            |s| Some(s.wearer.age_years),
            |s, v| s.wearer.age_years = v.unwrap_or(0.0),
            false,
        )}
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
        <Show when=move || measured().is_some()>
            {scenario_number(
                "Measured amplitude",
                "wearer.measured_amplitude.dioptres".into(),
                Shown::As("D"),
                |s| s.wearer.measured_amplitude.map(|m| m.dioptres),
                |s, v| {
                    if let Some(m) = s.wearer.measured_amplitude.as_mut() {
                        m.dioptres = v.unwrap_or(0.0);
                    }
                },
                false,
            )}
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
                Correction::Spectacles { vertex_mm: 12.0 }
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
            {scenario_number(
                "Vertex distance",
                "wearer.correction.vertex_mm".into(),
                Shown::As("mm"),
                |s| match s.wearer.correction {
                    Correction::Spectacles { vertex_mm } => Some(vertex_mm),
                    Correction::ContactLenses => None,
                },
                |s, v| s.wearer.correction = Correction::Spectacles { vertex_mm: v.unwrap_or(0.0) },
                false,
            )}
        </Show>
    }
}

/// Pupil size (measured or from lighting) and the blur each task tolerates.
fn pupil_and_blur_fields() -> impl IntoView {
    let state = use_app_state();
    let pupil_measured = move || {
        state
            .scenario
            .with(|s| matches!(s.wearer.pupil, PupilSource::Measured { .. }))
    };
    let on_pupil = Callback::new(move |v: String| {
        state.edit(|s| {
            s.wearer.pupil = if v == "measured" {
                PupilSource::Measured { diameter_mm: 4.0 }
            } else {
                PupilSource::FromLighting {
                    luminance_cd_m2: 100.0,
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
                BlurTolerance::Clinical { half_depth_d: 0.25 }
            } else {
                BlurTolerance::FromDetail
            }
        })
    });
    view! {
        <ChoiceField
            label="Pupil size"
            choices=vec![("lighting", "Estimate from lighting and age"), ("measured", "Measured")]
            value=Signal::derive(move || if pupil_measured() { "measured" } else { "lighting" })
            on_change=on_pupil
        />
        {move || {
            if pupil_measured() {
                scenario_number(
                        "Pupil diameter",
                        "wearer.pupil.diameter_mm".into(),
                        Shown::As("mm"),
                        |s| match s.wearer.pupil {
                            PupilSource::Measured { diameter_mm } => Some(diameter_mm),
                            PupilSource::FromLighting { .. } => None,
                        },
                        |s, v| s.wearer.pupil = PupilSource::Measured { diameter_mm: v.unwrap_or(0.0) },
                        false,
                    )
                    .into_any()
            } else {
                scenario_number(
                        "Task luminance",
                        "wearer.pupil.luminance_cd_m2".into(),
                        Shown::As("cd/m²"),
                        |s| match s.wearer.pupil {
                            PupilSource::FromLighting { luminance_cd_m2 } => Some(luminance_cd_m2),
                            PupilSource::Measured { .. } => None,
                        },
                        |s, v| {
                            s.wearer.pupil = PupilSource::FromLighting {
                                luminance_cd_m2: v.unwrap_or(0.0),
                            }
                        },
                        false,
                    )
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
            {scenario_number(
                "Half depth of field",
                "wearer.blur_tolerance.half_depth_d".into(),
                Shown::As("D"),
                |s| match s.wearer.blur_tolerance {
                    BlurTolerance::Clinical { half_depth_d } => Some(half_depth_d),
                    BlurTolerance::FromDetail => None,
                },
                |s, v| s.wearer.blur_tolerance = BlurTolerance::Clinical { half_depth_d: v.unwrap_or(0.0) },
                false,
            )}
        </Show>
    }
}

/// One fitting measurement: label, field path, unit, and how to read and write it.
struct Fitting {
    label: &'static str,
    path: &'static str,
    unit: &'static str,
    read: fn(&Scenario) -> f64,
    write: fn(&mut Scenario, f64),
}

/// The fitting measurements, in the order a dispenser takes them.
const FITTING: [Fitting; 5] = [
    Fitting {
        label: "PD right",
        path: "wearer.pd_right_mm",
        unit: "mm",
        read: |s| s.wearer.pd_right_mm,
        write: |s, v| s.wearer.pd_right_mm = v,
    },
    Fitting {
        label: "PD left",
        path: "wearer.pd_left_mm",
        unit: "mm",
        read: |s| s.wearer.pd_left_mm,
        write: |s, v| s.wearer.pd_left_mm = v,
    },
    Fitting {
        label: "Fitting height",
        path: "wearer.fitting_height_mm",
        unit: "mm",
        read: |s| s.wearer.fitting_height_mm,
        write: |s, v| s.wearer.fitting_height_mm = v,
    },
    Fitting {
        label: "Lens height",
        path: "wearer.lens_height_mm",
        unit: "mm",
        read: |s| s.wearer.lens_height_mm,
        write: |s, v| s.wearer.lens_height_mm = v,
    },
    Fitting {
        label: "Pantoscopic tilt",
        path: "wearer.pantoscopic_tilt_deg",
        unit: "°",
        read: |s| s.wearer.pantoscopic_tilt_deg,
        write: |s, v| s.wearer.pantoscopic_tilt_deg = v,
    },
];

/// The field of one fitting measurement.
fn fitting_field(f: &Fitting) -> impl IntoView {
    let (read, write) = (f.read, f.write);
    scenario_number(
        f.label,
        f.path.to_string(),
        Shown::As(f.unit),
        move |s| Some(read(s)),
        move |s, v| {
            if let Some(v) = v {
                write(s, v);
            }
        },
        false,
    )
}

/// The wearer panel.
#[component]
pub fn WearerPanel() -> impl IntoView {
    view! {
        <section class="panel wearer" aria-labelledby="wearer-heading">
            <h2 id="wearer-heading">"Wearer"</h2>
            <div class="grid">{amplitude_fields()}</div>
            <div class="eyes">
                {eye_fields("Right", |s| &s.wearer.right, |s| &mut s.wearer.right)}
                {eye_fields("Left", |s| &s.wearer.left, |s| &mut s.wearer.left)}
            </div>
            <div class="grid">
                {scenario_number(
                    "Prescribed addition",
                    "wearer.prescribed_addition_d".into(),
                    Shown::As("D"),
                    |s| s.wearer.prescribed_addition_d,
                    |s, v| s.wearer.prescribed_addition_d = v,
                    true,
                )}
                {correction_fields()}
            </div>
            <h3>"Fitting"</h3>
            <div class="grid">
                {FITTING.iter().map(fitting_field).collect_view()}
            </div>
            <h3>"Sustained work"</h3>
            <div class="grid">
                {scenario_number(
                    "Usable share of amplitude",
                    "wearer.usable_fraction".into(),
                    Shown::Percent,
                    |s| Some(s.wearer.usable_fraction),
                    |s, v| s.wearer.usable_fraction = v.unwrap_or(0.0),
                    false,
                )}
                {pupil_and_blur_fields()}
            </div>
            <fieldset class="grid">
                <legend>"Limits the plan is judged against"</legend>
                {scenario_number(
                    "Driving acuity standard (decimal)",
                    "settings.driving_acuity_decimal".into(),
                    Shown::As(""),
                    |s| Some(s.settings.driving_acuity_decimal),
                    |s, v| s.settings.driving_acuity_decimal = v.unwrap_or(0.0),
                    false,
                )}
                {scenario_number(
                    "Vertical prism limit",
                    "settings.vertical_imbalance_limit_pd".into(),
                    Shown::As("Δ"),
                    |s| Some(s.settings.vertical_imbalance_limit_pd),
                    |s, v| s.settings.vertical_imbalance_limit_pd = v.unwrap_or(0.0),
                    false,
                )}
                {addition_settings()}
            </fieldset>
        </section>
    }
}
