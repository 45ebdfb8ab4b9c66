// Measures the three browser figures of the speed goals, after a release
// build (`./dev.sh measure` builds and runs it). A measurement, not a test:
// it prints the figures and asserts no time limit.
//
// 1. Download: the wasm and JavaScript the page loads, compressed with
//    gzip -9, in bytes.
// 2. Edit to settled page, on a working day of 20 tasks: performance.now()
//    just before the input event is dispatched on a task's distance field,
//    and again right after the page's updates have run (in the next task,
//    after every microtask the edit queued), with style and layout forced
//    (reading offsetHeight), without waiting for a frame;
//    median and 90th percentile. The figure that also waits for two
//    animation frames (the display's refresh) is printed as a second line,
//    and the main thread's own CPU time over the same span (script, style
//    and layout) as a third, from the same edits run again under a DevTools
//    trace (`phases.js`): on a shared machine the wall-clock figure counts
//    other work too.
//    Every sample checks that the chart really shows the new distance.
// 3. First plan on screen: from navigation start to the range chart in the
//    DOM, in a fresh context (cold cache), median of several loads; the
//    chart's arrival is marked by a mutation observer (`first-plan.js`), so
//    work the app puts off until after the first paint does not count.
//    `npm run measure:startup` splits this time by the app's own marks.
//
// On a machine shared with other work, compare builds only in the same
// minutes: CLEARSPAN_COMPARE=DIR[,DIR] measures those builds too, in turn
// with the first, load by load and edit by edit.
import { readFile } from "node:fs/promises";
import { join, resolve } from "node:path";
import { serveDist, launchBrowser } from "../support/harness.js";
import { openTwentyTaskDay, ROOT, TASKS } from "./day.js";
import { firstVisit, FIRST_PLAN } from "./first-plan.js";
import { timeByPhase } from "./phases.js";

/**
 * The builds measured: dist/, or the directory CLEARSPAN_DIST names (an
 * earlier build); and, for a before-and-after on a shared machine, the
 * directories CLEARSPAN_COMPARE lists (comma-separated), measured in turn
 * with it, load by load and edit by edit, so that both see the same load.
 */
const DISTS = [
  process.env.CLEARSPAN_DIST ? resolve(process.env.CLEARSPAN_DIST) : join(ROOT, "dist"),
  ...(process.env.CLEARSPAN_COMPARE ?? "").split(",").filter(Boolean).map((d) => resolve(d)),
];
const WARM_UP = 3;
const SAMPLES = 30;

/**
 * One edit: types `cm` into task `index`'s distance; measures the work up to
 * a forced layout (`settled`) and up to the second animation frame (`framed`).
 * Marks `measure:edit:ID` and `measure:settled:ID` in the trace around the
 * settled part, for the main thread's CPU time of the same span.
 */
function timedEdit(page, index, cm, id) {
  return page.evaluate(
    async ({ index, cm, id }) => {
      const input = document.querySelector(`[data-testid="tasks-${index}--distance_m"]`);
      performance.mark(`measure:edit:${id}`);
      const start = performance.now();
      input.value = String(cm);
      input.dispatchEvent(new Event("input", { bubbles: true }));
      // The app's reactive updates run in the event and in the microtasks
      // it queues; a message-channel task runs right after all of them, and
      // reading a layout property there forces style and layout of the result.
      await new Promise((done) => {
        const channel = new MessageChannel();
        channel.port1.onmessage = done;
        channel.port2.postMessage(null);
      });
      void document.body.offsetHeight;
      const settled = performance.now() - start;
      performance.mark(`measure:settled:${id}`);
      await new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done)));
      const ms = performance.now() - start;
      const marker = [...document.querySelectorAll('[data-testid="range-chart"] .task-marker')].find((m) =>
        m.getAttribute("aria-label")?.startsWith(`${index + 1}. `),
      );
      const shown = marker?.getAttribute("aria-label") ?? "(no marker)";
      return { ms, settled, redrawn: shown.endsWith(` at ${cm} cm`), shown };
    },
    { index, cm, id },
  );
}

/**
 * The main thread's CPU time (script, style and layout, as the trace
 * counts them) between the marks of each traced edit of build `b`, in
 * milliseconds, one figure per edit.
 */
function settledCpu(events, b) {
  const marks = (kind) => events.filter((e) => e.name.startsWith(`measure:${kind}:${b}-`));
  const ends = new Map(marks("settled").map((e) => [e.name.split(":")[2], e]));
  return marks("edit").flatMap((start) => {
    const end = ends.get(start.name.split(":")[2]);
    if (!end) return [];
    const { cpu } = timeByPhase(events, start, start.ts, end.ts);
    return [Object.values(cpu).reduce((sum, ms) => sum + ms, 0)];
  });
}

