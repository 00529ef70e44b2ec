/**
 * The planar four-bar. A sketch whose links all lie in parallel vertical planes (y = ±400)
 * is a four-bar in side view: frame = ground (O2–O4, length d), the axle = coupler (A–B,
 * length b), crank a = O2–A, rocker c = O4–B. The axle's reference point sits level with A,
 * so the imposed travel drives the crank; the solver's coupler angle (θ3, whose change is
 * the pinion angle change) and rocker angle (θ4) are checked against:
 * - R. L. Norton, Design of Machinery, ch. 4: closed-form θ3 and θ4, open and crossed branches;
 * - F. Freudenstein's equation (Trans. ASME 1955; Ghosal, Resonance, Aug 2010);
 * - the worked example of docs/references.md (believed to be Norton's Example 4-1; inputs from
 *   memory, outputs recomputed two independent ways) and its second case.
 */
import { describe, expect, it } from 'vitest';
import { pointsAt, runSweep } from '../../shared/kinematics';
import { parseSketch } from '../../shared/schema/sketch';
import type { SketchInput } from '../../shared/schema/sketch';
import { fourBarSketch, nortonAngles, O2 } from './rigs';

const deg = (r: number) => (r * 180) / Math.PI;
/** The solver holds lengths to ~1e-8 mm on ~1000 mm links: angles to ~1e-9 rad. */
const ANGLE_TOL_DEG = 1e-6;
/** The references give their angles to three decimals. */
const TABLE_TOL_DEG = 0.0015;
const rad = (d: number) => (d * Math.PI) / 180;

function solverAngles(sketchDoc: SketchInput) {
  const sketch = parseSketch(sketchDoc);
  const result = runSweep(sketchDoc);
  return result.heave.map((row) => {
    const p = pointsAt(sketch, row.bodies);
    const A = p['A.l'],
      B = p['B.l'],
      O4 = p['O4.l'];
    return {
      row,
      theta2: deg(Math.atan2(A.z - O2.z, A.x - O2.x)),
      theta3: deg(Math.atan2(B.z - A.z, B.x - A.x)),
      theta4: deg(Math.atan2(B.z - O4.z, B.x - O4.x)),
    };
  });
}

describe('four-bar against Norton and Freudenstein', () => {
  const cases = [
    {
      a: 400,
      b: 1200,
      c: 800,
      d: 1000,
      ride: 30,
      target: 40,
      branch: 'open' as const,
      expect3: 20.298,
      expect4: 57.325,
    },
    {
      a: 400,
      b: 1200,
      c: 800,
      d: 1000,
      ride: 30,
      target: 40,
      branch: 'crossed' as const,
      expect3: -60.978,
      expect4: -98.005,
    },
    {
      a: 200,
      b: 700,
      c: 900,
      d: 600,
      ride: 20,
      target: 30,
      branch: 'open' as const,
      expect3: 88.837,
      expect4: 117.286,
    },
  ];

  for (const k of cases) {
    const travel = k.a * (Math.sin(rad(k.target)) - Math.sin(rad(k.ride)));
    const rows = solverAngles(fourBarSketch(k.a, k.b, k.c, k.d, k.ride, k.branch, travel));

    it(`a=${k.a} b=${k.b} c=${k.c} d=${k.d}, ${k.branch}: matches the closed form at every row`, () => {
      expect(rows).toHaveLength(17);
      const ride = nortonAngles(k.a, k.b, k.c, k.d, k.ride, k.branch);
      for (const r of rows) {
        const n = nortonAngles(k.a, k.b, k.c, k.d, r.theta2, k.branch);
        expect(Math.abs(r.theta3 - n.theta3)).toBeLessThan(ANGLE_TOL_DEG);
        expect(Math.abs(r.theta4 - n.theta4)).toBeLessThan(ANGLE_TOL_DEG);
        // The axle is the coupler: its pinion angle change is the coupler's rotation (−pitch).
        expect(Math.abs(r.row.pinionAngleChange! - (n.theta3 - ride.theta3))).toBeLessThan(ANGLE_TOL_DEG);
        // Freudenstein: K1·cosθ4 − K2·cosθ2 + K3 = cos(θ2 − θ4)
        const K1 = k.d / k.a,
          K2 = k.d / k.c,
          K3 = (k.a ** 2 - k.b ** 2 + k.c ** 2 + k.d ** 2) / (2 * k.a * k.c);
        const lhs = K1 * Math.cos(rad(r.theta4)) - K2 * Math.cos(rad(r.theta2)) + K3;
        expect(Math.abs(lhs - Math.cos(rad(r.theta2 - r.theta4)))).toBeLessThan(1e-8);
      }
    });

    it(`a=${k.a} b=${k.b} c=${k.c} d=${k.d}, ${k.branch}: reaches the worked example at θ2 = ${k.target}°`, () => {
      const last = rows.at(-1)!;
      expect(last.theta2).toBeCloseTo(k.target, 9);
      expect(Math.abs(last.theta3 - k.expect3)).toBeLessThan(TABLE_TOL_DEG);
      expect(Math.abs(last.theta4 - k.expect4)).toBeLessThan(TABLE_TOL_DEG);
      if (k.branch === 'open' && k.a === 400) {
        // Transmission angle µ = θ4 − θ3 = 37.03° (docs/references.md).
        expect(Math.abs(last.theta4 - last.theta3 - 37.03)).toBeLessThan(0.005);
      }
    });
  }
});
