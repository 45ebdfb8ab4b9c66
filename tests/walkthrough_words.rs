//! The wearer walkthrough speaks plain words: every verdict, zone and head
//! posture the planner can report maps to a sentence, no trade term appears
//! without its explaining phrase, and every demo's walkthrough has a step
//! per task with a picture per option whose blur matches the planner's own
//! blur-disc figure.

use clearspan::chart::scene::SceneKind;
use clearspan::core::blur_image::BlurDisc;
use clearspan::core::units::{Degrees, Dioptres};
use clearspan::library::{parse_import, DEMO_FILES};
use clearspan::plan::walkthrough::{
    current_glasses_plan, head_and_eyes, how_it_looks, walkthrough, where_to_look, Walkthrough,
    EXPLAINED_TERMS,
};
use clearspan::plan::*;
use clearspan::scenario::{validate, Scenario, ValidScenario};

/// Words of the optical trade a wearer should not meet unexplained, from the
/// outcome panel's own vocabulary and ISO 13666's lens names (from memory).
const TRADE_TERMS: [&str; 28] = [
    "addition",
    "add ",
    "dioptre",
    " d ",
    "corridor",
    "zone",
    "accommodat",
    "prism",
    "logmar",
    "arcmin",
    "vertex",
    "segment",
    "degressive",
    "occupational",
    "bifocal",
    "trifocal",
    "progressive",
    "single vision",
    "desk lenses",
    "intermediate",
    "verdict",
    "posture",
    "astigmatism",
    "presbyop",
    "amplitude",
    "defocus",
    "anisometropia",
    "convergence",
];

/// Every trade term in `text` that is not explained by its phrase in the
/// same sentence.
fn unexplained(text: &str) -> Vec<String> {
    let mut out = Vec::new();
    for sentence in text.split_inclusive(['.', ';']) {
        let lower = sentence.to_lowercase();
        for term in TRADE_TERMS {
            if !lower.contains(term) {
                continue;
            }
            let explained = EXPLAINED_TERMS
                .iter()
                .any(|(t, phrase)| *t == term && lower.contains(phrase));
            if !explained {
                out.push(format!("\"{term}\" in: {sentence}"));
            }
        }
    }
    out
}

fn demo_scenarios() -> Vec<ValidScenario> {
    DEMO_FILES
        .iter()
        .flat_map(|d| parse_import(d.text).expect("demo parses").accepted)
        .map(|item| validate(item.scenario).expect("demo validates"))
        .collect()
}

fn check_plain(text: &str) {
    let found = unexplained(text);
    assert!(found.is_empty(), "unexplained trade terms: {found:#?}");
}

fn all_words(w: &Walkthrough) -> Vec<String> {
    let mut words: Vec<String> = w.steps.iter().flat_map(|s| s.sentences.clone()).collect();
    words.extend(
        w.steps
            .iter()
            .flat_map(|s| s.pictures.iter().map(|p| p.sharpness.words().to_string())),
    );
    let c = &w.closing;
    words.push(c.what.clone());
    words.extend(c.why.iter().chain(&c.adapting).chain(&c.cautions).cloned());
    words
}

#[test]
fn the_check_finds_a_trade_term_and_accepts_an_explained_one() {
    assert_eq!(unexplained("Look through the corridor.").len(), 1);
    assert_eq!(unexplained("An add of +1.00 D here.").len(), 2);
    assert!(unexplained(
        "Lenses with no lines (progressive lenses: the focus changes gradually from far at the top to near at the bottom)."
    )
    .is_empty());
    assert_eq!(unexplained("Progressive lenses are fine.").len(), 1);
}

#[test]
fn every_demo_walks_through_every_task_for_every_option_in_plain_words() {
    for valid in demo_scenarios() {
        let plan = plan(&valid).expect("demo plans");
        let now = current_glasses_plan(&valid).expect("distance-only copy plans");
        assert_eq!(now.options.len(), 1);
        for option in &plan.options {
            let w = walkthrough(&plan, Some(&now), Some(option.option.index)).expect("has options");
            assert_eq!(w.steps.len(), plan.tasks.len(), "{}", plan.scenario_name);
            assert_eq!(w.closing.option, option.option);
            for step in &w.steps {
                assert!(step.sentences.len() >= 3, "{:?}", step.sentences);
                assert_eq!(step.pictures.len(), plan.options.len() + 1);
                assert_eq!(step.pictures.iter().filter(|p| p.chosen).count(), 1);
                assert!(!step.pictures[0].chosen, "the glasses now come first");
            }
            assert!(
                w.closing
                    .cautions
                    .iter()
                    .any(|c| c.contains("not a prescription")),
                "the planning-aid caution is always there"
            );
            for text in all_words(&w) {
                check_plain(&text);
            }
        }
    }
}

