//! Everything the planner works out once per scenario, before any lens is
//! tried: the corrected eye and its amplitude, the pupil, the fitting
//! geometry, and per task its half depth of field, the band of local
//! additions that makes it comfortable or in focus, and the lens height the
//! right eye's line of sight crosses at each head pitch. The solver's inner
//! loop then only compares numbers.
//!
//! **Refraction basis.** Vergence uses the mean of both eyes' spherical
//! equivalents: accommodation is yoked (both eyes accommodate by the same
//! amount), so one accommodative demand must serve both eyes; where the eyes
//! differ by 1 D or more a caution says so.
//!
//! **Contact lenses.** A wearer in contact lenses is corrected for distance
//! by them, and they move with the eye. Every option is then a pair worn
//! over the contact lenses at a nominal vertex distance: its distance part
//! is plano, the eye behind it is treated as corrected (emmetropic), and
//! only the over-pair's own powers (equal in both eyes) give prism.
//!
//! **Driving.** A driving task is not judged by its detail size but by the
//! vision standard for driving: it is comfortable only within
//! [`DRIVING_COMFORT_D`] of defocus, and in focus only while the acuity the
//! defocus leaves (Smith's relation in [`crate::core::acuity`]) meets the
//! standard of the plan settings with one chart line to spare. Its head
//! stays upright: the road and mirrors are watched with the eyes.

use super::error::PlanError;
use super::outcome::{
    AmplitudeSource, AmplitudeUsed, HalfDepthBasis, PupilOrigin, PupilUsed, RefractionBasis,
    RefractionUsed, TaskContext, TaskRef, Verdict,
};
use crate::core::accommodation::{ocular_from_spectacle, AgeModel};
use crate::core::acuity::defocus_for_decimal_acuity;
use crate::core::clear_range::{Viewer, MAX_AMPLITUDE_D};
use crate::core::depth_of_field::{self, task_half_depth, DEFAULT_BLUR_TO_DETAIL};
use crate::core::gaze::{
    keep_on_lens, subtended_angle, Eye, Fitting, FittingParams, TaskPosition, CHIN_UP_LIMIT_DEG,
    COR_BEHIND_CORNEA_MM, TYPICAL_LENS_HALF_WIDTH_MM,
};
use crate::core::lens::VerticalExtent;
use crate::core::prescription::SpheroCylinder;
use crate::core::pupil::{watson_yellott, AdaptedEyes, Luminance, WATSON_YELLOTT_AGES};
use crate::core::units::{Degrees, Dioptres, Metres, Millimetres};
use crate::core::vergence::{object_vergence, CorrectedEye};
use crate::scenario::{
    BlurTolerance, Correction, PlanSettings, PupilSource, ReferencePlane, Scenario, Task,
    ValidScenario,
};

