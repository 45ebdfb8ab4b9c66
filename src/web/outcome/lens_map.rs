//! The lens map: the chosen option's local addition over the lens, drawn
//! from the family's own map, with the usable-zone edges, the fitting point
//! and each task's crossing point labelled with the power found there.
//! The shaded lens depends only on the design and the frame, so it is
//! redrawn only when they change; the task points follow every edit.

use crate::chart::lens_map::{shade, LensFrame};
use crate::core::lens::LensDesign;
use crate::core::units::{Dioptres, Millimetres};
use crate::plan::{context::TOLERATED_ASTIGMATISM_D, OptionPlan};
use crate::scenario::FamilyChoice;
use crate::web::state::use_app_state;
use leptos::prelude::*;

/// SVG width of the map.
const WIDTH: f64 = 420.0;
/// Sampling step of the map, in millimetres (finer than a task point's label).
const STEP_MM: f64 = 1.0;

/// What the shaded lens depends on: the design, the fitting height, the lens
/// height and the lens to centre-of-rotation distance the plan used, in millimetres.
type Geometry = (FamilyChoice, f64, f64, f64);

/// The shaded lens, zone edges and fitting cross for `geometry`, with the
/// task points of `chosen` drawn over them.
fn drawing(geometry: Geometry, chosen: Memo<Option<OptionPlan>>) -> AnyView {
    let state = use_app_state();
    let (choice, fitting_height, lens_height, lens_to_cor) = geometry;
    let Ok(design) = LensDesign::from_choice(&choice) else {
        return view! { <p class="hint">"This option's lens cannot be drawn."</p> }.into_any();
    };
    if !(fitting_height > 0.0 && lens_height > fitting_height) {
        return view! { <p class="hint">"Correct the fitting height and lens height to draw the lens."</p> }
            .into_any();
    }
    let frame = LensFrame::new(fitting_height, lens_height, WIDTH);
    let (width, height) = frame.size();
    let max_add = design.max_addition().0;
    let cells = frame
        .cells(&design, STEP_MM)
        .into_iter()
        .map(|c| {
            view! { <rect x=c.x y=c.y width={c.size + 0.3} height={c.size + 0.3} fill=shade(c.addition_d, max_add) /> }
        })
        .collect_view();
    let edges = frame.zone_edges(
        &design,
        Dioptres(TOLERATED_ASTIGMATISM_D),
        Millimetres(lens_to_cor),
    );
    let points = move || {
        chosen.with(|o| {
            o.iter()
                .flat_map(|o| o.tasks.iter())
                .map(|t| {
                    let index = t.task.index;
                    let (x, y) = (frame.x(t.lens_point.x.0), frame.y(t.lens_point.y.0));
                    let label = format!("{} {}", index + 1, t.local_power.addition);
                    let tooltip = format!(
                        "{}. {}: {} zone, addition {}, {}",
                        index + 1,
                        t.task.name,
                        t.zone,
                        t.local_power.addition,
                        t.verdict
                    );
                    view! {
                        <g class="lens-point" on:click=move |_| state.chosen_task.set(Some(index))>
                            <title>{tooltip}</title>
                            <circle cx=x cy=y r="5" />
                            <text x={x + 8.0} y={y + 4.0}>{label}</text>
                        </g>
                    }
                })
                .collect_view()
        })
    };
    let (fx, fy) = (frame.x(0.0), frame.y(0.0));
    let outline = frame.outline();
    let label = move || {
        chosen.with(|o| {
            o.as_ref()
                .map(|o| o.option.label.clone())
                .unwrap_or_default()
        })
    };
    view! {
        <svg viewBox=format!("0 0 {width:.0} {height:.0}") role="img" aria-labelledby="lens-map-caption" data-testid="lens-map">
            <defs>
                <clipPath id="lens-clip">
                    <path d=outline.clone() />
                </clipPath>
            </defs>
            <g clip-path="url(#lens-clip)">{cells}</g>
            <path class="lens-outline" d=outline />
            <path class="zone-edge" d=edges />
            <path class="fitting-cross" d=format!("M{:.1} {fy:.1}h16M{fx:.1} {:.1}v16", fx - 8.0, fy - 8.0) />
            {points}
        </svg>
        <figcaption id="lens-map-caption">
            {label}
            {format!(
                ": right lens as seen facing the wearer (nose side right). Shading: local addition, white 0.00 D to dark {}. Lines: edges of the zone where unwanted astigmatism stays under {:.2} D. Cross: fitting point. Dots: where each task is seen.",
                Dioptres(max_add),
                TOLERATED_ASTIGMATISM_D,
            )}
        </figcaption>
    }
    .into_any()
}

/// The lens map of the option chosen in the comparison (the best by default).
#[component]
pub fn LensMap() -> impl IntoView {
    let state = use_app_state();
    let chosen = Memo::new(move |_| {
        state.outcome.with(|o| {
            o.plan
                .as_ref()
                .and_then(|p| super::shown_option(p).cloned())
        })
    });
    let geometry = Memo::new(move |_| {
        let choice = chosen.with(|o| o.as_ref().map(|o| o.design))?;
        let lens_to_cor = state
            .outcome
            .with(|o| o.plan.as_ref().map(|p| p.lens_to_cor.0))?;
        let (fitting, lens) = state
            .scenario
            .with(|s| (s.wearer.fitting_height_mm, s.wearer.lens_height_mm));
        Some((choice, fitting, lens, lens_to_cor))
    });
    view! {
        <Show when=move || geometry.with(Option::is_some)>
            <h3>"Lens map"</h3>
            <figure class="lens-map">
                {move || geometry.get().map(|g| drawing(g, chosen))}
            </figure>
        </Show>
    }
}
