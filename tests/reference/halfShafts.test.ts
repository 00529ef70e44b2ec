/**
 * Half-shaft readings of the independent rear (the trailing-arm starter) against arms turned in the test: each arm
 * turned about its hinge axis by Rodrigues' rotation formula (1840; any kinematics text), its angle found by
 * Gauss–Newton (independentPose.ts) so that the wheel centre reaches the row's travel (in roll: |y|·tan(roll), the
 * left side up, docs/sketch-format.md). On those hubs:
 * - the shaft's length is the distance between its joint centres, its plunge that length's change from ride;
 * - each joint's operating angle is the angle between the two shafts it joins, θ = acos(u·v / (|u|·|v|)) (any
 *   vector algebra text): the inner joint between the drive unit's output axis (pointing out into the joint) and
 *   the shaft, the outer joint between the shaft and the wheel's spin axis (pointing outboard).
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../shared/kinematics';
import type { HalfShaftReading } from '../../shared/kinematics/types';
import { parseSketch, type Sketch } from '../../shared/schema/sketch';
import { armAt, DEG, dist, xyzOf, type V3 } from './independentPose';

/** deg: the sweep's arm angle converges to 1e-6 mm over a 400 mm arm (about 1e-7°); round-off in acos near 0 */
const ANGLE_TOL_DEG = 1e-5;
/** mm */
const POS_TOL_MM = 1e-5;

const angle = (u: V3, v: V3) => {
  const c = (u[0] * v[0] + u[1] * v[1] + u[2] * v[2]) / (Math.hypot(...u) * Math.hypot(...v));
  return Math.acos(Math.min(1, Math.max(-1, c))) / DEG;
};
const minus = (a: V3, b: V3): V3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];

/** The half-shaft of `side` with its wheel centre `travel` mm above ride, from an arm turned in the test. */
function halfShaftByHand(sketch: Sketch, side: 'left' | 'right', travel: number): HalfShaftReading {
  const h = sketch.halfShafts![side]!;
  const at = (id: string) => xyzOf(sketch.points.find((p) => p.id === id)!);
  const arm = armAt(sketch, side === 'left' ? sketch.wheels.left : sketch.wheels.right, travel);
  expect(arm.worst).toBeLessThan(1e-9);
  const inner = at(h.inner),
    innerAxis = at(h.innerAxis);
  const outer = arm.place(at(h.outer)),
    outerAxis = arm.place(at(h.outerAxis));
  const length = dist(inner, outer);
  return {
    length,
    plunge: length - dist(inner, at(h.outer)),
    innerAngle: angle(minus(inner, innerAxis), minus(outer, inner)),
    outerAngle: angle(minus(outer, inner), minus(outerAxis, outer)),
  };
}

function close(got: HalfShaftReading, want: HalfShaftReading, at: string) {
  expect(Math.abs(got.length - want.length), at).toBeLessThan(POS_TOL_MM);
  expect(Math.abs(got.plunge - want.plunge), at).toBeLessThan(POS_TOL_MM);
  expect(Math.abs(got.innerAngle - want.innerAngle), at).toBeLessThan(ANGLE_TOL_DEG);
  expect(Math.abs(got.outerAngle - want.outerAngle), at).toBeLessThan(ANGLE_TOL_DEG);
}

describe('half-shafts of the trailing-arm starter against hubs placed in the test', () => {
  // A swept, tilted hinge (semi-trailing), so the hub turns in every view and the angles are not one number.
  const sketch = parseSketch(starters['trailing-arm']!.build({ sweepAngle: 18, axisTilt: 3 }));
  const r = runSweep(sketch);

  it('heave: length, plunge and both joint angles at every row, both sides', () => {
    expect(r.heave.length).toBeGreaterThan(30);
    for (const row of r.heave) {
      for (const side of ['left', 'right'] as const)
        close(row.halfShafts![side]!, halfShaftByHand(sketch, side, row.travel), `${side} at ${row.travel}`);
    }
    // The check has something to find: at full bump the joints are bent by degrees and the shaft plunges.
    const end = halfShaftByHand(sketch, 'left', r.heave.at(-1)!.travel);
    expect(end.innerAngle).toBeGreaterThan(3);
    expect(end.outerAngle).toBeGreaterThan(3);
    expect(Math.abs(end.plunge)).toBeGreaterThan(1);
  });

  it('roll: both sides at every row, the left up and the right down', () => {
    const half = (id: string) => Math.abs(sketch.points.find((p) => p.id === id)!.y);
    for (const row of r.roll) {
      const t = Math.tan(row.roll * DEG);
      close(
        row.halfShafts!.left!,
        halfShaftByHand(sketch, 'left', half(sketch.wheels.left) * t),
        `left at ${row.roll}°`,
      );
      close(
        row.halfShafts!.right!,
        halfShaftByHand(sketch, 'right', -half(sketch.wheels.right) * t),
        `right at ${row.roll}°`,
      );
    }
  });
});
