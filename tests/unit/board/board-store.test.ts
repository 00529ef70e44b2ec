// @vitest-environment happy-dom
import { beforeEach, describe, expect, it } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { useBoardStore } from '../../../src/stores/board';
import { usePrefsStore } from '../../../src/stores/prefs';
import { MM_PER_INCH } from '../../../shared/units';
import { detailOf, fourLink } from './fixture';

/** Decimal places for toBeCloseTo on mm after float arithmetic: 1e-9 mm, far below anything a user sees. */
const MM_DIGITS = 9;

function point(board: ReturnType<typeof useBoardStore>, id: string) {
  const p = board.document!.points.find((q) => q.id === id);
  if (!p) throw new Error(`no ${id}`);
  return p;
}

describe('board store: edits', () => {
  let board: ReturnType<typeof useBoardStore>;
  beforeEach(() => {
    localStorage.clear();
    setActivePinia(createPinia());
    board = useBoardStore();
    board.setLoaded(detailOf(fourLink()));
  });

  it('typing a coordinate moves the pivot and, while linked, its mirror partner', () => {
    expect(board.setPointCoordinate('LL.fl', 'x', 1000)).toEqual({ ok: true });
    expect(point(board, 'LL.fl').x).toBe(1000);
    expect(point(board, 'LL.fr').x).toBe(1000);
    board.setPointCoordinate('LL.fl', 'y', 500);
    expect(point(board, 'LL.fl').y).toBe(500);
    expect(point(board, 'LL.fr').y).toBe(-500);
  });

  it('unlinked, only the pivot itself moves', () => {
    board.setMirrorLinked(false);
    board.setPointCoordinate('LL.fl', 'z', 300);
    expect(point(board, 'LL.fl').z).toBe(300);
    expect(point(board, 'LL.fr').z).toBe(330);
  });

  it('undo returns the exact earlier document after a run of different edits, and redo the later one', () => {
    const start = JSON.stringify(board.document);
    board.setPointCoordinate('UL.al', 'z', 555);
    board.renamePoint('LL.fl', 'LowerFront.l');
    board.setMemberKind('ULl', 'shock');
    board.setMemberField('SHl', 'maxLength', 600);
    board.deleteMember('LR');
    board.setVehicleField('tireRadius', 420);
    const end = JSON.stringify(board.document);
    let n = 0;
    while (board.undo()) n++;
    expect(n).toBe(6);
    expect(JSON.stringify(board.document)).toBe(start);
    expect(board.document).toEqual(fourLink());
    while (board.redo()) n--;
    expect(n).toBe(0);
    expect(JSON.stringify(board.document)).toBe(end);
  });

  it('a whole drag is one undo step, and the partner follows mirrored', () => {
    const before = board.document;
    usePrefsStore().setSnap(false);
    expect(board.beginDrag('rear', 'SH.fl')).toBe(true);
    board.dragTo({ h: 530, v: 790 });
    board.dragTo({ h: 545, v: 800 });
    board.dragTo({ h: 550.25, v: 801.5 });
    board.endDrag();
    expect(point(board, 'SH.fl')).toMatchObject({ x: -140, y: 550.25, z: 801.5 });
    expect(point(board, 'SH.fr')).toMatchObject({ x: -140, y: -550.25, z: 801.5 });
    expect(board.undoLabel).toBe('Move SH.fl');
    board.undo();
    expect(board.document).toEqual(before);
    expect(board.canUndo).toBe(false);
  });

  it('a drag snaps the grabbed pivot to the grid step in the user unit', () => {
    usePrefsStore().setSnap(true);
    usePrefsStore().setSnapStep(5);
    board.beginDrag('side', 'UL.fl');
    board.dragTo({ h: 768.2, v: 611.9 });
    board.endDrag();
    expect(point(board, 'UL.fl')).toMatchObject({ x: 770, z: 610 });
    usePrefsStore().setUnits('in');
    usePrefsStore().setSnapStep(0.5);
    board.beginDrag('side', 'UL.fl');
    board.dragTo({ h: 800, v: 600 });
    board.endDrag();
    // 800 mm = 31.50 in → 31.5 in; 600 mm = 23.62 in → 23.5 in.
    expect(point(board, 'UL.fl').x).toBeCloseTo(31.5 * MM_PER_INCH, MM_DIGITS);
    expect(point(board, 'UL.fl').z).toBeCloseTo(23.5 * MM_PER_INCH, MM_DIGITS);
  });

  it('a drag that ends where it began records nothing; Escape cancels a drag', () => {
    board.beginDrag('side', 'UL.fl');
    board.endDrag();
    expect(board.canUndo).toBe(false);
    const before = board.document;
    board.beginDrag('side', 'UL.fl');
    board.dragTo({ h: 0, v: 0 });
    board.cancelDrag();
    expect(board.document).toBe(before);
    expect(board.canUndo).toBe(false);
  });

  it('arrow nudges move by the step (×10 with Shift) and a run of them undoes as one', () => {
    usePrefsStore().setSnap(false);
    board.select('LL.al');
    board.nudge('side', 1, 0);
    board.nudge('side', 1, 0, true);
    board.nudge('side', 0, 1);
    // Right on the side view is rearward (−x): front is drawn to the left.
    expect(point(board, 'LL.al').x).toBeCloseTo(30 - 1 - 10, MM_DIGITS);
    expect(point(board, 'LL.al').z).toBeCloseTo(236, MM_DIGITS);
    expect(point(board, 'LL.ar').x).toBeCloseTo(19, MM_DIGITS);
    board.undo();
    expect(board.document).toEqual(fourLink());
  });

  it('rename updates member ends, wheels and driveline, and refuses a taken or empty name', () => {
    expect(board.renamePoint('WC.l', 'Hub.l').ok).toBe(true);
    expect(board.document!.wheels.left).toBe('Hub.l');
    board.renamePoint('LL.al', 'LowerAxle.l');
    expect(board.document!.members.find((m) => m.id === 'LLl')!.b).toBe('LowerAxle.l');
    board.renamePoint('DS.p', 'Pinion');
    expect(board.document!.driveline!.pinion).toBe('Pinion');
    const before = board.document;
    const taken = board.renamePoint('LL.fl', 'LL.fr');
    expect(taken.ok).toBe(false);
    if (!taken.ok) expect(taken.error).toMatch(/already a pivot called 'LL.fr'/);
    expect(board.renamePoint('LL.fl', '').ok).toBe(false);
    expect(board.document).toBe(before);
  });

  it('re-kind: a link turned into a shock gets stroke limits around its length; back to a link drops them', () => {
    board.setMemberKind('ULl', 'shock');
    const shock = board.document!.members.find((m) => m.id === 'ULl')!;
    expect(shock.kind).toBe('shock');
    const len = Math.hypot(760 - 70, 0, 600 - 540);
    if (shock.kind === 'shock') {
      expect(shock.minLength).toBe(Math.round(len * 0.8));
      expect(shock.maxLength).toBe(Math.round(len * 1.2));
      expect('group' in shock).toBe(false);
    }
    board.setMemberKind('ULl', 'link');
    const link = board.document!.members.find((m) => m.id === 'ULl')!;
    expect(link).toEqual({ id: 'ULl', kind: 'link', a: 'UL.fl', b: 'UL.al' });
  });

  it('re-kind to a hinge needs two frame pivots', () => {
    const r = board.setMemberKind('LLl', 'hinge');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(/two frame pivots/);
  });

  it('delete and add members; a pivot still in use cannot be deleted', () => {
    board.deleteMember('LR');
    expect(board.document!.members.some((m) => m.id === 'LR')).toBe(false);
    const inUse = board.deletePoint('LL.fl');
    expect(inUse.ok).toBe(false);
    if (!inUse.ok) expect(inUse.error).toMatch(/member LLl/);
    expect(board.deletePoint('LR.f').ok).toBe(true);
    const add = board.addMember({ id: 'LR2', kind: 'lateral-rod', a: 'LR.a', b: 'N.f' }, [
      { id: 'N.f', body: 'frame', x: -70, y: 600, z: 520 },
    ]);
    expect(add).toEqual({ ok: true });
    expect(board.selectedMember).toBe('LR2');
    expect(board.addMember({ id: 'LR2', kind: 'link', a: 'LR.a', b: 'N.f' }).ok).toBe(false);
  });

  it('an edit that would make the sketch invalid is refused and changes nothing', () => {
    const before = board.document;
    // Putting LL.fl on top of LL.al makes a zero-length link.
    board.setMirrorLinked(false);
    const r = board.commit('bad', (d) => ({
      ...d,
      points: d.points.map((p) => (p.id === 'LL.fl' ? { ...p, x: 30, y: 470, z: 235 } : p)),
    }));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(/zero length/);
    expect(board.document).toBe(before);
  });

  it('selecting a member (as a flag does) clears the pivot selection, and unknown ids are ignored', () => {
    board.select('LL.fl');
    board.select('UL.fl', { add: true });
    expect(board.selectedPoints).toEqual(['LL.fl', 'UL.fl']);
    board.select('SHl');
    expect(board.selectedMember).toBe('SHl');
    expect(board.selectedPoints).toEqual([]);
    board.select('nope');
    expect(board.selectedMember).toBe('SHl');
  });

  it('document fields (targets, tracing) are set through the store and undo like any edit', () => {
    board.setTargets({ antiSquat: { min: 60, max: 90 } });
    board.setTracing({ opacity: 0.5 }, { live: true });
    board.setTracing({ opacity: 0.6 }, { live: true });
    expect((board.document as Record<string, unknown>).tracing).toEqual({ opacity: 0.6 });
    board.undo();
    expect('tracing' in board.document!).toBe(false);
    board.undo();
    expect(board.document).toEqual(fourLink());
  });
});

describe('board store: read-only', () => {
  beforeEach(() => {
    localStorage.clear();
    setActivePinia(createPinia());
  });

  it('refuses every edit and drag on a sketch the user cannot edit', () => {
    const board = useBoardStore();
    board.setLoaded(detailOf(fourLink(), { canEdit: false, mine: false }));
    expect(board.readOnly).toBe(true);
    expect(board.setPointCoordinate('LL.fl', 'x', 1).ok).toBe(false);
    expect(board.beginDrag('side', 'LL.fl')).toBe(false);
    expect(board.document).toEqual(fourLink());
  });

  it('a shared link is read-only even if the answer says otherwise', () => {
    const board = useBoardStore();
    board.setLoaded(detailOf(fourLink(), { canEdit: true }), 'tok123');
    expect(board.readOnly).toBe(true);
  });
});
