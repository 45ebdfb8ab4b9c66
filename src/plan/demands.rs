//! The task-demand sheet for occupational health: each task of a workstation
//! judged through the worker's current glasses, in plain figures (distance,
//! accommodation needed against what is available, convergence, gaze and
//! posture, detail size against the character-height guidance for
//! displays, hours), with one flag per task and its reason in numbers.
//!
//! Every judgement comes from [`super::plan`] itself: the current glasses
//! are planned as the only option, a workstation change is checked by
//! planning the changed workstation again, and task-specific eyewear by
//! planning a single-vision task lens, which must clear every reason but the
//! text size and is never the lens already worn. A driving task is judged
//! by the driving standard and gets neither a workstation change nor a task
//! lens (glasses are not swapped for a glance, and plus for the dashboard
//! blurs the road): when it is not fine it is referred, with the planner's
//! driving figures; a head turn to a mirror is a glance, not a flag. The
//! flags screen and document; they defer every power and design to
//! licensed eye-care practice.

use super::ergonomics::{
    size_for_arcmin, subtended_arcmin, AMPLITUDE_BELOW_NORM_REFER_D, CHARACTER_HEIGHT_MIN_ARCMIN,
    CHARACTER_HEIGHT_PREFERRED_ARCMIN, MAX_DISTANCE_CHANGE_M, NEAREST_WORKING_DISTANCE_M,
};
use super::{
    plan, AmplitudeSource, AmplitudeUsed, DefocusDirection, FarLimit, Plan, PlanError, Strain,
    TaskPlan, ZoneRange,
};
use super::{TaskRef, Verdict};
use crate::core::accommodation::AgeModel;
use crate::core::lens::SINGLE_VISION_ADDITION_GRID;
use crate::core::units::{Degrees, Dioptres, Metres, PrismDioptres};
use crate::display::metric_length;
use crate::scenario::{
    validate, FamilyChoice, LensOption, Scenario, ValidScenario, VerticalPosition,
};
use serde::Serialize;
use std::fmt;

/// The sheet for one worker at one workstation.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct DemandSheet {
    /// The scenario's name (the workstation, a pseudonymous worker id).
    pub scenario_name: String,
    /// What the tasks were judged through.
    pub glasses: String,
    /// The amplitude of accommodation behind every figure.
    pub amplitude: AmplitudeUsed,
    /// Hofstetter's minimum for the worker's age, in dioptres, shown beside
    /// a measured amplitude; `None` when the amplitude came from age.
    pub age_norm_minimum: Option<Dioptres>,
    /// Set when a measured amplitude lies far below the age norm: every
    /// task not fine as it is is then referred for an eye examination.
    pub amplitude_below_norm: bool,
    /// Each task, in input order.
    pub tasks: Vec<TaskDemand>,
}

impl DemandSheet {
    /// The most serious flag of the sheet (fine when there are no tasks).
    pub fn worst_flag(&self) -> FlagKind {
        self.tasks
            .iter()
            .map(|t| t.flag.kind())
            .max()
            .unwrap_or(FlagKind::Fine)
    }
}

