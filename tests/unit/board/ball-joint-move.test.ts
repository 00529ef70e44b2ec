/**
 * A ball joint is one place held by two points (the arm's and the knuckle's): the board moves them
 * together, with the left/right mirror as for any pivot, so the knuckle's point never strays from the
 * joint the sweep uses.
 */
import { describe, expect, it } from 'vitest';
import { movePoints, placePoints } from '../../../src/stores/board/edits';
import { findPairs } from '../../../src/stores/board/pairs';
import { starters } from '../../../shared/kinematics';
import { sweepSketch } from '../../../shared/kinematics';
import { checkSketch, type Sketch } from '../../../shared/schema/sketch';

const wishbone = (): Sketch => {
  const checked = checkSketch(starters['double-wishbone']!.build());
  if (!checked.ok) throw new Error(checked.problems.join('; '));
  return checked.sketch;
};
const at = (doc: Sketch, id: string) => {
  const p = doc.points.find((q) => q.id === id)!;
  return { x: p.x, y: p.y, z: p.z };
};

describe('moving a ball joint on the board', () => {
  it('moves the knuckle’s point with the arm’s, and the other side’s pair by the mirror image', () => {
    const doc = wishbone();
    const moved = movePoints(doc, new Map([['LA.bj.l', { x: 5, y: -3, z: 10 }]]), findPairs(doc.points));
    const shift = (id: string, d: { x: number; y: number; z: number }) => {
      const p = at(doc, id);
      return { x: p.x + d.x, y: p.y + d.y, z: p.z + d.z };
    };
    expect(at(moved, 'LA.bj.l')).toEqual(shift('LA.bj.l', { x: 5, y: -3, z: 10 }));
    expect(at(moved, 'LW.bj.l')).toEqual(at(moved, 'LA.bj.l'));
    expect(at(moved, 'LA.bj.r')).toEqual(shift('LA.bj.r', { x: 5, y: 3, z: 10 }));
    expect(at(moved, 'LW.bj.r')).toEqual(at(moved, 'LA.bj.r'));
    // Nothing else moved.
    const others = doc.points.filter((p) => !['LA.bj.l', 'LW.bj.l', 'LA.bj.r', 'LW.bj.r'].includes(p.id));
    for (const p of others) expect(at(moved, p.id)).toEqual(at(doc, p.id));
  });

  it('moves the arm’s point when the knuckle’s is dragged', () => {
    const doc = wishbone();
    const moved = movePoints(doc, new Map([['UW.bj.l', { z: -8 }]]));
    expect(at(moved, 'UA.bj.l').z).toBe(at(doc, 'UA.bj.l').z - 8);
    expect(at(moved, 'UW.bj.l')).toEqual(at(moved, 'UA.bj.l'));
  });

  it('leaves a table’s placements exactly as the table gives them, and the sweep names a joint left apart', () => {
    const doc = wishbone();
    const knuckle = at(doc, 'UW.bj.l');
    const placed = placePoints(doc, new Map([['UW.bj.l', { ...knuckle, z: knuckle.z + 12 }]]));
    expect(at(placed, 'UA.bj.l')).toEqual(at(doc, 'UA.bj.l'));
    const warnings = sweepSketch(placed).warnings;
    expect(warnings).toContain(
      'Ball joint UBJl: its arm point UA.bj.l and knuckle point UW.bj.l are 12.0 mm apart; the joint is taken at UA.bj.l. Put UW.bj.l on it.',
    );
    expect(sweepSketch(doc).warnings.some((w) => w.startsWith('Ball joint'))).toBe(false);
  });
});
