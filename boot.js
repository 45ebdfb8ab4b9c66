// Starts the wasm app without an inline script, so the Content-Security-Policy
// can forbid inline code. trunk writes the hashed file names onto this tag.
const tag = document.querySelector("script[data-clearspan-js]");
const { default: init } = await import(tag.dataset.clearspanJs);
await init({ module_or_path: tag.dataset.clearspanWasm });
