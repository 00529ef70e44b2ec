/**
 * Anti-squat of a solid drive axle: the line from the contact patch through the side-view
 * instant centre, %AS = 100 · tanθ / (h/L) (Milliken & Milliken, Race Car Vehicle Dynamics,
 * ch. 17; Gillespie, Fundamentals of Vehicle Dynamics, ch. 2 — formula forms from memory,
 * unverified). Worked check (docs/references.md): L = 2700, h = 500, IC 1000 ahead and 300 high
 * → 162.0 %. The instant centre is cross-checked with mathjs `intersect`.
 */
import { intersect } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { pointsAt, runSweep } from '../../shared/kinematics';
import { parseSketch } from '../../shared/schema/sketch';
import { antiSquatPercent } from '../../shared/kinematics/metrics/antiSquat';
import { doc, IC_RIG_MEMBERS, IC_RIG_POINTS } from './rigs';

function rig() {
  return doc(IC_RIG_POINTS, IC_RIG_MEMBERS, {
    vehicle: { wheelbase: 2700, cgHeight: 500, track: 1600, tireRadius: 400 },
  });
}

describe('anti-squat', () => {
  const r = runSweep(rig());

  it('worked check: IC 1000 ahead and 300 high, h = 500, L = 2700 → 162.0 %', () => {
    expect(r.ride.instantCenter!.x).toBeCloseTo(1000, 9);
    expect(r.ride.instantCenter!.z).toBeCloseTo(300, 9);
    expect(r.ride.antiSquat!).toBeCloseTo(162.0, 1);
  });

  it('independent suspension, line from the wheel centre (r = 300) → 0 % (same sources)', () => {
    expect(antiSquatPercent({ x: 1000, z: 300 }, { x: 0, z: 300 }, 500, 2700)).toBeCloseTo(0, 12);
  });

  it('instant centre and anti-squat agree with mathjs intersect at every row', () => {
    const sketch = parseSketch(rig());
    expect(r.heave).toHaveLength(61);
    for (const row of r.heave) {
      const p = pointsAt(sketch, row.bodies);
      const xz = (id: string) => [p[id].x, p[id].z];
      const ic = intersect(xz('UL.fl'), xz('UL.al'), xz('LL.fl'), xz('LL.al')) as number[];
      expect(row.instantCenter!.x).toBeCloseTo(ic[0], 6);
      expect(row.instantCenter!.z).toBeCloseTo(ic[1], 6);
      const cp = { x: p['WC.l'].x, z: row.travel };
      expect(row.antiSquat!).toBeCloseTo((100 * ((ic[1] - cp.z) / (ic[0] - cp.x))) / (500 / 2700), 6);
    }
  });
});
