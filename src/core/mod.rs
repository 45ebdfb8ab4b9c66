//! The optics of the eye and of spectacle lenses, with no browser types:
//! quantities, accommodation, vergence, depth of field, lens families and
//! gaze geometry. Every formula of the product lives in one file here.

pub mod accommodation;
pub mod acuity;
pub mod astigmatism;
pub mod blur_image;
pub mod bounds;
pub mod clear_range;
pub mod depth_of_field;
pub mod error;
pub mod gaze;
pub mod lens;
pub mod limits;
pub mod magnification;
pub mod prescription;
pub mod pupil;
pub mod schematic_eye;
pub mod units;
pub mod vergence;
