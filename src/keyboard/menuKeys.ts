/**
 * The keys of a menu opened from a button, as in the WAI-ARIA menu pattern: the up and down arrows move the
 * focus to the previous or next item (round from the last to the first), Home and End to the first and last.
 * Enter and Space pick the focused item (QItem does that) and Escape closes the menu (QMenu does that).
 */

/** The menu's items the focus can go to: Quasar gives a clickable QItem in a `role="menu"` list this role. */
const ITEM = '[role="menuitem"]:not([aria-disabled="true"])';

/**
 * Which item the key moves the focus to, from item `current` of `count` (-1 when the focus is on the menu
 * itself, not on an item); null when the key is not one of the menu's.
 */
export function menuStep(key: string, current: number, count: number): number | null {
  if (count === 0) return null;
  switch (key) {
    case 'ArrowDown':
      return current < 0 ? 0 : (current + 1) % count;
    case 'ArrowUp':
      return current < 0 ? count - 1 : (current - 1 + count) % count;
    case 'Home':
      return 0;
    case 'End':
      return count - 1;
    default:
      return null;
  }
}

/**
 * A QMenu's keydown listener (`<q-menu @keydown="onMenuKeydown">` around a `<q-list role="menu">`). The key is
 * kept from the page behind (the board's arrows nudge pivots), as the menu holds the focus.
 */
export function onMenuKeydown(evt: KeyboardEvent): void {
  if (evt.altKey || evt.ctrlKey || evt.metaKey || evt.shiftKey) return;
  const menu = evt.currentTarget as HTMLElement;
  const items = Array.from(menu.querySelectorAll<HTMLElement>(ITEM));
  const active = document.activeElement;
  const next = menuStep(
    evt.key,
    items.findIndex((item) => item.contains(active)),
    items.length,
  );
  if (next === null) return;
  evt.preventDefault();
  evt.stopPropagation();
  items[next]!.focus();
}
