//! Start-up timing: the performance marks the start-up measurement reads
//! (`tests/browser/measure/startup.js`), and putting work off until the
//! first plan is painted. At start the app draws what is in view (the
//! masthead, the shelf, the wearer's block, the plan) and leaves what is
//! not (the demos a first visit brings besides the one shown, the working
//! day and the lens options about 2,000 px down, below the wearer's block)
//! to the task after the first paint.

use leptos::prelude::*;
use std::cell::Cell;
use std::rc::Rc;
use std::time::Duration;

/// Records the performance mark `clearspan:NAME` at this instant. A mark
/// costs microseconds and each is recorded once, at start; a browser
/// without the Performance API records nothing.
pub fn mark(name: &str) {
    if let Some(performance) = web_sys::window().and_then(|w| w.performance()) {
        // A mark is only a measurement aid: a refusal changes nothing the user sees.
        let _ = performance.mark(&format!("clearspan:{name}"));
    }
}

/// How long work put off until the first paint waits at most, in
/// milliseconds from when it was put off: a tab opened in the background
/// paints no frame until it is shown, and the demos of a first visit must
/// not wait for that (closed unseen, it would never import them). Well
/// beyond the time the views take to mount on a loaded machine (up to
/// about 500 ms measured), so that a shown tab paints first.
const AT_THE_LATEST_MS: u64 = 1000;

/// Runs `work` once, in a task of its own after the next frame is painted
/// (an animation-frame callback runs just before the paint, and a timer it
/// sets runs after it), or after [`AT_THE_LATEST_MS`] if no frame came first.
pub fn after_first_paint(work: impl FnOnce() + 'static) {
    let work = Rc::new(Cell::new(Some(work)));
    let once = move || {
        let work = Rc::clone(&work);
        move || {
            if let Some(work) = work.take() {
                work();
            }
        }
    };
    let after_frame = once();
    request_animation_frame(move || set_timeout(after_frame, Duration::ZERO));
    set_timeout(once(), Duration::from_millis(AT_THE_LATEST_MS));
}

/// A signal that turns true in the task after the first paint (see
/// [`after_first_paint`]): views that are out of view at start, or that
/// only narrow screens show, are drawn once it is, so the first plan
/// comes sooner.
pub fn drawn_after_first_paint() -> ReadSignal<bool> {
    let (drawn, set_drawn) = signal(false);
    after_first_paint(move || set_drawn.set(true));
    drawn
}
