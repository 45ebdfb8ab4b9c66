//! The planner's error: a checked scenario that the optics or lens models
//! still cannot handle (a combination of values each within range that
//! together leave the models' domain). Each message names the scenario field
//! or option involved and what the model said.

use crate::core::error::OpticsError;
use crate::core::lens::LensError;
use std::fmt;

/// Why a plan could not be made.
#[derive(Debug, Clone, PartialEq)]
pub enum PlanError {
    /// An optics formula refused a value derived from the scenario.
    Optics {
        /// The scenario field or step concerned ("wearer.right", "tasks[2]").
        context: String,
        /// What the optics core said.
        error: OpticsError,
    },
    /// A lens or gaze model refused a value derived from the scenario.
    Lens {
        /// The scenario field or step concerned ("options[1]", "tasks[2]").
        context: String,
        /// What the lens model said.
        error: LensError,
    },
}

impl PlanError {
    /// Wraps an optics error with the field it concerns.
    pub fn optics(context: impl Into<String>) -> impl FnOnce(OpticsError) -> PlanError {
        let context = context.into();
        move |error| PlanError::Optics { context, error }
    }

    /// Wraps a lens error with the field it concerns.
    pub fn lens(context: impl Into<String>) -> impl FnOnce(LensError) -> PlanError {
        let context = context.into();
        move |error| PlanError::Lens { context, error }
    }
}

impl fmt::Display for PlanError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            PlanError::Optics { context, error } => write!(f, "{context}: {error}"),
            PlanError::Lens { context, error } => write!(f, "{context}: {error}"),
        }
    }
}

impl std::error::Error for PlanError {}
