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
import { doc } from './rigs';

function rig() {
  return doc(
    [
      { id: 'WC.l', body: 'axle', x: 0, y: 800, z: 400 },
      { id: 'WC.r', body: 'axle', x: 0, y: -800, z: 400 },
      // Lower links on the line through (0, 200) and the IC (1000, 300); uppers through (0, 600) and the IC.
      { id: 'LL.al', body: 'axle', x: 0, y: 500, z: 200 },
      { id: 'LL.fl', body: 'frame', x: 600, y: 500, z: 260 },
      { id: 'LL.ar', body: 'axle', x: 0, y: -500, z: 200 },
      { id: 'LL.fr', body: 'frame', x: 600, y: -500, z: 260 },
      { id: 'UL.al', body: 'axle', x: 0, y: 400, z: 600 },
      { id: 'UL.fl', body: 'frame', x: 500, y: 400, z: 450 },
      { id: 'UL.ar', body: 'axle', x: 0, y: -400, z: 600 },
      { id: 'UL.fr', body: 'frame', x: 500, y: -400, z: 450 },
      { id: 'LR.f', body: 'frame', x: -100, y: 550, z: 420 },
      { id: 'LR.a', body: 'axle', x: -100, y: -550, z: 420 },
    ],
    [
      { id: 'LLl', kind: 'link', group: 'lower', a: 'LL.fl', b: 'LL.al' },
      { id: 'LLr', kind: 'link', group: 'lower', a: 'LL.fr', b: 'LL.ar' },
      { id: 'ULl', kind: 'link', group: 'upper', a: 'UL.fl', b: 'UL.al' },
      { id: 'ULr', kind: 'link', group: 'upper', a: 'UL.fr', b: 'UL.ar' },
      { id: 'LR', kind: 'lateral-rod', a: 'LR.f', b: 'LR.a' },
    ],
    { vehicle: { wheelbase: 2700, cgHeight: 500, track: 1600, tireRadius: 400 } },
  );
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
