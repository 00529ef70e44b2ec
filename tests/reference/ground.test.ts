/**
 * The ground under the wheels against closed forms of circle and plane geometry, each worked out
 * here from the rig's own dimensions (not from the sweep's code):
 * - A knuckle that translates without turning (the parallelogram rig) carries its tyre circle
 *   along unturned, so its lowest point stays straight below the wheel centre: the contact patch's
 *   track change equals the wheel centre's, sqrt(L² − t²) − L for an arm of length L lifted by t.
 *   In roll both circles stay upright, so the ground is the line through the two points straight
 *   below the centres, and each wheel's camber to it is that line's tilt (plain plane geometry).
 * - A swing axle (a hinge along x) turns its wheel in the rear view by the arm's angle Δβ; the
 *   wheel's top then points along (0, −sin Δβ, cos Δβ), so the lowest point of a circle of radius
 *   r in a plane containing x sits r along minus that top direction whatever the ground's tilt:
 *   the contact point moves r·sin Δβ = −r·sin(camber) outward of the centre (circle geometry).
 * - A solid axle in pure heave with the body held still: the ground rises with the axle, so a
 *   height above it is the body-fixed z minus the travel, less any gap between the wheel centre's
 *   ride height and the tyre radius (closed form).
 * - A solid axle rolled: the axle is rolled in the test (independentPose.ts, Gauss–Newton least squares
 *   from the hardpoints), the ground under it found by an independent search (bisection on its tilt,
 *   each tyre's lowest point by sampling its circle and golden-section refinement), the roll centre from
 *   the lateral rod's ends on that axle, and its height by the distance from a point to a line.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../shared/kinematics';
import type { SweepResult } from '../../shared/kinematics';
import { parseSketch, type SketchInput } from '../../shared/schema/sketch';
import { axleAt, axlePoints, axleRig, DEG, rotate } from './independentPose';
import { parallelogram, wishboneSketch } from './wishboneRigs';

/** mm: the solver's convergence (1e-6 mm) with round-off through a few hundred mm of lever. */
const POS_TOL_MM = 1e-5;
/** deg */
const ANGLE_TOL_DEG = 1e-6;

const deg = (r: number) => (r * 180) / Math.PI;
type YZ = { y: number; z: number };

function sweepOf(doc: SketchInput): SweepResult {
  return runSweep(parseSketch(doc));
}

/** The ground line through two contact points (rear view): upward unit normal, unit direction to the left. */
function lineThrough(l: YZ, r: YZ) {
  const len = Math.hypot(l.y - r.y, l.z - r.z);
  const e = { y: (l.y - r.y) / len, z: (l.z - r.z) / len };
  return { e, n: { y: -e.z, z: e.y }, l, r };
}
type Line = ReturnType<typeof lineThrough>;
const above = (g: Line, p: YZ) => (p.y - g.l.y) * g.n.y + (p.z - g.l.z) * g.n.z;
/** Distance along the ground from where y = 0 meets it, outward positive. */
function alongGround(g: Line, side: 'left' | 'right') {
  const t = -g.l.y / g.e.y;
  const f = { y: g.l.y + t * g.e.y, z: g.l.z + t * g.e.z };
  const p = side === 'left' ? g.l : g.r;
  const s = (p.y - f.y) * g.e.y + (p.z - f.z) * g.e.z;
  return side === 'left' ? s : -s;
}

