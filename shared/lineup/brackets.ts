/**
 * The bracket list of a line-up: for every frame pivot of the variants compared, where each
 * variant puts it and whether one frame bracket can serve them all. Variants of one platform
 * are copies of one sketch, so a pivot is the same bracket in each when it has the same id.
 * Pure geometry on the sketches as given (mm), no sweep involved.
 */
import type { Sketch } from '../schema/sketch';
import { vecDistance, type Vec3 } from '../vec3';

/** mm: two variants whose frame pivot lies within this of each other can share one bracket hole. */
export const COMMON_BRACKET_TOLERANCE_MM = 1;

export type BracketStatus =
  /** every variant has the pivot, all within the tolerance of each other */
  | 'common'
  /** every variant has the pivot, but not all in one place */
  | 'moved'
  /** some variants have no such frame pivot */
  | 'partial';

export interface BracketRow {
  /** the pivot's id, as in the sketches */
  id: string;
  /** per variant, in the order given: the pivot's position (mm), or null where that variant has none */
  at: Array<Vec3 | null>;
  /** mm, the largest distance between two variants' positions (0 when fewer than two have it) */
  spread: number;
  status: BracketStatus;
}

/** Rows in the order the pivots first appear, variant by variant. */
export function bracketList(
  variants: readonly Pick<Sketch, 'points'>[],
  toleranceMm = COMMON_BRACKET_TOLERANCE_MM,
): BracketRow[] {
  const order: string[] = [];
  const seen = new Set<string>();
  for (const v of variants) {
    for (const p of v.points) {
      if (p.body === 'frame' && !seen.has(p.id)) {
        seen.add(p.id);
        order.push(p.id);
      }
    }
  }
  return order.map((id) => {
    const at = variants.map((v) => {
      const p = v.points.find((q) => q.id === id && q.body === 'frame');
      return p ? { x: p.x, y: p.y, z: p.z } : null;
    });
    const present = at.filter((p): p is NonNullable<typeof p> => p !== null);
    let spread = 0;
    for (let i = 0; i < present.length; i++) {
      for (let j = i + 1; j < present.length; j++) {
        const a = present[i];
        const b = present[j];
        spread = Math.max(spread, vecDistance(a, b));
      }
    }
    const status: BracketStatus =
      present.length < variants.length ? 'partial' : spread <= toleranceMm ? 'common' : 'moved';
    return { id, at, spread, status };
  });
}
