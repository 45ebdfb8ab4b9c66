// Wearer walkthrough journeys: on a tablet in both orientations, the
// dispenser opens every demo's plan as a walkthrough and the wearer steps
// through each task and the closing step by tap, swipe and keyboard. Every
// step is kept as a screenshot (target/screenshots/walk-*.png); the steps
// must fit the screen, show a painted picture per option and the glasses
// now, and leave the scenario exactly as it was.
import { test } from "node:test";
import assert from "node:assert/strict";
import { readFile, readdir } from "node:fs/promises";
import { join, resolve } from "node:path";
import { appUnderTest, screenshot, watchedPage } from "../support/harness.js";
import { PlannerPage, VIEWPORTS } from "../support/planner-page.js";
import { WalkthroughPage } from "../support/walkthrough-page.js";

const ROOT = resolve(import.meta.dirname, "../../..");
const app = appUnderTest();

/** Every demo file: its file name stem, scenario name, task and option counts. */
const demos = await Promise.all(
  (await readdir(join(ROOT, "scenarios")))
    .filter((f) => f.endsWith(".json"))
    .sort()
    .map(async (file) => {
      const { scenario } = JSON.parse(await readFile(join(ROOT, "scenarios", file), "utf8")).scenarios[0];
      return { stem: file.replace(/\.json$/, ""), name: scenario.name, tasks: scenario.tasks.length, options: scenario.options.length };
    }),
);

const SIZES = [
  ["landscape", VIEWPORTS.tabletLandscape],
  ["portrait", VIEWPORTS.tabletPortrait],
];

/** A tablet with touch, the app open on the demo named `name`. */
async function tabletOn(viewport, name) {
  const context = await app.browser().newContext({ viewport, hasTouch: true });
  const page = await watchedPage(context, app.url());
  const planner = new PlannerPage(page, app.url());
  await planner.open();
  if ((await planner.title()) !== name) await planner.openFromShelf(name);
  await planner.byTestId("recommendation").waitFor();
  return { context, page, planner, walk: new WalkthroughPage(page) };
}

for (const [size, viewport] of SIZES) {
  for (const demo of demos) {
    test(`${size}: the wearer walks through "${demo.stem}" by tap, swipe and keyboard`, async () => {
      const { context, page, planner, walk } = await tabletOn(viewport, demo.name);
      const before = await planner.storedScenarios();

      await walk.open({ touch: true });
      const steps = demo.tasks + 1;
      assert.deepEqual(await walk.progress(), { at: 1, of: steps }, "one step per task and a closing step");

      // A swipe to the left goes on, a swipe to the right comes back.
      await walk.swipe("left");
      await walk.waitForStep(2);
      await walk.swipe("right");
      await walk.waitForStep(1);
      // Back on the first step goes nowhere.
      await walk.press("ArrowLeft");
      assert.equal((await walk.progress()).at, 1);

      for (let at = 1; at <= steps; at += 1) {
        await walk.waitForStep(at);
        const title = await walk.title();
        assert.deepEqual(await walk.layoutFaults(), [], `${demo.stem} step ${at} fits ${size}`);
        if (at < steps) {
          const sentences = await walk.sentences();
          assert.ok(sentences.length >= 3, `${title}: words on where to look, sharpness and the head`);
          assert.match(sentences[0], /^(Look|These lenses)/, title);
          const pictures = await walk.pictures();
          assert.equal(pictures.length, demo.options + 1, `${title}: the glasses now and every option`);
          assert.match(pictures[0].label, /through Your (glasses now|contact lenses alone):/);
          for (const p of pictures) assert.ok(p.ms >= 0, `${p.label} is painted`);
        } else {
          assert.match(title, /^Your choice: /);
          assert.match(await page.getByTestId("walk-cautions").textContent(), /not a prescription/);
        }
        await screenshot(page, `walk-${size}-${demo.stem}-${String(at).padStart(2, "0")}`, { fullPage: false });
        if (at === steps) break;
        // Odd steps move on by tapping Next, even ones by the arrow key.
        if (at % 2 === 1) await walk.tap("Next");
        else await walk.press("ArrowRight");
      }

      // Done (by tap) or Escape (by keyboard) closes it, focus returns to the plan.
      if (size === "landscape") await walk.tap("Done");
      else await walk.press("Escape");
      await page.getByTestId("walkthrough").waitFor({ state: "detached" });
      assert.equal(await page.evaluate(() => document.activeElement?.textContent.trim()), "Show the wearer");
      assert.deepEqual(await planner.storedScenarios(), before, "the walkthrough changes nothing");
      assert.equal(await planner.title(), demo.name);

      assert.deepEqual(page.problems(), []);
      await context.close();
    });
  }
}

