//! The one approximate-equality check of the tests: a value within an
//! explicit tolerance of its expected value, failing at the caller's line
//! with both numbers. Compiled into the library's unit tests and, through a
//! `#[path]` module, into the integration tests, so it is written once.

/// Asserts that `actual` lies within `tolerance` of `expected`; `what` names
/// the quantity in the failure message.
#[track_caller]
pub fn close_for(actual: f64, expected: f64, tolerance: f64, what: &str) {
    assert!(
        (actual - expected).abs() <= tolerance,
        "{what}: got {actual}, expected {expected} ± {tolerance}"
    );
}

/// Asserts that `actual` lies within `tolerance` of `expected`.
#[track_caller]
pub fn close(actual: f64, expected: f64, tolerance: f64) {
    close_for(actual, expected, tolerance, "value");
}
