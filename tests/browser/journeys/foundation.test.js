// The app loads cleanly: no panic, no console error, nothing fetched from
// another origin, and the demo scenario opens with a computed plan.
import { test } from "node:test";
import assert from "node:assert/strict";
import { appUnderTest, watchedPage, screenshot } from "../support/harness.js";

const app = appUnderTest();

test("first visit opens the demo scenario with a computed plan", async () => {
  const context = await app.browser().newContext({ viewport: { width: 1366, height: 900 } });
  const page = await watchedPage(context, app.url());
  await page.goto(app.url());
  await page.getByTestId("workspace").waitFor();
  await page.getByTestId("recommendation").waitFor();
  await screenshot(page, "desktop-first-screen", { fullPage: false });
  await screenshot(page, "desktop-full");
  assert.deepEqual(page.problems(), []);
  await context.close();
});
