// Journeys for two tabs writing one scenario (issue 12, point 2): edits
// typed at the same instant in two tabs never lose one silently (either
// both reach storage or the tab whose edit did not shows the conflict
// banner), the losing tab's next edit does not overwrite the winner, and a
// stored revision at the integer maximum keeps the check working.
import { test } from "node:test";
import assert from "node:assert/strict";
import { appUnderTest, watchedPage } from "../support/harness.js";
import { typeAtTheSameMoment } from "../support/faults.js";
import { AGE, OFFICE_DEMO, PlannerPage } from "../support/planner-page.js";

const DISTANCE = "tasks-0--distance_m";
const TRIALS = 8;
const app = appUnderTest();

/** Two tabs of one context, both with the office demo open; `prepare` runs in the first before the second opens. */
async function twoTabs(prepare = async () => {}) {
  const context = await app.browser().newContext({ viewport: { width: 1366, height: 900 } });
  const first = new PlannerPage(await watchedPage(context, app.url()), app.url());
  await first.open();
  await prepare(first);
  const second = new PlannerPage(await watchedPage(context, app.url()), app.url());
  await second.open();
  await second.openFromShelf(OFFICE_DEMO);
  await first.openFromShelf(OFFICE_DEMO);
  return { context, first, second };
}

/** The office demo as stored: its age and its first task's distance in centimetres. */
async function storedOffice(tab) {
  const { entry } = await tab.storedByName(OFFICE_DEMO);
  return { age: entry.scenario.wearer.age_years, distanceCm: Math.round(entry.scenario.tasks[0].distance_m * 1000) / 10 };
}

/** Waits until both tabs settle: every storage event handled and both save states final. */
async function settle(tabs) {
  await new Promise((ok) => setTimeout(ok, 600));
  for (const tab of tabs) {
    await tab.page.waitForFunction(() => {
      const shown = document.querySelector('[data-testid="save-state"]')?.textContent ?? "";
      return !shown.startsWith("Saving");
    });
  }
}

/** Asserts that an edit missing from storage is announced by the tab that made it. */
async function assertNoSilentLoss(first, second, age, distanceCm, trial) {
  const stored = await storedOffice(first);
  if (stored.age !== age) assert.ok(await first.showsConflict(), `trial ${trial}: the first tab's age ${age} was lost silently (${JSON.stringify(stored)})`);
  if (stored.distanceCm !== distanceCm) {
    assert.ok(await second.showsConflict(), `trial ${trial}: the second tab's distance ${distanceCm} was lost silently (${JSON.stringify(stored)})`);
  }
}

/** Resolves any conflict by taking storage's version, so both tabs show what storage holds. */
async function takeTheirs(tab) {
  if (await tab.showsConflict()) {
    await tab.byTestId("conflict").getByRole("button", { name: "Take theirs" }).click();
    await tab.byTestId("conflict").waitFor({ state: "detached" });
  }
}

test("edits typed in two tabs at the same moment are never lost silently", async () => {
  const { context, first, second } = await twoTabs();
  for (let trial = 0; trial < TRIALS; trial += 1) {
    const age = 40 + trial;
    const distanceCm = 60 + trial;
    await typeAtTheSameMoment([
      { page: first.page, testId: AGE, value: String(age) },
      { page: second.page, testId: DISTANCE, value: String(distanceCm) },
    ]);
    await settle([first, second]);
    await assertNoSilentLoss(first, second, age, distanceCm, trial);
    await takeTheirs(first);
    await takeTheirs(second);
    await settle([first, second]);
  }

  // One after the other, each tab's next edit builds on the other's.
  const stored = await storedOffice(first);
  await first.setNumber(AGE, "71");
  await first.waitForSaveState("Saved on this device");
  await second.page.waitForFunction((id) => document.querySelector(`[data-testid="${id}"]`)?.value === "71", AGE);
  await second.setNumber(DISTANCE, "88");
  await second.waitForSaveState("Saved on this device");
  assert.deepEqual(await storedOffice(first), { ...stored, age: 71, distanceCm: 88 });

  assert.deepEqual(first.page.problems(), []);
  assert.deepEqual(second.page.problems(), []);
  await context.close();
});

test("a stored revision at the integer maximum does not switch the check off", async () => {
  const { context, first, second } = await twoTabs(async (tab) => {
    const { key } = await tab.storedByName(OFFICE_DEMO);
    await tab.page.evaluate((k) => {
      const raw = localStorage.getItem(k).replace(/"revision":\d+/, '"revision":18446744073709551615');
      localStorage.setItem(k, raw);
    }, key);
    await tab.reload();
  });
  await first.setNumber(AGE, "66");
  await first.waitForSaveState("Saved on this device");
  await settle([first, second]);

  await second.setNumber(DISTANCE, "77");
  await settle([first, second]);
  await assertNoSilentLoss(first, second, 66, 77, "max");

  assert.deepEqual(first.page.problems(), []);
  assert.deepEqual(second.page.problems(), []);
  await context.close();
});
