/**
 * The steered front axle against poses solved here, not by the sweep's solver.
 *
 * The independent model, from the sketch's hardpoints: the axle's pose is its reference point (the midpoint of
 * the wheel centres, docs/sketch-format.md) moved by (x, y, travel) and turned by R = Rz(yaw)·Ry(pitch)·Rx(roll)
 * (ISO 8855, from memory, unverified), roll imposed; each knuckle is turned about its kingpin (the line through
 * its two axle points, placed with the axle) by one angle θ, by Rodrigues' formula. The six unknowns (x, y,
 * pitch, yaw, θ left, θ right) meet the six length residuals of the two lower links, the upper link, the track
 * bar, the tie rod and the drag link: Gauss–Newton with a central-difference Jacobian and ml-matrix's QR
 * (rigidPose.ts), marched from ride in 10 mm (or 1° of pitman arm) steps to stay on the linkage's branch. The
 * pitman arm's ball is turned about the box's output axis (box pivot to axis point) by Rodrigues' formula, the
 * positive sense the one that moves the ball toward +y (docs/sketch-format.md). A wheel's steer angle is the
 * heading of the line where its wheel plane meets the ground (rigidPose.ts `headingOfSpin`).
 *
 * Checks: the starter's bump steer, lateral shift and caster change over the travel and its steer angles over
 * the pitman arm's swing; a variant whose drag link and track bar are parallel and of equal length (and whose
 * axle translates without turning) steers not at all; raising that variant's pitman ball steers the wheels left
 * in bump and right in droop, the sign reasoned out below.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../shared/kinematics';
import type { Sketch } from '../../shared/schema/sketch';
import {
  add,
  cross,
  DEG,
  gaussNewton,
  headingOfSpin,
  norm,
  rodrigues,
  rotateIso,
  scale,
  sub,
  type V3,
} from './rigidPose';

/** deg: the sweep solves to 1e-6 mm steps; over a 220 mm steering arm that is ~3e-7°, far below this. */
const ANGLE_TOL_DEG = 1e-5;
/** mm: the same convergence on the axle's position */
const LENGTH_TOL_MM = 1e-5;

const starter = (): Sketch => starters['steered-front-axle']!.build();

function rigOf(doc: Sketch) {
  const p = (id: string): V3 => {
    const q = doc.points.find((x) => x.id === id)!;
    return [q.x, q.y, q.z];
  };
  const ref = scale(add(p('WC.l'), p('WC.r')), 0.5);
  const axleLinks = [
    ['LL.fl', 'LL.al'],
    ['LL.fr', 'LL.ar'],
    ['UL.f', 'UL.a'],
    ['TB.f', 'TB.a'],
  ].map(([f, a]) => ({ frame: p(f), axle: p(a), L: norm(sub(p(f), p(a))) }));
  const knuckles = {
    l: { lo: p('KP.ll'), hi: p('KP.ul') },
    r: { lo: p('KP.lr'), hi: p('KP.ur') },
  };
  const pivot = p('SB.p');
  let u = sub(p('SB.a'), pivot);
  u = scale(u, 1 / norm(u));
  const ball0 = p('PM.b');
  // The positive swing moves the ball toward +y.
  if (cross(u, sub(ball0, pivot))[1] < 0) u = scale(u, -1);
  return {
    ref,
    axleLinks,
    knuckles,
    tieRod: { l: p('TA.l'), r: p('TA.r'), L: norm(sub(p('TA.l'), p('TA.r'))) },
    dragLink: { arm: p('SA.l'), L: norm(sub(p('SA.l'), ball0)) },
    ball: (deg: number): V3 => add(pivot, rodrigues(scale(u, deg * DEG), sub(ball0, pivot))),
  };
}

type Rig = ReturnType<typeof rigOf>;
/** q = [x, y, pitch, yaw, θ left, θ right] (mm, rad) */
type Q = number[];

function placeAxle(rig: Rig, q: Q, travel: number, v: V3): V3 {
  return add(add(rig.ref, [q[0], q[1], travel]), rotateIso(0, q[2], q[3], sub(v, rig.ref)));
}

