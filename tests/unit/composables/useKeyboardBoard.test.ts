// @vitest-environment happy-dom
/** The board's keys reach the board store while the board is mounted, and only then. */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { defineComponent, h, ref } from 'vue';
import { mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { useKeyboardBoard } from '../../../src/composables/useKeyboardBoard';
import { useBoardStore } from '../../../src/stores/board';
import type { ViewKind } from '../../../src/canvas/transform';

const press = (init: KeyboardEventInit) => window.dispatchEvent(new KeyboardEvent('keydown', init));

describe('useKeyboardBoard', () => {
  afterEach(() => {
    vi.restoreAllMocks();
  });

  it('undoes, redoes and fits the active view from window keys, and lets go of them when unmounted', () => {
    const pinia = createPinia();
    setActivePinia(pinia);
    const board = useBoardStore();
    const undo = vi.spyOn(board, 'undo').mockImplementation(() => undefined as never);
    const redo = vi.spyOn(board, 'redo').mockImplementation(() => undefined as never);
    const fitted: ViewKind[] = [];
    const Board = defineComponent(() => {
      useKeyboardBoard(ref<ViewKind>('rear'), { fit: (v) => fitted.push(v) });
      return () => h('div');
    });
    const wrapper = mount(Board, { global: { plugins: [pinia] } });

    press({ key: 'z', ctrlKey: true });
    press({ key: 'Z', ctrlKey: true, shiftKey: true });
    press({ key: 'y', metaKey: true });
    press({ key: 'f' });
    expect(undo).toHaveBeenCalledTimes(1);
    expect(redo).toHaveBeenCalledTimes(2);
    expect(fitted).toEqual(['rear']);

    wrapper.unmount();
    press({ key: 'z', ctrlKey: true });
    press({ key: 'f' });
    expect(undo).toHaveBeenCalledTimes(1);
    expect(fitted).toEqual(['rear']);
  });

  it('leaves keys pressed in a dialog or a menu over the board to them', () => {
    const pinia = createPinia();
    setActivePinia(pinia);
    const board = useBoardStore();
    const undo = vi.spyOn(board, 'undo').mockImplementation(() => undefined as never);
    const fitted: ViewKind[] = [];
    const Board = defineComponent(() => {
      useKeyboardBoard(ref<ViewKind>('side'), { fit: (v) => fitted.push(v) });
      return () => h('div');
    });
    const wrapper = mount(Board, { global: { plugins: [pinia] } });
    document.body.innerHTML =
      '<div role="dialog" aria-modal="true"><button id="in-dialog">Close</button></div>' +
      '<div class="q-menu"><div role="menuitem" tabindex="0" id="in-menu">Share</div></div>';
    const from = (id: string, init: KeyboardEventInit) =>
      document.getElementById(id)!.dispatchEvent(new KeyboardEvent('keydown', { ...init, bubbles: true }));

    from('in-dialog', { key: 'z', ctrlKey: true });
    from('in-dialog', { key: 'f' });
    from('in-menu', { key: 'f' });
    expect(undo).not.toHaveBeenCalled();
    expect(fitted).toEqual([]);
    // The same keys from the page itself still reach the board.
    press({ key: 'z', ctrlKey: true });
    press({ key: 'f' });
    expect(undo).toHaveBeenCalledTimes(1);
    expect(fitted).toEqual(['side']);
    wrapper.unmount();
    document.body.innerHTML = '';
  });
});
