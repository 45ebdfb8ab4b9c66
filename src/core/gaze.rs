//! Geometry of gaze behind spectacle lenses: where the line of sight from
//! each eye's centre of rotation (CoR) to a task crosses the tilted (and
//! optionally wrapped) lens plane, as a point in lens coordinates; plus near
//! centration, prism (`centration`) and the head posture a task forces
//! (`posture`).
//!
//! Head frame, in millimetres: origin at the midpoint between the two CoRs,
//! `x` towards the wearer's right, `y` up, `z` straight ahead. Each lens is a
//! plane through its fitting point, which lies on the eye's primary line of
//! sight at the distance `c` = vertex distance + CoR-to-cornea in front of
//! the CoR. Pantoscopic tilt turns the lens about its horizontal axis, lower
//! rim towards the face; face-form wrap turns it about the vertical, temporal
//! edge towards the face. The lens is treated as thin and flat for locating
//! the crossing point (its curvature moves the point by a fraction of a
//! millimetre at these angles), and for spectacles only: a contact lens
//! moves with the eye.

mod centration;
mod posture;
mod strain;

pub use centration::{
    head_turn_per_side, horizontal_prism, keep_on_lens, prentice, subtended_angle,
    vertical_imbalance, vertical_prism, VerticalImbalance, TYPICAL_LENS_HALF_WIDTH_MM,
};
pub use posture::{ComfortRange, Posture, PostureOutcome, HEAD_PITCH_LIMIT_DEG};
pub use strain::{pitch_strain, turn_strain, Strain, CHIN_UP_LIMIT_DEG};

use crate::core::lens::{LensError, LensPoint, NamedBounds, VerticalExtent};
use crate::core::limits;
use crate::core::units::{Degrees, Dioptres, Metres, Millimetres, PrismDioptres};
use nalgebra::{Point3, Rotation3, Vector3};

/// The eye's centre of rotation behind the cornea, in millimetres: about
/// 13-14 mm (from memory; D. Meister writes "usually around 13 or 14 mm" and
/// that lens design assumes a 27 mm lens-to-CoR "stop distance", optiboard.com
/// thread "Center of Rotation"). 13.5 mm is used when none is measured.
pub const COR_BEHIND_CORNEA_MM: f64 = 13.5;

/// Which eye.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Eye {
    /// The wearer's right eye.
    Right,
    /// The wearer's left eye.
    Left,
}

/// The fitting measurements the gaze model needs, as entered.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FittingParams {
    /// Monocular distance PD of the right eye, in millimetres (20 to 45).
    pub pd_right: Millimetres,
    /// Monocular distance PD of the left eye, in millimetres (20 to 45).
    pub pd_left: Millimetres,
    /// Back vertex of the lens to the cornea, in millimetres (0 to 25).
    pub vertex: Millimetres,
    /// Cornea to the eye's centre of rotation, in millimetres (10 to 18).
    pub cor_behind_cornea: Millimetres,
    /// Pantoscopic tilt, in degrees, lower rim towards the face positive (-5 to 25).
    pub pantoscopic_tilt: Degrees,
    /// Face-form (wrap) angle of each lens, in degrees, temporal edge towards the face (0 to 30).
    pub face_form: Degrees,
    /// The lens's extent above and below the fitting point.
    pub extent: VerticalExtent,
}

/// One eye's CoR and lens plane in the head frame (millimetres).
#[derive(Debug, Clone, Copy, PartialEq)]
struct EyeFrame {
    cor: Point3<f64>,
    fitting_point: Point3<f64>,
    /// Unit vector along the lens towards the nose.
    nasal: Vector3<f64>,
    /// Unit vector along the lens upwards.
    up: Vector3<f64>,
    /// Unit normal of the lens plane, pointing away from the eye.
    normal: Vector3<f64>,
    /// Unit vector towards the nose in the head frame (for eye rotation angles).
    head_nasal: Vector3<f64>,
}

/// Checked fitting measurements with each eye's lens plane worked out once.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Fitting {
    params: FittingParams,
    right: EyeFrame,
    left: EyeFrame,
}

/// A task's position in front of the wearer, as the user describes it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TaskPosition {
    /// Viewing distance from the spectacle plane along the line of sight, in metres (0.1 to 1000).
    pub distance: Metres,
    /// Where the task lies vertically.
    pub vertical: TaskVertical,
    /// Sideways offset of the task centre, in metres, to the wearer's right positive.
    pub sideways: Metres,
}

/// The vertical position of a task with the head upright.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum TaskVertical {
    /// Angle of the task above (positive) or below (negative) the horizontal, in degrees.
    GazeAngle(Degrees),
    /// Height of the task centre above (positive) or below eye level, in metres.
    Height(Metres),
}