/** The placed kingpin's lower point and unit axis of one knuckle. */
function kingpin(rig: Rig, q: Q, travel: number, s: 'l' | 'r'): { lo: V3; k: V3 } {
  const lo = placeAxle(rig, q, travel, rig.knuckles[s].lo);
  const hi = placeAxle(rig, q, travel, rig.knuckles[s].hi);
  const d = sub(hi, lo);
  return { lo, k: scale(d, 1 / norm(d)) };
}

/** A knuckle point: carried by the axle, then turned about the kingpin by θ. */
function placeKnuckle(rig: Rig, q: Q, travel: number, s: 'l' | 'r', v: V3): V3 {
  const { lo, k } = kingpin(rig, q, travel, s);
  const theta = s === 'l' ? q[4] : q[5];
  return add(lo, rodrigues(scale(k, theta), sub(placeAxle(rig, q, travel, v), lo)));
}

function residuals(rig: Rig, q: Q, travel: number, pitman: number): number[] {
  const out = rig.axleLinks.map(({ frame, axle, L }) => norm(sub(placeAxle(rig, q, travel, axle), frame)) - L);
  const tl = placeKnuckle(rig, q, travel, 'l', rig.tieRod.l);
  const tr = placeKnuckle(rig, q, travel, 'r', rig.tieRod.r);
  out.push(norm(sub(tl, tr)) - rig.tieRod.L);
  const arm = placeKnuckle(rig, q, travel, 'l', rig.dragLink.arm);
  out.push(norm(sub(arm, rig.ball(pitman))) - rig.dragLink.L);
  return out;
}

function solve(rig: Rig, start: Q, travel: number, pitman: number): Q {
  const q = gaussNewton((x) => residuals(rig, x, travel, pitman), start);
  expect(Math.max(...residuals(rig, q, travel, pitman).map(Math.abs))).toBeLessThan(1e-9);
  return q;
}

/** deg, a wheel's steer angle: its spin axis carried by the axle and turned about the kingpin. */
function steerOf(rig: Rig, q: Q, travel: number, s: 'l' | 'r'): number {
  const { k } = kingpin(rig, q, travel, s);
  const spin = rotateIso(0, q[2], q[3], [0, s === 'l' ? 1 : -1, 0]);
  return headingOfSpin(rodrigues(scale(k, s === 'l' ? q[4] : q[5]), spin));
}

/** The solved poses at each value of `along` (travel mm, or pitman deg), marched from ride in `step`s. */
function march(rig: Rig, values: number[], step: number, pose: (v: number) => [number, number]): Map<number, Q> {
  const out = new Map<number, Q>([[0, solve(rig, [0, 0, 0, 0, 0, 0], ...pose(0))]]);
  for (const dir of [1, -1]) {
    let q = out.get(0)!;
    const far = Math.max(0, ...values.map((v) => v * dir));
    for (let v = step; v <= far + 1e-9; v += step) {
      q = solve(rig, q, ...pose(dir * v));
      if (values.includes(dir * v)) out.set(dir * v, q);
    }
  }
  return out;
}

const TRAVELS = [-150, -80, 40, 150];
const heaveMarch = (rig: Rig, travels = TRAVELS) => march(rig, travels, 10, (t) => [t, 0]);

/** deg, the side-view angle from the vertical of the left kingpin, top rearward positive (plain geometry). */
function casterOf(rig: Rig, q: Q, travel: number): number {
  const lo = placeAxle(rig, q, travel, rig.knuckles.l.lo);
  const hi = placeAxle(rig, q, travel, rig.knuckles.l.hi);
  return Math.atan2(lo[0] - hi[0], hi[2] - lo[2]) / DEG;
}

