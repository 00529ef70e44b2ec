/**
 * What the plan view (from above, front up, the vehicle's left on the left) draws at a steer row, in the
 * ground plane: the front wheels turned, the members seen from above, the rear axle line, each front wheel's
 * axle line carried to it, the turning centre and the arc of the outer front wheel's contact patch about it.
 * Pure: the component only turns it into shapes.
 */
import type { Sketch } from '../../shared/schema/sketch';
import type { SteerResult, SteerRow } from '../../shared/kinematics/types';
import { pointsAt } from '../../shared/kinematics/points';
import type { Mm } from '../../shared/units';
import type { Vec3 } from '../../shared/vec3';
import { steerPlanGeometry, type GroundPoint, type SteerPlanGeometry } from './steerPlan';
import { turnedWheels, type TurnedWheel } from './steerWheels';

export interface PlanScene {
  wheels: TurnedWheel[];
  /** every sketch point at the row (mm) */
  points: Record<string, Vec3>;
  geometry: SteerPlanGeometry;
}

/** mm, x of the rear axle line: the front wheel centres' ride x less the wheelbase (as the steer sweep takes it). */
export function rearAxleX(sketch: Sketch): Mm | null {
  const at = (id: string) => sketch.points.find((p) => p.id === id);
  const l = at(sketch.wheels.left);
  const r = at(sketch.wheels.right);
  return l && r ? (l.x + r.x) / 2 - sketch.vehicle.wheelbase : null;
}

/**
 * Every sketch point at a steer row: bodies by the row's poses, the rack's frame points moved by the row's
 * rack travel along the rack's direction (docs/design/steering.md, "What a board needs from it").
 */
export function steerRowPoints(sketch: Sketch, steer: SteerResult, row: SteerRow): Record<string, Vec3> {
  const points = pointsAt(sketch, row.bodies);
  const d = steer.rackDirection;
  const along = steer.input === 'rack' ? row.rack : 0;
  if (d && along)
    for (const id of steer.rackPoints) {
      const p = points[id];
      if (p) points[id] = { x: p.x + along * d.x, y: p.y + along * d.y, z: p.z + along * d.z };
    }
  return points;
}

/** The plan view's scene at a row (points given, or placed from the row). */
export function planScene(
  sketch: Sketch,
  steer: SteerResult,
  row: SteerRow,
  points: Record<string, Vec3> = steerRowPoints(sketch, steer, row),
): PlanScene | null {
  const rearX = rearAxleX(sketch);
  if (rearX === null) return null;
  const wheels = turnedWheels(sketch, row, points);
  const geometry = steerPlanGeometry(
    wheels.flatMap((w) => (w.patch ? [{ side: w.side, patch: w.patch, steer: w.steer }] : [])),
    rearX,
  );
  return { wheels, points, geometry };
}

/** Points along the arc about `centre` through `from`, `sweepRad` each way of it (for a dashed arc). */
export function arcPoints(centre: GroundPoint, from: GroundPoint, sweepRad: number, samples = 48): GroundPoint[] {
  const r = Math.hypot(from.x - centre.x, from.y - centre.y);
  const a0 = Math.atan2(from.y - centre.y, from.x - centre.x);
  const out: GroundPoint[] = [];
  for (let i = 0; i <= samples; i++) {
    const a = a0 - sweepRad + (2 * sweepRad * i) / samples;
    out.push({ x: centre.x + r * Math.cos(a), y: centre.y + r * Math.sin(a) });
  }
  return out;
}