/// Vertex distance assumed for the lens geometry of contact-lens wearers,
/// whose options are then spectacles worn over the contact lenses, in
/// millimetres (common practice: 12 to 14 mm for spectacles).
pub const NOMINAL_VERTEX_MM: f64 = 12.0;
/// Astigmatism tolerated at the edge of a usable corridor, in dioptres
/// (the 0.50 D contour is the usual boundary of usable zones of progressive
/// lenses; common practice).
pub const TOLERATED_ASTIGMATISM_D: f64 = 0.5;
/// Largest chin lift the planner offers, in degrees: the lift beyond which
/// a held posture is not sustainable ([`CHIN_UP_LIMIT_DEG`]), so that no
/// plan asks for a posture the grading calls unsustainable.
pub const MAX_CHIN_UP_DEG: i32 = CHIN_UP_LIMIT_DEG as i32;
/// Largest chin drop the planner offers, in degrees (a product choice).
pub const MAX_CHIN_DOWN_DEG: i32 = 20;
/// Number of head pitches sampled, one per degree from chin down to chin up.
pub const PITCH_SAMPLES: usize = (MAX_CHIN_UP_DEG + MAX_CHIN_DOWN_DEG + 1) as usize;
/// Adapting field assumed for the pupil formula, in degrees: a lit room
/// seen through spectacles fills most of the visual field (a product choice).
pub const ADAPTING_FIELD_DEG: f64 = 60.0;
/// Half depth of field used for the zone ranges when no task says
/// otherwise, in dioptres (±0.25 D, the strict clinical tolerance; common practice).
pub const DEFAULT_ZONE_HALF_DEPTH_D: f64 = 0.25;
/// Most defocus the detail rule lets a task tolerate for a comfortable
/// verdict, in dioptres:
/// the lenient clinical tolerance (±0.50 D; common practice). Coarse detail
/// may stay recognisable with more blur, which the detail rule allows for
/// the in-focus verdict, but sustained work through more than half a
/// dioptre of blur is not comfortable.
pub const COMFORT_HALF_DEPTH_LIMIT_D: f64 = 0.5;
/// Defocus a driving task tolerates for a comfortable verdict, in dioptres
/// (about ±0.25 D at the road; common practice).
pub const DRIVING_COMFORT_D: f64 = 0.25;
/// Margin kept above the driving acuity standard, in logMAR: one chart line,
/// because the acuity model is an average and individual acuity with the
/// same defocus varies by about a line (a product choice).
pub const DRIVING_MARGIN_LOGMAR: f64 = 0.1;
/// Nearest distance at which a driving task counts as the road or what a
/// mirror shows, in metres (a product choice: the dashboard is nearer).
pub const ROAD_DISTANCE_M: f64 = 2.0;
/// Addition bands are kept within ±20 D so they stay finite when a criterion
/// has no limit on one side.
const BAND_LIMIT_D: f64 = 20.0;
/// Slack when comparing an addition with a band edge, in dioptres, so that a
/// grid value that lands on an edge counts as inside.
const EDGE_SLACK_D: f64 = 1e-9;
/// A lens height standing for "the line of sight misses the lens plane".
const OFF_LENS_MM: f64 = 1.0e6;

/// A range of local additions, in dioptres, `lo ≤ add ≤ hi`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Band {
    /// Smallest addition in the band.
    pub lo: f64,
    /// Largest addition in the band.
    pub hi: f64,
}

impl Band {
    /// Whether `add` lies in the band (with a tiny slack at the edges).
    pub fn contains(&self, add: f64) -> bool {
        add >= self.lo - EDGE_SLACK_D && add <= self.hi + EDGE_SLACK_D
    }

    /// How far `add` lies outside the band, in dioptres (0 inside it).
    pub fn distance_to(&self, add: f64) -> f64 {
        if add < self.lo {
            self.lo - add
        } else if add > self.hi {
            add - self.hi
        } else {
            0.0
        }
    }

    /// Whether the band holds any addition.
    pub fn is_empty(&self) -> bool {
        self.lo > self.hi
    }
}

/// How far inside the lens edge, in millimetres, a line of sight must stay
/// to count as seen through the lens (the bevel and frame rim; common practice).
pub const SIDE_MARGIN_MM: f64 = 3.0;

