// Journey for the app's own backup (issue 12, point 3): whatever the form
// accepts and saves comes back from "Export all": drafts the planner cannot
// plan yet (a 127-character name, an age of 130, an empty task name) are
// exported, erased and imported again as drafts, and a second export is the
// same file byte for byte.
import { test } from "node:test";
import assert from "node:assert/strict";
import { readFile } from "node:fs/promises";
import { appUnderTest } from "../support/harness.js";
import { AGE, DEMO_COUNT, freshPlanner } from "../support/planner-page.js";

const app = appUnderTest();

/** Clicks "Export all" and resolves to the downloaded file's text. */
async function exportAll(planner) {
  const [download] = await Promise.all([
    planner.page.waitForEvent("download"),
    planner.page.getByRole("button", { name: "Export all", exact: true }).click(),
  ]);
  return readFile(await download.path(), "utf8");
}

test("export all, erase all, import: every scenario comes back, drafts as drafts, byte for byte", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  await planner.byTestId("recommendation").waitFor();

  // A draft the planner cannot plan yet, typed into the form and autosaved.
  await planner.byTestId("new-scenario").click();
  const longName = `Fictional draft ${"x".repeat(111)}`;
  assert.equal(longName.length, 127);
  await planner.byTestId("scenario-name").fill(longName);
  await planner.setNumber(AGE, "130");
  await planner.byTestId("task-0-name").fill("");
  await planner.waitForSaveState("Saved on this device");
  const draft = await planner.storedByName(longName);
  assert.equal(draft.entry.scenario.wearer.age_years, 130);
  assert.equal(draft.entry.scenario.tasks[0].name, "");

  const backup = await exportAll(planner);
  const exportedMs = JSON.parse(backup).exported_ms;
  assert.equal(JSON.parse(backup).scenarios.length, DEMO_COUNT + 1);

  await page.getByRole("button", { name: "Erase all local data…" }).click();
  await planner.byTestId("confirm-erase").click();
  await planner.waitForNotice("Erased all");
  assert.deepEqual(await planner.shelfNames(), []);

  await planner.importFile("clearspan-all-scenarios.json", backup);
  await planner.waitForNotice(`Imported ${DEMO_COUNT + 1} scenarios`);
  const notice = (await planner.notices()).find((n) => n.startsWith("Imported"));
  assert.match(notice, /1 as a draft/);
  assert.equal((await planner.shelfNames()).length, DEMO_COUNT + 1);
  const marked = planner.byTestId("shelf-list").locator(".shelf-item").filter({ hasText: longName });
  assert.match(await marked.textContent(), /draft/);
  assert.equal(Object.keys(await planner.storedScenarios()).length, DEMO_COUNT + 1);

  // The same clock reading as the first export, so the files can match exactly.
  await page.clock.setFixedTime(exportedMs);
  assert.equal(await exportAll(planner), backup);

  assert.deepEqual(page.problems(), []);
  await context.close();
});
