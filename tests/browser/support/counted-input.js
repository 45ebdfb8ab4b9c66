// Input that counts itself: every key pressed and every click a journey
// sends goes through this object, so a journey can say how many a job took.
// Fields are reached from the keyboard (Tab or Shift+Tab until the focus is
// on them); for comparison, the count also says what reaching each field by
// one click instead would have taken.

/** Upper bound on the Tab presses to reach one control (a loop guard). */
const MAX_TABS = 400;

export class CountedInput {
  constructor(page) {
    this.page = page;
    /** Characters typed into fields. */
    this.typed = 0;
    /** Tab and Shift+Tab presses to move between controls. */
    this.tabs = 0;
    /** Other keys: Enter, Space, arrows, Ctrl+A. */
    this.keys = 0;
    /** Clicks (none when every control could be reached by the keyboard). */
    this.clicks = 0;
    /** How many times a control was reached by Tab (each would be one click instead). */
    this.reaches = 0;
  }

  /** Presses `key` (one keystroke, a chord such as Control+A included). */
  async press(key) {
    await this.page.keyboard.press(key);
    this.keys += 1;
  }

  /** Types `text` into the control with the focus, one keystroke a character. */
  async type(text) {
    await this.page.keyboard.type(text);
    this.typed += [...text].length;
  }

  /** Clicks `locator` (one click). */
  async click(locator) {
    await locator.click();
    this.clicks += 1;
  }

  /** Moves the focus to `locator` with Tab (or Shift+Tab when it lies before the focus). */
  async reach(locator) {
    const handle = await locator.elementHandle();
    const state = () =>
      this.page.evaluate((target) => {
        const active = document.activeElement;
        if (active === target) return "there";
        if (!active || active === document.body) return "after";
        return active.compareDocumentPosition(target) & Node.DOCUMENT_POSITION_FOLLOWING ? "after" : "before";
      }, handle);
    let where = await state();
    if (where === "there") return;
    const key = where === "after" ? "Tab" : "Shift+Tab";
    for (let i = 0; i < MAX_TABS; i += 1) {
      await this.page.keyboard.press(key);
      this.tabs += 1;
      where = await state();
      if (where === "there") {
        this.reaches += 1;
        return;
      }
    }
    throw new Error(`${MAX_TABS} presses of ${key} did not reach ${locator}`);
  }

  /**
   * Makes the text field `locator` read `text`: nothing when it does already,
   * else reach it, select what it holds (Ctrl+A unless Tab selected it) and type.
   */
  async enter(locator, text) {
    if ((await locator.inputValue()) === text) return;
    await this.reach(locator);
    const selected = await locator.evaluate(
      (el) => el.value === "" || (el.selectionStart === 0 && el.selectionEnd === el.value.length),
    );
    if (!selected) await this.press("Control+A");
    await this.type(text);
  }

  /** Picks the option whose words are `words` in the drop-down `locator` with the arrow keys. */
  async choose(locator, words) {
    const { from, to } = await locator.evaluate((el, words) => {
      const to = [...el.options].findIndex((o) => o.textContent.trim() === words);
      return { from: el.selectedIndex, to };
    }, words);
    if (to < 0) throw new Error(`no option "${words}"`);
    if (from === to) return;
    await this.reach(locator);
    for (let i = 0; i < Math.abs(to - from); i += 1) await this.press(to > from ? "ArrowDown" : "ArrowUp");
  }

  /** Reaches the button `locator` and presses Enter on it. */
  async activate(locator) {
    await this.reach(locator);
    await this.press("Enter");
  }

  /** Every keystroke so far. */
  get keystrokes() {
    return this.typed + this.tabs + this.keys;
  }

  /** The counts as one line, with what reaching each control by a click instead would take. */
  summary() {
    return (
      `${this.keystrokes} keystrokes (${this.typed} typed, ${this.tabs} Tab, ${this.keys} other keys) and ${this.clicks} clicks; ` +
      `reaching each of the ${this.reaches} controls by a click instead: ` +
      `${this.typed + this.keys} keystrokes and ${this.clicks + this.reaches} clicks`
    );
  }
}
