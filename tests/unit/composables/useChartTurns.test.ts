// @vitest-environment happy-dom
/**
 * The chart turns against a clock and a visibility the test drives: Vitest's fake
 * requestAnimationFrame, and an IntersectionObserver stand-in the test calls back itself.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { defineComponent, h, nextTick, ref } from 'vue';
import { mount, type VueWrapper } from '@vue/test-utils';
import { useChartTurns } from '../../../src/composables/useChartTurns';

/** Every observer made, so the test can say what is on screen. */
const observers: Array<{ el: Element | null; callback: IntersectionObserverCallback; disconnected: boolean }> = [];

class StandInObserver {
  private record: (typeof observers)[number];
  constructor(callback: IntersectionObserverCallback) {
    this.record = { el: null, callback, disconnected: false };
    observers.push(this.record);
  }
  observe(el: Element) {
    this.record.el = el;
  }
  disconnect() {
    this.record.disconnected = true;
  }
}

function setVisible(el: Element, visible: boolean) {
  for (const o of observers) {
    if (o.el === el && !o.disconnected)
      o.callback([{ isIntersecting: visible, target: el } as IntersectionObserverEntry], o as never);
  }
}

/** A chart stand-in: counts its redraws. */
const Chart = defineComponent({
  props: { name: { type: String, required: true }, log: { type: Array, required: true } },
  setup(props, { expose }) {
    const el = ref<HTMLElement | null>(null);
    const turns = useChartTurns(el, () => (props.log as string[]).push(props.name));
    expose({ changed: turns.changed, el });
    return () => h('div', { ref: el });
  },
});

let wrappers: VueWrapper[] = [];
function mountChart(name: string, log: string[]) {
  const w = mount(Chart, { props: { name, log }, attachTo: document.body });
  wrappers.push(w);
  return w.vm as unknown as { changed: () => void; el: HTMLElement };
}

describe('useChartTurns', () => {
  beforeEach(() => {
    observers.length = 0;
    vi.stubGlobal('IntersectionObserver', StandInObserver);
  });
  afterEach(() => {
    wrappers.forEach((w) => w.unmount());
    wrappers = [];
    vi.useRealTimers();
    vi.unstubAllGlobals();
  });

  it('redraws one chart per frame, oldest request first, and only charts on screen', async () => {
    const log: string[] = [];
    const a = mountChart('a', log);
    const b = mountChart('b', log);
    await nextTick(); // the observers start once the charts are in the page
    vi.useFakeTimers({ toFake: ['requestAnimationFrame', 'cancelAnimationFrame'] });
    setVisible(a.el, true);
    b.changed(); // b is not on screen yet: it keeps its request
    a.changed();
    vi.advanceTimersToNextFrame();
    expect(log).toEqual(['a']);
    setVisible(b.el, true); // b comes on screen with its request waiting
    vi.advanceTimersToNextFrame();
    expect(log).toEqual(['a', 'b']);
    a.changed();
    b.changed();
    vi.advanceTimersToNextFrame();
    expect(log).toEqual(['a', 'b', 'a']);
    await Promise.resolve();
    vi.advanceTimersToNextFrame();
    expect(log).toEqual(['a', 'b', 'a', 'b']);
  });

  it('stops watching a chart that leaves the page', async () => {
    mountChart('c', []);
    await nextTick();
    const record = observers[observers.length - 1];
    expect(record.disconnected).toBe(false);
    wrappers.pop()!.unmount();
    expect(record.disconnected).toBe(true);
  });
});
