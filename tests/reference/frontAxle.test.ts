/**
 * A solid axle at either end, by the side-view instant centre method (Milliken & Milliken, Race Car
 * Vehicle Dynamics, ch. 17, anti-squat / anti-dive / anti-lift; formula forms from memory, unverified):
 * with tanθ the slope of the line from the contact patch to the instant centre (rising towards it),
 * L the wheelbase, h the CG height,
 *   rear, under power:   %anti-squat        = 100 · tanθ · L/h
 *   rear, in braking:    %anti-lift         = (rear brake share) · tanθ · L/h
 *   front, in braking:   %anti-dive         = (front brake share) · tanθ · L/h
 *   front, under power:  %anti-lift         = (front drive share, here 100 %) · tanθ · L/h.
 * The rig places the instant centre by construction (both link lines aimed at it), so the expected
 * figures are worked by hand here; the front rig is the rear one mirrored fore and aft, so each front
 * reading must equal its rear counterpart. At every row the instant centre is found with mathjs `intersect` on
 * the axle solved in the test at that travel (independentPose.ts: Gauss–Newton least squares from the sketch's
 * hardpoints, not the sweep's placed points), and the percentages with the ratio computed in the test.
 */
import { intersect } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../shared/kinematics';
import { parseSketch, type SketchInput } from '../../shared/schema/sketch';
import { axleAt, axlePoints, axleRig } from './independentPose';
import { doc, IC_RIG_MEMBERS, IC_RIG_POINTS } from './rigs';

const L = 2700;
const H = 500;

/** The rear rig: lower links through (0, 200) and the IC (1000, 300), uppers through (0, 600) and the IC. */
const REAR_POINTS: SketchInput['points'] = [
  ...IC_RIG_POINTS,
  // A driveshaft to the pinion (the axle is driven); its points sit off the links.
  { id: 'DS.o', body: 'frame', x: 1500, y: 0, z: 500 },
  { id: 'DS.oa', body: 'frame', x: 1600, y: 0, z: 500 },
  { id: 'DS.p', body: 'axle', x: 150, y: 0, z: 420 },
  { id: 'DS.pa', body: 'axle', x: 50, y: 0, z: 410 },
];

const DRIVELINE = { output: 'DS.o', outputAxis: 'DS.oa', pinion: 'DS.p', pinionAxis: 'DS.pa' };

function rig(end: 'front' | 'rear', frontBrakeShare: number, driven: boolean): SketchInput {
  const sign = end === 'front' ? -1 : 1;
  // The front rig is the rear one mirrored fore and aft (x → −x): its links run rearward to the frame.
  const points = REAR_POINTS.map((p) => ({ ...p, x: sign * p.x }));
  const vehicle = { wheelbase: L, cgHeight: H, track: 1600, tireRadius: 400, frontBrakeShare };
  return doc(points, IC_RIG_MEMBERS, {
    vehicle: end === 'front' ? { ...vehicle, axle: 'front' as const } : vehicle,
    ...(driven ? { driveline: DRIVELINE } : {}),
  });
}

describe('solid axle at the rear: anti-squat and anti-lift in braking', () => {
  // Front brake share 60 %: the rear axle brakes with 40 %.
  const r = runSweep(rig('rear', 60, true));

  it('worked check: IC 1000 ahead and 300 high (tanθ = 0.3), L/h = 5.4', () => {
    expect(r.ride.instantCenter!.x).toBeCloseTo(1000, 9);
    expect(r.ride.instantCenter!.z).toBeCloseTo(300, 9);
    // 100 · 0.3 · 5.4 = 162.0 % (worked by hand)
    expect(r.ride.antiSquat!).toBeCloseTo(162.0, 6);
    // 40 · 0.3 · 5.4 = 64.8 % (worked by hand)
    expect(r.ride.antiLiftBraking!).toBeCloseTo(64.8, 6);
    expect(r.ride.antiDive).toBeUndefined();
    expect(r.ride.antiLift).toBeUndefined();
  });

  it('anti-lift in braking follows the rear brake share at every row (mathjs intersect for the IC)', () => {
    const sketch = parseSketch(rig('rear', 60, true));
    for (const row of r.heave) {
      const p = axlePoints(sketch, axleRig(sketch), axleAt(axleRig(sketch), row.travel));
      const xz = (id: string) => [p[id].x, p[id].z];
      const ic = intersect(xz('UL.fl'), xz('UL.al'), xz('LL.fl'), xz('LL.al')) as number[];
      const tan = (ic[1] - row.travel) / (ic[0] - p['WC.l'].x);
      expect(row.antiLiftBraking!).toBeCloseTo(0.4 * tan * (L / H) * 100, 6);
    }
  });
});

describe('solid axle at the front: anti-dive and anti-lift under power, never anti-squat', () => {
  // Front brake share 40 %: the same share as the rear rig's rear brakes, so anti-dive mirrors its anti-lift.
  const front = runSweep(rig('front', 40, true));
  const rear = runSweep(rig('rear', 60, true));

  it('worked check: IC 1000 behind and 300 high, L/h = 5.4', () => {
    expect(front.ride.instantCenter!.x).toBeCloseTo(-1000, 9);
    expect(front.ride.instantCenter!.z).toBeCloseTo(300, 9);
    // 40 · 0.3 · 5.4 = 64.8 % (worked by hand)
    expect(front.ride.antiDive!).toBeCloseTo(64.8, 6);
    // 100 · 0.3 · 5.4 = 162.0 % (worked by hand)
    expect(front.ride.antiLift!).toBeCloseTo(162.0, 6);
    expect(front.ride.antiSquat).toBeNull();
    expect(front.ride.antiLiftBraking).toBeUndefined();
  });

  it('mirrored fore and aft, every row reads as the rear rig does: anti-dive = rear anti-lift in braking, anti-lift = anti-squat', () => {
    expect(front.heave).toHaveLength(rear.heave.length);
    front.heave.forEach((row, i) => {
      expect(row.travel).toBeCloseTo(rear.heave[i].travel, 9);
      expect(row.antiDive!).toBeCloseTo(rear.heave[i].antiLiftBraking!, 6);
      expect(row.antiLift!).toBeCloseTo(rear.heave[i].antiSquat!, 6);
    });
  });

  it('anti-dive follows the front brake share at every row (mathjs intersect for the IC)', () => {
    const sketch = parseSketch(rig('front', 40, true));
    for (const row of front.heave) {
      const p = axlePoints(sketch, axleRig(sketch), axleAt(axleRig(sketch), row.travel));
      const xz = (id: string) => [p[id].x, p[id].z];
      const ic = intersect(xz('UL.fl'), xz('UL.al'), xz('LL.fl'), xz('LL.al')) as number[];
      // Rising rearward: the run is from the instant centre forward to the patch.
      const tan = (ic[1] - row.travel) / (p['WC.l'].x - ic[0]);
      expect(row.antiDive!).toBeCloseTo(0.4 * tan * (L / H) * 100, 6);
      expect(row.antiLift!).toBeCloseTo(tan * (L / H) * 100, 6);
    }
  });

  it('an axle without a driveline has no anti-lift under power', () => {
    const undriven = runSweep(rig('front', 40, false));
    expect(undriven.ride.antiLift).toBeNull();
    expect(undriven.ride.antiDive!).toBeCloseTo(64.8, 6);
  });
});
