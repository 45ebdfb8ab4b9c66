// Keeps clearspan usable offline from the first visit. On install it
// precaches every file of its build (the list and version below are written
// by tools/precache.sh after each trunk build) into a cache named after the
// build, and then serves the app only from that cache, so one load never
// mixes two builds. A new build is a new sw.js: the browser installs it
// beside the running one, the page lets it take over once the app has
// loaded (see boot.js), and the next load is the new build, whole. Nothing
// is ever requested from another origin.
const BUILD = { version: "unbuilt", files: [] };
const PREFIX = "clearspan-";
const CACHE = `${PREFIX}${BUILD.version}`;

self.addEventListener("install", (event) => {
  event.waitUntil(
    caches.open(CACHE).then((cache) => cache.addAll(BUILD.files.map((file) => new Request(file, { cache: "reload" })))),
  );
});

// The page asks a waiting new build to take over once it has loaded whole.
self.addEventListener("message", (event) => {
  if (event.data === "take-over") self.skipWaiting();
});

self.addEventListener("activate", (event) => {
  event.waitUntil(
    caches
      .keys()
      .then((names) => Promise.all(names.filter((n) => n.startsWith(PREFIX) && n !== CACHE).map((n) => caches.delete(n))))
      .then(() => self.clients.claim()),
  );
});

self.addEventListener("fetch", (event) => {
  const request = event.request;
  if (request.method !== "GET" || new URL(request.url).origin !== self.location.origin) return;
  // Every page address of the app is its one page.
  const wanted = request.mode === "navigate" ? "index.html" : request;
  event.respondWith(
    caches
      .open(CACHE)
      .then((cache) => cache.match(wanted, { ignoreSearch: true }))
      .then((hit) => hit ?? fetch(request)),
  );
});
