/**
 * The roll sweep of solid axles against poses solved in the test (independentPose.ts: Gauss–Newton least squares
 * over the links' length residuals, from the sketch's hardpoints; the axle's reference point held at ride height
 * and the roll imposed, as docs/sketch-format.md "How a row is solved" states):
 * - roll steer, 100 · yaw / roll, and each wheel centre's travel at every roll row;
 * - bind: where the links over-constrain the axle, the least-squares pose leaves some link unable to hold its
 *   length; the largest residual left is the bind (docs/sketch-format.md), found here by the same least squares
 *   written independently;
 * - the triangulated four-link's roll centre: the axle turns, for a small roll, about its instantaneous screw
 *   axis, the line of points whose velocity is along the angular velocity ω: p = ref + (ω × v_ref)/|ω|² (Chasles'
 *   theorem; any rigid-body kinematics text — from memory, unverified). Every link's axle end moves square to
 *   the link, so that axis meets every link line; for a sketch symmetric about y = 0 the two upper links' lines
 *   cross on the centreline, the two lowers' too, and the axis is the line through both crossings (the plan-view
 *   construction of docs/sketch-format.md). The roll centre is its height where it crosses the vertical cross
 *   plane through the wheel centres. Here the axis comes from the motion, not from the link lines.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../shared/kinematics';
import { parseSketch, type Sketch } from '../../shared/schema/sketch';
import { axleAt, axlePlace, axleRig, axleSolve, DEG, rotate, xyzOf, type V3 } from './independentPose';

/** %: roll steer from two solves that each converge to 1e-12 mm (the sweep's to 1e-6 mm over ~1 m of links). */
const STEER_TOL = 1e-3;
/** mm */
const POS_TOL_MM = 1e-5;

describe('roll sweep of the coil-sprung solid axles against poses solved in the test', () => {
  for (const layout of ['three-link-lateral-rod', 'four-link-lateral-rod', 'triangulated-four-link'] as const) {
    const sketch = parseSketch(starters[layout]!.build());
    const r = runSweep(sketch);
    const rig = axleRig(sketch);

    it(`${layout}: roll steer, wheel travel and bind at every roll row`, () => {
      const rolled = r.roll.filter((x) => x.roll !== 0);
      expect(rolled.length).toBeGreaterThan(6);
      const wl = xyzOf(sketch.points.find((p) => p.id === sketch.wheels.left)!);
      for (const row of r.roll) {
        const pose = axleAt(rig, 0, row.roll * DEG);
        const at = `at ${row.roll}°`;
        if (row.roll !== 0) {
          const steer = (100 * pose.q[3]) / (row.roll * DEG);
          expect(Math.abs(row.rollSteer! - steer), at).toBeLessThan(STEER_TOL);
        }
        expect(Math.abs(row.leftTravel - (axlePlace(rig, pose, wl)[2] - wl[2])), at).toBeLessThan(POS_TOL_MM);
        expect(Math.abs(row.bind - pose.worst), at).toBeLessThan(POS_TOL_MM);
      }
    });
  }
});

describe('a link that cannot hold its length in roll (bind)', () => {
  // The four-link starter with its left upper link's frame end moved 60 mm outboard: the upper links no longer
  // lie as the lowers do, and four links and a rod (five lengths) cannot all be held as the axle rolls (four free
  // coordinates).
  const doc = starters['four-link-lateral-rod']!.build();
  const upper = doc.members.find((m) => m.kind === 'link' && m.group === 'upper')!;
  const frameEnd = [upper.a, upper.b].find((id) => doc.points.find((p) => p.id === id)!.body === 'frame')!;
  const bent = parseSketch({
    ...doc,
    points: doc.points.map((p) => (p.id === frameEnd ? { ...p, y: p.y + Math.sign(p.y) * 60 } : p)),
    sweep: { ...doc.sweep, bindThreshold: 0.5 },
  });
  const r = runSweep(bent);
  const rig = axleRig(bent);

  it('leaves the bind the least squares leaves, and flags it where it passes the threshold', () => {
    const worst = r.roll.map((row) => ({ roll: row.roll, bind: axleAt(rig, 0, row.roll * DEG).worst }));
    for (const [i, row] of r.roll.entries()) {
      expect(Math.abs(row.bind - worst[i].bind), `at ${row.roll}°`).toBeLessThan(POS_TOL_MM);
    }
    const most = Math.max(...worst.map((w) => w.bind));
    expect(most).toBeGreaterThan(0.5);
    // Where the independently found bind crosses the threshold, interpolated between the rows on each side
    // (docs/sketch-format.md: events are interpolated where a limit is crossed between rows).
    const crossing = (sign: 1 | -1) => {
      const side = worst.filter((w) => sign * w.roll >= 0).sort((p, q) => sign * (p.roll - q.roll));
      const k = side.findIndex((w) => w.bind > 0.5);
      const [p, q] = [side[k - 1], side[k]];
      return p.roll + ((0.5 - p.bind) / (q.bind - p.bind)) * (q.roll - p.roll);
    };
    const flags = r.limits.events.filter((e) => e.kind === 'bind' && e.sweep === 'roll');
    expect(flags.map((e) => e.at).sort((p, q) => p - q)).toHaveLength(2);
    for (const sign of [1, -1] as const) {
      const want = crossing(sign);
      expect(flags.some((e) => Math.abs(e.at - want) < 1e-4)).toBe(true);
    }
  });
});

