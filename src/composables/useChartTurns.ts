/**
 * When the travel plots redraw. A Chart.js update lays out and paints a whole chart; doing
 * all of them on every sweep of a drag would take most of a frame. So each chart asks for a
 * turn when its data changes, and the charts get at most CHARTS_PER_FRAME turns per
 * animation frame, oldest request first, only charts on screen. A chart scrolled out of
 * view keeps its request and redraws when it comes back. Without requestAnimationFrame
 * (tests) a turn is given at once.
 */
import { effectScope, onBeforeUnmount, type Ref } from 'vue';
import { useIntersectionObserver } from '@vueuse/core';
import { useFrameBatch } from './useFrameBatch';

/** Charts redrawn per animation frame: one keeps a frame's work to a single chart update. */
const CHARTS_PER_FRAME = 1;

interface Job {
  dirty: boolean;
  visible: boolean;
  run: () => void;
}

/** In request order: a job that ran goes to the back, so every chart gets its turn. */
const queue: Job[] = [];

function giveTurns() {
  let given = 0;
  for (let i = 0; i < queue.length && given < CHARTS_PER_FRAME;) {
    const job = queue[i];
    if (job.dirty && job.visible) {
      job.dirty = false;
      queue.splice(i, 1);
      queue.push(job);
      job.run();
      given++;
    } else i++;
  }
  if (queue.some((j) => j.dirty && j.visible)) turnFrame.schedule();
}

/** One frame for all the charts of the page (the queue is shared), so it belongs to no component's scope. */
const turnFrame = effectScope(true).run(() => useFrameBatch(giveTurns))!;

/**
 * Registers a chart: `run` applies its latest data. Call `changed()` when the data changes.
 * `el` is watched for visibility (always visible where IntersectionObserver is missing).
 */
export function useChartTurns(el: Ref<HTMLElement | null>, run: () => void) {
  const job: Job = { dirty: false, visible: typeof IntersectionObserver === 'undefined', run };
  queue.push(job);

  useIntersectionObserver(el, (entries) => {
    job.visible = entries.some((e) => e.isIntersecting);
    if (job.visible && job.dirty) turnFrame.schedule();
  });

  onBeforeUnmount(() => {
    const i = queue.indexOf(job);
    if (i >= 0) queue.splice(i, 1);
  });

  return {
    changed() {
      job.dirty = true;
      if (job.visible) turnFrame.schedule();
    },
  };
}