describe('a knuckle that translates without turning (parallelogram rig)', () => {
  const rig = parallelogram;
  const L = rig.lowerJoint[0] - rig.lowerInner[0];
  const result = sweepOf(wishboneSketch(rig));

  it('moves its contact patch as its wheel centre in heave: sqrt(L² − t²) − L (plain geometry)', () => {
    for (const row of result.heave) {
      const t = row.travel;
      const expected = Math.sqrt(L * L - t * t) - L;
      expect(row.trackChange!).toBeCloseTo(expected, 5);
      expect(Math.abs(row.contactTrackChange! - expected)).toBeLessThan(POS_TOL_MM);
    }
  });

  it('stands on the line through the points below its centres in roll: track along it and camber by its tilt', () => {
    const half = rig.wheel[0];
    for (const row of result.roll) {
      // The sweep lifts the left wheel centre by half·tan(roll) and drops the right as much (docs/sketch-format.md).
      const lift = half * Math.tan((row.roll * Math.PI) / 180);
      const y = half - L + Math.sqrt(L * L - lift * lift);
      // Both circles stay upright: their lowest points are r below the centres, (±y, ±lift); the line runs through the origin.
      const along = Math.hypot(y, lift);
      expect(Math.abs(row.contactTrackChange!.left - (along - half))).toBeLessThan(POS_TOL_MM);
      expect(Math.abs(row.contactTrackChange!.right - (along - half))).toBeLessThan(POS_TOL_MM);
      expect(Math.abs(row.trackChange!.left - (y - half))).toBeLessThan(POS_TOL_MM);
      const tilt = deg(Math.atan2(lift, y));
      expect(Math.abs(row.groundCamber!.left - tilt)).toBeLessThan(ANGLE_TOL_DEG);
      expect(Math.abs(row.groundCamber!.right + tilt)).toBeLessThan(ANGLE_TOL_DEG);
    }
  });
});

/** A swing axle: each wheel on an arm turning about a fore-aft hinge at (±hy, hz). */
const SWING = { half: 800, wheelZ: 400, hy: 100, hz: 350, tyre: 400 };
function swingAxle(): SketchInput {
  const points: SketchInput['points'] = [];
  const members: SketchInput['members'] = [];
  for (const [s, sign, body] of [
    ['l', 1, 'arm-left'],
    ['r', -1, 'arm-right'],
  ] as const) {
    points.push(
      { id: `WC.${s}`, body, x: 0, y: sign * SWING.half, z: SWING.wheelZ },
      { id: `AR.${s}`, body, x: 0, y: sign * 400, z: 300 },
      { id: `HF.${s}`, body: 'frame', x: 300, y: sign * SWING.hy, z: SWING.hz },
      { id: `HR.${s}`, body: 'frame', x: -300, y: sign * SWING.hy, z: SWING.hz },
    );
    members.push({ id: `H${s}`, kind: 'hinge', body, a: `HF.${s}`, b: `HR.${s}` });
  }
  return {
    format: 'arcwright.sketch',
    version: 1,
    name: 'Swing axle rig',
    layout: 'trailing-arm',
    vehicle: { wheelbase: 2600, cgHeight: 500, track: 2 * SWING.half, tireRadius: SWING.tyre },
    points,
    members,
    wheels: { left: 'WC.l', right: 'WC.r' },
    sweep: { droop: -80, bump: 80, step: 10, roll: 4, rollStep: 1 },
  };
}

/** The swing arm with its wheel centre at height z: the centre's y and the arm's turn Δβ from ride (rad). */
function swingArm(z: number, side: 1 | -1) {
  const rho = Math.hypot(SWING.half - SWING.hy, SWING.wheelZ - SWING.hz);
  const y = side * (SWING.hy + Math.sqrt(rho * rho - (z - SWING.hz) ** 2));
  const beta = (yy: number, zz: number) => Math.atan2(zz - SWING.hz, yy - side * SWING.hy);
  return { y, turn: beta(y, z) - beta(side * SWING.half, SWING.wheelZ) };
}

/** Lowest point of the swing arm's tyre: r along minus its top direction (0, −sin Δβ, cos Δβ). */
function swingContact(z: number, side: 1 | -1): YZ {
  const { y, turn } = swingArm(z, side);
  return { y: y + SWING.tyre * Math.sin(turn), z: z - SWING.tyre * Math.cos(turn) };
}

