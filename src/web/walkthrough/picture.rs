//! One picture of a task on a `<canvas>`: the core draws the scene and
//! blurs it with the geometric blur disc; this file only hands the pixels to
//! the canvas and notes how long that took (`data-render-ms`, and the split
//! into drawing, blurring into RGBA and handing over to the canvas in
//! `data-render-phases`, read by the browser measurement).

use crate::chart::scene::{draw, px_per_arcmin, SceneKind, DETAIL_PX};
use crate::core::blur_image::BlurDisc;
use crate::core::units::{Dioptres, Metres, Millimetres};
use leptos::html;
use leptos::prelude::*;
use wasm_bindgen::{Clamped, JsCast};
use web_sys::{CanvasRenderingContext2d, HtmlCanvasElement, ImageData};

/// What one picture shows: a scene of `kind` for a task at `distance` with
/// a critical detail of `detail`, blurred by `defocus` through `pupil`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PictureSpec {
    /// The kind of scene.
    pub kind: SceneKind,
    /// The task's critical detail.
    pub detail: Millimetres,
    /// The task's distance from the lenses.
    pub distance: Metres,
    /// The defocus the eye cannot remove, in dioptres.
    pub defocus: Dioptres,
    /// The pupil diameter the plan used.
    pub pupil: Millimetres,
}

/// Draws `spec` into `canvas` at the canvas's own pixel size and records the
/// time taken in milliseconds on the element, in all and by phase. A blur
/// the core cannot size leaves the sharp scene (the caption still gives the
/// words).
fn paint(canvas: &HtmlCanvasElement, spec: PictureSpec) {
    let start = now_ms();
    let (w, h) = (canvas.width() as usize, canvas.height() as usize);
    let scene = draw(spec.kind, w, h, DETAIL_PX);
    let drawn_at = now_ms();
    let scale = px_per_arcmin(spec.detail, spec.distance);
    let disc = BlurDisc::from_defocus(spec.defocus, spec.pupil, scale).ok();
    let mut pixels = Vec::new();
    match disc {
        Some(disc) => disc.apply_rgba(&scene, &mut pixels),
        None => scene.write_rgba(&mut pixels),
    }
    let blurred_at = now_ms();
    let rgba = pixels.as_flattened();
    // An opaque canvas: the pictures have no transparency, so nothing behind
    // them needs blending.
    let options = js_sys::Object::new();
    let _ = js_sys::Reflect::set(&options, &"alpha".into(), &false.into());
    let drawn = canvas
        .get_context_with_context_options("2d", &options)
        .ok()
        .flatten()
        .and_then(|c| c.dyn_into::<CanvasRenderingContext2d>().ok())
        .zip(ImageData::new_with_u8_clamped_array_and_sh(Clamped(rgba), w as u32, h as u32).ok())
        .map(|(context, data)| context.put_image_data(&data, 0.0, 0.0).is_ok());
    if drawn == Some(true) {
        let end = now_ms();
        let phases = format!(
            "disc {:.1} px scene {:.2} blur {:.2} canvas {:.2}",
            disc.map_or(0.0, |d| d.radius_px),
            drawn_at - start,
            blurred_at - drawn_at,
            end - blurred_at
        );
        let _ = canvas.set_attribute("data-render-phases", &phases);
        let _ = canvas.set_attribute("data-render-ms", &format!("{:.2}", end - start));
    }
}

fn now_ms() -> f64 {
    web_sys::window()
        .and_then(|w| w.performance())
        .map_or(0.0, |p| p.now())
}

/// A canvas `width` by `height` pixels showing `spec`, described to screen
/// readers by `label`.
#[component]
pub fn ScenePicture(
    /// What to draw.
    spec: PictureSpec,
    /// Canvas width, in pixels.
    width: u32,
    /// Canvas height, in pixels.
    height: u32,
    /// The picture in words, for screen readers.
    label: String,
) -> impl IntoView {
    let canvas = NodeRef::<html::Canvas>::new();
    // Painting a canvas is work on the outside world, once it is mounted.
    Effect::new(move |_| {
        if let Some(element) = canvas.get() {
            paint(&element, spec);
        }
    });
    view! {
        <canvas
            node_ref=canvas
            width=width
            height=height
            role="img"
            aria-label=label
            data-testid="walk-picture"
        ></canvas>
    }
}
