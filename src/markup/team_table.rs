//! Team mode's words as HTML text: the note on privacy and what a roster
//! holds; then the result: how many roster rows were read, used and
//! skipped, each skipped row by line and field, the tally of flags, and
//! the table of who needs what (the first `SHOWN_WORKERS` workers; the
//! exported CSV holds them all); or why the roster was not screened. The
//! workers' ids and the task names are text typed by the user, escaped
//! like every text.

use super::html::Html;
use crate::display::thousands;
use crate::plan::demands::Flag;
use crate::plan::roster::{advice, Screened, TeamResult, COLUMNS as ROSTER_COLUMNS};

/// The most workers listed on screen (a product choice that keeps the tab
/// responsive); the exported CSV always holds every worker.
pub const SHOWN_WORKERS: usize = 500;

/// The team table's column heads.
const COLUMNS: [&str; 3] = [
    "Worker (pseudonymous id)",
    "Most serious flag",
    "Tasks not fine as they are",
];

/// What the tab says before the roster inputs: names of people are not
/// asked for, and what a roster holds (screened against the `tasks` tasks
/// of the scenario on screen).
pub fn team_intro(tasks: usize) -> String {
    let mut html = Html::new();
    html.open(
        "p",
        &[("class", "wv-privacy"), ("data-testid", "team-privacy")],
    )
    .element("strong", &[], "Names of real people are not asked for.")
    .text(" Give each worker a pseudonymous id (for example W-017) and keep the key to it elsewhere. The roster is read on this device, is not saved and is sent nowhere.")
    .close("p")
    .element(
        "p",
        &[("class", "hint")],
        &format!(
            "Each worker is screened against the {tasks} tasks of the scenario on screen. The first line names the columns: {} (id and age_years required; amplitude_d a push-up amplitude with the distance correction worn, correction_d its spherical equivalent, addition_d the current addition).",
            ROSTER_COLUMNS.join(", ")
        ),
    );
    html.finish()
}

/// One worker's row: the most serious flag, then each task that is not
/// fine with its reasons and advice.
fn worker_row(html: &mut Html, s: &Screened) {
    html.open("tr", &[])
        .open("th", &[("scope", "row")])
        .text(&s.worker.id)
        .element(
            "span",
            &[("class", "detail")],
            &format!("line {}", s.worker.line),
        )
        .close("th")
        .element("td", &[], s.sheet.worst_flag().words())
        .open("td", &[])
        .open("ul", &[("class", "wv-reasons")]);
    for t in s.sheet.tasks.iter().filter(|t| t.flag != Flag::Fine) {
        let reasons: Vec<String> = t.flag.reasons().iter().map(|r| r.to_string()).collect();
        html.open("li", &[])
            .element(
                "strong",
                &[],
                &format!("{}: {}", t.task.name, t.flag.kind().words()),
            )
            .text(&format!(" ({}); {}", reasons.join("; "), advice(&t.flag)))
            .close("li");
    }
    html.close("ul").close("td").close("tr");
}

/// What comes before the export button: the counts (a status line), the
/// rows skipped when there are any, and the tally of flags.
pub fn team_summary(team: &TeamResult) -> String {
    let mut html = Html::new();
    html.element(
        "p",
        &[
            ("class", "wv-counts"),
            ("role", "status"),
            ("data-testid", "team-counts"),
        ],
        &team.counts(),
    );
    if !team.skipped.is_empty() {
        html.open(
            "section",
            &[
                ("class", "notice warning"),
                ("data-testid", "team-skipped"),
                ("aria-labelledby", "team-skipped-heading"),
            ],
        )
        .element("h4", &[("id", "team-skipped-heading")], "Rows skipped")
        .open("ul", &[]);
        for p in &team.skipped {
            html.element("li", &[], &p.to_string());
        }
        html.close("ul").close("section");
    }
    html.open(
        "ul",
        &[("class", "wv-tally"), ("data-testid", "team-tally")],
    );
    for (kind, n) in team.tally() {
        html.element("li", &[], &format!("{}: {}", kind.words(), thousands(n)));
    }
    html.close("ul");
    html.finish()
}

/// What comes after the export button: a note when not every worker is
/// listed, and the table of the first `SHOWN_WORKERS` workers, one row
/// each.
pub fn team_table(team: &TeamResult) -> String {
    let mut html = Html::new();
    if team.workers.len() > SHOWN_WORKERS {
        html.element(
            "p",
            &[("class", "hint")],
            &format!(
                "The first {} workers are listed; the exported CSV holds all {}.",
                thousands(SHOWN_WORKERS),
                thousands(team.workers.len())
            ),
        );
    }
    html.open("div", &[("class", "table-scroll")])
        .open(
            "table",
            &[("class", "wv-table"), ("data-testid", "team-table")],
        )
        .element("caption", &[], "Who needs what at this workstation")
        .column_heads(&COLUMNS)
        .open("tbody", &[]);
    for s in team.workers.iter().take(SHOWN_WORKERS) {
        worker_row(&mut html, s);
    }
    html.close("tbody").close("table").close("div");
    html.finish()
}

/// Why the roster was not screened (`reason`, a clause without its full
/// stop), announced as an alert.
pub fn team_problem(reason: &str) -> String {
    let mut html = Html::new();
    html.element(
        "p",
        &[
            ("class", "notice warning"),
            ("role", "alert"),
            ("data-testid", "team-problem"),
        ],
        &format!("The roster was not screened: {reason}."),
    );
    html.finish()
}
