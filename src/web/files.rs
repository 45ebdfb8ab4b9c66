//! Files in and out of the browser: saving text as a download and reading a
//! file the user picked. Both stay on the device; nothing is sent anywhere.

use wasm_bindgen::JsCast;
use wasm_bindgen_futures::JsFuture;

/// Offers `text` to the user as a JSON file named `file_name`.
pub fn download_json(file_name: &str, text: &str) -> Result<(), String> {
    download_text(file_name, "application/json", text)
}

/// Offers `text` to the user as a file named `file_name` of media type
/// `mime` (a Blob behind an object address: nothing leaves the device).
pub fn download_text(file_name: &str, mime: &str, text: &str) -> Result<(), String> {
    let fail = |what: &str| format!("the file could not be offered for download ({what})");
    let parts = js_sys::Array::of1(&text.into());
    let options = web_sys::BlobPropertyBag::new();
    options.set_type(mime);
    let blob = web_sys::Blob::new_with_str_sequence_and_options(&parts, &options)
        .map_err(|_| fail("blob"))?;
    let url = web_sys::Url::create_object_url_with_blob(&blob).map_err(|_| fail("address"))?;
    let document = web_sys::window()
        .and_then(|w| w.document())
        .ok_or_else(|| fail("no document"))?;
    let anchor = document
        .create_element("a")
        .map_err(|_| fail("link"))?
        .dyn_into::<web_sys::HtmlAnchorElement>()
        .map_err(|_| fail("link"))?;
    anchor.set_href(&url);
    anchor.set_download(file_name);
    anchor.click();
    // The click has handed the data to the browser's download; the address can go.
    let _ = web_sys::Url::revoke_object_url(&url);
    Ok(())
}

/// The file picked in the file input that fired `ev`, if any; the input is
/// cleared so that picking the same file again fires again.
pub fn picked_file(ev: &leptos::ev::Event) -> Option<web_sys::File> {
    let input = ev
        .target()
        .and_then(|t| t.dyn_into::<web_sys::HtmlInputElement>().ok())?;
    let file = input.files().and_then(|f| f.get(0))?;
    input.set_value("");
    Some(file)
}

/// Reads the text of a file the user picked, refusing files larger than
/// `max_bytes` before reading them.
pub async fn read_text(file: web_sys::File, max_bytes: usize) -> Result<String, String> {
    read_text_or_advise(file, max_bytes, "export fewer scenarios per file").await
}

/// Like [`read_text`], with `advice` on what to do with a file too large.
pub async fn read_text_or_advise(
    file: web_sys::File,
    max_bytes: usize,
    advice: &str,
) -> Result<String, String> {
    let size = file.size();
    if size > max_bytes as f64 {
        return Err(format!(
            "the file is {:.1} MiB, more than the {} MiB allowed; {advice}",
            size / 1_048_576.0,
            max_bytes / 1_048_576
        ));
    }
    let text = JsFuture::from(file.text())
        .await
        .map_err(|_| "the file could not be read".to_string())?;
    text.as_string()
        .ok_or_else(|| "the file is not text".to_string())
}
