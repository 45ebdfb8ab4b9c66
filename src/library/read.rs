//! Reading untrusted text: a file the user picked or a value found in
//! storage. The text is checked against a size cap and a nesting cap before
//! any parsing (so a deeply nested document cannot exhaust the stack), parsed
//! as JSON, then handed to the migration.

use super::format::StoredEntry;
use super::migrate::{migrate_entry, migrate_export, ExportDocument, FormatError};
use serde_json::Value;
use std::fmt;

/// The largest document accepted, in bytes (2 MiB: hundreds of scenarios).
pub const MAX_DOCUMENT_BYTES: usize = 2 * 1024 * 1024;
/// The deepest nesting of brackets accepted. clearspan's own documents nest
/// at most 7 deep; serde_json's own recursion limit is 128.
pub const MAX_NESTING: usize = 32;

/// Why a text could not be read as a clearspan document.
#[derive(Debug, Clone, PartialEq)]
pub enum ReadError {
    /// The text is empty or only white space.
    Empty,
    /// The text is longer than [`MAX_DOCUMENT_BYTES`].
    TooLarge {
        /// Its length, in bytes.
        bytes: usize,
    },
    /// Brackets nest deeper than [`MAX_NESTING`].
    TooDeep {
        /// Byte offset of the first bracket past the limit.
        at_byte: usize,
    },
    /// The bytes are not UTF-8 text.
    NotText,
    /// The text is not well-formed JSON.
    NotJson {
        /// The parser's description, with line and column.
        detail: String,
    },
    /// The JSON is not a readable clearspan document.
    Format(FormatError),
}

impl fmt::Display for ReadError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            ReadError::Empty => {
                f.write_str("the file is empty; choose a file exported from clearspan")
            }
            ReadError::TooLarge { bytes } => write!(
                f,
                "the file is {:.1} MiB, more than the {} MiB allowed; export fewer scenarios per \
                 file",
                *bytes as f64 / (1024.0 * 1024.0),
                MAX_DOCUMENT_BYTES / (1024 * 1024)
            ),
            ReadError::TooDeep { at_byte } => write!(
                f,
                "the file nests brackets more than {MAX_NESTING} levels deep (at byte \
                 {at_byte}); clearspan files never do, so it is not a clearspan file"
            ),
            ReadError::NotText => f.write_str(
                "the file is not text (UTF-8); choose a .json file exported from clearspan",
            ),
            ReadError::NotJson { detail } => write!(
                f,
                "the file is not valid JSON ({detail}); it may be damaged or not a clearspan file"
            ),
            ReadError::Format(e) => e.fmt(f),
        }
    }
}

impl std::error::Error for ReadError {}

impl From<FormatError> for ReadError {
    fn from(e: FormatError) -> Self {
        ReadError::Format(e)
    }
}

/// Checks that no bracket nests deeper than [`MAX_NESTING`], scanning the raw
/// bytes (brackets inside JSON strings do not count).
///
/// ```
/// use clearspan::library::{check_nesting, MAX_NESTING};
/// assert!(check_nesting(br#"{"a": ["[[[["]}"#).is_ok());
/// assert!(check_nesting("[".repeat(MAX_NESTING + 1).as_bytes()).is_err());
/// ```
pub fn check_nesting(bytes: &[u8]) -> Result<(), ReadError> {
    let mut depth = 0usize;
    let mut in_string = false;
    let mut escaped = false;
    for (i, &b) in bytes.iter().enumerate() {
        if in_string {
            if escaped {
                escaped = false;
            } else if b == b'\\' {
                escaped = true;
            } else if b == b'"' {
                in_string = false;
            }
            continue;
        }
        match b {
            b'"' => in_string = true,
            b'[' | b'{' => {
                depth += 1;
                if depth > MAX_NESTING {
                    return Err(ReadError::TooDeep { at_byte: i });
                }
            }
            b']' | b'}' => depth = depth.saturating_sub(1),
            _ => {}
        }
    }
    Ok(())
}

/// The UTF-8 byte-order mark some editors put at the start of a text file.
const BYTE_ORDER_MARK: char = '\u{feff}';

/// Parses untrusted text into JSON after the size and nesting checks. A
/// byte-order mark at the start is passed over, as browsers do when they
/// decode a file.
pub fn parse_limited(text: &str) -> Result<Value, ReadError> {
    if text.len() > MAX_DOCUMENT_BYTES {
        return Err(ReadError::TooLarge { bytes: text.len() });
    }
    let text = text.strip_prefix(BYTE_ORDER_MARK).unwrap_or(text);
    if text.trim().is_empty() {
        return Err(ReadError::Empty);
    }
    check_nesting(text.as_bytes())?;
    serde_json::from_str(text).map_err(|e| ReadError::NotJson {
        detail: e.to_string(),
    })
}

