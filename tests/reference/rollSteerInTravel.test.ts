/**
 * Roll steer through the travel (heave rows' `rollSteerInTravel`) against poses solved here.
 *
 * Independent check: the axle's pose is solved in this test by Gauss–Newton least squares over the
 * links' length residuals |P − F| − L (ml-matrix QR, numerical Jacobian), not by the sweep's solver:
 * the axle reference point (the midpoint of the wheel centres, docs/sketch-format.md) held at the
 * travel, the roll imposed, fore-aft, sideways, pitch and yaw free; the rotation is the ISO 8855
 * yaw–pitch–roll sequence R = Rz(yaw)·Ry(pitch)·Rx(roll) (ISO 8855, from memory, unverified). The
 * travel is reached in 10 mm steps from ride (each solve starting from the last, to stay on the
 * linkage's branch); roll steer is then the central difference 100·(yaw(+δ) − yaw(−δ))/(2δ) of two
 * poses solved at ±δ of roll.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../shared/kinematics';
import { parseSketch, type Sketch } from '../../shared/schema/sketch';
import { DEG, gaussNewton, rotateIso, type V3 } from './rigidPose';

/** deg of roll for the central difference */
const DELTA = 0.1;
/** % roll steer: the sweep's slope at roll 0 against a ±0.1° difference (a third-order term apart) */
const TOL = 0.01;

/** The axle's links as frame point, axle point (relative to the reference) and length. */
function axleLinks(sketch: Sketch) {
  const at = new Map(sketch.points.map((p) => [p.id, p]));
  const wl = at.get(sketch.wheels.left)!,
    wr = at.get(sketch.wheels.right)!;
  const ref: V3 = [(wl.x + wr.x) / 2, (wl.y + wr.y) / 2, (wl.z + wr.z) / 2];
  const links = sketch.members
    .filter((m) => m.kind === 'link' || m.kind === 'lateral-rod')
    .map((m) => {
      const [a, b] = [at.get(m.a)!, at.get(m.b)!];
      const [frame, axle] = a.body === 'frame' ? [a, b] : [b, a];
      expect(frame.body).toBe('frame');
      expect(axle.body).toBe('axle');
      const local: V3 = [axle.x - ref[0], axle.y - ref[1], axle.z - ref[2]];
      return { F: [frame.x, frame.y, frame.z] as V3, local, L: Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z) };
    });
  return { ref, links };
}

/** Residuals for q = [x, y, pitch, yaw] (mm, rad) at a travel (mm) and roll (rad). */
function residuals(rig: ReturnType<typeof axleLinks>, q: number[], travel: number, roll: number): number[] {
  return rig.links.map(({ F, local, L }) => {
    const r = rotateIso(roll, q[2], q[3], local);
    const P = [rig.ref[0] + q[0] + r[0], rig.ref[1] + q[1] + r[1], rig.ref[2] + travel + r[2]];
    return Math.hypot(P[0] - F[0], P[1] - F[1], P[2] - F[2]) - L;
  });
}

function solvePose(rig: ReturnType<typeof axleLinks>, start: number[], travel: number, roll: number): number[] {
  return gaussNewton((q) => residuals(rig, q, travel, roll), start);
}

/** % roll steer at a travel, by central difference of independently solved poses. */
function independentRollSteer(sketch: Sketch, travel: number): number {
  const rig = axleLinks(sketch);
  let q = [0, 0, 0, 0];
  const steps = Math.round(Math.abs(travel) / 10);
  for (let k = 1; k <= steps; k++) q = solvePose(rig, q, (travel * k) / steps, 0);
  const up = solvePose(rig, q, travel, DELTA * DEG),
    dn = solvePose(rig, q, travel, -DELTA * DEG);
  return (100 * (up[3] - dn[3])) / DEG / (2 * DELTA);
}

describe('roll steer through the travel', () => {
  for (const layout of ['three-link-lateral-rod', 'four-link-lateral-rod'] as const) {
    const doc = starters[layout]!.build();
    const sketch = parseSketch(doc);
    const r = runSweep(doc);

    it(`${layout}: matches the independently solved poses from droop to bump`, () => {
      for (const travel of [-150, -100, -50, 0, 50, 100, 150]) {
        const row = r.heave.find((x) => x.travel === travel)!;
        expect(row.rollSteerInTravel).not.toBeNull();
        expect(Math.abs(row.rollSteerInTravel! - independentRollSteer(sketch, travel))).toBeLessThan(TOL);
      }
    });

    it(`${layout}: equals the roll sweep's roll steer at ride (a roll sweep of ±0.1° run on its own)`, () => {
      const small = runSweep({ ...doc, sweep: { ...doc.sweep, roll: 0.1, rollStep: 0.1 } });
      const steer = small.roll.filter((x) => x.roll !== 0).map((x) => x.rollSteer!);
      expect(steer).toHaveLength(2);
      const ride = r.heave.find((x) => x.travel === 0)!.rollSteerInTravel!;
      expect(Math.abs(ride - (steer[0] + steer[1]) / 2)).toBeLessThan(TOL);
    });
  }

  it('four-link: runs from about 28 % at full droop to about −6 % at full bump', () => {
    const r = runSweep(starters['four-link-lateral-rod']!.build());
    expect(r.heave[0].travel).toBe(-150);
    expect(r.heave[0].rollSteerInTravel).toBeGreaterThan(25);
    expect(r.heave.at(-1)!.rollSteerInTravel).toBeLessThan(-4);
  });

  it('is not given for an independent layout, nor in a heave-only sweep', () => {
    expect(runSweep(starters['double-wishbone']!.build()).heave[0].rollSteerInTravel).toBeUndefined();
    const heaveOnly = runSweep(starters['four-link-lateral-rod']!.build(), { heaveOnly: true });
    expect(heaveOnly.heave[0].rollSteerInTravel).toBeUndefined();
  });
});
