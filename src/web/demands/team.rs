//! Team mode: a roster of pseudonymous workers (a CSV file picked or text
//! pasted) screened against the tasks of the scenario on screen by
//! `plan::roster`. The view says how many rows were read, used and
//! skipped, lists each skipped row by line and field, tabulates who needs
//! what, and offers the team CSV as a download made on this device. The
//! roster is not saved and names of people are not asked for.

use crate::display::thousands;
use crate::plan::demands::Flag;
use crate::plan::roster::{advice, read_roster, screen_team, TeamResult, COLUMNS};
use crate::web::files::{download_text, picked_file, read_text_or_advise};
use crate::web::state::{use_app_state, AppState};
use crate::web::table::column_heads;
use leptos::prelude::*;

/// The largest roster file read, in bytes (a product limit: 20,000 rows of
/// a few dozen characters stay well under it).
const MAX_ROSTER_BYTES: usize = 4 * 1_048_576;

/// The most workers listed on screen (a product choice that keeps the tab
/// responsive); the exported CSV always holds every worker.
const SHOWN_WORKERS: usize = 500;

/// The roster `text` read and screened against the scenario on screen, or
/// why it could not be.
fn screen(state: AppState, text: &str) -> Result<TeamResult, String> {
    let roster = read_roster(text).map_err(|e| e.to_string())?;
    state.checked.with_untracked(|c| match c {
        Ok(valid) => Ok(screen_team(valid.get(), roster)),
        Err(_) => Err(
            "the scenario on screen has field problems to fix first: its tasks are the workstation"
                .to_string(),
        ),
    })
}

/// One worker's row of the table: the most serious flag, then each task
/// that is not fine with its reasons and advice.
fn worker_row(s: &crate::plan::roster::Screened) -> impl IntoView {
    let tasks = s
        .sheet
        .tasks
        .iter()
        .filter(|t| t.flag != Flag::Fine)
        .map(|t| {
            let reasons: Vec<String> = t.flag.reasons().iter().map(|r| r.to_string()).collect();
            view! {
                <li>
                    <strong>{format!("{}: {}", t.task.name, t.flag.kind().words())}</strong>
                    {format!(" ({}); {}", reasons.join("; "), advice(&t.flag))}
                </li>
            }
        })
        .collect_view();
    view! {
        <tr>
            <th scope="row">{s.worker.id.clone()}<span class="detail">{format!("line {}", s.worker.line)}</span></th>
            <td>{s.sheet.worst_flag().words()}</td>
            <td><ul class="wv-reasons">{tasks}</ul></td>
        </tr>
    }
}

/// What a screened team shows: counts, skipped rows, tally, table, export.
fn result_view(team: &TeamResult, export: Callback<()>) -> impl IntoView {
    let skipped = (!team.skipped.is_empty()).then(|| {
        let items = team
            .skipped
            .iter()
            .map(|p| view! { <li>{p.to_string()}</li> })
            .collect_view();
        view! {
            <section class="notice warning" data-testid="team-skipped" aria-labelledby="team-skipped-heading">
                <h4 id="team-skipped-heading">"Rows skipped"</h4>
                <ul>{items}</ul>
            </section>
        }
    });
    let tally = team
        .tally()
        .iter()
        .map(|(kind, n)| view! { <li>{format!("{}: {}", kind.words(), thousands(*n))}</li> })
        .collect_view();
    let rows = team
        .workers
        .iter()
        .take(SHOWN_WORKERS)
        .map(worker_row)
        .collect_view();
    let more = (team.workers.len() > SHOWN_WORKERS).then(|| {
        format!(
            "The first {} workers are listed; the exported CSV holds all {}.",
            thousands(SHOWN_WORKERS),
            thousands(team.workers.len())
        )
    });
    view! {
        <p class="wv-counts" role="status" data-testid="team-counts">{team.counts()}</p>
        {skipped}
        <ul class="wv-tally" data-testid="team-tally">{tally}</ul>
        <button type="button" class="primary" data-testid="team-export" on:click=move |_| export.run(())>
            "Export the team table (CSV)"
        </button>
        {more.map(|m| view! { <p class="hint">{m}</p> })}
        <div class="table-scroll">
            <table class="wv-table" data-testid="team-table">
                <caption>"Who needs what at this workstation"</caption>
                {column_heads(&["Worker (pseudonymous id)", "Most serious flag", "Tasks not fine as they are"])}
                <tbody>{rows}</tbody>
            </table>
        </div>
    }
}

/// The "Team" tab.
#[component]
pub fn TeamTab() -> impl IntoView {
    let state = use_app_state();
    let pasted = RwSignal::new(String::new());
    let result = RwSignal::new(None::<Result<TeamResult, String>>);
    let run = move |text: String| result.set(Some(screen(state, &text)));
    let pick = move |ev: leptos::ev::Event| {
        let Some(file) = picked_file(&ev) else {
            return;
        };
        leptos::task::spawn_local(async move {
            match read_text_or_advise(file, MAX_ROSTER_BYTES, "split the roster").await {
                Ok(text) => run(text),
                Err(e) => result.set(Some(Err(e))),
            }
        });
    };
    let export = Callback::new(move |()| {
        let csv = result.with_untracked(|r| match r {
            Some(Ok(team)) => Some(team.to_csv()),
            _ => None,
        });
        if let Some(csv) = csv {
            if let Err(e) = download_text("clearspan-team.csv", "text/csv", &csv) {
                result.set(Some(Err(e)));
            }
        }
    });
    let station = move || state.scenario.with(|s| s.tasks.len());
    view! {
        <p class="wv-privacy" data-testid="team-privacy">
            <strong>"Names of real people are not asked for."</strong>
            " Give each worker a pseudonymous id (for example W-017) and keep the key to it elsewhere. The roster is read on this device, is not saved and is sent nowhere."
        </p>
        <p class="hint">
            {move || format!(
                "Each worker is screened against the {} tasks of the scenario on screen. The first line names the columns: {} (id and age_years required; amplitude_d a push-up amplitude with the distance correction worn, correction_d its spherical equivalent, addition_d the current addition).",
                station(),
                COLUMNS.join(", ")
            )}
        </p>
        <div class="wv-roster-inputs">
            <div class="field">
                <label for="team-file">"Roster file (CSV)"</label>
                <input id="team-file" type="file" accept=".csv,text/csv,text/plain" data-testid="team-file" on:change=pick />
            </div>
            <div class="field">
                <label for="team-paste">"Or paste the roster"</label>
                <textarea
                    id="team-paste"
                    rows="6"
                    spellcheck="false"
                    data-testid="team-paste"
                    prop:value=move || pasted.get()
                    on:input=move |ev| pasted.set(event_target_value(&ev))
                ></textarea>
                <button type="button" data-testid="team-run" on:click=move |_| run(pasted.get_untracked())>
                    "Screen the pasted roster"
                </button>
            </div>
        </div>
        {move || {
            result
                .with(|r| match r {
                    None => ().into_any(),
                    Some(Ok(team)) => result_view(team, export).into_any(),
                    Some(Err(e)) => {
                        view! {
                            <p class="notice warning" role="alert" data-testid="team-problem">
                                {format!("The roster was not screened: {e}.")}
                            </p>
                        }
                            .into_any()
                    }
                })
        }}
    }
}
