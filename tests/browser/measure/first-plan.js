// One first visit of the app, timed: the range chart's arrival in the DOM
// (marked by a mutation observer installed before any of the page's own
// scripts, so work the app puts off to later tasks does not count), the end
// of the HTML and wasm downloads, and the app's own performance marks
// (`clearspan:*`, set by boot.js and src/web/startup.rs). Used by
// `startup.js` (the split) and `redraw.js` (the first-plan figure).
import { VIEWPORTS } from "../support/planner-page.js";

/** The name of the first-plan figure in what `firstVisit` returns. */
export const FIRST_PLAN = "first plan (chart in the DOM)";

/**
 * Records, from the page's first script on, when the range chart enters the
 * DOM: the observer runs in the microtasks of the task that added it, so
 * work the app puts off to later tasks does not count.
 */
function watchChart() {
  new MutationObserver((_, observer) => {
    if (document.querySelector('[data-testid="range-chart"]')) {
      performance.mark("measure:chart");
      observer.disconnect();
    }
  }).observe(document, { childList: true, subtree: true });
}

/**
 * One first visit of `url` in a fresh context (cold cache, empty storage):
 * the figures of this load, in milliseconds from navigation start.
 */
export async function firstVisit(browser, url) {
  const context = await browser.newContext({ viewport: VIEWPORTS.desktop });
  await context.addInitScript(watchChart);
  const page = await context.newPage();
  await page.goto(url);
  await page.waitForSelector('[data-testid="range-chart"]');
  const figures = await page.evaluate((name) => {
    const out = {};
    const chart = performance.getEntriesByName("measure:chart")[0];
    if (chart) out[name] = chart.startTime;
    const [navigation] = performance.getEntriesByType("navigation");
    if (navigation) out["html fetched"] = navigation.responseEnd;
    const wasm = performance.getEntriesByType("resource").find((r) => r.name.endsWith(".wasm"));
    if (wasm) out["wasm fetched"] = wasm.responseEnd;
    for (const m of performance.getEntriesByType("mark")) {
      if (m.name.startsWith("clearspan:")) out[m.name] = m.startTime;
    }
    return out;
  }, FIRST_PLAN);
  await context.close();
  return figures;
}
