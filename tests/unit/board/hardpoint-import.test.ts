// @vitest-environment happy-dom
/**
 * Applying an imported hardpoint table: one undoable edit through the board store that puts each listed
 * pivot exactly where the table says (no mirroring), leaves every other pivot as it was, and is refused
 * on a read-only board. Expected positions are the table's own numbers.
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { placementsOf, readHardpoints } from '../../../shared/hardpoints/read';
import { placePoints } from '../../../src/stores/board/edits';
import { useBoardStore } from '../../../src/stores/board';
import { detailOf, fourLink } from './fixture';

const TABLE = ['id,body,x (mm),y (mm),z (mm)', 'UL.fl,frame,775,440,610', 'NOPE,frame,1,2,3', ''].join('\r\n');

describe('placing pivots from a table (pure)', () => {
  it('moves only the pivots given, exactly, and shares the untouched ones', () => {
    const doc = fourLink();
    const out = placePoints(doc, new Map([['UL.fl', { x: 775, y: 440, z: 610 }]]));
    expect(out.points.find((p) => p.id === 'UL.fl')).toMatchObject({ x: 775, y: 440, z: 610 });
    // Its left/right partner stays: the table would list it if it moved.
    expect(out.points.find((p) => p.id === 'UL.fr')).toBe(doc.points.find((p) => p.id === 'UL.fr'));
    expect(doc.points.find((p) => p.id === 'UL.fl')).toMatchObject({ x: 760, y: 440, z: 600 });
  });

  it('gives back the same sketch when nothing moves, and refuses an unknown pivot', () => {
    const doc = fourLink();
    expect(placePoints(doc, new Map([['UL.fl', { x: 760, y: 440, z: 600 }]]))).toBe(doc);
    expect(() => placePoints(doc, new Map([['NOPE', { x: 0, y: 0, z: 0 }]]))).toThrow("There is no pivot 'NOPE'.");
  });
});

describe('board store: importing a hardpoint table', () => {
  let board: ReturnType<typeof useBoardStore>;
  beforeEach(() => {
    localStorage.clear();
    setActivePinia(createPinia());
    board = useBoardStore();
    board.setLoaded(detailOf(fourLink()));
  });

  it('applies the usable rows as one undo step, and undo restores the sketch exactly', () => {
    const before = board.document!;
    const reading = readHardpoints(TABLE, before);
    expect(reading.problems).toEqual([{ row: 3, message: "no pivot 'NOPE' in this sketch" }]);
    expect(board.placePoints(placementsOf(reading), 'Import hardpoints (1 pivot)')).toEqual({ ok: true });
    expect(board.document!.points.find((p) => p.id === 'UL.fl')).toMatchObject({ x: 775, y: 440, z: 610 });
    expect(board.undoLabel).toBe('Import hardpoints (1 pivot)');
    expect(board.undo()).toBe(true);
    expect(board.document).toEqual(before);
  });

  it('changes nothing on a read-only board', () => {
    board.setLoaded(detailOf(fourLink(), { canEdit: false }));
    const before = board.document;
    const r = board.placePoints(placementsOf(readHardpoints(TABLE, before!)), 'Import hardpoints');
    expect(r.ok).toBe(false);
    expect(board.document).toBe(before);
  });
});
