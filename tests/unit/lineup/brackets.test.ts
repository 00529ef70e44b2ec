import { describe, expect, it } from 'vitest';
import { bracketList } from '../../../shared/lineup/brackets';
import { starters } from '../../../shared/kinematics';

const fourLink = () => starters['four-link-lateral-rod']!.build();

describe('the bracket list of a line-up', () => {
  it('calls a frame pivot common when every variant has it in one place, and leaves axle pivots out', () => {
    const a = fourLink();
    const rows = bracketList([a, fourLink()]);
    const frameIds = a.points.filter((p) => p.body === 'frame').map((p) => p.id);
    expect(rows.map((r) => r.id)).toEqual(frameIds);
    expect(rows.every((r) => r.status === 'common' && r.spread === 0)).toBe(true);
  });

  it('measures how far a moved bracket is apart: a 3-4-5 move is 5 mm (Pythagoras)', () => {
    const a = fourLink();
    const b = fourLink();
    const p = b.points.find((q) => q.id === 'UL.fl')!;
    p.x += 3;
    p.z += 4;
    const row = bracketList([a, b]).find((r) => r.id === 'UL.fl')!;
    expect(row.spread).toBeCloseTo(5, 12);
    expect(row.status).toBe('moved');
    expect(row.at[1]).toEqual({ x: p.x, y: p.y, z: p.z });
  });

  it('keeps a move within the tolerance common, and takes the widest pair of three variants', () => {
    const a = fourLink();
    const b = fourLink();
    const c = fourLink();
    b.points.find((q) => q.id === 'LL.fl')!.y += 0.6;
    c.points.find((q) => q.id === 'LL.fl')!.y -= 0.6;
    const row = bracketList([a, b, c]).find((r) => r.id === 'LL.fl')!;
    expect(row.spread).toBeCloseTo(1.2, 12);
    expect(row.status).toBe('moved');
    expect(bracketList([a, b]).find((r) => r.id === 'LL.fl')!.status).toBe('common');
  });

  it('marks a pivot that only some variants have as partial, with no position for the others', () => {
    const a = fourLink();
    const b = {
      ...fourLink(),
      points: [...fourLink().points, { id: 'TB.f', body: 'frame' as const, x: 500, y: 0, z: 600 }],
    };
    const row = bracketList([a, b]).find((r) => r.id === 'TB.f')!;
    expect(row.status).toBe('partial');
    expect(row.at).toEqual([null, { x: 500, y: 0, z: 600 }]);
  });
});
