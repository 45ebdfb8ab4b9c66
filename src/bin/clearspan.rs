//! The clearspan command line. `clearspan plan FILE.json [--json]` reads a
//! scenario file (an export file with a version envelope holding one or more
//! scenarios, or a bare scenario), checks every scenario, plans each and
//! prints the plans as readable tables, or as JSON with `--json`. Problems
//! with the file are reported with the field they concern, and the exit
//! status is non-zero.

use clearspan::plan::{plan, text, Plan};
use clearspan::scenario::{validate, Scenario};
use serde::Deserialize;
use std::process::ExitCode;

const USAGE: &str = "usage: clearspan plan FILE.json [--json]";

/// The export envelope's format name and the versions this reader knows.
const EXPORT_FORMAT: &str = "clearspan-scenario-export";
const KNOWN_VERSIONS: [u64; 1] = [1];

/// One scenario of an export file (the other fields are bookkeeping).
#[derive(Deserialize)]
struct ExportItem {
    scenario: serde_json::Value,
}

/// A file's scenarios, each with the path prefix its fields are reported under.
fn scenarios_of(text: &str) -> Result<Vec<(String, Scenario)>, String> {
    let value: serde_json::Value =
        serde_json::from_str(text).map_err(|e| format!("not valid JSON: {e}"))?;
    let Some(format) = value.get("format") else {
        let s: Scenario =
            serde_json::from_value(value).map_err(|e| format!("not a clearspan scenario: {e}"))?;
        return Ok(vec![(String::new(), s)]);
    };
    if format.as_str() != Some(EXPORT_FORMAT) {
        return Err(format!(
            "format: {format} is not a clearspan export file (expected \"{EXPORT_FORMAT}\")"
        ));
    }
    let version = value.get("version").and_then(|v| v.as_u64());
    if !version.is_some_and(|v| KNOWN_VERSIONS.contains(&v)) {
        return Err(format!(
            "version: {} is not a version this program reads (it reads {KNOWN_VERSIONS:?})",
            value
                .get("version")
                .map_or("missing".to_string(), |v| v.to_string())
        ));
    }
    let items: Vec<ExportItem> = value
        .get("scenarios")
        .cloned()
        .map(serde_json::from_value)
        .transpose()
        .map_err(|e| format!("scenarios: {e}"))?
        .ok_or("scenarios: missing (an export file lists its scenarios there)")?;
    items
        .into_iter()
        .enumerate()
        .map(|(i, item)| {
            let prefix = format!("scenarios[{i}].scenario.");
            serde_json::from_value(item.scenario)
                .map(|s| (prefix.clone(), s))
                .map_err(|e| format!("{prefix}: {e}"))
        })
        .collect()
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
