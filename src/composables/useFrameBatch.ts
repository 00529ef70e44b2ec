/**
 * Once-per-frame batching: calls made between two animation frames become one call at the next
 * frame, with the latest value queued. Used wherever input can arrive faster than the page paints
 * (pointer moves, worker answers, chart redraws), so work nobody would see is never done.
 *
 * Built on VueUse's useRafFn (one frame, not a loop), so the frame it waits for is cancelled when
 * the component or store that made it goes away. Without requestAnimationFrame (tests in Node)
 * the call is made at once.
 */
import { tryOnScopeDispose, useRafFn } from '@vueuse/core';

export interface FrameBatch<T> {
  /** Queues `value` (replacing anything queued); `apply` gets it at the next animation frame. */
  schedule(value: T): void;
  /** Applies what is queued now instead of at the frame (e.g. the last move at the end of a drag). */
  flush(): void;
  /** Drops what is queued and the frame it waits for. */
  cancel(): void;
  /** True while a value waits for its frame. */
  pending(): boolean;
}

export function useFrameBatch<T = void>(apply: (value: T) => void): FrameBatch<T> {
  let queued: { value: T } | null = null;
  let applying = false;
  const frame = useRafFn(run, { immediate: false, once: true });

  function run() {
    // Stopped before `apply`, so that an `apply` that throws does not leave the frame marked as taken.
    frame.pause();
    const q = queued;
    queued = null;
    if (!q) return;
    applying = true;
    try {
      apply(q.value);
    } finally {
      applying = false;
    }
  }

  function request() {
    if (queued) frame.resume();
  }

  function schedule(value: T) {
    queued = { value };
    if (typeof requestAnimationFrame !== 'function') run();
    // useRafFn marks a `once` frame done after its callback returns, which would drop a frame asked for
    // inside `apply`; that request is made once the callback has returned, so it lands on the next frame.
    else if (applying) queueMicrotask(request);
    else frame.resume();
  }

  function flush() {
    run();
  }

  function cancel() {
    frame.pause();
    queued = null;
  }

  tryOnScopeDispose(cancel);
  return { schedule, flush, cancel, pending: () => queued !== null };
}