/// One task prepared for the solver.
#[derive(Debug, Clone, PartialEq)]
pub struct TaskPrep {
    /// Hours per day.
    pub hours: f64,
    /// Viewing distance from the spectacle plane.
    pub distance: Metres,
    /// Half depth of field allowed for a comfortable verdict, in dioptres.
    pub half_depth: Dioptres,
    /// Half depth of field allowed for an in-focus verdict, in dioptres: the
    /// same as `half_depth` except for driving tasks, where the driving
    /// acuity standard sets it.
    pub focus_depth: Dioptres,
    /// Local additions that make the task comfortable.
    pub comfort: Band,
    /// Local additions that bring the task into focus with the full amplitude.
    pub focus: Band,
    /// Lens x (nasal positive, mm) of the right eye's line of sight, head
    /// upright, or at the lens edge when the task lies beyond it.
    pub x: f64,
    /// Head turn towards the task, in degrees, that a task beyond the lens
    /// edge needs before its line of sight meets the lens (0 otherwise).
    pub side_turn: f64,
    /// Lens height (mm) of the right eye's line of sight at each head pitch,
    /// from `-MAX_CHIN_DOWN_DEG` to `MAX_CHIN_UP_DEG` in 1 degree steps;
    /// falls as the chin rises.
    pub heights: [f64; PITCH_SAMPLES],
    /// Centre of rotation to the lens along the line of sight, head upright, in mm.
    pub cor_to_lens: f64,
    /// Angle the task's width spans at the eye, in degrees.
    pub width_deg: f64,
    /// The task is part of driving: judged by the driving standard, head upright.
    pub driving: bool,
    /// The task is the road or a mirror's view: a driving task at
    /// [`ROAD_DISTANCE_M`] or more, which must be seen through the distance power.
    pub road: bool,
    /// Vertical prism difference between the eyes per millimetre of lens
    /// height away from the optical centres, in prism dioptres per mm
    /// (Prentice's rule: the difference of the vertical powers / 10).
    pub prism_per_mm: f64,
    /// Vertical prism difference above which the task is tiring, in prism dioptres.
    pub prism_limit: f64,
}

impl TaskPrep {
    /// Lens height with the head upright, in mm.
    pub fn natural_y(&self) -> f64 {
        self.heights[MAX_CHIN_DOWN_DEG as usize]
    }

    /// The focus verdict for a local addition `add` (dioptres).
    pub fn focus_verdict(&self, add: f64) -> Verdict {
        if self.comfort.contains(add) {
            Verdict::Comfortable
        } else if self.focus.contains(add) {
            Verdict::InFocusButTiring
        } else {
            Verdict::Blurred
        }
    }

    /// Whether the vertical prism difference `from_centre` millimetres above
    /// or below the optical centres exceeds the limit.
    pub fn prism_over_limit(&self, from_centre: f64) -> bool {
        self.prism_at(from_centre) > self.prism_limit + EDGE_SLACK_D
    }

    /// Vertical prism difference between the eyes, in prism dioptres, at
    /// `from_centre` millimetres above or below the optical centres.
    pub fn prism_at(&self, from_centre: f64) -> f64 {
        (from_centre * self.prism_per_mm).abs()
    }

    /// The head pitch (degrees, chin up positive) at which the line of
    /// sight crosses the lens at height `y`, interpolated between the
    /// sampled degrees; `None` beyond the allowed pitches.
    pub fn pitch_for(&self, y: f64) -> Option<f64> {
        let h = &self.heights;
        let (first, last) = (h.first()?, h.last()?);
        if y > *first || y < *last {
            return None;
        }
        // Heights fall as the pitch rises: the first sample at or below `y`
        // closes the interval that holds it.
        let i = h.partition_point(|&v| v > y).max(1);
        let (a, b) = (*h.get(i - 1)?, *h.get(i)?);
        let t = if a > b { (a - y) / (a - b) } else { 0.0 };
        Some((i - 1) as f64 + t - MAX_CHIN_DOWN_DEG as f64)
    }
}

