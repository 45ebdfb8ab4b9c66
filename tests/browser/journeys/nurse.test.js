// Occupational-health journeys: the nurse opens "Workplace vision" on the
// office demo at a desk and on a tablet, reads the task-demand sheet (a flag
// with its reason in numbers, the display-screen rule), prints it to one A4
// page, and screens a team from a roster file and from pasted text, with a
// malformed line reported by line and field, then exports the team CSV.
// Screenshots are kept in target/screenshots/nurse-*.png, the printed sheet
// as nurse-sheet.pdf and its picture nurse-sheet-print-1.png.
import { test } from "node:test";
import assert from "node:assert/strict";
import { execFile } from "node:child_process";
import { mkdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import { promisify } from "node:util";
import { appUnderTest, screenshot, SHOTS, watchedPage } from "../support/harness.js";
import { DEMOS, OFFICE_DEMO, PlannerPage, VIEWPORTS } from "../support/planner-page.js";
import { WorkVisionPage } from "../support/work-vision-page.js";

const run = promisify(execFile);
const app = appUnderTest();

const SIZES = [
  ["desktop", VIEWPORTS.desktop, false],
  ["tablet", VIEWPORTS.tabletPortrait, true],
];

/** Fictional workers; line 4 has a word where the age goes. */
const ROSTER = [
  "id,age_years,amplitude_d,correction_d,addition_d",
  "W-101,38,,,",
  "W-102,52,,-1.50,1.50",
  "W-103,fifty,,,",
  "W-104,61,1.0,+0.75,",
  '"W,105",45,,,',
].join("\r\n");

/** The app on the office demo (a first visit opens it) at `viewport`. */
async function officeAt(viewport, touch) {
  const context = await app.browser().newContext({ viewport, hasTouch: touch, acceptDownloads: true });
  const page = await watchedPage(context, app.url());
  const planner = new PlannerPage(page, app.url());
  await planner.open();
  assert.equal(await planner.title(), OFFICE_DEMO);
  await planner.byTestId("recommendation").waitFor();
  return { context, page, planner, vision: new WorkVisionPage(page) };
}

/** The counted figures of a "needs 2.46 D, has 1.56 D comfortably, short by 0.90 D" line. */
function focusFigures(text) {
  const m = text.match(/^needs (\d+\.\d\d) D, has (\d+\.\d\d) D comfortably(?:, short by (\d+\.\d\d) D)?$/);
  assert.ok(m, `focus words "${text}"`);
  return { needs: Number(m[1]), has: Number(m[2]), short: m[3] === undefined ? null : Number(m[3]) };
}

for (const [size, viewport, touch] of SIZES) {
  test(`${size}: the nurse reads the office worker's task-demand sheet, a flag with its reason in numbers`, async () => {
    const { context, page, planner, vision } = await officeAt(viewport, touch);
    const before = await planner.storedScenarios();

    await vision.open({ touch });
    const rows = await vision.sheetRows();
    assert.equal(rows.length, 6, "one row per task of the office day");
    const papers = rows.find((r) => r.name === "Papers on the desk");
    assert.ok(papers, "the papers task is on the sheet");
    assert.notEqual(papers.flag, "fine as is", "papers at 40 cm are beyond a 1.56 D usable share");
    const f = focusFigures(papers.focus);
    assert.ok(f.needs > f.has && f.short > 0, `needs more than it has: ${papers.focus}`);
    assert.match(papers.reasons[0], /^needs \d\.\d\d D of focusing, has \d\.\d\d D comfortably: short by \d\.\d\d D$/);
    assert.ok(papers.advice.length > 0, "the flag says what would help");
    assert.doesNotMatch(papers.advice, /move it to|enlarge the text/, "a paper gets no screen changes");
    const fine = rows.find((r) => r.name === "Colleague across the desk");
    assert.equal(fine.flag, "fine as is");
    assert.equal(focusFigures(fine.focus).short, null, "nothing short when fine");
    assert.match(fine.detail, /′ \(not display text\)$/);
    assert.match(fine.posture, /° gaze; head upright: comfortable$/);
    assert.match(fine.convergence, /^convergence \d+\.\d Δ$/);

    const rule = await vision.rule();
    assert.match(rule, /Council Directive 90\/270\/EEC, Article 9/, "names the display-screen directive");
    assert.match(rule, /licensed eye-care practitioner/, "defers to licensed practice");
    assert.match(await vision.sheetText(), /Signature:/);
    assert.deepEqual(await vision.layoutFaults(), [], `the sheet fits a ${size} screen`);
    await screenshot(page, `nurse-${size}-sheet`, { fullPage: false });

    // Escape closes the view; focus returns to its opener; nothing changed.
    await vision.closeByKey();
    assert.equal(await page.evaluate(() => document.activeElement?.textContent.trim()), "Workplace vision");
    assert.deepEqual(await planner.storedScenarios(), before, "reading the sheet changes nothing");
    assert.deepEqual(page.problems(), []);
    await context.close();
  });

  test(`${size}: the nurse screens a team from a roster file with a malformed line and exports the team CSV`, async () => {
    const { context, page, vision } = await officeAt(viewport, touch);
    await vision.open({ touch });
    await vision.showTeam({ touch });
    assert.match(await vision.privacyNote(), /^Names of real people are not asked for\. .*pseudonymous id/);

    await vision.pickRoster("team.csv", ROSTER);
    assert.equal(await vision.counts(), "5 rows read, 4 used, 1 skipped");
    assert.deepEqual(await vision.skipped(), ['line 4, age_years: "fifty" is not a number']);
    const rows = await vision.teamRows();
    assert.deepEqual(rows.map((r) => r.id), ["W-101", "W-102", "W-104", "W,105"]);
    for (const r of rows) {
      assert.match(r.worst, /^(fine as is|workstation change|task eyewear to discuss with an eye-care practitioner|refer for an eye examination)$/);
    }
    assert.deepEqual(await vision.layoutFaults(), [], `team mode fits a ${size} screen`);
    await screenshot(page, `nurse-${size}-team`, { fullPage: false });

    const csv = await vision.exportCsv();
    assert.equal(csv.name, "clearspan-team.csv");
    assert.match(csv.url, /^blob:/, "made on this device, not fetched");
    const lines = csv.text.split("\r\n").filter((l) => l.length > 0);
    assert.equal(lines[0], "id,task,flag,needs_d,has_d,reasons,advice");
    assert.equal(lines.length, 1 + 4 * 6, "one line per worker and task");
    assert.ok(lines.slice(1, 7).every((l) => l.startsWith("W-101,")), "W-101's six tasks first");
    assert.ok(lines.slice(19).every((l) => l.startsWith('"W,105",')), "an id with a comma is quoted");
    assert.ok(lines.some((l) => l.startsWith("W-102,Papers on the desk,")), "tasks by name");
    assert.ok(!lines.some((l) => l.startsWith("W-103")), "the skipped row is not exported");

    assert.deepEqual(page.problems(), []);
    await context.close();
  });
}

test("a pasted roster with an extra column and a missing id is reported line by line", async () => {
  const { context, page, vision } = await officeAt(VIEWPORTS.tabletLandscape, true);
  await vision.open({ touch: true });
  await vision.showTeam({ touch: true });
  await vision.pasteRoster(["id,age_years", "T-1,44", "T-2,50,7", ",47", "T-4,39"].join("\n"));
  assert.equal(await vision.counts(), "4 rows read, 2 used, 2 skipped");
  assert.deepEqual(await vision.skipped(), [
    "line 3: 3 fields where the header names 2; a comma inside a value needs quotes",
    "line 4, id: missing",
  ]);
  assert.deepEqual((await vision.teamRows()).map((r) => r.id), ["T-1", "T-4"]);

  // A header that asks for names is refused whole.
  await vision.page.getByLabel("Or paste the roster").fill("id,name,age_years\nT-1,Someone,40");
  await page.getByRole("button", { name: "Screen the pasted roster" }).click();
  const problem = (await page.getByTestId("team-problem").textContent()).trim();
  assert.match(problem, /column "name" that clearspan does not know .*names of people are not asked for/);

  // The tabs answer the arrow keys; the team's result stays while away.
  await page.getByRole("tab", { name: "Team" }).focus();
  await page.keyboard.press("ArrowLeft");
  await page.getByTestId("wv-sheet").waitFor();
  assert.equal(await page.getByRole("tab", { name: "This worker" }).getAttribute("aria-selected"), "true");
  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("a screen task out of reach gets a computed screen change; the sheet prints on one A4 page", async () => {
  const { context, page, planner, vision } = await officeAt(VIEWPORTS.desktop, false);
  // The main monitor becomes screen text and comes to 45 cm: 2.2 D needed
  // against the 1.56 D usable share, so the sheet should move it back.
  const first = planner.byTestId("task-card").first();
  await first.locator("summary", { hasText: "Flags and eye hazards" }).click();
  await first.getByLabel("Screen text (detail is the character height)", { exact: true }).check();
  await planner.setNumber("tasks-0--distance_m", "45");
  await vision.open();
  const monitor = (await vision.sheetRows()).find((r) => r.name === "Main monitor");
  assert.equal(monitor.flag, "workstation change", JSON.stringify(monitor));
  assert.match(monitor.advice, /move it to \d+ cm from the eyes/);
  assert.match(monitor.detail, /display text: at least 16′, 20′ or more preferred \(ISO 9241-3:1992\)/);

  await page.emulateMedia({ media: "print" });
  for (const id of ["workspace", "wv-print", "wv-tab-team", "unit-toggle"]) {
    assert.equal(await page.getByTestId(id).isVisible(), false, `${id} is hidden in print`);
  }
  assert.ok(await page.getByTestId("wv-sheet").isVisible(), "the sheet prints");
  await mkdir(SHOTS, { recursive: true });
  const pdfPath = join(SHOTS, "nurse-sheet.pdf");
  await page.pdf({ path: pdfPath, format: "A4", printBackground: true, margin: { top: "12mm", bottom: "12mm", left: "12mm", right: "12mm" } });
  const pdf = await readFile(pdfPath);
  assert.equal(pdf.subarray(0, 5).toString("latin1"), "%PDF-");
  const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length;
  console.log(`nurse-sheet.pdf: ${pdf.length} bytes, ${pages} page(s)`);
  assert.equal(pages, 1, "the task-demand sheet fits one A4 page");
  const { stdout: text } = await run("pdftotext", ["-layout", pdfPath, "-"]);
  const flat = text.replace(/\s+/g, " ");
  for (const part of [`Task-demand sheet: ${OFFICE_DEMO}`, "Papers on the desk", "90/270/EEC", "Occupational health nurse (name):", "Signature:", "Date:"]) {
    assert.ok(flat.includes(part), `the printed sheet holds "${part}"`);
  }
  await run("pdftoppm", ["-png", "-r", "80", pdfPath, join(SHOTS, "nurse-sheet-print")]);

  assert.deepEqual(page.problems(), []);
  await context.close();
});

test("every demo's task-demand sheet prints on one A4 page", async () => {
  const { context, page, planner, vision } = await officeAt(VIEWPORTS.desktop, false);
  const spills = [];
  for (const name of DEMOS) {
    await planner.openFromShelf(name);
    await vision.open();
    await page.emulateMedia({ media: "print" });
    const pdf = await page.pdf({ format: "A4", printBackground: true, margin: { top: "12mm", bottom: "12mm", left: "12mm", right: "12mm" } });
    const pages = (pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? []).length;
    if (pages !== 1) spills.push(`${name}: ${pages} pages`);
    await page.emulateMedia({ media: "screen" });
    await vision.closeByKey();
  }
  assert.deepEqual(spills, [], "each worker's sheet fits one A4 page");
  assert.deepEqual(page.problems(), []);
  await context.close();
});
