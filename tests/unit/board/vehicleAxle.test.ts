// @vitest-environment happy-dom
/** The front / rear axle choice in the vehicle block: shown for solid axles only, applied as one undoable edit. */
import { afterEach, describe, expect, it } from 'vitest';
import type { VueWrapper } from '@vue/test-utils';
import BoardPivotTableVehicle from '../../../src/components/BoardPivotTableVehicle.vue';
import { useBoardStore } from '../../../src/stores/board';
import { starters } from '../../../shared/kinematics/starters';
import { mountOnBoard, nextFrame } from './mount';

let mounted: VueWrapper | null = null;
afterEach(() => {
  mounted?.unmount();
  mounted = null;
  useBoardStore().dispose();
});

describe('the axle end in the vehicle block', () => {
  it('puts a solid axle at the front and back at the rear, leaving no field for the rear', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTableVehicle);
    mounted = wrapper;
    const select = wrapper.get('[data-test="vehicle-axle"]');
    expect((select.element as HTMLSelectElement).value).toBe('rear');
    await select.setValue('front');
    await nextFrame();
    expect(board.document!.vehicle.axle).toBe('front');
    await select.setValue('rear');
    await nextFrame();
    expect('axle' in board.document!.vehicle).toBe(false);
    expect(board.undo()).toBe(true);
    expect(board.document!.vehicle.axle).toBe('front');
  });

  it('is not offered for a layout without a solid axle', async () => {
    const { wrapper } = await mountOnBoard(BoardPivotTableVehicle, starters['double-wishbone'].build());
    mounted = wrapper;
    expect(wrapper.find('[data-test="vehicle-axle"]').exists()).toBe(false);
  });
});
