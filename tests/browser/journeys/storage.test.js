// Storage journeys: work survives a reload, damaged or foreign stored items
// are set aside without losing the good ones, bad import files are refused
// item by item (drafts come in as drafts), a full storage keeps the work in the tab and offers an
// export, two tabs follow each other, delete can be undone, and erasing
// removes everything the app stored (and nothing else).
import { test } from "node:test";
import assert from "node:assert/strict";
import { readFile } from "node:fs/promises";
import { join, resolve } from "node:path";
import { appUnderTest, watchedPage } from "../support/harness.js";
import { storageThatFills } from "../support/faults.js";
import {
  AGE,
  DEMO_COUNT,
  FORMAT_VERSION,
  freshPlanner,
  OFFICE_DEMO,
  PlannerPage,
  SCENARIO_PREFIX,
} from "../support/planner-page.js";

const ROOT = resolve(import.meta.dirname, "../../..");

const app = appUnderTest();

test("a number typed key by key is written to storage once, after the typing, and kept across a reload", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  await planner.byTestId("recommendation").waitFor();
  await page.evaluate((prefix) => {
    window.__scenarioWrites = 0;
    const setItem = Storage.prototype.setItem;
    Storage.prototype.setItem = function (key, value) {
      if (key.startsWith(prefix)) window.__scenarioWrites += 1;
      return setItem.call(this, key, value);
    };
  }, SCENARIO_PREFIX);
  const age = planner.byTestId(AGE);
  await age.fill("");
  await age.pressSequentially("5861", { delay: 20 });
  await planner.waitForSaveState("Saved on this device");
  const writes = await page.evaluate(() => window.__scenarioWrites);
  assert.ok(writes >= 1 && writes <= 2, `${writes} writes of the scenario for five edits`);
  await planner.setNumber(AGE, "58");
  await planner.waitForSaveState("Saved on this device");
  await planner.reload();
  assert.equal(await planner.valueOf(AGE), "58");
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("a reload keeps the edited value and the open scenario", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  const electronics = "Demo — fictional electronics bench technician";
  await planner.openFromShelf(electronics);
  await planner.setNumber(AGE, "53");
  await planner.waitForSaveState("Saved on this device");
  const stored = await planner.storedByName(electronics);
  assert.equal(stored.entry.format, "clearspan-scenario-entry");
  assert.equal(stored.entry.version, FORMAT_VERSION);
  assert.equal(stored.entry.scenario.wearer.age_years, 53);

  await planner.reload();
  assert.equal(await planner.title(), electronics);
  assert.equal(await planner.valueOf(AGE), "53");
  await planner.byTestId("recommendation").waitFor();

  // A second edit in the reloaded page is stored under the same key, not as a copy.
  await planner.setNumber(AGE, "54");
  await planner.waitForSaveState("Saved on this device");
  const again = await planner.storedByName(electronics);
  assert.equal(again.key, stored.key);
  assert.equal(again.entry.scenario.wearer.age_years, 54);
  assert.equal(Object.keys(await planner.storedScenarios()).length, DEMO_COUNT);

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test(
  "a reload right after the first visit keeps the demo that was open",
  async () => {
    const { context, page, planner } = await freshPlanner(app.browser(), app.url());
    await planner.open();
    assert.equal(await planner.title(), OFFICE_DEMO);
    await planner.reload();
    assert.equal(await planner.title(), OFFICE_DEMO);
    assert.deepEqual(page.problems(), []);
    await context.close();
  },
);

test("damaged and foreign stored items are set aside, the good scenarios still load", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  const demos = await planner.shelfNames();
  assert.equal(demos.length, DEMO_COUNT);
  const damaged = { key: `${SCENARIO_PREFIX}zz-damaged-1`, raw: '{"format":"clearspan-scenario-entry","version":1,' };
  const foreign = {
    key: `${SCENARIO_PREFIX}zz-foreign-2`,
    raw: JSON.stringify({ format: "another-program-settings", colour: "teal", zoom: 2 }),
  };
  await page.evaluate((items) => {
    for (const { key, raw } of items) localStorage.setItem(key, raw);
  }, [damaged, foreign]);

  await planner.reload();
  assert.deepEqual(await planner.shelfNames(), demos, "every good scenario loads");
  await planner.byTestId("recommendation").waitFor();

  const notices = await planner.notices();
  for (const { key } of [damaged, foreign]) {
    assert.ok(
      notices.some((n) => n.includes(key) && n.includes("could not be opened")),
      `a notice names ${key}: ${JSON.stringify(notices)}`,
    );
  }
  const setAside = planner.byTestId("set-aside").locator("li");
  assert.equal(await setAside.count(), 2);
  for (const { key } of [damaged, foreign]) {
    const item = setAside.filter({ hasText: key });
    assert.equal(await item.count(), 1, `${key} is listed under "Set aside"`);
    assert.ok(await item.getByRole("button", { name: "Download its text" }).isVisible());
  }

  const [download] = await Promise.all([
    page.waitForEvent("download"),
    setAside.filter({ hasText: damaged.key }).getByRole("button", { name: "Download its text" }).click(),
  ]);
  assert.equal(download.suggestedFilename(), "clearspan-recovered-zz-damaged-1.json");
  assert.equal(await readFile(await download.path(), "utf8"), damaged.raw, "the text comes back unchanged");

  const storage = await planner.storage();
  assert.equal(storage[damaged.key], damaged.raw, "the damaged item is kept, not overwritten");
  assert.equal(storage[foreign.key], foreign.raw, "the foreign item is kept, not overwritten");

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("a bad import file is refused with a notice; a mixed file imports the good scenario and the draft", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  const before = await planner.shelfNames();

  await planner.importFile("notes.json", "these are my notes, not a scenario file");
  await planner.waitForNotice("Nothing was imported");
  const refusal = (await planner.notices()).find((n) => n.startsWith("Nothing was imported"));
  assert.match(refusal, /not valid JSON/);
  assert.deepEqual(await planner.shelfNames(), before);
  assert.equal(Object.keys(await planner.storedScenarios()).length, DEMO_COUNT);

  const demo = JSON.parse(await readFile(join(ROOT, "scenarios", "office-two-monitors.json"), "utf8"));
  const named = (name, change) => {
    const item = structuredClone(demo.scenarios[0]);
    item.scenario.name = name;
    change(item.scenario);
    return item;
  };
  const good = named("Fictional import: good", () => {});
  const draft = named("Fictional import: draft", (s) => {
    s.tasks[0].distance_m = -1;
  });
  const bad = named("Fictional import: bad", (s) => {
    s.tasks[0].distance_m = "far";
  });
  await planner.importFile("mixed.json", JSON.stringify({ ...demo, scenarios: [good, draft, bad] }, null, 2));

  await page.waitForFunction(
    () => document.querySelector('[data-testid="scenario-title"]')?.textContent.trim() === "Fictional import: good",
  );
  const notice = planner.byTestId("notice").filter({ hasText: "Imported 2 scenarios" });
  assert.equal(
    (await notice.locator("p").textContent()).trim(),
    "Imported 2 scenarios (1 as a draft to correct); 1 was not imported.",
  );
  await notice.getByText("Show the list").click();
  const lines = (await notice.locator("li").allTextContents()).map((t) => t.trim());
  assert.equal(lines[0], 'Imported "Fictional import: good"');
  assert.match(lines[1], /^Imported "Fictional import: draft" as a draft to correct \(tasks\[0\]\.distance_m: /);
  assert.match(lines[2], /^Scenario 3 \("Fictional import: bad"\) was not imported: /);
  assert.match(lines[2], /scenarios\[2\]\.scenario\.tasks\[0\]\.distance_m/);

  const names = await planner.shelfNames();
  assert.equal(names.length, before.length + 2);
  assert.ok(names.includes("Fictional import: good"));
  assert.ok(names.includes("Fictional import: draft"));
  assert.ok(!names.includes("Fictional import: bad"));
  assert.ok(await planner.storedByName("Fictional import: good"), "the good scenario is stored");
  assert.ok(await planner.storedByName("Fictional import: draft"), "the draft is stored");
  assert.equal(await planner.storedByName("Fictional import: bad"), undefined);

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("full storage keeps the edit in the tab and offers an export", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { initScript: storageThatFills });
  await planner.open();
  await planner.byTestId("recommendation").waitFor();
  const title = await planner.title();
  const storedAge = (await planner.storedByName(title)).entry.scenario.wearer.age_years;
  await page.evaluate(() => window.__fillStorageForTest());

  await planner.setNumber(AGE, "58");
  await planner.waitForSaveState("Kept in this tab only:");
  assert.match(await planner.saveState(), /storage for this app is full/);
  const notice = planner.byTestId("notice").filter({ hasText: "full" });
  assert.equal(await notice.count(), 1, JSON.stringify(await planner.notices()));
  const exportButton = notice.getByRole("button", { name: "Export all scenarios" });
  assert.ok(await exportButton.isVisible());
  assert.equal(await planner.valueOf(AGE), "58", "the edited value stays on screen");
  await page.waitForFunction(() => document.querySelector('[data-testid="plan"]')?.textContent.includes("x 58 years"));
  assert.equal(
    (await planner.storedByName(title)).entry.scenario.wearer.age_years,
    storedAge,
    "storage still holds the last value it accepted",
  );

  const [download] = await Promise.all([page.waitForEvent("download"), exportButton.click()]);
  const exported = JSON.parse(await readFile(await download.path(), "utf8"));
  assert.equal(exported.format, "clearspan-scenario-export");
  const mine = exported.scenarios.find((s) => s.scenario.name === title);
  assert.equal(mine.scenario.wearer.age_years, 58, "the export carries the edit storage refused");
  assert.equal(exported.scenarios.length, DEMO_COUNT);

  // With room again, the next edit reaches storage and the state says so.
  await page.evaluate(() => window.__freeStorageForTest());
  await planner.setNumber(AGE, "59");
  await planner.waitForSaveState("Saved on this device");
  assert.equal((await planner.storedByName(title)).entry.scenario.wearer.age_years, 59);

  assert.deepEqual(page.problems(), []);
  await context.close();
});

/** Two tabs of the app sharing one storage; the second has the office demo open. */
async function twoTabsOnTheOfficeDemo() {
  const context = await app.browser().newContext({ viewport: { width: 1366, height: 900 } });
  const first = new PlannerPage(await watchedPage(context, app.url()), app.url());
  await first.open();
  const second = new PlannerPage(await watchedPage(context, app.url()), app.url());
  await second.open();
  await second.openFromShelf(OFFICE_DEMO);
  return { context, first, second };
}

test("an edit in one tab shows in the other", async () => {
  const { context, first, second } = await twoTabsOnTheOfficeDemo();
  assert.equal(await first.title(), OFFICE_DEMO);
  assert.notEqual(await first.valueOf(AGE), "61");

  await first.setNumber(AGE, "61");
  await first.waitForSaveState("Saved on this device");
  await second.page.waitForFunction(
    (id) => document.querySelector(`[data-testid="${id}"]`)?.value === "61",
    AGE,
  );
  await second.page.waitForFunction(() =>
    document.querySelector('[data-testid="plan"]')?.textContent.includes("x 61 years"),
  );

  // And back: the second tab's edit builds on the revision it received.
  await second.setNumber("tasks-0--distance_m", "72");
  await second.waitForSaveState("Saved on this device");
  await first.page.waitForFunction(
    () => document.querySelector('[data-testid="tasks-0--distance_m"]')?.value === "72",
  );
  assert.equal(await first.byTestId("conflict").count(), 0);
  assert.equal(await second.byTestId("conflict").count(), 0);
  assert.equal(await first.saveState(), "Saved on this device");

  assert.deepEqual(first.page.problems(), []);
  assert.deepEqual(second.page.problems(), []);
  await context.close();
});

test("a scenario deleted in one tab stays open in the other and is stored again on its next edit", async () => {
  const { context, first, second } = await twoTabsOnTheOfficeDemo();

  await first.openFromShelf(OFFICE_DEMO);
  await first.byTestId("delete-scenario").click();
  await second.page.waitForFunction(() =>
    [...document.querySelectorAll('[data-testid="notice"] p')].some((p) => p.textContent.includes("deleted in another tab")),
  );
  assert.equal(await second.title(), OFFICE_DEMO, "the work stays open");
  assert.ok(!(await second.shelfNames()).includes(OFFICE_DEMO));

  await second.setNumber(AGE, "50");
  await second.waitForSaveState("Saved on this device");
  const restored = await second.storedByName(OFFICE_DEMO);
  assert.equal(restored.entry.scenario.wearer.age_years, 50);
  await first.page.waitForFunction(
    (name) => [...document.querySelectorAll('[data-testid="shelf-list"] .shelf-name')].some((n) => n.textContent.trim() === name),
    OFFICE_DEMO,
  );

  assert.deepEqual(first.page.problems(), []);
  assert.deepEqual(second.page.problems(), []);
  await context.close();
});

test("a deleted scenario comes back with Undo", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  const names = await planner.shelfNames();
  const { key } = await planner.storedByName(OFFICE_DEMO);

  await planner.byTestId("delete-scenario").click();
  await page.waitForFunction(
    (name) => document.querySelector('[data-testid="scenario-title"]')?.textContent.trim() !== name,
    OFFICE_DEMO,
  );
  assert.deepEqual(await planner.shelfNames(), names.filter((n) => n !== OFFICE_DEMO));
  assert.equal((await planner.storage())[key], undefined, "the entry left storage");
  const notice = planner.byTestId("notice").filter({ hasText: `Deleted "${OFFICE_DEMO}".` });
  assert.equal(await notice.count(), 1);

  await notice.getByRole("button", { name: "Undo" }).click();
  await page.waitForFunction(
    (name) => document.querySelector('[data-testid="scenario-title"]')?.textContent.trim() === name,
    OFFICE_DEMO,
  );
  assert.deepEqual(await planner.shelfNames(), names);
  assert.ok(await planner.storedByName(OFFICE_DEMO), "the entry is stored again");
  await planner.byTestId("recommendation").waitFor();
  assert.equal(await planner.byTestId("notice").filter({ hasText: "Deleted" }).count(), 0);

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("erasing all local data removes every key of the app and nothing else", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  await planner.openFromShelf(OFFICE_DEMO);
  await page.evaluate(() => localStorage.setItem("another-app/preferences", "{\"dark\":true}"));
  const ownKeys = Object.keys(await planner.storage()).filter((k) => k.startsWith("clearspan/"));
  assert.ok(ownKeys.includes("clearspan/settings"));
  assert.equal(ownKeys.filter((k) => k.startsWith(SCENARIO_PREFIX)).length, DEMO_COUNT);

  await page.getByRole("button", { name: "Erase all local data…" }).click();
  assert.equal(Object.keys(await planner.storedScenarios()).length, DEMO_COUNT, "nothing is erased before confirming");
  await planner.byTestId("confirm-erase").click();
  await page.waitForFunction(() =>
    [...document.querySelectorAll('[data-testid="notice"] p')].some((p) => p.textContent.startsWith("Erased all")),
  );

  const left = await planner.storage();
  assert.deepEqual(Object.keys(left).filter((k) => k.startsWith("clearspan/")), []);
  assert.equal(left["another-app/preferences"], "{\"dark\":true}", "another app's data is untouched");
  assert.ok(
    (await planner.notices()).includes(`Erased all of clearspan's data on this device (${ownKeys.length} stored items).`),
  );
  assert.deepEqual(await planner.shelfNames(), []);
  assert.equal(await planner.title(), "Untitled scenario");

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("renaming the open scenario and giving it a note are kept across a reload", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  const name = planner.byTestId("scenario-name");
  await name.fill("Workstation 4, fictional");
  await page.waitForFunction(
    () => document.querySelector('[data-testid="scenario-title"]')?.textContent === "Workstation 4, fictional",
  );
  assert.ok((await planner.shelfNames()).includes("Workstation 4, fictional"), "the shelf follows");
  await planner.byTestId("scenario-note").fill("second floor, left desk");
  await planner.waitForSaveState("Saved on this device");
  const stored = await planner.storedByName("Workstation 4, fictional");
  assert.equal(stored.entry.note, "second floor, left desk");

  await planner.reload();
  assert.equal(await planner.title(), "Workstation 4, fictional");
  assert.equal(await planner.valueOf("scenario-note"), "second floor, left desk");

  await name.fill("");
  assert.equal(await planner.messageFor("scenario-name"), "", "an empty name is allowed while typing");
  assert.deepEqual(page.problems(), []);
  await context.close();
});
