//! Kinds of task a new task can start from: a typical distance, direction
//! of gaze, width, smallest detail, hours and flags for each, with where the
//! figures come from. A new task starts from its kind's figures instead of
//! one default for everything, so that the detail size (which decides how
//! much blur a task tolerates) is a stated assumption, not an accident.

use super::model::{Task, TaskFlags, VerticalPosition};

/// One kind of task and its typical figures.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TaskKind {
    /// Machine value, used by the form.
    pub key: &'static str,
    /// The kind in words.
    pub label: &'static str,
    /// Viewing distance from the eyes, in metres.
    pub distance_m: f64,
    /// Direction of gaze, in degrees above (+) or below (−) the horizontal.
    pub gaze_deg: f64,
    /// Width of the task area, in metres.
    pub width_m: f64,
    /// Smallest detail to be made out, in millimetres.
    pub detail_mm: f64,
    /// Hours a day, a starting guess to be replaced.
    pub hours: f64,
    /// Safety and character flags.
    pub flags: TaskFlags,
    /// Where the figures come from.
    pub source: &'static str,
}

const NONE: TaskFlags = TaskFlags {
    driving: false,
    moving_machinery: false,
    overhead: false,
    screen: false,
    hazards: super::model::Hazards {
        impact: false,
        splash_or_aerosol: false,
        dust: false,
        optical_radiation: false,
    },
};

/// The kinds offered, the first being what "Add task" adds by default.
pub const TASK_KINDS: [TaskKind; 8] = [
    TaskKind {
        key: "desk_screen",
        label: "Desk screen",
        distance_m: 0.65,
        gaze_deg: -15.0,
        width_m: 0.5,
        detail_mm: 3.0,
        hours: 4.0,
        flags: TaskFlags { screen: true, ..NONE },
        source: "screen 50 to 75 cm away, its top at or below eye level (ergonomic guidance, from memory); characters of at least 16 minutes of arc, about 3 mm at 65 cm (ISO 9241-303, from memory)",
    },
    TaskKind {
        key: "laptop",
        label: "Laptop screen",
        distance_m: 0.5,
        gaze_deg: -25.0,
        width_m: 0.3,
        detail_mm: 2.3,
        hours: 2.0,
        flags: TaskFlags { screen: true, ..NONE },
        source: "a laptop on a desk sits nearer and lower than a monitor (common practice); characters of 16 minutes of arc at 50 cm, about 2.3 mm (ISO 9241-303, from memory)",
    },
    TaskKind {
        key: "printed_page",
        label: "Printed page",
        distance_m: 0.4,
        gaze_deg: -30.0,
        width_m: 0.2,
        detail_mm: 1.4,
        hours: 1.0,
        flags: NONE,
        source: "reading at about 40 cm (common practice); lower-case letters of 8-point newsprint (N8) about 1.4 mm high (from memory)",
    },
    TaskKind {
        key: "phone",
        label: "Phone",
        distance_m: 0.35,
        gaze_deg: -35.0,
        width_m: 0.07,
        detail_mm: 1.2,
        hours: 1.0,
        flags: TaskFlags { screen: true, ..NONE },
        source: "phones held at about 32 to 40 cm for text and web pages (Bababekova et al. 2011, from memory); small phone text about 1.2 mm (from memory)",
    },
    TaskKind {
        key: "fine_bench",
        label: "Fine bench work",
        distance_m: 0.3,
        gaze_deg: -40.0,
        width_m: 0.3,
        detail_mm: 0.5,
        hours: 2.0,
        flags: TaskFlags {
            hazards: super::model::Hazards { impact: true, ..NONE.hazards },
            ..NONE
        },
        source: "small parts, wires and solder joints at about 30 cm (common practice); flying particles likely (common practice)",
    },
    TaskKind {
        key: "overhead",
        label: "Work overhead",
        distance_m: 0.6,
        gaze_deg: 40.0,
        width_m: 0.5,
        detail_mm: 2.0,
        hours: 1.0,
        flags: TaskFlags {
            overhead: true,
            hazards: super::model::Hazards { impact: true, dust: true, ..NONE.hazards },
            ..NONE
        },
        source: "fittings in a ceiling at arm's length above eye level (common practice); falling dust and debris likely (common practice)",
    },
    TaskKind {
        key: "dashboard",
        label: "Vehicle dashboard",
        distance_m: 0.75,
        gaze_deg: -20.0,
        width_m: 0.4,
        detail_mm: 3.0,
        hours: 0.5,
        flags: TaskFlags { driving: true, ..NONE },
        source: "instruments about 75 cm away, below the road (common practice); a driving task is judged against the driving vision standard, not its detail size",
    },
    TaskKind {
        key: "road",
        label: "Road ahead",
        distance_m: 20.0,
        gaze_deg: 0.0,
        width_m: 10.0,
        detail_mm: 80.0,
        hours: 1.0,
        flags: TaskFlags { driving: true, ..NONE },
        source: "the road straight ahead (common practice); a driving task is judged against the driving vision standard, not its detail size",
    },
];

/// The kind with machine value `key`, if there is one.
pub fn task_kind(key: &str) -> Option<&'static TaskKind> {
    TASK_KINDS.iter().find(|k| k.key == key)
}

impl TaskKind {
    /// A new task of this kind named `name`.
    pub fn task(&self, name: &str) -> Task {
        Task {
            name: name.to_string(),
            distance_m: self.distance_m,
            vertical: VerticalPosition::GazeAngle {
                degrees: self.gaze_deg,
            },
            sideways_m: 0.0,
            width_m: self.width_m,
            detail_mm: self.detail_mm,
            hours_per_day: self.hours,
            flags: self.flags,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::core::limits;
    use crate::scenario::{validate, Scenario};

    #[test]
    fn every_kind_lies_within_the_gate_and_names_its_source() {
        for k in &TASK_KINDS {
            assert!(limits::DISTANCE.check(k.distance_m).is_ok(), "{}", k.key);
            assert!(limits::GAZE_ANGLE.check(k.gaze_deg).is_ok(), "{}", k.key);
            assert!(limits::WIDTH.check(k.width_m).is_ok(), "{}", k.key);
            assert!(limits::DETAIL.check(k.detail_mm).is_ok(), "{}", k.key);
            assert!(limits::HOURS.check(k.hours).is_ok(), "{}", k.key);
            assert!(
                k.source.contains("from memory") || k.source.contains("common practice"),
                "{}: a source or its status is named",
                k.key
            );
            assert_eq!(task_kind(k.key), Some(k));
        }
    }

    #[test]
    fn a_scenario_of_every_kind_passes_the_gate() {
        let mut s = Scenario::untitled();
        s.tasks = TASK_KINDS.iter().map(|k| k.task(k.label)).collect();
        assert!(validate(s).is_ok());
    }

    #[test]
    fn screen_characters_of_the_screen_kinds_meet_the_display_minimum() {
        // ISO 9241-303 asks for characters of at least 16 minutes of arc
        // (from memory); 16′ at 65 cm is 650 mm × tan(16′) = 3.03 mm, at
        // 50 cm 2.33 mm, worked by hand; allow the rounding to 0.1 mm.
        let desk = task_kind("desk_screen").expect("kind");
        let laptop = task_kind("laptop").expect("kind");
        assert!((desk.detail_mm - 3.03).abs() < 0.05);
        assert!((laptop.detail_mm - 2.33).abs() < 0.05);
    }
}