/// Reads the text stored under an entry's key.
pub fn read_entry(text: &str) -> Result<StoredEntry, ReadError> {
    Ok(migrate_entry(&parse_limited(text)?)?)
}

/// Reads an export file (or a single stored entry) from text.
pub fn read_document(text: &str) -> Result<ExportDocument, ReadError> {
    Ok(migrate_export(&parse_limited(text)?)?)
}

/// A file's raw bytes as text, checking the size before decoding them as UTF-8.
pub fn document_text(bytes: &[u8]) -> Result<&str, ReadError> {
    if bytes.len() > MAX_DOCUMENT_BYTES {
        return Err(ReadError::TooLarge { bytes: bytes.len() });
    }
    std::str::from_utf8(bytes).map_err(|_| ReadError::NotText)
}

/// Reads an export file from raw bytes (see [`document_text`]).
pub fn read_document_bytes(bytes: &[u8]) -> Result<ExportDocument, ReadError> {
    read_document(document_text(bytes)?)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Nesting check on hand-made texts: `ok` says whether it passes.
    fn check(text: &str, ok: bool) {
        assert_eq!(check_nesting(text.as_bytes()).is_ok(), ok, "{text:.60}");
    }

    #[test]
    fn nesting_is_counted_outside_strings_only() {
        check(&"[".repeat(MAX_NESTING), true);
        check(&"[".repeat(MAX_NESTING + 1), false);
        check(&format!("\"{}\"", "[".repeat(1000)), true);
        check(&format!("\"\\\"{}\"", "{".repeat(1000)), true);
        check(&"[]".repeat(1000), true);
        check(&"]".repeat(1000), true);
    }

    #[test]
    fn over_deep_document_is_refused_before_parsing() {
        // A million brackets would overflow a naive recursive parser's stack.
        let deep = "[".repeat(1_000_000);
        let err = read_document(&deep).unwrap_err();
        assert_eq!(
            err,
            ReadError::TooDeep {
                at_byte: MAX_NESTING
            }
        );
        assert!(
            err.to_string().contains("more than 32 levels deep"),
            "{err}"
        );
    }

    #[test]
    fn over_size_document_is_refused_before_parsing() {
        let big = format!("\"{}\"", "x".repeat(MAX_DOCUMENT_BYTES));
        let err = read_document(&big).unwrap_err();
        assert_eq!(
            err,
            ReadError::TooLarge {
                bytes: MAX_DOCUMENT_BYTES + 2
            }
        );
        assert!(
            err.to_string()
                .contains("2.0 MiB, more than the 2 MiB allowed"),
            "{err}"
        );
        let err = read_document_bytes(big.as_bytes()).unwrap_err();
        assert!(matches!(err, ReadError::TooLarge { .. }));
    }

    #[test]
    fn a_byte_order_mark_at_the_start_is_passed_over() {
        // EF BB BF: U+FEFF, the byte-order mark, in UTF-8 (Unicode Standard, 23.8 "Specials").
        let with_mark = b"\xEF\xBB\xBF{\"format\": \"clearspan-scenario-export\", \"version\": 1, \"scenarios\": []}";
        let doc = read_document_bytes(with_mark).expect("the mark is passed over");
        assert!(doc.items.is_empty());
        assert_eq!(parse_limited("\u{feff}[1]"), Ok(serde_json::json!([1])));
        // Only at the start: elsewhere it is not white space to JSON.
        assert!(matches!(
            parse_limited("[1]\u{feff}"),
            Err(ReadError::NotJson { .. })
        ));
        assert_eq!(parse_limited("\u{feff}"), Err(ReadError::Empty));
    }

    #[test]
    fn empty_non_text_and_non_json_inputs_say_so() {
        let cases: [(&[u8], &str); 4] = [
            (b"", "the file is empty"),
            (b"  \n", "the file is empty"),
            (&[0xff, 0xfe, 0x00], "not text (UTF-8)"),
            (b"{\"format\": ", "not valid JSON (EOF while parsing"),
        ];
        for (bytes, expected) in cases {
            let message = read_document_bytes(bytes).unwrap_err().to_string();
            assert!(message.contains(expected), "{message}");
        }
    }
}
