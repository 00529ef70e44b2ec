import { describe, expect, it } from 'vitest';
import { matchBrackets, type Bracket } from '../../../shared/lineup/brackets';
import { framePivots, type FramePivot } from '../../../shared/lineup/framePivots';
import { matchGroups, suspensionEnd } from '../../../shared/lineup/ends';
import { starters } from '../../../shared/kinematics';

// Every expected number below is worked by hand from the positions given (distances by Pythagoras,
// mostly on 3-4-5 triangles), never by the matcher's own formula.

const at = (id: string, x: number, y: number, z: number): FramePivot => ({ id, at: { x, y, z } });
/** Each bracket as "variant:id" of its pivots, in the order given. */
const ids = (b: Bracket) => b.pivots.map((p) => `${p.variant}:${p.id}`).join(' ');

describe('frame brackets of a sketch', () => {
  it('are the frame points members are mounted on, not the driveline reference points', () => {
    // From the four-link starter: its frame points are the links', shocks', springs', the lateral rod's and DS.o / DS.oa.
    expect(framePivots(starters['four-link-lateral-rod']!.build()).map((p) => p.id)).toEqual([
      'LL.fl',
      'LL.fr',
      'SH.fl',
      'SH.fr',
      'SP.fl',
      'SP.fr',
      'UL.fl',
      'UL.fr',
      'LR.f',
    ]);
    // The trailing arm's half-shaft joints (HS.*) are the drive unit's, not brackets; its hinge pivots are.
    expect(framePivots(starters['trailing-arm']!.build()).map((p) => p.id)).toEqual([
      'HA.ol',
      'HA.il',
      'SP.fl',
      'SH.fl',
      'HA.or',
      'HA.ir',
      'SP.fr',
      'SH.fr',
    ]);
  });
});

