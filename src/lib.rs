//! clearspan plans eyewear for working distances. The crate is a pure core
//! (optics, lens families, gaze geometry, planning, saved format) that builds
//! and tests natively, and, behind the `web` feature, a thin leptos app over it.

#[cfg(test)]
mod approx;
pub mod chart;
pub mod core;
pub mod display;
pub mod library;
pub mod markup;
pub mod plan;
pub mod scenario;
#[cfg(feature = "web")]
pub mod web;
