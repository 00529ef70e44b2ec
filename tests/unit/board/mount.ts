/** Mounting board components the way the app does: Quasar installed, a fresh Pinia, a sketch on the board. */
import { mount, flushPromises } from '@vue/test-utils';
import { Quasar, Notify } from 'quasar';
import { createPinia, setActivePinia } from 'pinia';
import type { Sketch } from '../../../shared/schema/sketch';
import type { SketchDetail } from '../../../src/api/types';
import { useBoardStore } from '../../../src/stores/board';
import { detailOf, fourLink } from './fixture';

/** Quasar reads the screen orientation at install; happy-dom has none. */
function provideScreenOrientation() {
  if (window.screen.orientation) return;
  Object.defineProperty(window.screen, 'orientation', {
    configurable: true,
    value: { type: 'landscape-primary', angle: 0, addEventListener() {}, removeEventListener() {} },
  });
}

/** Lets the tables' once-a-frame refresh run. */
export async function nextFrame() {
  await new Promise((r) => requestAnimationFrame(() => r(undefined)));
  await flushPromises();
}

export async function mountOnBoard(component: unknown, doc: Sketch = fourLink(), over: Partial<SketchDetail> = {}) {
  provideScreenOrientation();
  localStorage.clear();
  const pinia = createPinia();
  setActivePinia(pinia);
  const board = useBoardStore();
  board.setLoaded(detailOf(doc, over));
  const wrapper = mount(component as never, {
    attachTo: document.body,
    global: { plugins: [[Quasar, { plugins: { Notify } }], pinia] },
  });
  await nextFrame();
  return { wrapper, board, pinia };
}
