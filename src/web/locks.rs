//! Writes to local storage take turns across every tab of the app. Local
//! storage is shared by the tabs but not updated atomically between them,
//! so two tabs that check and write at the same instant could both pass
//! their check. [`with_write_lock`] runs a write while this tab holds the
//! app's lock of the Web Locks API (`navigator.locks`), which the browser
//! grants to one tab at a time. Where the API is missing (an older browser,
//! a page that is not a secure context) the write runs at once; the library
//! still finds a lost update afterwards, when the browser reports the other
//! tab's write, and shows the conflict.

use js_sys::{Function, Promise, Reflect};
use std::cell::RefCell;
use std::rc::Rc;
use wasm_bindgen::prelude::*;
use wasm_bindgen_futures::JsFuture;

/// The name of the lock every tab of the app takes to write.
const WRITE_LOCK: &str = "clearspan/storage-writes";

/// A write waiting for the lock; taken out once by whichever path runs it.
type Pending = Rc<RefCell<Option<Box<dyn FnOnce()>>>>;

/// Runs the waiting write, if no other path ran it already.
fn run(pending: &Pending) {
    let write = pending.borrow_mut().take();
    if let Some(write) = write {
        write();
    }
}

/// `navigator.locks` and its `request` function, where the browser has them.
fn lock_manager() -> Option<(JsValue, Function)> {
    let navigator = web_sys::window()?.navigator();
    let locks = Reflect::get(&navigator, &"locks".into()).ok()?;
    if !locks.is_object() {
        return None;
    }
    let request = Reflect::get(&locks, &"request".into()).ok()?;
    Some((locks, request.dyn_into().ok()?))
}

/// Runs `write` while this tab holds the app's write lock (at once where
/// there is no Web Locks API). Writes of one tab run in the order asked;
/// if the browser refuses the lock, the write runs anyway rather than never.
pub fn with_write_lock(write: impl FnOnce() + 'static) {
    let pending: Pending = Rc::new(RefCell::new(Some(Box::new(write))));
    let Some((locks, request)) = lock_manager() else {
        run(&pending);
        return;
    };
    let granted = {
        let pending = Rc::clone(&pending);
        Closure::once_into_js(move |_lock: JsValue| {
            run(&pending);
            JsValue::UNDEFINED
        })
    };
    match request.call2(&locks, &WRITE_LOCK.into(), &granted) {
        Ok(answer) => {
            let done = JsFuture::from(Promise::resolve(&answer));
            leptos::task::spawn_local(async move {
                if done.await.is_err() {
                    run(&pending);
                }
            });
        }
        Err(_) => run(&pending),
    }
}
