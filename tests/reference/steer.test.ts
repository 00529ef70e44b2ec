/**
 * The steer sweep against poses solved here and a trapezoid solved by hand.
 *
 * 1. The double-wishbone starter: each knuckle is solved in this test on its five links (the two legs of
 *    each wishbone from its frame pivots to the ball joint, and the tie rod from the rack end moved along
 *    the rack line), its wheel centre held at ride height: Newton's method on the five length residuals
 *    over the knuckle's rotation vector (Rodrigues' formula) and its x, y translation, with a numerical
 *    Jacobian and ml-matrix's QR (rigidPose.ts), stepping the rack from centre in 1 mm steps to stay on the
 *    linkage's branch. The steer angle is the heading of the line where the wheel plane meets the ground
 *    (n × up, n the spin axis): plain vector geometry.
 * 2. A planar trapezoid (vertical kingpins, level steering arms, level tie rods and rack): each knuckle's
 *    angle solves a·cos θ + b·sin θ = k in closed form (the tie rod's length from its rack end to the arm's
 *    end swung about the kingpin). Ackermann % from those angles with the ideal inner angle of the Ackermann
 *    condition cot δo − cot δi = t / L (Gillespie, "Fundamentals of Vehicle Dynamics", SAE 1992, ch. 8, from
 *    memory, unverified), the turning radius from a 2 × 2 linear solve for the turning centre (ml-matrix),
 *    and the toggle where the tie rod and steering arm are in line: |rack end − kingpin| = rod + arm.
 */
import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../shared/kinematics';
import type { SketchInput } from '../../shared/schema/sketch';
import { DEG, gaussNewton, headingOfSpin, norm, rodrigues, sub, type V3 } from './rigidPose';
import { wishboneSketch } from './wishboneRigs';
import { KINGPIN_Y, trapezoid, trapezoidAngle } from './steerTrapezoid';

/** mm, the wheelbase the trapezoid's sketch is given (wishboneRigs.ts). */
const WHEELBASE = 2700;

/** deg: the sweep's solve converges to 1e-6 mm over arms of ~150 mm, far below this */
const ANGLE_TOL_DEG = 1e-5;

/** One knuckle on five links, from the sketch's points (ids of the double-wishbone starter). */
function knuckleRig(doc: SketchInput, s: 'l' | 'r') {
  const p = (id: string): V3 => {
    const q = doc.points.find((x) => x.id === `${id}.${s}`)!;
    return [q.x, q.y, q.z];
  };
  const wc = p('WC');
  // Each wishbone arm holds the knuckle at its ball joint: two legs from the frame pivots to that joint.
  const legs: Array<{ frame: V3; joint: V3 }> = [
    { frame: p('LW.f'), joint: p('LA.bj') },
    { frame: p('LW.r'), joint: p('LA.bj') },
    { frame: p('UW.f'), joint: p('UA.bj') },
    { frame: p('UW.r'), joint: p('UA.bj') },
  ];
  const links = legs.map((l) => ({ frame: l.frame, local: sub(l.joint, wc), L: norm(sub(l.frame, l.joint)) }));
  const rackEnd = p('TR.i');
  const outer = p('TR.o');
  return { wc, links, rackEnd, tieLocal: sub(outer, wc), tieL: norm(sub(rackEnd, outer)), side: s };
}

type Rig = ReturnType<typeof knuckleRig>;

/** The five residuals (mm) for q = [wx, wy, wz, tx, ty] with the rack at `rack` (mm along +y: the starter's rack line). */
function residuals(rig: Rig, q: number[], rack: number): number[] {
  const w: V3 = [q[0], q[1], q[2]];
  const place = (local: V3): V3 => {
    const r = rodrigues(w, local);
    return [rig.wc[0] + q[3] + r[0], rig.wc[1] + q[4] + r[1], rig.wc[2] + r[2]];
  };
  const out = rig.links.map(({ frame, local, L }) => norm(sub(place(local), frame)) - L);
  const end: V3 = [rig.rackEnd[0], rig.rackEnd[1] + rack, rig.rackEnd[2]];
  out.push(norm(sub(place(rig.tieLocal), end)) - rig.tieL);
  return out;
}

function newton(rig: Rig, start: number[], rack: number): number[] {
  const q = gaussNewton((x) => residuals(rig, x, rack), start);
  expect(Math.max(...residuals(rig, q, rack).map(Math.abs))).toBeLessThan(1e-9);
  return q;
}

/** deg, the wheel's heading (positive to the vehicle's left) from the solved rotation vector. */
function heading(rig: Rig, q: number[]): number {
  return headingOfSpin(rodrigues([q[0], q[1], q[2]], [0, rig.side === 'l' ? 1 : -1, 0]));
}

/** The knuckle's heading at each rack value, reached from centre in 1 mm steps. */
function headingsAt(rig: Rig, racks: number[]): Map<number, number> {
  const out = new Map<number, number>();
  for (const dir of [1, -1]) {
    let q = [0, 0, 0, 0, 0];
    const far = Math.max(...racks.map((r) => r * dir));
    for (let r = 0; r <= far + 1e-9; r += 1) {
      q = newton(rig, q, dir * r);
      if (racks.includes(dir * r)) out.set(dir * r, heading(rig, q));
    }
  }
  return out;
}

