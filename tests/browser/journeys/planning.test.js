// Planning journeys: a user builds a scenario, reads the plan, switches
// units, makes and corrects mistakes, changes the working day, prints the
// plan sheet, and uses the app on a desktop and on tablets.
import { test } from "node:test";
import assert from "node:assert/strict";
import { readFile, mkdir } from "node:fs/promises";
import { join } from "node:path";
import { appUnderTest, screenshot, SHOTS } from "../support/harness.js";
import { DEMOS, freshPlanner, VIEWPORTS } from "../support/planner-page.js";

const VERDICT_WORDS = new Set(["comfortable", "in focus, tiring", "blurred"]);
const DISTANCE = "tasks-0--distance_m";

const app = appUnderTest();

/** A fresh context with the demo loaded, then a new untitled scenario opened. */
async function newScenario(options) {
  const session = await freshPlanner(app.browser(), app.url(), options);
  await session.planner.open();
  await session.planner.showShelf();
  await session.planner.byTestId("new-scenario").click();
  await session.page.waitForFunction(
    () => document.querySelector('[data-testid="scenario-title"]')?.textContent.trim() === "Untitled scenario",
  );
  return session;
}

test("a new scenario with an age and a monitor distance gets a plan", async () => {
  const { context, page, planner } = await newScenario();
  assert.equal(await planner.taskCount(), 1, "a new scenario starts with one task");
  await assert.doesNotReject(
    page.waitForFunction(() => document.activeElement?.dataset.testid === "scenario-name"),
    "after New, focus is on the scenario's name",
  );

  await planner.fieldByLabel("Age").fill("52");
  await planner.byTestId("task-0-name").fill("Monitor");
  await planner.setNumber(DISTANCE, "70");

  await planner.byTestId("recommendation").waitFor();
  await assert.doesNotReject(
    page.waitForFunction(() => document.querySelector('[data-testid="plan"]')?.textContent.includes("x 52 years")),
    "the plan's amplitude line follows the age typed",
  );
  const recommendation = await planner.byTestId("recommendation").textContent();
  assert.match(recommendation, /^Recommended: /);
  assert.deepEqual(await planner.comparisonRows(), ["1. Monitor"]);
  const cells = await planner.verdictCells();
  assert.equal(cells.length, 3, "one verdict per starter lens option for the one task");
  for (const words of cells) assert.ok(VERDICT_WORDS.has(words), `verdict words "${words}"`);
  const sheet = await planner.orderSheetTasks();
  assert.equal(sheet.length, 1);
  assert.match(sheet[0], /^Monitor: 70 cm at -15°/);
  assert.match(await planner.byTestId("cautions").textContent(), /planning aid/i);
  assert.equal(await page.getByTestId("stale").count(), 0);

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("the shelf's scenarios stay folded on tablets until wanted and open beside the form on a desktop", async () => {
  for (const [viewport, open] of [[VIEWPORTS.tabletPortrait, false], [VIEWPORTS.tabletLandscape, false], [VIEWPORTS.desktop, true]]) {
    const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { viewport });
    await planner.open();
    await planner.byTestId("recommendation").waitFor();
    const more = planner.byTestId("shelf-more");
    assert.equal((await more.getAttribute("open")) !== null, open, `${viewport.width} px`);
    assert.match(await more.locator("summary").textContent(), /^Scenarios on this device \(\d+\)$/);
    if (!open) {
      // The wearer's first field starts within the first screen.
      const top = await page.getByTestId("wearer-age_years").evaluate((e) => e.getBoundingClientRect().top);
      assert.ok(top < viewport.height, `the form starts on the first screen (${top} px)`);
      await planner.showShelf();
      assert.ok(await planner.byTestId("shelf-list").isVisible());
      assert.ok((await planner.shelfNames()).length > 0);
    }
    assert.deepEqual(page.problems(), []);
    await context.close();
  }
});

test("on a tablet in portrait the plan at a glance follows an edit and leads to the plan and back", async () => {
  const { context, page, planner } = await newScenario({ viewport: VIEWPORTS.tabletPortrait });
  const peek = planner.byTestId("plan-peek");
  await peek.waitFor();
  await planner.setNumber(DISTANCE, "35");
  await assert.doesNotReject(
    page.waitForFunction(() => /\d comfortable, \d tiring, \d blurred$/.test(
      document.querySelector('[data-testid="plan-peek"] p')?.textContent ?? "")),
    "the bar counts the tasks by verdict",
  );
  const before = await page.evaluate(() => window.scrollY);
  await peek.getByRole("button", { name: "See the plan" }).click();
  await page.waitForFunction((y) => window.scrollY > y + 200, before);
  await peek.getByRole("button", { name: "Back to the form" }).click();
  await page.waitForFunction((y) => Math.abs(window.scrollY - y) < 2, before);
  await screenshot(page, "tablet-portrait-peek");
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("on a desktop the plan stays in view while the form scrolls", async () => {
  const { context, page, planner } = await newScenario({ viewport: VIEWPORTS.desktop });
  await planner.byTestId("recommendation").waitFor();
  await page.evaluate(() => window.scrollTo(0, document.body.scrollHeight));
  const { top, bottom, height } = await page.evaluate(() => {
    const box = document.querySelector('[data-testid="outcome"]').getBoundingClientRect();
    return { top: box.top, bottom: box.bottom, height: window.innerHeight };
  });
  assert.ok(top > -2 && bottom < height + 2, `the plan spans ${top} to ${bottom} px of a ${height} px window`);
  assert.equal(await planner.byTestId("plan-peek").isVisible(), false, "no bar on a wide screen");
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("a new task starts from the kind chosen, with its figures and their source shown", async () => {
  const { context, page, planner } = await newScenario();
  await planner.byTestId("task-kind").selectOption("phone");
  assert.match(await planner.byTestId("task-kind-source").textContent(), /Bababekova et al\. 2011/);
  await planner.byTestId("add-task").click();
  await page.waitForFunction(() => document.querySelectorAll('[data-testid="task-card"]').length === 2);
  assert.equal(await planner.valueOf("tasks-1--distance_m"), "35", "a phone starts at 35 cm");
  assert.equal(await planner.valueOf("tasks-1--detail_mm"), "1.2", "with small phone text");
  const phone = planner.byTestId("task-card").nth(1);
  assert.ok(await phone.getByLabel("Screen text (detail is the character height)", { exact: true }).isChecked());
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("choosing a task on the lens map opens its detail beside the point, inside the window", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { viewport: VIEWPORTS.desktop });
  await planner.open();
  const point = page.locator(".lens-point").last();
  await point.scrollIntoViewIfNeeded();
  await point.click();
  const detail = planner.byTestId("task-detail");
  await detail.waitFor();
  await assert.doesNotReject(
    page.waitForFunction(() => {
      const box = document.querySelector('[data-testid="task-detail"]').getBoundingClientRect();
      const dot = document.querySelectorAll(".lens-point");
      const mark = dot[dot.length - 1].getBoundingClientRect();
      const beside = Math.abs(box.top - mark.bottom) <= 12 || Math.abs(mark.top - box.bottom) <= 12;
      return beside && box.top >= 0 && box.bottom <= window.innerHeight;
    }),
    "the detail of the chosen task is on screen, next to the point",
  );
  assert.match(await detail.locator("h3").textContent(), / in detail$/);
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("switching units converts the task distance and back", async () => {
  const { context, page, planner } = await newScenario();
  await planner.setNumber(DISTANCE, "65");
  assert.equal(await planner.unitOf(DISTANCE), "cm");

  await planner.byTestId("unit-toggle").click();
  await page.waitForFunction(() => document.querySelector('[data-testid="unit-toggle"]')?.textContent === "Show centimetres");
  const inches = await planner.valueOf(DISTANCE);
  // 65 cm / 2.54 cm per inch (exact since 1959) = 25.59 in.
  assert.equal(Number(inches).toFixed(1), "25.6", `65 cm shown as "${inches}" in`);
  assert.equal(await planner.unitOf(DISTANCE), "in");
  assert.match((await planner.orderSheetTasks())[0], /: 26 in at/);

  await planner.byTestId("unit-toggle").click();
  await page.waitForFunction(() => document.querySelector('[data-testid="unit-toggle"]')?.textContent === "Show inches");
  assert.equal(await planner.valueOf(DISTANCE), "65");
  assert.equal(await planner.unitOf(DISTANCE), "cm");
  assert.match((await planner.orderSheetTasks())[0], /: 65 cm at/);

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("an invalid distance is explained, the last plan stays marked stale, and fixing it clears the mark", async () => {
  const { context, page, planner } = await newScenario();
  await planner.setNumber(DISTANCE, "65");
  await planner.byTestId("recommendation").waitFor();
  const stale = page.getByTestId("stale");
  assert.equal(await stale.count(), 0);

  await planner.setNumber(DISTANCE, "-3");
  await stale.waitFor();
  assert.equal(await planner.messageFor(DISTANCE), "Distance must be between 10 cm and 1,000 m.");
  assert.equal(await planner.byTestId(DISTANCE).getAttribute("aria-invalid"), "true");
  assert.ok(await planner.byTestId("recommendation").isVisible(), "the previous recommendation stays");
  assert.ok(await planner.byTestId("comparison").isVisible(), "the previous comparison stays");
  assert.match((await planner.orderSheetTasks())[0], /: 65 cm at/, "the plan on screen is still the one for 65 cm");

  await planner.setNumber(DISTANCE, "abc");
  assert.equal(await planner.messageFor(DISTANCE), '"abc" is not a number: type digits, with a point or a comma before any decimals.');
  assert.equal(await planner.valueOf(DISTANCE), "abc", "the user's text is kept for correction");
  assert.ok(await stale.isVisible(), "still stale: the scenario has no valid distance yet");
  assert.ok(await planner.byTestId("recommendation").isVisible());

  await planner.setNumber(DISTANCE, "80");
  await stale.waitFor({ state: "detached" });
  assert.equal(await planner.messageFor(DISTANCE), "");
  assert.equal(await planner.byTestId(DISTANCE).getAttribute("aria-invalid"), "false");
  assert.match((await planner.orderSheetTasks())[0], /: 80 cm at/);

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("adding and removing tasks updates the cards and the comparison rows", async () => {
  const { context, page, planner } = await newScenario();
  await planner.byTestId("add-task").click();
  await page.waitForFunction(() => document.querySelectorAll('[data-testid="task-card"]').length === 2);
  assert.equal(await planner.valueOf("task-1-name"), "Task 2");
  await planner.byTestId("task-1-name").fill("Phone");
  await planner.setNumber("tasks-1--distance_m", "35");
  await page.waitForFunction(
    () => document.querySelectorAll('[data-testid="comparison"] tbody tr').length === 2,
  );
  assert.deepEqual(await planner.comparisonRows(), ["1. Screen", "2. Phone"]);
  assert.equal((await planner.verdictCells()).length, 2 * 3);

  await page.getByRole("button", { name: "Remove task Screen" }).click();
  await page.waitForFunction(() => document.querySelectorAll('[data-testid="task-card"]').length === 1);
  assert.equal(await planner.valueOf("task-0-name"), "Phone", "the remaining card is the phone task");
  assert.equal(await planner.valueOf(DISTANCE), "35", "and shows the phone's distance");
  await page.waitForFunction(
    () => document.querySelectorAll('[data-testid="comparison"] tbody tr').length === 1,
  );
  assert.deepEqual(await planner.comparisonRows(), ["1. Phone"]);
  assert.match((await planner.orderSheetTasks())[0], /^Phone: 35 cm/);
  assert.equal(await page.getByRole("button", { name: "Remove task Screen" }).count(), 0);

  // The removal can be undone: focus lands on the undo button, so a second
  // Enter puts the task back where it was instead of removing another.
  await planner.byTestId("undo-remove").waitFor();
  await page.waitForFunction(() => document.activeElement?.getAttribute("data-testid") === "undo-remove");
  await page.keyboard.press("Enter");
  await page.waitForFunction(() => document.querySelectorAll('[data-testid="task-card"]').length === 2);
  assert.equal(await planner.valueOf("task-0-name"), "Screen", "the screen task is back in first place");
  assert.equal(await planner.byTestId("undo-remove").count(), 0, "the undo is spent");

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("the print view shows the plan sheet without the inputs", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  await planner.byTestId("recommendation").waitFor();
  await page.emulateMedia({ media: "print" });

  // The printed sheet is one page: the working inputs, the comparison table
  // and the range chart stay on screen only.
  const hidden = ["wearer-age_years", DISTANCE, "shelf", "unit-toggle", "add-task", "comparison", "range-chart"];
  for (const id of hidden) {
    assert.equal(await planner.byTestId(id).isVisible(), false, `${id} is hidden in print`);
  }
  for (const id of ["order-sheet", "cautions", "recommendation", "lens-map"]) {
    assert.ok(await planner.byTestId(id).isVisible(), `${id} is printed`);
  }
  const heading = page.locator(".order-sheet .print-only");
  assert.ok(await heading.isVisible(), "the sheet names itself when printed");
  assert.equal((await heading.textContent()).trim(), `clearspan plan sheet: ${await planner.title()}`);
  assert.equal(await page.getByRole("button", { name: "Print plan sheet" }).isVisible(), false);
  await screenshot(page, "print-view");

  await mkdir(SHOTS, { recursive: true });
  const pdfPath = join(SHOTS, "plan-sheet.pdf");
  await page.pdf({ path: pdfPath, format: "A4", printBackground: true });
  const pdf = await readFile(pdfPath);
  assert.equal(pdf.subarray(0, 5).toString("latin1"), "%PDF-");
  const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length;
  console.log(`plan-sheet.pdf: ${pdf.length} bytes, ${pages} page(s)`);
  assert.equal(pages, 1, "the plan sheet fits one A4 page");

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("every demo's plan sheet prints on one A4 page and on one US Letter page", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  await mkdir(SHOTS, { recursive: true });
  const spills = [];
  for (const name of DEMOS) {
    await planner.openFromShelf(name);
    await planner.byTestId("order-sheet").waitFor();
    await page.emulateMedia({ media: "print" });
    for (const format of ["A4", "Letter"]) {
      const pdf = await page.pdf({ format, printBackground: true });
      const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length;
      if (pages !== 1) spills.push(`${name}: ${pages} ${format} pages`);
    }
    await page.emulateMedia({ media: "screen" });
  }
  assert.deepEqual(spills, [], "each sheet fits one page");
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test(
  "removing a task does not carry a half-typed entry over to the task that takes its place",
  async () => {
    const { context, page, planner } = await newScenario();
    await planner.byTestId("add-task").click();
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="task-card"]').length === 2);
    // Both tasks start at the new-task distance (65 cm); the first gets a typo.
    await planner.setNumber(DISTANCE, "abc");
    assert.equal(await planner.messageFor(DISTANCE), '"abc" is not a number: type digits, with a point or a comma before any decimals.');

    await page.getByRole("button", { name: "Remove task Screen" }).click();
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="task-card"]').length === 1);
    assert.equal(await planner.valueOf("task-0-name"), "Task 2");
    assert.equal(await planner.valueOf(DISTANCE), "65", "the remaining task shows its own distance");
    assert.equal(await planner.messageFor(DISTANCE), "", "and no message about text typed for the removed task");

    assert.deepEqual(page.problems(), []);
    await context.close();
  },
);

test("text typed in a task stays with that task when a task above it is removed or put back", async () => {
  const { context, page, planner } = await newScenario();
  const cards = (n) => page.waitForFunction((n) => document.querySelectorAll('[data-testid="task-card"]').length === n, n);
  await planner.byTestId("add-task").click();
  await cards(2);
  await planner.byTestId("add-task").click();
  await cards(3);
  await planner.byTestId("task-2-name").fill("Bench");
  // Half-typed and not a number: it stays in the field, with its message, and the plan is stale.
  await planner.setNumber("tasks-2--distance_m", "12,,");
  const message = await planner.messageFor("tasks-2--distance_m");
  assert.notEqual(message, "", "the typed text is refused with a message");
  await page.getByTestId("stale").waitFor();

  await page.getByRole("button", { name: "Remove task Screen" }).click();
  await cards(2);
  assert.equal(await planner.valueOf("task-1-name"), "Bench", "the bench task moved up");
  assert.equal(await planner.valueOf("tasks-1--distance_m"), "12,,", "its typed text moved with it");
  assert.equal(await planner.messageFor("tasks-1--distance_m"), message);
  assert.equal(await planner.valueOf(DISTANCE), "65", "the task now first shows its own distance");
  assert.equal(await planner.messageFor(DISTANCE), "");
  assert.ok(await page.getByTestId("stale").isVisible(), "still stale: the bench field holds no number");

  await planner.byTestId("undo-remove").click();
  await cards(3);
  assert.equal(await planner.valueOf("task-0-name"), "Screen", "the removed task is back in first place");
  assert.equal(await planner.valueOf("tasks-2--distance_m"), "12,,", "and the bench task keeps its text");

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("typing inside a value, however fast, keeps each keystroke where it was typed and the caret after it", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { viewport: VIEWPORTS.desktop });
  await planner.open();
  // A number, a signed power, a task's name, the scenario's name and its
  // note (stored a moment after each keystroke, in this tab's turn).
  for (const id of [DISTANCE, "wearer-right-sphere_d", "task-0-name", "scenario-name", "scenario-note"]) {
    const field = planner.byTestId(id);
    await field.scrollIntoViewIfNeeded();
    await field.click();
    await field.evaluate((input) => input.setSelectionRange(1, 1));
    const before = await field.inputValue();
    await page.keyboard.type("05");
    // Every update the keystrokes started has run once the save state has settled.
    await page.waitForTimeout(300);
    const [value, caret] = await field.evaluate((input) => [input.value, input.selectionStart]);
    assert.equal(value, `${before.slice(0, 1)}05${before.slice(1)}`, `${id}: the keystrokes stay where they were typed`);
    assert.equal(caret, 3, `${id}: the caret stays after them`);
  }
  assert.deepEqual(page.problems(), []);
  await context.close();
});

/** Controls a user touches whose drawn box is under 44 px tall or wide. */
function smallControls(page) {
  return page.evaluate(() => {
    const controls = document.querySelectorAll(
      'button, input, select, textarea, [role="button"], label.button',
    );
    const counts = new Map();
    for (const el of controls) {
      let box = el.getBoundingClientRect();
      // A check box's target is the box and its label together (the label toggles it).
      const label = el.type === "checkbox" ? el.labels?.[0] : null;
      if (label) {
        const l = label.getBoundingClientRect();
        const left = Math.min(box.left, l.left);
        const top = Math.min(box.top, l.top);
        box = { width: Math.max(box.right, l.right) - left, height: Math.max(box.bottom, l.bottom) - top };
      }
      // Not drawn, or the 1 px visually-hidden pattern whose label is the control.
      if (box.width <= 1 || box.height <= 1 || getComputedStyle(el).visibility === "hidden") continue;
      if (box.width >= 44 && box.height >= 44) continue;
      const name =
        el.getAttribute("aria-label") ||
        el.getAttribute("data-testid") ||
        (el.labels?.[0]?.textContent ?? "") ||
        el.textContent.trim().slice(0, 40);
      const tag = `${el.tagName.toLowerCase()}${el.type ? `[${el.type}]` : ""}`;
      const what = `${tag} "${name}" ${Math.round(box.width)}x${Math.round(box.height)} px`;
      counts.set(what, (counts.get(what) ?? 0) + 1);
    }
    return [...counts].map(([what, n]) => (n > 1 ? `${what} (x${n})` : what));
  });
}

const LAYOUTS = [
  ["desktop", "desktop"],
  ["tabletLandscape", "tablet-landscape"],
  ["tabletPortrait", "tablet-portrait"],
];

for (const [name, file] of LAYOUTS) {
  const { width, height } = VIEWPORTS[name];
  test(`layout at ${width}x${height} fits the window without sideways scrolling`, async () => {
    const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { viewport: VIEWPORTS[name] });
    await planner.open();
    await planner.byTestId("range-chart").waitFor();
    await screenshot(page, file);
    const { scrollWidth, innerWidth } = await page.evaluate(() => ({
      scrollWidth: document.documentElement.scrollWidth,
      innerWidth: window.innerWidth,
    }));
    assert.ok(scrollWidth <= innerWidth + 1, `document is ${scrollWidth} px wide in a ${innerWidth} px window`);
    // The comparison's score rows put one cell under each option, side by side.
    const stacked = await page.evaluate(() =>
      [...document.querySelectorAll('[data-testid="comparison"] tr')]
        .filter((tr) => new Set([...tr.cells].map((c) => Math.round(c.getBoundingClientRect().top))).size > 1)
        .map((tr) => tr.cells[0]?.textContent.trim()),
    );
    assert.deepEqual(stacked, [], "comparison rows whose cells are not side by side");
    assert.deepEqual(page.problems(), []);
    await context.close();
  });
}

test(
  "every visible control is at least 44 px tall and wide at desktop and tablet sizes",
  async () => {
    const offenders = [];
    for (const [name] of LAYOUTS) {
      const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { viewport: VIEWPORTS[name] });
      await planner.open();
      await planner.byTestId("range-chart").waitFor();
      const { width, height } = VIEWPORTS[name];
      for (const what of await smallControls(page)) offenders.push(`${width}x${height}: ${what}`);
      assert.deepEqual(page.problems(), []);
      await context.close();
    }
    assert.deepEqual(offenders, [], `controls under 44 px:\n  ${offenders.join("\n  ")}`);
  },
);
