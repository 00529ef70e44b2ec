/**
 * Shared set-up for the sweep tests: a fresh Pinia, the sweep on the main thread (no Web
 * Worker in the test environment), and a sketch put on the board the way the page does it.
 */
import { nextTick } from 'vue';
import { createPinia, setActivePinia } from 'pinia';
import type { SketchDetail } from '../../../src/api/types';
import type { Sketch } from '../../../shared/schema/sketch';
import { starters } from '../../../shared/kinematics';
import { useBoardStore } from '../../../src/stores/board';
import { configureSweepRunner, useSweepStore } from '../../../src/stores/sweep';

export function detailOf(document: Sketch, id = 7): SketchDetail {
  return {
    id,
    name: document.name,
    layout: document.layout,
    version: 1,
    updatedAt: '2026-01-01T00:00:00.000Z',
    createdAt: '2026-01-01T00:00:00.000Z',
    owner: { id: 1, name: 'Mara Quill' },
    mine: true,
    share: 'private',
    deletedAt: null,
    document,
    canEdit: true,
    shareToken: null,
  };
}

export const fourLink = (): Sketch => starters['four-link-lateral-rod']!.build();

export function freshStores() {
  const pinia = createPinia();
  setActivePinia(pinia);
  configureSweepRunner({ useWorker: false });
  const board = useBoardStore();
  const sweep = useSweepStore();
  return { pinia, board, sweep };
}

/** Waits for the board's change to reach the sweep and the sweep to finish. */
export async function settled(sweep: ReturnType<typeof useSweepStore>) {
  await nextTick();
  await sweep.whenIdle();
  await nextTick();
}

export async function onBoard(doc: Sketch = fourLink()) {
  const s = freshStores();
  s.board.setLoaded(detailOf(doc));
  await settled(s.sweep);
  return s;
}

/**
 * happy-dom has no `screen.orientation`, which Quasar's Screen plugin reads when it installs;
 * a landscape desktop screen stands in for it.
 */
export function provideScreenOrientation() {
  if (typeof window === 'undefined' || window.screen.orientation) return;
  Object.defineProperty(window.screen, 'orientation', {
    configurable: true,
    value: { type: 'landscape-primary', angle: 0, addEventListener() {}, removeEventListener() {} },
  });
}