/// The wearer-level results and per-task preparation of one scenario.
#[derive(Debug, Clone)]
pub struct Context {
    /// The corrected eye (mean spherical equivalent) with its amplitude.
    pub viewer: Viewer,
    /// The distance power of the options used for vergence, in dioptres
    /// (mean spherical equivalent; 0 over contact lenses).
    pub distance_power: Dioptres,
    /// Right-eye distance power of the options (plano over contact lenses).
    pub right: SpheroCylinder,
    /// Left-eye distance power of the options (plano over contact lenses).
    pub left: SpheroCylinder,
    /// The options are worn over contact lenses.
    pub over_contact_lenses: bool,
    /// The limits the plan judges against.
    pub settings: PlanSettings,
    /// Pupil diameter.
    pub pupil: Millimetres,
    /// Fitting geometry.
    pub fitting: Fitting,
    /// The lens's extent in the frame.
    pub extent: VerticalExtent,
    /// What the plan reports about the amplitude.
    pub amplitude: AmplitudeUsed,
    /// What the plan reports about the refraction.
    pub refraction: RefractionUsed,
    /// What the plan reports about the pupil.
    pub pupil_used: PupilUsed,
    /// Half depth of field for the zone ranges, in dioptres.
    pub zone_half_depth: Dioptres,
    /// Per task, for the solver.
    pub tasks: Vec<TaskPrep>,
    /// Per task, for the report.
    pub contexts: Vec<TaskContext>,
    /// Inputs the models had to clamp: (model name, quantity, value, used).
    pub clamped: Vec<(&'static str, &'static str, f64, f64)>,
}

