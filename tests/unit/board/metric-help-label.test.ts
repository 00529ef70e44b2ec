// @vitest-environment happy-dom
/** A quantity's help opens for the keyboard as it does for the mouse: focus shows the tooltip, blur hides it. */
import { describe, expect, it } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { Quasar } from 'quasar';
import MetricHelpLabel from '../../../src/components/MetricHelpLabel.vue';

const HELP = 'Camber: the wheel’s lean from vertical, top outward positive.';

/** Quasar reads the screen orientation at install; happy-dom has none. */
if (!window.screen.orientation) {
  Object.defineProperty(window.screen, 'orientation', {
    configurable: true,
    value: { type: 'landscape-primary', angle: 0, addEventListener() {}, removeEventListener() {} },
  });
}

const shownTooltip = () => document.body.querySelector('.q-tooltip');

describe('a quantity name with help', () => {
  it('opens its tooltip on keyboard focus and closes it on blur', async () => {
    const wrapper = mount(MetricHelpLabel, {
      props: { text: 'Camber', help: HELP },
      attachTo: document.body,
      global: { plugins: [Quasar] },
    });
    expect(shownTooltip()).toBeNull();
    // Focus given as the keyboard gives it (focus, focusin, :focus-visible), which the tooltip answers after its delay.
    const label = wrapper.get('.metric-help').element as HTMLElement;
    label.focus();
    await new Promise((r) => setTimeout(r, 400));
    await flushPromises();
    expect(shownTooltip()?.textContent).toBe(HELP);
    label.blur();
    await new Promise((r) => setTimeout(r, 400));
    await flushPromises();
    expect(shownTooltip()).toBeNull();
    wrapper.unmount();
  });

  it('takes no focus and shows no tooltip when it has no help', async () => {
    const wrapper = mount(MetricHelpLabel, {
      props: { text: 'Pivot' },
      attachTo: document.body,
      global: { plugins: [Quasar] },
    });
    expect(wrapper.get('span').attributes('tabindex')).toBeUndefined();
    (wrapper.get('span').element as HTMLElement).focus();
    await new Promise((r) => setTimeout(r, 400));
    await flushPromises();
    expect(shownTooltip()).toBeNull();
    wrapper.unmount();
  });
});
