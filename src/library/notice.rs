//! Notices: what a [`super::Session`] tells the user about the library (a
//! storage refusal, a deletion that can be undone, an import's summary), as
//! plain values the app draws in its notice bar. Each notice carries an id
//! for as long as it is shown, at most one action, and an optional list.

/// How many lines the list behind an import notice holds; the rest are counted.
pub const NOTICE_LIST_LINES: usize = 200;

/// A message for the user, with an optional action and an optional list.
#[derive(Debug, Clone, PartialEq)]
pub struct Notice {
    /// Identifies the notice while it is shown (lists are keyed by it);
    /// unique within one session.
    pub id: u64,
    /// The words shown.
    pub text: String,
    /// Whether something went wrong (shown as a warning) or is information.
    pub warning: bool,
    /// A button offered with the notice.
    pub action: Option<NoticeAction>,
    /// Lines the user can open under the notice (empty: none).
    pub details: Vec<String>,
    /// How many further lines exist beyond `details`.
    pub more: usize,
}

/// Buttons a notice can carry.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum NoticeAction {
    /// Restore the scenario just deleted.
    UndoDelete,
    /// Save every scenario to a file (offered when storage refuses work).
    ExportAll,
}

/// The notices waiting for the user, newest last, with the next free id.
#[derive(Debug, Clone, Default)]
pub(super) struct Notices {
    shown: Vec<Notice>,
    next_id: u64,
}

impl Notices {
    /// The notices, oldest first.
    pub(super) fn all(&self) -> &[Notice] {
        &self.shown
    }

    /// Adds a notice with a list behind it (`details`, and `more` lines not listed).
    pub(super) fn push(
        &mut self,
        text: String,
        warning: bool,
        action: Option<NoticeAction>,
        details: Vec<String>,
        more: usize,
    ) {
        let id = self.next_id;
        self.next_id = self.next_id.wrapping_add(1);
        self.shown.push(Notice {
            id,
            text,
            warning,
            action,
            details,
            more,
        });
    }

    /// Adds a notice without a list.
    pub(super) fn tell(&mut self, text: String, warning: bool, action: Option<NoticeAction>) {
        self.push(text, warning, action, Vec::new(), 0);
    }

    /// Adds a notice unless one with the same words is already shown, so a
    /// fault met on every keystroke is said once.
    pub(super) fn tell_once(&mut self, text: String, warning: bool, action: Option<NoticeAction>) {
        if !self.shown.iter().any(|n| n.text == text) {
            self.tell(text, warning, action);
        }
    }

    /// Removes the notice `id` (nothing when it is gone already).
    pub(super) fn dismiss(&mut self, id: u64) {
        self.shown.retain(|n| n.id != id);
    }
}
