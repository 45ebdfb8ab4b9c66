//! Edits of a scenario that must keep its parts consistent: removing a lens
//! option keeps the dispenser's choice on the same option (or clears it when
//! the chosen one goes); a removed task can be put back where it was.

use super::model::{Scenario, Task};

impl Scenario {
    /// Removes the lens option at `index` (nothing when there is none), and
    /// keeps `chosen_option` pointing at the same option.
    pub fn remove_option(&mut self, index: usize) {
        if index >= self.options.len() {
            return;
        }
        self.options.remove(index);
        self.chosen_option = match self.chosen_option {
            Some(c) if c == index => None,
            Some(c) if c > index => Some(c - 1),
            other => other,
        };
    }
}

impl Scenario {
    /// Removes the task at `index` and returns it, for an undo; `None` when
    /// there is no such task.
    pub fn remove_task(&mut self, index: usize) -> Option<Task> {
        (index < self.tasks.len()).then(|| self.tasks.remove(index))
    }

    /// Puts `task` back at `index` (at the end when the list is shorter).
    pub fn restore_task(&mut self, index: usize, task: Task) {
        let at = index.min(self.tasks.len());
        self.tasks.insert(at, task);
    }
}

#[cfg(test)]
mod tests {
    use crate::scenario::Scenario;

    #[test]
    fn a_removed_task_goes_back_where_it_was() {
        let mut s = Scenario::untitled();
        s.tasks.push(s.tasks[0].clone());
        s.tasks[1].name = "second".to_string();
        let before = s.clone();
        let removed = s.remove_task(0).expect("a task to remove");
        assert_eq!(s.tasks.len(), 1);
        s.restore_task(0, removed);
        assert_eq!(s, before);
        assert!(s.remove_task(9).is_none());
    }

    #[test]
    fn removing_an_option_keeps_the_choice_on_its_option() {
        let mut s = Scenario::untitled();
        let count = s.options.len();
        assert!(count >= 3, "the starter set has options to remove");
        s.chosen_option = Some(2);
        s.remove_option(0);
        assert_eq!(s.chosen_option, Some(1));
        s.remove_option(1);
        assert_eq!(s.chosen_option, None);
        s.chosen_option = Some(0);
        s.remove_option(99);
        assert_eq!((s.options.len(), s.chosen_option), (count - 2, Some(0)));
    }
}
