//! Conversion between stored quantities and what the user reads and types:
//! distances in centimetres or inches, powers with explicit signs. The core
//! stores metres; units change only here, at the interface.

use crate::core::clear_range::{FarLimit, ZoneRange};
use crate::core::units::Metres;
use crate::scenario::fields::{self, Unit};
use crate::scenario::Problem;
use serde::{Deserialize, Serialize};

/// The unit the user reads and types task distances and sizes in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum LengthUnit {
    /// Centimetres (1 cm = 0.01 m).
    #[default]
    Centimetres,
    /// Inches (1 in = 0.0254 m exactly, by the 1959 international yard and pound agreement).
    Inches,
}

/// Metres in one inch, exact by definition (international yard and pound agreement, 1959).
const METRES_PER_INCH: f64 = 0.0254;

impl LengthUnit {
    /// Metres in one of this unit.
    pub fn metres_per_unit(self) -> f64 {
        match self {
            LengthUnit::Centimetres => 0.01,
            LengthUnit::Inches => METRES_PER_INCH,
        }
    }

    /// The unit's short symbol for labels ("cm", "in").
    pub fn symbol(self) -> &'static str {
        match self {
            LengthUnit::Centimetres => "cm",
            LengthUnit::Inches => "in",
        }
    }

    /// A length in metres expressed in this unit.
    pub fn from_metres(self, length: Metres) -> f64 {
        length.0 / self.metres_per_unit()
    }

    /// A length given in this unit, in metres.
    pub fn to_metres(self, value: f64) -> Metres {
        Metres(value * self.metres_per_unit())
    }

    /// A length written for a form field in this unit, with at most one decimal
    /// and no trailing zeros ("60", "23.6").
    pub fn format(self, length: Metres) -> String {
        trim_number(self.from_metres(length), 1)
    }
}

/// `value` with at most `decimals` decimals and no trailing zeros or sign on zero.
pub fn trim_number(value: f64, decimals: usize) -> String {
    let text = format!("{value:.decimals$}");
    let text = if text.contains('.') {
        text.trim_end_matches('0').trim_end_matches('.').to_string()
    } else {
        text
    };
    if text == "-0" {
        "0".to_string()
    } else {
        text
    }
}

/// Why a typed number was not accepted.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct ParseNumberError(pub String);

impl std::fmt::Display for ParseNumberError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(&self.0)
    }
}

impl std::error::Error for ParseNumberError {}

/// Reads a number typed by a user: surrounding spaces, a leading '+', and a
/// decimal comma are accepted; anything else that is not a finite number is
/// refused with a message saying so.
pub fn parse_number(text: &str) -> Result<f64, ParseNumberError> {
    let cleaned = text.trim().replace(',', ".");
    let cleaned = cleaned.strip_prefix('+').unwrap_or(&cleaned);
    if cleaned.is_empty() {
        return Err(ParseNumberError(
            "Enter a number: the field is empty.".to_string(),
        ));
    }
    match cleaned.parse::<f64>() {
        Ok(v) if v.is_finite() => Ok(v),
        _ => Err(ParseNumberError(format!(
            "\"{}\" is not a number: type digits, with a point or a comma before any decimals.",
            text.trim()
        ))),
    }
}

/// A stored value of a field in `unit` as the form shows it: lengths in the
/// user's length unit, shares as percentages, everything else as stored.
pub fn to_shown(unit: Unit, length: LengthUnit, stored: f64) -> f64 {
    match unit {
        Unit::Metres => length.from_metres(Metres(stored)),
        Unit::Share => stored * 100.0,
        _ => stored,
    }
}

/// A value typed into a field in `unit` as it is stored (the inverse of [`to_shown`]).
pub fn to_stored(unit: Unit, length: LengthUnit, shown: f64) -> f64 {
    match unit {
        Unit::Metres => length.to_metres(shown).0,
        Unit::Share => shown / 100.0,
        _ => shown,
    }
}

/// The unit symbol written after a field in `unit` ("cm", "%", "D").
pub fn shown_symbol(unit: Unit, length: LengthUnit) -> &'static str {
    match unit {
        Unit::Metres => length.symbol(),
        Unit::Share => "%",
        other => other.symbol(),
    }
}