/// One task's demands against what the worker has.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct TaskDemand {
    /// The task.
    pub task: TaskRef,
    /// Viewing distance from the spectacle plane, in metres.
    pub distance: Metres,
    /// Hours a day on the task.
    pub hours_per_day: f64,
    /// Ocular accommodation the task needs through the current glasses at
    /// its lens point, in dioptres (0 or less: none needed).
    pub accommodation_needed: Dioptres,
    /// Ocular accommodation available for sustained work (the usable share), in dioptres.
    pub accommodation_comfortable: Dioptres,
    /// The whole ocular amplitude, in dioptres.
    pub accommodation_full: Dioptres,
    /// Plus power missing for comfort after the depth of focus is counted,
    /// in dioptres (negative: this much too much plus; 0 when comfortable).
    pub short_of_comfort: Dioptres,
    /// Convergence of both eyes together, in prism dioptres.
    pub convergence: PrismDioptres,
    /// Gaze direction to the task centre from the eye, in degrees (negative is down).
    pub gaze: Degrees,
    /// Head tilt the glasses force, in degrees (positive lifts the chin).
    pub chin_up: Degrees,
    /// Head turn held towards the task, in degrees (a task beyond the lens
    /// edge or beside a corridor's usable zone; 0 when none).
    pub head_turn: Degrees,
    /// Further head turn to sweep across the task, in degrees (0 when the
    /// zone is wide enough).
    pub head_sweep: Degrees,
    /// How sustainable the worst of the head pitch and head turn is. For a
    /// driving task only the pitch counts: a turn to a mirror is a glance,
    /// part of driving, not a held posture.
    pub posture: Strain,
    /// Detail size as an angle, in minutes of arc.
    pub detail_arcmin: f64,
    /// Whether the task is reading text on a display (the character-height
    /// guidance applies).
    pub screen: bool,
    /// Whether the task is part of driving (judged by the driving vision
    /// standard; never offered task eyewear or workstation changes).
    pub driving: bool,
    /// The focus verdict through the current glasses.
    pub verdict: Verdict,
    /// The flag, with its reasons and what would clear it.
    pub flag: Flag,
}

/// The flag of one task.
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum Flag {
    /// The task is fine as it is.
    Fine,
    /// The workstation changes listed clear the flag (checked by planning again).
    WorkstationChange {
        /// Why the task is flagged.
        reasons: Vec<Reason>,
        /// What to change.
        changes: Vec<Change>,
    },
    /// Glasses made for the task, to discuss with an eye-care practitioner:
    /// a single-vision lens of about this addition serves it (checked by
    /// planning it); the practitioner decides.
    TaskEyewear {
        /// Why the task is flagged.
        reasons: Vec<Reason>,
        /// Addition over the distance correction found to serve the task, in dioptres.
        addition: Dioptres,
    },
    /// Refer for an eye examination.
    Refer {
        /// Why the task is flagged.
        reasons: Vec<Reason>,
    },
}

/// The flags in order of seriousness (for a team table and sorting).
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Hash, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum FlagKind {
    /// Fine as it is.
    Fine,
    /// Needs a workstation change.
    WorkstationChange,
    /// Needs task-specific eyewear, to discuss with a practitioner.
    TaskEyewear,
    /// Refer for an eye examination.
    Refer,
}

impl FlagKind {
    /// The flag in a few words.
    pub fn words(self) -> &'static str {
        match self {
            FlagKind::Fine => "fine as is",
            FlagKind::WorkstationChange => "workstation change",
            FlagKind::TaskEyewear => "task eyewear to discuss with an eye-care practitioner",
            FlagKind::Refer => "refer for an eye examination",
        }
    }
}

impl Flag {
    /// Which flag this is.
    pub fn kind(&self) -> FlagKind {
        match self {
            Flag::Fine => FlagKind::Fine,
            Flag::WorkstationChange { .. } => FlagKind::WorkstationChange,
            Flag::TaskEyewear { .. } => FlagKind::TaskEyewear,
            Flag::Refer { .. } => FlagKind::Refer,
        }
    }

    /// The reasons, empty when fine.
    pub fn reasons(&self) -> &[Reason] {
        match self {
            Flag::Fine => &[],
            Flag::WorkstationChange { reasons, .. }
            | Flag::TaskEyewear { reasons, .. }
            | Flag::Refer { reasons } => reasons,
        }
    }
}

