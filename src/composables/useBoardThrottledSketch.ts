/**
 * The shown sketch for panels that need not follow every pointer move (the tables): updated at
 * most once an animation frame, and while a pivot is being dragged at most every
 * DRAG_TABLE_INTERVAL_MS, so a drag redraws the canvas, not a table of inputs.
 */
import { onBeforeUnmount, shallowRef, watch } from 'vue';
import type { Sketch } from '../../shared/schema/sketch';
import { useBoardStore } from '../stores/board';
import { useFrameBatch } from './useFrameBatch';

/** Table refresh interval during a drag, ms: often enough to read, rare enough to cost nothing. */
const DRAG_TABLE_INTERVAL_MS = 150;

export function useBoardThrottledSketch() {
  const board = useBoardStore();
  const shown = shallowRef<Sketch | null>(board.sketch);
  let lastAt = 0;
  let timer: ReturnType<typeof setTimeout> | null = null;

  const frame = useFrameBatch(() => {
    timer = null;
    lastAt = performance.now();
    shown.value = board.sketch;
  });

  function schedule() {
    if (frame.pending() || timer) return;
    if (board.dragging) {
      const wait = Math.max(0, DRAG_TABLE_INTERVAL_MS - (performance.now() - lastAt));
      timer = setTimeout(() => frame.schedule(), wait);
    } else frame.schedule();
  }

  watch(() => board.sketch, schedule);
  // The end of a drag shows the final numbers on the next frame, not after the drag interval.
  watch(
    () => board.dragging,
    (d) => {
      if (d) return;
      if (timer) clearTimeout(timer);
      timer = null;
      frame.schedule();
    },
  );

  // The frame itself is dropped by useFrameBatch when the panel unmounts.
  onBeforeUnmount(() => {
    if (timer) clearTimeout(timer);
  });
  return shown;
}
