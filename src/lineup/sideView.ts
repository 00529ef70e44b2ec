/**
 * The line-up's overlaid side view as data: the stage transform that fits every shown variant (their
 * pivots and tyres) inside the axes' margins, the axes' ticks and the scale bar in the user's unit, and
 * the pivot nearest a pointer. Pure (stage pixels in, stage pixels out); LineupSideView draws it.
 */
import type { Sketch } from '../../shared/schema/sketch';
import { fixed } from '../../shared/display/format';
import { framePivots } from '../../shared/lineup/framePivots';
import { mmToUnit, type LengthUnit, type Mm } from '../../shared/units';
import {
  boundsOf,
  fitTransform,
  gridStep,
  gridValues,
  planeOf,
  planeToScreen,
  screenToPlane,
  type PlanePoint,
  type Px,
  type ViewTransform,
} from '../canvas/transform';

/** px kept clear for the z axis's labels (left) and the x axis's (bottom). */
export const AXIS_LEFT_PX = 44;
export const AXIS_BOTTOM_PX = 38;

/**
 * The points the line-up draws of a sketch: its moving pivots and its frame brackets. A frame point no
 * member is mounted on (the driveline's reference points: the gearbox output far forward) is no bracket
 * and would only shrink the drawing, so it is left out.
 */
export function drawnPoints(sketch: Sketch): Sketch['points'] {
  const brackets = new Set(framePivots(sketch).map((p) => p.id));
  return sketch.points.filter((p) => p.body !== 'frame' || brackets.has(p.id));
}

/** The transform showing every given sketch's drawn points and tyre, with the ground, inside the axes. */
export function fitSideView(sketches: readonly Sketch[], width: Px, height: Px): ViewTransform | null {
  // The pivots, and each tyre's top and front and back, so the wheels are in view too.
  const planes: PlanePoint[] = sketches.flatMap((v) => {
    const pts = drawnPoints(v).map((p) => planeOf('side', p));
    const wheel = v.points.find((p) => p.id === v.wheels.left);
    if (wheel) {
      const r = v.vehicle.tireRadius;
      pts.push({ h: wheel.x - r, v: wheel.z + r }, { h: wheel.x + r, v: wheel.z + r });
    }
    return pts;
  });
  const b = boundsOf([...planes, { h: planes[0]?.h ?? 0, v: 0 }]);
  if (!b) return null;
  const inner = fitTransform(b, width - AXIS_LEFT_PX, height - AXIS_BOTTOM_PX, 18);
  return { ...inner, originX: inner.originX + AXIS_LEFT_PX };
}

export interface Tick {
  /** stage px along the axis */
  at: Px;
  label: string;
}

export interface SideAxes {
  /** x ticks along the bottom edge (the front is to the left, as on the board) */
  x: Tick[];
  /** z ticks along the left edge */
  z: Tick[];
  /** the scale bar: its length in px and what it stands for */
  bar: { px: Px; label: string };
}

/** Ticks every grid step of the user's unit that falls inside the plotting area, and a scale bar of one step. */
export function sideAxes(t: ViewTransform, width: Px, height: Px, u: LengthUnit): SideAxes {
  const step = gridStep(t.scale, u, 56);
  const stepInUnit = mmToUnit(step, u);
  const digits = stepInUnit >= 1 ? 0 : stepInUnit >= 0.1 ? 1 : 2;
  const show = (v: Mm) => fixed(mmToUnit(v, u), digits);
  const left = screenToPlane(t, { px: AXIS_LEFT_PX, py: 0 });
  const right = screenToPlane(t, { px: width, py: height - AXIS_BOTTOM_PX });
  const x = gridValues(right.h, left.h, step)
    .map((h) => ({ at: planeToScreen(t, { h, v: 0 }).px, label: show(h) }))
    .filter((tk) => tk.at >= AXIS_LEFT_PX + 8 && tk.at <= width - 8);
  const z = gridValues(right.v, left.v, step)
    .map((v) => ({ at: planeToScreen(t, { h: 0, v }).py, label: show(v) }))
    .filter((tk) => tk.at >= 8 && tk.at <= height - AXIS_BOTTOM_PX - 4);
  return { x, z, bar: { px: step * t.scale, label: `${fixed(stepInUnit, digits)} ${u}` } };
}

export interface DrawnPivot {
  px: Px;
  py: Px;
  /** e.g. "Four-link · LL.fl (frame)" */
  label: string;
}

/** The pivots within `reach` px of the pointer nearest it (every variant's pivot drawn on that spot), nearest first. */
export function pivotsNear(pivots: readonly DrawnPivot[], px: Px, py: Px, reach: Px = 10): DrawnPivot[] {
  const d = (p: DrawnPivot) => Math.hypot(p.px - px, p.py - py);
  const near = pivots.filter((p) => d(p) <= reach).sort((a, b) => d(a) - d(b));
  if (!near.length) return [];
  const first = near[0];
  // Pivots drawn on one spot (a shared bracket) are named together.
  return near.filter((p) => Math.hypot(p.px - first.px, p.py - first.py) <= 3);
}
