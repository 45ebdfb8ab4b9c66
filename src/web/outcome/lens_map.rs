//! The lens map: the chosen option's local addition over the lens, drawn
//! from the family's own map, with the usable-zone edges, the fitting point
//! and each task's crossing point labelled with the power found there.
//! The shaded lens depends only on the design and the frame, so it is
//! painted once on a canvas when they change; the outline, zone edges,
//! cross are a small SVG over it, and only the task points (written by
//! `markup::lens_points`) follow every edit.

use super::detail::use_task_detail;
use super::written::written_marks;
use crate::chart::lens_map::{LensFrame, ShadeRun};
use crate::core::lens::LensDesign;
use crate::core::units::{Dioptres, Millimetres};
use crate::markup::lens_points::lens_points;
use crate::plan::{context::TOLERATED_ASTIGMATISM_D, OptionPlan};
use crate::scenario::FamilyChoice;
use crate::web::state::use_app_state;
use leptos::html;
use leptos::prelude::*;
use wasm_bindgen::JsCast;
use web_sys::{CanvasRenderingContext2d, HtmlCanvasElement, Path2d};

/// SVG width of the map.
const WIDTH: f64 = 420.0;
/// Sampling step of the map, in millimetres (finer than a task point's label).
const STEP_MM: f64 = 1.0;

/// What the shaded lens depends on: the design, the fitting height, the lens
/// height and the lens to centre-of-rotation distance the plan used, in millimetres.
type Geometry = (FamilyChoice, f64, f64, f64);

/// Canvas pixels per SVG unit: twice the drawing's size, sharp on
/// high-density screens and in print.
const PIXELS_PER_UNIT: f64 = 2.0;

/// Fills `runs` (SVG units) into `canvas`, clipped to the lens outline
/// `clip` (SVG path data). A canvas without a 2D context stays blank; the
/// outline, edges and points over it still show.
fn paint(canvas: &HtmlCanvasElement, runs: &[ShadeRun], clip: &str) {
    let Some(context) = canvas
        .get_context("2d")
        .ok()
        .flatten()
        .and_then(|c| c.dyn_into::<CanvasRenderingContext2d>().ok())
    else {
        return;
    };
    if let Ok(outline) = Path2d::new_with_path_string(clip) {
        let _ = context.scale(PIXELS_PER_UNIT, PIXELS_PER_UNIT);
        context.clip_with_path_2d(&outline);
        let _ = context.set_transform(1.0, 0.0, 0.0, 1.0, 0.0, 0.0);
    }
    let mut colour = "";
    for run in runs {
        if run.colour != colour {
            colour = &run.colour;
            context.set_fill_style_str(colour);
        }
        // Edges on whole pixels: neighbouring runs then meet without the
        // light seams that smoothing of fractional edges would draw.
        let pixel = |units: f64| (units * PIXELS_PER_UNIT).round();
        let (left, top) = (pixel(run.x), pixel(run.y));
        let (right, bottom) = (pixel(run.x + run.width), pixel(run.y + run.height));
        context.fill_rect(left, top, right - left, bottom - top);
    }
}

/// The shaded lens, zone edges and fitting cross for `geometry`, with the
/// task points of `chosen` drawn over them.
fn drawing(geometry: Geometry, chosen: Memo<Option<OptionPlan>>) -> AnyView {
    let detail = use_task_detail();
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
    let runs = frame.shade_runs(&design, STEP_MM);
    let canvas = NodeRef::<html::Canvas>::new();
    let clip = frame.outline();
    // Painting a canvas is work on the outside world, once it is mounted.
    Effect::new(move |_| {
        if let Some(element) = canvas.get() {
            paint(&element, &runs, &clip);
        }
    });
    let edges = frame.zone_edges(
        &design,
        Dioptres(TOLERATED_ASTIGMATISM_D),
        Millimetres(lens_to_cor),
    );
    let (fx, fy) = (frame.x(0.0), frame.y(0.0));
    let points = Memo::new(move |_| {
        let open = detail.open_task();
        chosen.with(|o| {
            o.as_ref()
                .map(|o| lens_points(&frame, o, open))
                .unwrap_or_default()
        })
    });
    let outline = frame.outline();
    let label = move || {
        chosen.with(|o| {
            o.as_ref()
                .map(|o| o.option.label.clone())
                .unwrap_or_default()
        })
    };
    let view_box = format!("0 0 {width:.0} {height:.0}");
    // The shading is a canvas under the SVG: hundreds of rectangles inside
    // an SVG are laid out and painted again whenever anything in that SVG
    // changes, and the task points change with every edit.
    view! {
        <div class="lens-drawing">
            <canvas
                node_ref=canvas
                class="lens-shading"
                width=(width * PIXELS_PER_UNIT).round()
                height=(height * PIXELS_PER_UNIT).round()
                aria-hidden="true"
            ></canvas>
            <svg viewBox=view_box role="img" aria-labelledby="lens-map-caption" data-testid="lens-map">
                <path class="lens-outline" d=outline />
                <path class="zone-edge" d=edges />
                <path class="fitting-cross" d=format!("M{:.1} {fy:.1}h16M{fx:.1} {:.1}v16", fx - 8.0, fy - 8.0) />
                {written_marks(move || points.get())}
            </svg>
        </div>
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
            <h3 class="lens-map-heading">"Lens map"</h3>
            <figure class="lens-map">
                {move || geometry.get().map(|g| drawing(g, chosen))}
            </figure>
        </Show>
    }
}