/// A task located in the head frame with the head upright, in millimetres
/// from the midpoint between the eyes' centres of rotation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TaskPoint {
    position: Point3<f64>,
}

impl TaskPoint {
    /// The task's position in head coordinates with the head pitched by
    /// `head_pitch` (chin up positive, turning about the eyes). Chin up by p
    /// turns the head's forward axis up, so in head coordinates the world
    /// turns down by p: a rotation about +x by +p.
    fn pitched(&self, head_pitch: Degrees) -> Point3<f64> {
        Rotation3::from_axis_angle(&Vector3::x_axis(), head_pitch.to_radians()) * self.position
    }
}

/// Where one eye's line of sight to a task crosses its lens.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LensCrossing {
    /// The crossing point in lens coordinates (millimetres from the fitting
    /// point, nasal and up positive).
    pub point: LensPoint,
    /// Distance from the CoR to the crossing point, in millimetres.
    pub cor_to_lens: Millimetres,
    /// The eye's rotation above (positive) or below the primary position, in degrees.
    pub elevation: Degrees,
    /// The eye's rotation towards the nose (positive) or the temple, in degrees.
    pub azimuth_nasal: Degrees,
    /// Whether the crossing lies within the lens's height in the frame.
    pub on_lens: bool,
}

const PD_RIGHT: NamedBounds = NamedBounds::of("right monocular PD", limits::PD);
const PD_LEFT: NamedBounds = NamedBounds::of("left monocular PD", limits::PD);
const VERTEX: NamedBounds = NamedBounds::of("vertex distance", limits::VERTEX);
const COR: NamedBounds = NamedBounds::new("CoR behind cornea", 10.0, 18.0, "mm");
const TILT: NamedBounds = NamedBounds::of("pantoscopic tilt", limits::TILT);
const WRAP: NamedBounds = NamedBounds::new("face-form angle", 0.0, 30.0, "°");
/// Task distance from the spectacle plane, in metres.
pub(crate) const DISTANCE: NamedBounds = NamedBounds::of("task distance", limits::DISTANCE);
const SIDEWAYS: NamedBounds = NamedBounds::of("task sideways offset", limits::SIDEWAYS);
const GAZE_ANGLE: NamedBounds = NamedBounds::of("task gaze angle", limits::GAZE_ANGLE);
const HEIGHT: NamedBounds = NamedBounds::of("task height", limits::HEIGHT);

impl Fitting {
    /// Checks the measurements and sets up both lens planes.
    pub fn new(params: FittingParams) -> Result<Fitting, LensError> {
        let pd_right = PD_RIGHT.check(params.pd_right.0)?;
        let pd_left = PD_LEFT.check(params.pd_left.0)?;
        let vertex = VERTEX.check(params.vertex.0)?;
        let cor = COR.check(params.cor_behind_cornea.0)?;
        let tilt = TILT.check(params.pantoscopic_tilt.0)?;
        let wrap = WRAP.check(params.face_form.0)?;
        let c = vertex + cor;
        let frame = |eye: Eye| {
            let (x, nasal_sign) = match eye {
                Eye::Right => (pd_right, -1.0),
                Eye::Left => (-pd_left, 1.0),
            };
            // The temporal edge turns towards the face: about +y for the right
            // eye (temporal is +x) and -y for the left eye.
            let wrap_angle = -nasal_sign * wrap.to_radians();
            let rotation = Rotation3::from_axis_angle(&Vector3::y_axis(), wrap_angle)
                * Rotation3::from_axis_angle(&Vector3::x_axis(), tilt.to_radians());
            let cor = Point3::new(x, 0.0, 0.0);
            EyeFrame {
                cor,
                fitting_point: cor + Vector3::new(0.0, 0.0, c),
                nasal: rotation * Vector3::new(nasal_sign, 0.0, 0.0),
                up: rotation * Vector3::new(0.0, 1.0, 0.0),
                normal: rotation * Vector3::new(0.0, 0.0, 1.0),
                head_nasal: Vector3::new(nasal_sign, 0.0, 0.0),
            }
        };
        Ok(Fitting {
            params,
            right: frame(Eye::Right),
            left: frame(Eye::Left),
        })
    }

    /// The measurements this fitting was built from.
    pub fn params(&self) -> &FittingParams {
        &self.params
    }

    /// Spectacle plane to CoR, `c` = vertex distance + CoR behind cornea, in millimetres.
    pub fn lens_to_cor(&self) -> Millimetres {
        self.params.vertex + self.params.cor_behind_cornea
    }

