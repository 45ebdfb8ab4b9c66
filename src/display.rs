//! Conversion between stored quantities and what the user reads and types:
//! distances in centimetres or inches, powers with explicit signs. The core
//! stores metres; units change only here, at the interface.

use crate::core::units::Metres;
use crate::scenario::fields::Unit;
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
        return Err(ParseNumberError("enter a number".to_string()));
    }
    match cleaned.parse::<f64>() {
        Ok(v) if v.is_finite() => Ok(v),
        _ => Err(ParseNumberError(format!(
            "\"{}\" is not a number",
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

/// A field problem restated for a form as a sentence, for a field stored in
/// `unit`: ranges of lengths are given in the user's length system, each
/// bound in the unit that reads best (centimetres below a metre and metres
/// above it, or inches below a yard and feet above it), shares as
/// percentages; large numbers carry thousands separators.
pub fn describe_problem(problem: &Problem, unit: Unit, length: LengthUnit) -> String {
    match problem {
        Problem::OutOfRange { min, max, .. } if unit == Unit::Metres => format!(
            "Must be between {} and {}.",
            readable_length(*min, length),
            readable_length(*max, length)
        ),
        Problem::OutOfRange { min, max, .. } => {
            let u = shown_symbol(unit, length);
            let space = if u.is_empty() || u == "°" { "" } else { " " };
            let shown = |v: f64| readable_number(to_shown(unit, length, v), 2);
            format!(
                "Must be between {}{space}{u} and {}{space}{u}.",
                shown(*min),
                shown(*max)
            )
        }
        Problem::Empty => "Must not be empty.".to_string(),
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
            assert_eq!(describe_problem(&p, unit, length), text)
        };
        use LengthUnit::{Centimetres, Inches};
        check(
            range(0.1, 1000.0, "m"),
            Unit::Metres,
            Centimetres,
            "Must be between 10 cm and 1,000 m.",
        );
        check(
            range(0.1, 2.54, "m"),
            Unit::Metres,
            Inches,
            "Must be between 3.9 in and 8.3 ft.",
        );
        check(
            range(20.0, 45.0, "mm"),
            Unit::Millimetres,
            Inches,
            "Must be between 20 mm and 45 mm.",
        );
        check(
            range(-80.0, 80.0, "°"),
            Unit::Degrees,
            Inches,
            "Must be between -80° and 80°.",
        );
        // A share is typed as a percentage, so its range is given as one
        // (it was given as the stored ratio, 0.2 to 1, beside a % field).
        check(
            range(0.2, 1.0, ""),
            Unit::Share,
            Centimetres,
            "Must be between 20 % and 100 %.",
        );
        check(
            Problem::Empty,
            Unit::Ratio,
            Centimetres,
            "Must not be empty.",
        );
    }
}