/// Why a task is flagged, in numbers.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum Reason {
    /// More accommodation than the usable share (dioptres, ocular).
    ShortOfFocus {
        /// Accommodation needed, in dioptres.
        needs: Dioptres,
        /// Accommodation available for sustained work, in dioptres.
        has: Dioptres,
        /// Plus missing after the depth of focus, in dioptres.
        short_by: Dioptres,
    },
    /// The glasses give more plus than the task can take, in dioptres.
    TooMuchPlus {
        /// Excess plus, in dioptres.
        excess: Dioptres,
    },
    /// The head posture the glasses force is tiring or not sustainable.
    Posture {
        /// Head tilt, in degrees (positive lifts the chin).
        chin_up: Degrees,
        /// Head turn held towards the task, in degrees.
        turn: Degrees,
        /// Further head turn to sweep across the task, in degrees.
        sweep: Degrees,
        /// How sustainable it is.
        strain: Strain,
    },
    /// Unequal vertical powers give more vertical prism between the eyes
    /// where the task is seen than the plan's limit (Prentice's rule).
    VerticalPrism {
        /// Vertical prism difference at the task's lens point, in prism dioptres.
        imbalance: PrismDioptres,
        /// The plan's limit, in prism dioptres.
        limit: PrismDioptres,
    },
    /// A driving task against the driving vision standard of the plan
    /// settings (one chart line to spare), in the planner's own figures.
    DrivingVision {
        /// Defocus the whole amplitude cannot remove, in dioptres (0 when none).
        defocus: Dioptres,
        /// The defocus lies beyond the near end of the whole focusing range
        /// (more plus would help); otherwise the glasses give too much plus.
        nearer_than_range: bool,
        /// Decimal acuity Smith's (1991) relation estimates from that
        /// defocus, for an eye that sees 1.0 when corrected.
        acuity: f64,
        /// The standard, decimal.
        standard: f64,
        /// Whether the task meets the standard with a line to spare.
        meets: bool,
    },
    /// A driving task is not given task eyewear: glasses for driving must
    /// keep the road and mirrors sharp, and are for licensed practice under
    /// the local driving-vision rules.
    DrivingEyewear,
    /// Screen text smaller than the guidance's minimum.
    SmallText {
        /// Character height, in minutes of arc.
        arcmin: f64,
        /// The minimum, in minutes of arc.
        minimum: f64,
    },
    /// A measured amplitude far below the age norm.
    AmplitudeBelowNorm {
        /// The measured amplitude, in dioptres.
        measured: Dioptres,
        /// Hofstetter's minimum for the age, in dioptres.
        norm_minimum: Dioptres,
    },
    /// No lens in the catalogue's range serves the task.
    NoEyewearServes,
}

impl fmt::Display for Reason {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Reason::ShortOfFocus {
                needs,
                has,
                short_by,
            } => write!(
                f,
                "needs {:.2} D of focusing, has {:.2} D comfortably: short by {:.2} D",
                needs.0, has.0, short_by.0
            ),
            Reason::TooMuchPlus { excess } => write!(
                f,
                "the glasses give {:.2} D more plus than this distance can take",
                excess.0
            ),
            Reason::Posture {
                chin_up,
                turn,
                sweep,
                strain,
            } => {
                let mut parts = Vec::new();
                if chin_up.0 > 0.5 {
                    parts.push(format!("chin lifted {:.0}°", chin_up.0));
                } else if chin_up.0 < -0.5 {
                    parts.push(format!("chin dropped {:.0}°", -chin_up.0));
                }
                if turn.0 > 0.5 {
                    parts.push(format!("head turned {:.0}° towards it", turn.0));
                }
                if sweep.0 > 0.5 {
                    parts.push(format!("a further {:.0}° to sweep across it", sweep.0));
                }
                if parts.is_empty() {
                    parts.push("no head posture brings it into view".to_string());
                }
                write!(f, "{} to see it: {strain}", parts.join(", "))
            }
            Reason::VerticalPrism { imbalance, limit } => write!(
                f,
                "{:.2} Δ of vertical prism between the eyes here, above the {:.2} Δ limit \
                 (Prentice's rule); centration, slab-off or contact lenses are for an \
                 eye-care practitioner to weigh",
                imbalance.0, limit.0
            ),
            Reason::DrivingVision {
                defocus,
                nearer_than_range,
                acuity,
                standard,
                meets,
            } => {
                if meets {
                    write!(
                        f,
                        "driving vision: {:.2} D out of focus, estimated acuity {acuity:.1} \
                         (Smith 1991): meets the {standard:.1} driving standard with a line to spare",
                        defocus.0
                    )
                } else if nearer_than_range {
                    // Smith's estimate from this defocus alone would flatter the
                    // eye: the focusing range (measured or from the age norm)
                    // already holds the depth of focus at its near end, so the
                    // planner allows no further blur there.
                    write!(
                        f,
                        "driving vision: {:.2} D nearer than the whole focusing range reaches, \
                         where no blur is allowed: below the {standard:.1} driving standard \
                         with a line to spare",
                        defocus.0
                    )
                } else {
                    write!(
                        f,
                        "driving vision: {:.2} D out of focus leaves an estimated acuity of \
                         {acuity:.2} (Smith 1991), below the {standard:.1} driving standard \
                         with a line to spare",
                        defocus.0
                    )
                }
            }
            Reason::SmallText { arcmin, minimum } => write!(
                f,
                "text {arcmin:.0}′ high, below the {minimum:.0}′ minimum for display text"
            ),
            Reason::AmplitudeBelowNorm {
                measured,
                norm_minimum,
            } => write!(
                f,
                "measured focusing range {:.2} D, well below the {:.2} D minimum expected at this age",
                measured.0, norm_minimum.0
            ),
            Reason::NoEyewearServes => {
                f.write_str("no single-vision lens in the range made serves it")
            }
            Reason::DrivingEyewear => f.write_str(
                "part of driving: no task glasses (a reading, occupational or upper-segment \
                 lens is not for driving); eyewear for driving is for a licensed eye-care \
                 practitioner under local driving-vision rules (EU: Directive 2006/126/EC, \
                 Annex III)",
            ),
        }
    }
}

