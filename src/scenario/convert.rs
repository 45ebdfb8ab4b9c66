//! Conversions from the scenario's saved shape into the core's own types,
//! so that the core never sees the input model: a task's position in front
//! of the wearer.

use super::model::{Task, VerticalPosition};
use crate::core::gaze::{TaskPosition, TaskVertical};
use crate::core::units::{Degrees, Metres};

impl Task {
    /// The task's position as the gaze geometry takes it.
    pub fn position(&self) -> TaskPosition {
        TaskPosition {
            distance: Metres(self.distance_m),
            vertical: match self.vertical {
                VerticalPosition::GazeAngle { degrees } => {
                    TaskVertical::GazeAngle(Degrees(degrees))
                }
                VerticalPosition::HeightFromEyes { metres } => TaskVertical::Height(Metres(metres)),
            },
            sideways: Metres(self.sideways_m),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::scenario::TaskFlags;

    #[test]
    fn a_task_converts_to_its_position() {
        let t = Task {
            name: "bench vice".to_string(),
            distance_m: 0.5,
            vertical: VerticalPosition::HeightFromEyes { metres: -0.3 },
            sideways_m: 0.1,
            width_m: 0.2,
            detail_mm: 1.0,
            hours_per_day: 2.0,
            flags: TaskFlags::default(),
        };
        assert_eq!(
            t.position(),
            TaskPosition {
                distance: Metres(0.5),
                vertical: TaskVertical::Height(Metres(-0.3)),
                sideways: Metres(0.1),
            }
        );
    }
}
