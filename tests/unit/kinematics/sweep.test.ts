import { describe, expect, it } from 'vitest';
import { runSweep, starters, pointsAt } from '../../../shared/kinematics';
import { parseSketch } from '../../../shared/schema/sketch';
import { SketchValidationError } from '../../../shared/schema/errors';
import { exampleSketch, nonFinite, sketchOf } from './helpers';

/** Link lengths are held to the solver's convergence (1e-8 mm step) plus round-off. */
const LENGTH_TOL_MM = 1e-6;

describe('runSweep on the example file', () => {
  const result = runSweep(exampleSketch());

  it("covers the file's range and starts from ride height", () => {
    expect(result.heave.map((r) => r.travel)).toEqual(Array.from({ length: 49 }, (_, i) => -130 + 5 * i));
    expect(result.roll.length).toBe(15);
    expect(result.ride.travel).toBe(0);
    expect(result.ride.pose).toEqual({ x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 });
    expect(result.ride.bind).toBe(0);
    expect(result.limits.droop).toBe(-130);
    expect(result.limits.bump).toBe(110);
    expect(nonFinite(result)).toEqual([]);
  });

  it('imposes travel on z and roll on roll', () => {
    for (const r of result.heave) {
      expect(r.pose.z).toBe(r.travel);
      expect(r.pose.roll).toBe(0);
    }
    for (const r of result.roll) expect(r.pose.roll).toBeCloseTo(r.roll, 12);
  });

  it('reports the contract fields with their definitions', () => {
    for (const r of result.heave) {
      expect(r.pinionAngleChange).toBeCloseTo(-r.pose.pitch, 12);
      expect(r.lateralShift).toBe(r.pose.y);
      expect(r.foreAftShift).toBe(r.pose.x);
      expect(r.members.SHl.motionRatio).toBeGreaterThan(0.9);
      expect(r.members.SPl.wheelRate).toBeCloseTo(38 * r.members.SPl.motionRatio! ** 2, 9);
      expect(r.driveline!.plunge).toBeCloseTo(r.driveline!.length - result.ride.driveline!.length, 9);
    }
  });

  it('keeps every link at its ride length in heave (exactly located, no bind)', () => {
    for (const r of result.heave) {
      for (const id of ['LLl', 'ULl', 'LLr', 'ULr', 'LR'])
        expect(Math.abs(r.members[id].lengthChange)).toBeLessThan(LENGTH_TOL_MM);
      expect(r.bind).toBeLessThan(LENGTH_TOL_MM);
    }
  });

  it('binds in roll and says how much', () => {
    const at7 = result.roll.find((r) => r.roll === -7)!;
    expect(at7.bind).toBeGreaterThan(0.1);
    expect(at7.bind).toBeLessThan(1.5);
    expect(at7.leftTravel).toBeLessThan(0);
    expect(at7.rightTravel).toBeGreaterThan(0);
    expect(result.roll.find((r) => r.roll === 0)!.rollSteer).toBeNull();
  });

  it('flags shock extension at the interpolated travel, between the rows that straddle it', () => {
    const ev = result.limits.events.find((e) => e.kind === 'shock-extended' && e.member === 'SHl')!;
    expect(ev.sweep).toBe('heave');
    const before = result.heave.find((r) => r.travel === Math.ceil(ev.at / 5) * 5)!;
    const after = result.heave.find((r) => r.travel === Math.floor(ev.at / 5) * 5)!;
    expect(before.members.SHl.length).toBeLessThanOrEqual(580);
    expect(after.members.SHl.length).toBeGreaterThan(580);
    const t = (580 - before.members.SHl.length) / (after.members.SHl.length - before.members.SHl.length);
    expect(ev.at).toBeCloseTo(before.travel + t * (after.travel - before.travel), 9);
  });

  it('flags joint angles over the limit and honours a settable limit', () => {
    expect(result.limits.events.some((e) => e.kind === 'joint-angle')).toBe(true);
    const relaxed = runSweep(exampleSketch(), { sweep: { jointAngleLimit: 20, bindThreshold: 0.2 } });
    expect(relaxed.limits.events.some((e) => e.kind === 'joint-angle')).toBe(false);
    const bind = relaxed.limits.events.filter((e) => e.kind === 'bind');
    expect(bind.length).toBe(2);
    for (const e of bind) {
      expect(e.sweep).toBe('roll');
      expect(Math.abs(e.at)).toBeGreaterThan(3);
      expect(Math.abs(e.at)).toBeLessThan(5);
    }
  });

  it('places points with pointsAt so that links keep their length', () => {
    const sketch = parseSketch(exampleSketch());
    const row = result.heave[0];
    const pts = pointsAt(sketch, row.bodies);
    const len = (a: string, b: string) => Math.hypot(pts[a].x - pts[b].x, pts[a].y - pts[b].y, pts[a].z - pts[b].z);
    expect(len('LL.fl', 'LL.al')).toBeCloseTo(row.members.LLl.length, 9);
    expect(len('SH.fl', 'SH.al')).toBeCloseTo(row.members.SHl.length, 9);
    expect(pts['LL.fl']).toEqual({ x: 980, y: 470, z: 330 });
    expect((pts['WC.l'].z + pts['WC.r'].z) / 2).toBeCloseTo(395 + row.travel, 9);
  });

  it('is deterministic', () => {
    expect(JSON.stringify(runSweep(exampleSketch()))).toBe(JSON.stringify(result));
  });
});