/// A workstation change, computed and checked by planning again.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum Change {
    /// Move the task to this distance.
    MoveTo {
        /// New distance from the eyes, in metres.
        distance: Metres,
    },
    /// Set the task centre at this gaze angle (same distance).
    GazeTo {
        /// New gaze angle, in degrees (negative is below eye level).
        gaze: Degrees,
        /// Change of height of the task centre, in metres (negative: lower it).
        height_change: Metres,
    },
    /// Enlarge the text to this character height.
    EnlargeText {
        /// New character height, in millimetres.
        to_mm: f64,
        /// Enlargement, in percent of the present size.
        percent: f64,
    },
}

impl fmt::Display for Change {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match *self {
            Change::MoveTo { distance } => {
                write!(f, "move it to {} from the eyes", metric_length(distance.0))
            }
            Change::GazeTo {
                gaze,
                height_change,
            } => {
                let way = if height_change.0 < 0.0 {
                    "lower"
                } else {
                    "raise"
                };
                write!(
                    f,
                    "{way} its centre by {}, to {:.0}° {} eye level",
                    metric_length(height_change.0.abs()),
                    gaze.0.abs(),
                    if gaze.0 < 0.0 { "below" } else { "above" }
                )
            }
            Change::EnlargeText { to_mm, percent } => write!(
                f,
                "enlarge the text by {percent:.0} % (capitals {to_mm:.1} mm high)"
            ),
        }
    }
}