    /// Monocular distance PD of `eye`, in millimetres.
    pub fn monocular_pd(&self, eye: Eye) -> Millimetres {
        match eye {
            Eye::Right => self.params.pd_right,
            Eye::Left => self.params.pd_left,
        }
    }

    fn frame(&self, eye: Eye) -> &EyeFrame {
        match eye {
            Eye::Right => &self.right,
            Eye::Left => &self.left,
        }
    }

    /// Places a task in the head frame with the head upright. The task lies
    /// `distance + c` from the midpoint between the CoRs; a gaze angle sets
    /// its elevation, a height sets its height directly, and the sideways
    /// offset its horizontal position. An error when the offsets do not fit
    /// within the distance.
    pub fn locate(&self, task: &TaskPosition) -> Result<TaskPoint, LensError> {
        let l = DISTANCE.check(task.distance.0)?;
        let s = SIDEWAYS.check(task.sideways.0)? * 1000.0;
        let r = l * 1000.0 + self.lens_to_cor().0;
        let (y, horizontal) = match task.vertical {
            TaskVertical::GazeAngle(a) => {
                let a = GAZE_ANGLE.check(a.0)?.to_radians();
                (r * a.sin(), r * a.cos())
            }
            TaskVertical::Height(h) => {
                let h = HEIGHT.check(h.0)? * 1000.0;
                if h.abs() >= r {
                    return Err(LensError::TaskUnreachable {
                        reason: "its height from eye level must be smaller than its distance",
                    });
                }
                (h, (r * r - h * h).sqrt())
            }
        };
        if s.abs() >= horizontal {
            return Err(LensError::TaskUnreachable {
                reason: "its sideways offset must be smaller than its horizontal distance",
            });
        }
        let z = (horizontal * horizontal - s * s).sqrt();
        Ok(TaskPoint {
            position: Point3::new(s, y, z),
        })
    }

    /// Where `eye`'s line of sight to `task` crosses its lens, with the head
    /// pitched `head_pitch` degrees (chin up positive; the head is taken to
    /// turn about the eyes). `None` when the line of sight runs beside the
    /// lens plane instead of through it (a gaze more than 90 degrees from
    /// the lens normal).
    pub fn crossing(
        &self,
        eye: Eye,
        task: &TaskPoint,
        head_pitch: Degrees,
    ) -> Option<LensCrossing> {
        self.crossing_towards(eye, &task.pitched(head_pitch))
    }

    /// Where `eye`'s line of sight to `target` (head frame, millimetres) crosses its lens.
    fn crossing_towards(&self, eye: Eye, target: &Point3<f64>) -> Option<LensCrossing> {
        let f = self.frame(eye);
        let sight = target - f.cor;
        let towards_lens = f.normal.dot(&sight);
        if towards_lens.is_nan() || towards_lens <= 1e-12 {
            return None;
        }
        let along = f.normal.dot(&(f.fitting_point - f.cor)) / towards_lens;
        let on_plane = f.cor + sight * along;
        let local = on_plane - f.fitting_point;
        let y = local.dot(&f.up);
        let horizontal = (sight.x * sight.x + sight.z * sight.z).sqrt();
        Some(LensCrossing {
            point: LensPoint::new(local.dot(&f.nasal), y),
            cor_to_lens: Millimetres(along * sight.norm()),
            elevation: Degrees::from_radians(sight.y.atan2(horizontal)),
            azimuth_nasal: Degrees::from_radians(f.head_nasal.dot(&sight).atan2(sight.z)),
            on_lens: self.params.extent.contains(Millimetres(y)),
        })
    }

    /// Near PD for a task `distance` metres in front of the spectacle plane,
    /// in millimetres: `PD x l / (l + c)`.
    ///
    /// ```
    /// # use clearspan::core::gaze::*;
    /// # use clearspan::core::lens::VerticalExtent;
    /// # use clearspan::core::units::*;
    /// let fitting = Fitting::new(FittingParams {
    ///     pd_right: Millimetres(32.0), pd_left: Millimetres(32.0),
    ///     vertex: Millimetres(13.5), cor_behind_cornea: Millimetres(13.5),
    ///     pantoscopic_tilt: Degrees(0.0), face_form: Degrees(0.0),
    ///     extent: VerticalExtent::from_frame(Millimetres(22.0), Millimetres(40.0)).unwrap(),
    /// }).unwrap();
    /// // 64 x 400 / (400 + 27) = 59.953 mm.
    /// let near = fitting.near_pd(Metres(0.4)).unwrap();
    /// assert!((near.0 - 59.953).abs() < 1e-3);
    /// ```
    pub fn near_pd(&self, distance: Metres) -> Result<Millimetres, LensError> {
        self.near_pd_through(distance, [Dioptres(0.0); 2])
    }