describe('steer angles of the double-wishbone starter', () => {
  const doc = starters['double-wishbone']!.build();
  const result = runSweep(doc);
  const steer = result.steer!;

  it('moves the rack along the line through the tie rods’ inner ends, here the y axis', () => {
    // The starter's inner ends are mirror images at one x and z, so the line is the y axis.
    expect(steer.rackDirection!.x).toBeCloseTo(0, 12);
    expect(steer.rackDirection!.y).toBeCloseTo(1, 12);
    expect(steer.rackPoints).toEqual(['TR.i.l', 'TR.i.r']);
  });

  it.each(['l', 'r'] as const)('gives side %s the steer angle of the knuckle solved on its five links', (s) => {
    const rig = knuckleRig(doc, s);
    const racks = [-60, -35, -10, 10, 35, 60];
    const expected = headingsAt(rig, racks);
    for (const rack of racks) {
      const row = steer.rows.find((r) => r.rack === rack)!;
      const got = s === 'l' ? row.leftSteer : row.rightSteer;
      expect(Math.abs(got - expected.get(rack)!), `rack ${rack}`).toBeLessThan(ANGLE_TOL_DEG);
    }
  });
});

describe('Ackermann, turning radius and the toggle on a trapezoid solved by hand', () => {
  const sweep = { droop: -40, bump: 40, step: 10, roll: 2, rollStep: 1, steer: { rack: 120, step: 5 } };
  const result = runSweep(wishboneSketch(trapezoid, sweep));
  const steer = result.steer!;

  it('turns each wheel by the closed-form angle of its four-bar', () => {
    for (const row of steer.rows) {
      expect(row.leftSteer, `rack ${row.rack}`).toBeCloseTo(trapezoidAngle(1, row.rack!), 6);
      expect(row.rightSteer, `rack ${row.rack}`).toBeCloseTo(trapezoidAngle(-1, row.rack!), 6);
    }
  });

  it('gives Ackermann % against the Ackermann condition cot δo − cot δi = t / L', () => {
    let checked = 0;
    for (const row of steer.rows) {
      if (row.rack === 0) {
        // Straight ahead there is no outer angle to compare with: not defined, never NaN.
        expect(row.ackermann).toBeNull();
        continue;
      }
      const l = trapezoidAngle(1, row.rack!) * DEG,
        r = trapezoidAngle(-1, row.rack!) * DEG;
      // The pair turns toward the side of the larger angle; the inner wheel is on that side.
      const left = l + r > 0;
      const inner = Math.abs(left ? l : r),
        outer = Math.abs(left ? r : l);
      const t = 2 * KINGPIN_Y; // vertical kingpins: 1400 mm apart at any height
      const idealInner = Math.atan(1 / (1 / Math.tan(outer) - t / WHEELBASE));
      const expected = (100 * (inner - outer)) / (idealInner - outer);
      expect(row.ackermann, `rack ${row.rack}`).not.toBeNull();
      expect(row.ackermann!, `rack ${row.rack}`).toBeCloseTo(expected, 4);
      checked++;
    }
    expect(checked).toBeGreaterThan(10);
  });

  it('gives the turning radius from the turning centre solved on the rear axle line', () => {
    for (const row of steer.rows.filter((x) => x.rack !== 0)) {
      const leftTurn = row.leftSteer + row.rightSteer > 0;
      const side = leftTurn ? -1 : 1; // the outer wheel
      const delta = (leftTurn ? row.rightSteer : row.leftSteer) * DEG;
      // The wheel centre swings about the kingpin; the contact patch is straight below it (no camber).
      const patch = [-side * 100 * Math.sin(delta), side * (KINGPIN_Y + 100 * Math.cos(delta))];
      // Turning centre O: on the rear axle line x = −L, and on the wheel's axle line: (O − patch) · heading = 0.
      const A = new Matrix([
        [1, 0],
        [Math.cos(delta), Math.sin(delta)],
      ]);
      const rhs = Matrix.columnVector([-WHEELBASE, Math.cos(delta) * patch[0] + Math.sin(delta) * patch[1]]);
      const o = solve(A, rhs);
      const radius = Math.hypot(o.get(0, 0) - patch[0], o.get(1, 0) - patch[1]);
      expect(row.turningRadius, `rack ${row.rack}`).toBeCloseTo(radius, 4);
    }
  });

  it('stops at the toggle where the right tie rod and steering arm come into line, before the 120 mm asked', () => {
    // Right side: the rack end (−150, −300 + r) is rod + arm = 360 + |(−150, 40)| from the kingpin (0, −700).
    const reach = 360 + Math.hypot(150, 40);
    const toggle = Math.sqrt(reach ** 2 - 150 ** 2) - 400;
    const up = steer.events.find((e) => e.at > 0)!;
    expect(up.kind).toBe('steer-toggle');
    expect(up.side).toBe('right');
    // Ten bisection steps of a 5 mm step close in to within 5/1024 mm of the toggle (from the reachable side).
    expect(Math.abs(up.at - toggle)).toBeLessThan(0.01);
    expect(up.message).toContain('sweep.steer.rack');
    expect(steer.rackMax).toBeLessThan(toggle);
    expect(steer.rackMax).toBeGreaterThan(toggle - 5);
  });
});
