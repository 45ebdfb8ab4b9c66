//! The clearspan command line (arguments parsed by clap).
//! `clearspan roster WORKSTATION.json ROSTER.csv [--json|--csv]` screens a
//! team (one row per worker, pseudonymous ids) against one workstation
//! with the task-demand sheet; bad rows are listed by line and field on
//! the error stream and skipped, and the counts of rows read, used and
//! skipped are always given. `clearspan plan FILE.json [--json]` reads a
//! scenario file (an export file with a version envelope holding one or more
//! scenarios, or a bare scenario), checks every scenario, plans each and
//! prints the plans as readable tables, or as JSON with `--json`. The file is
//! read strictly: a field clearspan does not know (often a misspelling) is an
//! error, as is a field of the wrong type, each named by its full path, and
//! the exit status is non-zero. It is read like an imported file (at most
//! 2 MiB, a byte-order mark passed over), and no control character from it
//! or from the arguments reaches the terminal: names in the tables and text
//! quoted in messages show them as visible stand-ins.

use clap::error::{ContextKind, ContextValue, ErrorKind};
use clap::{Parser, Subcommand};
use clearspan::display::{printable, problem_at_path};
use clearspan::library::{
    document_text, parse_import_value, parse_limited, read_bare_scenario, ImportBatch, ReadError,
    MAX_DOCUMENT_BYTES,
};
use clearspan::plan::roster::{read_roster, screen_team};
use clearspan::plan::{plan, text, Plan};
use clearspan::scenario::{validate, Scenario, ValidScenario};
use std::ffi::OsString;
use std::io::{Read, Write};
use std::path::{Path, PathBuf};
use std::process::ExitCode;

const USAGE: &str = "usage: clearspan plan FILE.json [--json]";
const ROSTER_USAGE: &str = "usage: clearspan roster WORKSTATION.json ROSTER.csv [--json|--csv]";

/// How many unknown fields an error names before it only counts the rest.
const NAMED_UNKNOWN_FIELDS: usize = 20;

/// Plans eyewear for working distances, and screens a team's visual
/// demands at a workstation. A planning aid, not a prescription.
#[derive(Parser, Debug)]
#[command(name = "clearspan", version, about)]
struct Cli {
    #[command(subcommand)]
    command: Command,
}

/// What the command line asks for.
#[derive(Subcommand, Debug)]
enum Command {
    /// Plan every scenario of a file and print the plans.
    #[command(override_usage = "clearspan plan FILE.json [--json]")]
    Plan {
        /// The scenario file (an export or a bare scenario).
        file: PathBuf,
        /// JSON output instead of text tables.
        #[arg(long)]
        json: bool,
    },
    /// Screen a roster of workers (CSV) against one workstation.
    #[command(override_usage = "clearspan roster WORKSTATION.json ROSTER.csv [--json|--csv]")]
    Roster {
        /// The workstation: a scenario file holding one scenario (its tasks).
        workstation: PathBuf,
        /// The roster: columns id, age_years, amplitude_d, correction_d, addition_d.
        roster: PathBuf,
        /// JSON output.
        #[arg(long, conflicts_with = "csv")]
        json: bool,
        /// CSV output (one line per worker and task).
        #[arg(long)]
        csv: bool,
    },
}

/// How a run failed: a usage error (exit status 2, as argument parsers
/// conventionally use) or bad input (exit status 1).
enum Failure {
    Usage(String),
    Input(String),
}

impl From<String> for Failure {
    fn from(message: String) -> Failure {
        Failure::Input(message)
    }
}

/// The arguments parsed, or what to print instead: help and version go to
/// standard output with success; an unknown option is named with the
/// subcommand's usage line.
fn parse(args: &[OsString]) -> Result<Command, Result<String, Failure>> {
    let argv = std::iter::once(OsString::from("clearspan")).chain(args.iter().cloned());
    match Cli::try_parse_from(argv) {
        Ok(cli) => Ok(cli.command),
        Err(e) => Err(match e.kind() {
            ErrorKind::DisplayHelp
            | ErrorKind::DisplayVersion
            | ErrorKind::DisplayHelpOnMissingArgumentOrSubcommand => {
                Ok(e.render().to_string().trim_end().to_string())
            }
            _ => {
                let usage = if args.first().is_some_and(|a| a == "roster") {
                    ROSTER_USAGE
                } else {
                    USAGE
                };
                let named = |kind| match e.get(kind) {
                    Some(ContextValue::String(arg)) => Some(arg.clone()),
                    _ => None,
                };
                let what = match e.kind() {
                    ErrorKind::UnknownArgument => named(ContextKind::InvalidArg)
                        .map(|arg| format!("unknown option \"{arg}\"")),
                    ErrorKind::InvalidSubcommand => named(ContextKind::InvalidSubcommand)
                        .map(|arg| format!("unknown command \"{arg}\"")),
                    _ => None,
                }
                .unwrap_or_else(|| first_line(&e.render().to_string()));
                Err(Failure::Usage(format!("{what}\n{usage}")))
            }
        }),
    }
}

