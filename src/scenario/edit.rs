//! Edits of a scenario that must keep its parts consistent: removing a lens
//! option keeps the dispenser's choice on the same option (or clears it when
//! the chosen one goes).

use super::model::Scenario;

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

#[cfg(test)]
mod tests {
    use crate::scenario::Scenario;

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
