import { describe, expect, it } from 'vitest';
import { starters } from '../../../shared/kinematics';
import { toScreen } from '../../../src/canvas/transform';
import {
  AXIS_BOTTOM_PX,
  AXIS_LEFT_PX,
  drawnPoints,
  fitSideView,
  pivotsNear,
  sideAxes,
} from '../../../src/lineup/sideView';

describe('the line-up side view', () => {
  it('puts ticks every 200 mm at 0.5 px/mm, where the transform puts those x and z, and a 100 px scale bar', () => {
    // h = (originX − px) / scale: the plotting area px 44…400 is x 600…−112 mm; py 0…300 is z 600…0 mm.
    const t = { scale: 0.5, originX: 344, originY: 300 };
    const a = sideAxes(t, 400, 330, 'mm');
    // 56 px at 0.5 px/mm is 112 mm: the next 1-2-5 step is 200 mm. x = 600 sits on the axis corner and is left out.
    expect(a.x).toEqual([
      { at: 344, label: '0' },
      { at: 244, label: '200' },
      { at: 144, label: '400' },
    ]);
    // z = 0 is the x axis's own line and z = 600 the top edge: both left out.
    expect(a.z).toEqual([
      { at: 200, label: '200' },
      { at: 100, label: '400' },
    ]);
    expect(a.bar).toEqual({ px: 100, label: '200 mm' });
  });

  it('takes inch steps for an inch user: 112 mm is 4.4 in, so 5 in (127 mm, 63.5 px)', () => {
    const a = sideAxes({ scale: 0.5, originX: 344, originY: 300 }, 400, 330, 'in');
    expect(a.bar.label).toBe('5 in');
    expect(a.bar.px).toBeCloseTo(63.5, 9);
  });

  it('fits every drawn pivot of every variant inside the axes, and draws no driveline reference point', () => {
    const sketches = [starters['leaf-spring']!.build(), starters['four-link-lateral-rod']!.build()];
    // The gearbox output (DS.o, DS.oa) is a frame point no member uses: no bracket, not drawn.
    expect(drawnPoints(sketches[1]).some((p) => p.id === 'DS.o' || p.id === 'DS.oa')).toBe(false);
    expect(drawnPoints(sketches[1]).some((p) => p.id === 'DS.p')).toBe(true);
    const t = fitSideView(sketches, 390, 340)!;
    for (const s of sketches)
      for (const p of drawnPoints(s)) {
        const q = toScreen('side', t, p);
        expect(q.px, p.id).toBeGreaterThanOrEqual(AXIS_LEFT_PX);
        expect(q.px, p.id).toBeLessThanOrEqual(390);
        expect(q.py, p.id).toBeGreaterThanOrEqual(0);
        expect(q.py, p.id).toBeLessThanOrEqual(340 - AXIS_BOTTOM_PX);
      }
  });

  it('names the pivots under the pointer, those drawn on one spot together', () => {
    const pivots = [
      { px: 100, py: 100, label: 'A · LF.l' },
      { px: 101, py: 100, label: 'B · LL.fl' },
      { px: 120, py: 100, label: 'C · SH.fl' },
    ];
    expect(pivotsNear(pivots, 104, 100).map((p) => p.label)).toEqual(['B · LL.fl', 'A · LF.l']);
    expect(pivotsNear(pivots, 118, 100).map((p) => p.label)).toEqual(['C · SH.fl']);
    expect(pivotsNear(pivots, 300, 300)).toEqual([]);
  });
});