// Two routes to the same blur: the planner's blur-disc figure for the task
// and the picture filter's disc from the same defocus and pupil (both
// β = p ΔD, Atchison & Smith, Optics of the Human Eye; from memory).
#[test]
fn each_picture_is_blurred_by_the_planners_own_blur_disc() {
    for valid in demo_scenarios() {
        let plan = plan(&valid).expect("demo plans");
        let now = current_glasses_plan(&valid).expect("distance-only copy plans");
        let w = walkthrough(&plan, Some(&now), None).expect("has options");
        for step in &w.steps {
            for (picture, option) in step.pictures.iter().skip(1).zip(&plan.options) {
                let task = &option.tasks[step.task_index];
                let disc = BlurDisc::from_defocus(picture.defocus, w.pupil, 1.0).expect("in range");
                assert!(
                    (disc.diameter_arcmin - task.blur.blur_disc_arcmin).abs() < 1e-9,
                    "{}: {} against {}",
                    step.name,
                    disc.diameter_arcmin,
                    task.blur.blur_disc_arcmin
                );
            }
        }
    }
}

/// A real task plan from the office demo, to vary field by field.
fn sample_task() -> TaskPlan {
    let valid = demo_scenarios().remove(0);
    plan(&valid).expect("demo plans").options[0].tasks[0].clone()
}

#[test]
fn every_zone_verdict_and_posture_maps_to_a_plain_sentence() {
    let base = sample_task();
    let zones = [
        ZoneKind::SingleVision,
        ZoneKind::Distance,
        ZoneKind::Intermediate,
        ZoneKind::Near,
        ZoneKind::Progression,
        ZoneKind::UpperSegment,
    ];
    let verdicts = [
        Verdict::Comfortable,
        Verdict::InFocusButTiring,
        Verdict::Blurred,
    ];
    let strains = [Strain::Comfortable, Strain::Tiring, Strain::NotSustainable];
    let mut sentences = Vec::new();
    for zone in zones {
        for y in [2.0, -6.0, -14.0] {
            let mut t = base.clone();
            t.zone = zone;
            t.lens_point.y.0 = y;
            sentences.push(where_to_look(&t));
        }
    }
    for verdict in verdicts {
        for focus in verdicts.into_iter().filter(|f| *f >= verdict) {
            for (beyond, direction) in [
                (0.0, DefocusDirection::None),
                (0.3, DefocusDirection::NeedsMorePlus),
                (1.5, DefocusDirection::NeedsLessPlus),
            ] {
                let mut t = base.clone();
                t.verdict = verdict;
                t.focus = focus;
                t.blur.beyond_tolerance = Dioptres(beyond);
                t.blur.direction = direction;
                for prism in [false, true] {
                    t.prism_over_limit = prism;
                    for hours in [0.25, 1.0, 6.0] {
                        sentences.push(how_it_looks(&t, hours));
                    }
                }
            }
        }
    }
    for reachable in [true, false] {
        for chin in [-20.0, -0.2, 12.0] {
            for strain in strains {
                for (held, sweep) in [(0.0, 0.0), (0.0, 15.0), (20.0, 30.0)] {
                    for gaze in [-35.0, -10.0, 0.0, 10.0] {
                        let mut t = base.clone();
                        t.posture.reachable = reachable;
                        t.posture.chin_up = Degrees(chin);
                        t.posture.strain = strain;
                        t.field.held_turn = Degrees(held);
                        t.field.head_turn = Degrees(sweep);
                        t.field.turn_strain = strain;
                        let words = head_and_eyes(&t, gaze);
                        assert!(!words.is_empty());
                        sentences.extend(words);
                    }
                }
            }
        }
    }
    for s in &sentences {
        assert!(s.ends_with('.'), "a whole sentence: {s}");
        assert!(s.chars().next().is_some_and(char::is_uppercase), "{s}");
        check_plain(s);
    }
    // Each grade of sharpness has its own wording.
    let distinct: std::collections::BTreeSet<&String> = sentences.iter().collect();
    assert!(distinct.len() > 20);
}

#[test]
fn a_task_tiring_only_for_its_cause_is_told_that_cause() {
    // Focus alone comfortable, the task tiring: for the prism difference
    // the words speak of the two lenses, for the head position of the neck,
    // never the one for the other.
    let mut t = sample_task();
    t.focus = Verdict::Comfortable;
    t.verdict = Verdict::InFocusButTiring;
    t.prism_over_limit = true;
    let prism = how_it_looks(&t, 2.0);
    assert!(prism.contains("two lenses differ"), "{prism}");
    t.prism_over_limit = false;
    t.posture.chin_up = Degrees(9.0);
    t.posture.strain = Strain::Tiring;
    let posture = how_it_looks(&t, 2.0);
    assert!(posture.contains("neck"), "{posture}");
    assert!(!posture.contains("lenses differ"), "{posture}");
    check_plain(&posture);
}

