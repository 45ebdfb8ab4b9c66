//! The only code that touches the browser's local storage: a
//! [`KeyValueStore`] over `window.localStorage`, reached through
//! gloo-storage's [`LocalStorage`]. gloo's accessors throw when storage is
//! unavailable (a private window, storage blocked by a setting or a policy),
//! so [`BrowserStore::probe`] first asks `web_sys` once whether there is a
//! storage at all; without one, every call answers
//! [`StoreError::Unavailable`] and gloo is never asked. Only the raw handle
//! is taken from gloo: its typed `get`/`set` would wrap every value in JSON
//! once more, and the saved format is stored as it is. Every failure becomes
//! a [`StoreError`] value: a quota error is `Full`, anything else
//! `Unavailable`. Nothing here panics.

use crate::library::{KeyValueStore, StoreError};
use gloo_storage::{LocalStorage, Storage};
use wasm_bindgen::{JsCast, JsValue};

/// Local storage of this origin, if the browser gave access to it at start.
#[derive(Debug, Clone, Copy)]
pub struct BrowserStore {
    /// Why storage cannot be used (`None`: it was there when probed).
    missing: Option<StoreError>,
}

impl BrowserStore {
    /// Asks the browser once, through `web_sys`, whether this page may use
    /// local storage; later calls only reach gloo's handle when it may.
    pub fn probe() -> Self {
        let available = web_sys::window()
            .and_then(|w| w.local_storage().ok().flatten())
            .is_some();
        BrowserStore {
            missing: (!available).then_some(StoreError::Unavailable),
        }
    }

    /// The storage handle, or why there is none.
    fn storage(&self) -> Result<web_sys::Storage, StoreError> {
        match self.missing {
            Some(e) => Err(e),
            None => Ok(LocalStorage::raw()),
        }
    }
}

/// Whether a failed write was the browser's quota being exceeded.
fn is_quota_error(error: &JsValue) -> bool {
    error
        .dyn_ref::<web_sys::DomException>()
        .is_some_and(|e| e.name() == "QuotaExceededError" || e.code() == 22)
}

impl KeyValueStore for BrowserStore {
    fn get(&self, key: &str) -> Result<Option<String>, StoreError> {
        self.storage()?
            .get_item(key)
            .map_err(|_| StoreError::Unavailable)
    }

    fn set(&mut self, key: &str, value: &str) -> Result<(), StoreError> {
        self.storage()?.set_item(key, value).map_err(|e| {
            if is_quota_error(&e) {
                StoreError::Full
            } else {
                StoreError::Unavailable
            }
        })
    }

    fn remove(&mut self, key: &str) -> Result<(), StoreError> {
        self.storage()?
            .remove_item(key)
            .map_err(|_| StoreError::Unavailable)
    }

    fn keys(&self) -> Result<Vec<String>, StoreError> {
        let store = self.storage()?;
        let count = store.length().map_err(|_| StoreError::Unavailable)?;
        let mut keys = Vec::with_capacity(count as usize);
        for i in 0..count {
            if let Some(key) = store.key(i).map_err(|_| StoreError::Unavailable)? {
                keys.push(key);
            }
        }
        Ok(keys)
    }
}
