/**
 * Left/right pairs of pivots, so that a move on one side can be mirrored on the other.
 *
 * Two pivots pair by name when their ids differ only in a trailing side mark
 * ("LL.fl" / "LL.fr", "WC.l" / "WC.r", "UCA-left" / "UCA-right", "A.L" / "A.R"), or, failing
 * a name, by place: same body kind, same x and z, and y mirrored about the centre plane.
 * A pivot on the centre plane (|y| within tolerance) never pairs by place.
 */
import type { Sketch } from '../../../shared/schema/sketch';
import type { Mm } from '../../../shared/units';

type Point = Sketch['points'][number];

/** Two pivots count as mirror images when their coordinates agree this closely (mm): below any drawing precision. */
export const MIRROR_TOLERANCE_MM: Mm = 0.05;

/** Trailing side marks and their opposites, longest first so "left" wins over "t". */
const SIDE_MARKS: readonly [string, string][] = [
  ['left', 'right'],
  ['Left', 'Right'],
  ['LEFT', 'RIGHT'],
  ['l', 'r'],
  ['L', 'R'],
];

/** The id of the other side's pivot by name ("LL.fl" → "LL.fr"), or null when the id has no side mark. */
export function oppositeId(id: string): string | null {
  for (const [left, right] of SIDE_MARKS) {
    if (id.length > left.length && id.endsWith(left)) return id.slice(0, -left.length) + right;
    if (id.length > right.length && id.endsWith(right)) return id.slice(0, -right.length) + left;
  }
  return null;
}

/** The body on the other side ("arm-left" → "arm-right"); frame and axle are their own mirror. */
export function mirrorBody(body: Point['body']): Point['body'] {
  if (body.endsWith('-left')) return body.replace(/-left$/, '-right') as Point['body'];
  if (body.endsWith('-right')) return body.replace(/-right$/, '-left') as Point['body'];
  return body;
}

function placedAsMirror(p: Point, q: Point): boolean {
  return (
    mirrorBody(p.body) === q.body &&
    Math.abs(p.y) > MIRROR_TOLERANCE_MM &&
    Math.abs(p.x - q.x) <= MIRROR_TOLERANCE_MM &&
    Math.abs(p.z - q.z) <= MIRROR_TOLERANCE_MM &&
    Math.abs(p.y + q.y) <= MIRROR_TOLERANCE_MM
  );
}

/** Map from each paired pivot id to its partner's id (both directions). */
export function findPairs(points: readonly Point[]): Map<string, string> {
  const byId = new Map(points.map((p) => [p.id, p]));
  const pairs = new Map<string, string>();
  for (const p of points) {
    if (pairs.has(p.id)) continue;
    const other = oppositeId(p.id);
    const q = other ? byId.get(other) : undefined;
    if (q && !pairs.has(q.id) && mirrorBody(p.body) === q.body) {
      pairs.set(p.id, q.id);
      pairs.set(q.id, p.id);
    }
  }
  for (const p of points) {
    if (pairs.has(p.id)) continue;
    const q = points.find((c) => c !== p && !pairs.has(c.id) && placedAsMirror(p, c));
    if (q) {
      pairs.set(p.id, q.id);
      pairs.set(q.id, p.id);
    }
  }
  return pairs;
}