describe('a swing axle turning its wheels about fore-aft hinges', () => {
  const result = sweepOf(swingAxle());
  const r = SWING.tyre;

  it('moves the contact patch r·sin(Δβ) outward of the wheel centre, i.e. −r·sin(camber change) (circle geometry)', () => {
    for (const row of result.heave) {
      const z = SWING.wheelZ + row.travel;
      const { y, turn } = swingArm(z, 1);
      expect(Math.abs(row.camberChange! + deg(turn))).toBeLessThan(ANGLE_TOL_DEG);
      expect(Math.abs(row.trackChange! - (y - SWING.half))).toBeLessThan(POS_TOL_MM);
      const contact = swingContact(z, 1);
      expect(Math.abs(row.contactTrackChange! - (contact.y - SWING.half))).toBeLessThan(POS_TOL_MM);
      const camber = (row.camberChange! * Math.PI) / 180;
      expect(Math.abs(row.contactTrackChange! - row.trackChange! + r * Math.sin(camber))).toBeLessThan(POS_TOL_MM);
    }
  });

  it('measures the roll centre from the ground under the cambered tyres, not from the travel (plane geometry)', () => {
    for (const row of result.heave) {
      const ground = swingContact(SWING.wheelZ + row.travel, 1).z;
      expect(Math.abs(row.rollCenterAboveGround! - (row.rollCenterHeight! - ground))).toBeLessThan(POS_TOL_MM);
    }
  });

  it('stands on the line through both contact points in roll: track, camber and roll centre read from it', () => {
    const rolled = result.roll.filter((row) => row.roll !== 0);
    expect(rolled.length).toBeGreaterThan(4);
    for (const row of result.roll) {
      const lift = SWING.half * Math.tan((row.roll * Math.PI) / 180);
      const cl = swingContact(SWING.wheelZ + lift, 1);
      const cr = swingContact(SWING.wheelZ - lift, -1);
      const g = lineThrough(cl, cr);
      expect(Math.abs(row.contactTrackChange!.left - (alongGround(g, 'left') - SWING.half))).toBeLessThan(POS_TOL_MM);
      expect(Math.abs(row.contactTrackChange!.right - (alongGround(g, 'right') - SWING.half))).toBeLessThan(POS_TOL_MM);
      // Outward spin axes: the left one turned by Δβ about x, (0, cos, sin); the right one (0, −cos, −sin).
      for (const [side, sign, z] of [
        ['left', 1, SWING.wheelZ + lift],
        ['right', -1, SWING.wheelZ - lift],
      ] as const) {
        const { turn } = swingArm(z, sign);
        const axis = { y: sign * Math.cos(turn), z: sign * Math.sin(turn) };
        const camber = deg(Math.asin(-(axis.y * g.n.y + axis.z * g.n.z)));
        expect(Math.abs(row.groundCamber![side] - camber), `${side} at ${row.roll}°`).toBeLessThan(ANGLE_TOL_DEG);
      }
      if (row.rollCenter)
        expect(Math.abs(row.rollCenterAboveGround! - above(g, row.rollCenter))).toBeLessThan(POS_TOL_MM);
    }
  });
});

describe('a solid axle (the four-link starter)', () => {
  const doc = starters['four-link-lateral-rod']!.build();
  const wheel = doc.points.find((p) => p.id === doc.wheels.left)!;

  it('in pure heave reads heights above the ground as body-fixed z minus the travel (closed form)', () => {
    const result = sweepOf(doc);
    expect(wheel.z).toBe(doc.vehicle.tireRadius);
    for (const row of result.heave) {
      expect(Math.abs(row.rollCenterAboveGround! - (row.rollCenterHeight! - row.travel))).toBeLessThan(POS_TOL_MM);
      if (row.instantCenter)
        expect(Math.abs(row.instantCenterAboveGround! - (row.instantCenter.z - row.travel))).toBeLessThan(POS_TOL_MM);
    }
  });

  it('takes the ground from the tyre radius: wheel centres 20 mm above it put the ground 20 mm up (closed form)', () => {
    const result = sweepOf({ ...doc, vehicle: { ...doc.vehicle, tireRadius: wheel.z - 20 } });
    for (const row of result.heave) {
      const expected = row.rollCenterHeight! - row.travel - 20;
      expect(Math.abs(row.rollCenterAboveGround! - expected)).toBeLessThan(POS_TOL_MM);
    }
  });

  it('rolled, measures the rod roll centre square to the ground found by an independent search (plane geometry)', () => {
    const sketch = parseSketch(doc);
    const result = runSweep(sketch);
    const rod = sketch.members.find((m) => m.kind === 'lateral-rod')!;
    const rig = axleRig(sketch);
    const rolled = result.roll.filter((row) => Math.abs(row.roll) > 2);
    expect(rolled.length).toBeGreaterThan(2);
    for (const row of rolled) {
      // The axle rolled in the test (independentPose.ts), not the sweep's pose: its lateral axis is both tyres' spin axis.
      const pose = axleAt(rig, 0, row.roll * DEG);
      const at = axlePoints(sketch, rig, pose);
      const [ax, ay, az] = rotate(pose.roll, pose.q[2], pose.q[3], [0, 1, 0]);
      const axis = { x: ax, y: ay, z: az };
      const g = groundBySearch(
        [at[sketch.wheels.left], at[sketch.wheels.right]],
        axis,
        sketch.vehicle.tireRadius,
        (row.roll * Math.PI) / 180,
      );
      const a = at[rod.a],
        b = at[rod.b];
      const rc = { y: 0, z: a.z + ((0 - a.y) * (b.z - a.z)) / (b.y - a.y) };
      expect(Math.abs(row.rollCenterAboveGround! - above(g, rc)), `at ${row.roll}°`).toBeLessThan(1e-4);
    }
  });
});

