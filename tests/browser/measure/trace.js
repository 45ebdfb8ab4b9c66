// A DevTools trace of distance edits on a 20-task day, in headless Chromium:
// the main thread's time per edit split into the browser's own phases
// (script, style, layout, paint and the rest), summed from the trace's
// top-level events. A measurement, not a test. Run with `npm run trace`
// after a release build.
import { resolve } from "node:path";
import { serveDist, launchBrowser } from "../support/harness.js";
import { editDistances, openTwentyTaskDay, TASKS } from "./day.js";

const EDITS = 30;

/** The phase a trace event's time counts under, or null for an event not counted. */
function phase(name) {
  if (["FunctionCall", "EvaluateScript", "RunMicrotasks", "EventDispatch", "TimerFire", "FireAnimationFrame", "v8.callFunction"].includes(name)) return "script";
  if (["UpdateLayoutTree", "RecalculateStyles", "ParseAuthorStyleSheet"].includes(name)) return "style";
  if (["Layout", "UpdateLayerTree", "Layerize"].includes(name)) return "layout";
  if (["Paint", "PaintImage", "PrePaint", "RasterTask", "CompositeLayers", "Commit"].includes(name)) return "paint";
  return null;
}

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
  // Wall time (dur) and the main thread's own CPU time (tdur): on a shared
  // machine the CPU time is the steadier of the two.
  const totals = {};
  const cpu = {};
  // Only complete events on the renderer's main thread, and only the outermost of
  // each phase: a Layout inside a FunctionCall counts as layout (forced), not script.
  const open = [];
  for (const e of events.filter((e) => e.ph === "X" && e.pid === main?.pid && e.tid === main?.tid).sort((a, b) => a.ts - b.ts)) {
    const kind = phase(e.name);
    if (!kind) continue;
    while (open.length && open.at(-1).end <= e.ts) open.pop();
    const parent = open.at(-1);
    if (parent && parent.kind === kind) continue;
    const ms = (e.dur ?? 0) / 1000;
    const own = (e.tdur ?? e.dur ?? 0) / 1000;
    totals[kind] = (totals[kind] ?? 0) + ms;
    cpu[kind] = (cpu[kind] ?? 0) + own;
    if (parent) {
      totals[parent.kind] -= ms;
      cpu[parent.kind] -= own;
    }
    open.push({ kind, end: e.ts + (e.dur ?? 0) });
  }
  console.log(`${EDITS} edits on a ${TASKS}-task day; main-thread time per edit by phase (wall, CPU):`);
  for (const [kind, ms] of Object.entries(totals).sort((a, b) => b[1] - a[1])) {
    console.log(`  ${kind.padEnd(7)} ${(ms / EDITS).toFixed(2).padStart(7)} ms ${(cpu[kind] / EDITS).toFixed(2).padStart(7)} ms`);
  }
  await context.close();
} finally {
  await browser.close();
  await server.close();
}
