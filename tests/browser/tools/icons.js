// Draws the app's install icons (icons/icon-192.png and icons/icon-512.png)
// from favicon.svg with the same headless Chromium the journeys use, so the
// icons are the app's own drawing at every size. Run it (npm run icons in
// tests/browser) after changing favicon.svg, and commit the PNG files.
import { readFile } from "node:fs/promises";
import { join, resolve } from "node:path";
import { launchBrowser } from "../support/harness.js";

const ROOT = resolve(import.meta.dirname, "../../..");
const SIZES = [192, 512];

const svg = await readFile(join(ROOT, "favicon.svg"), "utf8");
const browser = await launchBrowser();
try {
  for (const size of SIZES) {
    const page = await browser.newPage({ viewport: { width: size, height: size } });
    const drawn = svg.replace("<svg ", `<svg width="${size}" height="${size}" `);
    await page.setContent(`<html><body style="margin:0;background:transparent">${drawn}</body></html>`);
    const path = join(ROOT, "icons", `icon-${size}.png`);
    await page.screenshot({ path, omitBackground: true, clip: { x: 0, y: 0, width: size, height: size } });
    await page.close();
    console.log(`wrote ${path}`);
  }
} finally {
  await browser.close();
}
