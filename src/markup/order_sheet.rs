//! The order sheet: the parameters a lab order needs for the chosen option,
//! the wearer's age and prescription, each task with its distance, zone and
//! verdict through that option, the date and a line for the practitioner's
//! signature. On screen it is a summary; printed, it is the one-page plan
//! sheet (the cautions print above it).

use super::html::Html;
use crate::core::units::Dioptres;
use crate::display::{trim_number, LengthUnit};
use crate::plan::text::{family_name, order_lines};
use crate::plan::Plan;
use crate::scenario::{Prescription, Wearer};

/// The wearer's line: age, distance prescription and any prescribed addition.
fn wearer_line(w: &Wearer) -> String {
    let eye = |rx: &Prescription| {
        format!(
            "{} / {} x {:.0}",
            Dioptres(rx.sphere_d).signed(),
            Dioptres(rx.cylinder_d).signed(),
            rx.axis_deg
        )
    };
    format!(
        "Wearer: {:.0} years; distance prescription R {} L {}{}",
        w.age_years,
        eye(&w.right),
        eye(&w.left),
        w.prescribed_addition_d
            .map_or(String::new(), |a| format!(", addition {}", Dioptres(a)))
    )
}

/// The order sheet as HTML text: what comes before the table of tasks,
/// and that table's rows, each the content of one `<tr>`.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct OrderSheetText {
    /// The heading, the wearer's line with the date, and the order itself.
    pub order: String,
    /// One row per task: its distance, gaze and time, the zone and the
    /// verdict through the option ordered.
    pub tasks: Vec<String>,
}

/// The head row of the sheet's table of tasks (the content of its
/// `<thead>`): one header per column.
pub fn task_columns() -> String {
    let mut html = Html::new();
    html.column_row(&["Task: distance, gaze, time", "Zone", "Verdict"]);
    html.finish()
}

/// The line signed under the sheet.
pub const SIGNATURE: &str = "Checked and confirmed by a licensed eye-care practitioner: name, signature, date ______________________________";

/// The order sheet for `plan` of `wearer`, distances in `unit`, dated
/// `date` (as the reader writes dates).
pub fn order_sheet(plan: &Plan, wearer: &Wearer, unit: LengthUnit, date: &str) -> OrderSheetText {
    let mut html = Html::new();
    html.element("h3", &[("id", "order-heading")], "Order sheet")
        .element(
            "p",
            &[("class", "print-only")],
            &format!("clearspan plan sheet: {}", plan.scenario_name),
        )
        .element(
            "p",
            &[("class", "detail")],
            &format!("{} · {date}", wearer_line(wearer)),
        );
    if let Some(o) = &plan.order {
        html.element(
            "p",
            &[],
            &format!("{} ({})", o.option.label, family_name(&o.design)),
        )
        .open("ul", &[("class", "order-lines")]);
        for line in order_lines(o) {
            html.element("li", &[], &line);
        }
        html.close("ul");
    }
    let chosen = plan
        .order
        .as_ref()
        .and_then(|o| plan.options.iter().find(|p| p.option == o.option));
    let tasks = plan
        .tasks
        .iter()
        .map(|t| {
            let through =
                chosen.and_then(|o| o.tasks.iter().find(|tp| tp.task.index == t.task.index));
            let mut row = Html::new();
            row.element(
                "td",
                &[],
                &format!(
                    "{}: {} {} at {:+.0}°, {:.1} h a day",
                    t.task.name,
                    trim_number(unit.from_metres(t.distance), 0),
                    unit.symbol(),
                    t.gaze_elevation.0,
                    t.hours_per_day
                ),
            )
            .element(
                "td",
                &[],
                &through.map(|tp| tp.zone.to_string()).unwrap_or_default(),
            )
            .element(
                "td",
                &[],
                &through.map(|tp| tp.verdict.to_string()).unwrap_or_default(),
            );
            row.finish()
        })
        .collect();
    OrderSheetText {
        order: html.finish(),
        tasks,
    }
}
