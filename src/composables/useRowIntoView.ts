/**
 * Keeps the row of what was just selected in sight in a scrolling table: a pivot clicked on the
 * canvas, a member picked from a flag, a member just added at the bottom. The tables draw from a
 * once-a-frame copy of the sketch (useBoardThrottledSketch), so a new row may appear a frame
 * after the selection: the scroll waits for that frame.
 */
import { nextTick, watch, type Ref } from 'vue';
import { useFrameBatch } from './useFrameBatch';

export function useRowIntoView(
  scroller: Ref<HTMLElement | null>,
  selected: () => string | null,
  rowTestId: (id: string) => string,
): void {
  const scroll = useFrameBatch<string>(async (id) => {
    await nextTick();
    if (selected() !== id) return; // a newer selection has its own turn
    scroller.value?.querySelector(`[data-test="${CSS.escape(rowTestId(id))}"]`)?.scrollIntoView({ block: 'nearest' });
  });

  watch(selected, async (id) => {
    if (!id) return;
    await nextTick();
    scroll.schedule(id);
  });
}
