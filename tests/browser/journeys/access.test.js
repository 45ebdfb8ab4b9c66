// Accessibility checks a user relies on: every form control has a label a
// screen reader can announce, and text meets the WCAG 2.1 AA contrast
// minimum (4.5:1, or 3:1 for large text) against the background it is drawn on.
import { test } from "node:test";
import assert from "node:assert/strict";
import { appUnderTest, screenshot } from "../support/harness.js";
import { freshPlanner } from "../support/planner-page.js";

const app = appUnderTest();

test("every form control has a label", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  await planner.byTestId("range-chart").waitFor();
  const unlabelled = await page.evaluate(() =>
    [...document.querySelectorAll("input, select, textarea")]
      .filter((el) => el.labels.length === 0 && !el.getAttribute("aria-label"))
      .map((el) => el.outerHTML.slice(0, 120)),
  );
  assert.deepEqual(unlabelled, []);
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("every number field has help, opened by ? in the field or by finger and read as its description", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  await planner.byTestId("range-chart").waitFor();
  const withoutHelp = await page.evaluate(() =>
    [...document.querySelectorAll('input[inputmode="decimal"]')]
      .filter((input) => {
        const described = (input.getAttribute("aria-describedby") ?? "").split(" ");
        const help = described.map((id) => document.getElementById(id)).find((e) => e?.matches("small.help"));
        return !help || help.textContent.trim().length < 60;
      })
      .map((input) => input.dataset.testid),
  );
  assert.deepEqual(withoutHelp, []);
  const field = page.locator(".field", { has: page.getByTestId("tasks-0--distance_m") });
  const toggle = field.getByRole("button", { name: "Help", exact: true });
  const help = field.locator("small.help");
  assert.equal(await help.isVisible(), false, "help starts closed, so the form stays short");
  // From the keyboard, "?" in the field opens its help; Tab goes on to the
  // next number, not to the help button.
  const input = page.getByTestId("tasks-0--distance_m");
  const before = await input.inputValue();
  await input.focus();
  await page.keyboard.press("?");
  await help.waitFor({ state: "visible" });
  assert.equal(await toggle.getAttribute("aria-expanded"), "true");
  assert.equal(await input.inputValue(), before, "the ? is not typed into the number");
  await page.keyboard.press("Tab");
  assert.equal(
    await page.evaluate(() => document.activeElement?.matches("input, select")),
    true,
    "Tab skips the help button",
  );
  assert.match(await help.textContent(), /line of sight.*tape.*common practice/s);
  const detail = page.locator(".field", { has: page.getByTestId("tasks-0--detail_mm") });
  await detail.getByRole("button", { name: "Help", exact: true }).click();
  await detail.locator("small.help").waitFor({ state: "visible" });
  await field.scrollIntoViewIfNeeded();
  await screenshot(page, "field-help", { fullPage: false });
  await input.focus();
  await page.keyboard.press("?");
  await help.waitFor({ state: "hidden" });
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("text contrast meets WCAG 2.1 AA on screen", async () => {
  const { context, page, planner } = await freshPlanner(app.browser(), app.url());
  await planner.open();
  await planner.byTestId("range-chart").waitFor();
  const { failures, checked } = await page.evaluate(() => {
    // Relative luminance and contrast ratio as defined in WCAG 2.1 (success criterion 1.4.3).
    const channels = (css) => (css.match(/[\d.]+/g) ?? []).map(Number);
    const luminance = ([r, g, b]) => {
      const lin = (v) => {
        const c = v / 255;
        return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
      };
      return 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b);
    };
    const background = (el) => {
      for (let e = el; e; e = e.parentElement) {
        const c = channels(getComputedStyle(e).backgroundColor);
        if (c.length === 3 || (c.length === 4 && c[3] > 0.5)) return c;
      }
      return [255, 255, 255];
    };
    const out = new Set();
    let checked = 0;
    for (const el of document.querySelectorAll("body *")) {
      if (el.closest("svg") || el.disabled) continue;
      const ownText = [...el.childNodes].some((n) => n.nodeType === 3 && n.textContent.trim());
      if (!ownText) continue;
      const box = el.getBoundingClientRect();
      const style = getComputedStyle(el);
      if (box.width === 0 || box.height === 0 || style.visibility === "hidden") continue;
      checked += 1;
      const fg = luminance(channels(style.color));
      const bg = luminance(background(el));
      const ratio = (Math.max(fg, bg) + 0.05) / (Math.min(fg, bg) + 0.05);
      const size = parseFloat(style.fontSize);
      const large = size >= 24 || (size >= 18.66 && Number(style.fontWeight) >= 700);
      if (ratio < (large ? 3 : 4.5)) {
        out.add(`${el.tagName.toLowerCase()}.${el.className} "${el.textContent.trim().slice(0, 30)}" ${ratio.toFixed(2)}:1`);
      }
    }
    return { failures: [...out], checked };
  });
  assert.ok(checked > 100, `only ${checked} text elements were checked`);
  assert.deepEqual(failures, [], `text under the contrast minimum:\n  ${failures.join("\n  ")}`);
  assert.deepEqual(page.problems(), []);
  await context.close();
});
