//! Checks the architecture invariants written in DEVELOPERS.md by reading the
//! source tree: the pure core knows nothing of the browser, only the web
//! layer's storage adapter touches local storage, and every file says what
//! it is responsible for.

use std::fs;
use std::path::{Path, PathBuf};

/// Every `.rs` file below `dir`, recursively.
fn rust_files(dir: &Path) -> Vec<PathBuf> {
    let mut files = Vec::new();
    let mut pending = vec![dir.to_path_buf()];
    while let Some(d) = pending.pop() {
        for entry in fs::read_dir(&d).expect("source folder is readable") {
            let path = entry.expect("directory entry is readable").path();
            if path.is_dir() {
                pending.push(path);
            } else if path.extension().is_some_and(|e| e == "rs") {
                files.push(path);
            }
        }
    }
    files.sort();
    files
}

fn src() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("src")
}

/// Files that belong to the browser layer and may use browser crates.
fn is_web_layer(path: &Path) -> bool {
    let rel = path.strip_prefix(src()).expect("inside src");
    rel.starts_with("web") || rel == Path::new("bin/clearspan_web.rs")
}

const BROWSER_CRATES: [&str; 5] = ["leptos", "web_sys", "wasm_bindgen", "js_sys", "gloo"];

#[test]
fn the_pure_core_imports_nothing_from_the_browser() {
    let mut offenders = Vec::new();
    for path in rust_files(&src()).into_iter().filter(|p| !is_web_layer(p)) {
        let text = fs::read_to_string(&path).expect("source is UTF-8");
        for krate in BROWSER_CRATES {
            if text.contains(&format!("{krate}::")) || text.contains(&format!("use {krate}")) {
                offenders.push(format!("{} uses {krate}", path.display()));
            }
        }
    }
    assert!(
        offenders.is_empty(),
        "browser crates in the core: {offenders:#?}"
    );
}

#[test]
fn only_the_storage_adapter_touches_local_storage() {
    let adapter = src().join("web").join("storage.rs");
    let mut offenders = Vec::new();
    for path in rust_files(&src()).into_iter().filter(|p| *p != adapter) {
        let text = fs::read_to_string(&path).expect("source is UTF-8");
        if text.contains("local_storage") || text.contains("LocalStorage") {
            offenders.push(path.display().to_string());
        }
    }
    assert!(
        offenders.is_empty(),
        "local storage outside the adapter: {offenders:#?}"
    );
}

#[test]
fn every_source_file_opens_with_a_module_paragraph() {
    let missing: Vec<String> = rust_files(&src())
        .into_iter()
        .filter(|p| {
            let text = fs::read_to_string(p).expect("source is UTF-8");
            !text.trim_start().starts_with("//!")
        })
        .map(|p| p.display().to_string())
        .collect();
    assert!(
        missing.is_empty(),
        "files without a //! paragraph: {missing:#?}"
    );
}
