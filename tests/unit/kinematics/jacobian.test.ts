import { describe, expect, it } from 'vitest';
import { linkageModelBuild } from '../../../shared/kinematics/model';
import { residualsEvaluate, residualWorkCreate } from '../../../shared/kinematics/residuals';
import { starters } from '../../../shared/kinematics/starters';
import { parseSketch } from '../../../shared/schema/sketch';
import { sketchOf } from './helpers';

/** Central differences with h = 1e-5 (mm or rad) are good to about 1e-7 on these magnitudes. */
const FD_STEP = 1e-5;
const FD_TOLERANCE = 1e-5;

function checkJacobian(sketch: ReturnType<typeof parseSketch>) {
  const model = linkageModelBuild(sketch);
  const work = residualWorkCreate(model);
  const m = model.residualCount,
    n = model.stateSize;
  const state = Float64Array.from({ length: n }, (_, i) => (i % 6 < 3 ? 20 * Math.sin(i + 1) : 0.05 * Math.cos(i + 2)));
  const r = new Float64Array(m),
    J = new Float64Array(m * n);
  residualsEvaluate(model, state, work, r, J);
  const rp = new Float64Array(m),
    rm = new Float64Array(m);
  for (let c = 0; c < n; c++) {
    const sp = new Float64Array(state),
      sm = new Float64Array(state);
    sp[c] += FD_STEP;
    sm[c] -= FD_STEP;
    residualsEvaluate(model, sp, work, rp, null);
    residualsEvaluate(model, sm, work, rm, null);
    for (let i = 0; i < m; i++) {
      const fd = (rp[i] - rm[i]) / (2 * FD_STEP);
      expect(Math.abs(J[i * n + c] - fd)).toBeLessThan(FD_TOLERANCE * Math.max(1, Math.abs(fd)));
    }
  }
}

describe('analytic Jacobian', () => {
  for (const s of Object.values(starters)) {
    it(`matches central differences for the ${s!.layout} starter`, () => checkJacobian(s!.build()));
  }

  it('matches central differences for a hinged arm', () => {
    const sketch = parseSketch(
      sketchOf({
        points: [
          { id: 'H.f', body: 'frame', x: 400, y: 300, z: 350 },
          { id: 'H.i', body: 'frame', x: 380, y: 700, z: 340 },
          { id: 'WC.l', body: 'arm-left', x: 0, y: 800, z: 400 },
          { id: 'WC.r', body: 'arm-right', x: 0, y: -800, z: 400 },
          { id: 'G.f', body: 'frame', x: 400, y: -300, z: 350 },
          { id: 'G.i', body: 'frame', x: 380, y: -700, z: 340 },
        ],
        members: [
          { id: 'HL', kind: 'hinge', body: 'arm-left', a: 'H.f', b: 'H.i' },
          { id: 'HR', kind: 'hinge', body: 'arm-right', a: 'G.f', b: 'G.i' },
        ],
      }),
    );
    checkJacobian(sketch);
  });
});