/// The sheet for `scenario`: every task through its current glasses (the
/// distance correction alone when none are entered).
///
/// An error only when the planner fails on the workstation or a change of
/// it (a model's domain left; the message names the field).
pub fn demand_sheet(scenario: &ValidScenario) -> Result<DemandSheet, DemandError> {
    let s = scenario.get();
    let (label, worn) = match &s.current_glasses {
        Some(g) => (g.label.clone(), g.as_worn()),
        None => (
            "distance correction only (no current glasses entered)".to_string(),
            FamilyChoice::SingleVision {
                addition_d: Some(0.0),
            },
        ),
    };
    let base = plan_with(s, &label, worn)?.map_err(DemandError::Glasses)?;
    let seen = base
        .options
        .first()
        .map(|o| o.tasks.clone())
        .unwrap_or_default();
    let amplitude = base.amplitude;
    let (age_norm_minimum, amplitude_below_norm) = age_norm(s.wearer.age_years, &amplitude);
    let prism_limit = PrismDioptres(s.settings.vertical_imbalance_limit_pd);
    let mut tasks = Vec::with_capacity(seen.len());
    for (i, tp) in seen.iter().enumerate() {
        let (Some(t), Some(tc)) = (s.tasks.get(i), base.tasks.get(i)) else {
            continue;
        };
        let detail_arcmin = subtended_arcmin(t.detail_mm, t.distance_m);
        let terms = Terms {
            screen: t.flags.screen,
            driving: t.flags.driving,
            prism_limit,
        };
        let mut reasons = problems(tp, &terms, detail_arcmin, &amplitude);
        if terms.driving && !reasons.is_empty() {
            reasons.extend(driving_reason(tp));
        }
        let flag = if reasons.is_empty() {
            Flag::Fine
        } else if amplitude_below_norm {
            reasons.push(Reason::AmplitudeBelowNorm {
                measured: amplitude.stated,
                norm_minimum: age_norm_minimum.unwrap_or(Dioptres(0.0)),
            });
            if terms.driving {
                reasons.push(Reason::DrivingEyewear);
            }
            Flag::Refer { reasons }
        } else if terms.driving {
            // Glasses cannot be changed for one glance while driving, and a
            // lens with plus for the dashboard alone blurs the road: the
            // eyewear question goes to licensed practice.
            reasons.push(Reason::DrivingEyewear);
            Flag::Refer { reasons }
        } else {
            let changes = changes_for(s, i, tp);
            let cleared = if changes.is_empty() {
                false
            } else {
                let changed = with_changes(s, i, &changes);
                task_through(&changed, &label, worn, i)?.is_some_and(|after| {
                    let arcmin = changed
                        .tasks
                        .get(i)
                        .map_or(0.0, |t| subtended_arcmin(t.detail_mm, t.distance_m));
                    problems(&after, &terms, arcmin, &amplitude).is_empty()
                })
            };
            if cleared {
                Flag::WorkstationChange { reasons, changes }
            } else {
                eyewear_flag(
                    s,
                    (&label, worn),
                    i,
                    tp,
                    (&terms, &amplitude, detail_arcmin),
                    reasons,
                )?
            }
        };
        let pitch = tp.posture.strain;
        tasks.push(TaskDemand {
            task: tc.task.clone(),
            distance: tc.distance,
            hours_per_day: tc.hours_per_day,
            accommodation_needed: tp.accommodation,
            accommodation_comfortable: amplitude.usable_ocular,
            accommodation_full: amplitude.ocular,
            short_of_comfort: tp.blur.short_of_comfort,
            convergence: tp.near_vision.convergence,
            gaze: tc.gaze_elevation,
            chin_up: tp.posture.chin_up,
            head_turn: tp.field.held_turn,
            head_sweep: Degrees(tp.field.head_turn.0 - tp.field.held_turn.0),
            posture: if terms.driving {
                pitch
            } else {
                pitch.max(tp.field.turn_strain)
            },
            detail_arcmin,
            screen: t.flags.screen,
            driving: t.flags.driving,
            verdict: tp.verdict,
            flag,
        });
    }
    Ok(DemandSheet {
        scenario_name: s.name.clone(),
        glasses: label,
        amplitude,
        age_norm_minimum,
        amplitude_below_norm,
        tasks,
    })
}

/// Why a sheet could not be made.
#[derive(Debug, Clone, PartialEq)]
pub enum DemandError {
    /// The planner failed on the workstation as entered.
    Plan(PlanError),
    /// The glasses as worn did not pass the scenario gate (a field path and
    /// its problem); a checked scenario never gets here.
    Glasses(String),
}

impl fmt::Display for DemandError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            DemandError::Plan(e) => e.fmt(f),
            DemandError::Glasses(e) => write!(f, "the current glasses could not be checked: {e}"),
        }
    }
}

