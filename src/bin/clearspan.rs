//! The clearspan command line. `clearspan plan FILE.json [--json]` reads a
//! scenario file (an export file with a version envelope holding one or more
//! scenarios, or a bare scenario), checks every scenario, plans each and
//! prints the plans as readable tables, or as JSON with `--json`. The file is
//! read strictly: a field clearspan does not know (often a misspelling) is an
//! error, as is a field of the wrong type, each named by its full path, and
//! the exit status is non-zero. It is read like an imported file (at most
//! 2 MiB, a byte-order mark passed over), and no control character from it
//! or from the arguments reaches the terminal: names in the tables and text
//! quoted in messages show them as visible stand-ins.

use clearspan::display::printable;
use clearspan::library::{
    document_text, parse_import_value, parse_limited, read_bare_scenario, ImportBatch, ReadError,
    MAX_DOCUMENT_BYTES,
};
use clearspan::plan::{plan, text, Plan};
use clearspan::scenario::{validate, Scenario, ValidScenario};
use std::ffi::OsString;
use std::io::{ErrorKind, Read, Write};
use std::path::{Path, PathBuf};
use std::process::ExitCode;

const USAGE: &str = "usage: clearspan plan FILE.json [--json]";

/// How many unknown fields an error names before it only counts the rest.
const NAMED_UNKNOWN_FIELDS: usize = 20;

/// What the command line asks for.
struct Request {
    /// The scenario file.
    file: PathBuf,
    /// JSON output instead of text tables.
    json: bool,
}

/// Reads the arguments after the program name; anything unexpected is
/// refused with the usage line.
fn request(args: &[OsString]) -> Result<Request, String> {
    let (command, rest) = args.split_first().ok_or(USAGE)?;
    if command != "plan" {
        return Err(format!(
            "unknown command \"{}\"\n{USAGE}",
            command.to_string_lossy()
        ));
    }
    let mut json = false;
    let mut files = Vec::new();
    for arg in rest {
        if arg == "--json" {
            json = true;
        } else if arg.to_string_lossy().starts_with('-') {
            return Err(format!(
                "unknown option \"{}\"\n{USAGE}",
                arg.to_string_lossy()
            ));
        } else {
            files.push(arg);
        }
    }
    match files.as_slice() {
        [file] => Ok(Request {
            file: PathBuf::from(file),
            json,
        }),
        _ => Err(USAGE.to_string()),
    }
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
            .map(|e| format!("  {prefix}{}: {}", e.path, e.problem))
            .collect();
        format!("the scenario has problems:\n{}", lines.join("\n"))
    })
}

fn run(args: &[OsString]) -> Result<String, String> {
    let Request { file, json } = request(args)?;
    let shown = file.display();
    let in_file = |e: String| format!("{shown}: {e}");
    let bytes = read_capped(&file).map_err(in_file)?;
    let text = document_text(&bytes).map_err(|e| in_file(e.to_string()))?;
    let scenarios = scenarios_of(text).map_err(in_file)?;
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

fn main() -> ExitCode {
    let args: Vec<OsString> = std::env::args_os().skip(1).collect();
    let message = match run(&args) {
        Ok(out) => match writeln!(std::io::stdout().lock(), "{out}") {
            // A reader that stops early (`| head`) is not a failure.
            Ok(()) => return ExitCode::SUCCESS,
            Err(e) if e.kind() == ErrorKind::BrokenPipe => return ExitCode::SUCCESS,
            Err(e) => format!("the plan could not be written: {e}"),
        },
        Err(message) => message,
    };
    // A message may quote the file's text or the arguments; no control
    // character of theirs reaches the terminal, line by line.
    let lines: Vec<String> = message.lines().map(printable).collect();
    // Nothing more can be said if the error stream is closed too.
    let _ = writeln!(std::io::stderr().lock(), "clearspan: {}", lines.join("\n"));
    ExitCode::FAILURE
}
