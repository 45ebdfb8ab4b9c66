//! Runtime ids for the rows an editor draws for a scenario: one for the
//! wearer's block, one per task and one per lens option, in list order.
//! They are never saved. An editor keys its rows by them, so a row keeps
//! its own state (text being typed) when another row is removed above it,
//! and a removed row takes its state with it. Opening a scenario, or
//! showing it in another unit, gives every row a fresh id, so no row's
//! state outlives what it was typed for. The edits that change the lists
//! (removing a task or an option, putting a removed task back) change the
//! scenario and its ids together here.

use super::model::{Scenario, Task};

/// The ids of a scenario's rows, and the task removed last (for "put back").
#[derive(Debug, Clone, PartialEq, Default)]
pub struct RowIds {
    wearer: u64,
    tasks: Vec<u64>,
    options: Vec<u64>,
    /// The next id to hand out; ids are never reused within one editor.
    next: u64,
    removed: Option<RemovedTask>,
}

/// A task removed from the list, with its place and id, until it is put
/// back or another task is removed.
#[derive(Debug, Clone, PartialEq)]
struct RemovedTask {
    index: usize,
    id: u64,
    task: Task,
}

impl RowIds {
    /// Ids for the rows of `scenario`.
    pub fn new(scenario: &Scenario) -> Self {
        let mut ids = RowIds::default();
        ids.renew(scenario);
        ids
    }

    /// Gives every row of `scenario` a fresh id (after it was opened, or
    /// shown in another unit) and forgets the removed task.
    pub fn renew(&mut self, scenario: &Scenario) {
        self.wearer = self.fresh();
        self.tasks = (0..scenario.tasks.len()).map(|_| self.fresh()).collect();
        self.options = (0..scenario.options.len()).map(|_| self.fresh()).collect();
        self.removed = None;
    }

    /// Keeps one id per row after an edit that added rows at the end of a
    /// list (or took them from its end): new rows get fresh ids. Returns
    /// whether any id changed.
    pub fn fit(&mut self, scenario: &Scenario) -> bool {
        let before = (self.tasks.len(), self.options.len());
        let mut next = self.next;
        for (ids, len) in [
            (&mut self.tasks, scenario.tasks.len()),
            (&mut self.options, scenario.options.len()),
        ] {
            ids.truncate(len);
            while ids.len() < len {
                ids.push(next);
                next += 1;
            }
        }
        self.next = next;
        before != (self.tasks.len(), self.options.len())
    }

    /// The id of the wearer's block.
    pub fn wearer(&self) -> u64 {
        self.wearer
    }

    /// The ids of the tasks, in list order.
    pub fn tasks(&self) -> &[u64] {
        &self.tasks
    }

    /// The ids of the lens options, in list order.
    pub fn options(&self) -> &[u64] {
        &self.options
    }

    /// Where the task with id `id` stands now (`None`: it is gone).
    pub fn task_index(&self, id: u64) -> Option<usize> {
        self.tasks.iter().position(|&t| t == id)
    }

    /// Where the lens option with id `id` stands now (`None`: it is gone).
    pub fn option_index(&self, id: u64) -> Option<usize> {
        self.options.iter().position(|&o| o == id)
    }

    /// Removes the task with id `id` from `scenario`, keeping it to be put
    /// back (in place of any task removed before). Returns whether it was there.
    pub fn remove_task(&mut self, scenario: &mut Scenario, id: u64) -> bool {
        let Some(index) = self.task_index(id) else {
            return false;
        };
        let Some(task) = scenario.remove_task(index) else {
            return false;
        };
        self.tasks.remove(index);
        self.removed = Some(RemovedTask { index, id, task });
        true
    }

    /// The task removed last, while it can be put back.
    pub fn removed_task(&self) -> Option<&Task> {
        self.removed.as_ref().map(|r| &r.task)
    }

    /// Puts the task removed last back where it stood (at the end when the
    /// list is shorter now), under its old id. Returns where it went.
    pub fn put_back_task(&mut self, scenario: &mut Scenario) -> Option<usize> {
        let removed = self.removed.take()?;
        let at = removed.index.min(scenario.tasks.len());
        scenario.restore_task(at, removed.task);
        self.tasks.insert(at.min(self.tasks.len()), removed.id);
        Some(at)
    }

    /// Removes the lens option with id `id` from `scenario` (the chosen
    /// option follows, see [`Scenario::remove_option`]). Returns whether it was there.
    pub fn remove_option(&mut self, scenario: &mut Scenario, id: u64) -> bool {
        match self.option_index(id) {
            Some(index) if index < scenario.options.len() => {
                scenario.remove_option(index);
                self.options.remove(index);
                true
            }
            _ => false,
        }
    }

