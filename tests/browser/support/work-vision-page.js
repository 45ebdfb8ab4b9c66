// Page object for the occupational-health view ("Workplace vision"): open
// it from the masthead, read the task-demand sheet, switch to team mode,
// give a roster by file or by paste, read the counts and skipped rows, and
// export the team CSV. The journeys speak in these terms so a change of
// markup is fixed in one place.
import { readFile } from "node:fs/promises";

export class WorkVisionPage {
  constructor(page) {
    this.page = page;
  }

  dialog() {
    return this.page.getByRole("dialog", { name: "Workplace vision: task demands" });
  }

  opener() {
    return this.page.getByRole("button", { name: "Workplace vision" });
  }

  /** Opens the view (by tap when `touch`) and waits for the worker's sheet. */
  async open({ touch = false } = {}) {
    if (touch) await this.opener().tap();
    else await this.opener().click();
    await this.dialog().waitFor();
    await this.page.getByTestId("wv-sheet").waitFor();
  }

  async isOpen() {
    return (await this.page.getByTestId("work-vision").count()) === 1;
  }

  /** Closes the view with Escape and waits for it to go. */
  async closeByKey() {
    await this.page.keyboard.press("Escape");
    await this.page.getByTestId("work-vision").waitFor({ state: "detached" });
  }

  /** The sheet's task rows: [{ name, focus, posture, convergence, detail, flag, reasons, advice }]. */
  async sheetRows() {
    return this.page.locator('[data-testid="wv-sheet"] tbody tr').evaluateAll((rows) =>
      rows.map((r) => {
        const cells = [...r.children];
        const flag = cells[4];
        return {
          name: cells[0].firstChild.textContent.trim(),
          focus: cells[1].textContent.trim(),
          posture: cells[2].firstChild.textContent.trim(),
          convergence: cells[2].querySelector(".detail").textContent.trim(),
          detail: cells[3].textContent.trim(),
          flag: flag.querySelector("strong").textContent.trim(),
          reasons: [...flag.querySelectorAll("li")].map((li) => li.textContent.trim()),
          advice: flag.querySelector(".wv-advice")?.textContent.trim() ?? "",
        };
      }),
    );
  }

  /** The sheet's whole text. */
  async sheetText() {
    return (await this.page.getByTestId("wv-sheet").textContent()).replace(/\s+/g, " ").trim();
  }

  /** The workplace-rules paragraph of the sheet. */
  async rule() {
    return (await this.page.getByTestId("wv-rule").textContent()).trim();
  }

  /** Shows the team tab (by tap when `touch`). */
  async showTeam({ touch = false } = {}) {
    const tab = this.page.getByRole("tab", { name: "Team" });
    if (touch) await tab.tap();
    else await tab.click();
    await this.page.getByTestId("team-privacy").waitFor();
  }

  async privacyNote() {
    return (await this.page.getByTestId("team-privacy").textContent()).replace(/\s+/g, " ").trim();
  }

  /** Offers `text` as the roster file picked, and waits for the counts. */
  async pickRoster(name, text) {
    await this.page.getByLabel("Roster file (CSV)").setInputFiles({ name, mimeType: "text/csv", buffer: Buffer.from(text, "utf8") });
    await this.page.getByTestId("team-counts").waitFor();
  }

  /** Pastes `text` as the roster, screens it, and waits for the counts. */
  async pasteRoster(text) {
    await this.page.getByLabel("Or paste the roster").fill(text);
    await this.page.getByRole("button", { name: "Screen the pasted roster" }).click();
    await this.page.getByTestId("team-counts").waitFor();
  }

  /** "5 rows read, 4 used, 1 skipped". */
  async counts() {
    return (await this.page.getByTestId("team-counts").textContent()).trim();
  }

  /** Each skipped row's message ("line 4, age_years: ..."). */
  async skipped() {
    const list = this.page.getByTestId("team-skipped");
    if ((await list.count()) === 0) return [];
    return (await list.locator("li").allTextContents()).map((t) => t.trim());
  }

  /** The team table's rows: [{ id, worst }]. */
  async teamRows() {
    return this.page.locator('[data-testid="team-table"] tbody tr').evaluateAll((rows) =>
      rows.map((r) => ({ id: r.querySelector("th").firstChild.textContent.trim(), worst: r.children[1].textContent.trim() })),
    );
  }

  /** Clicks the export button and resolves to { name, text } of the download. */
  async exportCsv() {
    const [download] = await Promise.all([
      this.page.waitForEvent("download"),
      this.page.getByRole("button", { name: "Export the team table (CSV)" }).click(),
    ]);
    return { name: download.suggestedFilename(), url: download.url(), text: await readFile(await download.path(), "utf8") };
  }

  /** Horizontal overflow of the view: [] when it fits its width. */
  async layoutFaults() {
    return this.page.evaluate(() => {
      const faults = [];
      const body = document.querySelector(".wv-body");
      if (body && body.scrollWidth > body.clientWidth + 1) faults.push(`view ${body.scrollWidth} wider than ${body.clientWidth}`);
      for (const b of document.querySelectorAll(".work-vision button")) {
        const r = b.getBoundingClientRect();
        if (r.width > 0 && (r.height < 44 || r.width < 44)) faults.push(`button "${b.textContent.trim()}" ${r.width}x${r.height} below 44 px`);
      }
      return faults;
    });
  }
}
