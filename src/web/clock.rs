//! The device's clock: the time now, and a moment as a local date (and
//! time) in words. The words are made by `display::date_words` from the
//! device's offset from UTC rather than by the browser's locale formatting,
//! whose first use loads locale data (measured: about 38 ms of the first
//! visit, before the plan was on screen).

use crate::display::{date_time_words, date_words};

/// The milliseconds since the Unix epoch, from the browser clock.
pub fn now_ms() -> u64 {
    js_sys::Date::now().max(0.0) as u64
}

/// How many minutes the device's clock is ahead of UTC at the moment `ms`
/// (milliseconds since the Unix epoch).
fn minutes_ahead(ms: f64) -> f64 {
    -js_sys::Date::new(&ms.into()).get_timezone_offset()
}

/// Today's local date, as "3 Dec 2026".
pub fn today() -> String {
    let now = js_sys::Date::now();
    date_words(now, minutes_ahead(now))
}

/// The local date and time of the moment `ms` (milliseconds since the Unix
/// epoch), as "3 Dec 2026, 14:05".
pub fn when(ms: u64) -> String {
    let ms = ms as f64;
    date_time_words(ms, minutes_ahead(ms))
}