impl Context {
    /// Works out everything that does not depend on a lens option.
    pub fn new(valid: &ValidScenario) -> Result<Context, PlanError> {
        let s: &Scenario = valid.get();
        let w = &s.wearer;
        let (worn_right, worn_left) = (valid.right(), valid.left());
        let over_contact_lenses = w.correction == Correction::ContactLenses;
        let (right, left, vertex_mm) = match w.correction {
            Correction::Spectacles { vertex_mm } => (worn_right, worn_left, vertex_mm),
            Correction::ContactLenses => (
                SpheroCylinder::PLANO,
                SpheroCylinder::PLANO,
                NOMINAL_VERTEX_MM,
            ),
        };
        let mean = Dioptres(0.5 * (right.spherical_equivalent().0 + left.spherical_equivalent().0));
        let eye = CorrectedEye::new(mean, Millimetres(vertex_mm).to_m())
            .map_err(PlanError::optics("wearer.correction"))?;
        let prism_per_mm = (right.vertical_power().0 - left.vertical_power().0) / 10.0;
        let mut clamped = Vec::new();

        let (amplitude, ocular) = amplitude_of(w, &eye, &mut clamped)?;
        let usable = valid.usable();
        // Every amplitude the planner takes (Hofstetter's push-up norm, a
        // push-up or minus-lens measurement) is subjective: it already holds
        // the depth of focus at the near end.
        let viewer = Viewer::new(eye, ocular, usable)
            .map_err(PlanError::optics("wearer"))?
            .with_subjective_amplitude()
            .with_rounding_tolerance(Dioptres(s.settings.addition_rounding.tolerated_shortfall()));
        let amplitude = AmplitudeUsed {
            ocular,
            usable_fraction: w.usable_fraction,
            usable_ocular: usable.of(ocular),
            ..amplitude
        };

        let pupil_used = pupil_of(w.pupil, w.age_years, &mut clamped)?;
        let pupil = pupil_used.diameter;

        let extent = valid.extent();
        let fitting = Fitting::new(FittingParams {
            pd_right: Millimetres(w.pd_right_mm),
            pd_left: Millimetres(w.pd_left_mm),
            vertex: Millimetres(vertex_mm),
            cor_behind_cornea: Millimetres(COR_BEHIND_CORNEA_MM),
            pantoscopic_tilt: Degrees(w.pantoscopic_tilt_deg),
            face_form: Degrees(0.0),
            extent,
        })
        .map_err(PlanError::lens("wearer"))?;

        let tolerance = match w.blur_tolerance {
            BlurTolerance::Clinical { half_depth_d } => {
                depth_of_field::BlurTolerance::Clinical(Dioptres(half_depth_d))
            }
            BlurTolerance::FromDetail => depth_of_field::BlurTolerance::FromDetail {
                ratio: DEFAULT_BLUR_TO_DETAIL,
            },
        };
        let basis = match w.blur_tolerance {
            BlurTolerance::Clinical { .. } => HalfDepthBasis::Clinical,
            BlurTolerance::FromDetail => HalfDepthBasis::FromDetail,
        };
        let mut tasks = Vec::with_capacity(s.tasks.len());
        let mut contexts = Vec::with_capacity(s.tasks.len());
        let driving_limit = driving_defocus(s.settings.driving_acuity_decimal, pupil);
        for (i, t) in s.tasks.iter().enumerate() {
            let field = format!("tasks[{i}]");
            let (half_depth, focus_depth, task_basis) = if t.flags.driving {
                (
                    Dioptres(DRIVING_COMFORT_D.min(driving_limit.0)),
                    driving_limit,
                    HalfDepthBasis::DrivingStandard,
                )
            } else {
                let d = task_half_depth(
                    tolerance,
                    pupil,
                    Millimetres(t.detail_mm),
                    valid.positions()[i].distance,
                )
                .map_err(PlanError::optics(field.clone()))?;
                // The practitioner's own clinical tolerance stands as entered.
                let comfort = match basis {
                    HalfDepthBasis::FromDetail => Dioptres(d.0.min(COMFORT_HALF_DEPTH_LIMIT_D)),
                    _ => d,
                };
                (comfort, d, basis)
            };
            let (mut prep, elevation) = prepare_task(
                t,
                &valid.positions()[i],
                &viewer,
                mean,
                (half_depth, focus_depth),
                &fitting,
                &field,
            )?;
            prep.prism_per_mm = prism_per_mm;
            prep.prism_limit = s.settings.vertical_imbalance_limit_pd;
            contexts.push(TaskContext {
                task: TaskRef {
                    index: i,
                    name: t.name.clone(),
                },
                distance: valid.positions()[i].distance,
                hours_per_day: t.hours_per_day,
                gaze_elevation: elevation,
                half_depth,
                half_depth_basis: task_basis,
                width_angle: Degrees(prep.width_deg),
            });
            tasks.push(prep);
        }
        let zone_half_depth = match w.blur_tolerance {
            BlurTolerance::Clinical { half_depth_d } => Dioptres(half_depth_d),
            BlurTolerance::FromDetail => Dioptres(
                tasks
                    .iter()
                    .map(|t| t.half_depth.0)
                    .reduce(f64::min)
                    .unwrap_or(DEFAULT_ZONE_HALF_DEPTH_D),
            ),
        };
        let refraction = RefractionUsed {
            right_equivalent: worn_right.spherical_equivalent(),
            left_equivalent: worn_left.spherical_equivalent(),
            used: mean,
            basis: if over_contact_lenses {
                RefractionBasis::OverContactLenses
            } else {
                RefractionBasis::MeanOfBothEyes
            },
            vertex: Millimetres(vertex_mm),
        };
        Ok(Context {
            viewer,
            distance_power: mean,
            right,
            left,
            over_contact_lenses,
            settings: s.settings,
            pupil,
            fitting,
            extent,
            amplitude,
            refraction,
            pupil_used,
            zone_half_depth,
            tasks,
            contexts,
            clamped,
        })
    }
}

/// The largest defocus, in dioptres, that leaves the driving acuity
/// `standard` (decimal) with [`DRIVING_MARGIN_LOGMAR`] to spare through `pupil`.
fn driving_defocus(standard: f64, pupil: Millimetres) -> Dioptres {
    let required = (standard * 10f64.powf(DRIVING_MARGIN_LOGMAR)).min(1.0);
    let limit = defocus_for_decimal_acuity(required, pupil).unwrap_or(Dioptres(0.0));
    // Beyond the depth-of-field model's range the geometric blur disc no
    // longer describes the image; the model's own limit applies.
    Dioptres(limit.0.min(depth_of_field::MAX_HALF_DEPTH_D))
}

