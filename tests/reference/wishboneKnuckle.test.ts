/**
 * The double-wishbone starter's knuckle against poses solved in the test (independentPose.ts: Gauss–Newton least
 * squares from the sketch's hardpoints, each ball joint held at its distances from its wishbone's two inner
 * pivots and the tie rod at its length, the wheel centre's z imposed) and the textbook definitions of the wheel's
 * attitude and of the steering axis:
 * - camber and toe are the rear-view and top-view angles of the wheel's spin axis (the knuckle's turn applied to
 *   the outward lateral axis the wheel has at ride), top out and toe-in positive (docs/sketch-format.md);
 * - kingpin inclination and caster are the front- and side-view angles from the vertical of the line through
 *   the two ball joints; scrub radius and mechanical trail are where that line meets the ground, measured from
 *   the contact patch below the wheel centre: sideways (axis inboard of the patch positive) and fore-aft (axis
 *   ahead of the patch positive) (Milliken & Milliken, Race Car Vehicle Dynamics, ch. 19; Gillespie,
 *   Fundamentals of Vehicle Dynamics, ch. 8 — definitions from memory, unverified);
 * - the contact point of a cambered tyre is the lowest point of its circle in the wheel plane: the wheel centre
 *   plus r along the downward vertical projected into that plane (circle geometry).
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../shared/kinematics';
import { parseSketch, type Sketch } from '../../shared/schema/sketch';
import { DEG, knuckleAt, knucklePlace, knuckleRig, rotate, xyzOf, type V3 } from './independentPose';
import { wishboneArmsAsLinks } from './wishboneTwoLink';

/** deg: the sweep's solve stops at 1e-6 mm, over some 150 mm between its constraints: under 1e-6 deg; round-off */
const ANGLE_TOL_DEG = 1e-5;
/** mm: the same solve tolerance carried through a few hundred mm of lever */
const POS_TOL_MM = 1e-5;

const deg = (r: number) => r / DEG;

/** The knuckle's ball joints (lower, upper) and the wheel centre, as ids, from the sketch's members. */
function jointsOf(sketch: Sketch) {
  const body = new Map(sketch.points.map((p) => [p.id, p.body]));
  const joint = (group: 'upper' | 'lower') => {
    const link = sketch.members.find((m) => m.kind === 'link' && m.group === group && body.get(m.b) === 'knuckle-left');
    if (link && link.kind === 'link') return link.b;
    const arm = `${group}-arm-left`;
    const ball = sketch.members.find((m) => m.kind === 'ball-joint' && body.get(m.a) === arm)!;
    // The joint is at the arm's point, which the knuckle carries (docs/sketch-format.md).
    return ball.a;
  };
  return { lower: joint('lower'), upper: joint('upper'), wc: sketch.wheels.left };
}

/** Kingpin readings of the axis through `lower` and `upper` over the ground at height `groundZ`, left side. */
function kingpinByDefinition(lower: V3, upper: V3, wc: V3, groundZ: number) {
  const rise = upper[2] - lower[2];
  const t = (groundZ - lower[2]) / rise;
  const ground = [lower[0] + t * (upper[0] - lower[0]), lower[1] + t * (upper[1] - lower[1])];
  return {
    inclination: deg(Math.atan2(lower[1] - upper[1], rise)),
    caster: deg(Math.atan2(lower[0] - upper[0], rise)),
    scrubRadius: wc[1] - ground[1],
    trail: ground[0] - wc[0],
  };
}

/** Everything the test reads off an independently solved left knuckle at `travel`. */
function solvedKnuckle(sketch: Sketch, travel: number, side: 'left' | 'right' = 'left') {
  const rig = knuckleRig(sketch, side);
  const s = side === 'left' ? 1 : -1;
  const pose = knuckleAt(rig, travel);
  const ids = side === 'left' ? jointsOf(sketch) : { ...jointsOf(sketch), wc: sketch.wheels.right };
  const at = (id: string) => knucklePlace(rig, pose, xyzOf(sketch.points.find((p) => p.id === id)!));
  const [, , roll, pitch, yaw] = pose.q;
  // The outward spin axis at ride is the lateral axis: +y on the left, −y on the right.
  const n = rotate(roll, pitch, yaw, [0, s, 0]);
  const wc = at(ids.wc);
  // Lowest point of the tyre circle: r along the downward vertical projected into the wheel plane.
  const down: V3 = [n[0] * n[2], n[1] * n[2], -1 + n[2] * n[2]];
  const dl = Math.hypot(...down);
  const r = sketch.vehicle.tireRadius;
  const contact = [0, 1, 2].map((i) => wc[i] + (r * down[i]) / dl);
  const ride = xyzOf(sketch.points.find((p) => p.id === ids.wc)!);
  return {
    pose,
    camberChange: deg(Math.atan2(-n[2], s * n[1])),
    toeChange: deg(Math.atan2(n[0], s * n[1])),
    trackChange: s * (wc[1] - ride[1]),
    contactTrackChange: s * (contact[1] - ride[1]),
    kingpin: kingpinByDefinition(at(ids.lower), at(ids.upper), wc, travel),
  };
}