impl std::error::Error for DemandError {}

impl From<PlanError> for DemandError {
    fn from(e: PlanError) -> DemandError {
        DemandError::Plan(e)
    }
}

/// `s` planned with `family` (labelled `label`) as its only option; `None`
/// when that changed scenario leaves the allowed ranges.
fn plan_with(
    s: &Scenario,
    label: &str,
    family: FamilyChoice,
) -> Result<Result<Plan, String>, PlanError> {
    let mut c = s.clone();
    c.options = vec![LensOption {
        label: label.to_string(),
        family,
    }];
    match validate(c) {
        Ok(valid) => plan(&valid).map(Ok),
        Err(errors) => Ok(Err(errors
            .iter()
            .map(|e| format!("{}: {}", e.path, e.problem))
            .collect::<Vec<_>>()
            .join("; "))),
    }
}

/// The plan of task `i` when `s` is worn through `family` only; `None` when
/// the changed scenario leaves the allowed ranges (a computed change that
/// does so is no change to offer).
fn task_through(
    s: &Scenario,
    label: &str,
    family: FamilyChoice,
    i: usize,
) -> Result<Option<TaskPlan>, PlanError> {
    Ok(plan_with(s, label, family)?
        .ok()
        .and_then(|p| p.options.into_iter().next())
        .and_then(|o| o.tasks.into_iter().nth(i)))
}

/// Hofstetter's minimum for the age beside a measured amplitude, and whether
/// the measurement lies far below it.
fn age_norm(age_years: f64, amplitude: &AmplitudeUsed) -> (Option<Dioptres>, bool) {
    match amplitude.source {
        AmplitudeSource::Measured { .. } => {
            let norm = AgeModel::HofstetterMinimum.amplitude(age_years).ok();
            let below = norm
                .is_some_and(|n| n.0 - amplitude.stated.0 >= AMPLITUDE_BELOW_NORM_REFER_D - 1e-9);
            (norm, below)
        }
        AmplitudeSource::AgeModel { .. } => (None, false),
    }
}

/// How a task is judged beyond its plan: the rules that depend on what
/// the task is and on the plan settings.
struct Terms {
    /// Reading text on a display (the character-height guidance applies).
    screen: bool,
    /// Part of driving: a head turn to it is a glance, not a held posture.
    driving: bool,
    /// The plan's limit of vertical prism between the eyes.
    prism_limit: PrismDioptres,
}

/// What is wrong with a task seen as `tp`, in numbers. Focus is judged by
/// the focus verdict alone (a comfortable focus lowered by vertical prism
/// is reported as prism, never as a shortfall of 0.00 D), and a shortfall
/// or an excess under half a hundredth of a dioptre is no reason.
fn problems(tp: &TaskPlan, terms: &Terms, arcmin: f64, amplitude: &AmplitudeUsed) -> Vec<Reason> {
    let mut out = Vec::new();
    if tp.focus != Verdict::Comfortable {
        let d = tp.blur.short_of_comfort;
        // The plain difference where the task asks for more than the
        // usable share; otherwise what the planner finds missing once the
        // depth of focus and the rounding allowance are counted.
        let plain = tp.accommodation.0 - amplitude.usable_ocular.0;
        if d.0 <= -SHOWN_D {
            out.push(Reason::TooMuchPlus { excess: -d });
        } else if plain >= SHOWN_D || d.0 >= SHOWN_D {
            out.push(Reason::ShortOfFocus {
                needs: tp.accommodation,
                has: amplitude.usable_ocular,
                short_by: Dioptres(if plain > 0.0 { plain } else { d.0 }),
            });
        }
    }
    if tp.prism_over_limit {
        out.push(Reason::VerticalPrism {
            imbalance: tp.near_vision.vertical_imbalance,
            limit: terms.prism_limit,
        });
    }
    // The planner keeps a driving task's head upright; a turn towards a
    // door mirror is a glance, part of driving, which no glasses change.
    let strain = if terms.driving {
        tp.posture.strain
    } else {
        tp.posture.strain.max(tp.field.turn_strain)
    };
    if strain != Strain::Comfortable || !tp.posture.reachable {
        out.push(Reason::Posture {
            chin_up: tp.posture.chin_up,
            turn: if terms.driving {
                Degrees(0.0)
            } else {
                tp.field.held_turn
            },
            sweep: if terms.driving {
                Degrees(0.0)
            } else {
                Degrees(tp.field.head_turn.0 - tp.field.held_turn.0)
            },
            strain: if tp.posture.reachable {
                strain
            } else {
                Strain::NotSustainable
            },
        });
    }
    if terms.screen && arcmin < CHARACTER_HEIGHT_MIN_ARCMIN {
        out.push(Reason::SmallText {
            arcmin,
            minimum: CHARACTER_HEIGHT_MIN_ARCMIN,
        });
    }
    out
}

