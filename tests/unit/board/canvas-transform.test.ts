import { describe, expect, it } from 'vitest';
import {
  boundsOf,
  fitTransform,
  gridStep,
  gridValues,
  planeOf,
  planeToScreen,
  screenToPlane,
  snapTo,
  toScreen,
  zoomAt,
  MAX_SCALE,
} from '../../../src/canvas/transform';
import { MM_PER_INCH } from '../../../shared/units';

/** Screen positions agree to well under a pixel; plane positions to well under a micron. */
const PX_TOL = 1e-9;
const MM_TOL = 1e-9;

const t = { scale: 0.5, originX: 400, originY: 300 };

describe('view transform', () => {
  it('side view draws the front (+x) to the left and z up', () => {
    const ahead = toScreen('side', t, { x: 100, y: 0, z: 0 });
    const above = toScreen('side', t, { x: 0, y: 0, z: 100 });
    expect(ahead.px).toBeLessThan(t.originX);
    expect(above.py).toBeLessThan(t.originY);
  });

  it('rear view, seen from behind, draws the vehicle left (+y) on the left', () => {
    const left = toScreen('rear', t, { x: 0, y: 790, z: 395 });
    const right = toScreen('rear', t, { x: 0, y: -790, z: 395 });
    expect(left.px).toBeLessThan(right.px);
    // 790 mm at 0.5 px/mm is 395 px from the centre line.
    expect(left.px).toBeCloseTo(400 - 395, 9);
  });

  it('screen and plane positions convert back and forth', () => {
    for (const q of [
      { h: 0, v: 0 },
      { h: 1234.5, v: -67.25 },
      { h: -800, v: 900 },
    ]) {
      const back = screenToPlane(t, planeToScreen(t, q));
      expect(back.h).toBeCloseTo(q.h, 9);
      expect(back.v).toBeCloseTo(q.v, 9);
    }
  });

  it('the rear view shows a point by its y and z', () => {
    const p = { x: 10, y: 20, z: 30 };
    expect(planeOf('rear', p)).toEqual({ h: 20, v: 30 });
  });

  it('zooming about a point keeps that point still', () => {
    const at = { px: 123, py: 456 };
    const before = screenToPlane(t, at);
    const z = zoomAt(t, 1.7, at.px, at.py);
    const after = screenToPlane(z, at);
    expect(z.scale).toBeCloseTo(0.85, 12);
    expect(after.h).toBeCloseTo(before.h, 9);
    expect(after.v).toBeCloseTo(before.v, 9);
  });

  it('zoom stops at its limit', () => {
    expect(zoomAt(t, 1e9, 0, 0).scale).toBe(MAX_SCALE);
  });

  it('fit shows the whole box inside the margins, centred', () => {
    const b = boundsOf([
      { h: -1000, v: 0 },
      { h: 1500, v: 800 },
    ])!;
    const f = fitTransform(b, 800, 600, 40);
    const corners = [planeToScreen(f, { h: b.hMin, v: b.vMin }), planeToScreen(f, { h: b.hMax, v: b.vMax })];
    for (const c of corners) {
      expect(c.px).toBeGreaterThanOrEqual(40 - PX_TOL);
      expect(c.px).toBeLessThanOrEqual(760 + PX_TOL);
      expect(c.py).toBeGreaterThanOrEqual(40 - PX_TOL);
      expect(c.py).toBeLessThanOrEqual(560 + PX_TOL);
    }
    const mid = planeToScreen(f, { h: 250, v: 400 });
    expect(mid.px).toBeCloseTo(400, 9);
    expect(mid.py).toBeCloseTo(300, 9);
  });
});

describe('grid', () => {
  it('picks 1-2-5 steps in mm at least the wanted pixels apart', () => {
    // 0.5 px/mm, 36 px → at least 72 mm → 100 mm.
    expect(gridStep(0.5, 'mm', 36)).toBe(100);
    // 2 px/mm, 36 px → 18 mm → 20 mm.
    expect(gridStep(2, 'mm', 36)).toBe(20);
  });

  it('picks whole-inch steps for an inch user (1 in = 25.4 mm exactly, by definition)', () => {
    // 0.5 px/mm → 72 mm = 2.83 in → 5 in.
    expect(gridStep(0.5, 'in', 36)).toBeCloseTo(5 * MM_PER_INCH, 9);
  });

  it('lists the multiples of the step in a range', () => {
    expect(gridValues(-250, 250, 100)).toEqual([-200, -100, 0, 100, 200]);
  });

  it('snaps to the nearest step, also for inch steps', () => {
    expect(snapTo(12.4, 5)).toBe(10);
    expect(snapTo(13, 5)).toBe(15);
    const inch = snapTo(30, 0.25 * MM_PER_INCH);
    expect(Math.abs(inch / (0.25 * MM_PER_INCH) - Math.round(inch / (0.25 * MM_PER_INCH)))).toBeLessThan(MM_TOL);
    expect(snapTo(7.3, 0)).toBe(7.3);
  });
});
