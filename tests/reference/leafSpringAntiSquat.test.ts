/**
 * Leaf-spring anti-squat and side-view instant centre from the SAE three-link equivalent.
 *
 * Independent check at ride: the axle's pitch per mm of heave comes from the spring as an Euler–Bernoulli beam
 * (leafSideModel.ts: finite elements with ml-matrix; for a flat spring this is the small-motion limit of the
 * spring, leafSpring.test.ts), and its fore-aft motion from the front link, whose pivot A can only move square to
 * the line from the front eye F: with ω the pitch rate (rad per mm, nose down positive) and the reference point
 * rising 1 mm per mm, v(A)·(A − F) = 0 gives the reference point's fore-aft rate v_x. A rigid body moving in a
 * plane turns about the point of zero velocity (the pole; any kinematics text, e.g. Uicker, Pennock & Shigley,
 * Theory of Machines and Mechanisms, ch. 3 — from memory, unverified): with pitch positive nose down,
 * v(P) = (v_x + ω·(P_z − ref_z), 1 − ω·(P_x − ref_x)) = 0 at P = ref + (1/ω, −v_x/ω). Anti-squat is then
 * 100·tanθ/(h/L), θ the line from the contact patch through the pole (Milliken & Milliken, Race Car Vehicle
 * Dynamics, ch. 17 — from memory, unverified).
 */
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../shared/kinematics';
import { leafSpring } from '../../shared/kinematics/layouts/leaf-spring/starter';
import { parseSketch, type Sketch } from '../../shared/schema/sketch';
import { beamSeat, sideModel } from './leafSideModel';

/** % anti-squat at ride: the beam is the spring's small-motion limit exactly; the sweep's pitch rate is exact. */
const AS_RIDE_TOL = 0.01;

/** The pole and anti-squat at ride of a flat spring, from the beam's pitch rate and the front link. */
function beamAntiSquat(sketch: Sketch) {
  const m = sideModel(sketch);
  const w = -beamSeat(m.k1, m.frontCantilever, m.k2, m.rearCantilever).slopePerMm;
  const A = m.A0,
    F = m.F,
    ref = m.ref;
  const vx = -w * (A.z - ref.z) - ((1 - w * (A.x - ref.x)) * (A.z - F.z)) / (A.x - F.x);
  const pole = { x: ref.x + 1 / w, z: ref.z - vx / w };
  // Contact patch below the wheel centre (x = the reference point's), on the ground at ride.
  const tan = pole.z / (pole.x - ref.x);
  return { pole, antiSquat: (100 * tan) / (sketch.vehicle.cgHeight / sketch.vehicle.wheelbase) };
}

/** A flat spring (eyes level with the seat) whose front halves are stiffer than the rear: the seat pitches. */
function unevenFlat(): Sketch {
  const doc = leafSpring.build({ springArc: 0, frontShare: 40 });
  return parseSketch({
    ...doc,
    members: doc.members.map((m) =>
      m.kind === 'leaf-half' && m.id.startsWith('LFH') ? { ...m, rate: m.rate! * 2 } : m,
    ),
  });
}

describe('leaf-spring anti-squat against the beam and the front link', () => {
  it('matches the pole and anti-squat at ride of a flat spring with uneven halves', () => {
    const sketch = unevenFlat();
    const ride = runSweep(sketch, { heaveOnly: true }).ride;
    const want = beamAntiSquat(sketch);
    const scale = Math.hypot(want.pole.x, want.pole.z);
    expect(Math.abs(ride.instantCenter!.x - want.pole.x)).toBeLessThan(scale * 1e-4);
    expect(Math.abs(ride.instantCenter!.z - want.pole.z)).toBeLessThan(scale * 1e-4);
    expect(Math.abs(ride.antiSquat! - want.antiSquat)).toBeLessThan(AS_RIDE_TOL);
    expect(want.antiSquat).toBeGreaterThan(20);
  });
});

describe('leaf-spring anti-squat of the starter', () => {
  const doc = leafSpring.build();
  const r = runSweep(doc, { heaveOnly: true });

  it('puts the instant centre on the front half line (its pivot swings about the eye)', () => {
    const at = (id: string) => doc.points.find((p) => p.id === id)!;
    const F = at('LF.l'),
      A = at('LA.l');
    const ride = r.heave.find((h) => h.travel === 0)!;
    const ic = ride.instantCenter!;
    // Cross product of (A − F) and (IC − F), divided by |A − F|: the distance of the IC from the line.
    const off = ((A.x - F.x) * (ic.z - F.z) - (A.z - F.z) * (ic.x - F.x)) / Math.hypot(A.x - F.x, A.z - F.z);
    expect(Math.abs(off)).toBeLessThan(1);
  });

  it('gives the starter a ride anti-squat near the compliance analysis figure (about 55 %)', () => {
    const ride = r.heave.find((h) => h.travel === 0)!;
    expect(ride.antiSquat).toBeGreaterThan(45);
    expect(ride.antiSquat).toBeLessThan(65);
  });

  it('raises the anti-squat when the front eye is raised', () => {
    const raised: Sketch = {
      ...doc,
      points: doc.points.map((p) => (p.id === 'LF.l' || p.id === 'LF.r' ? { ...p, z: p.z + 40 } : p)),
    };
    const before = r.heave.find((h) => h.travel === 0)!.antiSquat!;
    const after = runSweep(raised, { heaveOnly: true }).heave.find((h) => h.travel === 0)!.antiSquat!;
    expect(after).toBeGreaterThan(before + 5);
  });
});
