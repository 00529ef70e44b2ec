/**
 * Cross-checks with general-purpose geometry libraries (docs/references.md):
 * - @flatten-js/core circle–circle intersection gives the four-bar's coupler joint B from
 *   the crank joint A (both branches); the solver's B must be one of them at every row;
 * - mathjs `intersect` gives line crossings: the side-view instant centre of the example
 *   file at every row (its links crossed on the axle solved in the test, independentPose.ts), and
 *   mathjs' own documented case for our line crossing.
 */
import Flatten from '@flatten-js/core';
import { intersect } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { pointsAt, runSweep } from '../../shared/kinematics';
import { lineCrossing2d } from '../../shared/kinematics/metrics/instantCenter';
import { parseSketch } from '../../shared/schema/sketch';
import { exampleSketch } from '../unit/kinematics/helpers';
import { axleAt, axlePoints, axleRig } from './independentPose';
import { fourBarSketch } from './rigs';

/** mm: the solver's convergence (1e-8) with round-off on 1000 mm numbers. */
const POS_TOL_MM = 1e-6;

describe('four-bar positions against @flatten-js/core circle intersection', () => {
  for (const branch of ['open', 'crossed'] as const) {
    it(`${branch} branch: the coupler joint is on both circles, on the branch it started on`, () => {
      const d = fourBarSketch(400, 1200, 800, 1000, 30, branch, 57);
      const sketch = parseSketch(d);
      const r = runSweep(d);
      let side: number | null = null;
      for (const row of r.heave) {
        const p = pointsAt(sketch, row.bodies);
        const A = new Flatten.Point(p['A.l'].x, p['A.l'].z);
        const O4 = new Flatten.Point(p['O4.l'].x, p['O4.l'].z);
        const hits = new Flatten.Circle(A, 1200).intersect(new Flatten.Circle(O4, 800));
        expect(hits).toHaveLength(2);
        const dist = hits.map((h) => Math.hypot(h.x - p['B.l'].x, h.y - p['B.l'].z));
        const k = dist[0] < dist[1] ? 0 : 1;
        expect(dist[k]).toBeLessThan(POS_TOL_MM);
        expect(dist[1 - k]).toBeGreaterThan(100);
        // Which side of the line A–O4 the joint is on must not change along the sweep.
        const s = Math.sign((O4.x - A.x) * (hits[k].y - A.y) - (O4.y - A.y) * (hits[k].x - A.x));
        side ??= s;
        expect(s).toBe(side);
      }
    });
  }
});

describe('instant centre against mathjs intersect', () => {
  it('mathjs documented case: [300,90],[400,97] × [300,130],[400,125] → [633.333, 113.333]', () => {
    const c = lineCrossing2d(300, 90, 400, 97, 300, 130, 400, 125)!;
    const m = intersect([300, 90], [400, 97], [300, 130], [400, 125]) as number[];
    expect(c.u).toBeCloseTo(633.333, 3);
    expect(c.v).toBeCloseTo(113.333, 3);
    expect(c.u).toBeCloseTo(m[0], 9);
    expect(c.v).toBeCloseTo(m[1], 9);
  });

  it("example file: every heave row's instant centre is where mathjs crosses the left links", () => {
    const d = exampleSketch();
    const sketch = parseSketch(d);
    const r = runSweep(d);
    const rig = axleRig(sketch);
    let checked = 0;
    for (const row of r.heave) {
      // The axle solved in the test at the row's travel (independentPose.ts), not the sweep's placed points.
      const p = axlePoints(sketch, rig, axleAt(rig, row.travel));
      const xz = (id: string) => [p[id].x, p[id].z];
      const m = intersect(xz('UL.fl'), xz('UL.al'), xz('LL.fl'), xz('LL.al')) as number[] | null;
      if (!row.instantCenter) continue;
      // Nearly parallel links put the crossing kilometres away; compare relative to its distance.
      const scale = Math.max(1, Math.hypot(m![0], m![1]));
      expect(Math.abs(row.instantCenter.x - m![0]) / scale).toBeLessThan(1e-9);
      expect(Math.abs(row.instantCenter.z - m![1]) / scale).toBeLessThan(1e-9);
      checked++;
    }
    expect(checked).toBeGreaterThan(40);
  });
});
