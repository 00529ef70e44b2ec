import { describe, expect, it } from 'vitest';
import { exitPoint, hingeAxis, lineAtX, placeLabels, shockMarks, springCoil } from '../../../src/canvas/shapes';

/** Pixel positions from straight-line arithmetic; far below a pixel. */
const PX_TOL = 1e-9;

describe('member drawing geometry', () => {
  it('a spring coil starts and ends on its pivots and zigzags across the line', () => {
    const pts = springCoil({ px: 0, py: 0 }, { px: 200, py: 0 }, 5, 6);
    expect(pts.slice(0, 2)).toEqual([0, 0]);
    expect(pts.slice(-2)).toEqual([200, 0]);
    const ys = pts.filter((_, i) => i % 2 === 1);
    expect(Math.max(...ys)).toBeCloseTo(6, 9);
    expect(Math.min(...ys)).toBeCloseTo(-6, 9);
  });

  it('a shock’s stroke marks sit where its b end would be at min and max length (ratios survive projection)', () => {
    const s = shockMarks({ px: 0, py: 0 }, { px: 100, py: 0 }, 500, 400, 600);
    expect(s.compressed!.px).toBeCloseTo(80, 9);
    expect(s.extended!.px).toBeCloseTo(120, 9);
    expect(s.outside).toBe(false);
    expect(shockMarks({ px: 0, py: 0 }, { px: 100, py: 0 }, 650, 400, 600).outside).toBe(true);
  });

  it('a hinge axis runs past both pivots', () => {
    expect(hingeAxis({ px: 0, py: 0 }, { px: 100, py: 0 }, 0.5)).toEqual([-50, 0, 150, 0]);
  });

  it('finds where a line meets a vertical', () => {
    const p = lineAtX({ px: 0, py: 0 }, { px: 10, py: 5 }, 40)!;
    expect(p.py).toBeCloseTo(20, 9);
    expect(lineAtX({ px: 3, py: 0 }, { px: 3, py: 5 }, 40)).toBeNull();
  });

  it('finds where a segment leaves a box, and nothing when it stays inside', () => {
    const e = exitPoint({ px: 50, py: 50 }, { px: 250, py: 50 }, 0, 0, 100, 100)!;
    expect(Math.abs(e.px - 100)).toBeLessThan(PX_TOL);
    expect(exitPoint({ px: 50, py: 50 }, { px: 60, py: 60 }, 0, 0, 100, 100)).toBeNull();
  });
});

describe('placeLabels', () => {
  it('moves a label that would cover another to a free side, and drops it when none is free', () => {
    const at = { px: 100, py: 100 };
    const boxes = placeLabels([
      { id: 'a', at, text: 'AAAA' },
      { id: 'b', at, text: 'BBBB' },
      { id: 'c', at, text: 'CCCC' },
      { id: 'd', at, text: 'DDDD' },
      { id: 'e', at, text: 'EEEE' },
    ]);
    expect(boxes.size).toBe(4);
    const placed = [...boxes.values()];
    for (let i = 0; i < placed.length; i++)
      for (let j = i + 1; j < placed.length; j++) {
        const [p, q] = [placed[i], placed[j]];
        const overlap = p.x < q.x + q.width && q.x < p.x + p.width && p.y < q.y + q.height && q.y < p.y + p.height;
        expect(overlap).toBe(false);
      }
  });

  it('always places a selected pivot’s label', () => {
    const at = { px: 0, py: 0 };
    const items = ['a', 'b', 'c', 'd', 'e'].map((id) => ({ id, at, text: id.repeat(4) }));
    items.push({ id: 'sel', at, text: 'SELECTED', priority: true } as never);
    expect(placeLabels(items).has('sel')).toBe(true);
  });
});
