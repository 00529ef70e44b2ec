/**
 * The leaf-spring model against an independent beam model and the SAE three-link geometry (leafSideModel.ts).
 *
 * - Stiffness: an Euler–Bernoulli beam, the two halves clamped together at the seat and pinned at their eyes,
 *   solved by a finite-element assembly with ml-matrix (Logan, A First Course in the Finite Element Method,
 *   ch. 4 — from memory, unverified). For a flat spring the eyes and the halves' pivots lie level with the seat,
 *   so to first order the eyes do not move and the beam is exactly the small-motion limit of the spring: its
 *   seat's pitch per mm of heave and its wind-up rate are what the sweep must give at ride. Worked closed form of
 *   the same beam (moment balance at the seat): slope/heave = (k2·L2 − k1·L1)/(k1·L1² + k2·L2²), wind-up rate
 *   k1·L1² + k2·L2²; for halves whose rates keep the seat level (k1·L1 = k2·L2) that is K·L1·L2
 *   (docs/references.md, a derivation, not a published value).
 * - Geometry: the starter builds each half as a link of ¾ of its cantilever length from the eye (SAE AE-11 Spring
 *   Design Manual; Blundell & Harty, Multibody Systems Approach to Vehicle Dynamics, fig. 6.15 — from memory,
 *   unverified). For the pitch the sweep settles at, the axle's fore-aft place (the front link's circle) and the
 *   rear eye and shackle (circle intersection) are found in the test: they must be where the sweep put them.
 * - Wind-up: the angle is the axle torque over the beam's wind-up rate; the axle turned by it at ride height, with
 *   its fore-aft place from the front link's circle, puts each shock's axle eye where the test computes, so the
 *   shocks' length changes in the wind-up are checked end to end.
 */
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../shared/kinematics';
import { leafSpring, LEAF_LINK_SHARE } from '../../shared/kinematics/layouts/leaf-spring/starter';
import { parseSketch, type Sketch } from '../../shared/schema/sketch';
import { beamSeat, sideModel } from './leafSideModel';

/** deg: the bending rows' pull on the lengths (< 1e-3 mm) turns the axle by far less than this. */
const PITCH_TOL_DEG = 2e-3;
/** mm */
const POS_TOL_MM = 0.01;
const DEG = Math.PI / 180;
/** N·mm per N·m */
const NMM = 1000;

/** A flat spring (eyes level with the seat) with its front halves twice as stiff: the seat pitches in heave. */
function unevenFlat(): Sketch {
  const doc = leafSpring.build({ springArc: 0, frontShare: 40 });
  return parseSketch({
    ...doc,
    members: doc.members.map((m) =>
      m.kind === 'leaf-half' && m.id.startsWith('LFH') ? { ...m, rate: m.rate! * 2 } : m,
    ),
    sweep: { ...doc.sweep, droop: -2, bump: 2, step: 1 },
  });
}

describe('leaf spring against a beam model (finite elements, ml-matrix)', () => {
  const sketch = unevenFlat();
  const m = sideModel(sketch);
  const L1 = m.frontCantilever,
    L2 = m.rearCantilever;
  const beam = beamSeat(m.k1, L1, m.k2, L2);
  const r = runSweep(sketch, { heaveOnly: true });

  it('the beam reproduces its own closed form (the check on the check)', () => {
    const closed = (m.k2 * L2 - m.k1 * L1) / (m.k1 * L1 ** 2 + m.k2 * L2 ** 2);
    expect(beam.slopePerMm / closed).toBeCloseTo(1, 9);
    expect(beam.windUpNmmPerRad / (m.k1 * L1 ** 2 + m.k2 * L2 ** 2)).toBeCloseTo(1, 9);
    // Uneven on purpose: the seat does pitch.
    expect(Math.abs(beam.slopePerMm) / DEG).toBeGreaterThan(5e-3);
  });

  it('pitches the axle in heave at ride as the beam turns its seat', () => {
    const at = (t: number) => r.heave.find((h) => h.travel === t)!.pose.pitch;
    // deg per mm; the sweep's pitch is nose-down positive, the beam's slope nose-up positive.
    const sweepRate = (at(1) - at(-1)) / 2;
    const beamRate = -beam.slopePerMm / DEG;
    // ±1 mm central difference: the third-order term is (1 mm / 450 mm)² of the slope and less.
    expect(Math.abs(sweepRate / beamRate - 1)).toBeLessThan(1e-4);
  });

  it('has the beam’s wind-up rate, both springs together', () => {
    const w = r.windUp!;
    const beamNmPerDeg = (2 * beam.windUpNmmPerRad * DEG) / NMM;
    expect(w.rate / beamNmPerDeg).toBeCloseTo(1, 6);
    expect(w.springs).toHaveLength(2);
  });
});

