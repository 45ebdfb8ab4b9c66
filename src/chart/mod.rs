//! The pure geometry of the charts: scales, ticks, bands, lens-map cells and
//! SVG path data, tested natively. Components in the web app only place the
//! elements computed here.

pub mod coord;
pub mod dioptric_axis;
pub mod lens_map;
pub mod range_rows;
pub mod scene;
