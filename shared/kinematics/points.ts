/**
 * Placing a sketch's points by body poses: what the board draws a swept linkage with.
 */
import type { MovingBodyId, Sketch } from '../schema/sketch';
import { sketchBodyReferences } from './model';
import { poseApply } from './pose';
import type { Pose } from './types';
import { vec, type Vec3 } from './vec';

/**
 * Every point of the sketch (mm), moved by the pose of its body (pose about the body's
 * reference point, as in the sweep rows' `bodies`). Frame points, and points of a body
 * missing from `bodies`, stay where they are at ride.
 */
export function pointsAt(sketch: Sketch, bodies: Partial<Record<string, Pose>>): Record<string, Vec3> {
  const refs = sketchBodyReferences(sketch);
  const out: Record<string, Vec3> = {};
  for (const p of sketch.points) {
    const pose = p.body === 'frame' ? undefined : bodies[p.body];
    const ref = p.body === 'frame' ? undefined : refs.get(p.body as MovingBodyId);
    out[p.id] = pose && ref ? poseApply(pose, ref, p) : vec(p.x, p.y, p.z);
  }
  return out;
}
