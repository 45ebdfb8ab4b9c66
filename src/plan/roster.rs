//! Team mode: a roster of workers (CSV, pseudonymous ids, no names) screened
//! against one workstation profile. Each row becomes the workstation's
//! scenario with that worker's age, measured amplitude, distance correction
//! and current addition, and goes through the one scenario gate and
//! [`super::demands::demand_sheet`]. A bad row is reported by its line and
//! field and skipped, never silently; the result counts rows read, used and
//! skipped. The command line and the browser share this reader (csv-core
//! splits the records: quoted commas, CRLF line ends; a byte-order mark is
//! passed over).

use super::demands::{demand_sheet, DemandSheet, Flag, FlagKind};
use crate::scenario::{
    validate, AmplitudeMethod, CurrentGlasses, FamilyChoice, MeasuredAmplitude, Prescription,
    ReferencePlane, Scenario,
};
use csv_core::{ReadRecordResult, Reader};
use serde::Serialize;
use std::collections::HashMap;
use std::fmt;

/// The columns a roster may have, in any order; the first two are required.
pub const COLUMNS: [&str; 5] = [
    "id",
    "age_years",
    "amplitude_d",
    "correction_d",
    "addition_d",
];

/// The longest pseudonymous id, in characters.
pub const MAX_ID_CHARS: usize = 40;

/// The most rows a roster may hold (a product limit that keeps a browser tab responsive).
pub const MAX_ROWS: usize = 20_000;

/// One worker as the roster gives them.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Worker {
    /// Line of the roster the worker was read from (1 is the header).
    pub line: usize,
    /// Pseudonymous id.
    pub id: String,
    /// Age in years.
    pub age_years: f64,
    /// Amplitude of accommodation measured by push-up with the distance
    /// correction worn, in dioptres at the spectacle plane, if measured.
    pub amplitude_d: Option<f64>,
    /// Spherical equivalent of the current distance correction, in dioptres
    /// (none: no distance correction).
    pub correction_d: Option<f64>,
    /// Addition of the current glasses, in dioptres (taken as progressive
    /// lenses; 0 or none with a correction: distance glasses).
    pub addition_d: Option<f64>,
}

/// A row that was skipped, with the line and field at fault.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct RowProblem {
    /// Line of the roster (1 is the header).
    pub line: usize,
    /// The column at fault (empty when it is the row as a whole).
    pub field: String,
    /// What is wrong.
    pub message: String,
}

impl fmt::Display for RowProblem {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        if self.field.is_empty() {
            write!(f, "line {}: {}", self.line, self.message)
        } else {
            write!(f, "line {}, {}: {}", self.line, self.field, self.message)
        }
    }
}

/// A roster read: the workers used and the rows skipped.
#[derive(Debug, Clone, PartialEq, Default, Serialize)]
pub struct Roster {
    /// Data rows read (blank lines not counted).
    pub read: usize,
    /// The workers whose rows were used.
    pub workers: Vec<Worker>,
    /// The rows skipped, each with its reason.
    pub skipped: Vec<RowProblem>,
}

/// Why a roster could not be read at all.
#[derive(Debug, Clone, PartialEq)]
pub enum RosterError {
    /// The file has no header line.
    Empty,
    /// The header names a column the roster does not know.
    UnknownColumn(String),
    /// The header lacks a required column.
    MissingColumn(&'static str),
    /// The header names a column twice.
    DuplicateColumn(String),
    /// More rows than [`MAX_ROWS`].
    TooManyRows,
}

impl fmt::Display for RosterError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let known = COLUMNS.join(", ");
        match self {
            RosterError::Empty => write!(f, "the roster is empty; its first line names the columns ({known})"),
            RosterError::UnknownColumn(c) => write!(
                f,
                "line 1: the roster has a column \"{c}\" that clearspan does not know (known: {known}); \
                 names of people are not asked for"
            ),
            RosterError::MissingColumn(c) => write!(f, "line 1: the roster needs a column \"{c}\""),
            RosterError::DuplicateColumn(c) => write!(f, "line 1: the column \"{c}\" appears twice"),
            RosterError::TooManyRows => write!(f, "the roster holds more than {MAX_ROWS} rows"),
        }
    }
}

impl std::error::Error for RosterError {}

