// Journeys for using the app without a network (issue 12, point 5): the
// first visit is enough to reload offline, a new build is picked up on the
// next load and never mixed with the old one, and the web app manifest
// makes the app installable (on a tablet's home screen, for example).
import { test } from "node:test";
import assert from "node:assert/strict";
import { execFile } from "node:child_process";
import { createHash } from "node:crypto";
import { cp, mkdtemp, readFile, readdir, rename, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { promisify } from "node:util";
import { appUnderTest, DIST, serveDist, watchedPage } from "../support/harness.js";
import { PlannerPage } from "../support/planner-page.js";

const ROOT = resolve(import.meta.dirname, "../../..");
const app = appUnderTest();

/** A fresh context with one watched planner page on `url`. */
async function plannerAt(url) {
  const context = await app.browser().newContext({ viewport: { width: 1024, height: 768 } });
  const page = await watchedPage(context, url);
  return { context, page, planner: new PlannerPage(page, url) };
}

/** Waits until the page's service worker is active (its install, and so its precache, finished). */
async function serviceWorkerReady(page) {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
}

/** The names of the app's caches in the page's origin. */
async function cacheNames(page) {
  return page.evaluate(() => caches.keys());
}

/** Waits (up to 15 s) until the page's origin holds exactly the caches `expected`. */
async function cachesBecome(page, expected) {
  for (let waited = 0; waited < 15000; waited += 100) {
    if (JSON.stringify(await cacheNames(page)) === JSON.stringify(expected)) return;
    await new Promise((ok) => setTimeout(ok, 100));
  }
  assert.deepEqual(await cacheNames(page), expected);
}

/** The build version written into the served sw.js by the precache step. */
async function builtVersion(dir) {
  const sw = await readFile(join(dir, "sw.js"), "utf8");
  const found = sw.match(/const BUILD = \{ version: "([0-9a-f]+)"/);
  assert.ok(found, "sw.js carries the build version");
  return found[1];
}

/**
 * Turns the app in `dir` into a "new build": the stylesheet gets new content
 * (a marker) under a new hashed name, index.html points at it, and the
 * precache step runs again as trunk would run it after a build.
 */
async function deployNewBuild(dir) {
  const css = (await readdir(dir)).find((f) => f.endsWith(".css"));
  const text = `${await readFile(join(dir, css), "utf8")}\n:root { --clearspan-build: "two"; }\n`;
  const renamed = `app-newbuild${createHash("sha256").update(text).digest("hex").slice(0, 16)}.css`;
  await writeFile(join(dir, renamed), text);
  await rm(join(dir, css));
  const integrity = `sha384-${createHash("sha384").update(text).digest("base64")}`;
  const index = (await readFile(join(dir, "index.html"), "utf8"))
    .replace(new RegExp(`/?${css}`, "g"), `/${renamed}`)
    .replace(/(<link rel="stylesheet"[^>]*integrity=")[^"]*"/, `$1${integrity}"`);
  assert.ok(index.includes(renamed), "index.html points at the new stylesheet");
  await writeFile(join(dir, "index.html.new"), index);
  await rename(join(dir, "index.html.new"), join(dir, "index.html"));
  await promisify(execFile)("sh", [join(ROOT, "tools", "precache.sh")], { env: { ...process.env, TRUNK_STAGING_DIR: dir } });
  return renamed;
}

/** Which build the page shows: its stylesheet's file and the marker only the new build's stylesheet sets. */
async function shownBuild(page) {
  return page.evaluate(() => ({
    stylesheet: new URL(document.querySelector('link[rel="stylesheet"]').href).pathname.slice(1),
    marker: getComputedStyle(document.documentElement).getPropertyValue("--clearspan-build").trim(),
  }));
}

test("the first visit is enough to reload the app offline", async () => {
  const { context, page, planner } = await plannerAt(app.url());
  await planner.open();
  await serviceWorkerReady(page);

  await context.setOffline(true);
  await planner.reload();
  await planner.byTestId("recommendation").waitFor();
  assert.ok((await planner.shelfNames()).length > 0, "the library opens offline");

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("a new build is picked up on the next load and never mixed with the old one", async () => {
  const dir = await mkdtemp(join(tmpdir(), "clearspan-dist-"));
  await cp(DIST, dir, { recursive: true });
  const server = await serveDist(dir);
  const { context, page, planner } = await plannerAt(server.url);
  try {
    await planner.open();
    await serviceWorkerReady(page);
    const first = await builtVersion(dir);
    assert.deepEqual(await cacheNames(page), [`clearspan-${first}`]);
    const old = await shownBuild(page);
    assert.equal(old.marker, "");

    const stylesheet = await deployNewBuild(dir);
    const second = await builtVersion(dir);
    assert.notEqual(second, first);

    // The load right after the deploy shows one build whole (the old one, from its cache).
    await planner.reload();
    await planner.byTestId("recommendation").waitFor();
    assert.deepEqual(await shownBuild(page), old);
    // Meanwhile the new build was fetched whole and replaced the old cache.
    await cachesBecome(page, [`clearspan-${second}`]);

    // The next load is the new build, and it works offline too.
    await planner.reload();
    await planner.byTestId("recommendation").waitFor();
    assert.deepEqual(await shownBuild(page), { stylesheet, marker: '"two"' });
    await context.setOffline(true);
    await planner.reload();
    await planner.byTestId("recommendation").waitFor();
    assert.deepEqual(await shownBuild(page), { stylesheet, marker: '"two"' });

    assert.deepEqual(page.problems(), []);
  } finally {
    await context.close();
    await server.close();
    await rm(dir, { recursive: true, force: true });
  }
});

test("the web app manifest makes the app installable, with its own icons", async () => {
  const { context, page, planner } = await plannerAt(app.url());
  await planner.open();
  await serviceWorkerReady(page);
  const cdp = await context.newCDPSession(page);
  const { errors: manifestErrors } = await cdp.send("Page.getAppManifest");
  assert.deepEqual(manifestErrors, [], "the manifest parses");
  const { installabilityErrors } = await cdp.send("Page.getInstallabilityErrors");
  // The journeys run in private browser contexts, where nothing can be
  // installed; that says nothing about the app, so only that reason is left out.
  const errors = installabilityErrors.map((e) => e.errorId).filter((id) => id !== "in-incognito");
  assert.deepEqual(errors, [], "Chromium finds nothing in the app that prevents installing it");
  const manifest = JSON.parse(await readFile(join(DIST, "manifest.webmanifest"), "utf8"));
  assert.equal(manifest.short_name, "clearspan");
  for (const icon of manifest.icons) {
    assert.ok(!/^[a-z]+:/i.test(icon.src), `${icon.src} is the app's own file`);
    const response = await page.request.get(new URL(icon.src, app.url()).href);
    assert.equal(response.status(), 200, icon.src);
  }

  assert.deepEqual(page.problems(), []);
  await context.close();
});
