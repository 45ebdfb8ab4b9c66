//! Names that never clash: an imported or duplicated scenario whose name is
//! already taken gets the first free "name (2)", "name (3)", ... so no
//! scenario is ever overwritten or confused with another by name.

use crate::scenario::MAX_NAME_CHARS;

/// The name a scenario is given when it takes a generic one because its own is empty.
const UNNAMED: &str = "Unnamed scenario";

/// `wanted` if no name in `taken` equals it (ignoring case and surrounding
/// space), else the first free `"root (n)"`, n = 2, 3, ..., where `root` is
/// `wanted` without any " (n)" suffix of its own; the result never exceeds
/// [`MAX_NAME_CHARS`] characters.
///
/// ```
/// use clearspan::library::unique_name;
/// assert_eq!(unique_name("Bench", ["bench", "Bench (2)"]), "Bench (3)");
/// ```
pub fn unique_name<'a>(wanted: &str, taken: impl IntoIterator<Item = &'a str>) -> String {
    let taken: Vec<String> = taken.into_iter().map(normal).collect();
    let is_free = |name: &str| !taken.contains(&normal(name));
    if is_free(wanted) {
        return wanted.to_string();
    }
    let root = match strip_counter(wanted.trim()) {
        "" => UNNAMED,
        root => root,
    };
    (2u64..)
        .map(|n| {
            let suffix = format!(" ({n})");
            let room = MAX_NAME_CHARS.saturating_sub(suffix.chars().count());
            let cut: String = root.chars().take(room).collect();
            format!("{}{suffix}", cut.trim_end())
        })
        .find(|candidate| is_free(candidate))
        .unwrap_or_else(|| UNNAMED.to_string())
}

fn normal(name: &str) -> String {
    name.trim().to_lowercase()
}

/// `name` without a trailing " (n)" counter.
fn strip_counter(name: &str) -> &str {
    let Some(body) = name.strip_suffix(')') else {
        return name;
    };
    match body.rsplit_once(" (") {
        Some((root, digits))
            if !digits.is_empty() && digits.bytes().all(|b| b.is_ascii_digit()) =>
        {
            root
        }
        _ => name,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn check(wanted: &str, taken: &[&str], expected: &str) {
        assert_eq!(
            unique_name(wanted, taken.iter().copied()),
            expected,
            "{wanted:?} among {taken:?}"
        );
    }

    #[test]
    fn clashing_names_get_the_first_free_counter() {
        check("Bench", &[], "Bench");
        check("Bench", &["Office"], "Bench");
        check("Bench", &["bench "], "Bench (2)");
        check("Bench", &["Bench", "Bench (2)"], "Bench (3)");
        check("Bench (2)", &["Bench", "Bench (2)"], "Bench (3)");
        check("Bench (x)", &["Bench (x)"], "Bench (x) (2)");
        check("", &[""], "Unnamed scenario (2)");
        check("(2)", &["(2)"], "(2) (2)");
    }

    #[test]
    fn long_names_are_cut_to_fit_the_counter() {
        let long = "x".repeat(MAX_NAME_CHARS);
        let named = unique_name(&long, [long.as_str()]);
        assert_eq!(named.chars().count(), MAX_NAME_CHARS);
        assert!(named.ends_with("x (2)"), "{named}");
    }
}