/// The first line of clap's message, without its "error: " prefix.
fn first_line(rendered: &str) -> String {
    let line = rendered.lines().next().unwrap_or_default();
    line.strip_prefix("error: ").unwrap_or(line).to_string()
}

/// Reads the file's bytes, refusing one that says it is larger than the
/// library accepts before reading it, and reading at most one byte past the
/// limit, so endless input (a device, a pipe) is never read whole.
fn read_capped(path: &Path) -> Result<Vec<u8>, String> {
    let file = std::fs::File::open(path).map_err(|e| e.to_string())?;
    let stated = file.metadata().map_err(|e| e.to_string())?.len();
    if stated > MAX_DOCUMENT_BYTES as u64 {
        let bytes = usize::try_from(stated).unwrap_or(usize::MAX);
        return Err(ReadError::TooLarge { bytes }.to_string());
    }
    let mut bytes = Vec::new();
    file.take(MAX_DOCUMENT_BYTES as u64 + 1)
        .read_to_end(&mut bytes)
        .map_err(|e| e.to_string())?;
    if bytes.len() > MAX_DOCUMENT_BYTES {
        return Err(format!(
            "the input goes on past the {} MiB allowed, so reading stopped there; a clearspan \
             file is never that large",
            MAX_DOCUMENT_BYTES / (1024 * 1024)
        ));
    }
    Ok(bytes)
}

/// A list of problems, one indented line each, under a heading.
fn problems(lines: Vec<String>) -> String {
    format!("the file has problems:\n{}", lines.join("\n"))
}

/// One line per unknown field (the first few, then how many more).
fn unknown_lines(paths: &[String]) -> Vec<String> {
    let mut lines: Vec<String> = paths
        .iter()
        .take(NAMED_UNKNOWN_FIELDS)
        .map(|p| {
            format!("  {p}: clearspan does not know this field; check its spelling or remove it")
        })
        .collect();
    if paths.len() > NAMED_UNKNOWN_FIELDS {
        lines.push(format!(
            "  ... and {} more unknown fields",
            paths.len() - NAMED_UNKNOWN_FIELDS
        ));
    }
    lines
}

/// A file's scenarios, each with the path prefix its fields are reported
/// under. Files with a format envelope go through the library's import
/// reader (version migration, validation); a bare scenario object, handy for
/// hand-written files, is decoded on its own. Either way the size, nesting
/// and byte-order-mark handling of the library's reader apply.
fn scenarios_of(text: &str) -> Result<Vec<(String, Scenario)>, String> {
    let value = parse_limited(text).map_err(|e| e.to_string())?;
    if value.get("format").is_none() {
        let bare =
            read_bare_scenario(&value).map_err(|e| format!("not a clearspan scenario: {e}"))?;
        if !bare.unknown_fields.is_empty() {
            return Err(problems(unknown_lines(&bare.unknown_fields)));
        }
        return Ok(vec![(String::new(), bare.scenario)]);
    }
    let batch = parse_import_value(&value).map_err(|e| e.to_string())?;
    enveloped(batch)
}

/// The accepted scenarios of an export file, if it holds any and nothing in
/// it is wrong or unknown.
fn enveloped(batch: ImportBatch) -> Result<Vec<(String, Scenario)>, String> {
    let mut lines: Vec<String> = batch.rejected.iter().map(|r| format!("  {r}")).collect();
    lines.extend(unknown_lines(&batch.unknown_fields));
    if !lines.is_empty() {
        return Err(problems(lines));
    }
    if batch.accepted.is_empty() {
        return Err("the file holds no scenarios; there is nothing to plan".to_string());
    }
    Ok(batch
        .accepted
        .into_iter()
        .enumerate()
        .map(|(i, item)| (format!("scenarios[{i}].scenario."), item.scenario))
        .collect())
}

/// The scenario with its name, task names and option labels made safe to
/// write to a terminal (see [`printable`]).
fn printable_names(mut s: Scenario) -> Scenario {
    s.name = printable(&s.name);
    for t in &mut s.tasks {
        t.name = printable(&t.name);
    }
    for o in &mut s.options {
        o.label = printable(&o.label);
    }
    s
}

/// Validates `s`, reporting problems under `prefix`.
fn checked(s: Scenario, prefix: &str) -> Result<ValidScenario, String> {
    validate(s).map_err(|errors| {
        let lines: Vec<String> = errors
            .iter()
            .map(|e| {
                format!(
                    "  {prefix}{}: {}",
                    e.path,
                    problem_at_path(&e.path, &e.problem)
                )
            })
            .collect();
        format!("the scenario has problems:\n{}", lines.join("\n"))
    })
}

