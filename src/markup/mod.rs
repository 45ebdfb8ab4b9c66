//! The read-only parts of the views as HTML text: of the plan, the
//! cautions, the recommendation, the comparison table, the range chart,
//! the task points on the lens map, a task's detail and the order sheet;
//! of workplace vision, the task-demand sheet and team mode's table; of
//! the wearer's walkthrough, each step's words. Written here, in
//! plain Rust with every text escaped, they build and are tested natively;
//! the app puts each part on the page in one step when it changes, and
//! reads which mark was chosen from its `data-mark` or `data-option`
//! attribute. A page built this way costs the browser one parse per part
//! instead of a call from wasm per element and attribute.

pub mod comparison;
pub mod demand_sheet;
pub mod html;
pub mod lens_points;
pub mod marks;
pub mod order_sheet;
pub mod range_chart;
mod reuse;
pub mod summary;
pub mod task_detail;
pub mod team_table;
pub mod walkthrough_step;

#[cfg(test)]
mod tests;
#[cfg(test)]
mod view_tests;