/// The records of `text`, each with the line it starts on; blank lines
/// are passed over and a byte-order mark at the start is ignored. The
/// buffers grow as a long field or a wide row needs.
fn records(text: &str) -> Vec<(usize, Vec<String>)> {
    // Line ends are made LF first, so that every record ends on the line
    // feed the reader counts (a CR alone would end a record uncounted).
    let text = text.strip_prefix('\u{feff}').unwrap_or(text);
    let text = text.replace("\r\n", "\n").replace('\r', "\n");
    let mut input = text.as_bytes();
    let mut reader = Reader::new();
    let mut out = Vec::new();
    let (mut bytes, mut ends) = (vec![0u8; 1024], vec![0usize; 16]);
    let (mut used, mut n_ends) = (0, 0);
    loop {
        let (result, read, written, ended) =
            reader.read_record(input, &mut bytes[used..], &mut ends[n_ends..]);
        let ended_on_line_feed = read > 0 && input.get(read - 1) == Some(&b'\n');
        input = &input[read..];
        used += written;
        n_ends += ended;
        match result {
            ReadRecordResult::InputEmpty => {}
            ReadRecordResult::OutputFull => bytes.resize(bytes.len() * 2, 0),
            ReadRecordResult::OutputEndsFull => ends.resize(ends.len() * 2, 0),
            ReadRecordResult::Record => {
                // The line the record starts on: the reader's count after
                // it, less its own line feed and those inside quoted fields.
                let inside = bytes[..used].iter().filter(|&&b| b == b'\n').count();
                let after = usize::try_from(reader.line()).unwrap_or(usize::MAX);
                let line = after
                    .saturating_sub(usize::from(ended_on_line_feed))
                    .saturating_sub(inside);
                let mut start = 0;
                let record: Vec<String> = ends[..n_ends]
                    .iter()
                    .map(|&end| {
                        let field = String::from_utf8_lossy(&bytes[start..end]).into_owned();
                        start = end;
                        field
                    })
                    .collect();
                if record.iter().any(|f| !f.trim().is_empty()) {
                    out.push((line, record));
                }
                (used, n_ends) = (0, 0);
            }
            ReadRecordResult::End => break,
        }
    }
    out
}

/// Reads `text` as a roster. The header line names the columns
/// ([`COLUMNS`], any order; `id` and `age_years` required). Each row is
/// checked field by field; a bad row is skipped with its line and field.
pub fn read_roster(text: &str) -> Result<Roster, RosterError> {
    let mut rows = records(text).into_iter();
    let (_, header) = rows.next().ok_or(RosterError::Empty)?;
    let mut index = [None; COLUMNS.len()];
    for (position, name) in header.iter().enumerate() {
        let name = name.trim();
        let Some(column) = COLUMNS.iter().position(|c| c.eq_ignore_ascii_case(name)) else {
            return Err(RosterError::UnknownColumn(name.to_string()));
        };
        if index[column].replace(position).is_some() {
            return Err(RosterError::DuplicateColumn(name.to_string()));
        }
    }
    for required in [0, 1] {
        if index[required].is_none() {
            return Err(RosterError::MissingColumn(COLUMNS[required]));
        }
    }
    let mut roster = Roster::default();
    for (line, record) in rows {
        roster.read += 1;
        if roster.read > MAX_ROWS {
            return Err(RosterError::TooManyRows);
        }
        match worker(line, &record, &index, header.len()) {
            Ok(w) => roster.workers.push(w),
            Err(p) => roster.skipped.push(p),
        }
    }
    Ok(roster)
}

/// One row as a worker, or the first problem found in it.
fn worker(
    line: usize,
    record: &[String],
    index: &[Option<usize>; COLUMNS.len()],
    width: usize,
) -> Result<Worker, RowProblem> {
    let problem = |field: &str, message: String| RowProblem {
        line,
        field: field.to_string(),
        message,
    };
    if record.len() > width {
        return Err(problem(
            "",
            format!(
                "{} fields where the header names {width}; a comma inside a value needs quotes",
                record.len()
            ),
        ));
    }
    let cell = |column: usize| -> Option<&str> {
        index[column]
            .and_then(|i| record.get(i))
            .map(|s| s.trim())
            .filter(|s| !s.is_empty())
    };
    let number = |column: usize| -> Result<Option<f64>, RowProblem> {
        match cell(column) {
            None => Ok(None),
            Some(text) => match text.parse::<f64>() {
                Ok(v) if v.is_finite() => Ok(Some(v)),
                _ => Err(problem(
                    COLUMNS[column],
                    format!("\"{text}\" is not a number"),
                )),
            },
        }
    };
    let id = cell(0).ok_or_else(|| problem("id", "missing".to_string()))?;
    if id.chars().count() > MAX_ID_CHARS {
        return Err(problem(
            "id",
            format!("longer than {MAX_ID_CHARS} characters; use a short pseudonymous id"),
        ));
    }
    let age_years = number(1)?.ok_or_else(|| problem("age_years", "missing".to_string()))?;
    Ok(Worker {
        line,
        id: id.to_string(),
        age_years,
        amplitude_d: number(2)?,
        correction_d: number(3)?,
        addition_d: number(4)?,
    })
}

