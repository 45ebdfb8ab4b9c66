//! Writing HTML and SVG text: elements opened and closed in order, every
//! text and attribute value escaped on the way in, so a task named
//! `<b>` or `"x" & y` shows as typed and can never become markup.

/// HTML (or inline SVG) being written, element by element.
#[derive(Debug, Default)]
pub struct Html {
    out: String,
}

/// Writes `text` with `&`, `<` and `>` escaped, and `"` too when `quote`
/// (inside a double-quoted attribute value). The runs between those
/// characters are copied whole.
fn escape_into(out: &mut String, text: &str, quote: bool) {
    let mut copied = 0;
    for (at, byte) in text.bytes().enumerate() {
        let reference = match byte {
            b'&' => "&amp;",
            b'<' => "&lt;",
            b'>' => "&gt;",
            b'"' if quote => "&quot;",
            _ => continue,
        };
        // The four characters are ASCII: `at` is on a character boundary.
        out.push_str(&text[copied..at]);
        out.push_str(reference);
        copied = at + 1;
    }
    out.push_str(&text[copied..]);
}

/// An SVG coordinate or length as written in an attribute: the shortest
/// decimal that reads back as the same number ("270", "12.5").
pub fn number(value: f64) -> String {
    value.to_string()
}

impl Html {
    /// Nothing written yet.
    pub fn new() -> Html {
        Html::default()
    }

    fn start_tag(&mut self, tag: &str, attributes: &[(&str, &str)]) {
        self.out.push('<');
        self.out.push_str(tag);
        for (name, value) in attributes {
            self.out.push(' ');
            self.out.push_str(name);
            self.out.push_str("=\"");
            escape_into(&mut self.out, value, true);
            self.out.push('"');
        }
    }

    /// Opens element `tag` with `attributes` (name, value; values escaped).
    pub fn open(&mut self, tag: &str, attributes: &[(&str, &str)]) -> &mut Html {
        self.start_tag(tag, attributes);
        self.out.push('>');
        self
    }

    /// Closes element `tag`.
    pub fn close(&mut self, tag: &str) -> &mut Html {
        self.out.push_str("</");
        self.out.push_str(tag);
        self.out.push('>');
        self
    }

    /// Writes `text`, escaped.
    pub fn text(&mut self, text: &str) -> &mut Html {
        escape_into(&mut self.out, text, false);
        self
    }

    /// Writes element `tag` with `attributes` holding only `text`.
    pub fn element(&mut self, tag: &str, attributes: &[(&str, &str)], text: &str) -> &mut Html {
        self.open(tag, attributes).text(text).close(tag)
    }

    /// Writes an SVG element `tag` without content (`<rect ... />`).
    pub fn shape(&mut self, tag: &str, attributes: &[(&str, &str)]) -> &mut Html {
        self.start_tag(tag, attributes);
        self.out.push_str("/>");
        self
    }

    /// Writes a table's head row: one column header per name, each
    /// scoped to its column for screen readers.
    pub fn column_row(&mut self, names: &[&str]) -> &mut Html {
        self.open("tr", &[]);
        for name in names {
            self.element("th", &[("scope", "col")], name);
        }
        self.close("tr")
    }

    /// Writes a table's head (`<thead>`) holding its [`Html::column_row`].
    pub fn column_heads(&mut self, names: &[&str]) -> &mut Html {
        self.open("thead", &[]).column_row(names).close("thead")
    }

    /// The text written.
    pub fn finish(self) -> String {
        self.out
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // The characters HTML gives meaning to in text (`&`, `<`) and in a
    // double-quoted attribute value (`&`, `"`): WHATWG HTML Living
    // Standard, 13.1.2.3 "Attributes" and 13.1.2.6 "Restrictions on the
    // contents of raw text and escapable raw text elements"; the named
    // references `&amp;`, `&lt;`, `&gt;`, `&quot;` are from its table of
    // named character references (13.5).
    #[test]
    fn text_and_attributes_are_escaped() {
        let mut html = Html::new();
        html.element("td", &[("title", "a \"b\" & <c>")], "<b>x</b> & 'y'");
        assert_eq!(
            html.finish(),
            "<td title=\"a &quot;b&quot; &amp; &lt;c&gt;\">&lt;b&gt;x&lt;/b&gt; &amp; 'y'</td>"
        );
    }

    #[test]
    fn letters_of_any_script_beside_escaped_characters_are_kept_whole() {
        let mut html = Html::new();
        html.element("td", &[("title", "Ø\"é")], "ü<Δ>&—");
        assert_eq!(
            html.finish(),
            "<td title=\"Ø&quot;é\">ü&lt;Δ&gt;&amp;—</td>"
        );
    }

    #[test]
    fn elements_nest_in_the_order_written() {
        let mut html = Html::new();
        html.open("g", &[("class", "p")])
            .shape("circle", &[("r", &number(5.0))])
            .element("text", &[], "1")
            .close("g");
        assert_eq!(
            html.finish(),
            "<g class=\"p\"><circle r=\"5\"/><text>1</text></g>"
        );
    }

    #[test]
    fn numbers_are_written_shortest() {
        assert_eq!(number(270.0), "270");
        assert_eq!(number(12.5), "12.5");
        assert_eq!(number(-0.5), "-0.5");
    }
}
