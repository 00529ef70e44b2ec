/**
 * Property tests for the double-wishbone layout: any starter parameters in range, every point
 * nudged, members dropped at random, any sweep range — never a NaN, an Infinity or a throw,
 * and every heave row carries the double-wishbone readings (a number or null) whenever the
 * knuckle has its wishbones.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import type { SketchInput } from '../../../shared/schema/sketch';
import { nonFinite } from './helpers';

const spec = starters['double-wishbone']!;
const POINTS = spec.build().points.length;

const wishboneSketch = fc
  .record({
    values: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), {
      minLength: spec.params.length,
      maxLength: spec.params.length,
    }),
    jitter: fc.array(fc.double({ min: -60, max: 60, noNaN: true }), { minLength: 3 * POINTS, maxLength: 3 * POINTS }),
    drop: fc.array(fc.nat(13), { maxLength: 3 }),
    droop: fc.integer({ min: -250, max: -5 }),
    bump: fc.integer({ min: 5, max: 250 }),
    roll: fc.integer({ min: 0, max: 12 }),
  })
  .map(({ values, jitter, drop, droop, bump, roll }) => {
    const params = Object.fromEntries(spec.params.map((p, i) => [p.key, p.min + values[i] * (p.max - p.min)]));
    const doc = structuredClone(spec.build(params)) as SketchInput;
    doc.points = doc.points.map((p, i) => ({
      ...p,
      x: p.x + jitter[3 * i],
      y: p.y + jitter[3 * i + 1],
      z: p.z + jitter[3 * i + 2],
    }));
    const dropped = new Set(drop.map((i) => doc.members[i].id));
    doc.members = doc.members.filter((m) => !dropped.has(m.id));
    // A wishbone arm that lost its hinge or its ball joint goes altogether (the schema refuses a half arm).
    const whole = (body: string) =>
      doc.members.some((m) => m.kind === 'hinge' && m.body === body) &&
      doc.members.some((m) => m.kind === 'ball-joint' && doc.points.find((p) => p.id === m.a)?.body === body);
    const gone = new Set(doc.points.filter((p) => p.body.includes('-arm-') && !whole(p.body)).map((p) => p.id));
    doc.points = doc.points.filter((p) => !gone.has(p.id));
    doc.members = doc.members.filter(
      (m) => !gone.has(m.a) && !gone.has(m.b) && !(m.kind === 'hinge' && !doc.points.some((p) => p.body === m.body)),
    );
    doc.sweep = { droop, bump, step: 10, roll, rollStep: 1 };
    return doc;
  });

describe('property: double-wishbone sketches', () => {
  it('never give NaN, Infinity or a throw, and carry their readings on every row', () => {
    fc.assert(
      fc.property(wishboneSketch, (doc) => {
        const r = runSweep(doc);
        expect(nonFinite(r)).toEqual([]);
        expect(r.ride.travel).toBe(0);
        const hasPlan = r.ride.frontViewInstantCenter !== undefined;
        for (const h of r.heave) {
          expect(h.travel).toBeGreaterThanOrEqual(doc.sweep!.droop!);
          expect(h.travel).toBeLessThanOrEqual(doc.sweep!.bump!);
          if (!hasPlan) continue;
          for (const k of [
            'camberChange',
            'toeChange',
            'trackChange',
            'casterChange',
            'frontViewInstantCenter',
            'kingpin',
            'antiDive',
            'rollCenterHeight',
          ] as const) {
            expect(h[k]).not.toBeUndefined();
          }
        }
        for (const x of r.roll) if (hasPlan && x.camberToGround) expect(x.rollCenter).not.toBeUndefined();
      }),
      { numRuns: 120, seed: 7070 },
    );
  });
});
