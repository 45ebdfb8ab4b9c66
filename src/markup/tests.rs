//! The parts written for every demo's plan: well formed (every element
//! closed in order), one row and one mark per task, the chosen option
//! pressed and the open task's marks expanded, and text typed by the user
//! never read as markup.

use super::comparison::{comparison, ComparisonRows};
use super::lens_points::lens_points;
use super::order_sheet::order_sheet;
use super::range_chart::{range_chart, RangeChartMarks};
use super::summary::{cautions, chosen_note, recommendation, unserved};
use super::task_detail::task_detail;
use crate::chart::lens_map::LensFrame;
use crate::display::LengthUnit;
use crate::library::{parse_import, DEMO_FILES};
use crate::plan::{plan, Plan};
use crate::scenario::{validate, Scenario, Task};

/// Every demo scenario with its plan.
pub(super) fn demo_plans() -> Vec<(Scenario, Plan)> {
    DEMO_FILES
        .iter()
        .flat_map(|file| parse_import(file.text).expect("demo reads").accepted)
        .map(|entry| {
            let scenario = entry.scenario;
            let planned =
                plan(&validate(scenario.clone()).expect("demo is valid")).expect("demo plans");
            (scenario, planned)
        })
        .collect()
}

/// The comparison table's rows, one after the other.
fn table_text(rows: ComparisonRows) -> String {
    [vec![rows.head], rows.tasks, rows.foot].concat().concat()
}

/// The range chart's marks and caption, one after the other.
fn chart_text(marks: RangeChartMarks) -> String {
    [marks.ticks, marks.rows, marks.markers, vec![marks.caption]]
        .concat()
        .concat()
}

/// Every piece written for `plan` (each row and mark apart), the option at
/// input index 0 chosen and the task at input index `open` expanded.
fn every_part(scenario: &Scenario, plan: &Plan, open: Option<usize>) -> Vec<String> {
    let shown = &plan.options[0];
    let frame = LensFrame::new(30.0, 50.0, 420.0);
    let table = comparison(plan, Some(0), open, None);
    let chart = range_chart(plan, shown, LengthUnit::Centimetres, open, None);
    let sheet = order_sheet(plan, &scenario.wearer, LengthUnit::Inches, "1 April 2031");
    let mut parts = vec![
        recommendation(shown),
        cautions(&plan.cautions, Some(&shown.option)),
        chosen_note(plan.choice.as_ref()),
        unserved(&plan.unserved),
        table.head,
        sheet.order,
        chart.caption,
    ];
    parts.extend(table.tasks);
    parts.extend(table.foot);
    parts.extend(chart.ticks);
    parts.extend(chart.rows);
    parts.extend(chart.markers);
    parts.extend(sheet.tasks);
    parts.extend(lens_points(&frame, shown, open));
    parts.extend(
        plan.tasks
            .iter()
            .filter_map(|t| task_detail(plan, t.task.index))
            .map(|(_, table)| table),
    );
    parts
}

/// The tag names of `html` in order, closing tags as `/name`, elements
/// closed in their start tag (`<rect ... />`) left out.
fn tags(html: &str) -> Vec<String> {
    let mut out = Vec::new();
    for piece in html.split('<').skip(1) {
        let tag = piece.split('>').next().unwrap_or("");
        if tag.ends_with('/') {
            continue;
        }
        let name: String = tag
            .chars()
            .take_while(|c| *c == '/' || c.is_ascii_alphanumeric())
            .collect();
        out.push(name);
    }
    out
}

/// Whether every element of `html` is closed, innermost first.
pub(super) fn well_formed(html: &str) -> bool {
    let mut open = Vec::new();
    for tag in tags(html) {
        match tag.strip_prefix('/') {
            Some(name) => {
                if open.pop().as_deref() != Some(name) {
                    return false;
                }
            }
            None => open.push(tag),
        }
    }
    open.is_empty()
}

#[test]
fn every_part_of_every_demo_is_well_formed() {
    for (scenario, plan) in demo_plans() {
        for part in every_part(&scenario, &plan, None) {
            assert!(well_formed(&part), "{}: {part}", scenario.name);
        }
    }
}

#[test]
fn every_task_has_its_row_and_its_marks() {
    for (_, plan) in demo_plans() {
        let shown = &plan.options[0];
        let n = plan.tasks.len();
        let rows = comparison(&plan, None, None, None);
        assert_eq!(rows.tasks.len(), n);
        let table = table_text(rows);
        assert_eq!(table.matches("class=\"task-head-button\"").count(), n);
        assert_eq!(
            table.matches("class=\"option-head\"").count(),
            plan.options.len()
        );
        let chart = chart_text(range_chart(
            &plan,
            shown,
            LengthUnit::Centimetres,
            None,
            None,
        ));
        assert_eq!(chart.matches("class=\"range-row\"").count(), n);
        assert_eq!(chart.matches("class=\"task-marker\"").count(), n);
        let points = lens_points(&LensFrame::new(30.0, 50.0, 420.0), shown, None);
        assert_eq!(points.len(), shown.tasks.len());
        assert!(points
            .iter()
            .all(|p| p.matches("class=\"lens-point\"").count() == 1));
        for t in &plan.tasks {
            for mark in ["row", "marker"] {
                let id = format!("data-mark=\"{mark}-{}\"", t.task.index);
                assert_eq!(
                    table.matches(&id).count() + chart.matches(&id).count(),
                    1,
                    "{id}"
                );
            }
        }
    }
}

