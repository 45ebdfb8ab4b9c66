//! The wearer walkthrough in plain words: for each task of the day, where to
//! look through the chosen lenses, whether it will be sharp, a little soft
//! or blurred, how long it can be kept up, and what the head and eyes will
//! do; then a closing step with the choice, why, what to expect while getting
//! used to it, and the cautions. Everything is generated from the plan's
//! outcome types, never written per scenario.
//!
//! The wearer's glasses now are not in the scenario; the comparison uses
//! lenses for distance only (the distance prescription, no reading part),
//! planned by [`current_glasses_plan`] on a copy of the scenario with that
//! one option, and the closing step says so. Trade words are avoided; the
//! few that a wearer will hear from the dispenser are listed in
//! [`EXPLAINED_TERMS`] and always appear with their explaining phrase.

use super::{
    plan, CautionKind, DefocusDirection, OptionPlan, OptionRef, Plan, RefractionBasis, Strain,
    TaskPlan, Verdict, ZoneKind,
};
use crate::core::units::{Dioptres, Metres, Millimetres};
use crate::scenario::{validate, FamilyChoice, LensOption, ValidScenario};

/// The trade words the walkthrough may use, each with the phrase that always
/// follows it in the same sentence.
pub const EXPLAINED_TERMS: [(&str, &str); 5] = [
    (
        "progressive",
        "the focus changes gradually from far at the top to near at the bottom",
    ),
    ("bifocal", "two parts, far above and near below"),
    ("trifocal", "three parts, for far, arm's length and near"),
    (
        "desk lenses",
        "arm's length at the top changing gradually to near at the bottom",
    ),
    ("single vision", "the same focus all over the lens"),
];

/// Defocus beyond the task's allowance up to which a blurred task is called
/// "a little soft" rather than blurred, in dioptres (the lenient clinical
/// tolerance; common practice).
const A_LITTLE_SOFT_D: f64 = 0.5;
/// Head tilt or turn below which the walkthrough says nothing of it, in degrees.
const NOTICEABLE_DEG: f64 = 1.0;

/// How a task will look, in the four grades the wearer is told.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Sharpness {
    /// In focus within the comfortable share of the eyes' focusing.
    Sharp,
    /// In focus, but only by focusing harder than can be kept up.
    SharpWithEffort,
    /// Just beyond focus: no more than [`A_LITTLE_SOFT_D`] past the allowance.
    ALittleSoft,
    /// Clearly out of focus.
    Blurred,
}

impl Sharpness {
    /// The grade of a task through one lens point.
    pub fn of(task: &TaskPlan) -> Sharpness {
        match task.verdict {
            Verdict::Comfortable => Sharpness::Sharp,
            Verdict::InFocusButTiring => Sharpness::SharpWithEffort,
            Verdict::Blurred if task.blur.beyond_tolerance.0 <= A_LITTLE_SOFT_D => {
                Sharpness::ALittleSoft
            }
            Verdict::Blurred => Sharpness::Blurred,
        }
    }

    /// A few words for a picture's caption ("sharp", "a little soft").
    pub fn words(self) -> &'static str {
        match self {
            Sharpness::Sharp => "sharp",
            Sharpness::SharpWithEffort => "sharp, with effort",
            Sharpness::ALittleSoft => "a little soft",
            Sharpness::Blurred => "blurred",
        }
    }
}

/// One picture of a task: which lenses, and the defocus to blur it by.
#[derive(Debug, Clone, PartialEq)]
pub struct Picture {
    /// Whose lenses: "Your glasses now" or the option's label.
    pub label: String,
    /// The option's input index; `None` for the glasses now.
    pub option: Option<usize>,
    /// Whether these are the lenses the walkthrough is about.
    pub chosen: bool,
    /// The defocus the eye cannot remove there, in dioptres (0 when in focus).
    pub defocus: Dioptres,
    /// How it will look.
    pub sharpness: Sharpness,
    /// Approximate lines of the letter chart lost to the blur (Smith 1991,
    /// as the planner computes it): 0.1 logMAR is one line.
    pub chart_lines_lost: f64,
}

/// One step of the walkthrough: a task of the day.
#[derive(Debug, Clone, PartialEq)]
pub struct TaskStep {
    /// Position of the task in the scenario (0-based).
    pub task_index: usize,
    /// The task's name, as the dispenser entered it.
    pub name: String,
    /// How far away it is, from the lenses.
    pub distance: Metres,
    /// Hours a day it takes.
    pub hours_per_day: f64,
    /// The sentences for the chosen lenses, in order: where to look, how it
    /// will look and for how long, what the head and eyes do, and how it
    /// compares with the glasses now.
    pub sentences: Vec<String>,
    /// The pictures: the glasses now first (when planned), then every
    /// option, best ranked first.
    pub pictures: Vec<Picture>,
}

