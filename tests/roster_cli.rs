//! The `roster` subcommand and the argument parser, run as a user would:
//! a fictional workstation and a fictional team (pseudonymous ids) in
//! `tests/fixtures/roster/`, bad rows named on the error stream, help and
//! version printed with success, unknown flags refused with usage status 2.

use std::process::Command;

const STATION: &str = "tests/fixtures/roster/workstation-office.json";
const TEAM: &str = "tests/fixtures/roster/team.csv";

/// Runs the command line; returns (exit code, stdout, stderr).
fn run(args: &[&str]) -> (Option<i32>, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_clearspan"))
        .args(args)
        .output()
        .expect("the binary runs");
    (
        out.status.code(),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

#[test]
fn a_team_is_screened_with_bad_rows_named_and_counted() {
    let (code, out, err) = run(&["roster", STATION, TEAM]);
    assert_eq!(code, Some(0), "{err}");
    assert!(out.starts_with("8 rows read, 6 used, 2 skipped"), "{out}");
    assert!(
        err.contains("line 7, age_years: \"thirty\" is not a number"),
        "{err}"
    );
    assert!(
        err.contains("line 8: 6 fields where the header names 5"),
        "{err}"
    );
    assert!(
        out.contains("W-0108, night shift"),
        "a quoted comma stays in the id: {out}"
    );
}

#[test]
fn csv_and_json_outputs_hold_one_entry_per_worker() {
    let (code, out, err) = run(&["roster", STATION, TEAM, "--csv"]);
    assert_eq!(code, Some(0), "{err}");
    let mut lines = out.lines();
    assert_eq!(
        lines.next(),
        Some("id,task,flag,needs_d,has_d,reasons,advice")
    );
    // Six workers used, six tasks at the workstation.
    assert_eq!(lines.count(), 36);
    let (code, out, err) = run(&["roster", STATION, TEAM, "--json"]);
    assert_eq!(code, Some(0), "{err}");
    let json: serde_json::Value = serde_json::from_str(&out).expect("JSON");
    assert_eq!(json["read"], 8);
    assert_eq!(json["used"], 6);
    assert_eq!(json["workers"].as_array().map(Vec::len), Some(6));
    assert_eq!(json["skipped"][0]["line"], 7);
    let (code, _, err) = run(&["roster", STATION, TEAM, "--json", "--csv"]);
    assert_eq!(code, Some(2));
    assert!(err.contains("usage: clearspan roster"), "{err}");
}

#[test]
fn help_and_version_are_answered_and_unknown_flags_refused() {
    for args in [&["--help"][..], &["plan", "--help"], &["roster", "--help"]] {
        let (code, out, _) = run(args);
        assert_eq!(code, Some(0), "{args:?}");
        assert!(out.contains("Usage:"), "{out}");
    }
    let (code, out, _) = run(&["--version"]);
    assert_eq!(code, Some(0));
    assert!(out.starts_with("clearspan "), "{out}");
    let (code, _, err) = run(&["roster", STATION, TEAM, "--tsv"]);
    assert_eq!(code, Some(2));
    assert!(err.contains("unknown option \"--tsv\""), "{err}");
    let (code, _, err) = run(&["screen"]);
    assert_eq!(code, Some(2));
    assert!(err.contains("unknown command \"screen\""), "{err}");
}

#[test]
fn a_roster_asking_for_names_is_refused_whole() {
    let path = std::env::temp_dir().join(format!("clearspan-names-{}.csv", std::process::id()));
    std::fs::write(&path, "id,name,age_years\nW-1,someone,40\n").expect("temp file");
    let (code, out, err) = run(&["roster", STATION, &path.to_string_lossy()]);
    assert_eq!(code, Some(1));
    assert!(out.is_empty());
    assert!(err.contains("column \"name\""), "{err}");
    let _ = std::fs::remove_file(path);
}
