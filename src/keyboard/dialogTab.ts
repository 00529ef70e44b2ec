/**
 * Tab inside an open dialog goes round its controls: from the last one on to the first, and with Shift from the
 * first back to the last. Quasar's dialog keeps the focus from landing outside it, but a dialog sits last in the
 * page, so Tab from its last control leaves the page for the browser's own bar, and Shift+Tab from its first
 * control is pulled back to that first control instead of going on to the last.
 */

/** Elements that may take the focus; which of them do is decided by tabbableStops. */
const CANDIDATES = 'a[href], button, input, select, textarea, [tabindex], [contenteditable="true"]';

/** The controls Tab stops at inside `root`, in the order it visits them (the app sets no positive tabindex). */
export function tabbableStops(root: HTMLElement): HTMLElement[] {
  return Array.from(root.querySelectorAll<HTMLElement>(CANDIDATES)).filter(
    (el) =>
      el.tabIndex >= 0 &&
      !(el as HTMLButtonElement).disabled &&
      !(el instanceof HTMLInputElement && el.type === 'hidden') &&
      el.getClientRects().length > 0 &&
      getComputedStyle(el).visibility !== 'hidden' &&
      el.closest('[inert]') === null,
  );
}

/**
 * Where Tab goes from stop `at` of `count` (-1: the focus is on the dialog itself, on no stop) when the browser's
 * own step would leave the dialog; null when the browser's own step stays inside it.
 */
export function wrappedStop(at: number, count: number, back: boolean): number | null {
  if (count === 0) return null;
  if (back) return at <= 0 ? count - 1 : null;
  return at < 0 || at === count - 1 ? 0 : null;
}

/** A keydown listener for the document: Tab and Shift+Tab in the topmost open dialog go round inside it. */
export function onDialogTab(evt: KeyboardEvent): void {
  if (evt.key !== 'Tab' || evt.defaultPrevented || evt.altKey || evt.ctrlKey || evt.metaKey) return;
  const active = document.activeElement as HTMLElement | null;
  // Quasar's modal dialog: role="dialog" with aria-modal="true" (a seamless one leaves the page usable).
  const dialog = active?.closest<HTMLElement>('[role="dialog"][aria-modal="true"]');
  if (!active || !dialog) return;
  const stops = tabbableStops(dialog);
  const exact = stops.indexOf(active);
  const at = exact >= 0 ? exact : stops.findIndex((el) => el.contains(active));
  const next = wrappedStop(at, stops.length, evt.shiftKey);
  if (next === null) return;
  evt.preventDefault();
  stops[next]!.focus();
}