/// A field problem restated as a full sentence naming the field by its
/// `label` ("Distance must be between 10 cm and 1,000 m."), for a field
/// stored in `unit`: ranges of lengths are given in the user's length
/// system, each bound in the unit that reads best (centimetres below a
/// metre and metres above it, or inches below a yard and feet above it),
/// shares as percentages; large numbers carry thousands separators. A
/// label's explanation in brackets ("Gaze angle (up +, down −)") is left
/// out of the sentence.
pub fn describe_problem(problem: &Problem, label: &str, unit: Unit, length: LengthUnit) -> String {
    let subject = label.split(" (").next().unwrap_or(label);
    match problem {
        Problem::OutOfRange { min, max, .. } => format!(
            "{subject} must be between {} and {}.",
            shown_value(*min, unit, length),
            shown_value(*max, unit, length)
        ),
        Problem::Empty => format!("{subject} must not be empty."),
        Problem::NotANumber => format!("{subject} must be a number."),
        Problem::TooLong(max) => format!(
            "{subject} must not be longer than {} characters.",
            thousands(*max)
        ),
        other => {
            let text = other.to_string();
            let mut chars = text.chars();
            match chars.next() {
                Some(first) => format!("{}{}.", first.to_uppercase(), chars.as_str()),
                None => text,
            }
        }
    }
}

/// A stored value of a field in `unit` written with its unit, as a person
/// reads it: lengths in the user's system in the unit that reads best,
/// shares as percentages, thousands separated ("1,000 m", "20 %", "-80°").
pub fn shown_value(stored: f64, unit: Unit, length: LengthUnit) -> String {
    if unit == Unit::Metres {
        return readable_length(stored, length);
    }
    let symbol = shown_symbol(unit, length);
    let number = readable_number(to_shown(unit, length, stored), 2);
    match symbol {
        "" => number,
        "°" => format!("{number}°"),
        _ => format!("{number} {symbol}"),
    }
}

/// A problem the scenario gate found at `path` (a saved file's field path,
/// such as `tasks[0].distance_m`) as a sentence: a number field's problem
/// names the field by its label, gives the range in metric units and the
/// value found; any other problem is its own words.
pub fn problem_at_path(path: &str, problem: &Problem) -> String {
    let field = fields::all().find(|f| {
        let index = path
            .split_once('[')
            .and_then(|(_, rest)| rest.split_once(']'))
            .and_then(|(i, _)| i.parse::<usize>().ok());
        [Some(0), Some(1), index]
            .into_iter()
            .flatten()
            .any(|i| f.path(i) == path)
    });
    match (field, problem) {
        (Some(f), Problem::OutOfRange { value, .. }) => format!(
            "{} The file gives {}.",
            describe_problem(problem, f.label, f.unit, LengthUnit::Centimetres),
            shown_value(*value, f.unit, LengthUnit::Centimetres)
        ),
        (Some(f), _) => describe_problem(problem, f.label, f.unit, LengthUnit::Centimetres),
        (None, _) => problem.to_string(),
    }
}

/// A length of `metres` in the user's system, in the unit that reads best.
fn readable_length(metres: f64, unit: LengthUnit) -> String {
    match unit {
        LengthUnit::Centimetres if metres.abs() >= 1.0 => {
            format!("{} m", readable_number(metres, 1))
        }
        LengthUnit::Centimetres => format!("{} cm", readable_number(metres * 100.0, 1)),
        LengthUnit::Inches => {
            let inches = unit.from_metres(Metres(metres));
            if inches.abs() >= 36.0 {
                format!("{} ft", readable_number(inches / 12.0, 1))
            } else {
                format!("{} in", readable_number(inches, 1))
            }
        }
    }
}

/// A distance measured or planned, in metric units as people read them:
/// whole centimetres below a metre, metres with one decimal from a metre
/// on, thousands separated ("48 cm", "5.9 m", "1,000 m"), never a plus sign.
///
/// ```
/// use clearspan::display::metric_length;
/// assert_eq!(metric_length(0.483), "48 cm");
/// assert_eq!(metric_length(5.92), "5.9 m");
/// assert_eq!(metric_length(1000.0), "1,000 m");
/// ```
pub fn metric_length(metres: f64) -> String {
    if (metres * 100.0).round().abs() >= 100.0 {
        format!("{} m", readable_number(metres, 1))
    } else {
        format!("{} cm", readable_number(metres * 100.0, 0))
    }
}