describe('leaf spring against the SAE three-link geometry', () => {
  const doc = leafSpring.build();
  const sketch = parseSketch(doc);
  const model = sideModel(sketch);
  const r = runSweep(doc, { heaveOnly: true });

  it('builds each half as a link of ¾ of its cantilever length from the eye (from memory, unverified)', () => {
    expect(model.l1).toBeCloseTo(LEAF_LINK_SHARE * model.frontCantilever, 0);
    expect(LEAF_LINK_SHARE).toBe(0.75);
  });

  it('places the axle and the shackle where the links put them for the pitch the sweep settles at', () => {
    for (const row of r.heave.filter((h) => h.travel % 25 === 0)) {
      const want = model.close(row.travel, row.pose.pitch * DEG)!;
      expect(Math.abs(row.pose.x - want.X)).toBeLessThan(POS_TOL_MM);
      const eye = row.bodies['shackle-left']!;
      const E0 = sketch.points.find((p) => p.id === 'LE.l')!;
      expect(Math.abs(E0.x + eye.x - want.E.x)).toBeLessThan(POS_TOL_MM);
      expect(Math.abs(E0.z + eye.z - want.E.z)).toBeLessThan(POS_TOL_MM);
      // Shackle angle from the vertical, eye rearward positive.
      const sa = Math.atan2(model.H.x - want.E.x, Math.abs(model.H.z - want.E.z)) / DEG;
      expect(Math.abs(row.shackleAngle! - sa)).toBeLessThan(PITCH_TOL_DEG * 10);
    }
  });
});

describe('wind-up of the starter: angle from the beam, shock lengths from the wound-up axle', () => {
  const doc = leafSpring.build();
  const sketch = parseSketch(doc);
  const model = sideModel(sketch);
  const w = runSweep(sketch, { heaveOnly: true }).windUp!;
  // The beam along each half's eye-to-seat chord (the arch is 70 mm over 650 mm halves): the seat's turning
  // stiffness does not depend on which way the chord points.
  const beam = beamSeat(model.k1, model.frontCantilever, model.k2, model.rearCantilever);
  const torqueNm = sketch.sweep.axleTorque ?? 4000; // the default documented in docs/sketch-format.md

  it('turns the housing pinion nose up by the torque over the beam’s rate', () => {
    const angleDeg = (torqueNm * NMM) / (2 * beam.windUpNmmPerRad) / DEG;
    expect(w.torque).toBe(torqueNm);
    expect(Math.abs(w.angle - angleDeg)).toBeLessThan(1e-6);
    expect(w.angle).toBeGreaterThan(0.5);
  });

  it('changes each shock’s length as the axle turned by that angle, with its front links held, moves its eye', () => {
    const pitch = -((torqueNm * NMM) / (2 * beam.windUpNmmPerRad)); // rad, nose-down positive
    const pose = model.close(0, pitch)!;
    const at = (id: string) => sketch.points.find((p) => p.id === id)!;
    for (const s of ['l', 'r']) {
      const top = at(`SH.f.${s}`),
        eye = at(`SH.a.${s}`);
      const moved = model.place({ x: eye.x, z: eye.z }, pitch, pose.X, 0);
      const ride = Math.hypot(top.x - eye.x, top.z - eye.z, top.y - eye.y);
      const wound = Math.hypot(top.x - moved.x, top.z - moved.z, top.y - eye.y);
      const change = w.members[`SH${s}`].lengthChange;
      // Staggered shocks: one ahead of the axle, one behind, so they change length opposite ways.
      expect(Math.abs(change - (wound - ride)), `SH${s}`).toBeLessThan(POS_TOL_MM);
      expect(Math.abs(wound - ride)).toBeGreaterThan(1);
    }
  });
});