/// The closing step.
#[derive(Debug, Clone, PartialEq)]
pub struct Closing {
    /// The chosen lenses' label.
    pub option: OptionRef,
    /// What the lenses are, in plain words.
    pub what: String,
    /// Why they suit the day.
    pub why: Vec<String>,
    /// What to expect while getting used to them.
    pub adapting: Vec<String>,
    /// The cautions that concern these lenses, in plain words.
    pub cautions: Vec<String>,
}

/// The whole walkthrough for one chosen option.
#[derive(Debug, Clone, PartialEq)]
pub struct Walkthrough {
    /// The scenario's name.
    pub scenario_name: String,
    /// The pupil diameter the blur is computed for, in millimetres.
    pub pupil: Millimetres,
    /// One step per task, in the order of the day as entered.
    pub steps: Vec<TaskStep>,
    /// The closing step.
    pub closing: Closing,
}

/// The label of the comparison lenses.
fn now_label(plan: &Plan) -> &'static str {
    match plan.refraction.basis {
        RefractionBasis::OverContactLenses => "Your contact lenses alone",
        RefractionBasis::MeanOfBothEyes => "Your glasses now",
    }
}

/// The label of the stand-in for the wearer's glasses when the scenario
/// does not say what they wear today.
const DISTANCE_ONLY: &str = "Distance only";

/// Plans a copy of `scenario` whose only option is the wearer's glasses now:
/// the current glasses when the scenario has them, else lenses for distance
/// (single vision, no addition) as a stand-in. `None` when that copy cannot
/// be planned.
pub fn current_glasses_plan(scenario: &ValidScenario) -> Option<Plan> {
    let mut copy = scenario.get().clone();
    let now = match &copy.current_glasses {
        Some(g) => LensOption {
            label: g.label.clone(),
            family: g.as_worn(),
        },
        None => LensOption {
            label: DISTANCE_ONLY.into(),
            family: FamilyChoice::SingleVision {
                addition_d: Some(0.0),
            },
        },
    };
    copy.options = vec![now];
    copy.chosen_option = None;
    plan(&validate(copy).ok()?).ok()
}

/// What the comparison lenses are, in a phrase: the stand-in for distance
/// only, or the glasses the wearer has today as entered.
fn now_words(now: &OptionPlan) -> String {
    if now.option.label == DISTANCE_ONLY {
        "lenses for distance only".to_string()
    } else {
        format!("your own glasses, \"{}\"", now.option.label)
    }
}

/// The walkthrough of `plan` for the option with input index `chosen` (the
/// best ranked when it is `None` or no option has that index), compared with
/// `current` (from [`current_glasses_plan`]). `None` when the plan has no options.
pub fn walkthrough(
    plan: &Plan,
    current: Option<&Plan>,
    chosen: Option<usize>,
) -> Option<Walkthrough> {
    let option = plan
        .options
        .iter()
        .find(|o| Some(o.option.index) == chosen)
        .or_else(|| plan.options.first())?;
    let now = current.and_then(|c| c.options.first());
    let steps = plan
        .tasks
        .iter()
        .filter_map(|ctx| {
            let i = ctx.task.index;
            let here = option.tasks.iter().find(|t| t.task.index == i)?;
            let before = now.and_then(|o| o.tasks.iter().find(|t| t.task.index == i));
            let mut sentences = vec![where_to_look(here), how_it_looks(here, ctx.hours_per_day)];
            sentences.extend(head_and_eyes(here, ctx.gaze_elevation.0));
            if let (Some(n), Some(b)) = (now, before) {
                sentences.push(format!(
                    "{} ({}): {}.",
                    now_label(plan),
                    now_words(n),
                    Sharpness::of(b).words()
                ));
            }
            let pictures = now
                .zip(before)
                .map(|(_, b)| picture(now_label(plan), None, false, b))
                .into_iter()
                .chain(plan.options.iter().filter_map(|o| {
                    let t = o.tasks.iter().find(|t| t.task.index == i)?;
                    Some(picture(
                        &o.option.label,
                        Some(o.option.index),
                        o.option.index == option.option.index,
                        t,
                    ))
                }))
                .collect();
            Some(TaskStep {
                task_index: i,
                name: ctx.task.name.clone(),
                distance: ctx.distance,
                hours_per_day: ctx.hours_per_day,
                sentences,
                pictures,
            })
        })
        .collect();
    Some(Walkthrough {
        scenario_name: plan.scenario_name.clone(),
        pupil: plan.pupil.diameter,
        steps,
        closing: closing(plan, option, now),
    })
}

