/**
 * Roll steer through the travel (heave rows' `rollSteerInTravel`) against poses solved here.
 *
 * Independent check: the axle's pose is solved by Gauss–Newton least squares over the links' length
 * residuals |P − F| − L (ml-matrix QR, numerical Jacobian; independentPose.ts), not by the sweep's solver:
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
import { axleAt, axleRig, axleSolve, DEG } from './independentPose';

/** deg of roll for the central difference */
const DELTA = 0.1;
/** % roll steer: the sweep's slope at roll 0 against a ±0.1° difference (a third-order term apart) */
const TOL = 0.01;

/** % roll steer at a travel, by central difference of independently solved poses. */
function independentRollSteer(sketch: Sketch, travel: number): number {
  const rig = axleRig(sketch);
  const at = axleAt(rig, travel);
  const up = axleSolve(rig, travel, DELTA * DEG, at.q),
    dn = axleSolve(rig, travel, -DELTA * DEG, at.q);
  return (100 * (up.q[3] - dn.q[3])) / DEG / (2 * DELTA);
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
