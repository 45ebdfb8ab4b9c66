//! The planner's answer, as plain serialisable values: for every lens option
//! (ranked best first) the parameters it resolved, why, a score, the ranges of
//! clear vision of its zones and, per task, the lens point, power, focus
//! verdict, head posture, field and centration; and for the whole plan the
//! amplitude used, unserved tasks, cautions and an order summary.
//!
//! These types are a contract with the screens and the command line: every
//! quantity carries its unit in its type or field name, every outcome that
//! could be a word is an enum, and each enum has a plain-English
//! [`fmt::Display`] (or a `describe` method) that both front ends share.
//! Nothing here is NaN or infinite: an infinite far limit is
//! [`FarLimit::Infinite`], an undefined share is `None`.

mod option;
mod summary;
mod task;
mod wearer;

pub use option::*;
pub use summary::*;
pub use task::*;
pub use wearer::*;

use crate::core::units::{Dioptres, Millimetres};
use serde::Serialize;
use std::fmt;

/// The complete plan for one scenario.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Plan {
    /// The scenario's name, as the user gave it.
    pub scenario_name: String,
    /// The amplitude of accommodation the plan used and where it came from.
    pub amplitude: AmplitudeUsed,
    /// The distance refraction the vergence calculations used.
    pub refraction: RefractionUsed,
    /// The pupil diameter the depth of field used and where it came from.
    pub pupil: PupilUsed,
    /// Half depth of field used for the zone ranges, in dioptres: the
    /// clinical tolerance, or with the detail rule the strictest task's.
    pub zone_half_depth: Dioptres,
    /// Distance from the back of the lens to the eye's centre of rotation
    /// the gaze geometry used, in millimetres (the lens map draws the usable
    /// zone edges with it).
    pub lens_to_cor: Millimetres,
    /// What the plan knows about each task independently of any lens, in input order.
    pub tasks: Vec<TaskContext>,
    /// The lens options, best first.
    pub options: Vec<OptionPlan>,
    /// Tasks that no option makes comfortable, with the reason.
    pub unserved: Vec<UnservedTask>,
    /// Warnings drawn from the scenario, most important first.
    pub cautions: Vec<Caution>,
    /// Which option the order is written for, and how it stands against the
    /// planner's recommendation; `None` when there are no options.
    pub choice: Option<Choice>,
    /// What to order for the chosen option (the best-ranked unless the
    /// dispenser chose another); `None` when there are no options.
    pub order: Option<OrderSummary>,
}

/// The dispenser's choice beside the planner's recommendation.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Choice {
    /// The option the order is written for.
    pub chosen: OptionRef,
    /// The planner's recommendation (the best-ranked option).
    pub recommended: OptionRef,
    /// Whether the dispenser chose it (rather than following the recommendation).
    pub by_dispenser: bool,
    /// How the recommendation scores against the chosen option, when they differ.
    pub difference: Option<ChoiceDifference>,
}

/// How the recommended option scores against a different chosen one.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ChoiceDifference {
    /// Recommended minus chosen score, in hours of the working day.
    pub score_h: f64,
    /// Comfortable hours of the recommended option.
    pub recommended_comfortable_h: f64,
    /// Comfortable hours of the chosen option.
    pub chosen_comfortable_h: f64,
    /// The chosen option is not fit for driving on a day that includes driving.
    pub chosen_unfit_for_driving: bool,
}

impl fmt::Display for Choice {
    /// "Chosen by the dispenser; the planner recommends "X": ..." or nothing to add.
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let Some(d) = self.difference else {
            return if self.by_dispenser {
                f.write_str("chosen by the dispenser, as the planner recommends")
            } else {
                f.write_str("the planner's recommendation")
            };
        };
        write!(
            f,
            "chosen by the dispenser; the planner recommends \"{}\", which scores {:.2} h a \
             day more (comfortable {:.1} h against {:.1} h)",
            self.recommended.label, d.score_h, d.recommended_comfortable_h, d.chosen_comfortable_h
        )?;
        if d.chosen_unfit_for_driving {
            write!(f, "; \"{}\" is not fit for driving", self.chosen.label)?;
        }
        Ok(())
    }
}

/// A reference to one task: its input index and its name, so a message can
/// name it without looking it up.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct TaskRef {
    /// Position of the task in the scenario's task list (0-based).
    pub index: usize,
    /// The task's name.
    pub name: String,
}

/// A reference to one lens option: its input index and label.
#[derive(Debug, Clone, PartialEq, Eq, Serialize)]
pub struct OptionRef {
    /// Position of the option in the scenario's option list (0-based).
    pub index: usize,
    /// The option's label.
    pub label: String,
}
