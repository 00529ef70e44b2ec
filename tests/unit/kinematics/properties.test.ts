/* eslint-disable @typescript-eslint/no-explicit-any -- these tests poke at untyped JSON documents on purpose */
/** Property tests: valid sketches never give NaN, Infinity or a throw; broken ones always a validation error. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import { checkSketch, type SketchInput } from '../../../shared/schema/sketch';
import { isSketchValidationError } from '../../../shared/schema/errors';
import { exampleSketch, nonFinite } from './helpers';

const specs = Object.values(starters).map((s) => s!);

/** A starter with random parameters in range, every point then nudged up to ±40 mm. */
const validSketch = fc
  .record({
    spec: fc.constantFrom(...specs),
    values: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 20, maxLength: 20 }),
    jitter: fc.array(fc.double({ min: -40, max: 40, noNaN: true }), { minLength: 3 * 40, maxLength: 3 * 40 }),
    roll: fc.integer({ min: 0, max: 15 }),
  })
  .map(({ spec, values, jitter, roll }) => {
    const params = Object.fromEntries(spec.params.map((p, i) => [p.key, p.min + values[i] * (p.max - p.min)]));
    const doc = structuredClone(spec.build(params)) as SketchInput;
    doc.points = doc.points.map((p, i) => ({
      ...p,
      x: p.x + jitter[3 * i],
      y: p.y + jitter[3 * i + 1],
      z: p.z + jitter[3 * i + 2],
    }));
    doc.sweep = { ...doc.sweep, roll, step: 10 };
    return doc;
  });

/** Any drawing at all: random pivots on the frame and the axle, random members between them. */
const coord = fc.integer({ min: -1500, max: 1500 });
const randomSketch = fc
  .record({
    frame: fc.array(fc.record({ x: coord, y: coord, z: fc.integer({ min: 0, max: 1200 }) }), {
      minLength: 1,
      maxLength: 8,
    }),
    axle: fc.array(fc.record({ x: coord, y: coord, z: fc.integer({ min: 0, max: 1200 }) }), {
      minLength: 0,
      maxLength: 8,
    }),
    links: fc.array(
      fc.record({
        f: fc.nat(7),
        a: fc.nat(9),
        kind: fc.constantFrom('link', 'lateral-rod', 'shock', 'spring'),
        group: fc.constantFrom('upper', 'lower', undefined),
      }),
      { maxLength: 8 },
    ),
    droop: fc.integer({ min: -300, max: -1 }),
    bump: fc.integer({ min: 1, max: 300 }),
  })
  .map(({ frame, axle, links, droop, bump }) => {
    const points: SketchInput['points'] = [
      { id: 'WC.l', body: 'axle', x: 0, y: 800, z: 400 },
      { id: 'WC.r', body: 'axle', x: 0, y: -800, z: 400 },
      ...frame.map((p, i) => ({ id: `F${i}`, body: 'frame' as const, ...p })),
      ...axle.map((p, i) => ({ id: `A${i}`, body: 'axle' as const, ...p })),
    ];
    const axleIds = ['WC.l', 'WC.r', ...axle.map((_, i) => `A${i}`)];
    const members: SketchInput['members'] = [];
    links.forEach((l, i) => {
      const f = points.find((p) => p.id === `F${l.f % frame.length}`)!;
      const a = points.find((p) => p.id === axleIds[l.a % axleIds.length])!;
      if (Math.hypot(f.x - a.x, f.y - a.y, f.z - a.z) < 1) return;
      const base = { id: `M${i}`, a: f.id, b: a.id };
      members.push(
        l.kind === 'link'
          ? { ...base, kind: 'link', ...(l.group ? { group: l.group } : {}) }
          : ({ ...base, kind: l.kind } as SketchInput['members'][number]),
      );
    });
    const doc: SketchInput = {
      format: 'arcwright.sketch',
      version: 1,
      name: 'random',
      layout: 'four-link-lateral-rod',
      vehicle: { wheelbase: 3000, cgHeight: 600, track: 1600, tireRadius: 400 },
      points,
      members,
      wheels: { left: 'WC.l', right: 'WC.r' },
      sweep: { droop, bump, step: 10, roll: 8, rollStep: 2 },
    };
    return doc;
  });