describe('runSweep options and input', () => {
  it('overrides the range and skips roll on request', () => {
    const r = runSweep(exampleSketch(), { sweep: { droop: -20, bump: 12, step: 5 }, heaveOnly: true });
    expect(r.heave.map((h) => h.travel)).toEqual([-20, -15, -10, -5, 0, 5, 10, 12]);
    expect(r.roll).toEqual([]);
  });

  it('throws SketchValidationError for bad input and bad overrides', () => {
    expect(() => runSweep({})).toThrow(SketchValidationError);
    let caught: unknown;
    try {
      runSweep(exampleSketch(), { sweep: { step: -1 } });
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(SketchValidationError);
    expect((caught as SketchValidationError).problems).toEqual(['options.sweep.step: must be greater than 0']);
  });

  it('pointsAt leaves points of bodies without a pose at ride', () => {
    const sketch = parseSketch(exampleSketch());
    const pts = pointsAt(sketch, {});
    for (const p of sketch.points) expect(pts[p.id]).toEqual({ x: p.x, y: p.y, z: p.z });
  });
});

/** The solid-axle starters share this block's numbers; other layouts have their own tests. */
const SOLID_AXLE_LAYOUTS: readonly string[] = [
  'four-link-lateral-rod',
  'triangulated-four-link',
  'three-link-lateral-rod',
];

describe('starters', () => {
  for (const spec of Object.values(starters).filter((x) => SOLID_AXLE_LAYOUTS.includes(x!.layout))) {
    const s = spec!;
    describe(s.layout, () => {
      const result = runSweep(s.build());

      it('runs the full default range without lock-up and without NaN', () => {
        expect(result.heave).toHaveLength(61);
        expect(result.roll).toHaveLength(17);
        expect(result.limits).toMatchObject({ droop: -150, bump: 150, articulation: 8 });
        expect(result.limits.events.filter((e) => e.kind === 'lock-up' || e.kind.startsWith('shock'))).toEqual([]);
        expect(result.warnings).toEqual([]);
        expect(nonFinite(result)).toEqual([]);
      });

      it('gives plausible numbers (common practice ranges, no published source)', () => {
        expect(result.ride.antiSquat!).toBeGreaterThan(20);
        expect(result.ride.antiSquat!).toBeLessThan(120);
        for (const r of result.heave) {
          expect(Math.abs(r.lateralShift!)).toBeLessThan(15);
          expect(Math.abs(r.pinionAngleChange!)).toBeLessThan(5);
          expect(Math.abs(r.foreAftShift)).toBeLessThan(40);
          expect(r.members.SHl.motionRatio!).toBeGreaterThan(0.9);
        }
      });

      it('builds a valid sketch from its parameters, clamping out-of-range values', () => {
        const keys = s.params.map((p) => p.key);
        expect(keys).toEqual(expect.arrayContaining(['track', 'tireRadius', 'wheelbase', 'rideHeight']));
        for (const p of s.params) {
          expect(p.min).toBeLessThanOrEqual(p.default);
          expect(p.default).toBeLessThanOrEqual(p.max);
        }
        const wide = s.build({ track: 99999 });
        expect(wide.vehicle.track).toBe(s.params.find((p) => p.key === 'track')!.max);
        const narrow = s.build({ track: 1400, tireRadius: 300 });
        expect(narrow.points.find((p) => p.id === 'WC.l')).toMatchObject({ y: 700, z: 300 });
        expect(narrow.layout).toBe(s.layout);
      });
    });
  }
});

describe('a hinged arm (generic bodies)', () => {
  it('turns the wheel centre about its hinge axis', () => {
    const doc = sketchOf({
      points: [
        { id: 'H.f', body: 'frame', x: 450, y: 250, z: 380 },
        { id: 'H.i', body: 'frame', x: 420, y: 650, z: 380 },
        { id: 'WC.l', body: 'arm-left', x: 0, y: 800, z: 400 },
        { id: 'WC.r', body: 'arm-right', x: 0, y: -800, z: 400 },
        { id: 'G.f', body: 'frame', x: 450, y: -250, z: 380 },
        { id: 'G.i', body: 'frame', x: 420, y: -650, z: 380 },
      ],
      members: [
        { id: 'HL', kind: 'hinge', body: 'arm-left', a: 'H.f', b: 'H.i' },
        { id: 'HR', kind: 'hinge', body: 'arm-right', a: 'G.f', b: 'G.i' },
      ],
      sweep: { droop: -100, bump: 100, step: 10, roll: 4, rollStep: 2 },
    });
    const r = runSweep(doc);
    expect(r.heave).toHaveLength(21);
    expect(nonFinite(r)).toEqual([]);
    const sketch = parseSketch(doc);
    const a = { x: 450, y: 250, z: 380 },
      b = { x: 420, y: 650, z: 380 };
    const axisDistance = (p: { x: number; y: number; z: number }) => {
      const u = { x: b.x - a.x, y: b.y - a.y, z: b.z - a.z };
      const w = { x: p.x - a.x, y: p.y - a.y, z: p.z - a.z };
      const c = { x: u.y * w.z - u.z * w.y, y: u.z * w.x - u.x * w.z, z: u.x * w.y - u.y * w.x };
      return Math.hypot(c.x, c.y, c.z) / Math.hypot(u.x, u.y, u.z);
    };
    const ride = axisDistance({ x: 0, y: 800, z: 400 });
    for (const row of r.heave) {
      const wc = pointsAt(sketch, row.bodies)['WC.l'];
      expect(wc.z).toBeCloseTo(400 + row.travel, 6);
      expect(axisDistance(wc)).toBeCloseTo(ride, 6);
      expect(row.lateralShift).toBeNull();
    }
  });
});
