//! The demo scenarios: invented, clearly fictional working days that ship
//! with the app so a new user can try it. Each is a version-1 export file in
//! `scenarios/`, embedded here at build time and imported like any file.

/// One embedded demo file.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct DemoFile {
    /// The file name under `scenarios/`.
    pub file_name: &'static str,
    /// The file's text, a version-1 export file.
    pub text: &'static str,
}

macro_rules! demo {
    ($name:literal) => {
        DemoFile {
            file_name: $name,
            text: include_str!(concat!("../../scenarios/", $name)),
        }
    };
}

/// Every demo file, in the order they are offered.
pub const DEMO_FILES: &[DemoFile] = &[
    demo!("office-two-monitors.json"),
    demo!("electronics-bench.json"),
    demo!("delivery-driver.json"),
    demo!("overhead-electrician.json"),
    demo!("laboratory-technician.json"),
    demo!("contact-lens-screen.json"),
    demo!("van-driver-overhead.json"),
];

#[cfg(test)]
mod tests {
    use super::*;
    use crate::library::transfer::parse_import;
    use std::collections::BTreeSet;

    #[test]
    fn every_file_in_scenarios_is_embedded_parses_and_validates() {
        let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("scenarios");
        let on_disk: BTreeSet<String> = std::fs::read_dir(&dir)
            .expect("scenarios/ is listable")
            .filter_map(|e| e.ok())
            .map(|e| e.file_name().to_string_lossy().into_owned())
            .filter(|n| n.ends_with(".json"))
            .collect();
        let embedded: BTreeSet<String> =
            DEMO_FILES.iter().map(|d| d.file_name.to_string()).collect();
        assert_eq!(
            on_disk, embedded,
            "every scenarios/*.json is embedded, and only those"
        );
        for demo in DEMO_FILES {
            let batch =
                parse_import(demo.text).unwrap_or_else(|e| panic!("{}: {e}", demo.file_name));
            assert!(
                batch.rejected.is_empty(),
                "{}: {:?}",
                demo.file_name,
                batch.rejected
            );
            assert_eq!(batch.accepted.len(), 1, "{}", demo.file_name);
            for item in &batch.accepted {
                let s = &item.scenario;
                assert!(s.name.starts_with("Demo — fictional"), "{}", s.name);
                assert!(item.note.contains("Fictional demo"), "{}", demo.file_name);
                assert!(
                    (4..=8).contains(&s.tasks.len()),
                    "{}: 4 to 8 tasks",
                    demo.file_name
                );
                assert!(
                    (3..=5).contains(&s.options.len()),
                    "{}: 3 to 5 options",
                    demo.file_name
                );
            }
        }
    }

    #[test]
    fn demos_carry_the_flags_their_jobs_need() {
        let flags = |file: &str| {
            let demo = DEMO_FILES
                .iter()
                .find(|d| d.file_name == file)
                .expect("embedded");
            let batch = parse_import(demo.text).expect("parses");
            batch.accepted[0]
                .scenario
                .tasks
                .iter()
                .map(|t| t.flags)
                .collect::<Vec<_>>()
        };
        assert!(flags("delivery-driver.json").iter().any(|f| f.driving));
        assert!(flags("electronics-bench.json")
            .iter()
            .any(|f| f.hazards.impact));
        let overhead = flags("overhead-electrician.json");
        assert!(overhead.iter().any(|f| f.overhead && f.hazards.impact));
        assert!(flags("laboratory-technician.json")
            .iter()
            .any(|f| f.hazards.splash_or_aerosol));
        let van = flags("van-driver-overhead.json");
        assert!(van.iter().any(|f| f.driving) && van.iter().any(|f| f.overhead));
    }
}
