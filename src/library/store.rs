//! The storage boundary: a minimal string key-value store that the browser
//! adapter implements over local storage, and an in-memory implementation
//! for native tests that can simulate full storage, unavailable storage and
//! values written by someone else (another tab, another program, a newer
//! version of the app).

use std::cell::RefCell;
use std::collections::BTreeMap;
use std::fmt;
use std::rc::Rc;

/// Why the store refused an operation.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StoreError {
    /// The store has no room left for this value (the browser's quota is used up).
    Full,
    /// The store cannot be used at all (private browsing, storage disabled by
    /// the browser or by a policy, or the store was taken away).
    Unavailable,
}

impl fmt::Display for StoreError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            StoreError::Full => f.write_str(
                "the browser's storage for this app is full: your work is kept in this tab only; \
                 export your scenarios to a file now, then delete ones you no longer need",
            ),
            StoreError::Unavailable => f.write_str(
                "the browser does not let this app use its storage (private window or storage \
                 turned off): your work is kept in this tab only; export your scenarios to a \
                 file before closing it",
            ),
        }
    }
}

impl std::error::Error for StoreError {}

/// A string key-value store with the semantics of browser local storage:
/// synchronous, shared by every tab of the app, limited in size.
pub trait KeyValueStore {
    /// The value stored under `key`, or `None` if there is none.
    fn get(&self, key: &str) -> Result<Option<String>, StoreError>;
    /// Stores `value` under `key`, replacing any previous value.
    fn set(&mut self, key: &str, value: &str) -> Result<(), StoreError>;
    /// Removes `key`; removing a missing key is not an error.
    fn remove(&mut self, key: &str) -> Result<(), StoreError>;
    /// Every key in the store, the app's own and anyone else's.
    fn keys(&self) -> Result<Vec<String>, StoreError>;
}

/// An in-memory store for tests and for running without any storage.
/// Its capacity counts the bytes of keys plus values, like a browser quota.
#[derive(Debug, Clone, Default)]
pub struct MemoryStore {
    values: BTreeMap<String, String>,
    capacity_bytes: Option<usize>,
    unavailable: bool,
}

impl MemoryStore {
    /// An empty store with no size limit.
    pub fn new() -> Self {
        Self::default()
    }

    /// Limits the store to `bytes` of keys plus values (`None` removes the limit);
    /// a `set` that would exceed it fails with [`StoreError::Full`].
    pub fn set_capacity(&mut self, bytes: Option<usize>) {
        self.capacity_bytes = bytes;
    }

    /// Makes every operation fail with [`StoreError::Unavailable`] (or work again).
    pub fn set_unavailable(&mut self, unavailable: bool) {
        self.unavailable = unavailable;
    }

    /// Writes `value` under `key` directly, bypassing capacity and
    /// availability, as another program or tab would.
    pub fn insert_raw(&mut self, key: &str, value: &str) {
        self.values.insert(key.to_string(), value.to_string());
    }

    /// The value under `key` regardless of availability, for inspection in tests.
    pub fn raw(&self, key: &str) -> Option<&str> {
        self.values.get(key).map(String::as_str)
    }

    /// Bytes used by keys plus values.
    pub fn used_bytes(&self) -> usize {
        self.values.iter().map(|(k, v)| k.len() + v.len()).sum()
    }

    fn check(&self) -> Result<(), StoreError> {
        if self.unavailable {
            Err(StoreError::Unavailable)
        } else {
            Ok(())
        }
    }
}

impl KeyValueStore for MemoryStore {
    fn get(&self, key: &str) -> Result<Option<String>, StoreError> {
        self.check()?;
        Ok(self.values.get(key).cloned())
    }

    fn set(&mut self, key: &str, value: &str) -> Result<(), StoreError> {
        self.check()?;
        if let Some(capacity) = self.capacity_bytes {
            let replaced = self.values.get(key).map_or(0, |old| key.len() + old.len());
            let after = self.used_bytes() - replaced + key.len() + value.len();
            if after > capacity {
                return Err(StoreError::Full);
            }
        }
        self.values.insert(key.to_string(), value.to_string());
        Ok(())
    }

    fn remove(&mut self, key: &str) -> Result<(), StoreError> {
        self.check()?;
        self.values.remove(key);
        Ok(())
    }

    fn keys(&self) -> Result<Vec<String>, StoreError> {
        self.check()?;
        Ok(self.values.keys().cloned().collect())
    }
}

/// One memory store shared by several owners, as local storage is shared by
/// the tabs of a browser: give each simulated tab a clone.
pub type SharedMemoryStore = Rc<RefCell<MemoryStore>>;

/// Shared access never panics: a store that is already borrowed (which the
/// library's single-threaded use never causes) reports itself unavailable.
impl KeyValueStore for SharedMemoryStore {
    fn get(&self, key: &str) -> Result<Option<String>, StoreError> {
        self.try_borrow()
            .map_err(|_| StoreError::Unavailable)?
            .get(key)
    }

    fn set(&mut self, key: &str, value: &str) -> Result<(), StoreError> {
        self.try_borrow_mut()
            .map_err(|_| StoreError::Unavailable)?
            .set(key, value)
    }

    fn remove(&mut self, key: &str) -> Result<(), StoreError> {
        self.try_borrow_mut()
            .map_err(|_| StoreError::Unavailable)?
            .remove(key)
    }

    fn keys(&self) -> Result<Vec<String>, StoreError> {
        self.try_borrow()
            .map_err(|_| StoreError::Unavailable)?
            .keys()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn full_store_refuses_growth_but_allows_shrinking() {
        let mut s = MemoryStore::new();
        s.set_capacity(Some(10));
        assert_eq!(s.set("k", "12345678"), Ok(()));
        assert_eq!(s.set("j", "12345678"), Err(StoreError::Full));
        assert_eq!(
            s.set("k", "1"),
            Ok(()),
            "replacing with a smaller value fits"
        );
        assert_eq!(s.used_bytes(), 2);
    }

    #[test]
    fn unavailable_store_fails_everything_and_keeps_its_values() {
        let mut s = MemoryStore::new();
        s.insert_raw("k", "v");
        s.set_unavailable(true);
        assert_eq!(s.get("k"), Err(StoreError::Unavailable));
        assert_eq!(s.set("k", "w"), Err(StoreError::Unavailable));
        assert_eq!(s.remove("k"), Err(StoreError::Unavailable));
        assert_eq!(s.keys(), Err(StoreError::Unavailable));
        assert_eq!(s.raw("k"), Some("v"));
    }

    #[test]
    fn shared_store_is_seen_by_every_clone() {
        let a: SharedMemoryStore = Rc::new(RefCell::new(MemoryStore::new()));
        let mut b = Rc::clone(&a);
        assert_eq!(b.set("k", "v"), Ok(()));
        assert_eq!(a.get("k"), Ok(Some("v".to_string())));
    }
}