test("a tapped picture opens over the whole tablet screen and Escape closes only the picture", async () => {
  const { context, page, walk } = await tabletOn(VIEWPORTS.tabletLandscape, demos.find((d) => d.stem === "electronics-bench").name);
  await walk.open({ touch: true });
  await walk.pictures();
  await page.locator(".walk-zoom").first().tap();
  const big = page.getByTestId("walk-enlarged").getByTestId("walk-picture");
  await big.waitFor();
  await page.waitForFunction(() => document.querySelector('[data-testid="walk-enlarged"] canvas[data-render-ms]'));
  const size = await big.evaluate((c) => ({ width: c.width, height: c.height }));
  assert.deepEqual(size, { width: 1024, height: 768 }, "drawn at the screen's own size");
  await screenshot(page, "walk-landscape-enlarged-picture", { fullPage: false });

  await walk.press("Escape");
  await page.getByTestId("walk-enlarged").waitFor({ state: "detached" });
  assert.ok(await walk.isOpen(), "the walkthrough stays open");
  assert.equal((await walk.progress()).at, 1);
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("the wearer looks at another option by tap and number key; the plan and the scenario stay as they were", async () => {
  const demo = demos.find((d) => d.stem === "electronics-bench");
  const { context, page, planner, walk } = await tabletOn(VIEWPORTS.tabletPortrait, demo.name);
  const before = await planner.storedScenarios();
  await walk.open({ touch: true });

  const lenses = await walk.lenses();
  assert.equal(lenses.length, demo.options, "one switch per option planned");
  const planned = lenses.find((l) => l.pressed);
  assert.ok(planned, "the planned option is shown first");
  assert.equal(await walk.outlinedPicture(), planned.label);
  const plannedWords = await walk.sentences();

  // A tap on another option: its picture is outlined and the words are about it.
  const other = lenses.find((l) => !l.pressed);
  await walk.showLenses(other.label, { touch: true });
  await walk.pictures();
  assert.equal(await walk.outlinedPicture(), other.label);
  assert.notDeepEqual(await walk.sentences(), plannedWords, "the words follow the lenses shown");
  assert.match(await page.locator(".walk-figure", { hasText: planned.label }).textContent(), /planned for you/);
  await screenshot(page, "walk-portrait-electronics-bench-another-option", { fullPage: false });

  // The number keys pick by position; the choice holds from step to step.
  await walk.press("1");
  await page.waitForFunction((label) => document.querySelector('[data-testid="walk-lens"][aria-pressed="true"]')?.textContent.trim() === label, lenses[0].label);
  const third = lenses[2].label;
  await walk.press("3");
  await page.waitForFunction((label) => document.querySelector('[data-testid="walk-lens"][aria-pressed="true"]')?.textContent.trim() === label, third);
  await walk.press("ArrowRight");
  await walk.waitForStep(2);
  await walk.pictures();
  assert.equal(await walk.outlinedPicture(), third);
  assert.deepEqual(await walk.layoutFaults(), []);

  // The closing step says whose lenses these are.
  for (let at = 2; at < demo.tasks + 1; at += 1) await walk.tap("Next");
  await walk.waitForStep(demo.tasks + 1);
  const title = await walk.title();
  assert.equal(title, third === planned.label ? `Your choice: ${third}` : `Another choice: ${third}`);

  // Closing and opening again starts from the planned option; nothing was saved.
  await walk.press("Escape");
  await page.getByTestId("walkthrough").waitFor({ state: "detached" });
  assert.deepEqual(await planner.storedScenarios(), before, "looking at another option changes nothing");
  await walk.open();
  assert.equal((await walk.lenses()).find((l) => l.pressed)?.label, planned.label);
  assert.deepEqual(page.problems(), []);
  await context.close();
});
