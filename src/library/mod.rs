//! The scenario library: many wearers' and workstations' scenarios kept on
//! one device, each under its own storage key so one damaged entry never
//! takes the others down. It owns the versioned saved format, its migration,
//! import and export of files, and the demo scenarios. It is pure: storage is
//! reached only through the [`KeyValueStore`] trait, which the browser
//! adapter implements over local storage; nothing here knows the browser.

pub mod format;
pub mod migrate;
pub mod read;
pub mod store;

pub use format::{
    encode_entry, encode_export, Entry, EntryId, ExportItem, StoredEntry, CURRENT_VERSION,
    ENTRY_FORMAT, EXPORT_FORMAT, SHIPPED_VERSIONS,
};
pub use migrate::{migrate_entry, migrate_export, DocumentItem, ExportDocument, FormatError};
pub use read::{
    check_nesting, parse_limited, read_document, read_document_bytes, read_entry, ReadError,
    MAX_DOCUMENT_BYTES, MAX_NESTING,
};
pub use store::{KeyValueStore, MemoryStore, SharedMemoryStore, StoreError};
