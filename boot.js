// Starts the wasm app without an inline script, so the Content-Security-Policy
// can forbid inline code. trunk writes the hashed file names onto this tag.
const tag = document.querySelector("script[data-clearspan-js]");
const { default: init } = await import(tag.dataset.clearspanJs);
await init({ module_or_path: tag.dataset.clearspanWasm });

// Offline use: a service worker keeps a copy of the app's own files.
if ("serviceWorker" in navigator) {
  navigator.serviceWorker.register("sw.js").catch(() => {
    // Without a service worker the app still runs; it just needs the network to load.
  });
}
