/**
 * The double-wishbone layout through the whole core: the starter's sweep, the kingpin axis
 * against its closed form (plain geometry), the coil-over's motion ratio against a central
 * difference of its length, anti-dive's brake share, the structure warnings, lock-up, the
 * bump-steer note and the CSV columns.
 */
import { describe, expect, it } from 'vitest';
import { heaveRowsCsv, runSweep, starters } from '../../../shared/kinematics';
import { checkSketch, type SketchInput } from '../../../shared/schema/sketch';
import { nonFinite } from './helpers';

const spec = starters['double-wishbone']!;
/** deg / mm: closed forms evaluated on the same numbers, round-off only. */
const EXACT = 1e-9;
/** Central difference over ±5 mm rows: its error is (5 mm)²/6 · |d³L/dt³|, well under this for a coil-over. */
const FD_TOL = 1e-3;

describe('double-wishbone starter', () => {
  const sketch = spec.build();
  const r = runSweep(sketch);

  it('sweeps its default range without lock-up, warnings or NaN', () => {
    expect(r.heave.map((h) => h.travel)).toEqual(Array.from({ length: 49 }, (_, i) => -120 + 5 * i));
    expect(r.roll).toHaveLength(13);
    expect(r.limits.events).toEqual([]);
    expect(r.warnings).toEqual([]);
    expect(nonFinite(r)).toEqual([]);
    for (const h of r.heave) {
      expect(h.bind).toBeLessThan(1e-6);
      expect(h.pose).toEqual(h.bodies['knuckle-left']);
      expect(h.antiSquat).toBeNull();
    }
  });

  it('gives plausible front-end numbers (common practice ranges, no published source)', () => {
    const at = (t: number) => r.heave.find((h) => h.travel === t)!;
    // A short upper arm gains negative camber in bump and loses it in droop.
    expect(at(100).camberChange!).toBeLessThan(-1);
    expect(at(-100).camberChange!).toBeGreaterThan(0.5);
    expect(Math.abs(at(50).toeChange!)).toBeLessThan(0.05);
    expect(r.ride.rollCenterHeight!).toBeGreaterThan(50);
    expect(r.ride.rollCenterHeight!).toBeLessThan(200);
    expect(r.ride.antiDive!).toBeGreaterThan(5);
    expect(r.ride.antiDive!).toBeLessThan(40);
    // The roll centre drops in bump on a short-long arm front.
    expect(at(100).rollCenterHeight!).toBeLessThan(r.ride.rollCenterHeight!);
    // Anti-dive geometry: the upper joint moves rearward in bump.
    expect(at(100).casterChange!).toBeGreaterThan(0);
  });

  it('reads the kingpin axis at ride as its closed form from the ball joints (plain geometry)', () => {
    const p = (id: string) => sketch.points.find((q) => q.id === id)!;
    const L = p('LW.bj.l'),
      U = p('UW.bj.l'),
      W = p('WC.l');
    const rise = U.z - L.z;
    const kp = r.ride.kingpin!;
    expect(kp.inclination).toBeCloseTo((Math.atan((L.y - U.y) / rise) * 180) / Math.PI, 9);
    expect(kp.caster).toBeCloseTo((Math.atan((L.x - U.x) / rise) * 180) / Math.PI, 9);
    // The axis meets the ground (z = 0) at L + t(U − L), t = −L.z / rise.
    const t = -L.z / rise;
    expect(Math.abs(kp.scrubRadius - (W.y - (L.y + t * (U.y - L.y))))).toBeLessThan(EXACT);
    expect(Math.abs(kp.trail - (L.x + t * (U.x - L.x) - W.x))).toBeLessThan(EXACT);
    // The starter's own numbers: 60 mm of inset over 390 mm of rise, 4° of caster.
    expect(kp.inclination).toBeCloseTo(8.746, 3);
    expect(kp.caster).toBeCloseTo(4, 2);
    expect(r.ride.casterChange).toBe(0);
  });

  it('gives the coil-over a motion ratio equal to the central difference of its length, and wheel rate = rate · MR²', () => {
    const spring = sketch.members.find((m) => m.id === 'SPl');
    const rate = spring?.kind === 'spring' ? spring.rate! : NaN;
    expect(rate).toBe(130);
    for (let i = 1; i < r.heave.length - 1; i++) {
      const fd = (r.heave[i + 1].members.SHl.length - r.heave[i - 1].members.SHl.length) / 10;
      expect(Math.abs(r.heave[i].members.SHl.motionRatio! - Math.abs(fd))).toBeLessThan(FD_TOL);
      // Barton & Fieldhouse, Automotive Chassis Engineering, §3.9.
      expect(r.heave[i].members.SPl.wheelRate!).toBeCloseTo(rate * r.heave[i].members.SPl.motionRatio! ** 2, 9);
    }
    // On the lower arm at 62 % of its length: 0.5–0.7 (common practice ranges, no published source).
    expect(r.ride.members.SHl.motionRatio!).toBeGreaterThan(0.5);
    expect(r.ride.members.SHl.motionRatio!).toBeLessThan(0.7);
  });

  it('rolls the body: the left wheel up by halfTrack·tan(roll), camber relative to the ground from zero at roll 0', () => {
    for (const x of r.roll) {
      expect(x.leftTravel).toBeCloseTo(810 * Math.tan((x.roll * Math.PI) / 180), 6);
      expect(x.rightTravel).toBeCloseTo(-x.leftTravel, 6);
      expect(x.bind).toBeLessThan(1e-6);
    }
    const zero = r.roll.find((x) => x.roll === 0)!;
    expect(zero.camberToGround).toEqual({ left: 0, right: 0 });
    // The outer (bump) wheel leans out relative to the ground: the arms recover only part of the roll.
    const at5 = r.roll.find((x) => x.roll === 5)!;
    expect(at5.camberToGround!.left).toBeGreaterThan(0);
    expect(at5.camberToGround!.left).toBeLessThan(5);
  });
});

