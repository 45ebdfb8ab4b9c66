// Details where the finger is: choosing a task on the comparison (its row),
// the range chart (its numbered marker) or the lens map (its point) opens the
// task's numbers beside what was chosen, inside the window, as a labelled
// dialog that takes the focus; Escape or its close button closes it and
// puts the focus back on the mark. Checked on a 1366 px desktop, a 1024 px
// landscape tablet and a 768 px portrait tablet, with screenshots kept in
// target/screenshots/detail-<size>-<mark>.png; an open detail is not
// printed and the plan sheet still fits one A4 page.
import { test } from "node:test";
import assert from "node:assert/strict";
import { appUnderTest, screenshot } from "../support/harness.js";
import { freshPlanner, VIEWPORTS } from "../support/planner-page.js";

const app = appUnderTest();

/** The three kinds of mark a detail opens from, by their `data-mark` prefix. */
const MARKS = [
  ["row", "a comparison row"],
  ["marker", "a range-chart marker"],
  ["point", "a lens-map point"],
];

const SIZES = [
  ["desktop", "desktop"],
  ["tabletLandscape", "tablet-landscape"],
  ["tabletPortrait", "tablet-portrait"],
];

/** Boxes of the open detail and of `mark`, the window size and what has the focus. */
function geometry(page, mark) {
  return page.evaluate((mark) => {
    const box = (el) => {
      const r = el.getBoundingClientRect();
      return { left: r.left, top: r.top, right: r.right, bottom: r.bottom };
    };
    const detail = document.querySelector('[data-testid="task-detail"]');
    const active = document.activeElement;
    return {
      detail: box(detail),
      mark: box(document.querySelector(`[data-mark="${mark}"]`)),
      width: document.documentElement.clientWidth,
      height: document.documentElement.clientHeight,
      focusInside: detail.contains(active),
      role: detail.getAttribute("role"),
      labelledBy: document.getElementById(detail.getAttribute("aria-labelledby"))?.textContent ?? "",
    };
  }, mark);
}

/** Whether the element with the focus is the mark `mark`. */
/**
 * Whether the focus is on the mark `mark` or reaches it within a second: the
 * marks are written again when a detail closes, and the focus follows them a
 * frame later.
 */
function focusIsOn(page, mark) {
  return page
    .waitForFunction((mark) => document.activeElement?.getAttribute("data-mark") === mark, mark, { timeout: 1000 })
    .then(
      () => true,
      () => false,
    );
}

/** The `data-mark` of the last mark of kind `kind` (the last task's), scrolled into view. */
async function lastMark(page, kind) {
  const marks = page.locator(`[data-mark^="${kind}-"]`);
  const mark = marks.last();
  await mark.scrollIntoViewIfNeeded();
  return { mark, id: await mark.getAttribute("data-mark") };
}

for (const [size, file] of SIZES) {
  const { width, height } = VIEWPORTS[size];
  test(`at ${width}x${height} a task's detail opens beside the row, marker or point chosen, and closes back to it`, async () => {
    const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { viewport: VIEWPORTS[size] });
    await planner.open();
    await planner.byTestId("range-chart").waitFor();
    const detail = planner.byTestId("task-detail");
    for (const [kind, what] of MARKS) {
      const { mark, id } = await lastMark(page, kind);
      // Rows by a click, markers by the keyboard, points by a click.
      if (kind === "marker") {
        await mark.focus();
        await page.keyboard.press("Enter");
      } else {
        await mark.click();
      }
      await detail.waitFor();
      await page.waitForFunction(() => document.querySelector('[data-testid="task-detail"]')?.contains(document.activeElement));
      const g = await geometry(page, id);
      const where = `${what} at ${width}x${height}`;
      assert.equal(g.role, "dialog", `the detail is a dialog (${where})`);
      assert.match(g.labelledBy, /^\d+\. .+ in detail$/, `the dialog is named by its heading (${where})`);
      assert.ok(g.focusInside, `the focus moved into the detail (${where})`);
      assert.equal(await mark.getAttribute("aria-expanded"), "true", `the mark says its detail is open (${where})`);
      // Inside the window, whole.
      assert.ok(
        g.detail.left >= 0 && g.detail.top >= 0 && g.detail.right <= g.width && g.detail.bottom <= g.height,
        `the detail ${JSON.stringify(g.detail)} lies inside the ${g.width}x${g.height} window (${where})`,
      );
      // Beside the mark: just under it or just over it, and overlapping it sideways.
      const under = Math.abs(g.detail.top - g.mark.bottom) <= 12;
      const over = Math.abs(g.mark.top - g.detail.bottom) <= 12;
      assert.ok(under || over, `the detail ${JSON.stringify(g.detail)} sits next to the mark ${JSON.stringify(g.mark)} (${where})`);
      assert.ok(
        g.detail.left <= g.mark.right && g.detail.right >= g.mark.left,
        `the detail is level with the mark sideways (${where})`,
      );
      await screenshot(page, `detail-${file}-${kind}`, { fullPage: false });

      // Closed by Escape (the marker and the point) or by its button (the row); the focus goes back to the mark.
      if (kind === "row") {
        await planner.byTestId("task-detail-close").click();
      } else {
        await page.keyboard.press("Escape");
      }
      await detail.waitFor({ state: "detached" });
      assert.ok(await focusIsOn(page, id), `the focus is back on ${what} (${width}x${height})`);
      assert.equal(await mark.getAttribute("aria-expanded"), "false");
    }
    assert.deepEqual(page.problems(), []);
    await context.close();
  });
}

test("an open detail is not printed, and the plan sheet still fits one A4 page", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { viewport: VIEWPORTS.tabletPortrait });
  await planner.open();
  const { mark } = await lastMark(page, "point");
  await mark.click();
  await planner.byTestId("task-detail").waitFor();
  await page.emulateMedia({ media: "print" });
  assert.equal(await planner.byTestId("task-detail").isVisible(), false, "the detail stays on screen only");
  assert.ok(await planner.byTestId("order-sheet").isVisible(), "the sheet prints");
  const pdf = await page.pdf({ format: "A4", printBackground: true });
  const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length;
  assert.equal(pages, 1, "the plan sheet fits one A4 page with a detail open");
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("a detail follows its task through edits and closes when another scenario is opened", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url(), { viewport: VIEWPORTS.desktop });
  await planner.open();
  const { mark, id } = await lastMark(page, "row");
  await mark.click();
  const detail = planner.byTestId("task-detail");
  await detail.waitFor();
  const heading = await detail.locator("h3").textContent();
  // An edit of the wearer re-plans; the same task's detail stays open beside its row.
  await planner.byTestId("wearer-age_years").fill("61");
  await page.waitForFunction(() => document.querySelector('[data-testid="plan"]')?.textContent.includes("x 61 years"));
  assert.equal(await detail.locator("h3").textContent(), heading, "the detail still shows the task chosen");
  const g = await geometry(page, id);
  assert.ok(Math.abs(g.detail.top - g.mark.bottom) <= 12 || Math.abs(g.mark.top - g.detail.bottom) <= 12, "and still sits beside its row");
  // Another scenario: its tasks are others, so no detail opens by itself.
  await planner.byTestId("new-scenario").click();
  await page.waitForFunction(
    () => document.querySelector('[data-testid="scenario-title"]')?.textContent.trim() === "Untitled scenario",
  );
  assert.equal(await detail.count(), 0, "the detail closed with the scenario it belonged to");
  assert.deepEqual(page.problems(), []);
  await context.close();
});