/// The workstation `station` with `w` as its wearer: age, a push-up
/// amplitude at the spectacle plane if measured, a spherical distance
/// correction (none: plano), and current glasses from the correction and
/// addition (progressive when an addition is given, otherwise distance
/// glasses; none when neither is given).
pub fn worker_scenario(station: &Scenario, w: &Worker) -> Scenario {
    let mut s = station.clone();
    s.name = w.id.clone();
    s.wearer.age_years = w.age_years;
    s.wearer.measured_amplitude = w.amplitude_d.map(|dioptres| MeasuredAmplitude {
        dioptres,
        method: AmplitudeMethod::PushUp,
        plane: ReferencePlane::Spectacle,
    });
    let rx = Prescription {
        sphere_d: w.correction_d.unwrap_or(0.0),
        cylinder_d: 0.0,
        axis_deg: 0.0,
        prism: Default::default(),
    };
    s.wearer.right = rx;
    s.wearer.left = rx;
    s.current_glasses = match (w.correction_d, w.addition_d) {
        (_, Some(a)) if a > 0.0 => Some(CurrentGlasses {
            label: format!("progressive lenses, addition {:+.2} D", a),
            family: FamilyChoice::Progressive {
                addition_d: Some(a),
                progression_length_mm: None,
            },
        }),
        (None, None) => None,
        _ => Some(CurrentGlasses {
            label: "distance glasses".to_string(),
            family: FamilyChoice::SingleVision {
                addition_d: w.addition_d.or(Some(0.0)),
            },
        }),
    };
    s
}

/// The column of a roster row that a scenario field path belongs to.
fn column_of(path: &str) -> &'static str {
    if path.starts_with("wearer.age_years") {
        "age_years"
    } else if path.starts_with("wearer.measured_amplitude") {
        "amplitude_d"
    } else if path.starts_with("wearer.right") || path.starts_with("wearer.left") {
        "correction_d"
    } else if path.starts_with("current_glasses") {
        "addition_d"
    } else {
        ""
    }
}

/// One worker's screening.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Screened {
    /// The worker.
    pub worker: Worker,
    /// The sheet.
    pub sheet: DemandSheet,
}

/// A team screened: the sheets of the workers used, and every row skipped
/// (by the reader or by the scenario gate).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct TeamResult {
    /// Data rows read.
    pub read: usize,
    /// Rows used.
    pub used: usize,
    /// Rows skipped, with their reasons.
    pub skipped: Vec<RowProblem>,
    /// The sheets, in roster order.
    pub workers: Vec<Screened>,
}

/// One worker's sheet at `station`, or the problems that skip the row
/// (their line is set by the caller).
fn screen_worker(station: &Scenario, w: &Worker) -> Result<DemandSheet, Vec<RowProblem>> {
    let valid = validate(worker_scenario(station, w)).map_err(|errors| {
        errors
            .into_iter()
            .map(|e| RowProblem {
                line: w.line,
                field: column_of(&e.path).to_string(),
                message: e.problem.to_string(),
            })
            .collect::<Vec<_>>()
    })?;
    demand_sheet(&valid).map_err(|e| {
        vec![RowProblem {
            line: w.line,
            field: String::new(),
            message: e.to_string(),
        }]
    })
}