/// Plans every scenario of `file`.
fn run_plan(file: &Path, json: bool) -> Result<String, String> {
    let shown = file.display();
    let in_file = |e: String| format!("{shown}: {e}");
    let scenarios = scenarios_of(&read_text(file)?).map_err(in_file)?;
    let mut plans: Vec<Plan> = Vec::new();
    for (prefix, s) in scenarios {
        // Checked as written; the text tables then get names that cannot
        // drive the terminal, which changes no length and no emptiness.
        let valid = checked(s.clone(), &prefix).map_err(in_file)?;
        let valid = if json {
            valid
        } else {
            checked(printable_names(s), &prefix).map_err(in_file)?
        };
        plans.push(plan(&valid).map_err(|e| in_file(format!("{prefix}{e}")))?);
    }
    if json {
        serde_json::to_string_pretty(&plans).map_err(|e| format!("could not write JSON: {e}"))
    } else {
        Ok(plans
            .iter()
            .map(text::render)
            .collect::<Vec<_>>()
            .join("\n"))
    }
}

/// The text of the file at `path` as the library reads imports (size
/// checked first, a byte-order mark passed over), with the path in front
/// of any error.
fn read_text(path: &Path) -> Result<String, String> {
    let in_file = |e: String| format!("{}: {e}", path.display());
    let bytes = read_capped(path).map_err(in_file)?;
    document_text(&bytes)
        .map(str::to_string)
        .map_err(|e| in_file(e.to_string()))
}

/// Screens the roster at `roster_path` against the one workstation in
/// `station_path`. Skipped rows and the counts go to `notes` (the error
/// stream); the table, JSON or CSV is the result.
fn run_roster(
    station_path: &Path,
    roster_path: &Path,
    json: bool,
    csv: bool,
    notes: &mut Vec<String>,
) -> Result<String, String> {
    let shown = station_path.display();
    let text = read_text(station_path)?;
    let mut scenarios = scenarios_of(&text).map_err(|e| format!("{shown}: {e}"))?;
    if scenarios.len() != 1 {
        return Err(format!(
            "{shown}: holds {} scenarios; a workstation file holds one",
            scenarios.len()
        ));
    }
    let (prefix, station) = scenarios.remove(0);
    let station = checked(station, &prefix).map_err(|e| format!("{shown}: {e}"))?;
    let roster_text = read_text(roster_path)?;
    let roster =
        read_roster(&roster_text).map_err(|e| format!("{}: {e}", roster_path.display()))?;
    let team = screen_team(station.get(), roster);
    notes.extend(
        team.skipped
            .iter()
            .map(|p| format!("{}: {p}", roster_path.display())),
    );
    notes.push(format!("{}: {}", roster_path.display(), team.counts()));
    // Ids and task names come from the files: in text and CSV their
    // control characters are shown, never obeyed (JSON escapes them).
    let shown = |out: String| out.lines().map(printable).collect::<Vec<_>>().join("\n");
    if json {
        serde_json::to_string_pretty(&team).map_err(|e| format!("could not write JSON: {e}"))
    } else if csv {
        Ok(shown(team.to_csv()))
    } else {
        Ok(shown(team.render_table()))
    }
}

/// Runs the command line; notes for the error stream are collected in `notes`.
fn run(args: &[OsString], notes: &mut Vec<String>) -> Result<String, Failure> {
    match parse(args) {
        Err(done) => done,
        Ok(Command::Plan { file, json }) => Ok(run_plan(&file, json)?),
        Ok(Command::Roster {
            workstation,
            roster,
            json,
            csv,
        }) => Ok(run_roster(&workstation, &roster, json, csv, notes)?),
    }
}

/// Runs the command line with the process's arguments.
pub fn main() -> ExitCode {
    let args: Vec<OsString> = std::env::args_os().skip(1).collect();
    let mut notes = Vec::new();
    let outcome = run(&args, &mut notes);
    // Notes (skipped rows, counts) quote the input: shown, never obeyed.
    // Nothing more can be said if the error stream is closed.
    for note in &notes {
        let _ = writeln!(std::io::stderr().lock(), "clearspan: {}", printable(note));
    }
    let (message, code) = match outcome {
        Ok(out) => match writeln!(std::io::stdout().lock(), "{out}") {
            // A reader that stops early (`| head`) is not a failure.
            Ok(()) => return ExitCode::SUCCESS,
            Err(e) if e.kind() == std::io::ErrorKind::BrokenPipe => return ExitCode::SUCCESS,
            Err(e) => (format!("the output could not be written: {e}"), 1),
        },
        Err(Failure::Input(message)) => (message, 1),
        Err(Failure::Usage(message)) => (message, 2),
    };
    // A message may quote the file's text or the arguments; no control
    // character of theirs reaches the terminal, line by line.
    let lines: Vec<String> = message.lines().map(printable).collect();
    let _ = writeln!(std::io::stderr().lock(), "clearspan: {}", lines.join("\n"));
    ExitCode::from(code)
}
