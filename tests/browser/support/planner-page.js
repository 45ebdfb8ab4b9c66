// Page-object helpers for the planner: find fields by label or test id, type
// into them, read their messages, and read what the outcome panel shows. The
// journeys speak in these terms so a change of markup is fixed in one place.
import { watchedPage } from "./harness.js";

/** The viewports the app is laid out for. */
export const VIEWPORTS = {
  desktop: { width: 1366, height: 900 },
  tabletLandscape: { width: 1024, height: 768 },
  tabletPortrait: { width: 768, height: 1024 },
};

/** The storage key prefix of stored scenarios. */
export const SCENARIO_PREFIX = "clearspan/scenario/";
/** The demo days shipped in scenarios/ (a first visit opens the office demo). */
export const DEMO_COUNT = 7;
/** The demo a first visit opens. */
export const OFFICE_DEMO = "Demo — fictional office worker with two monitors";

/** The names of the demo scenarios shipped with the app (all fictional). */
export const DEMOS = [
  "Demo — fictional contact-lens wearer at a screen",
  "Demo — fictional parcel delivery driver",
  "Demo — fictional electronics bench technician",
  "Demo — fictional laboratory technician",
  OFFICE_DEMO,
  "Demo — fictional electrician working overhead",
  "Demo — fictional van driver who also stocks overhead shelves",
];
/** The saved-format version this build writes. */
export const FORMAT_VERSION = 2;
/** The test id of the wearer's age field. */
export const AGE = "wearer-age_years";

/**
 * Opens a fresh browser context (empty storage) with a watched page and a
 * planner object around it; `initScript` runs in every page before the app.
 */
export async function freshPlanner(browser, origin, { viewport = VIEWPORTS.desktop, initScript } = {}) {
  const context = await browser.newContext({ viewport, acceptDownloads: true });
  if (initScript) await context.addInitScript(initScript);
  const page = await watchedPage(context, origin);
  return { context, page, planner: new PlannerPage(page, origin) };
}

export class PlannerPage {
  constructor(page, origin) {
    this.page = page;
    this.origin = origin;
  }

  /** Loads the app and waits until the workspace and a plan are drawn. */
  async open() {
    await this.page.goto(this.origin);
    await this.ready();
  }

  /** Reloads the page and waits for the app again. */
  async reload() {
    await this.page.reload();
    await this.ready();
  }

  async ready() {
    await this.page.getByTestId("workspace").waitFor();
    await this.page.getByTestId("scenario-title").waitFor();
  }

  byTestId(id) {
    return this.page.getByTestId(id);
  }

  /** The input labelled `label` (exact words), optionally inside `within`. */
  fieldByLabel(label, within = this.page) {
    return within.getByLabel(label, { exact: true });
  }

  /** Types `text` into the field with test id `testId` (one input event per fill). */
  async setNumber(testId, text) {
    await this.byTestId(testId).fill(text);
  }

  /** The text the field with test id `testId` currently shows. */
  async valueOf(testId) {
    return this.byTestId(testId).inputValue();
  }

  /** The message shown for a field: the message among the elements its aria-describedby names (the field's help is the other). */
  async messageFor(testId) {
    const field = this.byTestId(testId);
    const ids = (await field.getAttribute("aria-describedby"))?.split(" ") ?? [];
    const message = ids.map((id) => `[id="${id}"].message`).join(", ");
    if (!message) throw new Error(`field ${testId} has no aria-describedby`);
    return (await this.page.locator(message).textContent()).trim();
  }

  /** The unit written after the field with test id `testId`. */
  async unitOf(testId) {
    return (await this.byTestId(testId).locator("xpath=following-sibling::span[@class='unit']").textContent()).trim();
  }

  async title() {
    return (await this.byTestId("scenario-title").textContent()).trim();
  }

  async taskCount() {
    return this.byTestId("task-card").count();
  }

