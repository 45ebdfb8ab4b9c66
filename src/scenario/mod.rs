//! The planning case as the user enters and saves it, and the single gate
//! that checks it before the optics runs.

mod convert;
mod defaults;
mod edit;
mod model;
mod row_ids;
mod validate;

pub use model::*;
pub use row_ids::RowIds;
pub use validate::{
    validate, FieldError, Problem, ValidScenario, MAX_NAME_CHARS, MAX_OPTIONS, MAX_TASKS,
};