fn picture(label: &str, option: Option<usize>, chosen: bool, task: &TaskPlan) -> Picture {
    Picture {
        label: label.to_string(),
        option,
        chosen,
        defocus: task.blur.defocus,
        sharpness: Sharpness::of(task),
        chart_lines_lost: task.blur.acuity_loss_logmar * 10.0,
    }
}

/// Where in the lens the task is seen.
pub fn where_to_look(task: &TaskPlan) -> String {
    let y = task.lens_point.y.0;
    match task.zone {
        ZoneKind::SingleVision => {
            "These lenses focus the same all over: look through whatever part is natural.".into()
        }
        ZoneKind::Distance => "Look through the upper part of the lens, the part for far away.".into(),
        ZoneKind::Intermediate => {
            "Look through the middle band of the lens, the part for arm's length.".into()
        }
        ZoneKind::Near => "Look through the lower part of the lens, the part for close work.".into(),
        ZoneKind::UpperSegment => {
            "Look up through the small part at the top of the lens, made for close work above your head."
                .into()
        }
        ZoneKind::Progression => {
            let part = if y > -3.0 {
                "high up in"
            } else if y > -10.0 {
                "part way down"
            } else {
                "low down in"
            };
            format!(
                "Look {part} the clear channel down the middle of the lens, where the focus changes gradually from far to near."
            )
        }
    }
}

/// Hours in words: "none", "half an hour", "an hour", "2.5 hours".
fn hours_words(hours: f64) -> String {
    if hours < 2.5 / 60.0 {
        "none".into()
    } else if hours < 0.75 {
        let minutes = (hours * 60.0 / 5.0).round() * 5.0;
        if (minutes - 30.0).abs() < 0.5 {
            "half an hour".into()
        } else {
            format!("{minutes:.0} minutes")
        }
    } else {
        let rounded = (hours * 2.0).round() / 2.0;
        if rounded == 1.0 {
            "an hour".into()
        } else if rounded.fract() == 0.0 {
            format!("{rounded:.0} hours")
        } else {
            format!("{rounded:.1} hours")
        }
    }
}

/// Whether it will be sharp, and for how long that can be kept up.
pub fn how_it_looks(task: &TaskPlan, hours_per_day: f64) -> String {
    let hours = hours_words(hours_per_day);
    let why = match task.blur.direction {
        DefocusDirection::NeedsMorePlus => ": it is too close for that part of the lens",
        DefocusDirection::NeedsLessPlus => ": it is too far away for that part of the lens",
        DefocusDirection::None => "",
    };
    match Sharpness::of(task) {
        Sharpness::Sharp if task.focus == task.verdict => {
            format!("It will be sharp, and easy to keep up for {hours} a day.")
        }
        // Focus alone is comfortable; the two lenses' difference tires the
        // eyes, or the head position it needs (said in the next sentence)
        // tires the neck.
        Sharpness::SharpWithEffort
            if task.focus == Verdict::Comfortable && task.prism_over_limit =>
        {
            format!(
                "It will be sharp, but the two lenses differ here enough to tire the eyes over {hours} a day."
            )
        }
        Sharpness::SharpWithEffort if task.focus == Verdict::Comfortable => format!(
            "It will be sharp, but only with your head held as below, which tires the neck over {hours} a day."
        ),
        Sharpness::Sharp | Sharpness::SharpWithEffort => format!(
            "It will be sharp, but only by focusing harder than is comfortable for long: expect tired eyes over {hours} a day."
        ),
        Sharpness::ALittleSoft => format!(
            "It will look a little soft, not quite sharp{why}; fine for a glance, tiring for {hours} a day."
        ),
        Sharpness::Blurred => format!("It will look blurred{why}."),
    }
}

/// What holding the head in `strain` is like, as the end of a sentence.
fn strain_words(strain: Strain) -> &'static str {
    match strain {
        Strain::Comfortable => "easy to keep up",
        Strain::Tiring => "your neck will tire over a day",
        Strain::NotSustainable => {
            "too much to hold for long; ask about another choice for this task"
        }
    }
}

