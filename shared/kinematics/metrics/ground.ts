/**
 * The ground under the wheels at one row, and what is read off it (docs/sketch-format.md,
 * "Ground and contact patches"). The frame is held still in the sweep, so the ground moves:
 * it is the plane, level fore and aft in the frame's axes, on which both tyres stand. Each
 * tyre is the circle of the vehicle's tyre radius about its wheel centre in the wheel plane
 * (square to the spin axis); its contact point is the circle's lowest point measured square
 * to that ground. The ground is the plane through the two contact points, and the contact
 * points depend (to second order only) on the ground's tilt, so the two are found together by
 * a few fixed-point steps from the tilt the sweep imposes (level in heave, the roll in roll).
 * Plain circle and plane geometry, no published source needed.
 */
import type { Deg, Mm } from '../../units';
import * as units from '../../units';
import type { Vec3 } from '../vec';

const radToDeg = units.radToDeg;

/** One tyre: its wheel centre (mm) and its spin axis pointing out of the vehicle (unit). */
export interface TyreCircle {
  centre: Vec3;
  axis: Vec3;
}

/** The ground under both tyres: the two contact points (mm) and the ground's upward unit normal (no x part). */
export interface GroundUnder {
  left: Vec3;
  right: Vec3;
  normal: Vec3;
}

/** The fixed-point steps stop when the ground's tilt moves less than this (rad): far below any reading's digits. */
const TILT_TOLERANCE_RAD = 1e-13;
/** Each step squares the tilt error (the contact points' heights move to second order), so a few steps suffice. */
const MAX_STEPS = 12;

/**
 * The lowest point (mm) of a tyre circle measured along `up` (a unit vector): the centre plus
 * `radius` along the part of −up that lies in the wheel plane. null when the wheel plane lies
 * flat on the ground (no lowest point).
 */
export function contactPoint(tyre: TyreCircle, up: Vec3, radius: Mm): Vec3 | null {
  const a = tyre.axis;
  const k = up.x * a.x + up.y * a.y + up.z * a.z;
  // −up with its component along the spin axis removed: the steepest way down in the wheel plane.
  const dx = -(up.x - k * a.x),
    dy = -(up.y - k * a.y),
    dz = -(up.z - k * a.z);
  const n = Math.hypot(dx, dy, dz);
  if (!(n > 1e-9)) return null;
  const s = radius / n;
  return { x: tyre.centre.x + s * dx, y: tyre.centre.y + s * dy, z: tyre.centre.z + s * dz };
}

/**
 * The ground both tyres stand on, starting from the tilt `rollRad` (rad, positive raising the
 * left side: the ground z = y·tan(roll) of a roll row, 0 in heave). null when a wheel lies flat
 * or the two contact points stand one above the other.
 */
export function groundUnder(left: TyreCircle, right: TyreCircle, radius: Mm, rollRad: number): GroundUnder | null {
  let up: Vec3 = { x: 0, y: -Math.sin(rollRad), z: Math.cos(rollRad) };
  for (let step = 0; step < MAX_STEPS; step++) {
    const l = contactPoint(left, up, radius);
    const r = contactPoint(right, up, radius);
    if (!l || !r) return null;
    // The ground holds the fore-aft direction and the line from the right contact point to the left one.
    const ey = l.y - r.y,
      ez = l.z - r.z;
    const len = Math.hypot(ey, ez);
    if (!(ey > 1e-9 * Math.max(1, len))) return null;
    const next: Vec3 = { x: 0, y: -ez / len, z: ey / len };
    const moved = Math.abs(next.y - up.y) + Math.abs(next.z - up.z);
    up = next;
    if (moved < TILT_TOLERANCE_RAD) return { left: l, right: r, normal: up };
  }
  const l = contactPoint(left, up, radius);
  const r = contactPoint(right, up, radius);
  return l && r ? { left: l, right: r, normal: up } : null;
}

/** Height (mm) of the point (y, z) of the frame's rear view above the ground, measured square to the ground. */
export function heightAboveGround(g: GroundUnder, y: Mm, z: Mm): Mm {
  return (y - g.left.y) * g.normal.y + (z - g.left.z) * g.normal.z;
}

/**
 * Distance (mm) of a wheel's contact point from the vehicle's centreline, measured along the
 * ground from where the centreline plane (y = 0) meets it; outward positive on either side.
 * With level ground it is the contact point's |y|.
 */
export function contactDistanceFromCentreline(g: GroundUnder, side: 'left' | 'right'): Mm {
  // Unit direction along the ground towards the left (square to the normal in the rear view).
  const uy = g.normal.z,
    uz = -g.normal.y;
  // Where the line through the contact points crosses y = 0 (uy > 0: the ground is never vertical here).
  const t = -g.left.y / uy;
  const fy = g.left.y + t * uy,
    fz = g.left.z + t * uz;
  const p = side === 'left' ? g.left : g.right;
  const along = (p.y - fy) * uy + (p.z - fz) * uz;
  return side === 'left' ? along : -along;
}

/**
 * Camber (deg) of a wheel relative to the ground: the angle of the wheel plane from the
 * ground's normal, positive when the top of the wheel leans out (the sign of `camberChange`).
 * `axis` is the outward unit spin axis: leaning the top out tips it towards the ground.
 */
export function groundCamberOfAxis(axis: Vec3, normal: Vec3): Deg {
  const k = axis.x * normal.x + axis.y * normal.y + axis.z * normal.z;
  return radToDeg(Math.asin(Math.max(-1, Math.min(1, -k))));
}
