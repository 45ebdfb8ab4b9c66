//! The lens map: the chosen option's local addition over the lens, drawn
//! from the family's own map, with the usable-zone edges, the fitting point
//! and each task's crossing point labelled with the power found there.

use crate::chart::lens_map::{shade, LensFrame};
use crate::core::gaze::COR_BEHIND_CORNEA_MM;
use crate::core::lens::LensDesign;
use crate::core::units::{Dioptres, Millimetres};
use crate::plan::{context::TOLERATED_ASTIGMATISM_D, OptionPlan};
use crate::scenario::{Correction, Wearer};
use crate::web::state::use_app_state;
use leptos::prelude::*;

/// SVG width of the map.
const WIDTH: f64 = 420.0;
/// Sampling step of the map, in millimetres.
const STEP_MM: f64 = 1.0;

/// The lens map of option `o` for `wearer`.
pub fn lens_map(o: &OptionPlan, wearer: &Wearer) -> impl IntoView {
    let state = use_app_state();
    let Ok(design) = LensDesign::from_choice(&o.design) else {
        return view! { <p class="hint">"This option's lens cannot be drawn."</p> }.into_any();
    };
    let frame = LensFrame::new(wearer.fitting_height_mm, wearer.lens_height_mm, WIDTH);
    let (width, height) = frame.size();
    let max_add = design.max_addition().0;
    let cells = frame
        .cells(&design, STEP_MM)
        .into_iter()
        .map(|c| {
            view! { <rect x=c.x y=c.y width={c.size + 0.3} height={c.size + 0.3} fill=shade(c.addition_d, max_add) /> }
        })
        .collect_view();
    let vertex = match wearer.correction {
        Correction::Spectacles { vertex_mm } => vertex_mm,
        Correction::ContactLenses => 0.0,
    };
    let edges = frame.zone_edges(
        &design,
        Dioptres(TOLERATED_ASTIGMATISM_D),
        Millimetres(vertex + COR_BEHIND_CORNEA_MM),
    );
    let points = o
        .tasks
        .iter()
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
        .collect_view();
    let (fx, fy) = (frame.x(0.0), frame.y(0.0));
    let outline = frame.outline();
    view! {
        <figure class="lens-map">
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
                {format!(
                    "{}: right lens as seen facing the wearer (nose side right). Shading: local addition, white 0.00 D to dark {}. Lines: edges of the zone where unwanted astigmatism stays under {:.2} D. Cross: fitting point. Dots: where each task is seen.",
                    o.option.label,
                    Dioptres(max_add),
                    TOLERATED_ASTIGMATISM_D,
                )}
            </figcaption>
        </figure>
    }
    .into_any()
}