describe('the steered front axle starter in heave', () => {
  const doc = starter();
  const rig = rigOf(doc);
  const result = runSweep(doc);
  const poses = heaveMarch(rig);

  it('gives each wheel the bump steer of the knuckles solved on the axle, the tie rod and the drag link', () => {
    for (const t of TRAVELS) {
      const row = result.heave.find((r) => r.travel === t)!;
      const q = poses.get(t)!;
      expect(Math.abs(row.wheelSteer!.left - steerOf(rig, q, t, 'l')), `left at ${t}`).toBeLessThan(ANGLE_TOL_DEG);
      expect(Math.abs(row.wheelSteer!.right - steerOf(rig, q, t, 'r')), `right at ${t}`).toBeLessThan(ANGLE_TOL_DEG);
    }
    // The figures are not all zero: the starter's drag link is 78 mm longer than its track bar.
    expect(Math.abs(result.heave.at(-1)!.wheelSteer!.left)).toBeGreaterThan(0.1);
  });

  it("gives the track bar's lateral shift and the caster change of the axle solved here", () => {
    const ride = casterOf(rig, poses.get(0)!, 0);
    for (const t of TRAVELS) {
      const row = result.heave.find((r) => r.travel === t)!;
      const q = poses.get(t)!;
      expect(Math.abs(row.lateralShift! - q[1]), `lateral shift at ${t}`).toBeLessThan(LENGTH_TOL_MM);
      expect(Math.abs(row.casterChange! - (casterOf(rig, q, t) - ride)), `caster at ${t}`).toBeLessThan(ANGLE_TOL_DEG);
    }
  });
});

describe('the steered front axle starter turned by its pitman arm', () => {
  const doc = starter();
  const rig = rigOf(doc);
  const steer = runSweep(doc).steer!;
  const SWINGS = [-35, -20, 10, 35];
  const poses = march(rig, SWINGS, 1, (deg) => [0, deg]);

  it('reports the pitman arm, not a rack, and reaches the swing asked for each way', () => {
    expect(steer.input).toBe('pitman');
    expect(steer.rows.every((r) => r.rack === undefined && typeof r.pitman === 'number')).toBe(true);
    expect(steer.pitmanArm).toMatchObject({ min: -35, max: 35, ball: 'PM.b' });
  });

  it('turns each wheel by the angle of the knuckles solved with the ball swung about the box axis', () => {
    for (const deg of SWINGS) {
      const row = steer.rows.find((r) => r.pitman === deg)!;
      const q = poses.get(deg)!;
      expect(Math.abs(row.leftSteer - steerOf(rig, q, 0, 'l')), `left at ${deg}°`).toBeLessThan(ANGLE_TOL_DEG);
      expect(Math.abs(row.rightSteer - steerOf(rig, q, 0, 'r')), `right at ${deg}°`).toBeLessThan(ANGLE_TOL_DEG);
    }
    // A positive swing pushes the drag link to the left, and the steering arm reaches forward: both wheels turn left.
    const lock = steer.rows.at(-1)!;
    expect(lock.leftSteer).toBeGreaterThan(20);
    expect(lock.rightSteer).toBeGreaterThan(20);
  });
});

/**
 * The starter made "ideal": the upper link given the lower links' own vector (frame end minus axle end), so all
 * three links are parallel and of equal length and the axle only translates in heave; and the pitman ball moved
 * (with its box) to the steering arm's point less the track bar's vector, so the drag link is the track bar
 * shifted: parallel and of equal length.
 */
function parallelVariant(raiseBall = 0): Sketch {
  const doc = structuredClone(starter());
  const pt = (id: string) => doc.points.find((p) => p.id === id)!;
  const v = (id: string): V3 => [pt(id).x, pt(id).y, pt(id).z];
  const move = (id: string, to: V3) => Object.assign(pt(id), { x: to[0], y: to[1], z: to[2] });
  move('UL.f', add(v('UL.a'), sub(v('LL.fl'), v('LL.al'))));
  const shift = add(sub(sub(v('SA.l'), sub(v('TB.a'), v('TB.f'))), v('PM.b')), [0, 0, raiseBall]);
  for (const id of ['PM.b', 'SB.p', 'SB.a']) move(id, add(v(id), shift));
  return doc;
}

