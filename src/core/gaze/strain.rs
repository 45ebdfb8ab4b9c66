//! How sustainable a head posture is: a head pitch (chin up or down) or a
//! head turn graded comfortable, tiring or not sustainable for work held for
//! long periods.
//!
//! The limits follow ISO 11226:2000, Ergonomics — Evaluation of static
//! working postures (recalled from memory): head inclination forward up to
//! 25° is acceptable, beyond it only briefly; holding the neck extended
//! (chin up) is not acceptable without support; axial rotation of the head
//! up to about 45° is acceptable. The comfortable limits inside those
//! (15° down, 5° up, 20° of turn) are this product's choice from common
//! practice: multifocal wearers notice a few degrees of chin lift at once.

use crate::core::units::Degrees;
use serde::Serialize;

/// How sustainable a posture is for work held for long periods.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Strain {
    /// Can be held for the whole task.
    Comfortable,
    /// Can be held, but tires the neck over a working day.
    Tiring,
    /// Outside what ergonomic guidance accepts for sustained work.
    NotSustainable,
}

/// Chin drop (neck flexion) up to which a posture is comfortable, in degrees.
pub const CHIN_DOWN_COMFORTABLE_DEG: f64 = 15.0;
/// Chin drop beyond which a posture is not sustainable, in degrees (ISO 11226: 25°).
pub const CHIN_DOWN_LIMIT_DEG: f64 = 25.0;
/// Chin lift (neck extension) up to which a posture is comfortable, in degrees.
pub const CHIN_UP_COMFORTABLE_DEG: f64 = 5.0;
/// Chin lift beyond which a posture is not sustainable, in degrees.
pub const CHIN_UP_LIMIT_DEG: f64 = 15.0;
/// Head turn up to which a posture is comfortable, in degrees.
pub const TURN_COMFORTABLE_DEG: f64 = 20.0;
/// Head turn beyond which a posture is not sustainable, in degrees (ISO 11226: about 45°).
pub const TURN_LIMIT_DEG: f64 = 45.0;

fn grade(angle: f64, comfortable: f64, limit: f64) -> Strain {
    if angle <= comfortable + 1e-9 {
        Strain::Comfortable
    } else if angle <= limit + 1e-9 {
        Strain::Tiring
    } else {
        Strain::NotSustainable
    }
}

/// The strain of holding the head pitched by `chin_up` degrees (chin up
/// positive, chin down negative).
///
/// ```
/// use clearspan::core::gaze::{pitch_strain, Strain};
/// use clearspan::core::units::Degrees;
/// assert_eq!(pitch_strain(Degrees(-10.0)), Strain::Comfortable);
/// assert_eq!(pitch_strain(Degrees(12.0)), Strain::Tiring);
/// assert_eq!(pitch_strain(Degrees(-30.0)), Strain::NotSustainable);
/// ```
pub fn pitch_strain(chin_up: Degrees) -> Strain {
    if chin_up.0 >= 0.0 {
        grade(chin_up.0, CHIN_UP_COMFORTABLE_DEG, CHIN_UP_LIMIT_DEG)
    } else {
        grade(-chin_up.0, CHIN_DOWN_COMFORTABLE_DEG, CHIN_DOWN_LIMIT_DEG)
    }
}

/// The strain of turning the head by `turn` degrees to either side.
pub fn turn_strain(turn: Degrees) -> Strain {
    grade(turn.0.abs(), TURN_COMFORTABLE_DEG, TURN_LIMIT_DEG)
}

impl std::fmt::Display for Strain {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            Strain::Comfortable => "comfortable",
            Strain::Tiring => "tiring",
            Strain::NotSustainable => "not sustainable",
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn limits_follow_the_static_posture_guidance() {
        // ISO 11226 (from memory): forward head inclination beyond 25° is not
        // acceptable for holding; a sustained neck extension is not either.
        assert_eq!(pitch_strain(Degrees(-25.0)), Strain::Tiring);
        assert_eq!(pitch_strain(Degrees(-26.0)), Strain::NotSustainable);
        assert_eq!(pitch_strain(Degrees(20.0)), Strain::NotSustainable);
        assert_eq!(turn_strain(Degrees(39.0)), Strain::Tiring);
        assert_eq!(turn_strain(Degrees(59.0)), Strain::NotSustainable);
        assert_eq!(turn_strain(Degrees(-10.0)), Strain::Comfortable);
    }
}
