/**
 * Anti-squat of a solid drive axle: the line from the contact patch through the side-view
 * instant centre, %AS = 100 · tanθ / (h/L) (Milliken & Milliken, Race Car Vehicle Dynamics,
 * ch. 17; Gillespie, Fundamentals of Vehicle Dynamics, ch. 2 — formula forms from memory,
 * unverified).
 *
 * Independent check: the axle's pose is solved in the test (independentPose.ts, Gauss–Newton least
 * squares from the sketch's hardpoints) at travel ± 0.5 mm, and the side-view instant centre is taken as
 * the pole of that motion, the one point of the axle with no velocity (a rigid body moving in a plane turns
 * about it: any kinematics text, e.g. Uicker, Pennock & Shigley, Theory of Machines and Mechanisms, ch. 3 —
 * from memory, unverified). With pitch positive nose down, v(P) = (v_x + ω·(P_z − ref_z), v_z − ω·(P_x −
 * ref_x)) vanishes at P = ref + (v_z/ω, −v_x/ω). That is a different route from the sweep's crossing of the
 * link lines; at ride (where the lateral rod is level and the axle does not shift sideways) the two must agree.
 * Through the travel the instant centre is the documented crossing of the left upper and lower link lines in
 * side view, taken here on the pose solved in the test. (Away from ride the rod shifts the axle sideways, the
 * links leave their vertical planes, and that crossing parts from the pole of the side-view motion: by 1.9 %
 * anti-squat at ±150 mm on this rig, so the pole is compared at ride only.)
 * Worked check (docs/references.md): the rig's links are aimed by construction at a point 1000 mm ahead and
 * 300 mm high; with L = 2700, h = 500 that is 100 · (300/1000) · 5.4 = 162.0 %.
 */
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../shared/kinematics';
import { parseSketch, type Sketch, type SketchInput } from '../../shared/schema/sketch';
import { axleAt, axlePlace, axleRig, axleSolve, xyzOf } from './independentPose';
import { doc, IC_RIG_MEMBERS, IC_RIG_POINTS } from './rigs';

/** mm of travel either side of a row for the pole's central difference */
const D = 0.5;
/**
 * Relative tolerance on an instant centre: the solves (here and the sweep's, 1e-6 mm) are magnified by the
 * crossing's distance over the links' length (about 2); the pole's central difference adds a term of order D²
 * (under 1e-6 of the pole's distance on this rig).
 */
const REL_TOL = 1e-5;

function rig(): SketchInput {
  return doc(IC_RIG_POINTS, IC_RIG_MEMBERS, {
    vehicle: { wheelbase: 2700, cgHeight: 500, track: 1600, tireRadius: 400 },
  });
}

/** The side-view pole of the axle's heave motion at `travel`, and the anti-squat from it, solved here. */
export function independentAntiSquat(sketch: Sketch, travel: number) {
  const a = axleRig(sketch);
  const mid = axleAt(a, travel);
  const lo = axleSolve(a, travel - D, 0, mid.q),
    hi = axleSolve(a, travel + D, 0, mid.q);
  const ref = axlePlace(a, mid, a.ref);
  const vx = (hi.q[0] - lo.q[0]) / (2 * D),
    vz = 1;
  const w = (hi.q[2] - lo.q[2]) / (2 * D);
  const pole = { x: ref[0] + vz / w, z: ref[2] - vx / w };
  const wheel = axlePlace(a, mid, xyzOf(sketch.points.find((p) => p.id === sketch.wheels.left)!));
  // The contact patch: below the left wheel centre, on the ground, which has risen with the travel.
  const cp = { x: wheel[0], z: travel };
  const tan = (pole.z - cp.z) / (pole.x - cp.x);
  return { pole, antiSquat: (100 * tan) / (sketch.vehicle.cgHeight / sketch.vehicle.wheelbase) };
}

describe('anti-squat against the pole of an independently solved axle motion', () => {
  const sketch = parseSketch(rig());
  const r = runSweep(sketch);

  it('worked check: the links aimed at 1000 ahead and 300 high, h = 500, L = 2700 → 162.0 %', () => {
    const want = independentAntiSquat(sketch, 0);
    // The pole of the solved motion is where the rig's links were aimed: the check can tell a wrong motion.
    expect(Math.abs(want.pole.x - 1000)).toBeLessThan(1000 * REL_TOL);
    expect(Math.abs(want.pole.z - 300)).toBeLessThan(1000 * REL_TOL);
    expect(want.antiSquat).toBeCloseTo(162.0, 2);
    expect(r.ride.instantCenter!.x).toBeCloseTo(1000, 6);
    expect(r.ride.instantCenter!.z).toBeCloseTo(300, 6);
    expect(r.ride.antiSquat!).toBeCloseTo(162.0, 2);
  });

  it('instant centre and anti-squat at every row match the link lines crossed on the independently solved axle', () => {
    // docs/sketch-format.md defines the instant centre as the side-view crossing of the left upper and lower
    // link lines; here they are crossed on the pose solved in the test (plain line geometry).
    expect(r.heave).toHaveLength(61);
    const a = axleRig(sketch);
    const link = (id: string) => a.links.find((l) => l.id === id)!;
    for (const row of r.heave) {
      const pose = axleAt(a, row.travel);
      const line = (id: string) => {
        const l = link(id);
        return { f: l.F, p: axlePlace(a, pose, [a.ref[0] + l.local[0], a.ref[1] + l.local[1], a.ref[2] + l.local[2]]) };
      };
      const u = line('ULl'),
        l = line('LLl');
      // Side view (x, z): f + s·(p − f) for each; solve the 2×2 system by Cramer's rule.
      const d1 = [u.p[0] - u.f[0], u.p[2] - u.f[2]],
        d2 = [l.p[0] - l.f[0], l.p[2] - l.f[2]];
      const det = d1[0] * -d2[1] + d2[0] * d1[1];
      const s1 = ((l.f[0] - u.f[0]) * -d2[1] + d2[0] * (l.f[2] - u.f[2])) / det;
      const ic = { x: u.f[0] + s1 * d1[0], z: u.f[2] + s1 * d1[1] };
      const wheel = axlePlace(a, pose, xyzOf(sketch.points.find((p) => p.id === 'WC.l')!));
      const as = (100 * ((ic.z - row.travel) / (ic.x - wheel[0]))) / (500 / 2700);
      const scale = Math.hypot(ic.x, ic.z);
      expect(Math.abs(row.instantCenter!.x - ic.x), `x at ${row.travel}`).toBeLessThan(scale * REL_TOL);
      expect(Math.abs(row.instantCenter!.z - ic.z), `z at ${row.travel}`).toBeLessThan(scale * REL_TOL);
      expect(Math.abs(row.antiSquat! - as), `at ${row.travel}`).toBeLessThan(1e-3);
    }
    // The rows do move: the anti-squat at full droop is well away from ride's.
    expect(Math.abs(r.heave[0].antiSquat! - r.ride.antiSquat!)).toBeGreaterThan(5);
  });
});