describe('kingpin inclination, scrub radius and trail of the double-wishbone starter at ride (hardpoints only)', () => {
  const sketch = parseSketch(starters['double-wishbone']!.build());
  const r = runSweep(sketch);
  const ids = jointsOf(sketch);
  const p = (id: string) => xyzOf(sketch.points.find((q) => q.id === id)!);
  const want = kingpinByDefinition(p(ids.lower), p(ids.upper), p(ids.wc), 0);

  it('reads the textbook definitions off the ball joints and the contact patch under the wheel centre', () => {
    const kp = r.ride.kingpin!;
    expect(Math.abs(kp.inclination - want.inclination)).toBeLessThan(ANGLE_TOL_DEG);
    expect(Math.abs(kp.caster - want.caster)).toBeLessThan(ANGLE_TOL_DEG);
    expect(Math.abs(kp.scrubRadius - want.scrubRadius)).toBeLessThan(POS_TOL_MM);
    expect(Math.abs(kp.trail - want.trail)).toBeLessThan(POS_TOL_MM);
    // The starter's figures, so the check cannot pass on zeros: an inboard-leaning axis, caster and trail ahead.
    expect(want.inclination).toBeGreaterThan(3);
    expect(want.caster).toBeGreaterThan(1);
    expect(want.trail).toBeGreaterThan(5);
    expect(Math.abs(want.scrubRadius)).toBeGreaterThan(1);
  });
});

describe('the double-wishbone starter against its knuckle solved in the test', () => {
  const sketch = parseSketch(starters['double-wishbone']!.build());
  const r = runSweep(sketch);

  it('camber gain, bump steer, track and the kingpin at +60 mm bump (a knuckle that has turned)', () => {
    const row = r.heave.find((h) => h.travel === 60)!;
    const want = solvedKnuckle(sketch, 60);
    expect(want.pose.worst).toBeLessThan(1e-9);
    // Non-trivial: the short-long arms have turned the knuckle by more than a degree of camber.
    expect(Math.abs(want.camberChange)).toBeGreaterThan(1);
    expect(Math.abs(row.camberChange! - want.camberChange)).toBeLessThan(ANGLE_TOL_DEG);
    expect(Math.abs(row.toeChange! - want.toeChange)).toBeLessThan(ANGLE_TOL_DEG);
    expect(Math.abs(row.trackChange! - want.trackChange)).toBeLessThan(POS_TOL_MM);
    expect(Math.abs(row.contactTrackChange! - want.contactTrackChange)).toBeLessThan(POS_TOL_MM);
    const kp = row.kingpin!;
    expect(Math.abs(kp.inclination - want.kingpin.inclination)).toBeLessThan(ANGLE_TOL_DEG);
    expect(Math.abs(kp.caster - want.kingpin.caster)).toBeLessThan(ANGLE_TOL_DEG);
    expect(Math.abs(kp.scrubRadius - want.kingpin.scrubRadius)).toBeLessThan(POS_TOL_MM);
    expect(Math.abs(kp.trail - want.kingpin.trail)).toBeLessThan(POS_TOL_MM);
  });

  for (const [label, doc] of [
    ['arm bodies', sketch],
    ['two-link wishbones', parseSketch(wishboneArmsAsLinks(starters['double-wishbone']!.build()))],
  ] as const) {
    it(`${label}: camber, toe, track and contact-patch track change at every heave row`, () => {
      const rows = runSweep(doc).heave;
      expect(rows.length).toBeGreaterThan(30);
      for (const row of rows) {
        const want = solvedKnuckle(doc, row.travel);
        const at = `at ${row.travel}`;
        expect(Math.abs(row.camberChange! - want.camberChange), at).toBeLessThan(ANGLE_TOL_DEG);
        expect(Math.abs(row.toeChange! - want.toeChange), at).toBeLessThan(ANGLE_TOL_DEG);
        expect(Math.abs(row.trackChange! - want.trackChange), at).toBeLessThan(POS_TOL_MM);
        expect(Math.abs(row.contactTrackChange! - want.contactTrackChange), at).toBeLessThan(POS_TOL_MM);
        expect(Math.abs(row.casterChange! - (want.kingpin.caster - r.ride.kingpin!.caster)), at).toBeLessThan(
          ANGLE_TOL_DEG,
        );
      }
    });
  }

  for (const [label, doc] of [
    ['arm bodies', sketch],
    ['two-link wishbones', parseSketch(wishboneArmsAsLinks(starters['double-wishbone']!.build()))],
  ] as const) {
    it(`${label}: camber to the ground at every roll row`, () => {
      // The roll sweep lifts each wheel centre by its |y|·tan(roll), the left up for positive roll
      // (docs/sketch-format.md), so the ground under the wheels tilts by the roll: its normal leans towards −y,
      // inboard of the left wheel and outboard of the right. An upright left wheel then leans out from that
      // normal by the roll, the right one in (plane geometry).
      const rows = runSweep(doc).roll;
      expect(rows.filter((x) => x.roll !== 0).length).toBeGreaterThan(4);
      const half = (id: string) => Math.abs(doc.points.find((p) => p.id === id)!.y);
      for (const row of rows) {
        const t = Math.tan(row.roll * DEG);
        const left = solvedKnuckle(doc, half(doc.wheels.left) * t, 'left');
        const right = solvedKnuckle(doc, -half(doc.wheels.right) * t, 'right');
        const at = `at ${row.roll}°`;
        expect(Math.abs(row.camberToGround!.left - (left.camberChange + row.roll)), at).toBeLessThan(ANGLE_TOL_DEG);
        expect(Math.abs(row.camberToGround!.right - (right.camberChange - row.roll)), at).toBeLessThan(ANGLE_TOL_DEG);
        expect(Math.abs(row.trackChange!.left - left.trackChange), at).toBeLessThan(POS_TOL_MM);
        expect(Math.abs(row.trackChange!.right - right.trackChange), at).toBeLessThan(POS_TOL_MM);
      }
    });
  }
});
