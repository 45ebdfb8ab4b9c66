//! The clearspan command line. `clearspan plan FILE.json [--json]` reads a
//! scenario file (an export file with a version envelope holding one or more
//! scenarios, or a bare scenario), checks every scenario, plans each and
//! prints the plans as readable tables, or as JSON with `--json`. Problems
//! with the file are reported with the field they concern, and the exit
//! status is non-zero.

use clearspan::library::{parse_import, parse_limited};
use clearspan::plan::{plan, text, Plan};
use clearspan::scenario::{validate, Scenario};
use std::process::ExitCode;

const USAGE: &str = "usage: clearspan plan FILE.json [--json]";

/// A file's scenarios, each with the path prefix its fields are reported
/// under. Files with a format envelope go through the library's import
/// reader (size and nesting caps, version migration, validation); a bare
/// scenario object, handy for hand-written files, is read directly.
fn scenarios_of(text: &str) -> Result<Vec<(String, Scenario)>, String> {
    let value = parse_limited(text).map_err(|e| e.to_string())?;
    if value.get("format").is_none() {
        let s: Scenario =
            serde_json::from_value(value).map_err(|e| format!("not a clearspan scenario: {e}"))?;
        return Ok(vec![(String::new(), s)]);
    }
    let batch = parse_import(text).map_err(|e| e.to_string())?;
    if !batch.rejected.is_empty() {
        let lines: Vec<String> = batch.rejected.iter().map(|r| format!("  {r}")).collect();
        return Err(format!("the file has problems:\n{}", lines.join("\n")));
    }
    Ok(batch
        .accepted
        .into_iter()
        .enumerate()
        .map(|(i, item)| (format!("scenarios[{i}].scenario."), item.scenario))
        .collect())
}

fn run(args: &[String]) -> Result<String, String> {
    let (command, rest) = args.split_first().ok_or(USAGE)?;
    if command != "plan" {
        return Err(format!("unknown command \"{command}\"\n{USAGE}"));
    }
    let json = rest.iter().any(|a| a == "--json");
    let files: Vec<&String> = rest.iter().filter(|a| !a.starts_with("--")).collect();
    let [file] = files.as_slice() else {
        return Err(USAGE.to_string());
    };
    let text = std::fs::read_to_string(file).map_err(|e| format!("{file}: {e}"))?;
    let scenarios = scenarios_of(&text).map_err(|e| format!("{file}: {e}"))?;
    let mut plans: Vec<Plan> = Vec::new();
    for (prefix, s) in scenarios {
        let valid = validate(s).map_err(|errors| {
            let lines: Vec<String> = errors
                .iter()
                .map(|e| format!("  {prefix}{}: {}", e.path, e.problem))
                .collect();
            format!("{file}: the scenario has problems:\n{}", lines.join("\n"))
        })?;
        plans.push(plan(&valid).map_err(|e| format!("{file}: {prefix}{e}"))?);
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
    let args: Vec<String> = std::env::args().skip(1).collect();
    match run(&args) {
        Ok(out) => {
            println!("{out}");
            ExitCode::SUCCESS
        }
        Err(message) => {
            eprintln!("clearspan: {message}");
            ExitCode::FAILURE
        }
    }
}