/**
 * The ground under two tyres on one spin axis, found by search: for a tilt θ of the ground the
 * lowest point of each circle (sampled every degree, then refined by golden section) gives its
 * height along the ground's normal; bisection on θ makes the two heights equal.
 */
function groundBySearch(
  centres: [{ x: number; y: number; z: number }, { x: number; y: number; z: number }],
  axis: { x: number; y: number; z: number },
  radius: number,
  guess: number,
): Line {
  const len = Math.hypot(axis.x, axis.y, axis.z);
  const a = { x: axis.x / len, y: axis.y / len, z: axis.z / len };
  // Two unit vectors spanning the wheel plane.
  const t0 = Math.abs(a.x) < 0.9 ? { x: 1, y: 0, z: 0 } : { x: 0, y: 0, z: 1 };
  const d = t0.x * a.x + t0.y * a.y + t0.z * a.z;
  const u0 = { x: t0.x - d * a.x, y: t0.y - d * a.y, z: t0.z - d * a.z };
  const ul = Math.hypot(u0.x, u0.y, u0.z);
  const u = { x: u0.x / ul, y: u0.y / ul, z: u0.z / ul };
  const v = { x: a.y * u.z - a.z * u.y, y: a.z * u.x - a.x * u.z, z: a.x * u.y - a.y * u.x };
  const onCircle = (c: { y: number; z: number }, s: number): YZ => ({
    y: c.y + radius * (Math.cos(s) * u.y + Math.sin(s) * v.y),
    z: c.z + radius * (Math.cos(s) * u.z + Math.sin(s) * v.z),
  });
  const lowest = (c: { y: number; z: number }, theta: number): YZ => {
    const n = { y: -Math.sin(theta), z: Math.cos(theta) };
    const h = (s: number) => {
      const p = onCircle(c, s);
      return p.y * n.y + p.z * n.z;
    };
    let best = 0;
    for (let k = 1; k < 360; k++) if (h((k * Math.PI) / 180) < h((best * Math.PI) / 180)) best = k;
    let lo = ((best - 1) * Math.PI) / 180,
      hi = ((best + 1) * Math.PI) / 180;
    const phi = (Math.sqrt(5) - 1) / 2;
    for (let k = 0; k < 200; k++) {
      const m1 = hi - phi * (hi - lo),
        m2 = lo + phi * (hi - lo);
      if (h(m1) < h(m2)) hi = m2;
      else lo = m1;
    }
    return onCircle(c, (lo + hi) / 2);
  };
  // Difference of the two lowest points' heights along the normal of tilt θ: zero on the ground.
  const gap = (theta: number) => {
    const l = lowest(centres[0], theta),
      r = lowest(centres[1], theta);
    return (l.y - r.y) * -Math.sin(theta) + (l.z - r.z) * Math.cos(theta);
  };
  let lo = guess - 0.2,
    hi = guess + 0.2;
  expect(Math.sign(gap(lo))).not.toBe(Math.sign(gap(hi)));
  for (let k = 0; k < 100; k++) {
    const mid = (lo + hi) / 2;
    if (Math.sign(gap(mid)) === Math.sign(gap(lo))) lo = mid;
    else hi = mid;
  }
  const theta = (lo + hi) / 2;
  return lineThrough(lowest(centres[0], theta), lowest(centres[1], theta));
}