/// A point on the lens, in millimetres from the fitting point (x positive
/// towards the nose, y positive upwards), written as coordinates: a minus
/// sign where the point lies temporal or below, no plus sign ("1.2, -4.6 mm").
///
/// ```
/// use clearspan::display::lens_point_words;
/// assert_eq!(lens_point_words(1.23, -4.56), "1.2, -4.6 mm");
/// assert_eq!(lens_point_words(-0.04, 2.0), "0.0, 2.0 mm");
/// ```
pub fn lens_point_words(x_mm: f64, y_mm: f64) -> String {
    // Rounded first so that a point a hair left of the centre reads 0.0, not -0.0.
    let tenth = |v: f64| (v * 10.0).round() / 10.0 + 0.0;
    format!("{:.1}, {:.1} mm", tenth(x_mm), tenth(y_mm))
}

/// A zone's range of clear vision in words: "48 cm to 5.9 m", "63 cm to
/// infinity", or why nothing is clear.
pub fn zone_range_words(range: &ZoneRange) -> String {
    match range {
        ZoneRange::Clear { near, far } => {
            let far = match far {
                FarLimit::Finite(m) => metric_length(m.0),
                FarLimit::Infinite => "infinity".to_string(),
            };
            format!("{} to {far}", metric_length(near.0))
        }
        other => other.to_string(),
    }
}

/// A number with at most `decimals` decimals and thousands separators.
///
/// ```
/// use clearspan::display::readable_number;
/// assert_eq!(readable_number(100_000.0, 1), "100,000");
/// assert_eq!(readable_number(-1234.5, 1), "-1,234.5");
/// assert_eq!(readable_number(0.25, 2), "0.25");
/// ```
pub fn readable_number(value: f64, decimals: usize) -> String {
    let text = trim_number(value, decimals);
    let (sign, rest) = text
        .strip_prefix('-')
        .map_or(("", text.as_str()), |r| ("-", r));
    let (whole, fraction) = rest
        .split_once('.')
        .map_or((rest, None), |(w, f)| (w, Some(f)));
    let grouped = whole
        .parse::<usize>()
        .map_or_else(|_| whole.to_string(), thousands);
    match fraction {
        Some(f) => format!("{sign}{grouped}.{f}"),
        None => format!("{sign}{grouped}"),
    }
}

/// A count as people read it, with a comma between thousands.
///
/// ```
/// use clearspan::display::thousands;
/// assert_eq!(thousands(100_000), "100,000");
/// assert_eq!(thousands(999), "999");
/// assert_eq!(thousands(1_234_567), "1,234,567");
/// ```
pub fn thousands(n: usize) -> String {
    let digits = n.to_string();
    let mut out = String::with_capacity(digits.len() + digits.len() / 3);
    for (i, c) in digits.chars().enumerate() {
        if i > 0 && (digits.len() - i) % 3 == 0 {
            out.push(',');
        }
        out.push(c);
    }
    out
}

/// A download file name made from a scenario name: lower-case letters,
/// digits and dashes only, at most 60 of them, never empty.
pub fn file_name_for(name: &str) -> String {
    let stem: String = name
        .chars()
        .map(|c| {
            if c.is_alphanumeric() {
                c.to_ascii_lowercase()
            } else {
                '-'
            }
        })
        .collect();
    let stem: String = stem.trim_matches('-').chars().take(60).collect();
    let stem = if stem.is_empty() {
        "scenario".to_string()
    } else {
        stem
    };
    format!("clearspan-{stem}.json")
}

/// `text` with every control character replaced by a visible stand-in, so a
/// user's name can be written to a terminal without moving the cursor,
/// changing colours or starting a new line: the C0 controls (U+0000 to
/// U+001F) and delete become their control pictures (U+2400 to U+241F and
/// U+2421, such as ␛ for escape and ␊ for a line feed), the C1 controls
/// (U+0080 to U+009F, which have no pictures) the replacement character �.
/// Each character stays one character, so a length checked on the name
/// still holds.
///
/// ```
/// use clearspan::display::printable;
/// assert_eq!(printable("a\u{1b}[2Jb\n"), "a␛[2Jb␊");
/// ```
pub fn printable(text: &str) -> String {
    text.chars()
        .map(|c| match u32::from(c) {
            code @ 0x00..=0x1f => {
                char::from_u32(0x2400 + code).unwrap_or(char::REPLACEMENT_CHARACTER)
            }
            0x7f => '\u{2421}',
            0x80..=0x9f => char::REPLACEMENT_CHARACTER,
            _ => c,
        })
        .collect()
}

/// Abbreviated month names, January first.
const MONTHS: [&str; 12] = [
    "Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec",
];

