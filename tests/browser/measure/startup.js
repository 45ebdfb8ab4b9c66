// Measures the first plan on screen and where its time goes, on a first
// visit (fresh context: cold cache, empty local storage), after a release
// build. A measurement, not a test: it prints figures and asserts no limit.
//
// Usage: node measure/startup.js [DIST ...] (default: dist/). Given several
// builds, it loads them alternately, so builds compared share the machine's
// load of the same minutes.
//
// For every load, in milliseconds from navigation start (`first-plan.js`):
// the range chart in the DOM, the HTML and the wasm downloaded, and every
// performance mark of the app (`clearspan:*`, set by boot.js and
// src/web/startup.rs). Each line gives the median and the range over the
// loads, in the order of the medians, and the median time since the line
// above within a load: the split of the time to the first plan.
import { resolve } from "node:path";
import { serveDist, launchBrowser, DIST } from "../support/harness.js";
import { firstVisit, FIRST_PLAN } from "./first-plan.js";

const LOADS = Number(process.env.LOADS ?? 9);

function median(values) {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

const dists = process.argv.length > 2 ? process.argv.slice(2).map((d) => resolve(d)) : [DIST];
const servers = await Promise.all(dists.map((d) => serveDist(d)));
const browser = await launchBrowser();
try {
  const runs = dists.map(() => []);
  for (let i = 0; i < LOADS; i += 1) {
    for (const [at, server] of servers.entries()) runs[at].push(await firstVisit(browser, server.url));
  }
  for (const [at, dist] of dists.entries()) {
    console.log(`${dist} (${LOADS} first visits, milliseconds: median [min–max])`);
    const names = [...new Set(runs[at].flatMap((r) => Object.keys(r)))];
    const lines = names.map((name) => {
      const values = runs[at].map((r) => r[name]).filter((v) => v !== undefined);
      return { name, values, middle: median(values) };
    });
    let previous;
    for (const { name, values, middle } of lines.sort((a, b) => a.middle - b.middle)) {
      const low = Math.min(...values).toFixed(0);
      const high = Math.max(...values).toFixed(0);
      // The time since the line above, within each load: steadier than a
      // difference of medians on a machine whose load changes between loads.
      const spans = runs[at].filter((r) => r[name] !== undefined && r[previous] !== undefined);
      const since = previous ? `, +${median(spans.map((r) => r[name] - r[previous])).toFixed(0)} after the line above` : "";
      console.log(`  ${name.padEnd(34)} ${middle.toFixed(0).padStart(5)} [${low}–${high}]${since}`);
      previous = name;
    }
    // The app's own part: from its entry point to the chart, within each load.
    const own = runs[at].filter((r) => r["clearspan:wasm-run"] !== undefined && r[FIRST_PLAN] !== undefined);
    if (own.length) {
      const spans = own.map((r) => r[FIRST_PLAN] - r["clearspan:wasm-run"]);
      console.log(`  entry point to first plan: median ${median(spans).toFixed(0)} ms`);
    }
  }
} finally {
  await browser.close();
  await Promise.all(servers.map((s) => s.close()));
}