/// What the head and eyes will do: a sentence on the tilt of the head (or
/// the eyes alone), and one on turning the head when there is a turn.
pub fn head_and_eyes(task: &TaskPlan, gaze_elevation_deg: f64) -> Vec<String> {
    let posture = task.posture;
    let chin = posture.chin_up.0;
    let mut out = Vec::new();
    if !posture.reachable {
        out.push(
            "No comfortable position of the head brings it into the right part of the lens.".into(),
        );
    } else if chin.abs() < NOTICEABLE_DEG {
        let eyes = if gaze_elevation_deg < -20.0 {
            "; lower your eyes to it"
        } else if gaze_elevation_deg < -5.0 {
            "; lower your eyes a little"
        } else if gaze_elevation_deg > 5.0 {
            "; raise your eyes a little"
        } else {
            ""
        };
        out.push(format!("Your head can stay as it naturally is{eyes}."));
    } else {
        let (verb, degrees) = if chin > 0.0 {
            ("Lift", chin)
        } else {
            ("Drop", -chin)
        };
        out.push(format!(
            "{verb} your chin about {degrees:.0}° to see it through the right part: {}.",
            strain_words(posture.strain)
        ));
    }
    let field = task.field;
    if field.held_turn.0 >= NOTICEABLE_DEG {
        out.push(format!(
            "Turn your head about {:.0}° towards it and keep it there: {}.",
            field.held_turn.0,
            strain_words(field.turn_strain)
        ));
    } else if field.head_turn.0 >= NOTICEABLE_DEG {
        out.push(format!(
            "Turn your head, not just your eyes, to see it from one side to the other: {}.",
            strain_words(field.turn_strain)
        ));
    }
    out
}

/// What the design is, in plain words with its trade name explained.
pub fn what_the_lenses_are(design: &FamilyChoice) -> String {
    let term = |t: &str| {
        let phrase = EXPLAINED_TERMS
            .iter()
            .find(|(k, _)| *k == t)
            .map_or("", |(_, p)| p);
        let named = if t.ends_with("lenses") {
            t.to_string()
        } else {
            format!("{t} lenses")
        };
        format!("{named}: {phrase}")
    };
    match design {
        FamilyChoice::SingleVision { addition_d } if addition_d.unwrap_or(0.0).abs() < 0.005 => {
            format!("Lenses for far away ({})", term("single vision"))
        }
        FamilyChoice::SingleVision { .. } => format!(
            "Lenses for one working distance ({})",
            term("single vision")
        ),
        FamilyChoice::Bifocal { .. } => format!("Lenses with a line ({})", term("bifocal")),
        FamilyChoice::Trifocal { .. } => format!("Lenses with two lines ({})", term("trifocal")),
        FamilyChoice::Progressive { .. } => format!("Lenses with no lines ({})", term("progressive")),
        FamilyChoice::Degressive { .. } => format!("Lenses for the desk ({})", term("desk lenses")),
        FamilyChoice::DoubleSegment { .. } => {
            "Lenses with a part for close work at the bottom and another at the top, for work above your head"
                .into()
        }
    }
}

/// What to expect while getting used to a design.
fn adapting(design: &FamilyChoice) -> Vec<String> {
    let stairs = "Take stairs and kerbs carefully at first, looking over the part for close work.";
    match design {
        FamilyChoice::SingleVision { addition_d } if addition_d.unwrap_or(0.0).abs() < 0.005 => {
            vec!["Nothing new to get used to: close work depends on your own focusing, which gets harder over the years.".into()]
        }
        FamilyChoice::SingleVision { .. } => vec![
            "Things further away than your work will be blurred: take them off to walk about.".into(),
            "Never drive in them.".into(),
        ],
        FamilyChoice::Bifocal { .. } | FamilyChoice::Trifocal { .. } => vec![
            "You will see the edge between the parts; most people stop noticing it within a few days.".into(),
            stairs.into(),
        ],
        FamilyChoice::Progressive { .. } => vec![
            "Allow a week or two to get used to them.".into(),
            "The clear channel for arm's length is narrow: point your nose at what you look at rather than moving your eyes.".into(),
            "The sides of the lens are soft, and straight lines may seem to sway at first.".into(),
            stairs.into(),
        ],
        FamilyChoice::Degressive { .. } => vec![
            "They are for the desk: across the room will be soft.".into(),
            "Never drive in them.".into(),
        ],
        FamilyChoice::DoubleSegment { .. } => vec![
            "You will see the edges of both parts; most people stop noticing them within a few days.".into(),
            stairs.into(),
            "Never drive in them: the top part blurs signs and mirrors.".into(),
        ],
    }
}