describe('anti-dive and the front brake share', () => {
  it('scales with the share and defaults to 65 %', () => {
    const at = (share?: number) => {
      const doc = structuredClone(spec.build()) as SketchInput;
      if (share === undefined) delete (doc.vehicle as { frontBrakeShare?: number }).frontBrakeShare;
      else doc.vehicle.frontBrakeShare = share;
      return runSweep(doc).ride.antiDive!;
    };
    expect(at(100) / at(50)).toBeCloseTo(2, 12);
    expect(at(undefined)).toBeCloseTo(at(65), 12);
  });

  it('refuses a share outside 0–100 % with a named problem', () => {
    const doc = structuredClone(spec.build()) as SketchInput;
    doc.vehicle.frontBrakeShare = 120;
    const res = checkSketch(doc);
    expect(res.ok).toBe(false);
    expect(res.ok ? [] : res.problems).toContain('vehicle.frontBrakeShare: must be at most 100');
  });
});

describe('structure, lock-up and notes', () => {
  it("without a tie rod the knuckle's steer is unlocated: a warning, no NaN", () => {
    const doc = structuredClone(spec.build()) as SketchInput;
    doc.members = doc.members.filter((m) => m.id !== 'TRl');
    const r = runSweep(doc);
    expect(r.warnings.some((w) => w.includes('knuckle-left') && w.includes('steer'))).toBe(true);
    expect(nonFinite(r)).toEqual([]);
  });

  it('a knuckle without both wishbones gets a warning and no wishbone readings', () => {
    const doc = structuredClone(spec.build()) as SketchInput;
    // The left upper wishbone taken away: its hinge, its ball joint and the arm's point.
    doc.members = doc.members.filter((m) => m.id !== 'UWl' && m.id !== 'UBJl');
    doc.points = doc.points.filter((p) => p.body !== 'upper-arm-left');
    const r = runSweep(doc);
    expect(r.warnings.some((w) => w.startsWith('The knuckle-left has no upper and lower wishbone'))).toBe(true);
    expect(r.ride.frontViewInstantCenter).toBeUndefined();
    expect(nonFinite(r)).toEqual([]);
  });

  it('stops at lock-up when the arms cannot reach the travel', () => {
    const r = runSweep(spec.build(), { sweep: { bump: 600, droop: -600, step: 10 }, heaveOnly: true });
    const lock = r.limits.events.filter((e) => e.kind === 'lock-up');
    expect(lock.map((e) => Math.sign(e.at)).sort()).toEqual([-1, 1]);
    expect(r.limits.bump).toBeLessThan(600);
    expect(r.limits.droop).toBeGreaterThan(-600);
    expect(nonFinite(r)).toEqual([]);
  });

  it('notes large bump steer on both sides when the rack sits too high, naming each tie rod', () => {
    const r = runSweep(spec.build({ tieRodInnerHeight: 345 }));
    const notes = r.warnings.filter((w) => w.startsWith('Bump steer'));
    expect(notes).toHaveLength(2);
    expect(notes[0]).toContain('(tie rod TRl)');
    expect(notes[1]).toContain('(tie rod TRr)');
    expect(notes[0]).toMatch(/lower it \d+ mm/);
  });

  it('writes the independent-wheel columns into the CSV', () => {
    const header = heaveRowsCsv(runSweep(spec.build(), { heaveOnly: true }))
      .split('\r\n')[0]
      .split(',');
    for (const c of [
      'camberChange',
      'toeChange',
      'trackChange',
      'casterChange',
      'frontViewInstantCenter.y',
      'antiDive',
      'kingpin.scrubRadius',
    ]) {
      expect(header).toContain(c);
    }
    const solid = heaveRowsCsv(runSweep(starters['three-link-lateral-rod']!.build(), { heaveOnly: true })).split(
      '\r\n',
    )[0];
    expect(solid).not.toContain('camberChange');
  });
});