/// Screens every worker of `roster` at `station`. A row whose values the
/// scenario gate refuses (an age out of range) is skipped with its line
/// and column; one the planner cannot handle is skipped with its message.
pub fn screen_team(station: &Scenario, roster: Roster) -> TeamResult {
    let mut skipped = roster.skipped;
    let mut workers = Vec::with_capacity(roster.workers.len());
    // Workers with the same figures get the same sheet: each distinct set
    // of figures is screened once (a team repeats ages and corrections).
    let mut screened: HashMap<[Option<u64>; 4], Result<DemandSheet, Vec<RowProblem>>> =
        HashMap::new();
    for w in roster.workers {
        let key = [
            Some(w.age_years.to_bits()),
            w.amplitude_d.map(f64::to_bits),
            w.correction_d.map(f64::to_bits),
            w.addition_d.map(f64::to_bits),
        ];
        let outcome = screened
            .entry(key)
            .or_insert_with(|| screen_worker(station, &w));
        match outcome {
            Ok(sheet) => {
                let mut sheet = sheet.clone();
                sheet.scenario_name = w.id.clone();
                workers.push(Screened { worker: w, sheet });
            }
            Err(problems) => skipped.extend(problems.iter().map(|p| RowProblem {
                line: w.line,
                ..p.clone()
            })),
        }
    }
    skipped.sort_by_key(|p| p.line);
    let lines_skipped = {
        let mut lines: Vec<usize> = skipped.iter().map(|p| p.line).collect();
        lines.dedup();
        lines.len()
    };
    TeamResult {
        read: roster.read,
        used: roster.read - lines_skipped,
        skipped,
        workers,
    }
}

impl TeamResult {
    /// "12 rows read, 10 used, 2 skipped".
    pub fn counts(&self) -> String {
        format!(
            "{} rows read, {} used, {} skipped",
            self.read,
            self.used,
            self.read - self.used
        )
    }

    /// The team table as CSV: one line per worker and task, with the flag
    /// and its reasons and advice in words (quoted as RFC 4180 asks).
    pub fn to_csv(&self) -> String {
        let mut out = String::from("id,task,flag,needs_d,has_d,reasons,advice\r\n");
        for s in &self.workers {
            for t in &s.sheet.tasks {
                let reasons: Vec<String> = t.flag.reasons().iter().map(|r| r.to_string()).collect();
                let row = [
                    s.worker.id.clone(),
                    t.task.name.clone(),
                    t.flag.kind().words().to_string(),
                    format!("{:.2}", t.accommodation_needed.0.max(0.0)),
                    format!("{:.2}", t.accommodation_comfortable.0),
                    reasons.join("; "),
                    advice(&t.flag),
                ];
                let cells: Vec<String> = row.iter().map(|c| quoted(c)).collect();
                out.push_str(&cells.join(","));
                out.push_str("\r\n");
            }
        }
        out
    }

    /// The team table for a terminal: one line per worker with the most
    /// serious flag, then each task that is not fine with what it needs.
    /// Ids and task names are as written: a terminal front end makes
    /// their control characters visible.
    pub fn render_table(&self) -> String {
        let mut out = format!("{}\n", self.counts());
        for (kind, n) in self.tally() {
            out.push_str(&format!("  {n:>6}  {}\n", kind.words()));
        }
        out.push('\n');
        for s in &self.workers {
            out.push_str(&format!(
                "{:<16} {}\n",
                s.worker.id,
                s.sheet.worst_flag().words()
            ));
            for t in s.sheet.tasks.iter().filter(|t| t.flag != Flag::Fine) {
                let reasons: Vec<String> = t.flag.reasons().iter().map(|r| r.to_string()).collect();
                out.push_str(&format!(
                    "    {}: {} ({}); {}\n",
                    t.task.name,
                    t.flag.kind().words(),
                    reasons.join("; "),
                    advice(&t.flag)
                ));
            }
        }
        out.trim_end().to_string()
    }

    /// How many workers have each flag as their most serious one.
    pub fn tally(&self) -> [(FlagKind, usize); 4] {
        let mut tally = [
            (FlagKind::Fine, 0),
            (FlagKind::WorkstationChange, 0),
            (FlagKind::TaskEyewear, 0),
            (FlagKind::Refer, 0),
        ];
        for s in &self.workers {
            let worst = s.sheet.worst_flag();
            if let Some(entry) = tally.iter_mut().find(|(k, _)| *k == worst) {
                entry.1 += 1;
            }
        }
        tally
    }
}

/// What a flag asks for, in words.
pub fn advice(flag: &Flag) -> String {
    match flag {
        Flag::Fine => String::new(),
        Flag::WorkstationChange { changes, .. } => changes
            .iter()
            .map(|c| c.to_string())
            .collect::<Vec<_>>()
            .join("; "),
        Flag::TaskEyewear { addition, .. } => format!(
            "discuss task glasses with an eye-care practitioner (a single-vision lens about {} \
             over the distance correction served it in this plan)",
            addition
        ),
        Flag::Refer { .. } => "refer for an eye examination".to_string(),
    }
}

