/**
 * The build sheet's legend of pivot codes: every pivot once, with the body it is on and what meets there, in
 * the words a fabricator reads without the board.
 */
import { describe, expect, it } from 'vitest';
import { pivotLegend } from '../../../shared/sheet/pivotLegend';
import { starters } from '../../../shared/kinematics';
import { parseSketch } from '../../../shared/schema/sketch';

const legendOf = (layout: keyof typeof starters) => {
  const sketch = parseSketch(starters[layout]!.build());
  return { sketch, byId: new Map(pivotLegend(sketch).map((e) => [e.id, e])) };
};

describe('the pivot legend', () => {
  it('lists every pivot once, in the sketch’s order', () => {
    for (const layout of Object.keys(starters) as (keyof typeof starters)[]) {
      const { sketch } = legendOf(layout);
      expect(pivotLegend(sketch).map((e) => e.id)).toEqual(sketch.points.map((p) => p.id));
    }
  });

  it('names the wheel centres, the driveline’s reference points and the members’ ends', () => {
    const { byId } = legendOf('four-link-lateral-rod');
    expect(byId.get('WC.l')).toEqual({ id: 'WC.l', on: 'axle', joins: 'left wheel centre' });
    expect(byId.get('DS.o')!.joins).toBe('driveshaft joint at the gearbox output (reference point, not a bracket)');
    expect(byId.get('LL.fl')!.joins).toMatch(/^end of LLl \(/);
  });

  it('names a leaf spring’s seat, a knuckle’s kingpin and the steering box’s parts', () => {
    const leaf = legendOf('leaf-spring').byId;
    expect([...leaf.values()].some((e) => /^seat of /.test(e.joins))).toBe(true);
    const { sketch, byId } = legendOf('steered-front-axle');
    const pitman = sketch.pitmanArm!;
    expect(byId.get(pitman.pivot!)!.joins).toBe('steering box output shaft, where the pitman arm turns');
    expect(byId.get(pitman.axis!)!.joins).toBe("point on the steering box's output axis");
    expect(byId.get(pitman.ball!)!.joins).toContain("pitman arm's ball");
    expect([...byId.values()].some((e) => /^axis of /.test(e.joins))).toBe(true);
    expect([...byId.values()].filter((e) => e.joins === 'no member')).toEqual([]);
  });
});