describe('bump steer of the drag link against the track bar', () => {
  it('is zero when the two are parallel and of equal length', () => {
    const doc = parallelVariant();
    const rig = rigOf(doc);
    // The variant is what it says: the drag link is the track bar's vector, shifted.
    const drag = sub(rig.dragLink.arm, rig.ball(0));
    const bar = sub(rig.axleLinks[3].axle, rig.axleLinks[3].frame);
    expect(norm(sub(drag, bar))).toBeLessThan(1e-9);
    // Zero steer meets every length exactly as the axle translates (the arm moves with the axle, and the drag
    // link stays the track bar shifted), so the sweep's figure is zero to its convergence (ANGLE_TOL_DEG).
    const result = runSweep(doc);
    expect(result.heave.length).toBeGreaterThan(50);
    for (const row of result.heave) {
      expect(Math.abs(row.wheelSteer!.left), `left at ${row.travel}`).toBeLessThan(ANGLE_TOL_DEG);
      expect(Math.abs(row.wheelSteer!.right), `right at ${row.travel}`).toBeLessThan(ANGLE_TOL_DEG);
    }
    // The independent solve agrees: no knuckle turn at either end of the travel.
    const poses = heaveMarch(rig, [-150, 150]);
    for (const t of [-150, 150]) expect(Math.abs(steerOf(rig, poses.get(t)!, t, 'l'))).toBeLessThan(1e-7);
    expect(result.warnings.some((w) => /steer by themselves/.test(w))).toBe(false);
  });

  /*
   * Raising the pitman ball by h tilts the drag link against the track bar. Its arm end A and ball B keep their
   * distance: (A − B)·dA = 0, so with A a lateral run ΔY = A.y − B.y > 0 to the left of B and a rise
   * ΔZ = A.z − B.z, the arm end moves sideways by dA.y = −(ΔZ/ΔY)·dA.z as it rises (the fore-aft run is nil here).
   * The track bar moves the axle by the same rule with its own rise, equal to the drag link's in the parallel
   * variant; raising B lowers ΔZ by h, so in bump (dA.z > 0) the arm end is pushed toward +y against the axle
   * by (h/ΔY)·travel. The steering arm reaches forward of the kingpin, so a push to the left turns the knuckle's
   * nose left: positive steer in bump, negative in droop, about (h/ΔY)·travel / arm length radians at first order.
   */
  it('turns the wheels left in bump and right in droop when the pitman ball is raised', () => {
    const h = 60;
    const doc = parallelVariant(h);
    const rig = rigOf(doc);
    const result = runSweep(doc);
    const poses = heaveMarch(rig);
    for (const t of TRAVELS) {
      const row = result.heave.find((r) => r.travel === t)!;
      const q = poses.get(t)!;
      expect(Math.sign(row.wheelSteer!.left), `sign at ${t}`).toBe(Math.sign(t));
      expect(Math.sign(row.wheelSteer!.right), `sign at ${t}`).toBe(Math.sign(t));
      expect(Math.abs(row.wheelSteer!.left - steerOf(rig, q, t, 'l')), `left at ${t}`).toBeLessThan(ANGLE_TOL_DEG);
      expect(Math.abs(row.wheelSteer!.right - steerOf(rig, q, t, 'r')), `right at ${t}`).toBeLessThan(ANGLE_TOL_DEG);
    }
    // The first-order size: ΔY and the arm's reach forward of the kingpin from the hardpoints.
    const dy = rig.dragLink.arm[1] - rig.ball(0)[1];
    const { lo, k } = kingpin(rig, [0, 0, 0, 0, 0, 0], 0, 'l');
    const reach = norm(cross(k, sub(rig.dragLink.arm, lo)));
    const estimate = ((h / dy) * 40) / reach / DEG;
    const at40 = result.heave.find((r) => r.travel === 40)!.wheelSteer!.left;
    // Within a quarter of the first-order figure at 40 mm (the second-order terms grow with the travel).
    expect(Math.abs(at40 - estimate) / estimate).toBeLessThan(0.25);
  });
});