/// `cell` as a CSV field: quoted when it holds a comma, a quote or a line
/// end, with quotes doubled; a leading `=`, `+`, `-` or `@` is prefixed
/// with an apostrophe so a spreadsheet does not run it as a formula.
fn quoted(cell: &str) -> String {
    let safe = if cell.starts_with(['=', '+', '-', '@']) && cell.parse::<f64>().is_err() {
        format!("'{cell}")
    } else {
        cell.to_string()
    };
    if safe.contains([',', '"', '\n', '\r']) {
        format!("\"{}\"", safe.replace('"', "\"\""))
    } else {
        safe
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn workers_with_the_same_figures_share_a_sheet_but_keep_their_ids_and_lines() {
        let station = crate::scenario::Scenario::untitled();
        let text = "id,age_years,amplitude_d,correction_d,addition_d\n\
                    W-1,52,,-1.50,1.25\n\
                    W-2,52,,-1.50,1.25\n\
                    W-3,300,,,\n\
                    W-4,300,,,\n";
        let team = screen_team(&station, read_roster(text).expect("readable"));
        assert_eq!(team.workers.len(), 2);
        let (a, b) = (&team.workers[0], &team.workers[1]);
        assert_eq!(
            (
                a.sheet.scenario_name.as_str(),
                b.sheet.scenario_name.as_str()
            ),
            ("W-1", "W-2")
        );
        assert_eq!(a.sheet.tasks, b.sheet.tasks);
        let lines: Vec<usize> = team.skipped.iter().map(|p| p.line).collect();
        assert_eq!(lines, [4, 5], "each refused row is named by its own line");
    }

    /// The problems of `text` as "line, field" pairs.
    fn skipped(text: &str) -> Vec<(usize, String)> {
        let roster = read_roster(text).expect("a readable header");
        roster
            .skipped
            .iter()
            .map(|p| (p.line, p.field.clone()))
            .collect()
    }

    #[test]
    fn a_clean_roster_with_bom_crlf_and_quotes_reads_every_row() {
        // RFC 4180: CRLF line ends, a quoted field may hold a comma.
        let text = "\u{feff}id,age_years,amplitude_d,correction_d,addition_d\r\n\
                    W-001,52,,-1.5,1.25\r\n\"W,002\",38,6.5,,\r\n\r\nW-003,61,,,2\r\n";
        let roster = read_roster(text).expect("reads");
        assert_eq!(roster.read, 3);
        assert!(roster.skipped.is_empty(), "{:?}", roster.skipped);
        let ids: Vec<&str> = roster.workers.iter().map(|w| w.id.as_str()).collect();
        assert_eq!(ids, ["W-001", "W,002", "W-003"]);
        assert_eq!(
            roster.workers[2].line, 5,
            "the blank line 4 still counts as a line"
        );
        assert_eq!(roster.workers[0].correction_d, Some(-1.5));
        assert_eq!(roster.workers[1].amplitude_d, Some(6.5));
        assert_eq!(roster.workers[1].addition_d, None);
    }

    #[test]
    fn bad_rows_are_named_by_line_and_field_and_skipped() {
        let text = "id,age_years,addition_d\n\
                    W-1,forty,\n\
                    ,50,1\n\
                    W-3,50,1,extra\n\
                    W-4\n\
                    W-5,55,1.5\n";
        assert_eq!(
            skipped(text),
            [
                (2, "age_years".to_string()),
                (3, "id".to_string()),
                (4, String::new()),
                (5, "age_years".to_string()),
            ]
        );
        let roster = read_roster(text).expect("reads");
        assert_eq!((roster.read, roster.workers.len()), (5, 1));
        assert_eq!(
            roster.skipped[0].to_string(),
            "line 2, age_years: \"forty\" is not a number"
        );
    }

    #[test]
    fn a_header_that_asks_for_names_or_lacks_a_column_is_refused() {
        assert_eq!(
            read_roster("id,name,age_years\n"),
            Err(RosterError::UnknownColumn("name".to_string()))
        );
        assert_eq!(
            read_roster("id,amplitude_d\n"),
            Err(RosterError::MissingColumn("age_years"))
        );
        assert_eq!(read_roster(""), Err(RosterError::Empty));
    }

    #[test]
    fn spreadsheet_formulas_and_quotes_are_neutralised_on_export() {
        assert_eq!(quoted("=SUM(A1)"), "'=SUM(A1)");
        assert_eq!(quoted("-0.50"), "-0.50");
        assert_eq!(quoted("a, \"b\""), "\"a, \"\"b\"\"\"");
    }
}
