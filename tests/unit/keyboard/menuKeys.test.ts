// @vitest-environment happy-dom
/**
 * A menu's keys as the WAI-ARIA menu pattern names them (https://www.w3.org/WAI/ARIA/apg/patterns/menu-button/):
 * Down and Up move to the next and previous item and wrap round, Home and End go to the first and last item.
 */
import { describe, expect, it } from 'vitest';
import { menuStep, onMenuKeydown } from '../../../src/keyboard/menuKeys';

describe('menuStep', () => {
  it('moves down and up through four items and wraps round at either end', () => {
    expect(menuStep('ArrowDown', 0, 4)).toBe(1);
    expect(menuStep('ArrowDown', 3, 4)).toBe(0);
    expect(menuStep('ArrowUp', 2, 4)).toBe(1);
    expect(menuStep('ArrowUp', 0, 4)).toBe(3);
  });

  it('goes from the menu itself to the first item with Down and to the last with Up', () => {
    expect(menuStep('ArrowDown', -1, 4)).toBe(0);
    expect(menuStep('ArrowUp', -1, 4)).toBe(3);
  });

  it('goes to the first and last item with Home and End, and leaves other keys and empty menus alone', () => {
    expect(menuStep('Home', 2, 4)).toBe(0);
    expect(menuStep('End', 1, 4)).toBe(3);
    expect(menuStep('Enter', 1, 4)).toBeNull();
    expect(menuStep('ArrowLeft', 1, 4)).toBeNull();
    expect(menuStep('ArrowDown', -1, 0)).toBeNull();
  });
});

describe('onMenuKeydown', () => {
  /** A menu of three items, the middle one disabled, as Quasar renders it; the focus on the menu element. */
  function menu() {
    const root = document.createElement('div');
    root.tabIndex = -1;
    root.innerHTML =
      '<div role="menu"><div role="menuitem" tabindex="0">Open</div>' +
      '<div role="menuitem" aria-disabled="true">Rename</div><div role="menuitem" tabindex="0">Delete</div></div>';
    document.body.replaceChildren(root);
    root.addEventListener('keydown', onMenuKeydown);
    root.focus();
    const items = Array.from(root.querySelectorAll<HTMLElement>('[role="menuitem"]'));
    const press = (key: string) => {
      const evt = new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true });
      (document.activeElement ?? root).dispatchEvent(evt);
      return evt;
    };
    return { items, press };
  }

  it('moves the focus over the items it can take, skipping a disabled one, and keeps the key from the page', () => {
    const { items, press } = menu();
    const reached: string[] = [];
    document.body.addEventListener('keydown', (e) => reached.push(e.key));
    expect(press('ArrowDown').defaultPrevented).toBe(true);
    expect(document.activeElement).toBe(items[0]);
    press('ArrowDown');
    expect(document.activeElement).toBe(items[2]);
    press('ArrowDown');
    expect(document.activeElement).toBe(items[0]);
    press('End');
    expect(document.activeElement).toBe(items[2]);
    expect(reached).toEqual([]);
    // Enter is the item's own (Quasar turns it into a click): it passes on untouched.
    expect(press('Enter').defaultPrevented).toBe(false);
    expect(reached).toEqual(['Enter']);
  });
});
