/**
 * The leaf-spring model against the SAE three-link description (SAE AE-11 Spring Design
 * Manual; Blundell & Harty, Multibody Systems Approach to Vehicle Dynamics, fig. 6.15 —
 * docs/references.md: "each half of the spring acts like a rigid link pivoted near its eye, of
 * about ¾ of the cantilever length (from memory, unverified), with a rigid centre block at the
 * axle seat and the shackle as a third link").
 *
 * The independent check is a side-view model of one spring written here from that description:
 * for an axle pitch p at a travel, the front link fixes the axle's fore-aft position (a circle
 * about the front eye), the rear eye is where the rear link's circle meets the shackle's
 * (@flatten-js/core circle intersection), and the spring settles at the pitch of least bending
 * energy Σ k_i·ℓ_i²·sin²(bend_i) (the model's stated energy, layouts/leaf-spring/constraints.ts), found by
 * golden-section search. The sweep (3-D, both springs, least squares) must agree.
 * The wind-up rate K·L1·L2 is a derivation (cantilever model; docs/references.md, not a published value).
 */
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../shared/kinematics';
import { leafSpring, LEAF_LINK_SHARE } from '../../shared/kinematics/layouts/leaf-spring/starter';
import { parseSketch } from '../../shared/schema/sketch';
import { sideModel } from './leafSideModel';

/** deg: the bending rows' pull on the lengths (< 1e-3 mm) turns the axle by far less than this. */
const PITCH_TOL_DEG = 2e-3;
/** mm */
const POS_TOL_MM = 0.01;

describe('leaf spring against the SAE three-link description', () => {
  const doc = leafSpring.build();
  const sketch = parseSketch(doc);
  const model = sideModel(sketch);
  const r = runSweep(doc, { heaveOnly: true });

  it('builds each half as a link of ¾ of its cantilever length from the eye (from memory, unverified)', () => {
    expect(model.l1).toBeCloseTo(LEAF_LINK_SHARE * model.frontCantilever, 0);
    expect(LEAF_LINK_SHARE).toBe(0.75);
  });

  it('settles each heave row at the pitch of least bending energy, with the axle and shackle where the links put them', () => {
    for (const row of r.heave.filter((h) => h.travel % 25 === 0)) {
      const want = model.settle(row.travel);
      const pitchDeg = (want.pitch * 180) / Math.PI;
      expect(Math.abs(row.pose.pitch - pitchDeg)).toBeLessThan(PITCH_TOL_DEG);
      expect(Math.abs(row.pose.x - want.X)).toBeLessThan(POS_TOL_MM);
      const eye = row.bodies['shackle-left']!;
      const E0 = sketch.points.find((p) => p.id === 'LE.l')!;
      expect(Math.abs(E0.x + eye.x - want.E.x)).toBeLessThan(POS_TOL_MM);
      expect(Math.abs(E0.z + eye.z - want.E.z)).toBeLessThan(POS_TOL_MM);
      // Shackle angle from the vertical, eye rearward positive.
      const sa = (Math.atan2(model.H.x - want.E.x, Math.abs(model.H.z - want.E.z)) * 180) / Math.PI;
      expect(Math.abs(row.shackleAngle! - sa)).toBeLessThan(PITCH_TOL_DEG * 10);
    }
  });

  it('has the wind-up rate K·L1·L2 for small angles (cantilever derivation, references.md)', () => {
    // A flat spring, so the links lie level and the small-angle derivation holds exactly.
    const flat = parseSketch(leafSpring.build({ springArc: 0 }));
    const m = sideModel(flat);
    const h = 1e-4;
    // Energy Σ k·ℓ²·sin²(bend) is twice the strain energy ½·Σ k_θ·bend²; the rate is its second derivative / 2.
    const e = (p: number) => m.close(0, p)!.energy;
    const stiffness = (e(h) - 2 * e(0) + e(-h)) / (h * h) / 2; // N·mm per rad
    const K = m.k1 + m.k2;
    expect(stiffness / (K * m.frontCantilever * m.rearCantilever)).toBeCloseTo(1, 2);
    const w = runSweep(flat, { heaveOnly: true }).windUp!;
    const left = w.springs.find((s) => s.side === 'left')!;
    expect((left.rate * 1000 * 180) / Math.PI / stiffness).toBeCloseTo(1, 2);
  });
});