/** The roll centre at `travel` from the screw axis of a ±δ roll of the independently solved axle. */
function screwRollCentre(sketch: Sketch, travel: number) {
  const rig = axleRig(sketch);
  const d = 0.05 * DEG;
  const mid = axleAt(rig, travel);
  const up = axleSolve(rig, travel, d, mid.q),
    dn = axleSolve(rig, travel, -d, mid.q);
  // ω from M = R_up·R_dnᵀ ≈ I + 2δ·[ω]×: its skew part, per rad of roll.
  const basis: V3[] = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
  const turn = (pose: typeof up, v: V3) => rotate(pose.roll, pose.q[2], pose.q[3], v);
  const M = [0, 1, 2].map((i) =>
    [0, 1, 2].map((j) => basis.reduce((acc, e) => acc + turn(up, e)[i] * turn(dn, e)[j], 0)),
  );
  const w: V3 = [
    (M[2][1] - M[1][2]) / 2 / (2 * d),
    (M[0][2] - M[2][0]) / 2 / (2 * d),
    (M[1][0] - M[0][1]) / 2 / (2 * d),
  ];
  // Velocity of the axle's reference point, which sits at `o` in the mid pose.
  const o = axlePlace(rig, mid, rig.ref);
  const a = axlePlace(rig, up, rig.ref),
    b = axlePlace(rig, dn, rig.ref);
  const v: V3 = [0, 1, 2].map((i) => (a[i] - b[i]) / (2 * d)) as V3;
  const w2 = w[0] ** 2 + w[1] ** 2 + w[2] ** 2;
  const c: V3 = [w[1] * v[2] - w[2] * v[1], w[2] * v[0] - w[0] * v[2], w[0] * v[1] - w[1] * v[0]];
  const p: V3 = [o[0] + c[0] / w2, o[1] + c[1] / w2, o[2] + c[2] / w2];
  // Along the axis to the vertical cross plane through the wheel centres (x of the reference point).
  const t = (o[0] - p[0]) / w[0];
  return { y: p[1] + t * w[1], z: p[2] + t * w[2], omega: w };
}

/**
 * mm: the ±0.05° central difference leaves a term of order δ² in the axis (measured 8e-5 mm on the starter); the
 * solves converge to 1e-12 mm here and 1e-6 mm in the sweep.
 */
const RC_TOL_MM = 1e-3;

describe('the triangulated four-link’s roll centre from the screw axis of its motion', () => {
  const sketch = parseSketch(starters['triangulated-four-link']!.build());
  const r = runSweep(sketch);

  it('is where the axle’s instantaneous roll axis crosses the wheel centres’ cross plane, from droop to bump', () => {
    for (const travel of [-100, -50, 0, 50, 100]) {
      const row = r.heave.find((h) => h.travel === travel)!;
      const want = screwRollCentre(sketch, travel);
      // Mostly a roll: the axis runs fore-aft.
      expect(Math.abs(want.omega[0])).toBeGreaterThan(0.9 * Math.hypot(...want.omega));
      expect(Math.abs(want.y), `y at ${travel}`).toBeLessThan(1e-3);
      expect(Math.abs(row.rollCenterHeight! - want.z), `at ${travel}`).toBeLessThan(RC_TOL_MM);
    }
  });
});
