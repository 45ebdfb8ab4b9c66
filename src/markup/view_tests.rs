//! The workplace-vision and walkthrough parts written for every demo: well
//! formed (every element closed in order), one row per task and per worker
//! listed, one item per sentence, and text typed by the user (scenario,
//! task and option names, worker ids) never read as markup.

use super::demand_sheet::{demand_sheet, sheet_intro, sheet_problem};
use super::team_table::{team_intro, team_problem, team_summary, team_table, SHOWN_WORKERS};
use super::tests::{demo_plans, typed_demo, well_formed, TYPED};
use super::walkthrough_step::{closing_step, no_plan, picture_caption, task_words};
use crate::display::LengthUnit;
use crate::plan::demands;
use crate::plan::roster::{read_roster, screen_team, TeamResult};
use crate::plan::walkthrough::{current_glasses_plan, walkthrough};
use crate::plan::Plan;
use crate::scenario::{validate, Scenario};

/// A roster of the first `n` workers of a small fictional team (ids
/// `W-1`, `W-2`, ..., ages from 25 to 64 in turn), as CSV.
fn roster(n: usize) -> String {
    let mut text = String::from("id,age_years,amplitude_d,correction_d,addition_d\n");
    for i in 1..=n {
        text.push_str(&format!("W-{i},{},,,\n", 25 + i % 40));
    }
    text
}

/// `roster_text` screened against the tasks of `station`.
fn team(station: &Scenario, roster_text: &str) -> TeamResult {
    screen_team(station, read_roster(roster_text).expect("roster reads"))
}

/// The task-demand sheet of `scenario`, written with distances in inches.
fn sheet_text(scenario: &Scenario) -> (usize, String) {
    let valid = validate(scenario.clone()).expect("demo is valid");
    let sheet = demands::demand_sheet(&valid).expect("demo has a sheet");
    (
        sheet.tasks.len(),
        demand_sheet(&sheet, LengthUnit::Inches, "1 April 2031"),
    )
}

/// Every walkthrough part of `plan` for each option in turn: each task
/// step's words and picture captions and the closing step.
fn walkthrough_parts(scenario: &Scenario, plan: &Plan) -> Vec<String> {
    let valid = validate(scenario.clone()).expect("demo is valid");
    let current = current_glasses_plan(&valid);
    let planned = plan.options.first().map(|o| o.option.index);
    let mut parts = Vec::new();
    for option in &plan.options {
        let walk = walkthrough(plan, current.as_ref(), Some(option.option.index))
            .expect("a plan with options walks through");
        for step in &walk.steps {
            parts.push(task_words(step, LengthUnit::Centimetres));
            parts.extend(step.pictures.iter().map(|p| picture_caption(p, planned)));
        }
        parts.push(closing_step(&walk.closing));
    }
    parts
}

#[test]
fn every_demo_sheet_is_well_formed_with_one_row_per_task() {
    for (scenario, _) in demo_plans() {
        let (tasks, text) = sheet_text(&scenario);
        assert!(well_formed(&text), "{}: {text}", scenario.name);
        assert_eq!(text.matches("<tr data-testid=\"wv-task-").count(), tasks);
        assert_eq!(text.matches("<th scope=\"row\">").count(), tasks);
        assert_eq!(text.matches("<th scope=\"col\">").count(), 5);
        assert_eq!(text.matches("class=\"wv-flag ").count(), tasks);
        assert_eq!(text.matches("data-testid=\"wv-rule\"").count(), 1);
    }
    assert!(well_formed(&sheet_intro()));
}

#[test]
fn every_demo_team_is_well_formed_with_one_row_per_worker() {
    for (scenario, _) in demo_plans() {
        let team = team(&scenario, &roster(3));
        let (summary, table) = (team_summary(&team), team_table(&team));
        assert!(well_formed(&summary), "{}: {summary}", scenario.name);
        assert!(well_formed(&table), "{}: {table}", scenario.name);
        assert!(
            summary.contains("3 rows read, 3 used, 0 skipped"),
            "{summary}"
        );
        assert!(!summary.contains("team-skipped"));
        assert_eq!(summary.matches("<li>").count(), 4, "one per kind of flag");
        assert_eq!(table.matches("<tr>").count(), 1 + 3, "head and workers");
        for id in ["W-1", "W-2", "W-3"] {
            assert!(table.contains(&format!("<th scope=\"row\">{id}<span")));
        }
        assert!(!table.contains("class=\"hint\""), "every worker listed");
        let intro = team_intro(scenario.tasks.len());
        assert!(well_formed(&intro), "{intro}");
        let station = format!("screened against the {} tasks", scenario.tasks.len());
        assert!(intro.contains(&station), "{intro}");
    }
}

