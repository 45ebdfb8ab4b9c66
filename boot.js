// Starts the wasm app without an inline script, so the Content-Security-Policy
// can forbid inline code. trunk writes the hashed file names onto this tag
// (and preloads both files from the page's head).
// The wasm is compiled while the wasm-bindgen glue is imported, streaming
// from the response (the preloaded one); if that fails, the glue fetches and
// compiles it itself, and reports what went wrong.
// The marks `clearspan:boot` (this script runs), `clearspan:js-loaded` (the
// glue imported), `clearspan:compiled` (the wasm compiled) and
// `clearspan:started` (the wasm instantiated and its entry point returned:
// the first plan is in the page) are for the start-up measurement,
// `tests/browser/measure/startup.js`.
performance.mark("clearspan:boot");
const tag = document.querySelector("script[data-clearspan-js]");
const compiling = WebAssembly.compileStreaming(fetch(tag.dataset.clearspanWasm)).then(
  (module) => {
    performance.mark("clearspan:compiled");
    return module;
  },
  () => tag.dataset.clearspanWasm,
);
const { default: init } = await import(tag.dataset.clearspanJs);
performance.mark("clearspan:js-loaded");
await init({ module_or_path: await compiling });
performance.mark("clearspan:started");

// Offline use: a service worker precaches the app's own files (see sw.js).
// The app has loaded whole by now, so a new build that finished installing
// may take over: the next load is then the new build, never a mix.
function takeOverWhenInstalled(worker) {
  if (!worker) return;
  const ask = () => worker.postMessage("take-over");
  if (worker.state === "installed") ask();
  else worker.addEventListener("statechange", () => worker.state === "installed" && ask());
}

if ("serviceWorker" in navigator) {
  navigator.serviceWorker
    .register("sw.js")
    .then((registration) => {
      takeOverWhenInstalled(registration.waiting ?? registration.installing);
      registration.addEventListener("updatefound", () => takeOverWhenInstalled(registration.installing));
      return registration.update();
    })
    .catch(() => {
      // Without a service worker the app still runs; it just needs the network to load.
    });
}
