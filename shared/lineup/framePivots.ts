/**
 * A sketch's frame brackets: the frame points a member is mounted on. The driveline's reference
 * points (the gearbox output and its axis, a drive unit's half-shaft joints and axes) are frame
 * points too, but nothing pivots on them and no bracket is cut for them, so they are left out;
 * so is any other frame point no member uses (a reference the designer placed).
 * Positions in mm, on the sketch file's axes.
 */
import type { Sketch } from '../schema/sketch';
import type { Vec3 } from '../vec3';
import { drivelineReferenceIds } from '../drivelineReferences';

export interface FramePivot {
  /** the point's id in its sketch */
  id: string;
  /** mm */
  at: Vec3;
}

type Mounted = Pick<Sketch, 'points' | 'members' | 'driveline' | 'halfShafts'>;

/** The sketch's frame brackets in the order of its points. */
export function framePivots(sketch: Mounted): FramePivot[] {
  const used = new Set<string>();
  for (const m of sketch.members) {
    used.add(m.a);
    used.add(m.b);
  }
  const refs = drivelineReferenceIds(sketch);
  return sketch.points
    .filter((p) => p.body === 'frame' && used.has(p.id) && !refs.has(p.id))
    .map((p) => ({ id: p.id, at: { x: p.x, y: p.y, z: p.z } }));
}