/// The proleptic Gregorian date (year, month 1 to 12, day 1 to 31) of the
/// day `days` after 1 January 1970 (the inverse of H. Hinnant's
/// `days_from_civil`, "chrono-Compatible Low-Level Date Algorithms").
fn civil_from_days(days: i64) -> (i64, usize, i64) {
    let z = days + 719_468;
    let era = z.div_euclid(146_097);
    let day_of_era = z.rem_euclid(146_097);
    let year_of_era =
        (day_of_era - day_of_era / 1460 + day_of_era / 36_524 - day_of_era / 146_096) / 365;
    let day_of_year = day_of_era - (365 * year_of_era + year_of_era / 4 - year_of_era / 100);
    let month_from_march = (5 * day_of_year + 2) / 153;
    let day = day_of_year - (153 * month_from_march + 2) / 5 + 1;
    let month = if month_from_march < 10 {
        month_from_march + 3
    } else {
        month_from_march - 9
    };
    let year = year_of_era + era * 400 + i64::from(month <= 2);
    (year, month as usize, day)
}

/// The local date and time of the instant `utc_ms` (milliseconds since
/// 1970-01-01 00:00 UTC) where the clock is `ahead_min` minutes ahead of
/// UTC: the day, the date as "3 Dec 2026" and the time as "14:05".
fn local_date_time(utc_ms: f64, ahead_min: f64) -> (String, String) {
    let minutes = ((utc_ms / 60_000.0).floor() + ahead_min.round()) as i64;
    let (year, month, day) = civil_from_days(minutes.div_euclid(1440));
    let of_day = minutes.rem_euclid(1440);
    let month = MONTHS.get(month - 1).copied().unwrap_or("");
    (
        format!("{day} {month} {year}"),
        format!("{:02}:{:02}", of_day / 60, of_day % 60),
    )
}

/// The local date of the instant `utc_ms` (milliseconds since 1970-01-01
/// UTC) on a clock `ahead_min` minutes ahead of UTC, as "3 Dec 2026": the
/// month in words, so no reader takes the day for the month.
pub fn date_words(utc_ms: f64, ahead_min: f64) -> String {
    local_date_time(utc_ms, ahead_min).0
}

