//! Start-up timing: the performance marks the start-up measurement reads
//! (`tests/browser/measure/startup.js`), and putting work off until the
//! first plan is painted. At start the app draws what is in view (the
//! masthead, the shelf, the wearer's block, the plan) and leaves what is
//! not (the demos a first visit brings besides the one shown, the working
//! day and the lens options about 2,000 px down, below the wearer's block)
//! to the task after the first paint.

use leptos::prelude::*;
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

/// Runs `work` in a task of its own after the next frame is painted: an
/// animation-frame callback runs just before the paint, and a timer it
/// sets runs after it.
pub fn after_first_paint(work: impl FnOnce() + 'static) {
    request_animation_frame(move || set_timeout(work, Duration::ZERO));
}
