/**
 * Property tests for the leaf-spring and trailing-arm starters over their whole parameter
 * ranges: no NaN or Infinity and no throw, and mirror symmetry (a symmetric sketch heaves with
 * no sideways motion or yaw, and rolls the same either way, mirrored).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../../shared/kinematics';
import { leafSpring } from '../../../shared/kinematics/layouts/leaf-spring/starter';
import { trailingArm } from '../../../shared/kinematics/layouts/trailing-arm/starter';
import type { StarterSpec } from '../../../shared/kinematics/layouts/starterTypes';
import type { MovingBodyId } from '../../../shared/schema/sketch';
import { nonFinite } from './helpers';

/** Mirror images agree to this (mm or deg): solver convergence over a few hundred mm. */
const MIRROR_TOL = 1e-5;

type PoseLike = { x: number; y: number; z: number; roll: number; pitch: number; yaw: number };
const mirrorBody = (id: string): MovingBodyId =>
  (id.endsWith('-left')
    ? id.replace('-left', '-right')
    : id.endsWith('-right')
      ? id.replace('-right', '-left')
      : id) as MovingBodyId;
/** The mirror image in y = 0 of a pose: x, z and pitch alike, y, roll and yaw opposite. */
function expectMirror(p: PoseLike, q: PoseLike) {
  for (const k of ['x', 'z', 'pitch'] as const) expect(Math.abs(p[k] - q[k])).toBeLessThan(MIRROR_TOL);
  for (const k of ['y', 'roll', 'yaw'] as const) expect(Math.abs(p[k] + q[k])).toBeLessThan(MIRROR_TOL);
}

function paramsOf(spec: StarterSpec) {
  return fc
    .array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: spec.params.length, maxLength: spec.params.length })
    .map((u) => Object.fromEntries(spec.params.map((p, i) => [p.key, p.min + u[i] * (p.max - p.min)])));
}

for (const spec of [leafSpring, trailingArm]) {
  describe(`property: ${spec.layout} starter`, () => {
    it('sweeps without NaN, Infinity or a throw, mirror-symmetric in heave and roll', () => {
      fc.assert(
        fc.property(paramsOf(spec), (params) => {
          const doc = { ...spec.build(params) };
          doc.sweep = { ...doc.sweep, step: 15, rollStep: 2 };
          const r = runSweep(doc);
          expect(nonFinite(r)).toEqual([]);
          for (const h of r.heave) {
            for (const [id, pose] of Object.entries(h.bodies)) expectMirror(pose!, h.bodies[mirrorBody(id)]!);
            if (h.halfShafts)
              expect(Math.abs(h.halfShafts.left!.plunge - h.halfShafts.right!.plunge)).toBeLessThan(MIRROR_TOL);
          }
          for (const row of r.roll) {
            const m = r.roll.find((q) => q.roll === -row.roll);
            if (!m) continue; // a lock-up on one side only shows in the limits, checked below
            expect(Math.abs(row.leftTravel - m.rightTravel)).toBeLessThan(MIRROR_TOL);
            for (const [id, pose] of Object.entries(row.bodies)) expectMirror(pose!, m.bodies[mirrorBody(id)]!);
          }
          expect(r.limits.rollMax).toBeCloseTo(-r.limits.rollMin, 9);
        }),
        { numRuns: 40, seed: 606 },
      );
    });
  });
}
