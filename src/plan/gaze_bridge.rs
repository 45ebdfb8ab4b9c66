//! Temporary gaze geometry for the planner, until the lens branch's
//! `core::gaze` and `core::astigmatism` are merged: where the right eye's
//! line of sight to a task crosses the tilted lens at a head pitch, near PD,
//! convergence, Prentice's vertical imbalance and the Minkwitz usable width.
//! The formulas are the domain brief's (spectacle plane to centre of rotation
//! c = vertex + 13.5 mm; near PD = PD l / (l + c); convergence per eye
//! 100 (PD/2) / (l + c); Prentice P = c F with c in cm; Minkwitz width T / G).
//! Every function here is to be replaced by a call to the lens branch's.

use crate::core::lens::{LensDesign, VerticalExtent};
use crate::core::units::{Degrees, Millimetres, PrismDioptres};
use crate::scenario::{Task, VerticalPosition};

/// Cornea to the eye's centre of rotation, in millimetres (13-14 mm in the
/// domain brief; 13.5 mm from memory, as in the lens branch).
pub const COR_BEHIND_CORNEA_MM: f64 = 13.5;

/// Vertex distance assumed for the lens geometry of contact-lens wearers,
/// whose options are then spectacles worn over the contact lenses, in
/// millimetres (common practice: 12 to 14 mm).
pub const NOMINAL_VERTEX_MM: f64 = 12.0;

/// Astigmatism tolerated at the edge of a usable corridor, in dioptres
/// (0.50 D is the usual contour for usable zones of progressive lenses; common practice).
pub const TOLERATED_ASTIGMATISM_D: f64 = 0.5;

/// The wearer's fitting as the gaze geometry needs it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Fitting {
    /// Spectacle plane to centre of rotation, in millimetres.
    pub c_mm: f64,
    /// Pantoscopic tilt, in radians.
    pub tilt_rad: f64,
    /// Right monocular PD, in millimetres.
    pub pd_right_mm: f64,
    /// Left monocular PD, in millimetres.
    pub pd_left_mm: f64,
    /// The lens's height in the frame around the fitting point.
    pub extent: VerticalExtent,
}

/// A task placed in front of the wearer with the head upright, in
/// millimetres from the midpoint between the centres of rotation
/// (x to the wearer's right, y up, z ahead).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TaskPlace {
    x: f64,
    y: f64,
    z: f64,
}

/// Where the right eye's line of sight crosses its lens.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Crossing {
    /// Lens x, millimetres from the fitting point, nasal positive.
    pub x: f64,
    /// Lens y, millimetres from the fitting point, up positive.
    pub y: f64,
    /// Centre of rotation to the crossing, in millimetres.
    pub cor_to_lens: f64,
}

impl Fitting {
    /// Places `task` with the head upright.
    pub fn place(&self, task: &Task) -> TaskPlace {
        let r = task.distance_m * 1000.0 + self.c_mm;
        let (y, horizontal) = match task.vertical {
            VerticalPosition::GazeAngle { degrees } => {
                let a = degrees.to_radians();
                (r * a.sin(), r * a.cos())
            }
            VerticalPosition::HeightFromEyes { metres } => {
                let h = metres * 1000.0;
                (h, (r * r - h * h).max(0.0).sqrt())
            }
        };
        let x = task.sideways_m * 1000.0;
        let z = (horizontal * horizontal - x * x).max(1.0).sqrt();
        TaskPlace { x, y, z }
    }

    /// The task's elevation seen from between the eyes, head upright, in degrees.
    pub fn elevation(&self, place: &TaskPlace) -> Degrees {
        let horizontal = (place.x * place.x + place.z * place.z).sqrt();
        Degrees::from_radians(place.y.atan2(horizontal))
    }

    /// Where the right eye's line of sight to `place` crosses the right lens
    /// with the head pitched `pitch` degrees (chin up positive); `None` when
    /// the line of sight runs beside the lens plane.
    pub fn crossing(&self, place: &TaskPlace, pitch: Degrees) -> Option<Crossing> {
        let (sp, cp) = pitch.to_radians().sin_cos();
        // Chin up turns the world down in head coordinates.
        let ty = place.y * cp - place.z * sp;
        let tz = place.y * sp + place.z * cp;
        let (dx, dy, dz) = (place.x - self.pd_right_mm, ty, tz);
        let (sa, ca) = self.tilt_rad.sin_cos();
        let towards = -dy * sa + dz * ca;
        if towards <= 1e-9 {
            return None;
        }
        let t = self.c_mm * ca / towards;
        let (px, py, pz) = (t * dx, t * dy, t * dz - self.c_mm);
        Some(Crossing {
            x: -px,
            y: py * ca + pz * sa,
            cor_to_lens: t * (dx * dx + dy * dy + dz * dz).sqrt(),
        })
    }

    /// Near PD for a task `distance_mm` from the spectacle plane: PD l / (l + c).
    pub fn near_pd(&self, distance_mm: f64) -> Millimetres {
        let pd = self.pd_right_mm + self.pd_left_mm;
        Millimetres(pd * distance_mm / (distance_mm + self.c_mm))
    }

    /// Convergence demand of both eyes together, in prism dioptres:
    /// the sum over the eyes of 100 PD_mono / (l + c).
    pub fn convergence(&self, distance_mm: f64) -> PrismDioptres {
        let pd = self.pd_right_mm + self.pd_left_mm;
        PrismDioptres(100.0 * pd / (distance_mm + self.c_mm))
    }
}

/// Vertical prism difference between the eyes `y_mm` from the optical
/// centres (taken at the fitting point) for vertical powers `right_d` and
/// `left_d` (Prentice's rule, P = c F, c in cm).
pub fn vertical_imbalance(y_mm: f64, right_d: f64, left_d: f64) -> PrismDioptres {
    PrismDioptres((y_mm / 10.0 * (right_d - left_d)).abs())
}

/// Usable width of `design` at height `y_mm`, in millimetres; `None` where
/// the design does not limit it. Corridors: Minkwitz T / G; segments: the
/// segment's chord at that height.
pub fn usable_width(design: &LensDesign, y_mm: f64) -> Option<f64> {
    let chord = |c: Millimetres| (c.0 > 0.0).then_some(c.0);
    match design {
        LensDesign::SingleVision(_) => None,
        LensDesign::Progressive(_) | LensDesign::Degressive(_) => {
            let g = design.ramp()?.gradient_at(Millimetres(y_mm)).magnitude();
            (g > 0.0).then(|| TOLERATED_ASTIGMATISM_D / g)
        }
        LensDesign::Bifocal(b) => chord(b.shape().chord_at_depth(b.segment_top().0 - y_mm)),
        LensDesign::Trifocal(t) => chord(t.shape().chord_at_depth(t.segment_top().0 - y_mm)),
        LensDesign::DoubleSegment(d) => {
            let lower = d.shape().chord_at_depth(d.lower_top().0 - y_mm).0;
            let upper = d.shape().chord_at_depth(y_mm - d.upper_bottom().0).0;
            chord(Millimetres(lower.max(upper)))
        }
    }
}

/// The angle in degrees a width `w_mm` spans from `d_mm` away: 2 atan(w / 2d).
pub fn subtended_deg(w_mm: f64, d_mm: f64) -> f64 {
    (2.0 * (w_mm / (2.0 * d_mm)).atan()).to_degrees()
}
