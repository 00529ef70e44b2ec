// @vitest-environment happy-dom
/**
 * useFrameBatch against a clock the test drives: Vitest's fake requestAnimationFrame, where a
 * frame is 16 ms of fake time and advanceTimersToNextFrame runs exactly the callbacks of one frame.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { effectScope } from 'vue';
import { useFrameBatch } from '../../../src/composables/useFrameBatch';

/** Runs the composable inside a scope the test can stop, as a component or a store would. */
function inScope<T>(apply: (value: T) => void) {
  const scope = effectScope();
  const batch = scope.run(() => useFrameBatch<T>(apply))!;
  return { batch, stop: () => scope.stop() };
}

describe('useFrameBatch', () => {
  beforeEach(() => {
    vi.useFakeTimers({ toFake: ['requestAnimationFrame', 'cancelAnimationFrame', 'performance'] });
  });
  afterEach(() => {
    vi.useRealTimers();
  });

  it('waits for the next frame and then applies only the latest of the values queued before it', () => {
    const seen: number[] = [];
    const { batch } = inScope<number>((v) => seen.push(v));
    batch.schedule(1);
    batch.schedule(2);
    batch.schedule(3);
    expect(seen).toEqual([]);
    expect(batch.pending()).toBe(true);
    vi.advanceTimersToNextFrame();
    expect(seen).toEqual([3]);
    expect(batch.pending()).toBe(false);
    vi.advanceTimersToNextFrame();
    expect(seen).toEqual([3]); // nothing new queued: no second call
  });

  it('gives each frame at most one call, also when values keep coming', () => {
    const seen: number[] = [];
    const { batch } = inScope<number>((v) => seen.push(v));
    for (let frame = 0; frame < 3; frame++) {
      for (let k = 0; k < 5; k++) batch.schedule(frame * 10 + k);
      vi.advanceTimersToNextFrame();
    }
    expect(seen).toEqual([4, 14, 24]);
  });

  it('puts a value queued while applying on the following frame, not the same one, and does not lose it', async () => {
    const seen: number[] = [];
    const { batch } = inScope<number>((v) => {
      seen.push(v);
      if (v < 3) batch.schedule(v + 1);
    });
    batch.schedule(1);
    vi.advanceTimersToNextFrame();
    expect(seen).toEqual([1]);
    await Promise.resolve(); // the request made inside the frame is sent once the frame's callback returns
    vi.advanceTimersToNextFrame();
    expect(seen).toEqual([1, 2]);
    await Promise.resolve();
    vi.advanceTimersToNextFrame();
    await Promise.resolve();
    vi.advanceTimersToNextFrame();
    expect(seen).toEqual([1, 2, 3]);
  });

  it('keeps working after an apply that throws', () => {
    const seen: number[] = [];
    const { batch } = inScope<number>((v) => {
      if (v === 1) throw new Error('bad value');
      seen.push(v);
    });
    batch.schedule(1);
    expect(() => vi.advanceTimersToNextFrame()).toThrow('bad value');
    batch.schedule(2);
    vi.advanceTimersToNextFrame();
    expect(seen).toEqual([2]);
  });

  it('flush applies the queued value at once and leaves nothing for the frame', () => {
    const seen: string[] = [];
    const { batch } = inScope<string>((v) => seen.push(v));
    batch.schedule('a');
    batch.flush();
    expect(seen).toEqual(['a']);
    vi.advanceTimersToNextFrame();
    expect(seen).toEqual(['a']);
    batch.flush(); // nothing queued: nothing applied
    expect(seen).toEqual(['a']);
  });

  it('cancel drops the queued value', () => {
    const seen: number[] = [];
    const { batch } = inScope<number>((v) => seen.push(v));
    batch.schedule(1);
    batch.cancel();
    expect(batch.pending()).toBe(false);
    vi.advanceTimersToNextFrame();
    expect(seen).toEqual([]);
    batch.schedule(2); // still usable after a cancel
    vi.advanceTimersToNextFrame();
    expect(seen).toEqual([2]);
  });

  it('drops what is queued when its scope is disposed (the component unmounts)', () => {
    const seen: number[] = [];
    const { batch, stop } = inScope<number>((v) => seen.push(v));
    batch.schedule(1);
    stop();
    vi.advanceTimersToNextFrame();
    expect(seen).toEqual([]);
    expect(batch.pending()).toBe(false);
  });
});

describe('useFrameBatch without requestAnimationFrame', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
  });

  it('applies each call at once', () => {
    vi.stubGlobal('requestAnimationFrame', undefined);
    const seen: number[] = [];
    const { batch } = inScope<number>((v) => seen.push(v));
    batch.schedule(1);
    batch.schedule(2);
    expect(seen).toEqual([1, 2]);
    expect(batch.pending()).toBe(false);
  });
});