    /// A new id.
    fn fresh(&mut self) -> u64 {
        let id = self.next;
        self.next += 1;
        id
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// An untitled scenario with tasks named "1", "2", "3".
    fn three_tasks() -> Scenario {
        let mut s = Scenario::untitled();
        let first = s.tasks[0].clone();
        s.tasks = ["1", "2", "3"]
            .iter()
            .map(|name| Task {
                name: name.to_string(),
                ..first.clone()
            })
            .collect();
        s
    }

    fn task_names(s: &Scenario) -> Vec<&str> {
        s.tasks.iter().map(|t| t.name.as_str()).collect()
    }

    #[test]
    fn removing_a_task_keeps_the_other_rows_ids_and_moves_them_up() {
        let mut s = three_tasks();
        let mut ids = RowIds::new(&s);
        let [first, second, third] = [ids.tasks()[0], ids.tasks()[1], ids.tasks()[2]];
        assert!(ids.remove_task(&mut s, first));
        assert_eq!(task_names(&s), ["2", "3"]);
        assert_eq!(ids.tasks(), [second, third]);
        assert_eq!(ids.task_index(third), Some(1), "task 3 is second now");
        assert_eq!(ids.task_index(first), None);
        assert!(!ids.remove_task(&mut s, first), "gone already");
    }

    #[test]
    fn a_removed_task_is_put_back_in_its_place_under_its_id_once() {
        let mut s = three_tasks();
        let before = s.clone();
        let mut ids = RowIds::new(&s);
        let row_ids = ids.tasks().to_vec();
        assert!(ids.remove_task(&mut s, row_ids[1]));
        assert_eq!(ids.removed_task().map(|t| t.name.as_str()), Some("2"));
        assert_eq!(ids.put_back_task(&mut s), Some(1));
        assert_eq!(s, before);
        assert_eq!(ids.tasks(), row_ids);
        assert_eq!(ids.put_back_task(&mut s), None, "the undo is spent");

        // Only the last removal can be put back.
        assert!(ids.remove_task(&mut s, row_ids[2]));
        assert!(ids.remove_task(&mut s, row_ids[0]));
        assert_eq!(ids.put_back_task(&mut s), Some(0));
        assert_eq!(task_names(&s), ["1", "2"]);
        assert_eq!(ids.tasks(), &row_ids[..2]);
    }

    #[test]
    fn opening_or_a_unit_switch_gives_fresh_ids_and_forgets_the_removed_task() {
        let mut s = three_tasks();
        let mut ids = RowIds::new(&s);
        let old = ids.clone();
        assert!(ids.remove_task(&mut s, old.tasks()[0]));
        ids.renew(&s);
        assert_eq!(ids.removed_task(), None);
        assert_eq!(ids.tasks().len(), 2);
        assert_eq!(ids.options().len(), s.options.len());
        let mut all: Vec<u64> = old.tasks().to_vec();
        all.extend(old.options());
        all.push(old.wearer());
        for id in ids
            .tasks()
            .iter()
            .chain(ids.options())
            .chain([&ids.wearer()])
        {
            assert!(!all.contains(id), "id {id} was used before");
            all.push(*id);
        }
    }

    #[test]
    fn rows_added_at_the_end_get_new_ids_and_the_others_keep_theirs() {
        let mut s = three_tasks();
        let mut ids = RowIds::new(&s);
        let before = ids.clone();
        assert!(!ids.fit(&s), "nothing to fit");
        s.tasks.push(s.tasks[0].clone());
        s.options.pop();
        assert!(ids.fit(&s));
        assert_eq!(ids.tasks()[..3], before.tasks()[..]);
        assert_eq!(ids.tasks().len(), 4);
        assert!(!before.tasks().contains(&ids.tasks()[3]));
        assert!(!before.options().contains(&ids.tasks()[3]));
        assert_eq!(ids.options(), &before.options()[..s.options.len()]);
    }

    #[test]
    fn removing_an_option_keeps_the_others_and_the_choice_on_its_option() {
        let mut s = three_tasks();
        let mut ids = RowIds::new(&s);
        let options = ids.options().to_vec();
        s.chosen_option = Some(2);
        assert!(ids.remove_option(&mut s, options[0]));
        assert_eq!(ids.options(), &options[1..]);
        assert_eq!(s.chosen_option, Some(1));
        assert!(!ids.remove_option(&mut s, options[0]));
    }
}
