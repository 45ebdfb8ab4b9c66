// A DevTools trace of distance edits on a 20-task day, in headless Chromium:
// the main thread's time per edit split into the browser's own phases
// (script, style, layout, paint and the rest), summed from the trace's
// top-level events. A measurement, not a test. Run with `npm run trace`
// after a release build.
import { resolve } from "node:path";
import { serveDist, launchBrowser } from "../support/harness.js";
import { editDistances, openTwentyTaskDay, TASKS } from "./day.js";
import { timeByPhase } from "./phases.js";

const EDITS = 30;

const server = await serveDist(process.env.CLEARSPAN_DIST ? resolve(process.env.CLEARSPAN_DIST) : undefined);
const browser = await launchBrowser();
try {
  const { context, page } = await openTwentyTaskDay(browser, server.url);
  const cdp = await context.newCDPSession(page);
  const events = [];
  cdp.on("Tracing.dataCollected", ({ value }) => events.push(...value));
  const done = new Promise((resolve) => cdp.once("Tracing.tracingComplete", resolve));
  await cdp.send("Tracing.start", { categories: "devtools.timeline,disabled-by-default-devtools.timeline", transferMode: "ReportEvents" });
  await editDistances(page, EDITS);
  await cdp.send("Tracing.end");
  await done;
  const main = events.find((e) => e.name === "thread_name" && e.args?.name === "CrRendererMain");
  const { wall: totals, cpu } = timeByPhase(events, main ?? {});
  console.log(`${EDITS} edits on a ${TASKS}-task day; main-thread time per edit by phase (wall, CPU):`);
  for (const [kind, ms] of Object.entries(totals).sort((a, b) => b[1] - a[1])) {
    console.log(`  ${kind.padEnd(7)} ${(ms / EDITS).toFixed(2).padStart(7)} ms ${(cpu[kind] / EDITS).toFixed(2).padStart(7)} ms`);
  }
  await context.close();
} finally {
  await browser.close();
  await server.close();
}