describe('property: valid sketches', () => {
  it('any drawing sweeps without NaN, Infinity or a throw', () => {
    fc.assert(
      fc.property(randomSketch, (doc) => {
        const r = runSweep(doc);
        expect(nonFinite(r)).toEqual([]);
        expect(r.ride.travel).toBe(0);
      }),
      { numRuns: 150, seed: 424242 },
    );
  });

  it('never give NaN, Infinity or a throw', () => {
    fc.assert(
      fc.property(validSketch, (doc) => {
        const r = runSweep(doc);
        expect(nonFinite(r)).toEqual([]);
        expect(r.heave.length).toBeGreaterThan(0);
        expect(r.heave.some((h) => h.travel === 0)).toBe(true);
        for (const h of r.heave) expect(h.travel).toBeGreaterThanOrEqual(doc.sweep!.droop!);
      }),
      { numRuns: 60, seed: 20261201 },
    );
  });
});

type Breaker = (d: any) => void;
const breakers: fc.Arbitrary<Breaker> = fc.oneof(
  fc
    .record({
      i: fc.nat(23),
      k: fc.constantFrom('x', 'y', 'z'),
      v: fc.constantFrom<unknown>('12', null, true, [], {}, undefined),
    })
    .map(({ i, k, v }) => (d: any) => {
      if (d.points?.[i]) d.points[i][k] = v;
      else d.points = 'gone';
    }),
  fc
    .record({ i: fc.nat(8), end: fc.constantFrom('a', 'b'), ref: fc.string({ minLength: 1, maxLength: 8 }) })
    .map(({ i, end, ref }) => (d: any) => {
      if (d.members?.[i]) d.members[i][end] = `missing:${ref}`;
      else d.members = 'gone';
    }),
  fc.nat(23).map((i) => (d: any) => {
    if (d.points?.[i]) d.points.push({ ...d.points[i] });
    else d.points = 'gone';
  }),
  fc
    .constantFrom('format', 'version', 'name', 'layout', 'vehicle', 'points', 'members', 'wheels')
    .map((k) => (d: any) => {
      delete d[k];
    }),
  fc
    .record({ k: fc.constantFrom('droop', 'bump', 'step', 'rollStep'), v: fc.constantFrom(0, -0, 'x', 1e9) })
    .map(({ k, v }) => (d: any) => {
      d.sweep = { ...d.sweep, [k]: k === 'droop' && v === 1e9 ? 5 : v };
    }),
  fc.nat(8).map((i) => (d: any) => {
    if (d.members?.[i]) d.members[i].b = d.members[i].a;
    else d.members = 'gone';
  }),
  fc
    .anything()
    .filter((v) => typeof v !== 'object' || v === null || Array.isArray(v))
    .map((v) => (d: any) => {
      d.vehicle = v;
    }),
);

describe('property: broken documents', () => {
  it('always give a validation error naming a field, never a crash', () => {
    fc.assert(
      fc.property(fc.array(breakers, { minLength: 1, maxLength: 3 }), (bs) => {
        const doc = exampleSketch() as any;
        for (const b of bs) b(doc);
        let error: unknown = null;
        try {
          runSweep(doc);
        } catch (e) {
          error = e;
        }
        expect(isSketchValidationError(error)).toBe(true);
        const problems = (error as { problems: string[] }).problems;
        expect(problems.length).toBeGreaterThan(0);
        for (const p of problems) expect(p).toMatch(/^[^\n]+: [^\n]+$/);
      }),
      { numRuns: 300, seed: 7 },
    );
  });

  it('checkSketch never throws on any JSON value', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (v) => {
        const r = checkSketch(v);
        expect(r.ok).toBe(false);
      }),
      { numRuns: 300, seed: 11 },
    );
  });
});
