/**
 * What changed between two versions of a sketch, for the revision list's "compare":
 * which pivots moved and by how much, which came and went, and which members changed.
 * Lengths in mm.
 */
import type { Sketch } from '../../../shared/schema/sketch';
import type { Mm } from '../../../shared/units';
import { deepEqual } from './history';

/** Moves smaller than this (mm) are rounding, not edits. */
export const MOVE_TOLERANCE_MM: Mm = 0.01;

export interface PivotMove {
  id: string;
  dx: Mm;
  dy: Mm;
  dz: Mm;
  /** straight-line distance, mm */
  distance: Mm;
}

export interface SketchComparison {
  moved: PivotMove[];
  addedPivots: string[];
  removedPivots: string[];
  addedMembers: string[];
  removedMembers: string[];
  /** members present in both whose kind, ends or settings differ */
  changedMembers: string[];
  /** top-level settings that differ (vehicle, sweep, name, …) */
  changedSettings: string[];
}

/** Compares `from` (older) with `to` (newer). */
export function compareSketches(from: Sketch, to: Sketch): SketchComparison {
  const before = new Map(from.points.map((p) => [p.id, p]));
  const after = new Map(to.points.map((p) => [p.id, p]));
  const moved: PivotMove[] = [];
  for (const [id, p] of before) {
    const q = after.get(id);
    if (!q) continue;
    const dx = q.x - p.x;
    const dy = q.y - p.y;
    const dz = q.z - p.z;
    const distance = Math.hypot(dx, dy, dz);
    if (distance > MOVE_TOLERANCE_MM) moved.push({ id, dx, dy, dz, distance });
  }
  moved.sort((a, b) => b.distance - a.distance);
  const membersBefore = new Map(from.members.map((m) => [m.id, m]));
  const membersAfter = new Map(to.members.map((m) => [m.id, m]));
  const settings = new Set([...Object.keys(from), ...Object.keys(to)]);
  for (const k of ['points', 'members', 'format']) settings.delete(k);
  return {
    moved,
    addedPivots: [...after.keys()].filter((id) => !before.has(id)),
    removedPivots: [...before.keys()].filter((id) => !after.has(id)),
    addedMembers: [...membersAfter.keys()].filter((id) => !membersBefore.has(id)),
    removedMembers: [...membersBefore.keys()].filter((id) => !membersAfter.has(id)),
    changedMembers: [...membersBefore.entries()]
      .filter(([id, m]) => membersAfter.has(id) && !deepEqual(m, membersAfter.get(id)))
      .map(([id]) => id),
    changedSettings: [...settings].filter(
      (k) => !deepEqual((from as Record<string, unknown>)[k], (to as Record<string, unknown>)[k]),
    ),
  };
}