  /** Row headers of the comparison table ("1. Screen", …). */
  async comparisonRows() {
    const heads = this.byTestId("comparison").locator("tbody tr th[scope=row] button");
    return (await heads.allTextContents()).map((t) => t.trim());
  }

  /** The verdict words of every cell of the comparison table, row by row. */
  async verdictCells() {
    return (await this.byTestId("comparison").locator("tbody td.verdict .words").allTextContents()).map((t) =>
      t.trim(),
    );
  }

  /** The task cell ("name: distance at gaze, hours") of each row of the order sheet's task table. */
  async orderSheetTasks() {
    const cells = this.byTestId("order-sheet").locator("table.sheet-tasks tbody tr td:first-child");
    return (await cells.allTextContents()).map((t) => t.trim());
  }

  /** The text of every notice shown. */
  async notices() {
    return (await this.byTestId("notice").locator("p").allTextContents()).map((t) => t.trim());
  }

  /** The names of the scenarios on the shelf, in shelf order. */
  async shelfNames() {
    return (await this.byTestId("shelf-list").locator(".shelf-name").allTextContents()).map((t) => t.trim());
  }

  async saveState() {
    return (await this.byTestId("save-state").textContent()).trim();
  }

  /** Waits until the save state reads `text` exactly (or starts with it, for a prefix ending in ':'). */
  async waitForSaveState(text) {
    await this.page.waitForFunction((wanted) => {
      const shown = document.querySelector('[data-testid="save-state"]')?.textContent.trim() ?? "";
      return wanted.endsWith(":") ? shown.startsWith(wanted) : shown === wanted;
    }, text);
  }

  /** Waits until a notice's text contains `part`. */
  async waitForNotice(part) {
    await this.page.waitForFunction(
      (wanted) => [...document.querySelectorAll('[data-testid="notice"] p')].some((p) => p.textContent.includes(wanted)),
      part,
    );
  }

  /** The stored entry (parsed) whose scenario is named `name`, with its key. */
  async storedByName(name) {
    for (const [key, raw] of Object.entries(await this.storedScenarios())) {
      const entry = JSON.parse(raw);
      if (entry.scenario?.name === name) return { key, entry };
    }
    return undefined;
  }

  /** Whether the conflict banner is shown. */
  async showsConflict() {
    return (await this.byTestId("conflict").count()) > 0;
  }

  /** Every key and value in local storage of the app's origin. */
  async storage() {
    return this.page.evaluate(() => {
      const out = {};
      for (let i = 0; i < localStorage.length; i += 1) {
        const key = localStorage.key(i);
        out[key] = localStorage.getItem(key);
      }
      return out;
    });
  }

  /** The stored scenario entries, parsed, keyed by storage key. */
  async storedScenarios() {
    const all = await this.storage();
    const out = {};
    for (const [key, value] of Object.entries(all)) {
      if (key.startsWith(SCENARIO_PREFIX)) out[key] = value;
    }
    return out;
  }

  /** Unfolds the shelf's scenarios and actions (folded at first on tablets). */
  async showShelf() {
    const more = this.byTestId("shelf-more");
    if ((await more.getAttribute("open")) === null) await more.locator("summary").click();
  }

  /** Opens the shelf entry whose name is exactly `name`. */
  async openFromShelf(name) {
    await this.showShelf();
    await this.byTestId("shelf-list")
      .locator(".shelf-item")
      .filter({ has: this.page.locator(".shelf-name", { hasText: name }) })
      .first()
      .click();
    await this.page.waitForFunction(
      (wanted) => document.querySelector('[data-testid="scenario-title"]')?.textContent.trim() === wanted,
      name,
    );
  }

  /** Offers `text` as the file picked in the import field. */
  async importFile(name, text, mimeType = "application/json") {
    await this.byTestId("import-file").setInputFiles({ name, mimeType, buffer: Buffer.from(text, "utf8") });
  }
}
