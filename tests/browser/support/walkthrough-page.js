// Page object for the wearer walkthrough: open it from the plan, read the
// step shown, move by tap, swipe or keyboard, and measure its layout. The
// journeys speak in these terms so a change of markup is fixed in one place.

export class WalkthroughPage {
  constructor(page) {
    this.page = page;
  }

  dialog() {
    return this.page.getByRole("dialog", { name: /.+/ });
  }

  /** Opens the walkthrough from the plan (by tap when `touch`) and waits for its first step. */
  async open({ touch = false } = {}) {
    const opener = this.page.getByRole("button", { name: "Show the wearer" });
    if (touch) await opener.tap();
    else await opener.click();
    await this.page.getByTestId("walkthrough").waitFor();
    await this.waitForStep(1);
  }

  /** { at, of } from "Step 2 of 7". */
  async progress() {
    const text = (await this.page.getByTestId("walk-progress").textContent()).trim();
    const [, at, of] = text.match(/^Step (\d+) of (\d+)$/) ?? [];
    return { at: Number(at), of: Number(of) };
  }

  async waitForStep(n) {
    await this.page.waitForFunction(
      (wanted) => document.querySelector('[data-testid="walk-progress"]')?.textContent.trim().startsWith(`Step ${wanted} of`),
      n,
    );
  }

  async title() {
    return (await this.page.getByTestId("walk-title").textContent()).trim();
  }

  /** The sentences of the step shown. */
  async sentences() {
    return (await this.page.locator(".walk-body .walk-words li").allTextContents()).map((t) => t.trim());
  }

  /** The pictures of the step shown, once every one is painted: [{ label, ms, width, height }]. */
  async pictures() {
    const canvases = this.page.locator('.walk-body [data-testid="walk-picture"]');
    const count = await canvases.count();
    if (count > 0) {
      await this.page.waitForFunction(
        (n) => document.querySelectorAll('.walk-body [data-testid="walk-picture"][data-render-ms]').length === n,
        count,
      );
    }
    return canvases.evaluateAll((els) =>
      els.map((e) => ({ label: e.getAttribute("aria-label"), ms: Number(e.dataset.renderMs), width: e.width, height: e.height })),
    );
  }

  /** Taps a button of the walkthrough by its visible name ("Next", "Back", "Done", "Close"). */
  async tap(name) {
    await this.page.getByTestId("walkthrough").getByRole("button", { name, exact: true }).tap();
  }

  async press(key) {
    await this.page.keyboard.press(key);
  }

  /**
   * Swipes a finger across the middle of the screen, `direction` "left"
   * (to the next step) or "right" (back), through the DevTools protocol so
   * the browser makes real touch and pointer events.
   */
  async swipe(direction) {
    const cdp = await this.page.context().newCDPSession(this.page);
    const { width, height } = this.page.viewportSize();
    const y = Math.round(height * 0.4);
    const [from, to] = direction === "left" ? [width * 0.8, width * 0.2] : [width * 0.2, width * 0.8];
    await cdp.send("Input.dispatchTouchEvent", { type: "touchStart", touchPoints: [{ x: from, y }] });
    for (let i = 1; i <= 6; i += 1) {
      const x = from + ((to - from) * i) / 6;
      await cdp.send("Input.dispatchTouchEvent", { type: "touchMove", touchPoints: [{ x, y }] });
    }
    await cdp.send("Input.dispatchTouchEvent", { type: "touchEnd", touchPoints: [] });
    await cdp.detach();
  }

  /** The lens switch: [{ label, pressed }] in the plan's order. */
  async lenses() {
    return this.page.getByTestId("walk-lens").evaluateAll((els) =>
      els.map((e) => ({ label: e.textContent.trim(), pressed: e.getAttribute("aria-pressed") === "true" })),
    );
  }

  /** Shows the lenses named `label`, by tap when `touch`, by click otherwise. */
  async showLenses(label, { touch = false } = {}) {
    const button = this.page.getByTestId("walk-lenses").getByRole("button", { name: label, exact: true });
    if (touch) await button.tap();
    else await button.click();
    await this.page.waitForFunction(
      (name) => [...document.querySelectorAll('[data-testid="walk-lens"][aria-pressed="true"]')].some((e) => e.textContent.trim() === name),
      label,
    );
  }

  /** The label of the picture outlined as the lenses shown. */
  async outlinedPicture() {
    return (await this.page.locator(".walk-figure.chosen figcaption strong").textContent()).trim();
  }

  async isOpen() {
    return (await this.page.getByTestId("walkthrough").count()) > 0;
  }

  /**
   * What would make the step unusable on this screen: content wider than
   * the viewport, a control smaller than 44 px, or the step buttons off screen.
   */
  async layoutFaults() {
    return this.page.evaluate(() => {
      const faults = [];
      const { innerWidth: vw, innerHeight: vh } = window;
      if (document.documentElement.scrollWidth > vw) faults.push(`page ${document.documentElement.scrollWidth} px wide in ${vw}`);
      const walk = document.querySelector('[data-testid="walkthrough"]');
      if (walk.scrollWidth > walk.clientWidth) faults.push("the walkthrough scrolls sideways");
      for (const b of walk.querySelectorAll(".walk-head button, .walk-nav button")) {
        const r = b.getBoundingClientRect();
        if (r.width < 44 || r.height < 44) faults.push(`"${b.textContent}" is ${r.width}x${r.height} px`);
        if (r.bottom > vh || r.right > vw || r.top < 0) faults.push(`"${b.textContent}" is off screen`);
      }
      return faults;
    });
  }
}
