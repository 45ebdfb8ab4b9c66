// Faults the journeys provoke inside the page: a local storage that fills up
// on request, and edits typed into two tabs at the same moment. Each helper
// is plain page code or drives pages only through their own documents.

/**
 * An init script: wraps `Storage.prototype.setItem` so a journey can make
 * storage full once the app has started (`__fillStorageForTest()`) and give
 * it room again (`__freeStorageForTest()`). A full storage throws the
 * browser's own `QuotaExceededError`.
 */
export function storageThatFills() {
  const original = Storage.prototype.setItem;
  let full = false;
  window.__fillStorageForTest = () => {
    full = true;
  };
  window.__freeStorageForTest = () => {
    full = false;
  };
  Storage.prototype.setItem = function setItem(key, value) {
    if (full) throw new DOMException("full", "QuotaExceededError");
    return original.call(this, key, value);
  };
}

/**
 * Types into several pages at one instant: each edit `{ page, testId, value }`
 * sets the field's text and fires its input event when the shared clock
 * reaches a moment a little ahead, so neither page sees the other's write first.
 */
export async function typeAtTheSameMoment(edits, leadMs = 300) {
  const at = Date.now() + leadMs;
  await Promise.all(
    edits.map(({ page, testId, value }) =>
      page.evaluate(
        ({ testId, value, at }) =>
          new Promise((done) => {
            const field = document.querySelector(`[data-testid="${testId}"]`);
            setTimeout(() => {
              field.value = value;
              field.dispatchEvent(new Event("input", { bubbles: true }));
              done();
            }, Math.max(0, at - Date.now()));
          }),
        { testId, value, at },
      ),
    ),
  );
}
