// A CPU profile of distance edits on a 20-task day, in headless Chromium
// through the DevTools protocol: where the main thread spends the time of
// an edit, summed by function (self time) and printed as the top entries.
// A measurement, not a test. Run with `npm run profile` after a release
// build; wasm functions show their names when the build keeps them.
import { resolve } from "node:path";
import { serveDist, launchBrowser } from "../support/harness.js";
import { editDistances, openTwentyTaskDay } from "./day.js";

const EDITS = 40;

const server = await serveDist(process.env.CLEARSPAN_DIST ? resolve(process.env.CLEARSPAN_DIST) : undefined);
const browser = await launchBrowser();
try {
  const { context, page } = await openTwentyTaskDay(browser, server.url);
  const cdp = await context.newCDPSession(page);
  await cdp.send("Profiler.enable");
  await cdp.send("Profiler.setSamplingInterval", { interval: 100 });
  await cdp.send("Profiler.start");
  await editDistances(page, EDITS);
  const { profile } = await cdp.send("Profiler.stop");
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const self = new Map();
  const dt = profile.timeDeltas;
  profile.samples.forEach((id, k) => {
    const node = byId.get(id);
    const f = node.callFrame;
    const key = `${f.functionName || "(anonymous)"} ${f.url ? f.url.split("/").pop() : ""}`.trim();
    self.set(key, (self.get(key) ?? 0) + (dt[k] ?? 0) / 1000);
  });
  const total = [...self.values()].reduce((a, b) => a + b, 0);
  const top = [...self.entries()].filter(([k]) => k !== "(idle)").sort((a, b) => b[1] - a[1]).slice(0, 25);
  console.log(`${EDITS} edits, ${total.toFixed(0)} ms sampled; self time by function:`);
  for (const [k, ms] of top) console.log(`  ${(ms / EDITS).toFixed(2).padStart(7)} ms/edit  ${k}`);
  await context.close();
} finally {
  await browser.close();
  await server.close();
}
