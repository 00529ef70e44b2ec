// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import type { DOMWrapper, VueWrapper } from '@vue/test-utils';
import BoardPivotTable from '../../../src/components/BoardPivotTable.vue';
import BoardMemberTable from '../../../src/components/BoardMemberTable.vue';
import { usePrefsStore } from '../../../src/stores/prefs';
import { useBoardStore } from '../../../src/stores/board';
import { MM_PER_INCH } from '../../../shared/units';
import { mountOnBoard, nextFrame } from './mount';

let mounted: VueWrapper | null = null;
afterEach(() => {
  mounted?.unmount();
  mounted = null;
  // No autosave after the test: there is no server here.
  useBoardStore().dispose();
});

async function type(input: Omit<DOMWrapper<Element>, 'exists'>, text: string) {
  await input.trigger('focus');
  await input.setValue(text);
  await input.trigger('keydown', { key: 'Enter' });
  await nextFrame();
}

const point = (board: { document: { points: { id: string; x: number; y: number; z: number }[] } | null }, id: string) =>
  board.document!.points.find((p) => p.id === id)!;

describe('pivot table', () => {
  it('lists every pivot with x, y and z in mm', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTable);
    mounted = wrapper;
    expect(wrapper.findAll('tbody tr')).toHaveLength(board.document!.points.length);
    expect((wrapper.get('[data-test="pivot-LL.fl-x"]').element as HTMLInputElement).value).toBe('980');
    expect((wrapper.get('[data-test="pivot-LL.fr-y"]').element as HTMLInputElement).value).toBe('-470');
  });

  it('a typed coordinate moves the pivot and its mirror partner', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTable);
    mounted = wrapper;
    await type(wrapper.get('[data-test="pivot-LL.fl-x"]'), '1000');
    expect(point(board, 'LL.fl').x).toBe(1000);
    expect(point(board, 'LL.fr').x).toBe(1000);
    expect((wrapper.get('[data-test="pivot-LL.fr-x"]').element as HTMLInputElement).value).toBe('1000');
  });

  it('a bad number shows an error beside the field and changes nothing', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTable);
    mounted = wrapper;
    const before = board.document;
    await type(wrapper.get('[data-test="pivot-LL.fl-z"]'), '33o');
    expect(wrapper.get('[data-test="pivot-LL.fl-z-error"]').text()).toMatch(/“33o” is not a number/);
    expect(wrapper.get('[data-test="pivot-LL.fl-z"]').attributes('aria-invalid')).toBe('true');
    expect(board.document).toBe(before);
    expect(board.canUndo).toBe(false);
  });

  it('a number the sketch refuses (a zero-length link) shows why and changes nothing', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTable);
    mounted = wrapper;
    board.setMirrorLinked(false);
    board.setPointCoordinate('LL.fl', 'x', 30);
    board.setPointCoordinate('LL.fl', 'y', 470);
    await nextFrame();
    const before = board.document;
    await type(wrapper.get('[data-test="pivot-LL.fl-z"]'), '235');
    expect(wrapper.get('[data-test="pivot-LL.fl-z-error"]').text()).toMatch(/zero length/);
    expect(board.document).toBe(before);
  });

  it('works in inches: shows them and reads them', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTable);
    mounted = wrapper;
    usePrefsStore().setUnits('in');
    await nextFrame();
    // 980 mm / 25.4 = 38.583 in (1 in = 25.4 mm exactly, by definition).
    expect((wrapper.get('[data-test="pivot-LL.fl-x"]').element as HTMLInputElement).value).toBe('38.583');
    await type(wrapper.get('[data-test="pivot-LL.fl-x"]'), '40');
    expect(point(board, 'LL.fl').x).toBeCloseTo(40 * MM_PER_INCH, 9);
    // A length with its own unit is read as such and then shown in the user's.
    await type(wrapper.get('[data-test="pivot-LL.fl-z"]'), '254 mm');
    expect(point(board, 'LL.fl').z).toBe(254);
    expect((wrapper.get('[data-test="pivot-LL.fl-z"]').element as HTMLInputElement).value).toBe('10');
  });

  it('renaming a pivot updates the members that use it', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTable);
    mounted = wrapper;
    await type(wrapper.get('[data-test="pivot-UL.al-id"]'), 'UpperAxle.l');
    expect(board.document!.members.find((m) => m.id === 'ULl')!.b).toBe('UpperAxle.l');
    expect(wrapper.find('[data-test="pivot-row-UpperAxle.l"]').exists()).toBe(true);
  });

  it('vehicle sizes are edited in the user unit and refuse zero', async () => {
    const { wrapper, board } = await mountOnBoard(BoardPivotTable);
    mounted = wrapper;
    await wrapper.get('[data-test="vehicle-toggle"]').trigger('click');
    await nextFrame();
    const before = board.document;
    await type(wrapper.get('[data-test="vehicle-tireRadius"]'), '0');
    expect(wrapper.get('[data-test="vehicle-tireRadius-error"]').text()).toMatch(/more than 0/);
    expect(board.document).toBe(before);
    await type(wrapper.get('[data-test="vehicle-tireRadius"]'), '420');
    expect(board.document!.vehicle.tireRadius).toBe(420);
  });

  it('is read-only for a sketch the user cannot edit', async () => {
    const { wrapper } = await mountOnBoard(BoardPivotTable, undefined, { canEdit: false });
    mounted = wrapper;
    expect(wrapper.get('[data-test="pivot-LL.fl-x"]').attributes('disabled')).toBeDefined();
    expect(wrapper.find('[data-test="pivot-add"]').exists()).toBe(false);
  });
});