/// The local date and time of the instant `utc_ms`, as [`date_words`]
/// with the time on a 24-hour clock: "3 Dec 2026, 14:05".
pub fn date_time_words(utc_ms: f64, ahead_min: f64) -> String {
    let (date, time) = local_date_time(utc_ms, ahead_min);
    format!("{date}, {time}")
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn control_characters_become_visible_one_for_one() {
        // Stand-ins from the Unicode Control Pictures block (U+2400 to U+243F).
        let raw = "Bench\u{0}\t\r\n\u{7}\u{7f}\u{9b}31m é";
        let shown = printable(raw);
        assert_eq!(shown, "Bench␀␉␍␊␇␡\u{fffd}31m é");
        assert_eq!(shown.chars().count(), raw.chars().count());
        assert!(!shown.chars().any(char::is_control));
        assert_eq!(printable("Plain name (2)"), "Plain name (2)");
    }

    #[test]
    fn inches_and_centimetres_convert_exactly() {
        // 1 in = 2.54 cm exactly (international yard and pound agreement, 1959).
        let d = LengthUnit::Inches.to_metres(10.0);
        assert!((d.0 - 0.254).abs() < 1e-12);
        assert!((LengthUnit::Centimetres.from_metres(d) - 25.4).abs() < 1e-9);
        assert_eq!(LengthUnit::Inches.format(Metres(0.6)), "23.6");
        assert_eq!(LengthUnit::Centimetres.format(Metres(0.6)), "60");
    }

    #[test]
    fn typed_numbers() {
        let check = |text: &str, expected: Option<f64>| {
            assert_eq!(parse_number(text).ok(), expected, "input {text:?}");
        };
        check(" 60 ", Some(60.0));
        check("+1.25", Some(1.25));
        check("-0,5", Some(-0.5));
        check("", None);
        check("NaN", None);
        check("inf", None);
        check("12 cm", None);
        assert_eq!(trim_number(-0.01, 1), "0");
    }

    #[test]
    fn download_names_are_safe() {
        assert_eq!(
            file_name_for("Demo: office / two screens"),
            "clearspan-demo--office---two-screens.json"
        );
        assert_eq!(file_name_for("///"), "clearspan-scenario.json");
    }

    #[test]
    fn problems_are_restated_in_the_users_unit() {
        let range = |min, max, unit| Problem::OutOfRange {
            value: 0.0,
            min,
            max,
            unit,
        };
        let check = |p: Problem, unit, length, text: &str| {
            assert_eq!(describe_problem(&p, "Value", unit, length), text)
        };
        use LengthUnit::{Centimetres, Inches};
        check(
            range(0.1, 1000.0, "m"),
            Unit::Metres,
            Centimetres,
            "Value must be between 10 cm and 1,000 m.",
        );
        check(
            range(0.1, 2.54, "m"),
            Unit::Metres,
            Inches,
            "Value must be between 3.9 in and 8.3 ft.",
        );
        check(
            range(20.0, 45.0, "mm"),
            Unit::Millimetres,
            Inches,
            "Value must be between 20 mm and 45 mm.",
        );
        check(
            range(-80.0, 80.0, "°"),
            Unit::Degrees,
            Inches,
            "Value must be between -80° and 80°.",
        );
        // A share is typed as a percentage, so its range is given as one
        // (it was given as the stored ratio, 0.2 to 1, beside a % field).
        check(
            range(0.2, 1.0, ""),
            Unit::Share,
            Centimetres,
            "Value must be between 20 % and 100 %.",
        );
        check(
            Problem::Empty,
            Unit::Ratio,
            Centimetres,
            "Value must not be empty.",
        );
    }

    #[test]
    fn a_problem_names_its_field_in_a_full_sentence() {
        // Rule (issue 14, point 9): a validation message is a full sentence
        // naming the field, its range in readable units and, for a file,
        // the value found.
        let distance = Problem::OutOfRange {
            value: -3.0,
            min: 0.1,
            max: 1000.0,
            unit: "m",
        };
        assert_eq!(
            describe_problem(&distance, "Distance", Unit::Metres, LengthUnit::Centimetres),
            "Distance must be between 10 cm and 1,000 m."
        );
        assert_eq!(
            problem_at_path("tasks[3].distance_m", &distance),
            "Distance must be between 10 cm and 1,000 m. The file gives -3 m."
        );
        let gaze = Problem::OutOfRange {
            value: 95.0,
            min: -80.0,
            max: 80.0,
            unit: "°",
        };
        let label = crate::scenario::fields::all()
            .find(|f| f.key == "vertical.degrees")
            .map_or("", |f| f.label);
        assert!(
            label.contains('('),
            "the gaze label explains its sign: {label}"
        );
        assert_eq!(
            describe_problem(&gaze, label, Unit::Degrees, LengthUnit::Centimetres),
            "Gaze angle must be between -80° and 80°."
        );
        assert_eq!(
            problem_at_path("wearer.left.sphere_d", &Problem::NotANumber),
            "Sphere must be a number."
        );
        assert_eq!(
            problem_at_path("name", &Problem::Empty),
            "must not be empty"
        );
        for text in [
            parse_number("").unwrap_err().0,
            parse_number("abc").unwrap_err().0,
        ] {
            assert!(text.ends_with('.'), "a sentence: {text}");
            assert!(
                text.chars().next().is_some_and(|c| !c.is_lowercase()),
                "{text}"
            );
        }
    }

    // Expected values from GNU coreutils `date -u -d @SECONDS "+%-d %b %Y, %H:%M"`
    // (and `TZ=Europe/Paris date -d @1796340600` for the clock an hour ahead).
    #[test]
    fn dates_and_times_agree_with_gnu_date() {
        let cases = [
            (0.0, 0.0, "1 Jan 1970, 00:00"),
            (951_782_400_000.0, 0.0, "29 Feb 2000, 00:00"),
            (-86_400_000.0, 0.0, "31 Dec 1969, 00:00"),
            (1_798_761_600_000.0, 0.0, "1 Jan 2027, 00:00"),
            (1_796_340_600_000.0, 0.0, "3 Dec 2026, 23:30"),
            (1_796_340_600_000.0, 60.0, "4 Dec 2026, 00:30"),
            (4_107_542_399_000.0, 0.0, "28 Feb 2100, 23:59"),
        ];
        for (ms, ahead, words) in cases {
            assert_eq!(
                date_time_words(ms, ahead),
                words,
                "{ms} ms, {ahead} min ahead"
            );
        }
        assert_eq!(date_words(1_796_340_600_000.0, 60.0), "4 Dec 2026");
    }
}