/// The smallest difference in dioptres the sheet shows as a reason: its
/// figures are printed to a hundredth, and "short by 0.00 D" is no reason.
const SHOWN_D: f64 = 0.005;

/// A driving task's figures against the driving vision standard, as the
/// planner found them (`None` for a task that is not driving).
fn driving_reason(tp: &TaskPlan) -> Option<Reason> {
    let dv = tp.driving_vision?;
    Some(Reason::DrivingVision {
        defocus: tp.blur.defocus,
        nearer_than_range: tp.blur.direction == DefocusDirection::NeedsMorePlus,
        acuity: dv.acuity_decimal,
        standard: dv.standard_decimal,
        meets: dv.meets_standard,
    })
}

/// The workstation changes that would clear task `i` seen as `tp`: a new
/// distance inside the comfortable range at its lens point, a new height
/// that undoes the head tilt, and a character height at the preferred size
/// for the (new) distance. Only a display screen is a workstation part that
/// can be moved, raised or given larger text (Directive 90/270/EEC, Annex,
/// point 1(b), from memory: characters of adequate size, a screen that
/// swivels and tilts, on a separate base or an adjustable table); a paper, a
/// bench, a dashboard or a mirror gets none of these, and a driving task
/// none at all, so other tasks go on to the eyewear question.
fn changes_for(s: &Scenario, i: usize, tp: &TaskPlan) -> Vec<Change> {
    let Some(t) = s.tasks.get(i) else {
        return Vec::new();
    };
    if !t.flags.screen || t.flags.driving {
        return Vec::new();
    }
    let mut out = Vec::new();
    let mut distance = t.distance_m;
    // A move only where the distance is what falls short: a task in
    // comfortable focus that is tiring for its posture or prism stays put.
    if tp.focus != Verdict::Comfortable {
        if let ZoneRange::Clear { near, far } = tp.range_here.comfortable {
            let far_m = match far {
                FarLimit::Finite(m) => m.0,
                FarLimit::Infinite => f64::INFINITY,
            };
            // One centimetre inside the range, in whole centimetres, so the
            // change survives a wearer sitting a little differently.
            let to = if t.distance_m < near.0 {
                ((near.0 + 0.01) * 100.0).ceil() / 100.0
            } else {
                ((far_m - 0.01) * 100.0).floor() / 100.0
            };
            let allowed = to >= NEAREST_WORKING_DISTANCE_M
                && (to - t.distance_m).abs() <= MAX_DISTANCE_CHANGE_M
                && to >= near.0
                && to <= far_m;
            if allowed {
                distance = to;
                out.push(Change::MoveTo {
                    distance: Metres(to),
                });
            }
        }
    }
    if tp.posture.chin_up.0.abs() > 0.5 && tp.posture.strain != Strain::Comfortable {
        let now = gaze_of(t.vertical, t.distance_m);
        let to = (now - tp.posture.chin_up.0).round();
        let height = |deg: f64, d: f64| d * deg.to_radians().sin();
        out.push(Change::GazeTo {
            gaze: Degrees(to),
            height_change: Metres(height(to, distance) - height(now, t.distance_m)),
        });
    }
    if subtended_arcmin(t.detail_mm, distance) < CHARACTER_HEIGHT_MIN_ARCMIN {
        let to_mm =
            (size_for_arcmin(CHARACTER_HEIGHT_PREFERRED_ARCMIN, distance) * 10.0).ceil() / 10.0;
        out.push(Change::EnlargeText {
            to_mm,
            percent: (to_mm / t.detail_mm - 1.0) * 100.0,
        });
    }
    out
}