describe('matching frame pivots by position', () => {
  it('finds brackets all variants share, those a subset shares and those one needs, whatever the ids', () => {
    const leaf = [at('LF.l', 0, 0, 0), at('SH.f.l', 100, 0, 0), at('LH.l', 200, 0, 0), at('X.l', 300, 0, 0)];
    const fourLink = [at('LL.fl', 3, 4, 0), at('SH.fl', 100, 0, 6), at('UL.fl', 500, 0, 0)];
    const trailing = [at('HA.ol', 0, 0, -8), at('SP.fl', 200, 7, 0)];
    const m = matchBrackets([leaf, fourLink, trailing], 10);

    // LF.l–LL.fl 5 mm (3-4-5), LF.l–HA.ol 8 mm, LL.fl–HA.ol √(9+16+64) = √89 ≈ 9.43 mm: all within 10.
    expect(m.brackets.map(ids)).toEqual([
      '0:LF.l 1:LL.fl 2:HA.ol',
      '0:SH.f.l 1:SH.fl',
      '0:LH.l 2:SP.fl',
      '0:X.l',
      '1:UL.fl',
    ]);
    expect(m.brackets.map((b) => b.share)).toEqual(['common', 'subset', 'subset', 'unique', 'unique']);
    expect(m.brackets[0].spread).toBeCloseTo(Math.sqrt(89), 12);
    expect(m.brackets[1].spread).toBeCloseTo(6, 12);
    // The common bracket sits at the mean of its three pivots: ((0+3+0)/3, (0+4+0)/3, (0+0-8)/3).
    expect(m.brackets[0].at.x).toBeCloseTo(1, 12);
    expect(m.brackets[0].at.y).toBeCloseTo(4 / 3, 12);
    expect(m.brackets[0].at.z).toBeCloseTo(-8 / 3, 12);
    // Beyond the common one: the leaf spring needs SH, LH (shared with one other) and X (its own) ...
    expect(m.perVariant).toEqual([
      { variant: 0, beyondCommon: 3, own: 1 },
      { variant: 1, beyondCommon: 2, own: 1 },
      { variant: 2, beyondCommon: 1, own: 0 },
    ]);
    expect(m.nearMisses).toEqual([]);
  });

  it('never matches by id: one id in two places is two brackets', () => {
    const m = matchBrackets([[at('UL.fl', 0, 0, 0)], [at('UL.fl', 50, 0, 0)]], 10);
    expect(m.brackets.map((b) => b.share)).toEqual(['unique', 'unique']);
  });

  it('holds the tolerance edge: exactly 10 mm apart share at 10 mm, not at 9.99 mm, and then are a near miss', () => {
    const pair = [[at('A', 0, 0, 0)], [at('B', 6, 8, 0)]]; // 6-8-10
    expect(matchBrackets(pair, 10).brackets.map(ids)).toEqual(['0:A 1:B']);
    const tight = matchBrackets(pair, 9.99);
    expect(tight.brackets.map(ids)).toEqual(['0:A', '1:B']);
    expect(tight.nearMisses).toHaveLength(1);
    expect(tight.nearMisses[0].apart).toBeCloseTo(10, 12);
    expect(tight.nearMisses[0].by).toBeCloseTo(0.01, 9);
  });

  it('names a near miss: 22 mm apart at 10 mm is "move by 12 mm"; up to 3× the tolerance and no further', () => {
    const m = matchBrackets([[at('A', 0, 0, 0)], [at('B', 22, 0, 0)]], 10);
    expect(m.nearMisses).toHaveLength(1);
    const [miss] = m.nearMisses;
    // Both brackets have one pivot: the later variant's moves.
    expect([miss.move.id, miss.to.id]).toEqual(['B', 'A']);
    expect(miss.apart).toBeCloseTo(22, 12);
    expect(miss.by).toBeCloseTo(12, 12);

    // 18-24-30 (3-4-5 × 6): exactly 3 × 10 mm is still a near miss, by 20 mm; 31 mm is not.
    const edge = matchBrackets([[at('A', 0, 0, 0)], [at('B', 0, 18, 24)]], 10);
    expect(edge.nearMisses.map((n) => n.by)).toEqual([expect.closeTo(20, 9)]);
    expect(matchBrackets([[at('A', 0, 0, 0)], [at('B', 31, 0, 0)]], 10).nearMisses).toEqual([]);
  });

  it('moves only a pivot alone on its bracket, and only where the move lets it join the other', () => {
    // A and B share a bracket (4 mm apart); C is 20 mm from A, 16 mm from B.
    const m = matchBrackets([[at('A', 0, 0, 0)], [at('B', 4, 0, 0)], [at('C', 20, 0, 0)]], 10);
    expect(m.brackets.map(ids)).toEqual(['0:A 1:B', '2:C']);
    // Moving C 10 mm towards A puts it at x = 10: 10 mm from A and 6 mm from B, so it joins; the closer
    // pair B–C would need only 6 mm, but C would then be at x = 14, 14 mm from A: no bracket for all three;
    // and B moving 6 mm to C would take it off the bracket it shares with A.
    expect(m.nearMisses).toHaveLength(1);
    expect([m.nearMisses[0].move.id, m.nearMisses[0].to.id]).toEqual(['C', 'A']);
    expect(m.nearMisses[0].by).toBeCloseTo(10, 12);
  });

  it('does not chain: A–B 7 mm and B–C 8 mm but A–C 15 mm give one shared bracket and a near miss', () => {
    const m = matchBrackets([[at('A', 0, 0, 0)], [at('B', 7, 0, 0)], [at('C', 15, 0, 0)]], 10);
    // The closest pair joins first; C cannot join as it is 15 mm from A.
    expect(m.brackets.map(ids)).toEqual(['0:A 1:B', '2:C']);
    expect(m.brackets[0].spread).toBeCloseTo(7, 12);
    expect(m.brackets.every((b) => b.spread <= 10)).toBe(true);
    // Move C 5 mm towards A: x = 10, 10 mm from A and 3 mm from B.
    expect(m.nearMisses.map((n) => [n.move.id, n.to.id, n.by])).toEqual([['C', 'A', expect.closeTo(5, 9)]]);
  });

  it('puts at most one pivot of a variant on a bracket', () => {
    const m = matchBrackets([[at('P1', 0, 0, 0), at('P2', 4, 0, 0)], [at('Q', 2, 0, 0)]], 10);
    expect(m.brackets.map(ids)).toEqual(['0:P1 1:Q', '0:P2']);
  });

  it('follows the tolerance the user sets: 4 mm apart share at 5 mm, 6 mm apart do not', () => {
    const m = matchBrackets(
      [
        [at('A', 0, 0, 0), at('B', 100, 0, 0)],
        [at('C', 4, 0, 0), at('D', 106, 0, 0)],
      ],
      5,
    );
    expect(m.brackets.map(ids)).toEqual(['0:A 1:C', '0:B', '1:D']);
    expect(m.nearMisses.map((n) => [n.move.id, n.by])).toEqual([['D', expect.closeTo(1, 9)]]);
  });

  it('finds every frame bracket of two copies of one sketch common, 0 mm apart', () => {
    const s = starters['four-link-lateral-rod']!.build();
    const m = matchBrackets([framePivots(s), framePivots(starters['four-link-lateral-rod']!.build())]);
    expect(m.tolerance).toBe(10);
    expect(m.brackets).toHaveLength(9);
    expect(m.brackets.every((b) => b.share === 'common' && b.spread === 0)).toBe(true);
    expect(m.brackets.map((b) => b.pivots[0].id)).toEqual(m.brackets.map((b) => b.pivots[1].id));
  });
});

describe('which variants are matched together', () => {
  it('takes a double wishbone, or a solid axle put at the front, as a front layout', () => {
    expect(suspensionEnd(starters['double-wishbone']!.build())).toBe('front');
    const fourLink = starters['four-link-lateral-rod']!.build();
    expect(suspensionEnd(fourLink)).toBe('rear');
    expect(suspensionEnd({ ...fourLink, vehicle: { ...fourLink.vehicle, axle: 'front' } })).toBe('front');
    expect(suspensionEnd(starters['trailing-arm']!.build())).toBe('rear');
  });

  it('keeps front and rear apart unless asked', () => {
    expect(matchGroups(['rear', 'front', 'rear'], false)).toEqual([
      { end: 'rear', variants: [0, 2] },
      { end: 'front', variants: [1] },
    ]);
    expect(matchGroups(['rear', 'front', 'rear'], true)).toEqual([{ end: null, variants: [0, 1, 2] }]);
    expect(matchGroups(['rear', 'rear'], false)).toEqual([{ end: 'rear', variants: [0, 1] }]);
  });

  it('reports the line-up places of the variants a group compares', () => {
    const m = matchBrackets([[at('A', 0, 0, 0)], [at('B', 1, 0, 0)]], 10, [0, 2]);
    expect(m.brackets[0].variants).toEqual([0, 2]);
    expect(m.perVariant.map((v) => v.variant)).toEqual([0, 2]);
  });
});
