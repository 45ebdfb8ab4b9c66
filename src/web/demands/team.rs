//! Team mode: a roster of pseudonymous workers (a CSV file picked or text
//! pasted) screened against the tasks of the scenario on screen by
//! `plan::roster`. The view says how many rows were read, used and
//! skipped, lists each skipped row by line and field, tabulates who needs
//! what (written as HTML text by `markup::team_table`), and offers the
//! team CSV as a download made on this device. The roster is not saved and
//! names of people are not asked for.

use crate::markup::team_table::{team_intro, team_problem, team_summary, team_table};
use crate::plan::roster::{read_roster, screen_team, TeamResult};
use crate::web::files::{download_text, picked_file, read_text_or_advise};
use crate::web::state::{use_app_state, AppState};
use leptos::prelude::*;

/// The largest roster file read, in bytes (a product limit: 20,000 rows of
/// a few dozen characters stay well under it).
const MAX_ROSTER_BYTES: usize = 4 * 1_048_576;

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
    // The result as HTML text: what comes before the export button (the
    // problem when there is no result), and the table after it.
    let written = Memo::new(move |_| {
        result.with(|r| match r {
            None => (String::new(), None),
            Some(Ok(team)) => (team_summary(team), Some(team_table(team))),
            Some(Err(e)) => (team_problem(e), None),
        })
    });
    let export = move |_| {
        let csv = result.with_untracked(|r| match r {
            Some(Ok(team)) => Some(team.to_csv()),
            _ => None,
        });
        if let Some(csv) = csv {
            if let Err(e) = download_text("clearspan-team.csv", "text/csv", &csv) {
                result.set(Some(Err(e)));
            }
        }
    };
    let intro = Memo::new(move |_| team_intro(state.scenario.with(|s| s.tasks.len())));
    view! {
        <div class="part" inner_html=move || intro.get()></div>
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
        <div class="part" inner_html=move || written.with(|w| w.0.clone())></div>
        <Show when=move || written.with(|w| w.1.is_some())>
            <button type="button" class="primary" data-testid="team-export" on:click=export>
                "Export the team table (CSV)"
            </button>
        </Show>
        <div class="part" inner_html=move || written.with(|w| w.1.clone().unwrap_or_default())></div>
    }
}
