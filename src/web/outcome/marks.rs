//! How verdicts are marked on screen: a symbol and words as well as a
//! colour, so that no reader depends on colour alone.

use crate::plan::Verdict;

/// The symbol, CSS class and words for a verdict.
pub fn verdict_mark(v: Verdict) -> (&'static str, &'static str, &'static str) {
    match v {
        Verdict::Comfortable => ("✓", "v-comfortable", "comfortable"),
        Verdict::InFocusButTiring => ("!", "v-tiring", "in focus, tiring"),
        Verdict::Blurred => ("✗", "v-blurred", "blurred"),
    }
}
