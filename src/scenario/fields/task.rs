//! A task's numbers in the field table: its distance, vertical position
//! (a gaze angle or a height from the eyes), sideways offset, width,
//! smallest detail and hours a day. Their starting values describe a
//! desk-top screen (common office layout, common practice).

use super::{Field, Help, Scope, Unit};
use crate::core::limits;
use crate::scenario::model::{Task, VerticalPosition};

/// Writes `value` into task `index` with `write`, if both exist.
fn write_task(
    s: &mut crate::scenario::Scenario,
    index: usize,
    value: Option<f64>,
    write: fn(&mut Task, f64),
) {
    if let (Some(t), Some(v)) = (s.tasks.get_mut(index), value) {
        write(t, v);
    }
}

/// Viewing distance.
pub const TASK_DISTANCE: Field = Field {
    scope: Scope::Task,
    key: "distance_m",
    label: "Distance",
    unit: Unit::Metres,
    bounds: limits::DISTANCE,
    default: Some(0.65),
    optional: false,
    help: Help {
        what: "How far the task is from the spectacle lenses, along the line of sight.",
        how: "Measured with a tape from the eyes to the middle of the task, in the wearer's usual posture.",
        usual: "Reading about 35 to 45 cm, a desk screen 50 to 80 cm, distance vision from 4 m on (common practice).",
    },
    get: |s, i| s.tasks.get(i).map(|t| t.distance_m),
    set: |s, i, v| write_task(s, i, v, |t, v| t.distance_m = v),
};

/// Gaze angle, when the position is given as one.
pub const TASK_ANGLE: Field = Field {
    scope: Scope::Task,
    key: "vertical.degrees",
    label: "Gaze angle (up +, down −)",
    unit: Unit::Degrees,
    bounds: limits::GAZE_ANGLE,
    default: Some(-15.0),
    optional: false,
    help: Help {
        what: "How far the line of sight rises (+) or drops (−) from the horizontal to reach the task.",
        how: "Estimated from the posture, or worked out from the task's height and distance.",
        usual: "Reading about −25 to −40°, a desk screen about −10 to −20° (common practice).",
    },
    get: |s, i| match s.tasks.get(i).map(|t| t.vertical) {
        Some(VerticalPosition::GazeAngle { degrees }) => Some(degrees),
        _ => None,
    },
    set: |s, i, v| {
        write_task(s, i, v, |t, degrees| {
            t.vertical = VerticalPosition::GazeAngle { degrees }
        })
    },
};

/// Height from the eyes, when the position is given as one.
pub const TASK_HEIGHT: Field = Field {
    scope: Scope::Task,
    key: "vertical.metres",
    label: "Height from eyes (up +, down −)",
    unit: Unit::Metres,
    bounds: limits::HEIGHT,
    default: Some(-0.2),
    optional: false,
    help: Help {
        what: "How far the middle of the task is above (+) or below (−) eye level.",
        how: "Measured with a tape from eye level to the middle of the task, the wearer in the usual posture.",
        usual: "A desk screen's middle about 10 to 25 cm below eye level, a document on the desk 30 to 45 cm below (common practice).",
    },
    get: |s, i| match s.tasks.get(i).map(|t| t.vertical) {
        Some(VerticalPosition::HeightFromEyes { metres }) => Some(metres),
        _ => None,
    },
    set: |s, i, v| {
        write_task(s, i, v, |t, metres| {
            t.vertical = VerticalPosition::HeightFromEyes { metres }
        })
    },
};

/// Sideways offset.
pub const TASK_SIDEWAYS: Field = Field {
    scope: Scope::Task,
    key: "sideways_m",
    label: "Sideways (right +)",
    unit: Unit::Metres,
    bounds: limits::SIDEWAYS,
    default: Some(0.0),
    optional: false,
    help: Help {
        what: "How far the middle of the task is to the right (+) or left (−) of straight ahead.",
        how: "Measured across from the point straight in front of the wearer's nose.",
        usual: "0 for a task straight ahead; a second screen 30 to 60 cm to one side (common practice).",
    },
    get: |s, i| s.tasks.get(i).map(|t| t.sideways_m),
    set: |s, i, v| write_task(s, i, v, |t, v| t.sideways_m = v),
};

/// Width of the task area.
pub const TASK_WIDTH: Field = Field {
    scope: Scope::Task,
    key: "width_m",
    label: "Width of task area",
    unit: Unit::Metres,
    bounds: limits::WIDTH,
    default: Some(0.5),
    optional: false,
    help: Help {
        what: "The width the eyes must cover for this task.",
        how: "Measured across the task: a screen's visible width, a page, a work surface.",
        usual: "A page about 20 cm, a desk screen 50 to 60 cm (common practice).",
    },
    get: |s, i| s.tasks.get(i).map(|t| t.width_m),
    set: |s, i, v| write_task(s, i, v, |t, v| t.width_m = v),
};

/// Size of the smallest detail.
pub const TASK_DETAIL: Field = Field {
    scope: Scope::Task,
    key: "detail_mm",
    label: "Smallest detail",
    unit: Unit::Millimetres,
    bounds: limits::DETAIL,
    default: Some(2.5),
    optional: false,
    help: Help {
        what: "The size of the smallest detail that must be made out: a letter's height, a scale mark, a wire.",
        how: "Measured on the task itself; for text, the height of a capital letter.",
        usual: "Capitals of 10 to 12 point print are about 2.5 to 3 mm high (common practice); screen characters should be at least about 2.8 mm at 60 cm (16 minutes of arc, ISO 9241-303, from memory).",
    },
    get: |s, i| s.tasks.get(i).map(|t| t.detail_mm),
    set: |s, i, v| write_task(s, i, v, |t, v| t.detail_mm = v),
};

/// Hours a day on the task.
pub const TASK_HOURS: Field = Field {
    scope: Scope::Task,
    key: "hours_per_day",
    label: "Hours per day",
    unit: Unit::Hours,
    bounds: limits::HOURS,
    default: Some(4.0),
    optional: false,
    help: Help {
        what: "The time spent on this task on a working day.",
        how: "Asked of the wearer, or taken from the work schedule.",
        usual: "All tasks together usually come to 6 to 10 hours (common practice).",
    },
    get: |s, i| s.tasks.get(i).map(|t| t.hours_per_day),
    set: |s, i, v| write_task(s, i, v, |t, v| t.hours_per_day = v),
};

/// Every number of a task, in the order the gate checks them.
pub const TASK: [&Field; 7] = [
    &TASK_DISTANCE,
    &TASK_ANGLE,
    &TASK_HEIGHT,
    &TASK_SIDEWAYS,
    &TASK_WIDTH,
    &TASK_DETAIL,
    &TASK_HOURS,
];
