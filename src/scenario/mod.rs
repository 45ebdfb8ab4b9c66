//! The planning case as the user enters and saves it, the table of its
//! editable numbers (`fields`), and the single gate that checks it before
//! the optics runs.

mod convert;
mod defaults;
mod edit;
pub mod fields;
mod model;
mod row_ids;
pub mod task_kinds;
mod valid;
mod validate;

pub use model::*;
pub use row_ids::RowIds;
pub use valid::ValidScenario;
pub use validate::{validate, FieldError, Problem, MAX_NAME_CHARS, MAX_OPTIONS, MAX_TASKS};
