// The working day the measurements edit: a scenario of 20 tasks built on the
// office demo's wearer and options (fictional, generated), opened in a page.
import { readFile } from "node:fs/promises";
import { join, resolve } from "node:path";
import { watchedPage } from "../support/harness.js";
import { PlannerPage, VIEWPORTS } from "../support/planner-page.js";

const ROOT = resolve(import.meta.dirname, "../../..");
/** Tasks in the measured day. */
export const TASKS = 20;
const NAME = "Fictional twenty-task day";

/** An export file with one scenario of `TASKS` tasks. */
async function twentyTaskFile() {
  const demo = JSON.parse(await readFile(join(ROOT, "scenarios", "office-two-monitors.json"), "utf8"));
  const item = structuredClone(demo.scenarios[0]);
  const pattern = item.scenario.tasks;
  item.scenario.name = NAME;
  item.note = "Fictional: generated for the measurements.";
  item.scenario.tasks = Array.from({ length: TASKS }, (_, i) => ({
    ...structuredClone(pattern[i % pattern.length]),
    name: `Task ${i + 1}`,
    hours_per_day: 0.4,
  }));
  return JSON.stringify({ ...demo, scenarios: [item] });
}

/** A desktop page with the twenty-task day open and its chart drawn; resolves to { context, page }. */
export async function openTwentyTaskDay(browser, url) {
  const context = await browser.newContext({ viewport: VIEWPORTS.desktop });
  const page = await watchedPage(context, url);
  const planner = new PlannerPage(page, url);
  await planner.open();
  await planner.importFile("twenty-tasks.json", await twentyTaskFile());
  await page.waitForFunction(
    (name) => document.querySelector('[data-testid="scenario-title"]')?.textContent.trim() === name,
    NAME,
  );
  const count = await planner.taskCount();
  if (count !== TASKS) throw new Error(`expected ${TASKS} task cards, found ${count}`);
  await planner.byTestId("range-chart").waitFor();
  return { context, page };
}

/** The root of the checkout. */
export { ROOT };

/**
 * Types `count` distance edits into the day's tasks in `page` (task i*7 mod
 * 20, 40 to 69 cm), each waiting two animation frames: the edits the
 * profile and the trace record.
 */
export async function editDistances(page, count) {
  for (let i = 0; i < count; i += 1) {
    await page.evaluate(
      async ({ index, cm }) => {
        const input = document.querySelector(`[data-testid="tasks-${index}--distance_m"]`);
        input.value = String(cm);
        input.dispatchEvent(new Event("input", { bubbles: true }));
        await new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done)));
      },
      { index: (i * 7) % TASKS, cm: 40 + (i % 30) },
    );
  }
}