/// The gaze angle of a task position, in degrees (negative is down).
fn gaze_of(v: VerticalPosition, distance_m: f64) -> f64 {
    match v {
        VerticalPosition::GazeAngle { degrees } => degrees,
        VerticalPosition::HeightFromEyes { metres } => {
            (metres / distance_m).clamp(-1.0, 1.0).asin().to_degrees()
        }
    }
}

/// `s` with `changes` made to task `i`.
fn with_changes(s: &Scenario, i: usize, changes: &[Change]) -> Scenario {
    let mut c = s.clone();
    if let Some(t) = c.tasks.get_mut(i) {
        for change in changes {
            match *change {
                Change::MoveTo { distance } => t.distance_m = distance.0,
                Change::GazeTo { gaze, .. } => {
                    t.vertical = VerticalPosition::GazeAngle { degrees: gaze.0 }
                }
                Change::EnlargeText { to_mm, .. } => t.detail_mm = to_mm,
            }
        }
    }
    c
}

/// The flag of a task no workstation change clears: a single-vision task
/// lens with the addition it needs, if one in the range made serves it
/// (checked by planning it), otherwise a referral. A lens serves when it
/// clears every reason but the text size (focus, vertical prism, head
/// posture): a lens that leaves the task as tiring as before suggests
/// nothing that helps. A lens equal to the glasses worn (`glasses`: label
/// and design) is never suggested.
fn eyewear_flag(
    s: &Scenario,
    glasses: (&str, FamilyChoice),
    i: usize,
    tp: &TaskPlan,
    judged: (&Terms, &AmplitudeUsed, f64),
    reasons: Vec<Reason>,
) -> Result<Flag, PlanError> {
    let (label, worn) = glasses;
    let (terms, amplitude, arcmin) = judged;
    let needed = tp.local_power.addition.0 + tp.blur.short_of_comfort.0;
    let grid = SINGLE_VISION_ADDITION_GRID;
    // Up to the next step; `short_of_comfort` already allows the planner's
    // rounding tolerance.
    let first = (needed / grid.step - 1e-9).ceil().max(0.0) * grid.step;
    // The step found and the next: the shortfall is measured at the task's
    // lens point through the current glasses, and a task lens seen at
    // another point may need one step more.
    for addition in [first, first + grid.step] {
        if addition > grid.last {
            break;
        }
        let family = FamilyChoice::SingleVision {
            addition_d: Some(addition),
        };
        if same_lens(family, worn) {
            continue;
        }
        // Text size is for the screen, not the lens; every other reason
        // must be gone.
        let serves = task_through(s, label, family, i)?.is_some_and(|after| {
            problems(&after, terms, arcmin, amplitude)
                .iter()
                .all(|r| matches!(r, Reason::SmallText { .. }))
        });
        if serves {
            return Ok(Flag::TaskEyewear {
                reasons,
                addition: Dioptres(addition),
            });
        }
    }
    let mut reasons = reasons;
    reasons.push(Reason::NoEyewearServes);
    Ok(Flag::Refer { reasons })
}

/// Whether `a` and `b` are the same single-vision lens (additions within a
/// hundredth of a dioptre): a suggestion equal to the glasses worn helps nothing.
fn same_lens(a: FamilyChoice, b: FamilyChoice) -> bool {
    match (a, b) {
        (
            FamilyChoice::SingleVision {
                addition_d: Some(x),
            },
            FamilyChoice::SingleVision {
                addition_d: Some(y),
            },
        ) => (x - y).abs() < 0.01,
        _ => false,
    }
}
