//! How the plan's marks are written: a verdict as a symbol and words as
//! well as a colour, so that no reader depends on colour alone, and the
//! `data-mark` name of each mark a task's detail can be opened from, by
//! which the app finds the mark chosen and the mark to sit beside.

use crate::plan::Verdict;

/// The symbol, CSS class and words for a verdict.
pub fn verdict_mark(v: Verdict) -> (&'static str, &'static str, &'static str) {
    match v {
        Verdict::Comfortable => ("✓", "v-comfortable", "comfortable"),
        Verdict::InFocusButTiring => ("!", "v-tiring", "in focus, tiring"),
        Verdict::Blurred => ("✗", "v-blurred", "blurred"),
    }
}

/// The kinds of mark a task's detail is opened from.
#[derive(Clone, Copy, PartialEq, Eq, Debug)]
pub enum Mark {
    /// The task's row heading in the comparison table.
    Row,
    /// The task's numbered marker above the range chart.
    Marker,
    /// The task's point on the lens map.
    Point,
}

/// Every kind of mark with the word that names it in `data-mark`.
const KINDS: [(Mark, &str); 3] = [
    (Mark::Row, "row"),
    (Mark::Marker, "marker"),
    (Mark::Point, "point"),
];

impl Mark {
    /// The `data-mark` value of this kind of mark for the task at input
    /// index `t`.
    pub fn id(self, t: usize) -> String {
        let kind = KINDS.iter().find(|(m, _)| *m == self).map_or("", |k| k.1);
        format!("{kind}-{t}")
    }

    /// The kind of mark and the task's input index a `data-mark` value
    /// names; `None` for anything else.
    pub fn parse(id: &str) -> Option<(Mark, usize)> {
        let (kind, t) = id.split_once('-')?;
        let mark = KINDS.iter().find(|(_, word)| *word == kind)?.0;
        Some((mark, t.parse().ok()?))
    }

    /// The `aria-expanded` value of the mark of task `t` while the detail of
    /// task `open` (if any) is shown.
    pub fn expanded(t: usize, open: Option<usize>) -> &'static str {
        if open == Some(t) {
            "true"
        } else {
            "false"
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_mark_name_reads_back_as_its_kind_and_task() {
        for (mark, _) in KINDS {
            for t in [0, 7, 19] {
                assert_eq!(Mark::parse(&mark.id(t)), Some((mark, t)));
            }
        }
        assert_eq!(Mark::id(Mark::Marker, 3), "marker-3");
        assert_eq!(Mark::parse("row-x"), None);
        assert_eq!(Mark::parse("cell-2"), None);
        assert_eq!(Mark::parse("row"), None);
    }
}
