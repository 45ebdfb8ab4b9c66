// Measures how long the app takes from a typed task distance to the redrawn
// range chart, on a working day of 20 tasks. A measurement, not a test: it
// prints the figures and asserts no time limit. Run with `npm run measure`
// after a release build (`./dev.sh size`).
//
// Each sample is taken inside the page: performance.now() just before the
// input event is dispatched on a task's distance field, and again in the
// second requestAnimationFrame callback after it, by which time the new chart
// has been committed to the DOM and the frame showing it has been produced.
// Every sample also checks that the chart really shows the new distance.
import { readFile } from "node:fs/promises";
import { join, resolve } from "node:path";
import { serveDist, launchBrowser, watchedPage } from "../support/harness.js";
import { PlannerPage, VIEWPORTS } from "../support/planner-page.js";

const ROOT = resolve(import.meta.dirname, "../../..");
const TASKS = 20;
const WARM_UP = 3;
const SAMPLES = 30;
const NAME = "Fictional twenty-task day";

/** An export file with one scenario of `TASKS` tasks, built on the office demo's wearer and options. */
async function twentyTaskFile() {
  const demo = JSON.parse(await readFile(join(ROOT, "scenarios", "office-two-monitors.json"), "utf8"));
  const item = structuredClone(demo.scenarios[0]);
  const pattern = item.scenario.tasks;
  item.scenario.name = NAME;
  item.note = "Fictional: generated for the redraw measurement.";
  item.scenario.tasks = Array.from({ length: TASKS }, (_, i) => {
    const task = structuredClone(pattern[i % pattern.length]);
    task.name = `Task ${i + 1}`;
    task.hours_per_day = 0.4;
    return task;
  });
  return JSON.stringify({ ...demo, scenarios: [item] });
}

/** One edit: types `cm` into task `index`'s distance and waits two frames. */
function timedEdit(page, index, cm) {
  return page.evaluate(
    async ({ index, cm }) => {
      const input = document.querySelector(`[data-testid="tasks-${index}--distance_m"]`);
      const start = performance.now();
      input.value = String(cm);
      input.dispatchEvent(new Event("input", { bubbles: true }));
      await new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done)));
      const ms = performance.now() - start;
      const marker = [...document.querySelectorAll('[data-testid="range-chart"] .task-marker')].find((m) =>
        m.getAttribute("aria-label")?.startsWith(`${index + 1}. `),
      );
      const shown = marker?.getAttribute("aria-label") ?? "(no marker)";
      return { ms, redrawn: shown.endsWith(` at ${cm} cm`), shown };
    },
    { index, cm },
  );
}

function percentile(sorted, p) {
  const rank = Math.ceil((p / 100) * sorted.length) - 1;
  return sorted[Math.min(sorted.length - 1, Math.max(0, rank))];
}

const server = await serveDist();
const browser = await launchBrowser();
let failed = false;
try {
  const context = await browser.newContext({ viewport: VIEWPORTS.desktop });
  const page = await watchedPage(context, server.url);
  const planner = new PlannerPage(page, server.url);
  await planner.open();
  await planner.importFile("twenty-tasks.json", await twentyTaskFile());
  await page.waitForFunction(
    (name) => document.querySelector('[data-testid="scenario-title"]')?.textContent.trim() === name,
    NAME,
  );
  const count = await planner.taskCount();
  if (count !== TASKS) throw new Error(`expected ${TASKS} task cards, found ${count}`);
  await planner.byTestId("range-chart").waitFor();

  const samples = [];
  const missed = [];
  for (let i = 0; i < WARM_UP + SAMPLES; i += 1) {
    const index = (i * 7) % TASKS;
    const cm = 40 + (i % 2 === 0 ? i : 60 + i);
    const sample = await timedEdit(page, index, cm);
    if (!sample.redrawn) missed.push(`task ${index + 1} -> ${cm} cm: chart shows "${sample.shown}"`);
    if (i >= WARM_UP) samples.push(sample.ms);
  }
  const sorted = [...samples].sort((a, b) => a - b);
  const fmt = (ms) => `${ms.toFixed(1)} ms`;
  console.log(`redraw after a distance edit, ${TASKS} tasks, ${samples.length} edits (after ${WARM_UP} warm-up)`);
  console.log(`  median ${fmt(percentile(sorted, 50))}`);
  console.log(`  p90    ${fmt(percentile(sorted, 90))}`);
  console.log(`  min    ${fmt(sorted[0])}, max ${fmt(sorted[sorted.length - 1])}`);
  if (missed.length) {
    failed = true;
    console.error(`the chart did not show the new distance after ${missed.length} edit(s):\n  ${missed.join("\n  ")}`);
  }
  const problems = page.problems();
  if (problems.length) {
    failed = true;
    console.error(`page problems:\n  ${problems.join("\n  ")}`);
  }
  await context.close();
} finally {
  await browser.close();
  await server.close();
}
process.exitCode = failed ? 1 : 0;
