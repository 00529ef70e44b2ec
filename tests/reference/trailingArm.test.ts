/**
 * Trailing arms against plain geometry and Rodrigues' rotation formula.
 * - A hinge axis parallel to y turns the arm about the wheel's own spin direction, so camber,
 *   toe and track do not change (plain geometry), and the rear-view line from the patch runs
 *   level: the roll centre is on the ground.
 * - A swept hinge turns the wheel by exactly the rotation about that axis. The angle that
 *   lifts the wheel centre by the travel is found here by bisection with a hand-written
 *   Rodrigues formula, v' = v·cosθ + (u × v)·sinθ + u·(u·v)·(1 − cosθ) (O. Rodrigues, 1840;
 *   any kinematics text); the rotation itself is mathjs `rotationMatrix(θ, u)` (a
 *   general-purpose library). Camber and toe are then the rear- and top-view angles of the
 *   rotated spin axis (docs/sketch-format.md definitions).
 */
import { multiply, rotationMatrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { pointsAt, runSweep } from '../../shared/kinematics';
import { trailingArm } from '../../shared/kinematics/layouts/trailing-arm/starter';
import { parseSketch } from '../../shared/schema/sketch';

/** deg: the solver's convergence (1e-6 mm over a 500 mm arm is 1e-7°) with round-off. */
const ANGLE_TOL_DEG = 1e-6;
/** mm */
const POS_TOL_MM = 1e-5;

type P3 = { x: number; y: number; z: number };
const deg = (r: number) => (r * 180) / Math.PI;

function rodrigues(p: P3, a: P3, u: P3, t: number): P3 {
  const v = { x: p.x - a.x, y: p.y - a.y, z: p.z - a.z };
  const c = Math.cos(t),
    s = Math.sin(t),
    d = u.x * v.x + u.y * v.y + u.z * v.z;
  return {
    x: a.x + v.x * c + (u.y * v.z - u.z * v.y) * s + u.x * d * (1 - c),
    y: a.y + v.y * c + (u.z * v.x - u.x * v.z) * s + u.y * d * (1 - c),
    z: a.z + v.z * c + (u.x * v.y - u.y * v.x) * s + u.z * d * (1 - c),
  };
}

describe('trailing arm, hinge parallel to y (plain geometry)', () => {
  const doc = trailingArm.build({ sweepAngle: 0, axisTilt: 0 });
  const r = runSweep(doc);

  it('has zero camber, toe and track change at every row', () => {
    for (const row of r.heave) {
      expect(Math.abs(row.camberChange!)).toBeLessThan(ANGLE_TOL_DEG);
      expect(Math.abs(row.toeChange!)).toBeLessThan(ANGLE_TOL_DEG);
      expect(Math.abs(row.trackChange!)).toBeLessThan(POS_TOL_MM);
    }
  });

  it('puts the roll centre on the ground and the rear-view centre at infinity', () => {
    for (const row of r.heave) {
      expect(row.rollCenterHeight!).toBeCloseTo(row.travel, 6);
      expect(row.frontViewInstantCenter).toBeNull();
    }
  });
});

describe('trailing arm, swept hinge, against Rodrigues rotation (mathjs)', () => {
  const doc = trailingArm.build({ sweepAngle: 22, axisTilt: 4 });
  const sketch = parseSketch(doc);
  const r = runSweep(doc);
  const pt = (id: string) => sketch.points.find((p) => p.id === id)!;
  const a = pt('HA.ol'),
    b = pt('HA.il'),
    wc = pt('WC.l'),
    shock = pt('SH.al');
  const len = Math.hypot(b.x - a.x, b.y - a.y, b.z - a.z);
  const u = { x: (b.x - a.x) / len, y: (b.y - a.y) / len, z: (b.z - a.z) / len };

  it('turns the wheel centre, the other arm points and the spin axis by the rotation about the hinge axis', () => {
    for (const row of r.heave.filter((h) => h.travel % 25 === 0)) {
      // The arm angle that lifts the wheel centre by the travel (hand-written Rodrigues, bisection).
      let lo = -0.6,
        hi = 0.6;
      const lift = (t: number) => rodrigues(wc, a, u, t).z - wc.z - row.travel;
      const rising = lift(hi) > lift(lo);
      for (let i = 0; i < 80; i++) {
        const mid = (lo + hi) / 2;
        if (lift(mid) > 0 === rising) hi = mid;
        else lo = mid;
      }
      const theta = (lo + hi) / 2;
      const M = rotationMatrix(theta, [u.x, u.y, u.z]) as unknown as number[][];
      const turn = (p: P3) => {
        const v = multiply(M, [p.x - a.x, p.y - a.y, p.z - a.z]) as unknown as number[];
        return { x: a.x + v[0], y: a.y + v[1], z: a.z + v[2] };
      };
      const placed = pointsAt(sketch, row.bodies);
      for (const [id, p] of [
        ['WC.l', wc],
        ['SH.al', shock],
      ] as const) {
        const q = turn(p);
        expect(Math.hypot(placed[id].x - q.x, placed[id].y - q.y, placed[id].z - q.z)).toBeLessThan(POS_TOL_MM);
      }
      const n = multiply(M, [0, 1, 0]) as unknown as number[];
      expect(Math.abs(row.camberChange! - deg(Math.atan2(-n[2], n[1])))).toBeLessThan(ANGLE_TOL_DEG);
      expect(Math.abs(row.toeChange! - deg(Math.atan2(n[0], n[1])))).toBeLessThan(ANGLE_TOL_DEG);
      const c = turn(wc);
      expect(row.trackChange!).toBeCloseTo(c.y - wc.y, 5);
      expect(row.foreAftShift).toBeCloseTo(c.x - wc.x, 5);
    }
  });

  it('has a non-trivial check: the swept axis does change camber and toe', () => {
    const end = r.heave.at(-1)!;
    expect(Math.abs(end.camberChange!)).toBeGreaterThan(1);
    expect(Math.abs(end.toeChange!)).toBeGreaterThan(0.1);
  });
});
