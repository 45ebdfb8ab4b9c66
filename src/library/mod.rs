//! The scenario library: many wearers' and workstations' scenarios kept on
//! one device, each under its own storage key so one damaged entry never
//! takes the others down. It owns the versioned saved format, its migration,
//! import and export of files, the demo scenarios, and one tab's
//! [`Session`] (open entry, notices, conflicts). It is pure: storage is
//! reached only through the [`KeyValueStore`] trait, which the browser
//! adapter implements over local storage; nothing here knows the browser.

mod bare;
mod collection;
pub mod demos;
mod field_path;
pub mod format;
pub mod migrate;
mod naming;
mod notice;
pub mod read;
mod report;
mod session;
mod status;
pub mod store;
mod sync;
mod transfer;
mod unknown;

pub use bare::{read_bare_scenario, BareScenario};
pub use collection::{id_for_key, key_for, Library, APP_PREFIX, SCENARIO_PREFIX};
pub use demos::{DemoFile, DEMO_FILES};
pub use format::{
    encode_entry, encode_export, Entry, EntryId, ExportItem, StoredEntry, CURRENT_VERSION,
    ENTRY_FORMAT, EXPORT_FORMAT, SHIPPED_VERSIONS,
};
pub use migrate::{migrate_entry, migrate_export, DocumentItem, ExportDocument, FormatError};
pub use naming::unique_name;
pub use notice::{Notice, NoticeAction, NOTICE_LIST_LINES};
pub use read::{
    check_nesting, document_text, parse_limited, read_document, read_document_bytes, read_entry,
    ReadError, MAX_DOCUMENT_BYTES, MAX_NESTING,
};
pub use report::{
    Conflict, EntryProblem, LibraryError, LoadReport, Persisted, SetAside, Summary, Theirs,
};
pub use session::{Session, Started};
pub use status::{SaveStatus, Unsaved};
pub use store::{KeyValueStore, MemoryStore, SharedMemoryStore, StoreError};
pub use sync::Reloaded;
pub use transfer::{
    parse_import, parse_import_bytes, parse_import_value, ImportBatch, ImportReport, Imported,
    RejectedItem,
};

#[cfg(test)]
mod fuzz;
#[cfg(test)]
mod tests;
