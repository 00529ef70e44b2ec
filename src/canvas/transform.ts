/**
 * The board's third space: Konva stage pixels. Sketch coordinates are vehicle axes in mm
 * (x forward, y left, z up); each view shows one plane of them, and this module is the only
 * place that turns one into the other.
 *
 * - Side view (x–z), seen from the vehicle's left: the front (+x) is to the LEFT of the screen.
 * - Rear view (y–z), seen from behind: the vehicle's left (+y) is on the LEFT of the screen.
 *
 * So in both views the horizontal plane coordinate `h` grows to the left, and z grows up;
 * screen pixels grow right and down.
 */
import { mmToUnit, unitToMm, type LengthUnit, type Mm } from '../../shared/units';
import type { Vec3 } from '../../shared/vec3';

export type ViewKind = 'side' | 'rear';

/** Stage pixels (from the top-left corner of the canvas). */
export type Px = number;

/**
 * A position in a view's plane: `h` is x (side view) or y (rear view), `v` is z. A type rather than an
 * interface, so that it fits the loose `centre` object of a tracing in the sketch document.
 */
export type PlanePoint = { h: Mm; v: Mm };

export interface ScreenPoint {
  px: Px;
  py: Px;
}

/** Where the plane's origin sits on the stage and how many pixels one millimetre takes. */
export interface ViewTransform {
  /** px per mm */
  scale: number;
  /** stage x of h = 0 */
  originX: Px;
  /** stage y of v = 0 (the ground at ride) */
  originY: Px;
}

/** Zoom limits: from a whole vehicle on a phone to a bracket's bolt holes (px per mm). */
const MIN_SCALE = 0.02;
export const MAX_SCALE = 20;

export function planeOf(view: ViewKind, p: Vec3): PlanePoint {
  return { h: view === 'side' ? p.x : p.y, v: p.z };
}

export function planeToScreen(t: ViewTransform, q: PlanePoint): ScreenPoint {
  return { px: t.originX - q.h * t.scale, py: t.originY - q.v * t.scale };
}

export function screenToPlane(t: ViewTransform, s: ScreenPoint): PlanePoint {
  return { h: (t.originX - s.px) / t.scale, v: (t.originY - s.py) / t.scale };
}

export function toScreen(view: ViewKind, t: ViewTransform, p: Vec3): ScreenPoint {
  return planeToScreen(t, planeOf(view, p));
}

/** Zooms by `factor` about the stage point (px, py), which stays over the same plane point. */
export function zoomAt(t: ViewTransform, factor: number, px: Px, py: Px): ViewTransform {
  const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, t.scale * factor));
  const k = scale / t.scale;
  return { scale, originX: px - (px - t.originX) * k, originY: py - (py - t.originY) * k };
}

export function panBy(t: ViewTransform, dpx: Px, dpy: Px): ViewTransform {
  return { ...t, originX: t.originX + dpx, originY: t.originY + dpy };
}

export interface PlaneBounds {
  hMin: Mm;
  hMax: Mm;
  vMin: Mm;
  vMax: Mm;
}

/** The smallest box holding all the plane points (null for none). */
export function boundsOf(points: readonly PlanePoint[]): PlaneBounds | null {
  if (points.length === 0) return null;
  const b = { hMin: Infinity, hMax: -Infinity, vMin: Infinity, vMax: -Infinity };
  for (const p of points) {
    b.hMin = Math.min(b.hMin, p.h);
    b.hMax = Math.max(b.hMax, p.h);
    b.vMin = Math.min(b.vMin, p.v);
    b.vMax = Math.max(b.vMax, p.v);
  }
  return b;
}

/** A transform that shows `b` whole and centred in a width × height stage with `margin` px all round. */
export function fitTransform(b: PlaneBounds, width: Px, height: Px, margin: Px = 32): ViewTransform {
  const w = Math.max(b.hMax - b.hMin, 1);
  const h = Math.max(b.vMax - b.vMin, 1);
  const usableW = Math.max(width - 2 * margin, 1);
  const usableH = Math.max(height - 2 * margin, 1);
  const scale = Math.min(MAX_SCALE, Math.max(MIN_SCALE, Math.min(usableW / w, usableH / h)));
  const hMid = (b.hMin + b.hMax) / 2;
  const vMid = (b.vMin + b.vMax) / 2;
  return { scale, originX: width / 2 + hMid * scale, originY: height / 2 + vMid * scale };
}

/** Steps a grid may take, per decade of the user's unit. */
const NICE_MANTISSAS = [1, 2, 5];

/**
 * The grid step (mm) for a scale: the smallest 1-2-5 step in the user's unit whose lines are at
 * least `minPx` apart, so an inch user gets inch lines (1, 2, 5, 10 in…) and a metric user mm.
 */
export function gridStep(scale: number, unit: LengthUnit, minPx: Px = 36): Mm {
  const minUnits = mmToUnit(minPx / scale, unit);
  let decade = 10 ** Math.floor(Math.log10(minUnits));
  for (;;) {
    for (const m of NICE_MANTISSAS) {
      const step = m * decade;
      if (step >= minUnits * (1 - 1e-9)) return unitToMm(step, unit);
    }
    decade *= 10;
  }
}

/** The multiples of `step` (mm) from `lo` to `hi` (mm), for grid lines. */
export function gridValues(lo: Mm, hi: Mm, step: Mm): Mm[] {
  const out: Mm[] = [];
  const first = Math.ceil(Math.min(lo, hi) / step);
  const last = Math.floor(Math.max(lo, hi) / step);
  // A runaway count would only come from a broken scale; a stage never needs more lines than this.
  if (last - first > 2000) return out;
  for (let k = first; k <= last; k++) out.push(k * step);
  return out;
}

/** The plane area a stage shows. */
export function visibleBounds(t: ViewTransform, width: Px, height: Px): PlaneBounds {
  const a = screenToPlane(t, { px: 0, py: 0 });
  const b = screenToPlane(t, { px: width, py: height });
  return { hMin: Math.min(a.h, b.h), hMax: Math.max(a.h, b.h), vMin: Math.min(a.v, b.v), vMax: Math.max(a.v, b.v) };
}

/** Rounds a length (mm) to the nearest multiple of `step` (mm). */
export function snapTo(v: Mm, step: Mm): Mm {
  if (!(step > 0)) return v;
  const snapped = Math.round(v / step) * step;
  // 12 significant digits: removes the float noise of inch steps (0.1 in = 2.54 mm) without moving a point.
  return Number(snapped.toPrecision(12));
}
