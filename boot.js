// Starts the wasm app without an inline script, so the Content-Security-Policy
// can forbid inline code. trunk writes the hashed file names onto this tag.
const tag = document.querySelector("script[data-clearspan-js]");
const { default: init } = await import(tag.dataset.clearspanJs);
await init({ module_or_path: tag.dataset.clearspanWasm });

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
