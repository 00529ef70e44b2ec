/**
 * Trailing-arm layout: the starter sweeps its whole range, gives the per-side readings of
 * docs/sketch-format.md, and the half-shaft readings follow their definitions.
 */
import { describe, expect, it } from 'vitest';
import { pointsAt, runSweep } from '../../../shared/kinematics';
import { parseSketch } from '../../../shared/schema/sketch';
import { trailingArm } from '../../../shared/kinematics/layouts/trailing-arm/starter';
import { nonFinite } from './helpers';

/** Lengths agree to this (mm): solver convergence plus round-off. */
const LENGTH_TOL_MM = 1e-6;
/** Angles agree to this (deg). */
const ANGLE_TOL_DEG = 1e-6;

describe('trailing-arm starter', () => {
  const sketch = trailingArm.build();
  const result = runSweep(sketch);

  it('runs the full default range without lock-up, shock limits, warnings or NaN', () => {
    expect(result.heave).toHaveLength(61);
    expect(result.roll).toHaveLength(17);
    expect(result.limits).toMatchObject({ droop: -150, bump: 150, articulation: 8 });
    expect(result.limits.events.filter((e) => e.kind === 'lock-up' || e.kind.startsWith('shock'))).toEqual([]);
    expect(result.warnings).toEqual([]);
    expect(nonFinite(result)).toEqual([]);
  });

  it('gives plausible semi-trailing numbers (common practice ranges, no published source)', () => {
    const ride = result.ride;
    expect(ride.antiSquat!).toBeGreaterThan(10);
    expect(ride.antiSquat!).toBeLessThan(80);
    expect(ride.rollCenterHeight!).toBeGreaterThan(50);
    expect(ride.rollCenterHeight!).toBeLessThan(400);
    const bump = result.heave.find((r) => r.travel === 50)!;
    // A swept axis gains negative camber in bump, about a degree per 25 mm or so.
    expect(bump.camberChange!).toBeLessThan(-0.5);
    expect(bump.camberChange!).toBeGreaterThan(-4);
    for (const r of result.heave) {
      expect(Math.abs(r.toeChange!)).toBeLessThan(2);
      expect(r.lateralShift).toBeNull();
      expect(r.pinionAngleChange).toBeNull();
      expect(r.members.SPl.motionRatio!).toBeGreaterThan(0.4);
      expect(r.members.SPl.motionRatio!).toBeLessThan(0.9);
      expect(r.halfShafts!.left!.innerAngle).toBeLessThan(20);
    }
  });

  it('keeps each wheel centre at its distance from the hinge axis and reports the contract fields', () => {
    const s = parseSketch(sketch);
    const a = s.points.find((p) => p.id === 'HA.ol')!,
      b = s.points.find((p) => p.id === 'HA.il')!;
    const u = { x: b.x - a.x, y: b.y - a.y, z: b.z - a.z };
    const axisDistance = (p: { x: number; y: number; z: number }) => {
      const w = { x: p.x - a.x, y: p.y - a.y, z: p.z - a.z };
      const c = { x: u.y * w.z - u.z * w.y, y: u.z * w.x - u.x * w.z, z: u.x * w.y - u.y * w.x };
      return Math.hypot(c.x, c.y, c.z) / Math.hypot(u.x, u.y, u.z);
    };
    const wcRide = s.points.find((p) => p.id === 'WC.l')!;
    for (const r of result.heave) {
      const pts = pointsAt(s, r.bodies);
      const wc = pts['WC.l'];
      expect(wc.z).toBeCloseTo(wcRide.z + r.travel, 6);
      expect(Math.abs(axisDistance(wc) - axisDistance(wcRide))).toBeLessThan(LENGTH_TOL_MM);
      expect(r.trackChange!).toBeCloseTo(Math.abs(wc.y) - Math.abs(wcRide.y), 9);
      expect(r.foreAftShift).toBeCloseTo(wc.x - wcRide.x, 9);
      // Side-view instant centre: on the hinge axis, in the wheel's fore-aft plane.
      const t = (wc.y - a.y) / u.y;
      expect(r.instantCenter!.x).toBeCloseTo(a.x + t * u.x, 6);
      expect(r.instantCenter!.z).toBeCloseTo(a.z + t * u.z, 6);
      // Anti-squat from the wheel centre (frame-mounted drive; docs/sketch-format.md).
      const tan = (r.instantCenter!.z - wc.z) / (r.instantCenter!.x - wc.x);
      expect(r.antiSquat!).toBeCloseTo((100 * tan) / (s.vehicle.cgHeight / s.vehicle.wheelbase), 6);
      // Half-shaft: length between the joints as placed, plunge from ride.
      const hs = r.halfShafts!.left!;
      const len = Math.hypot(
        pts['HS.ol'].x - pts['HS.il'].x,
        pts['HS.ol'].y - pts['HS.il'].y,
        pts['HS.ol'].z - pts['HS.il'].z,
      );
      expect(hs.length).toBeCloseTo(len, 9);
      expect(hs.plunge).toBeCloseTo(len - result.ride.halfShafts!.left!.length, 9);
    }
  });

  it('is mirror-symmetric: the right side in heave, and roll to the left mirrors roll to the right', () => {
    for (const r of result.heave) {
      expect(r.halfShafts!.right!.plunge).toBeCloseTo(r.halfShafts!.left!.plunge, 6);
      expect(r.halfShafts!.right!.outerAngle).toBeCloseTo(r.halfShafts!.left!.outerAngle, 6);
    }
    for (const r of result.roll) {
      const m = result.roll.find((q) => q.roll === -r.roll)!;
      expect(r.leftTravel).toBeCloseTo(m.rightTravel, 6);
      expect(r.camberToGround!.left).toBeCloseTo(m.camberToGround!.right, 6);
      if (r.rollCenter && m.rollCenter) {
        expect(r.rollCenter.y).toBeCloseTo(-m.rollCenter.y, 6);
        expect(r.rollCenter.z).toBeCloseTo(m.rollCenter.z, 6);
      }
    }
  });

  it('moves each side on its own in roll: the left arm goes where the heave sweep put it', () => {
    // Independent arms: the left wheel at +roll sits exactly where heave put it at the same travel.
    for (const r of result.roll.filter((q) => q.roll !== 0)) {
      const s = parseSketch(sketch);
      const wcRoll = pointsAt(s, r.bodies)['WC.l'];
      const heaveAt = runSweep(sketch, {
        sweep: {
          droop: -Math.max(1, Math.abs(r.leftTravel)),
          bump: Math.max(1, Math.abs(r.leftTravel)),
          step: Math.abs(r.leftTravel),
        },
        heaveOnly: true,
      });
      const row = heaveAt.heave.find((h) => Math.abs(h.travel - r.leftTravel) < LENGTH_TOL_MM)!;
      const wcHeave = pointsAt(s, row.bodies)['WC.l'];
      expect(Math.abs(wcRoll.x - wcHeave.x) + Math.abs(wcRoll.y - wcHeave.y)).toBeLessThan(1e-5);
      expect(r.camberToGround!.left - r.roll).toBeCloseTo(row.camberChange!, 5);
    }
  });

  it('builds from its parameters, clamping out-of-range values, and a sweep angle of 0 gives a hinge along y', () => {
    for (const p of trailingArm.params) {
      expect(p.min).toBeLessThanOrEqual(p.default);
      expect(p.default).toBeLessThanOrEqual(p.max);
    }
    expect(trailingArm.build({ track: 99999 }).vehicle.track).toBe(2200);
    const narrow = trailingArm.build({ track: 1400, tireRadius: 300 });
    expect(narrow.points.find((p) => p.id === 'WC.l')).toMatchObject({ x: 0, y: 700, z: 300 });
    const pure = trailingArm.build({ sweepAngle: 0, axisTilt: 0 });
    const a = pure.points.find((p) => p.id === 'HA.ol')!,
      b = pure.points.find((p) => p.id === 'HA.il')!;
    expect(Math.abs(a.x - b.x) + Math.abs(a.z - b.z)).toBeLessThan(ANGLE_TOL_DEG);
  });
});
