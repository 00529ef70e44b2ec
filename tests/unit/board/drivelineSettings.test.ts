// @vitest-environment happy-dom
/** The driveline's settings beside the pivots: shaft type, joint-angle rules and slip-yoke lengths. */
import { afterEach, describe, expect, it } from 'vitest';
import type { DOMWrapper, VueWrapper } from '@vue/test-utils';
import BoardPivotTable from '../../../src/components/BoardPivotTable.vue';
import BoardPivotTableDriveline from '../../../src/components/BoardPivotTableDriveline.vue';
import { usePrefsStore } from '../../../src/stores/prefs';
import { useBoardStore } from '../../../src/stores/board';
import { MM_PER_INCH } from '../../../shared/units';
import { pointReferences, renamePoint, setDrivelineSettings } from '../../../src/stores/board/edits';
import { mountOnBoard, nextFrame } from './mount';
import { fourLink } from './fixture';

let mounted: VueWrapper | null = null;
afterEach(() => {
  mounted?.unmount();
  mounted = null;
  useBoardStore().dispose();
});

async function type(input: Omit<DOMWrapper<Element>, 'exists'>, text: string) {
  await input.trigger('focus');
  await input.setValue(text);
  await input.trigger('keydown', { key: 'Enter' });
  await nextFrame();
}

const valueOf = (w: VueWrapper, testId: string) => (w.get(`[data-test="${testId}"]`).element as HTMLInputElement).value;

describe('driveline settings on the board', () => {
  it('shows beside the pivots only for a sketch with a driveline', async () => {
    const withShaft = await mountOnBoard(BoardPivotTable);
    expect(withShaft.wrapper.find('[data-test="driveline-fields"]').exists()).toBe(true);
    withShaft.wrapper.unmount();
    useBoardStore().dispose();
    const doc = fourLink();
    delete doc.driveline;
    const { wrapper } = await mountOnBoard(BoardPivotTable, doc);
    mounted = wrapper;
    expect(wrapper.find('[data-test="driveline-fields"]').exists()).toBe(false);
  });

  it('shows the defaults, and sets the shaft type and angles as undoable edits', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTableDriveline);
    mounted = wrapper;
    expect(valueOf(wrapper, 'driveline-min-angle')).toBe('0.5');
    expect(valueOf(wrapper, 'driveline-max-mismatch')).toBe('1');
    await wrapper.get('[data-test="driveline-shaft"]').setValue('double-cardan');
    await nextFrame();
    expect(board.document!.driveline!.shaft).toBe('double-cardan');
    await type(wrapper.get('[data-test="driveline-min-angle"]'), '0.8');
    expect(board.document!.driveline!.minJointAngle).toBe(0.8);
    // Empty brings the default back by removing the field.
    await type(wrapper.get('[data-test="driveline-min-angle"]'), '');
    expect(board.document!.driveline!).not.toHaveProperty('minJointAngle');
    board.undo();
    expect(board.document!.driveline!.minJointAngle).toBe(0.8);
    // The four points are untouched by the settings.
    expect(board.document!.driveline!).toMatchObject(fourLink().driveline!);
  });

  it('refuses a negative angle with the reason beside the field, changing nothing', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTableDriveline);
    mounted = wrapper;
    const before = board.document;
    await type(wrapper.get('[data-test="driveline-max-mismatch"]'), '-1');
    expect(wrapper.get('[data-test="driveline-max-mismatch-error"]').text()).toBe(
      'Joint-angle mismatch must be at least 0 and at most 90 °.',
    );
    expect(board.document).toBe(before);
  });

  it('takes slip-yoke lengths in inches once both ends are typed, and refuses them in the wrong order', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTableDriveline);
    mounted = wrapper;
    usePrefsStore().setUnits('in');
    await nextFrame();
    await type(wrapper.get('[data-test="driveline-yoke-collapsed"]'), '54');
    expect(board.document!.driveline!.slipYoke).toBeUndefined();
    expect(wrapper.get('[data-test="driveline-yoke-note"]').text()).toContain('extended');
    await type(wrapper.get('[data-test="driveline-yoke-extended"]'), '57.5');
    // 1 in = 25.4 mm exactly (NIST SP 811, appendix B).
    expect(board.document!.driveline!.slipYoke).toEqual({ collapsed: 54 * MM_PER_INCH, extended: 57.5 * MM_PER_INCH });
    expect(valueOf(wrapper, 'driveline-yoke-extended')).toBe('57.5');
    const before = board.document;
    await type(wrapper.get('[data-test="driveline-yoke-extended"]'), '50');
    expect(wrapper.get('[data-test="driveline-yoke-extended-error"]').text()).toContain(
      'The extended length must be longer than the collapsed',
    );
    expect(board.document).toBe(before);
    await type(wrapper.get('[data-test="driveline-yoke-collapsed"]'), '');
    expect(board.document!.driveline!.slipYoke).toBeUndefined();
  });
});

describe('driveline edits', () => {
  it('renaming a pivot renames only the point fields, leaving the settings as they are', () => {
    const doc = setDrivelineSettings(fourLink(), {
      shaft: 'double-cardan',
      slipYoke: { collapsed: 1350, extended: 1450 },
    });
    const renamed = renamePoint(doc, 'DS.p', 'PN');
    expect(renamed.driveline).toEqual({ ...doc.driveline, pinion: 'PN' });
  });

  it('a pivot named like a setting is not taken for a driveline point', () => {
    const doc = setDrivelineSettings(fourLink(), { shaft: 'double-cardan' });
    expect(pointReferences(doc, 'double-cardan')).toEqual([]);
    expect(pointReferences(doc, 'DS.o')).toEqual(['the driveline (output)']);
  });

  it('refuses settings for a sketch without a driveline', () => {
    const doc = fourLink();
    delete doc.driveline;
    expect(() => setDrivelineSettings(doc, { minJointAngle: 1 })).toThrow('This sketch has no driveline.');
  });
});