// Every task of every demo day gets a picture of its kind; the driving
// demos' dashboards are instrument panels, not screens of text. Every
// display screen of the demos carries the screen mark (monitors, a laptop,
// phones, a hand scanner, tablets, an analyser, a meeting-room screen) and
// is drawn as a screen with text; the readouts of a multimeter and a voltage
// tester are instruments at a work surface, not screens of text.
#[test]
fn every_demo_task_gets_a_picture_of_its_kind() {
    use SceneKind::*;
    let expected: [(&str, &[(&str, SceneKind)]); 7] = [
        (
            "contact-lens-screen.json",
            &[
                ("Laptop screen", Screen),
                ("Paper notes", Page),
                ("Colleague across the desk", Wall),
                ("Phone messages", Screen),
            ],
        ),
        (
            "delivery-driver.json",
            &[
                ("Road ahead", Road),
                ("Dashboard and speedometer", Dashboard),
                ("Left door mirror", Road),
                ("Rear-view mirror", Road),
                ("Hand scanner screen", Screen),
                ("Parcel labels", Page),
            ],
        ),
        (
            "electronics-bench.json",
            &[
                ("Soldering a circuit board", Bench),
                ("Schematic on the monitor", Screen),
                ("Multimeter display", Bench),
                ("Component drawers on the wall", Wall),
                ("Magnifier lamp work", Bench),
            ],
        ),
        (
            "laboratory-technician.json",
            &[
                ("Pipetting at the bench", Bench),
                ("Tube labels", Bench),
                ("Analyser screen", Screen),
                ("Work inside the fume hood", Bench),
                ("Protocol sheet on the wall", Wall),
                ("Lab notebook", Page),
            ],
        ),
        (
            "office-two-monitors.json",
            &[
                ("Main monitor", Screen),
                ("Second monitor, to the right", Screen),
                ("Papers on the desk", Page),
                ("Phone", Screen),
                ("Colleague across the desk", Wall),
                ("Meeting-room screen", Screen),
            ],
        ),
        (
            "overhead-electrician.json",
            &[
                ("Ceiling junction box", Bench),
                ("Terminals in a wall panel", Bench),
                ("Floor and ladder footing", Wall),
                ("Voltage tester display", Bench),
                ("Wiring plan on a tablet", Screen),
            ],
        ),
        (
            "van-driver-overhead.json",
            &[
                ("Road ahead", Road),
                ("Rear-view mirror", Road),
                ("Dashboard", Dashboard),
                ("Delivery tablet", Screen),
                ("Labels on the top shelf", Bench),
            ],
        ),
    ];
    assert_eq!(DEMO_FILES.len(), expected.len(), "every demo listed");
    for (file, tasks) in expected {
        let demo = DEMO_FILES
            .iter()
            .find(|d| d.file_name == file)
            .unwrap_or_else(|| panic!("{file} is a demo"));
        let scenario = &parse_import(demo.text).expect("parses").accepted[0].scenario;
        let names: Vec<&str> = scenario.tasks.iter().map(|t| t.name.as_str()).collect();
        let listed: Vec<&str> = tasks.iter().map(|(name, _)| *name).collect();
        assert_eq!(names, listed, "{file}: every task listed, in order");
        for (task, (name, kind)) in scenario.tasks.iter().zip(tasks) {
            assert_eq!(SceneKind::for_task(task), *kind, "{file}: {name}");
        }
    }
}

#[test]
fn the_wearers_own_glasses_are_compared_when_entered() {
    // With the scenario's current glasses entered (fictional: a +1.00 D
    // reading pair), the comparison lenses are those glasses, named as the
    // wearer knows them; without them, lenses for distance only stand in.
    let mut s: Scenario = demo_scenarios()[0].get().clone();
    s.current_glasses = Some(clearspan::scenario::CurrentGlasses {
        label: "old reading glasses".to_string(),
        family: clearspan::scenario::FamilyChoice::SingleVision {
            addition_d: Some(1.0),
        },
    });
    let valid = validate(s).expect("valid");
    let p = plan(&valid).expect("plans");
    let now = current_glasses_plan(&valid).expect("the glasses plan");
    assert_eq!(now.options[0].option.label, "old reading glasses");
    let w = walkthrough(&p, Some(&now), None).expect("options exist");
    let words = all_words(&w).join(" ");
    assert!(words.contains("\"old reading glasses\""), "{words}");
    assert!(!words.contains("lenses for distance only"), "{words}");
}
