//! Team mode over a roster of 10,000 fictional workers (pseudonymous ids,
//! ages 20 to 69, every third with a measured amplitude, every other with a
//! distance correction, the older ones with an addition) at the fictional
//! two-monitor office workstation: reading the CSV, and screening the team.
//! Goal: the whole command under one second on the 2-core reference machine
//! (timed separately with the command line, see DEVELOPERS.md).

use clearspan::library::read_bare_scenario;
use clearspan::plan::roster::{read_roster, screen_team};
use clearspan::scenario::Scenario;
use criterion::{criterion_main, Criterion};
use std::fmt::Write;

/// The fictional workstation of the command-line tests.
fn station() -> Scenario {
    let text = include_str!("../tests/fixtures/roster/workstation-office.json");
    let value = serde_json::from_str(text).expect("fixture is JSON");
    read_bare_scenario(&value)
        .expect("fixture is a scenario")
        .scenario
}

/// A fictional roster of `n` workers.
fn roster_text(n: usize) -> String {
    let mut text = String::from("id,age_years,amplitude_d,correction_d,addition_d\n");
    for i in 0..n {
        let age = 20 + i % 50;
        let amplitude = if i % 3 == 0 {
            format!("{:.2}", (15.0 - 0.25 * age as f64).max(0.5))
        } else {
            String::new()
        };
        let correction = if i % 2 == 0 {
            format!("{:.2}", -2.0 + 0.25 * (i % 13) as f64)
        } else {
            String::new()
        };
        let addition = if age >= 45 {
            format!("{:.2}", (0.75 + 0.25 * ((age - 45) / 4) as f64).min(2.5))
        } else {
            String::new()
        };
        let _ = writeln!(text, "W-{i:05},{age},{amplitude},{correction},{addition}");
    }
    text
}

fn bench_roster(c: &mut Criterion) {
    let station = station();
    let text = roster_text(10_000);
    let mut group = c.benchmark_group("roster");
    group.sample_size(10);
    group.bench_function("read 10,000 rows", |b| {
        b.iter(|| read_roster(&text).expect("reads"))
    });
    group.bench_function("screen 10,000 workers", |b| {
        b.iter(|| screen_team(&station, read_roster(&text).expect("reads")))
    });
    group.finish();
}

/// The benchmark group (a module, so its generated function carries documentation).
mod group {
    criterion::criterion_group!(benches, super::bench_roster);
}

criterion_main!(group::benches);
