//! The planner: from a checked scenario (a wearer and a working day of tasks)
//! to lens options ranked best first, each with its open parameters chosen,
//! the ranges of clear vision of its zones, and for every task the lens
//! point, local power, focus verdict, head posture and centration.
//! The planner reads only [`crate::scenario::ValidScenario`] and calls the
//! optics core for every formula.

pub mod outcome;

pub use outcome::*;
