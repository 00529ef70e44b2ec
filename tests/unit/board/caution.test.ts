// @vitest-environment happy-dom
/** The board's caution: the banner until the user dismisses it, per user, and the menu item that opens the full text. */
import { afterEach, describe, expect, it } from 'vitest';
import { defineComponent, h, nextTick } from 'vue';
import type { VueWrapper } from '@vue/test-utils';
import BoardCaution from '../../../src/components/BoardCaution.vue';
import { CAUTION_TEXT, CAUTION_TITLE } from '../../../shared/display/caution';
import { useBoardStore } from '../../../src/stores/board';
import { useSessionStore } from '../../../src/stores/session';
import { mountOnBoard } from './mount';

let mounted: VueWrapper | null = null;
afterEach(() => {
  mounted?.unmount();
  mounted = null;
  useBoardStore().dispose();
});

/** The board's own caution and the board menu's item, side by side as on the page. */
const BannerAndMenuItem = defineComponent(() => () => [h(BoardCaution), h(BoardCaution, { variant: 'menu-item' })]);

describe('board caution', () => {
  it('shows the caution until the user dismisses it, and remembers the dismissal for that user only', async () => {
    const { wrapper, pinia } = await mountOnBoard(BoardCaution);
    mounted = wrapper;
    const banner = wrapper.get('[data-test="caution-banner"]');
    expect(banner.text()).toContain(CAUTION_TITLE);
    expect(banner.text()).toContain(CAUTION_TEXT);
    await wrapper.get('[data-test="caution-dismiss"]').trigger('click');
    expect(wrapper.find('[data-test="caution-banner"]').exists()).toBe(false);
    expect(localStorage.getItem('arcwright.caution-seen.guest')).toBe('1');

    // Another user on the same browser has not dismissed it.
    useSessionStore(pinia).user = { id: 41, name: 'Ines Harrow', email: 'ines@example.test', role: 'member' };
    await nextTick();
    expect(wrapper.find('[data-test="caution-banner"]').exists()).toBe(true);
  });

  it('the menu item opens the full caution', async () => {
    const { wrapper } = await mountOnBoard(BannerAndMenuItem);
    mounted = wrapper;
    expect(document.querySelector('[data-test="caution-dialog"]')).toBeNull();
    await wrapper.get('[data-test="caution-menu-item"]').trigger('click');
    await nextTick();
    const dialog = document.querySelector('[data-test="caution-dialog"]');
    expect(dialog?.textContent).toContain(CAUTION_TEXT);
  });
});
