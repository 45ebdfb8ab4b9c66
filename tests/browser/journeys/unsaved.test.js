// Journeys for work that storage refused (issue 12, point 1): an unsaved
// edit stays marked whatever is opened next, is written as soon as storage
// has room again (on the next write, or when the tab comes back into view),
// an import into full storage is kept the same way, and leaving the page
// while anything is unsaved asks first.
import { test } from "node:test";
import assert from "node:assert/strict";
import { readFile } from "node:fs/promises";
import { join, resolve } from "node:path";
import { appUnderTest } from "../support/harness.js";
import { storageThatFills } from "../support/faults.js";
import { AGE, freshPlanner, OFFICE_DEMO } from "../support/planner-page.js";

const ROOT = resolve(import.meta.dirname, "../../..");
const ELECTRONICS = "Demo — fictional electronics bench technician";
const app = appUnderTest();

/** Closes `page` as a user leaving it would; resolves to the kind of dialog the page raised, if any. */
async function tryToLeave(page) {
  const asked = new Promise((answer) => {
    page.once("dialog", async (dialog) => {
      answer(dialog.type());
      await dialog.dismiss();
    });
    setTimeout(() => answer(undefined), 2000);
  });
  await page.close({ runBeforeUnload: true });
  return asked;
}

test("an unsaved edit stays marked after opening another scenario and is written when the tab regains focus", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { initScript: storageThatFills });
  await planner.open();
  await planner.byTestId("recommendation").waitFor();
  assert.equal(await planner.title(), OFFICE_DEMO);
  await page.evaluate(() => window.__fillStorageForTest());

  await planner.setNumber(AGE, "58");
  await planner.waitForSaveState("Kept in this tab only:");
  await planner.openFromShelf(ELECTRONICS);
  const state = await planner.saveState();
  assert.notEqual(state, "Saved on this device", "never a false Saved while an edit waits");
  assert.match(state, /1 other scenario is kept in this tab only/);
  const office = planner.byTestId("shelf-list").locator(".shelf-item").filter({ hasText: OFFICE_DEMO });
  assert.match(await office.textContent(), /not stored/);

  // Leaving now would lose the edit: the page asks first (and the user stays).
  assert.equal(await tryToLeave(page), "beforeunload");
  assert.ok(!page.isClosed(), "the user chose to stay");

  // Room again, and the tab comes back into focus: the edit is written.
  await page.evaluate(() => window.__freeStorageForTest());
  await page.evaluate(() => window.dispatchEvent(new Event("focus")));
  await planner.waitForSaveState("Saved on this device");
  assert.equal((await planner.storedByName(OFFICE_DEMO)).entry.scenario.wearer.age_years, 58);
  assert.doesNotMatch(await office.textContent(), /not stored/);

  // With nothing unsaved, leaving asks nothing, and a new page finds the edit.
  assert.equal(await tryToLeave(page), undefined);
  const next = await context.newPage();
  await next.goto(app.url());
  await next.getByTestId("workspace").waitFor();
  await next.getByTestId("shelf-list").locator(".shelf-item").filter({ hasText: OFFICE_DEMO }).click();
  await next.waitForFunction((id) => document.querySelector(`[data-testid="${id}"]`)?.value === "58", AGE);

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("an import into full storage is kept, marked, and written by the next write once there is room", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { initScript: storageThatFills });
  await planner.open();
  await planner.byTestId("recommendation").waitFor();
  await page.evaluate(() => window.__fillStorageForTest());

  const demo = JSON.parse(await readFile(join(ROOT, "scenarios", "office-two-monitors.json"), "utf8"));
  const names = ["Fictional import: first", "Fictional import: second"];
  const items = names.map((name) => {
    const item = structuredClone(demo.scenarios[0]);
    item.scenario.name = name;
    return item;
  });
  await planner.importFile("two.json", JSON.stringify({ ...demo, scenarios: items }, null, 2));
  await page.waitForFunction(
    (name) => document.querySelector('[data-testid="scenario-title"]')?.textContent.trim() === name,
    names[0],
  );
  await planner.waitForSaveState("Kept in this tab only:");
  for (const name of names) {
    const item = planner.byTestId("shelf-list").locator(".shelf-item").filter({ hasText: name });
    assert.match(await item.textContent(), /not stored/, `${name} is marked`);
    assert.equal(await planner.storedByName(name), undefined);
  }
  assert.equal(await tryToLeave(page), "beforeunload");

  // Room again: the next edit writes itself and every import still waiting.
  await page.evaluate(() => window.__freeStorageForTest());
  await planner.setNumber(AGE, "47");
  await planner.waitForSaveState("Saved on this device");
  for (const name of names) assert.ok(await planner.storedByName(name), `${name} is stored`);
  assert.equal((await planner.storedByName(names[0])).entry.scenario.wearer.age_years, 47);

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("an unsaved edit is written when the tab becomes visible again", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { initScript: storageThatFills });
  await planner.open();
  await planner.byTestId("recommendation").waitFor();
  await page.evaluate(() => window.__fillStorageForTest());
  await planner.setNumber(AGE, "63");
  await planner.waitForSaveState("Kept in this tab only:");

  await page.evaluate(() => window.__freeStorageForTest());
  await page.evaluate(() => document.dispatchEvent(new Event("visibilitychange", { bubbles: true })));
  await planner.waitForSaveState("Saved on this device");
  assert.equal((await planner.storedByName(OFFICE_DEMO)).entry.scenario.wearer.age_years, 63);

  assert.deepEqual(page.problems(), []);
  await context.close();
});
