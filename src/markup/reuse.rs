//! Writing again only what changed: a part written row by row (the
//! comparison table's task rows, the range chart's rows and markers) keeps
//! what each row was written from, and the next writing takes a row's text
//! from the last one when its inputs are the same. Comparing what a row is
//! written from costs far less than writing it (numbers formatted, text
//! escaped); the result is, text for text, what writing afresh gives
//! (`tests::a_part_written_after_another_is_the_part_written_afresh`).

/// The text at `at` of the last writing (`before`: its inputs and texts)
/// if that row was written from `input`; else `write()`.
pub(super) fn reused<I: PartialEq>(
    before: Option<(&[I], &[String])>,
    at: usize,
    input: &I,
    write: impl FnOnce() -> String,
) -> String {
    before
        .filter(|(inputs, _)| inputs.get(at) == Some(input))
        .and_then(|(_, texts)| texts.get(at).cloned())
        .unwrap_or_else(write)
}
