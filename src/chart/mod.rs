//! The pure geometry of the charts: scales, ticks and SVG path data, tested
//! natively. Components in the web app only place the elements computed here.

pub mod dioptric_axis;