function percentile(sorted, p) {
  const rank = Math.ceil((p / 100) * sorted.length) - 1;
  return sorted[Math.min(sorted.length - 1, Math.max(0, rank))];
}

/** Median and 90th percentile of `values`, formatted in milliseconds. */
function summary(values) {
  const sorted = [...values].sort((a, b) => a - b);
  return `median ${percentile(sorted, 50).toFixed(1)} ms, p90 ${percentile(sorted, 90).toFixed(1)} ms`;
}

/** The wasm and JavaScript files of dist/, each compressed with gzip -9, in bytes. */
async function downloadBytes(dist) {
  const { readdir } = await import("node:fs/promises");
  const { gzipSync } = await import("node:zlib");
  let total = 0;
  const parts = [];
  for (const name of await readdir(dist)) {
    if (!/\.(wasm|js)$/.test(name) || name === "sw.js") continue;
    const bytes = gzipSync(await readFile(join(dist, name)), { level: 9 }).length;
    parts.push(`${name} ${bytes}`);
    total += bytes;
  }
  return { total, parts };
}

const browser = await launchBrowser();
const builds = [];
let failed = false;
try {
  for (const dist of DISTS) {
    const build = { dist, server: await serveDist(dist), loads: [], samples: [], settled: [], missed: [] };
    builds.push(build);
    Object.assign(build, await openTwentyTaskDay(browser, build.server.url));
  }
  for (let i = 0; i < 7; i += 1) {
    for (const b of builds) b.loads.push((await firstVisit(browser, b.server.url))[FIRST_PLAN]);
  }
  /** Runs the day's edits on every build, in turn; `traced` marks them for the trace. */
  const editAll = async (traced) => {
    for (let i = 0; i < WARM_UP + SAMPLES; i += 1) {
      const index = (i * 7) % TASKS;
      const cm = 40 + (i % 2 === 0 ? i : 60 + i);
      for (const [n, b] of builds.entries()) {
        const sample = await timedEdit(b.page, index, cm, `${traced && i >= WARM_UP ? "" : "untraced-"}${n}-${i}`);
        if (!sample.redrawn) b.missed.push(`task ${index + 1} -> ${cm} cm: chart shows "${sample.shown}"`);
        if (!traced && i >= WARM_UP) {
          b.samples.push(sample.ms);
          b.settled.push(sample.settled);
        }
      }
    }
  };
  await editAll(false);
  // The same edits again, traced, for the main thread's own CPU time: on a
  // machine shared with other work, the wall clock counts that work too
  // (and the trace slows the page, so the wall-clock figures come from the
  // untraced edits above).
  const tracing = await browser.newBrowserCDPSession();
  const events = [];
  tracing.on("Tracing.dataCollected", ({ value }) => events.push(...value));
  const traced = new Promise((done) => tracing.once("Tracing.tracingComplete", done));
  await tracing.send("Tracing.start", {
    categories: "devtools.timeline,disabled-by-default-devtools.timeline,blink.user_timing",
    transferMode: "ReportEvents",
  });
  await editAll(true);
  await tracing.send("Tracing.end");
  await traced;
  for (const [n, b] of builds.entries()) {
    if (builds.length > 1) console.log(`== ${b.dist}`);
    const download = await downloadBytes(b.dist);
    console.log(`download (wasm + JavaScript, gzip -9): ${download.total} bytes (${download.parts.join(", ")})`);
    console.log(`first plan on screen (navigation to range chart, cold cache, ${b.loads.length} loads): ${summary(b.loads)}`);
    console.log(`edit to settled page, ${TASKS} tasks, ${b.samples.length} edits (after ${WARM_UP} warm-up): ${summary(b.settled)}`);
    console.log(`  the same up to the second animation frame: ${summary(b.samples)}`);
    console.log(`  the same edits again, traced, as the main thread's own CPU time: ${summary(settledCpu(events, n))}`);
    if (b.missed.length) {
      failed = true;
      console.error(`the chart did not show the new distance after ${b.missed.length} edit(s):\n  ${b.missed.join("\n  ")}`);
    }
    const problems = b.page.problems();
    if (problems.length) {
      failed = true;
      console.error(`page problems:\n  ${problems.join("\n  ")}`);
    }
  }
} finally {
  for (const b of builds) {
    await b.context?.close();
    await b.server.close();
  }
  await browser.close();
}
process.exitCode = failed ? 1 : 0;
