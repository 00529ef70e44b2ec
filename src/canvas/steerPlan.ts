/**
 * The plan view's geometry at a steer row, in the ground plane (x forward, y left, mm): the rear axle
 * line, each front wheel's axle line (through its contact patch, square to its heading) carried to the
 * rear axle line, the turning centre where the outer wheel's line meets it and the turning radius from
 * there to the outer wheel's contact patch — the construction the steer sweep reads its turning radius
 * from (shared/kinematics/steer/readings.ts). With true Ackermann both lines meet the rear axle line at
 * one point; the gap between their ends is what the Ackermann % measures. Plain plane geometry.
 */
import { turnSense } from '../../shared/kinematics/steer/readings';
import type { Deg, Mm } from '../../shared/units';

type Side = 'left' | 'right';
export interface GroundPoint {
  x: Mm;
  y: Mm;
}

export interface PlanWheel {
  side: Side;
  /** mm, the contact patch */
  patch: GroundPoint;
  /** deg, positive toward the vehicle's left */
  steer: Deg;
}

export interface PlanAxleLine {
  side: Side;
  from: GroundPoint;
  /** where the wheel's axle line meets the rear axle line; null straight ahead (they are parallel) */
  to: GroundPoint | null;
}

export interface SteerPlanGeometry {
  /** mm, x of the rear axle line */
  rearX: Mm;
  /** each front wheel's axle line to the rear axle line */
  axleLines: PlanAxleLine[];
  /** which wheel is on the outside of the turn; null straight ahead */
  outer: Side | null;
  /** the turning centre (the outer wheel's axle line on the rear axle line); null straight ahead */
  centre: GroundPoint | null;
  /** mm, from the centre to the outer wheel's contact patch; null straight ahead */
  radius: Mm | null;
}

const DEG = Math.PI / 180;

/** Where the axle line through `patch`, square to the heading `steer` (deg), meets x = rearX; null when parallel. */
export function axleLineToRear(patch: GroundPoint, steer: Deg, rearX: Mm): GroundPoint | null {
  // Heading (cos δ, sin δ); the axle line runs along (−sin δ, cos δ).
  const dx = -Math.sin(steer * DEG),
    dy = Math.cos(steer * DEG);
  if (!(Math.abs(dx) > 1e-9)) return null;
  const s = (rearX - patch.x) / dx;
  const y = patch.y + s * dy;
  return Number.isFinite(y) ? { x: rearX, y } : null;
}

export function steerPlanGeometry(wheels: readonly PlanWheel[], rearX: Mm): SteerPlanGeometry {
  const left = wheels.find((w) => w.side === 'left');
  const right = wheels.find((w) => w.side === 'right');
  const axleLines = wheels.map((w) => ({ side: w.side, from: w.patch, to: axleLineToRear(w.patch, w.steer, rearX) }));
  const sense = left && right ? turnSense(left.steer, right.steer) : 0;
  if (sense === 0) return { rearX, axleLines, outer: null, centre: null, radius: null };
  const outer: Side = sense > 0 ? 'right' : 'left';
  const line = axleLines.find((l) => l.side === outer);
  const centre = line?.to ?? null;
  const radius = centre && line ? Math.hypot(line.from.x - centre.x, line.from.y - centre.y) : null;
  return { rearX, axleLines, outer, centre, radius };
}
