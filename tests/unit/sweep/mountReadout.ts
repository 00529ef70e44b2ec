/**
 * The board's readout mounted on a loaded board with its sweep settled, and the few ways the
 * readout tests read and type into it.
 */
import { flushPromises, mount } from '@vue/test-utils';
import { Quasar } from 'quasar';
import BoardReadout from '../../../src/components/BoardReadout.vue';
import { usePrefsStore } from '../../../src/stores/prefs';
import type { Sketch } from '../../../shared/schema/sketch';
import { onBoard } from './setup';

/** `component` (the readout unless told) mounted on a board holding `doc`, in the unit system asked for. */
export async function mountOnBoard<T>(doc?: Sketch, opts: { units?: 'mm' | 'in'; component?: T } = {}) {
  const stores = await onBoard(doc);
  if (opts.units) usePrefsStore().setUnits(opts.units);
  const component = opts.component ?? BoardReadout;
  const wrapper = mount(component as never, { global: { plugins: [[Quasar, {}], stores.pinia] } });
  await flushPromises();
  return { ...stores, wrapper };
}

/** The value cell of one readout line. */
export const valueOf = (w: ReturnType<typeof mount>, key: string) =>
  w.get(`[data-test="readout-${key}"] .board-readout__value`);

/** Types `text` into the input with `testId` and presses Enter. */
export async function typeInto(w: ReturnType<typeof mount>, testId: string, text: string) {
  const input = w.get(`[data-test="${testId}"]`);
  await input.setValue(text);
  await input.trigger('keydown', { key: 'Enter' });
  await flushPromises();
}