    /// Near PD for a task `distance` metres away seen through lenses whose
    /// horizontal powers are `powers` (right, left), in millimetres: the
    /// distance PD less both eyes' [`Fitting::near_inset_through`].
    pub fn near_pd_through(
        &self,
        distance: Metres,
        [right, left]: [Dioptres; 2],
    ) -> Result<Millimetres, LensError> {
        let pd = self.params.pd_right.0 + self.params.pd_left.0;
        let r = self.near_inset_through(Eye::Right, distance, right)?;
        let l = self.near_inset_through(Eye::Left, distance, left)?;
        Ok(Millimetres(pd - r.0 - l.0))
    }

    /// Inset of `eye`'s near centration for a task `distance` metres away,
    /// in millimetres: `PD_mono x c / (l + c)`, so the two insets add up to
    /// the difference between the distance and near PDs.
    pub fn near_inset(&self, eye: Eye, distance: Metres) -> Result<Millimetres, LensError> {
        self.near_inset_through(eye, distance, Dioptres(0.0))
    }

    /// Inset of `eye`'s near visual point for a task straight ahead at
    /// `distance` metres, seen through a lens of horizontal power `power`
    /// centred for distance, in millimetres. The ray from the task to the
    /// eye's centre of rotation is bent at the lens by Prentice's rule, so
    ///
    /// `i = PD_mono x c / (l + c - F c l)`
    ///
    /// (l the task distance and c the lens to centre of rotation, in metres
    /// for the product F c l): plus lenses need more inset and minus lenses
    /// less than the plano `PD_mono x c / (l + c)` (the near centration
    /// through powered lenses of Jalie, Principles of Ophthalmic Lenses;
    /// from memory). An error when the lens is so strong that no ray
    /// reaches the eye (far beyond ophthalmic powers).
    pub fn near_inset_through(
        &self,
        eye: Eye,
        distance: Metres,
        power: Dioptres,
    ) -> Result<Millimetres, LensError> {
        let l = DISTANCE.check(distance.0)? * 1000.0;
        let c = self.lens_to_cor().0;
        let denominator = l + c - power.0 * c * l / 1000.0;
        if denominator <= 0.0 {
            return Err(LensError::TaskUnreachable {
                reason: "the lens is too strong for any ray from the task to reach the eye",
            });
        }
        Ok(Millimetres(self.monocular_pd(eye).0 * c / denominator))
    }

    /// Convergence demand of `eye` for a task straight ahead at `distance`
    /// metres, in prism dioptres: `100 x PD_mono / (l + c)`.
    ///
    /// ```
    /// # use clearspan::core::gaze::*;
    /// # use clearspan::core::lens::VerticalExtent;
    /// # use clearspan::core::units::*;
    /// # let fitting = Fitting::new(FittingParams {
    /// #     pd_right: Millimetres(32.0), pd_left: Millimetres(32.0),
    /// #     vertex: Millimetres(13.5), cor_behind_cornea: Millimetres(13.5),
    /// #     pantoscopic_tilt: Degrees(0.0), face_form: Degrees(0.0),
    /// #     extent: VerticalExtent::from_frame(Millimetres(22.0), Millimetres(40.0)).unwrap(),
    /// # }).unwrap();
    /// // 100 x 0.032 m / 0.427 m = 7.494 prism dioptres.
    /// let demand = fitting.convergence_demand(Eye::Right, Metres(0.4)).unwrap();
    /// assert!((demand.0 - 7.494).abs() < 1e-3);
    /// ```
    pub fn convergence_demand(
        &self,
        eye: Eye,
        distance: Metres,
    ) -> Result<PrismDioptres, LensError> {
        self.convergence_through(eye, distance, Dioptres(0.0))
    }

    /// Convergence of `eye` for a task straight ahead at `distance` metres
    /// seen through a lens of horizontal power `power` centred for distance,
    /// in prism dioptres: 100 x the slope of the ray into the centre of
    /// rotation, `100 x i / c` with `i` from [`Fitting::near_inset_through`]
    /// (with no power, `100 x PD_mono / (l + c)`).
    pub fn convergence_through(
        &self,
        eye: Eye,
        distance: Metres,
        power: Dioptres,
    ) -> Result<PrismDioptres, LensError> {
        let inset = self.near_inset_through(eye, distance, power)?;
        Ok(PrismDioptres(100.0 * inset.0 / self.lens_to_cor().0))
    }
}

#[cfg(test)]
mod tests;
