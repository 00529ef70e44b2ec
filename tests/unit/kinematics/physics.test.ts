/**
 * Physics that must hold whatever the numbers: symmetry, redundancy and invariance.
 * These are properties of rigid-body geometry (plain geometry, no published source needed).
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import type { SketchInput } from '../../../shared/schema/sketch';
import type { SweepResult } from '../../../shared/kinematics/types';
import { exampleSketch, mapPoints } from './helpers';

/** Solver convergence is 1e-8 mm; comparisons between two sweeps allow round-off above that. */
const MM = 1e-6;
const DEG = 1e-6;

describe('symmetric triangulated four-link', () => {
  const r = runSweep(starters['triangulated-four-link']!.build());
  it('has zero lateral shift and zero bind in heave', () => {
    for (const h of r.heave) {
      expect(Math.abs(h.lateralShift!)).toBeLessThan(MM);
      expect(Math.abs(h.pose.yaw)).toBeLessThan(DEG);
      expect(h.bind).toBeLessThan(MM);
    }
  });
  it('has zero bind in roll', () => {
    for (const h of r.roll) expect(h.bind).toBeLessThan(MM);
  });
});

describe('redundancy', () => {
  it('a parallel four-link with a lateral rod binds in roll', () => {
    const r = runSweep(starters['four-link-lateral-rod']!.build());
    const at8 = r.roll.find((x) => x.roll === 8)!;
    expect(at8.bind).toBeGreaterThan(0.5);
    expect(r.heave.every((h) => h.bind < MM)).toBe(true);
  });
  it('a three-link with a lateral rod does not', () => {
    const r = runSweep(starters['three-link-lateral-rod']!.build());
    for (const x of r.roll) expect(x.bind).toBeLessThan(MM);
  });
});

function mirror(doc: SketchInput): SketchInput {
  const m = mapPoints(doc, (p) => ({ x: p.x, y: -p.y, z: p.z }));
  m.wheels = { left: doc.wheels.right, right: doc.wheels.left };
  return m;
}

describe('mirroring left to right', () => {
  const doc = exampleSketch();
  const a = runSweep(doc);
  const b = runSweep(mirror(doc));

  it('mirrors heave: y and yaw change sign, the rest stays', () => {
    a.heave.forEach((ha, i) => {
      const hb = b.heave[i];
      expect(hb.travel).toBe(ha.travel);
      expect(hb.pose.y).toBeCloseTo(-ha.pose.y, 6);
      expect(hb.pose.yaw).toBeCloseTo(-ha.pose.yaw, 6);
      expect(hb.pose.x).toBeCloseTo(ha.pose.x, 6);
      expect(hb.pinionAngleChange!).toBeCloseTo(ha.pinionAngleChange!, 6);
      expect(hb.rollCenterHeight!).toBeCloseTo(ha.rollCenterHeight!, 6);
      expect(hb.antiSquat!).toBeCloseTo(ha.antiSquat!, 6);
      expect(hb.bind).toBeCloseTo(ha.bind, 6);
      expect(hb.members.SHl.length).toBeCloseTo(ha.members.SHr.length, 6);
    });
  });

  it('mirrors roll: the row at +φ matches the row at −φ', () => {
    a.roll.forEach((ra) => {
      const rb = b.roll.find((x) => x.roll === -ra.roll)!;
      expect(rb.leftTravel).toBeCloseTo(ra.rightTravel, 6);
      expect(rb.pose.y).toBeCloseTo(-ra.pose.y, 6);
      expect(rb.pose.pitch).toBeCloseTo(ra.pose.pitch, 6);
      expect(rb.pose.yaw).toBeCloseTo(-ra.pose.yaw, 6);
      expect(rb.bind).toBeCloseTo(ra.bind, 6);
    });
  });
});

function expectSameRelative(a: SweepResult, b: SweepResult) {
  expect(b.heave.length).toBe(a.heave.length);
  a.heave.forEach((ha, i) => {
    const hb = b.heave[i];
    for (const k of ['x', 'y', 'z', 'roll', 'pitch', 'yaw'] as const) expect(hb.pose[k]).toBeCloseTo(ha.pose[k], 6);
    expect(hb.bind).toBeCloseTo(ha.bind, 6);
    for (const id of Object.keys(ha.members)) {
      expect(hb.members[id].length).toBeCloseTo(ha.members[id].length, 6);
      if (ha.members[id].motionRatio !== undefined)
        expect(hb.members[id].motionRatio!).toBeCloseTo(ha.members[id].motionRatio!, 6);
    }
    expect(hb.driveline!.outputAngle).toBeCloseTo(ha.driveline!.outputAngle, 6);
  });
  a.roll.forEach((ra, i) => {
    expect(b.roll[i].bind).toBeCloseTo(ra.bind, 6);
    expect(b.roll[i].pose.yaw).toBeCloseTo(ra.pose.yaw, 6);
  });
}

describe('moving every point by the same vector', () => {
  const doc = exampleSketch();
  const a = runSweep(doc);

  it('changes nothing relative, and moves the instant and roll centres with it', () => {
    const v = { x: 40, y: 25, z: 60 };
    const b = runSweep(mapPoints(doc, (p) => ({ x: p.x + v.x, y: p.y + v.y, z: p.z + v.z })));
    expectSameRelative(a, b);
    a.heave.forEach((ha, i) => {
      const hb = b.heave[i];
      if (ha.instantCenter && Math.abs(ha.instantCenter.x) < 20000) {
        expect(hb.instantCenter!.x).toBeCloseTo(ha.instantCenter.x + v.x, 3);
        expect(hb.instantCenter!.z).toBeCloseTo(ha.instantCenter.z + v.z, 3);
      }
    });
  });

  it('keeps anti-squat when the move is fore-aft (the ground stays put)', () => {
    const b = runSweep(mapPoints(doc, (p) => ({ x: p.x + 123, y: p.y, z: p.z })));
    expectSameRelative(a, b);
    a.heave.forEach((ha, i) => expect(b.heave[i].antiSquat!).toBeCloseTo(ha.antiSquat!, 6));
  });
});
