/**
 * Drawing geometry of members on a stage, in pixels: a spring's coil, a shock's stroke marks,
 * a hinge's axis line. Pure functions of screen points, so they are cheap to run every frame.
 */
import type { Px, ScreenPoint } from './transform';

/** Below this screen length (px) a member is drawn as a plain line: a coil or marks would be noise. */
const MIN_DETAIL_PX = 14;

function lerp(a: ScreenPoint, b: ScreenPoint, t: number): ScreenPoint {
  return { px: a.px + (b.px - a.px) * t, py: a.py + (b.py - a.py) * t };
}

/** A zigzag coil from a to b: `turns` full turns of half-width `amplitude` px, straight ends. Flat list x0, y0, x1, y1… */
export function springCoil(a: ScreenPoint, b: ScreenPoint, turns = 7, amplitude: Px = 7): number[] {
  const dx = b.px - a.px;
  const dy = b.py - a.py;
  const len = Math.hypot(dx, dy);
  if (len < MIN_DETAIL_PX) return [a.px, a.py, b.px, b.py];
  const nx = -dy / len;
  const ny = dx / len;
  const lead = 0.12;
  const out = [a.px, a.py];
  const s = lerp(a, b, lead);
  out.push(s.px, s.py);
  const segments = turns * 2;
  for (let i = 1; i < segments; i++) {
    const t = lead + ((1 - 2 * lead) * i) / segments;
    const c = lerp(a, b, t);
    const side = i % 2 === 1 ? 1 : -1;
    out.push(c.px + nx * amplitude * side, c.py + ny * amplitude * side);
  }
  const e = lerp(a, b, 1 - lead);
  out.push(e.px, e.py, b.px, b.py);
  return out;
}

export interface ShockMarks {
  /** screen points where the b end would sit at the shortest and the longest stroke */
  compressed: ScreenPoint | null;
  extended: ScreenPoint | null;
  /** short cross marks at those places, flat lists */
  compressedTick: number[] | null;
  extendedTick: number[] | null;
  /** the body (from a, the longer part) and the shaft (to b) */
  body: number[];
  shaft: number[];
  /** true when the present length is outside the stroke */
  outside: boolean;
}

/**
 * A shock drawn from a (body end) to b (shaft end), with marks where b would sit at `minLength`
 * and `maxLength`. The 3D length ratio carries over to the view: projection keeps ratios along a line.
 */
export function shockMarks(
  a: ScreenPoint,
  b: ScreenPoint,
  length: number,
  minLength?: number,
  maxLength?: number,
  tick: Px = 6,
): ShockMarks {
  const dx = b.px - a.px;
  const dy = b.py - a.py;
  const len = Math.hypot(dx, dy);
  const nx = len > 0 ? -dy / len : 0;
  const ny = len > 0 ? dx / len : 0;
  const mark = (mm?: number): ScreenPoint | null => (mm && length > 0 ? lerp(a, b, mm / length) : null);
  const tickAt = (p: ScreenPoint | null) =>
    p && len >= MIN_DETAIL_PX ? [p.px - nx * tick, p.py - ny * tick, p.px + nx * tick, p.py + ny * tick] : null;
  const compressed = mark(minLength);
  const extended = mark(maxLength);
  // The body reaches to where the shaft would bottom out; without limits, a little past halfway.
  const bodyEnd =
    compressed && minLength! < length ? lerp(a, b, Math.max(0.35, (minLength! / length) * 0.85)) : lerp(a, b, 0.55);
  return {
    compressed,
    extended,
    compressedTick: tickAt(compressed),
    extendedTick: tickAt(extended),
    body: [a.px, a.py, bodyEnd.px, bodyEnd.py],
    shaft: [bodyEnd.px, bodyEnd.py, b.px, b.py],
    outside: (minLength !== undefined && length < minLength) || (maxLength !== undefined && length > maxLength),
  };
}

/** A hinge axis line from a through b, carried on by `extend` of its length past each end. */
export function hingeAxis(a: ScreenPoint, b: ScreenPoint, extend = 0.35): number[] {
  const s = lerp(a, b, -extend);
  const e = lerp(a, b, 1 + extend);
  return [s.px, s.py, e.px, e.py];
}

/** Where the line through p and q reaches the vertical screen line px = x (null if the line is vertical). */
export function lineAtX(p: ScreenPoint, q: ScreenPoint, x: Px): ScreenPoint | null {
  const dx = q.px - p.px;
  if (Math.abs(dx) < 1e-9) return null;
  const t = (x - p.px) / dx;
  return lerp(p, q, t);
}

export interface LabelBox {
  x: Px;
  y: Px;
  width: Px;
  height: Px;
}

/** Approximate width of a label in the board's 10 px font, px per character (Roboto averages about 0.56 em). */
const LABEL_CHAR_PX = 5.6;
const LABEL_HEIGHT_PX = 12;

function overlaps(a: LabelBox, b: LabelBox): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

/**
 * Places name labels beside their handles without covering each other: each tries four spots
 * round its handle (right-above first) and is left out when all four are taken. `priority`
 * labels (selected pivots) go first, so they always show.
 */
export function placeLabels(
  items: readonly { id: string; at: ScreenPoint; text: string; priority?: boolean }[],
  handles: readonly ScreenPoint[] = [],
): Map<string, LabelBox> {
  const placed = new Map<string, LabelBox>();
  const taken: LabelBox[] = handles.map((h) => ({ x: h.px - 6, y: h.py - 6, width: 12, height: 12 }));
  const order = [...items].sort((a, b) => Number(!!b.priority) - Number(!!a.priority));
  for (const it of order) {
    const width = it.text.length * LABEL_CHAR_PX + 2;
    const spots: LabelBox[] = [
      { x: it.at.px + 8, y: it.at.py - 15, width, height: LABEL_HEIGHT_PX },
      { x: it.at.px - 8 - width, y: it.at.py - 15, width, height: LABEL_HEIGHT_PX },
      { x: it.at.px + 8, y: it.at.py + 4, width, height: LABEL_HEIGHT_PX },
      { x: it.at.px - 8 - width, y: it.at.py + 4, width, height: LABEL_HEIGHT_PX },
    ];
    const spot = spots.find((s) => !taken.some((t) => overlaps(s, t)));
    if (spot || it.priority) {
      const box = spot ?? spots[0];
      placed.set(it.id, box);
      taken.push(box);
    }
  }
  return placed;
}

/**
 * Where the segment from p to q, with p inside the box [x0, x1] × [y0, y1], leaves it; null when q
 * is inside too (Liang–Barsky clipping, for the label of an instant centre off the view).
 */
export function exitPoint(p: ScreenPoint, q: ScreenPoint, x0: Px, y0: Px, x1: Px, y1: Px): ScreenPoint | null {
  if (q.px >= x0 && q.px <= x1 && q.py >= y0 && q.py <= y1) return null;
  const dx = q.px - p.px;
  const dy = q.py - p.py;
  let tMax = 1;
  const edges: [number, number][] = [
    [-dx, p.px - x0],
    [dx, x1 - p.px],
    [-dy, p.py - y0],
    [dy, y1 - p.py],
  ];
  for (const [den, num] of edges) {
    if (den > 0) tMax = Math.min(tMax, num / den);
  }
  if (!(tMax >= 0)) return null;
  return { px: p.px + dx * tMax, py: p.py + dy * tMax };
}