/// A caution in plain words.
fn caution_words(kind: CautionKind) -> String {
    match kind {
        CautionKind::PlanningAid => "This is a plan to talk over, not a prescription: your eye-care practitioner confirms the lenses.".into(),
        CautionKind::OverContactLenses => "These glasses are worn over your contact lenses.".into(),
        CautionKind::NotForDriving => {
            "Do not drive in these lenses: they blur the road or the mirrors.".into()
        }
        CautionKind::MovingMachinery => "Near moving machinery, take extra care while you get used to new glasses.".into(),
        CautionKind::SafetyEyewear => "Some of your work needs protective glasses made to a safety standard: ask about safety lenses.".into(),
        CautionKind::Anisometropia => "Your two eyes need quite different lenses, which can make things look a different size to each eye; your practitioner will check this.".into(),
        CautionKind::VerticalImbalance => "Your two lenses differ enough that looking low in them can tire the eyes; your practitioner will check this.".into(),
        CautionKind::HighPower => "Your lenses are strong, so how the frame sits matters: have it fitted with care.".into(),
        CautionKind::ModelRange => "Some of your measurements are outside what the planner's calculations cover; your practitioner will check the result.".into(),
        CautionKind::ApparentAmplitude => "The measurement of your focusing may overstate it; your practitioner will check it.".into(),
        CautionKind::Posture => "One task asks you to hold your head in a way that cannot be kept up for long: ask about another pair for it.".into(),
    }
}

/// The closing step for `option`, compared with the glasses now.
fn closing(plan: &Plan, option: &OptionPlan, now: Option<&OptionPlan>) -> Closing {
    let total: f64 = plan.tasks.iter().map(|t| t.hours_per_day).sum();
    let s = option.score;
    let mut why = vec![format!(
        "Of the {} of tasks in your day, {} will be sharp and comfortable with these, and {} sharp but tiring.",
        hours_words(total),
        hours_words(s.comfortable_hours),
        hours_words(s.tiring_hours)
    )];
    if let Some(n) = now {
        why.push(format!(
            "{} would make {} comfortable.",
            now_label(plan),
            hours_words(n.score.comfortable_hours)
        ));
    }
    why.push(if option.rank == 1 {
        format!(
            "Of the {} choices compared, these serve your day best.",
            plan.options.len()
        )
    } else {
        format!(
            "Of the {} choices compared, these come {} for your day.",
            plan.options.len(),
            ordinal(option.rank)
        )
    });
    match now {
        Some(n) if n.option.label == DISTANCE_ONLY => why.push(format!(
            "\"{}\" in the pictures means lenses for distance only, made to your distance prescription with no part for close work: the planner does not know the glasses you have.",
            now_label(plan)
        )),
        Some(n) => why.push(format!(
            "\"{}\" in the pictures are the glasses you wear today, as entered: \"{}\".",
            now_label(plan),
            n.option.label
        )),
        None => {}
    }
    let concerns = |c: &&super::Caution| {
        c.options.is_empty() || c.options.iter().any(|o| o.index == option.option.index)
    };
    let mut cautions: Vec<String> = Vec::new();
    for words in plan
        .cautions
        .iter()
        .filter(concerns)
        .map(|c| caution_words(c.kind))
    {
        if !cautions.contains(&words) {
            cautions.push(words);
        }
    }
    Closing {
        option: option.option.clone(),
        what: what_the_lenses_are(&option.design),
        why,
        adapting: adapting(&option.design),
        cautions,
    }
}

fn ordinal(rank: usize) -> String {
    match rank {
        2 => "second".into(),
        3 => "third".into(),
        4 => "fourth".into(),
        5 => "fifth".into(),
        n => format!("number {n}"),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn hours_read_as_people_say_them() {
        let check = |h: f64, words: &str| assert_eq!(hours_words(h), words, "{h} h");
        check(0.0, "none");
        check(0.5, "half an hour");
        check(0.25, "15 minutes");
        check(1.0, "an hour");
        check(2.0, "2 hours");
        check(1.2, "an hour");
        check(2.4, "2.5 hours");
        check(7.5, "7.5 hours");
    }

    #[test]
    fn every_design_names_its_trade_term_with_the_phrase() {
        // Single vision as a distance-only and as a reading lens, then every
        // family with an addition (bifocal to degressive).
        let single = [0.0, 1.5].map(|a| FamilyChoice::SingleVision {
            addition_d: Some(a),
        });
        let designs = single
            .into_iter()
            .chain(FamilyChoice::ALL_OPEN[1..5].iter().copied());
        for d in designs {
            let words = what_the_lenses_are(&d);
            let explained = EXPLAINED_TERMS
                .iter()
                .any(|(term, phrase)| words.contains(term) && words.contains(phrase));
            assert!(explained, "{words}");
            assert!(!adapting(&d).is_empty());
        }
    }
}
