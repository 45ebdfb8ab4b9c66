// The app loads cleanly: no panic, no console error, nothing fetched from
// another origin, and the demo scenario opens with a computed plan.
import { test, before, after } from "node:test";
import assert from "node:assert/strict";
import { serveDist, launchBrowser, watchedPage, screenshot } from "../support/harness.js";

let server;
let browser;

before(async () => {
  server = await serveDist();
  browser = await launchBrowser();
});

after(async () => {
  await browser?.close();
  await server?.close();
});

test("first visit opens the demo scenario with a computed plan", async () => {
  const context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
  const page = await watchedPage(context, server.url);
  await page.goto(server.url);
  await page.getByTestId("workspace").waitFor();
  await page.getByTestId("recommendation").waitFor();
  await screenshot(page, "desktop-first-screen", { fullPage: false });
  await screenshot(page, "desktop-full");
  assert.deepEqual(page.problems(), []);
  await context.close();
});