#[test]
fn the_chosen_option_is_pressed_and_the_open_task_expanded() {
    let (_, plan) = demo_plans().swap_remove(0);
    let shown = &plan.options[0];
    let none = table_text(comparison(&plan, None, None, None));
    assert_eq!(none.matches("aria-pressed=\"true\"").count(), 0);
    assert_eq!(none.matches("aria-expanded=\"true\"").count(), 0);
    let chosen = shown.option.index;
    let open = plan.tasks[1].task.index;
    let table = table_text(comparison(&plan, Some(chosen), Some(open), None));
    assert_eq!(table.matches("aria-pressed=\"true\"").count(), 1);
    assert!(table.contains(&format!("aria-pressed=\"true\" data-option=\"{chosen}\"")));
    let expanded =
        format!("data-mark=\"row-{open}\" aria-haspopup=\"dialog\" aria-expanded=\"true\"");
    assert_eq!(table.matches("aria-expanded=\"true\"").count(), 1);
    assert!(table.contains(&expanded), "{table}");
    let chart = chart_text(range_chart(
        &plan,
        shown,
        LengthUnit::Centimetres,
        Some(open),
        None,
    ));
    assert!(chart.contains(&format!(
        "aria-expanded=\"true\" data-mark=\"marker-{open}\""
    )));
}

#[test]
fn a_marker_moving_up_a_lane_leaves_the_other_rows_and_the_grid_as_written() {
    // Four copies of a demo task at 40, 67, 100 and 200 cm: their markers
    // are far apart, on one lane. The last one moved to 101 cm sits on the
    // 100 cm marker and takes a second lane; the rows of the other three,
    // the grid and the other markers are written exactly as before.
    let (mut scenario, _) = demo_plans().swap_remove(0);
    let task = scenario.tasks[0].clone();
    scenario.tasks = [0.40, 0.67, 1.00, 2.00]
        .map(|distance_m| Task {
            distance_m,
            ..task.clone()
        })
        .to_vec();
    let chart = |scenario: &Scenario| {
        let plan = plan(&validate(scenario.clone()).expect("valid")).expect("plans");
        range_chart(&plan, &plan.options[0], LengthUnit::Centimetres, None, None)
    };
    let apart = chart(&scenario);
    scenario.tasks[3].distance_m = 1.01;
    let stacked = chart(&scenario);
    assert_ne!(apart.shift, stacked.shift, "the markers take more room");
    assert_ne!(apart.view_box, stacked.view_box);
    assert_eq!(apart.ticks, stacked.ticks);
    assert_eq!(apart.rows[..3], stacked.rows[..3]);
    assert_ne!(apart.rows[3], stacked.rows[3]);
    assert_eq!(apart.markers[..3], stacked.markers[..3]);
    assert_ne!(apart.markers[3], stacked.markers[3]);
}

#[test]
fn a_part_written_after_another_is_the_part_written_afresh() {
    // Every demo with each task moved in turn, in centimetres and in
    // inches, with and without a detail open and an option chosen: the
    // chart and the table that take their unchanged rows and markers from
    // the ones before are, text for text, the ones written from nothing.
    for (scenario, planned) in demo_plans() {
        let shown = &planned.options[0];
        let chart_before = range_chart(&planned, shown, LengthUnit::Centimetres, None, None);
        let table_before = comparison(&planned, None, None, None);
        for t in 0..scenario.tasks.len() {
            let mut moved = scenario.clone();
            moved.tasks[t].distance_m *= 1.5;
            let Some(after) = validate(moved).ok().and_then(|v| plan(&v).ok()) else {
                continue;
            };
            for (unit, open, chosen) in [
                (LengthUnit::Centimetres, None, None),
                (LengthUnit::Inches, None, Some(0)),
                (LengthUnit::Centimetres, Some(t), None),
            ] {
                let option = &after.options[0];
                assert_eq!(
                    range_chart(&after, option, unit, open, Some(&chart_before)),
                    range_chart(&after, option, unit, open, None),
                    "{}, task {t} moved",
                    scenario.name
                );
                assert_eq!(
                    comparison(&after, chosen, open, Some(&table_before)),
                    comparison(&after, chosen, open, None),
                    "{}, task {t} moved",
                    scenario.name
                );
            }
        }
    }
}

/// Text a user could type that would be markup if it were not escaped.
pub(super) const TYPED: &str = "<img src=x onerror=\"alert(1)\"> & co";

/// The first demo with [`TYPED`] as its name, its first task's name and its
/// first option's label, and its plan.
pub(super) fn typed_demo() -> (Scenario, Plan) {
    let (mut scenario, _) = demo_plans().swap_remove(0);
    scenario.name = TYPED.into();
    scenario.tasks[0].name = TYPED.into();
    scenario.options[0].label = TYPED.into();
    let planned = plan(&validate(scenario.clone()).expect("still valid")).expect("plans");
    (scenario, planned)
}

#[test]
fn text_typed_by_the_user_is_never_read_as_markup() {
    let (scenario, plan) = typed_demo();
    let escaped = "&lt;img src=x onerror=";
    for part in every_part(&scenario, &plan, Some(0)) {
        assert!(!part.contains("<img"), "{part}");
        assert!(well_formed(&part), "{part}");
    }
    let parts = every_part(&scenario, &plan, Some(0)).concat();
    assert!(parts.contains(escaped), "the name shows as typed");
    assert!(parts.contains("&amp; co"));
}
