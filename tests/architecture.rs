//! Checks the architecture invariants written in DEVELOPERS.md by reading the
//! source tree: the pure core knows nothing of the browser, the layers point
//! one way (core ← scenario ← display ← plan ← chart, display ← library, all ← web and the
//! binaries), only the web layer's storage adapter touches local storage,
//! and every file says what it is responsible for.

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

/// Each layer of the library and the crate modules it may import besides
/// itself. The web layer and the binaries sit on top and may use them all.
const LAYERS: [(&str, &[&str]); 7] = [
    ("core", &[]),
    ("scenario", &["core"]),
    ("plan", &["core", "scenario", "display"]),
    ("display", &["core", "scenario"]),
    ("library", &["core", "scenario", "display"]),
    ("chart", &["core", "scenario", "plan", "display"]),
    ("markup", &["core", "scenario", "plan", "display", "chart"]),
];

/// Every crate module a layer could name.
const MODULES: [&str; 8] = [
    "core", "scenario", "plan", "library", "display", "chart", "markup", "web",
];

/// Outside crates the core may use: the standard library, serde and nalgebra.
const CORE_FORBIDDEN_CRATES: [&str; 9] = [
    "serde_json",
    "serde_path_to_error",
    "leptos",
    "wasm_bindgen",
    "js_sys",
    "web_sys",
    "gloo",
    "console_error_panic_hook",
    "criterion",
];

/// The part of a source file that is not test code: a whole `tests.rs` is
/// test code, and so is everything from the first `#[cfg(test)]`.
fn non_test_text(path: &Path) -> String {
    if path.file_name().is_some_and(|n| n == "tests.rs") {
        return String::new();
    }
    let text = fs::read_to_string(path).expect("source is UTF-8");
    match text.find("#[cfg(test)]") {
        Some(at) => text[..at].to_string(),
        None => text,
    }
}

/// The source files of one layer: `src/<layer>/**` and `src/<layer>.rs`.
fn layer_files(layer: &str) -> Vec<PathBuf> {
    let mut files = Vec::new();
    let dir = src().join(layer);
    if dir.is_dir() {
        files.extend(rust_files(&dir));
    }
    let file = src().join(format!("{layer}.rs"));
    if file.is_file() {
        files.push(file);
    }
    files
}

#[test]
fn layers_point_one_way() {
    let mut offenders = Vec::new();
    for (layer, allowed) in LAYERS {
        let files = layer_files(layer);
        assert!(!files.is_empty(), "layer {layer} has files");
        for path in files {
            let text = non_test_text(&path);
            for module in MODULES {
                let named = text.contains(&format!("crate::{module}::"))
                    || text.contains(&format!("crate::{module};"))
                    || text.contains(&format!("crate::{module}}}"))
                    || text.contains(&format!("crate::{{{module}"));
                if module != layer && !allowed.contains(&module) && named {
                    offenders.push(format!("{} ({layer}) uses {module}", path.display()));
                }
            }
        }
    }
    assert!(
        offenders.is_empty(),
        "imports against the layering: {offenders:#?}"
    );
}

#[test]
fn the_core_uses_only_std_serde_and_nalgebra() {
    let mut offenders = Vec::new();
    for path in layer_files("core") {
        let text = non_test_text(&path);
        for krate in CORE_FORBIDDEN_CRATES {
            if text.contains(&format!("{krate}::")) || text.contains(&format!("use {krate}")) {
                offenders.push(format!("{} uses {krate}", path.display()));
            }
        }
    }
    assert!(
        offenders.is_empty(),
        "outside crates in the core: {offenders:#?}"
    );
}