#[test]
fn skipped_rows_are_listed_and_a_long_team_is_cut_to_the_shown_workers() {
    let (scenario, _) = demo_plans().swap_remove(0);
    let mut text = roster(SHOWN_WORKERS + 1);
    text.push_str("W-bad,forty,,,\n");
    let team = team(&scenario, &text);
    let summary = team_summary(&team);
    assert!(well_formed(&summary), "{summary}");
    assert_eq!(summary.matches("data-testid=\"team-skipped\"").count(), 1);
    let table = team_table(&team);
    assert!(well_formed(&table));
    assert_eq!(table.matches("<tr>").count(), 1 + SHOWN_WORKERS);
    assert!(
        table.contains("The first 500 workers are listed; the exported CSV holds all 501."),
        "{}",
        &table[..300]
    );
}

#[test]
fn every_demo_walkthrough_is_well_formed_with_one_item_per_sentence() {
    for (scenario, plan) in demo_plans() {
        for part in walkthrough_parts(&scenario, &plan) {
            assert!(well_formed(&part), "{}: {part}", scenario.name);
        }
        let walk = walkthrough(&plan, None, None).expect("walks through");
        for step in &walk.steps {
            let words = task_words(step, LengthUnit::Inches);
            assert_eq!(words.matches("<li>").count(), step.sentences.len());
            assert!(words.starts_with("<p class=\"walk-facts\">"), "{words}");
        }
        let c = &walk.closing;
        let closing = closing_step(c);
        let items = c.why.len() + c.adapting.len() + c.cautions.len();
        assert_eq!(closing.matches("<li>").count(), items);
        assert_eq!(closing.matches("data-testid=\"walk-cautions\"").count(), 1);
    }
    assert!(well_formed(&no_plan()));
}

#[test]
fn only_the_planned_option_is_named_planned_for_you() {
    let (scenario, plan) = demo_plans().swap_remove(0);
    let planned = plan.options[0].option.index;
    let walk = walkthrough(&plan, None, Some(planned)).expect("walks through");
    let captions: Vec<String> = walk.steps[0]
        .pictures
        .iter()
        .map(|p| picture_caption(p, Some(planned)))
        .collect();
    let marked = captions
        .iter()
        .filter(|c| c.contains(" (planned for you)"))
        .count();
    assert_eq!(marked, 1, "{}: {captions:?}", scenario.name);
    assert!(captions
        .iter()
        .all(|c| c.starts_with("<strong>") && c.contains("<span class=\"walk-sharpness ")));
}

#[test]
fn text_typed_by_the_user_is_never_read_as_markup_in_the_views() {
    let (scenario, planned) = typed_demo();
    let id = "\"<img src=x onerror=\"\"alert(1)\"\"> & co\"";
    let team = team(
        &scenario,
        &format!("id,age_years\n{id},52\n<b>W-2</b>,48\n"),
    );
    let mut parts = walkthrough_parts(&scenario, &planned);
    parts.push(sheet_text(&scenario).1);
    parts.push(team_summary(&team));
    parts.push(team_table(&team));
    parts.push(sheet_problem(TYPED));
    parts.push(team_problem(TYPED));
    for part in &parts {
        assert!(!part.contains("<img") && !part.contains("<b>"), "{part}");
        assert!(well_formed(part), "{part}");
    }
    let all = parts.concat();
    assert!(all.contains("&lt;img src=x onerror=\"alert(1)\"&gt; &amp; co"));
    assert!(all.contains("<th scope=\"row\">&lt;b&gt;W-2&lt;/b&gt;<span"));
}
