/**
 * Where the pivot labels of a drawing go: each label takes the first place around its pivot that
 * overlaps no other label, no pivot marker and no fixed text, trying rings further out in turn (a
 * leader line joins a label set apart to its pivot). All in points.
 */

export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface LabelRequest {
  /** the pivot's position */
  x: number;
  y: number;
  /** one line per pivot id at this position */
  lines: string[];
}

export interface PlacedLabel {
  box: Box;
  lines: string[];
  leader: { x1: number; y1: number; x2: number; y2: number } | null;
}

/**
 * Advance widths of Roboto Regular in ems, by character class (from its metrics, rounded up): the labels
 * need a box a little wider than the text, never a narrower one.
 */
function charWidth(c: string): number {
  if (c === '.' || c === ',' || c === ':' || c === ';' || c === '|' || c === "'") return 0.27;
  if (c === ' ') return 0.26;
  if (c === 'i' || c === 'l' || c === 'j' || c === 'I') return 0.26;
  if (c === 'f' || c === 't' || c === 'r' || c === '(' || c === ')') return 0.36;
  if (c === 'm' || c === 'w') return 0.88;
  if (c === 'M' || c === 'W') return 0.9;
  if (/[A-Z]/.test(c)) return 0.68;
  if (/[0-9]/.test(c)) return 0.57;
  return 0.57;
}

/** The width (pt) a line of Roboto takes at `size` pt. */
export function labelWidth(s: string, size: number): number {
  let w = 0;
  for (const c of s) w += charWidth(c);
  return w * size;
}

function overlaps(a: Box, b: Box): boolean {
  return a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
}

function inside(a: Box, b: Box): boolean {
  return a.x >= b.x && a.y >= b.y && a.x + a.w <= b.x + b.w && a.y + a.h <= b.y + b.h;
}

/** Distances from the pivot (pt), and the directions tried on each ring (degrees, y down): beside it first. */
const RINGS = [4, 11, 20, 32, 46, 62];
const DIRECTIONS = [0, 180, -90, 90, -45, 45, -135, 135, -22.5, 22.5, -157.5, 157.5, -67.5, 67.5, -112.5, 112.5].map(
  (deg) => (deg * Math.PI) / 180,
);

/** The point of `b` nearest to (x, y): where a leader line ends. */
function nearestOn(b: Box, x: number, y: number): { x: number; y: number } {
  return { x: Math.min(Math.max(x, b.x), b.x + b.w), y: Math.min(Math.max(y, b.y), b.y + b.h) };
}

/**
 * Places every label, the most crowded pivots first (they have the fewest free places). A label that
 * finds no free place takes the one that overlaps least.
 */
export function placeLabels(requests: LabelRequest[], fixed: Box[], bounds: Box, size: number): PlacedLabel[] {
  const lineH = size * 1.2;
  const taken: Box[] = [...fixed];
  const crowd = (r: LabelRequest) => requests.filter((q) => Math.hypot(q.x - r.x, q.y - r.y) < 40).length;
  const order = [...requests].sort((a, b) => crowd(b) - crowd(a) || a.x - b.x);
  const placed: PlacedLabel[] = [];
  for (const r of order) {
    const w = Math.max(...r.lines.map((s) => labelWidth(s, size))) + 2;
    const h = r.lines.length * lineH + 1;
    let best: { box: Box; cost: number } | null = null;
    search: for (const d of RINGS) {
      for (const a of DIRECTIONS) {
        const cx = r.x + d * Math.cos(a);
        const cy = r.y + d * Math.sin(a);
        const box: Box = {
          x: Math.cos(a) > 0.3 ? cx : Math.cos(a) < -0.3 ? cx - w : cx - w / 2,
          y: Math.sin(a) > 0.3 ? cy : Math.sin(a) < -0.3 ? cy - h : cy - h / 2,
          w,
          h,
        };
        if (!inside(box, bounds)) continue;
        const cost = taken.filter((t) => overlaps(t, box)).length;
        if (!best || cost < best.cost) best = { box, cost };
        if (cost === 0) break search;
      }
    }
    const box = best?.box ?? { x: r.x + 4, y: r.y - h / 2, w, h };
    taken.push(box);
    const end = nearestOn(box, r.x, r.y);
    const far = Math.hypot(end.x - r.x, end.y - r.y) > 6;
    placed.push({ box, lines: r.lines, leader: far ? { x1: r.x, y1: r.y, x2: end.x, y2: end.y } : null });
  }
  return placed;
}
