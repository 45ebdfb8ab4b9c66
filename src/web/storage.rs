//! The only code that touches the browser's local storage: a
//! [`KeyValueStore`] over `window.localStorage`. Every failure becomes a
//! [`StoreError`] value: a quota error is `Full`, anything else (private
//! mode, storage disabled, no window) is `Unavailable`. Nothing here panics.

use crate::library::{KeyValueStore, StoreError};
use wasm_bindgen::{JsCast, JsValue};

/// Local storage of this origin, reached afresh on every call so that a
/// store taken away while the app runs is reported, not cached.
#[derive(Debug, Clone, Copy, Default)]
pub struct BrowserStore;

fn storage() -> Result<web_sys::Storage, StoreError> {
    web_sys::window()
        .ok_or(StoreError::Unavailable)?
        .local_storage()
        .map_err(|_| StoreError::Unavailable)?
        .ok_or(StoreError::Unavailable)
}

/// Whether a failed write was the browser's quota being exceeded.
fn is_quota_error(error: &JsValue) -> bool {
    error
        .dyn_ref::<web_sys::DomException>()
        .is_some_and(|e| e.name() == "QuotaExceededError" || e.code() == 22)
}

impl KeyValueStore for BrowserStore {
    fn get(&self, key: &str) -> Result<Option<String>, StoreError> {
        storage()?
            .get_item(key)
            .map_err(|_| StoreError::Unavailable)
    }

    fn set(&mut self, key: &str, value: &str) -> Result<(), StoreError> {
        storage()?.set_item(key, value).map_err(|e| {
            if is_quota_error(&e) {
                StoreError::Full
            } else {
                StoreError::Unavailable
            }
        })
    }

    fn remove(&mut self, key: &str) -> Result<(), StoreError> {
        storage()?
            .remove_item(key)
            .map_err(|_| StoreError::Unavailable)
    }

    fn keys(&self) -> Result<Vec<String>, StoreError> {
        let store = storage()?;
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
