/**
 * The front wheels at a steer row, as the board draws them turned: each wheel's centre, its outward
 * spin axis (the ride axis ±y turned by its body's pose, as the steer sweep reads it), its steer
 * angle and its contact patch (the tyre circle's lowest point on level ground, shared/kinematics/
 * metrics/ground.ts). And a tyre's outline in any view: the convex hull of its two sidewall
 * circles projected, so one function draws a turned tyre from the side, the front and above.
 */
import type { MovingBodyId, Sketch } from '../../shared/schema/sketch';
import { sketchBodyReferences } from '../../shared/kinematics/model';
import type { Pose, SteerRow } from '../../shared/kinematics/types';
import { poseApply } from '../../shared/kinematics/pose';
import { contactPoint } from '../../shared/kinematics/metrics/ground';
import type { Deg, Mm } from '../../shared/units';
import type { Vec3 } from '../../shared/vec3';

export type Side = 'left' | 'right';

export interface TurnedWheel {
  side: Side;
  /** the id of the body carrying the wheel (its knuckle) */
  body: string;
  /** mm, the wheel centre at the row */
  centre: Vec3;
  /** unit, the spin axis pointing out of the vehicle */
  axis: Vec3;
  /** deg, the row's steer angle of this wheel, positive toward the vehicle's left */
  steer: Deg;
  /** mm, the contact patch on level ground (x, y); null if the wheel lay flat */
  patch: { x: Mm; y: Mm } | null;
}

const ORIGIN: Vec3 = { x: 0, y: 0, z: 0 };

/** A direction turned by a body's pose (its rotation only). */
function turn(pose: Pose | undefined, v: Vec3): Vec3 {
  return pose ? poseApply({ ...pose, x: 0, y: 0, z: 0 }, ORIGIN, v) : v;
}

/** The two front wheels at a steer row, placed by `points` (every sketch point at the row, mm). */
export function turnedWheels(sketch: Sketch, row: SteerRow, points: Record<string, Vec3>): TurnedWheel[] {
  const out: TurnedWheel[] = [];
  const r = sketch.vehicle.tireRadius;
  const refs = sketchBodyReferences(sketch);
  for (const side of ['left', 'right'] as const) {
    const id = sketch.wheels[side];
    const ride = sketch.points.find((p) => p.id === id);
    if (!ride) continue;
    // The wheel turns with its knuckle. A steered solid axle keeps its wheel centres on the axle body and turns
    // the knuckle on its kingpin: the sweep reads the wheel as carried by the knuckle, and so is it drawn here.
    const poses = row.bodies as Partial<Record<string, Pose>>;
    const knuckle = `knuckle-${side}`;
    const carrier = poses[knuckle] && refs.has(knuckle as MovingBodyId) ? knuckle : ride.body;
    const pose = poses[carrier];
    const ref = refs.get(carrier as MovingBodyId);
    const centre = carrier === ride.body ? points[id] : pose && ref ? poseApply(pose, ref, ride) : points[id];
    if (!centre) continue;
    const axis = turn(pose, { x: 0, y: side === 'left' ? 1 : -1, z: 0 });
    const patch = contactPoint({ centre, axis }, { x: 0, y: 0, z: 1 }, r);
    out.push({
      side,
      body: ride.body,
      centre,
      axis,
      steer: side === 'left' ? row.leftSteer : row.rightSteer,
      patch: patch ? { x: patch.x, y: patch.y } : null,
    });
  }
  return out;
}

/** Points round each sidewall circle: enough for a smooth ellipse at any zoom the board allows. */
const SIDEWALL_SAMPLES = 48;

/** Convex hull (Andrew's monotone chain) of screen points, counter-clockwise, without repeats. */
export function convexHull<P extends { px: number; py: number }>(points: readonly P[]): P[] {
  const pts = [...points].sort((a, b) => a.px - b.px || a.py - b.py);
  if (pts.length < 3) return pts;
  const cross = (o: P, a: P, b: P) => (a.px - o.px) * (b.py - o.py) - (a.py - o.py) * (b.px - o.px);
  const lower: P[] = [];
  for (const p of pts) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: P[] = [];
  for (let i = pts.length - 1; i >= 0; i--) {
    const p = pts[i];
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], p) <= 0) upper.pop();
    upper.push(p);
  }
  return [...lower.slice(0, -1), ...upper.slice(0, -1)];
}

/**
 * A tyre's outline as seen through `project` (mm → screen): the hull of its two sidewalls, circles of
 * radius `radius` square to the spin axis, `width` apart about the wheel centre.
 */
export function tyreOutline<P extends { px: number; py: number }>(
  wheel: Pick<TurnedWheel, 'centre' | 'axis'>,
  radius: Mm,
  width: Mm,
  project: (p: Vec3) => P,
): P[] {
  const a = wheel.axis;
  // Two unit vectors square to the axis and to each other span the wheel plane.
  const ref = Math.abs(a.z) < 0.9 ? { x: 0, y: 0, z: 1 } : { x: 1, y: 0, z: 0 };
  const u = normalized(crossOf(a, ref));
  const v = crossOf(a, u);
  const pts: P[] = [];
  for (const off of [-width / 2, width / 2]) {
    for (let i = 0; i < SIDEWALL_SAMPLES; i++) {
      const t = (2 * Math.PI * i) / SIDEWALL_SAMPLES;
      const c = Math.cos(t) * radius,
        s = Math.sin(t) * radius;
      pts.push(
        project({
          x: wheel.centre.x + a.x * off + u.x * c + v.x * s,
          y: wheel.centre.y + a.y * off + u.y * c + v.y * s,
          z: wheel.centre.z + a.z * off + u.z * c + v.z * s,
        }),
      );
    }
  }
  return convexHull(pts);
}

function crossOf(a: Vec3, b: Vec3): Vec3 {
  return { x: a.y * b.z - a.z * b.y, y: a.z * b.x - a.x * b.z, z: a.x * b.y - a.y * b.x };
}

function normalized(a: Vec3): Vec3 {
  const n = Math.hypot(a.x, a.y, a.z) || 1;
  return { x: a.x / n, y: a.y / n, z: a.z / n };
}
