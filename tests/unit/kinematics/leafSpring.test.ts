/**
 * Leaf-spring layout: the starter sweeps its range, the SAE three-link members hold, the
 * readout states the lateral assumption, wind-up follows its derivation, the sketch additions
 * are validated with named problems, and version 1 files keep their meaning.
 */
import { describe, expect, it } from 'vitest';
import { pointsAt, runSweep } from '../../../shared/kinematics';
import { linkageModelBuild } from '../../../shared/kinematics/model';
import { leafSpring } from '../../../shared/kinematics/layouts/leaf-spring/starter';
import { checkSketch, parseSketch, type SketchInput } from '../../../shared/schema/sketch';
import { exampleSketch, nonFinite } from './helpers';

/** Lengths and planes hold to this (mm): the bending rows pull on them by well under 1e-3 mm. */
const HELD_TOL_MM = 2e-3;
/** Mirror images agree to this (mm or deg): solver convergence. */
const MIRROR_TOL = 1e-6;

const dist = (p: { x: number; y: number; z: number }, q: { x: number; y: number; z: number }) =>
  Math.hypot(p.x - q.x, p.y - q.y, p.z - q.z);

describe('leaf-spring starter', () => {
  const sketch = leafSpring.build();
  const result = runSweep(sketch);

  it('runs the full default range without lock-up, shock limits or NaN, and states the lateral assumption', () => {
    expect(result.heave).toHaveLength(61);
    expect(result.roll).toHaveLength(17);
    expect(result.limits).toMatchObject({ droop: -150, bump: 150, articulation: 8 });
    expect(result.limits.events.filter((e) => e.kind === 'lock-up' || e.kind.startsWith('shock'))).toEqual([]);
    expect(nonFinite(result)).toEqual([]);
    expect(result.warnings).toHaveLength(2);
    expect(result.warnings[0]).toMatch(/leaves locate the axle sideways/);
    expect(result.warnings[0]).toMatch(/no lateral rod/);
    // The three-link equivalent's side-view pole gives them (tests/reference/leafSpringAntiSquat.test.ts checks the values).
    expect(result.ride.instantCenter).not.toBeNull();
    expect(result.ride.antiSquat).not.toBeNull();
    expect(result.warnings[1]).toMatch(/instant centre and anti-squat are those of that equivalent/);
  });

  it('holds every spring half, shackle and plane through heave and roll; the bind stays tiny', () => {
    const s = parseSketch(sketch);
    const ride = Object.fromEntries(s.points.map((p) => [p.id, p]));
    for (const row of [...result.heave, ...result.roll]) {
      const pts = pointsAt(s, row.bodies);
      for (const side of ['l', 'r']) {
        for (const [a, b] of [
          [`LF.${side}`, `LA.${side}`],
          [`LE.${side}`, `LB.${side}`],
          [`LH.${side}`, `LE.${side}`],
        ]) {
          expect(Math.abs(dist(pts[a], pts[b]) - dist(ride[a], ride[b]))).toBeLessThan(HELD_TOL_MM);
        }
        // The shackle swings in its hanger's fore-aft plane.
        expect(Math.abs(pts[`LE.${side}`].y - ride[`LE.${side}`].y)).toBeLessThan(HELD_TOL_MM);
      }
      // The leaves hold the axle sideways: the front pivots' mean y stays put.
      const meanY = (pts['LA.l'].y + pts['LA.r'].y) / 2 - (ride['LA.l'].y + ride['LA.r'].y) / 2;
      expect(Math.abs(meanY)).toBeLessThan(HELD_TOL_MM);
      expect(row.bind).toBeLessThan(HELD_TOL_MM);
    }
  });

  it('gives plausible leaf-spring numbers (common practice ranges, no published source)', () => {
    for (const r of result.heave) {
      expect(Math.abs(r.pinionAngleChange!)).toBeLessThan(2);
      expect(Math.abs(r.lateralShift!)).toBeLessThan(0.01);
      expect(Math.abs(r.foreAftShift)).toBeLessThan(60);
      expect(Math.abs(r.shackleAngle!)).toBeLessThan(60);
      // The seat (65 mm above the wheel centre) rides with the axle; its small pitch moves it by well under 0.01 mm.
      expect(Math.abs(r.rollCenterHeight! - (460 + r.travel))).toBeLessThan(0.01);
    }
    expect(result.ride.shackleAngle).toBeCloseTo(12, 1);
    // The eyes are farthest apart, so the shackle's eye farthest rearward, where the half-links lie
    // level: the pivots a quarter in from the seat sit ¾ × 70 mm of arc below the eyes at ride.
    const widest = result.heave.reduce((best, r) => (r.shackleAngle! > best.shackleAngle! ? r : best));
    expect(widest.travel).toBeGreaterThan(30);
    expect(widest.travel).toBeLessThan(80);
  });

  it('is mirror-symmetric: left and right springs alike in heave, roll either way mirrored', () => {
    for (const r of result.heave) {
      expect(r.pose.yaw).toBeCloseTo(0, 6);
      expect(r.pose.y).toBeCloseTo(0, 6);
      expect(r.bodies['shackle-left']!.x).toBeCloseTo(r.bodies['shackle-right']!.x, 6);
    }
    for (const r of result.roll) {
      const m = result.roll.find((q) => q.roll === -r.roll)!;
      expect(Math.abs(r.pose.x - m.pose.x)).toBeLessThan(MIRROR_TOL);
      expect(Math.abs(r.pose.y + m.pose.y)).toBeLessThan(MIRROR_TOL);
      expect(Math.abs(r.pose.pitch - m.pose.pitch)).toBeLessThan(MIRROR_TOL);
      expect(Math.abs(r.pose.yaw + m.pose.yaw)).toBeLessThan(MIRROR_TOL);
      expect(Math.abs(r.leftTravel - m.rightTravel)).toBeLessThan(MIRROR_TOL);
    }
  });
});

