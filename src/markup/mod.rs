//! The plan's read-only parts as HTML text: the cautions, the
//! recommendation, the comparison table, the range chart, the task points
//! on the lens map, a task's detail and the order sheet. Written here, in
//! plain Rust with every text escaped, they build and are tested natively;
//! the app puts each part on the page in one step when it changes, and
//! reads which mark was chosen from its `data-mark` or `data-option`
//! attribute. A page built this way costs the browser one parse per part
//! instead of a call from wasm per element and attribute.

pub mod comparison;
pub mod html;
pub mod lens_points;
pub mod marks;
pub mod order_sheet;
pub mod range_chart;
pub mod summary;
pub mod task_detail;

#[cfg(test)]
mod tests;
