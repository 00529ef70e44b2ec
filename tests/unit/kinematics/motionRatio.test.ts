/**
 * The analytic motion ratio (from the pose sensitivity) agrees with the central difference of
 * the shock lengths between neighbouring heave rows, for every starter and at every row —
 * ride included, where the first sensitivity is found before the solver knows the linkage's rank.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';

/** A 5 mm central difference is good to about h²·L'''/6, well under this on these linkages. */
const MR_TOL = 2e-3;
/**
 * Leaf springs: the sensitivity is the Gauss–Newton one, which leaves out the curvature of the
 * springs' bending rows (they are not zero away from ride); measured against 0.5 mm differences
 * that costs up to 2.1e-3 at ±140 mm, 0.2 % of the ratio (docs/design/leaf-spring.md).
 */
const MR_TOL_SOFT = 3e-3;

describe('motion ratio against central differences', () => {
  for (const spec of Object.values(starters)) {
    it(`${spec!.layout}`, () => {
      const r = runSweep(spec!.build(), { heaveOnly: true });
      const shocks = spec!
        .build()
        .members.filter((m) => m.kind === 'shock' || m.kind === 'spring')
        .map((m) => m.id);
      expect(shocks.length).toBeGreaterThan(0);
      for (let i = 1; i < r.heave.length - 1; i++) {
        const [a, b, c] = [r.heave[i - 1], r.heave[i], r.heave[i + 1]];
        for (const id of shocks) {
          const fd = Math.abs((c.members[id].length - a.members[id].length) / (c.travel - a.travel));
          const tol = spec!.layout === 'leaf-spring' ? MR_TOL_SOFT : MR_TOL;
          expect(Math.abs(b.members[id].motionRatio! - fd), `${id} at ${b.travel} mm`).toBeLessThan(tol);
        }
      }
    });
  }
});