/// The amplitude as stated (measured, or Hofstetter's minimum for the age)
/// and referred to the eye.
fn amplitude_of(
    w: &crate::scenario::Wearer,
    eye: &CorrectedEye,
    clamped: &mut Vec<(&'static str, &'static str, f64, f64)>,
) -> Result<(AmplitudeUsed, Dioptres), PlanError> {
    let (source, stated, plane) = match w.measured_amplitude {
        Some(m) => (
            AmplitudeSource::Measured { method: m.method },
            Dioptres(m.dioptres),
            m.plane,
        ),
        None => {
            let model = AgeModel::HofstetterMinimum;
            let (lo, hi) = model.supported_ages();
            let age = w.age_years.clamp(lo, hi);
            if age != w.age_years {
                clamped.push((model.name(), "age", w.age_years, age));
            }
            let a = model
                .amplitude(age)
                .map_err(PlanError::optics("wearer.age_years"))?;
            let plane = match model.plane() {
                crate::core::accommodation::AmplitudePlane::Spectacle => ReferencePlane::Spectacle,
                crate::core::accommodation::AmplitudePlane::Ocular => ReferencePlane::Ocular,
            };
            (
                AmplitudeSource::AgeModel {
                    model,
                    age_years: age,
                },
                a,
                plane,
            )
        }
    };
    // An age norm describes the eyes of (near-)emmetropic subjects: it is
    // referred to the eye through a plano lens at the same vertex, never
    // through the wearer's own lens, which acts only on each task's demand.
    // A measurement was taken through the wearer's own correction.
    let through = match source {
        AmplitudeSource::AgeModel { .. } => CorrectedEye::new(Dioptres(0.0), eye.vertex())
            .map_err(PlanError::optics("wearer.correction"))?,
        AmplitudeSource::Measured { .. } => *eye,
    };
    let converted = match plane {
        ReferencePlane::Spectacle => ocular_from_spectacle(&through, stated)
            .map_err(PlanError::optics("wearer.measured_amplitude"))?,
        ReferencePlane::Ocular => stated,
    };
    // A spectacle-plane figure through a strong lens can exceed what any
    // eye accommodates; the model's ceiling applies, and the plan says so.
    let ocular = Dioptres(converted.0.min(MAX_AMPLITUDE_D));
    if ocular != converted {
        clamped.push((
            "the accommodation model",
            "ocular amplitude",
            converted.0,
            ocular.0,
        ));
    }
    Ok((
        AmplitudeUsed {
            source,
            stated,
            stated_plane: plane,
            ocular,
            usable_fraction: w.usable_fraction,
            usable_ocular: ocular,
        },
        ocular,
    ))
}

/// The pupil: measured, or Watson & Yellott (2012) for the lighting and age.
fn pupil_of(
    source: PupilSource,
    age_years: f64,
    clamped: &mut Vec<(&'static str, &'static str, f64, f64)>,
) -> Result<PupilUsed, PlanError> {
    match source {
        PupilSource::Measured { diameter_mm } => Ok(PupilUsed {
            diameter: Millimetres(diameter_mm),
            source: PupilOrigin::Measured,
        }),
        PupilSource::FromLighting { luminance_cd_m2 } => {
            let (lo, hi) = WATSON_YELLOTT_AGES;
            let age = age_years.clamp(lo, hi);
            if age != age_years {
                clamped.push(("Watson & Yellott 2012", "age", age_years, age));
            }
            let luminance = Luminance::cd_per_m2(luminance_cd_m2)
                .map_err(PlanError::optics("wearer.pupil.luminance_cd_m2"))?;
            let d = watson_yellott(
                luminance,
                Degrees(ADAPTING_FIELD_DEG),
                age,
                AdaptedEyes::Both,
            )
            .map_err(PlanError::optics("wearer.pupil"))?;
            Ok(PupilUsed {
                diameter: d,
                source: PupilOrigin::WatsonYellott {
                    luminance_cd_m2,
                    field: Degrees(ADAPTING_FIELD_DEG),
                    age_years: age,
                },
            })
        }
    }
}

