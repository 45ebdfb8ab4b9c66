//! The command-line planner (work in progress on the planner branch).

fn main() {}
