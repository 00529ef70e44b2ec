// @vitest-environment happy-dom
/**
 * Tab in a modal dialog goes round its controls (WAI-ARIA dialog pattern,
 * https://www.w3.org/WAI/ARIA/apg/patterns/dialog-modal/): Tab from the last control to the first, Shift+Tab from
 * the first to the last; in between, the browser's own step is left alone.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { onDialogTab, wrappedStop } from '../../../src/keyboard/dialogTab';

describe('wrappedStop', () => {
  it('wraps only at the ends, and from the dialog itself', () => {
    expect(wrappedStop(2, 3, false)).toBe(0);
    expect(wrappedStop(0, 3, true)).toBe(2);
    expect(wrappedStop(-1, 3, true)).toBe(2);
    expect(wrappedStop(-1, 3, false)).toBe(0);
    expect(wrappedStop(1, 3, false)).toBeNull();
    expect(wrappedStop(1, 3, true)).toBeNull();
    expect(wrappedStop(-1, 0, false)).toBeNull();
  });
});

describe('onDialogTab', () => {
  afterEach(() => document.removeEventListener('keydown', onDialogTab));

  /** A page button, then a modal dialog with a field, a disabled button, a hidden input and two buttons. */
  function page() {
    document.body.innerHTML =
      '<button id="behind">Behind</button>' +
      '<div role="dialog" aria-modal="true"><div tabindex="-1" id="inner">' +
      '<input id="name"><button id="off" disabled>Off</button><input type="hidden" id="secret">' +
      '<button id="cancel">Cancel</button><button id="ok">OK</button></div></div>';
    // happy-dom lays nothing out: every element gets a box, as the browser's would here.
    for (const el of Array.from(document.querySelectorAll<HTMLElement>('*')))
      el.getClientRects = () => [{ width: 10, height: 10 }] as unknown as DOMRectList;
    document.addEventListener('keydown', onDialogTab);
    const $ = (id: string) => document.getElementById(id)!;
    const tab = (shiftKey = false) => {
      const evt = new KeyboardEvent('keydown', { key: 'Tab', shiftKey, bubbles: true, cancelable: true });
      document.activeElement!.dispatchEvent(evt);
      return evt;
    };
    return { $, tab };
  }

  it('takes Tab from the last control to the first and Shift+Tab from the first to the last', () => {
    const { $, tab } = page();
    $('ok').focus();
    expect(tab().defaultPrevented).toBe(true);
    expect(document.activeElement).toBe($('name'));
    expect(tab(true).defaultPrevented).toBe(true);
    expect(document.activeElement).toBe($('ok'));
  });

  it('leaves the browser its own step inside the dialog, and leaves the page alone', () => {
    const { $, tab } = page();
    $('cancel').focus();
    expect(tab().defaultPrevented).toBe(false);
    expect(tab(true).defaultPrevented).toBe(false);
    $('behind').focus();
    expect(tab(true).defaultPrevented).toBe(false);
    expect(document.activeElement).toBe($('behind'));
  });

  it('sends Shift+Tab from the dialog itself to its last control', () => {
    const { $, tab } = page();
    $('inner').focus();
    expect(tab(true).defaultPrevented).toBe(true);
    expect(document.activeElement).toBe($('ok'));
  });
});
