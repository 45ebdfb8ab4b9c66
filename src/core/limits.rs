//! The one table of allowed ranges: every number a scenario may hold, as the
//! scenario gate checks it and the optics, lens and gaze models accept it.
//! A range is written here once; the gate and the models refer to it, so a
//! value that passes the gate is one the models take.

use super::bounds::Bounds;

/// Wearer's age over which the amplitude models are applied, in years.
pub const AGE: Bounds = Bounds::new(5.0, 100.0, "years");
/// A measured amplitude of accommodation, in dioptres.
pub const AMPLITUDE: Bounds = Bounds::new(0.0, 25.0, "D");
/// Sphere of a prescription, in dioptres.
pub const SPHERE: Bounds = Bounds::new(-30.0, 30.0, "D");
/// Cylinder of a prescription, in dioptres.
pub const CYLINDER: Bounds = Bounds::new(-10.0, 10.0, "D");
/// Cylinder axis, in degrees (TABO).
pub const AXIS: Bounds = Bounds::new(0.0, 180.0, "°");
/// Prescribed prism per component and eye, in prism dioptres (ground-in
/// prisms rarely exceed 10 Δ; a product choice leaving room for unusual
/// prescriptions).
pub const PRISM: Bounds = Bounds::new(0.0, 20.0, "Δ");
/// Any addition over the distance power, in dioptres.
pub const ADDITION: Bounds = Bounds::new(0.0, 4.0, "D");
/// Vertex distance of spectacles, in millimetres.
pub const VERTEX: Bounds = Bounds::new(0.0, 25.0, "mm");
/// Monocular pupillary distance, in millimetres.
pub const PD: Bounds = Bounds::new(20.0, 45.0, "mm");
/// Fitting-point height above the lowest point of the lens, in millimetres.
pub const FITTING_HEIGHT: Bounds = Bounds::new(8.0, 45.0, "mm");
/// Lens height of the frame (boxed B dimension), in millimetres.
pub const LENS_HEIGHT: Bounds = Bounds::new(15.0, 70.0, "mm");
/// Pantoscopic tilt, in degrees.
pub const TILT: Bounds = Bounds::new(-5.0, 25.0, "°");
/// A measured pupil diameter, in millimetres.
pub const PUPIL: Bounds = Bounds::new(1.0, 9.0, "mm");
/// Adapting luminance, in candelas per square metre.
pub const LUMINANCE: Bounds = Bounds::new(0.001, 100_000.0, "cd/m²");
/// Share of the amplitude used for sustained work.
pub const USABLE_FRACTION: Bounds = Bounds::new(0.2, 1.0, "");
/// A clinical half depth of field, in dioptres.
pub const HALF_DEPTH: Bounds = Bounds::new(0.05, 1.5, "D");
/// Task viewing distance from the spectacle plane, in metres.
pub const DISTANCE: Bounds = Bounds::new(0.1, 1000.0, "m");
/// Task gaze angle above (positive) or below the horizontal, in degrees.
pub const GAZE_ANGLE: Bounds = Bounds::new(-80.0, 80.0, "°");
/// Task height above (positive) or below eye level, in metres.
pub const HEIGHT: Bounds = Bounds::new(-5.0, 5.0, "m");
/// Task sideways offset, to the right positive, in metres.
pub const SIDEWAYS: Bounds = Bounds::new(-20.0, 20.0, "m");
/// Width of the task area, in metres.
pub const WIDTH: Bounds = Bounds::new(0.0, 20.0, "m");
/// Size of a task's smallest detail, in millimetres.
pub const DETAIL: Bounds = Bounds::new(0.01, 1000.0, "mm");
/// Hours a day spent on a task (and on all of them together).
pub const HOURS: Bounds = Bounds::new(0.0, 24.0, "h");
/// Segment top relative to the fitting point, in millimetres.
pub const SEGMENT_TOP: Bounds = Bounds::new(-20.0, 5.0, "mm");
/// Trifocal intermediate power as a share of the near addition.
pub const INTERMEDIATE_RATIO: Bounds = Bounds::new(0.3, 0.8, "");
/// Progression length, fitting point to near reference point, in millimetres.
pub const PROGRESSION_LENGTH: Bounds = Bounds::new(10.0, 24.0, "mm");
/// Near addition of a degressive lens, in dioptres.
pub const NEAR_ADDITION: Bounds = Bounds::new(0.5, 4.0, "D");
/// Degression of a degressive lens, in dioptres.
pub const DEGRESSION: Bounds = Bounds::new(0.5, 2.5, "D");
/// Bottom edge of an upper segment relative to the fitting point, in millimetres.
pub const UPPER_BOTTOM: Bounds = Bounds::new(3.0, 25.0, "mm");
/// Driving acuity standards in use, as a decimal acuity.
pub const DRIVING_ACUITY: Bounds = Bounds::new(0.1, 1.0, "");
/// Vertical prism difference limit, in prism dioptres.
pub const IMBALANCE_LIMIT: Bounds = Bounds::new(0.25, 5.0, "Δ");