describe('wind-up', () => {
  const sketch = leafSpring.build();
  const result = runSweep(sketch);
  const w = result.windUp!;

  it('has the rate Σ k_i·L_i² of the halves, K·L1·L2 for the starter (derivation in windUp.ts)', () => {
    expect(w.springs).toHaveLength(2);
    for (const s of w.springs) {
      const k = s.verticalRate;
      // N·mm per rad → N·m per degree.
      expect(s.rate).toBeCloseTo((k * s.frontLength * s.rearLength) / 1000 / (180 / Math.PI), 0);
    }
    expect(w.rate).toBeCloseTo(w.springs[0].rate + w.springs[1].rate, 9);
    expect(w.torque).toBe(4000);
    expect(w.angle).toBeCloseTo(4000 / w.rate, 12);
  });

  it('turns the pinion nose up under drive by the wind-up angle and moves staggered shocks opposite ways', () => {
    expect(-w.pose.pitch).toBeCloseTo(w.angle, 9);
    expect(w.pose.z).toBe(0);
    // Left shock ahead of the axle, right behind: the housing turning nose-up shortens one, lengthens the other.
    expect(w.members.SHl.lengthChange).toBeLessThan(-1);
    expect(w.members.SHr.lengthChange).toBeGreaterThan(1);
    expect(w.bind).toBeLessThan(HELD_TOL_MM);
    // The starter's pinion points 2° below the shaft's line at ride: the housing turning nose-up closes that angle.
    expect(w.driveline!.pinionAngle).toBeLessThan(result.ride.driveline!.pinionAngle - 1);
  });

  it("scales with the axle torque (option or file), reverses with it, and needs the halves' rates", () => {
    const twice = runSweep(sketch, { sweep: { axleTorque: 8000 }, heaveOnly: true }).windUp!;
    expect(twice.angle).toBeCloseTo(2 * w.angle, 9);
    const back = runSweep({ ...sketch, sweep: { ...sketch.sweep, axleTorque: -4000 } }, { heaveOnly: true }).windUp!;
    expect(back.pose.pitch).toBeCloseTo(-w.pose.pitch, 9);
    const noRates = structuredClone(sketch) as SketchInput;
    noRates.members = noRates.members.map((m) => (m.kind === 'leaf-half' ? { ...m, rate: undefined } : m));
    const r = runSweep(noRates, { heaveOnly: true });
    expect(r.windUp).toBeUndefined();
    expect(nonFinite(r)).toEqual([]);
  });
});

describe('format additions', () => {
  it('keep every version 1 file valid and its sweep unchanged', () => {
    const doc = exampleSketch();
    const before = runSweep(doc);
    expect(before.windUp).toBeUndefined();
    expect(before.warnings.some((s) => s.startsWith('Leaf springs'))).toBe(false);
    // A version 1 shackle between frame and axle is still one distance, with no plane added.
    const withShackle = structuredClone(doc);
    withShackle.members.push({ id: 'K', kind: 'shackle', a: 'LR.f', b: 'LR.a' });
    const model = linkageModelBuild(parseSketch(withShackle));
    expect(model.constraints.filter((c) => c.type === 'planar')).toEqual([]);
  });

  it('name the problem for a misplaced leaf half or half-shaft', () => {
    const doc = structuredClone(leafSpring.build()) as SketchInput;
    const i = doc.members.findIndex((m) => m.id === 'LFHl');
    doc.members[i] = { ...doc.members[i], a: 'LS.l', seat: 'nowhere' } as SketchInput['members'][number];
    const j = doc.members.findIndex((m) => m.id === 'LRHl');
    doc.members[j] = { ...doc.members[j], b: 'LF.r' } as SketchInput['members'][number];
    doc.halfShafts = { left: { inner: 'WC.l', innerAxis: 'LF.l', outer: 'LF.l', outerAxis: 'gone' } };
    const res = checkSketch(doc);
    expect(res.ok).toBe(false);
    const problems = res.ok ? [] : res.problems;
    expect(problems).toEqual(
      expect.arrayContaining([
        `members[${i}].a: a leaf spring's eye must be on the frame or a shackle ('LS.l' is on 'axle')`,
        `members[${i}].seat: no point 'nowhere'`,
        `members[${j}].b: a leaf spring's pivot must be on the axle ('LF.r' is on 'frame')`,
        "halfShafts.left.outerAxis: no point 'gone'",
        "halfShafts.left.inner: 'WC.l' must be on the frame (it is on 'axle')",
        "halfShafts.left.outer: 'LF.l' must be on a moving body (it is on the frame)",
      ]),
    );
  });

  it('validate the axle torque and the load limit', () => {
    const doc = structuredClone(leafSpring.build()) as SketchInput;
    doc.sweep = { ...doc.sweep, axleTorque: 1e9, linkLoadLimit: -5 };
    const res = checkSketch(doc);
    expect(res.ok ? [] : res.problems).toEqual([
      'sweep.axleTorque: must be at most 200000',
      'sweep.linkLoadLimit: must be greater than 0',
    ]);
  });
});
