// Shared harness for the browser journeys: serves the built dist/ on
// loopback, starts headless Chromium through playwright-core, and watches
// every page for console errors, uncaught exceptions and requests that leave
// the app's own origin.
import { createServer } from "node:http";
import { readFile, mkdir } from "node:fs/promises";
import { extname, join, normalize, resolve } from "node:path";
import { before, after } from "node:test";
import { chromium } from "playwright-core";

const ROOT = resolve(import.meta.dirname, "../../..");
/** The built app that trunk writes. */
export const DIST = join(ROOT, "dist");
/** Screenshots for review are kept here. */
export const SHOTS = join(ROOT, "target", "screenshots");

const TYPES = {
  ".html": "text/html; charset=utf-8",
  ".js": "text/javascript",
  ".wasm": "application/wasm",
  ".css": "text/css",
  ".json": "application/json",
  ".svg": "image/svg+xml",
  ".png": "image/png",
  ".webmanifest": "application/manifest+json",
};

/** Serves `root` (dist/ unless given) on 127.0.0.1 at a free port; resolves to { url, close }. */
export async function serveDist(root = DIST) {
  const server = createServer(async (req, res) => {
    const path = decodeURIComponent(new URL(req.url, "http://x").pathname);
    const file = normalize(join(root, path === "/" ? "index.html" : path));
    if (!file.startsWith(root)) {
      res.writeHead(403).end();
      return;
    }
    try {
      const body = await readFile(file);
      res.writeHead(200, { "content-type": TYPES[extname(file)] ?? "application/octet-stream" });
      res.end(body);
    } catch {
      res.writeHead(404).end("not found");
    }
  });
  await new Promise((ok) => server.listen(0, "127.0.0.1", ok));
  const { port } = server.address();
  return {
    url: `http://127.0.0.1:${port}/`,
    close: () => new Promise((ok) => server.close(ok)),
  };
}

/** Launches Debian's Chromium headless with the flags this machine needs. */
export async function launchBrowser() {
  return chromium.launch({
    executablePath: process.env.CHROMIUM ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-background-networking",
      "--disable-component-update",
      "--no-first-run",
      "--disable-sync",
      "--disable-quic",
    ],
  });
}

/**
 * Opens a page on `origin` and records what would betray a broken app:
 * console errors, uncaught exceptions (a Rust panic surfaces as one), and
 * any request to another origin. `problems()` lists them.
 */
export async function watchedPage(context, origin) {
  const page = await context.newPage();
  const seen = [];
  const own = new URL(origin).origin;
  page.on("console", (msg) => {
    if (msg.type() === "error") seen.push(`console error: ${msg.text()}`);
  });
  page.on("pageerror", (err) => seen.push(`uncaught: ${err.message}`));
  page.on("request", (req) => {
    const url = new URL(req.url());
    const local = url.origin === own || url.protocol === "data:" || url.protocol === "blob:";
    if (!local) seen.push(`request to another origin: ${req.url()}`);
  });
  page.problems = () => [...seen];
  page.allowProblem = (pattern) => {
    for (let i = seen.length - 1; i >= 0; i -= 1) if (pattern.test(seen[i])) seen.splice(i, 1);
  };
  return page;
}

/** Saves a screenshot (the whole page unless `fullPage` is false) under target/screenshots/NAME.png. */
export async function screenshot(page, name, { fullPage = true } = {}) {
  await mkdir(SHOTS, { recursive: true });
  const path = join(SHOTS, `${name}.png`);
  await page.screenshot({ path, fullPage });
  return path;
}

/**
 * Serves dist/ (or the build in the directory CLEARSPAN_DIST names, for a
 * comparison with an earlier build) and starts Chromium once for a test
 * file, and stops both after its last test. Returns getters for the browser
 * and the app's address.
 */
export function appUnderTest() {
  let server;
  let browser;
  before(async () => {
    server = await serveDist(process.env.CLEARSPAN_DIST ? resolve(process.env.CLEARSPAN_DIST) : DIST);
    browser = await launchBrowser();
  });
  after(async () => {
    await browser?.close();
    await server?.close();
  });
  return { browser: () => browser, url: () => server.url };
}