/// The band of local additions (over `distance_power`) for which the
/// accommodation a task at object vergence `l` needs lies within
/// `[lo_acc, hi_acc]`. Accommodation falls as plus power rises, so the
/// upper accommodation limit sets the smallest addition. Inverts
/// [`CorrectedEye::accommodation_for_vergence`] through
/// [`CorrectedEye::vergence_for_accommodation`].
fn addition_band(viewer: &Viewer, l: f64, distance_power: f64, lo_acc: f64, hi_acc: f64) -> Band {
    let power_for = |acc: f64, missing: f64| {
        viewer
            .eye()
            .vergence_for_accommodation(Dioptres(acc), Dioptres(0.0))
            .map_or(missing, |at_lens| at_lens.0 - l - distance_power)
            .clamp(-BAND_LIMIT_D, BAND_LIMIT_D)
    };
    Band {
        lo: power_for(hi_acc, -BAND_LIMIT_D),
        hi: power_for(lo_acc, BAND_LIMIT_D),
    }
}

/// A task's solver data and its upright gaze elevation (degrees).
fn prepare_task(
    t: &Task,
    position: &TaskPosition,
    viewer: &Viewer,
    distance_power: Dioptres,
    (half_depth, focus_depth): (Dioptres, Dioptres),
    fitting: &Fitting,
    field: &str,
) -> Result<(TaskPrep, Degrees), PlanError> {
    let l = object_vergence(position.distance)
        .map_err(PlanError::optics(field))?
        .0;
    let dof = half_depth.0;
    let amp = viewer.amplitude().0;
    let usable = viewer.usable().of(viewer.amplitude()).0;
    let f = distance_power.0;
    let point = fitting.locate(position).map_err(PlanError::lens(field))?;
    let mut heights = [0.0; PITCH_SAMPLES];
    for (i, h) in heights.iter_mut().enumerate() {
        let pitch = Degrees(i as f64 - MAX_CHIN_DOWN_DEG as f64);
        *h = match fitting.crossing(Eye::Right, &point, pitch) {
            Some(c) => c.point.y.0,
            // A line of sight beside the lens plane only happens at extreme
            // gaze; keep the heights ordered with a far-off value.
            None if i < MAX_CHIN_DOWN_DEG as usize => OFF_LENS_MM,
            None => -OFF_LENS_MM,
        };
    }
    let c = fitting.lens_to_cor().0;
    let upright = fitting.crossing(Eye::Right, &point, Degrees(0.0));
    let width = subtended_angle(
        Millimetres(t.width_m * 1000.0),
        Millimetres(position.distance.to_mm().0 + c),
    )
    .map_err(PlanError::lens(field))?;
    let cor_to_lens = upright.map_or(c, |c| c.cor_to_lens.0);
    let (x, side_turn) = keep_on_lens(
        Millimetres(upright.map_or(0.0, |c| c.point.x.0)),
        Millimetres(cor_to_lens),
        Millimetres(TYPICAL_LENS_HALF_WIDTH_MM - SIDE_MARGIN_MM),
    );
    let prep = TaskPrep {
        hours: t.hours_per_day,
        distance: position.distance,
        half_depth,
        focus_depth,
        comfort: addition_band(
            viewer,
            l,
            f,
            -dof,
            usable + viewer.near_end_allowance(half_depth).0,
        ),
        focus: addition_band(
            viewer,
            l,
            f,
            -focus_depth.0,
            amp + viewer.near_end_allowance(focus_depth).0,
        ),
        x: x.0,
        side_turn: side_turn.0,
        heights,
        cor_to_lens,
        width_deg: width.0,
        driving: t.flags.driving,
        road: t.flags.driving && position.distance.0 >= ROAD_DISTANCE_M,
        prism_per_mm: 0.0,
        prism_limit: f64::INFINITY,
    };
    Ok((prep, upright.map_or(Degrees(0.0), |c| c.elevation)))
}
