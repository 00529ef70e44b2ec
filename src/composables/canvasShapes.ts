/**
 * Drawing geometry of members on a stage, in pixels: a spring's coil, a shock's stroke marks,
 * a hinge's axis line. Pure functions of screen points, so they are cheap to run every frame.
 */
import type { Px, ScreenPoint } from './canvasTransform';

/** Below this screen length (px) a member is drawn as a plain line: a coil or marks would be noise. */
export const MIN_DETAIL_PX = 14;

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
export function shockMarks(a: ScreenPoint, b: ScreenPoint, length: number, minLength?: number, maxLength?: number, tick: Px = 6): ShockMarks {
  const dx = b.px - a.px;
  const dy = b.py - a.py;
  const len = Math.hypot(dx, dy);
  const nx = len > 0 ? -dy / len : 0;
  const ny = len > 0 ? dx / len : 0;
  const mark = (mm?: number): ScreenPoint | null => (mm && length > 0 ? lerp(a, b, mm / length) : null);
  const tickAt = (p: ScreenPoint | null) => (p && len >= MIN_DETAIL_PX ? [p.px - nx * tick, p.py - ny * tick, p.px + nx * tick, p.py + ny * tick] : null);
  const compressed = mark(minLength);
  const extended = mark(maxLength);
  // The body reaches to where the shaft would bottom out; without limits, a little past halfway.
  const bodyEnd = compressed && minLength! < length ? lerp(a, b, Math.max(0.35, (minLength! / length) * 0.85)) : lerp(a, b, 0.55);
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