describe('member table', () => {
  it('lists members with kind, ends and length at ride', async () => {
    const { wrapper } = await mountOnBoard(BoardMemberTable);
    mounted = wrapper;
    expect((wrapper.get('[data-test="member-LLl-kind"]').element as HTMLSelectElement).value).toBe('link');
    expect((wrapper.get('[data-test="member-LLl-a"]').element as HTMLSelectElement).value).toBe('LL.fl');
    // |(980, 470, 330) − (30, 470, 235)| = √(950² + 95²) = 954.7 mm.
    expect(wrapper.get('[data-test="member-LLl-length"]').text()).toBe('954.7');
  });

  it('re-kinding a link to a shock gives it stroke limits to edit; a bad limit is refused', async () => {
    const { wrapper, board } = await mountOnBoard(BoardMemberTable);
    mounted = wrapper;
    await wrapper.get('[data-test="member-ULl-kind"]').setValue('shock');
    await nextFrame();
    expect(board.document!.members.find((m) => m.id === 'ULl')!.kind).toBe('shock');
    const before = board.document;
    await type(wrapper.get('[data-test="member-ULl-min"]'), '-5');
    expect(wrapper.get('[data-test="member-ULl-min-error"]').text()).toMatch(/more than 0/);
    expect(board.document).toBe(before);
    await type(wrapper.get('[data-test="member-ULl-max"]'), '900');
    const m = board.document!.members.find((x) => x.id === 'ULl')!;
    expect(m.kind === 'shock' && m.maxLength).toBe(900);
  });

  it('a spring rate must be a positive number', async () => {
    const { wrapper, board } = await mountOnBoard(BoardMemberTable);
    mounted = wrapper;
    const before = board.document;
    await type(wrapper.get('[data-test="member-SHr-rate"]'), 'stiff');
    expect(wrapper.get('[data-test="member-SHr-rate-error"]').text()).toMatch(/not a number/);
    expect(board.document).toBe(before);
    await type(wrapper.get('[data-test="member-SHr-rate"]'), '52.5');
    const m = board.document!.members.find((x) => x.id === 'SHr')!;
    expect(m.kind === 'spring' && m.rate).toBe(52.5);
  });

  it('a spring rate is shown and typed in lbf/in with inches, and stored in N/mm', async () => {
    const { wrapper, board } = await mountOnBoard(BoardMemberTable);
    mounted = wrapper;
    usePrefsStore().setUnits('in');
    await nextFrame();
    // 1 lbf/in = 0.45359237 kg × 9.80665 m/s² / 25.4 mm (international pound and inch, 1959; standard gravity).
    const nPerMmPerLbfIn = (0.45359237 * 9.80665) / 25.4;
    expect(board.setMemberField('SHr', 'rate', 40).ok).toBe(true);
    await nextFrame();
    const box = () => wrapper.get('[data-test="member-SHr-rate"]').element as HTMLInputElement;
    expect(box().value).toBe(String(+(40 / nPerMmPerLbfIn).toFixed(2)));
    expect(wrapper.get('[data-test="member-row-SHr"]').text()).toContain('lbf/in');
    await type(wrapper.get('[data-test="member-SHr-rate"]'), '300 lbf/in');
    const m = board.document!.members.find((x) => x.id === 'SHr')!;
    expect(m.kind === 'spring' && m.rate).toBeCloseTo(300 * nPerMmPerLbfIn, 9);
    expect(box().value).toBe('300');
    await type(wrapper.get('[data-test="member-SHr-rate"]'), '-3');
    expect(wrapper.get('[data-test="member-SHr-rate-error"]').text()).toMatch(/above 0 .* lbf\/in/);
  });

  it('changing an end reconnects the member; delete removes it', async () => {
    const { wrapper, board } = await mountOnBoard(BoardMemberTable);
    mounted = wrapper;
    await wrapper.get('[data-test="member-LR-b"]').setValue('LL.ar');
    expect(board.document!.members.find((m) => m.id === 'LR')!.b).toBe('LL.ar');
    await wrapper.get('[data-test="member-LR-delete"]').trigger('click');
    await nextFrame();
    expect(board.document!.members.some((m) => m.id === 'LR')).toBe(false);
    expect(wrapper.find('[data-test="member-row-LR"]').exists()).toBe(false);
  });

  it('adds a member with two new pivots', async () => {
    const { wrapper, board } = await mountOnBoard(BoardMemberTable);
    mounted = wrapper;
    const points = board.document!.points.length;
    await wrapper.get('[data-test="member-add-kind"]').setValue('lateral-rod');
    await wrapper.get('[data-test="member-add"]').trigger('submit');
    await nextFrame();
    const added = board.document!.members.find((m) => m.id === 'LR2');
    expect(added?.kind).toBe('lateral-rod');
    expect(board.document!.points.length).toBe(points + 2);
    expect(board.selectedMember).toBe('LR2');
  });
});
