//! The optics of the eye and of spectacle lenses, with no browser types:
//! quantities, accommodation, vergence, depth of field, lens families and
//! gaze geometry. Every formula of the product lives in one file here.

pub mod astigmatism;
pub mod gaze;
pub mod lens;
pub mod units;
