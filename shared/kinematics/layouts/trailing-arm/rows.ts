/**
 * Trailing-arm (and semi-trailing-arm) readings of one row (docs/sketch-format.md, "Trailing-arm
 * layouts"), added to the generic rows (rows.ts, through reader.ts) when wheels ride on arms with hinges:
 * - heave, for the left arm: camber, toe, track change (metrics/wheel.ts); the side-view
 *   instant centre where the hinge axis meets the fore-aft plane through the wheel centre,
 *   anti-squat with the line from the wheel centre (frame-mounted drive); the rear-view
 *   instant centre and the roll-centre height (metrics/hingeAxis.ts);
 * - roll (each arm moves on its own: the left wheel up, the right down): each wheel's camber
 *   relative to the tilted ground and the roll centre where the two patch lines cross.
 * The foreAftShift of the contract is already the left wheel centre's x change (rows.ts).
 */
import { degToRad } from '../../../units';
import { antiSquatPercent } from '../../metrics/antiSquat';
import { axisInView, lineAtCentreline, lineToward, viewLinesCross } from '../../metrics/hingeAxis';
import { wheelAttitude, type WheelSide } from '../../metrics/wheel';
import type { BodyModel, LinkageModel, PointModel } from '../../model';
import { poseFromState } from '../../pose';
import type { HeaveRow, RollRow } from '../../types';
import type { RollCentres } from '../types';
import type { Vec3 } from '../../vec';
import type { PlacePoint } from '../types';

export interface TrailingArmSide {
  side: WheelSide;
  body: BodyModel;
  wheel: PointModel;
  /** mm, the hinge axis' two frame points */
  axisA: Vec3;
  axisB: Vec3;
}

export interface TrailingArmPlan {
  left: TrailingArmSide;
  right: TrailingArmSide | null;
  cgHeight: number;
  wheelbase: number;
}

/** The plan when the left wheel rides on an arm with a hinge; null otherwise. */
export function trailingArmPlanBuild(model: LinkageModel): TrailingArmPlan | null {
  const sideOf = (wheel: PointModel, side: WheelSide): TrailingArmSide | null => {
    const body = model.bodies[wheel.slot];
    if (!body || body.role !== 'wheel-carrier') return null;
    const hinge = model.constraints.find((c) => c.type === 'hinge' && c.slot === body.slot);
    if (!hinge || hinge.type !== 'hinge') return null;
    return { side, body, wheel, axisA: hinge.axisA, axisB: hinge.axisB };
  };
  if (model.wheelLeft.slot < 0) return null;
  const left = sideOf(model.wheelLeft, 'left');
  if (!left) return null;
  const right = model.wheelRight.slot < 0 ? null : sideOf(model.wheelRight, 'right');
  return { left, right, cgHeight: model.sketch.vehicle.cgHeight, wheelbase: model.sketch.vehicle.wheelbase };
}

/** Rear-view line from a contact patch (y, z) through the arm's rear-view instant centre. */
function patchLine(s: TrailingArmSide, wc: Vec3, patch: { u: number; v: number }) {
  const target = axisInView(s.axisA, s.axisB, 'x', wc.x);
  return { target, line: target ? lineToward(patch, target) : null };
}

/** The trailing-arm fields of a heave row at `travel` (mm). */
export function trailingArmHeaveFields(
  plan: TrailingArmPlan,
  at: PlacePoint,
  state: Float64Array,
  travel: number,
  clean: (v: number) => number,
): Partial<HeaveRow> {
  const s = plan.left;
  const wc = at(s.wheel);
  const attitude = wheelAttitude(poseFromState(state, s.body.slot), s.body.reference, s.wheel.ride, 'left');

  const side = axisInView(s.axisA, s.axisB, 'y', wc.y);
  const instantCenter = side && 'point' in side ? { x: side.point.u, z: side.point.v } : null;
  // Frame-mounted drive: the line runs from the wheel centre (docs/sketch-format.md, anti-squat).
  const parallelSlope =
    side && 'direction' in side && side.direction.u !== 0 ? side.direction.v / side.direction.u : null;
  const antiSquat = antiSquatPercent(instantCenter, { x: wc.x, z: wc.z }, plan.cgHeight, plan.wheelbase, parallelSlope);

  // In a heave row the ground has risen by the travel; the patch is below the wheel centre.
  const rear = patchLine(s, wc, { u: wc.y, v: travel });
  const rollCenterHeight = rear.line ? lineAtCentreline(rear.line) : null;
  const orNull = (v: number | null) => (v === null ? null : clean(v));
  return {
    camberChange: clean(attitude.camberChange),
    toeChange: clean(attitude.toeChange),
    trackChange: clean(attitude.trackChange),
    instantCenter: instantCenter ? { x: clean(instantCenter.x), z: clean(instantCenter.z) } : null,
    antiSquat: orNull(antiSquat),
    frontViewInstantCenter:
      rear.target && 'point' in rear.target ? { y: clean(rear.target.point.u), z: clean(rear.target.point.v) } : null,
    rollCenterHeight: orNull(rollCenterHeight),
  };
}

/** Foot of the perpendicular from a wheel centre onto the ground, z = y·tan(roll) in the frame's axes (rear view, mm). */
function patchOnTiltedGround(wc: Vec3, rollRad: number): { u: number; v: number } {
  const ny = -Math.sin(rollRad),
    nz = Math.cos(rollRad);
  const d = wc.y * ny + wc.z * nz;
  return { u: wc.y - d * ny, v: wc.z - d * nz };
}

/** The trailing-arm fields of a roll row at `rollDeg` (deg, the left wheel up for positive roll). */
export function trailingArmRollFields(
  plan: TrailingArmPlan,
  at: PlacePoint,
  state: Float64Array,
  rollDeg: number,
  clean: (v: number) => number,
): Partial<RollRow> {
  if (!plan.right) return {};
  const roll = degToRad(rollDeg);
  const sides = [plan.left, plan.right];
  const lines = sides.map((s) => {
    const wc = at(s.wheel);
    return patchLine(s, wc, patchOnTiltedGround(wc, roll)).line;
  });
  const c = lines[0] && lines[1] ? viewLinesCross(lines[0], lines[1]) : null;
  const camber = (s: TrailingArmSide) =>
    wheelAttitude(poseFromState(state, s.body.slot), s.body.reference, s.wheel.ride, s.side).camberChange;
  // The ground tilts by the roll (left side up): relative to it the left wheel leans out by the roll, the right in.
  return {
    rollCenter: c ? { y: clean(c.u), z: clean(c.v) } : null,
    camberToGround: { left: clean(camber(plan.left) + rollDeg), right: clean(camber(plan.right) - rollDeg) },
  };
}

/** The roll centre of a roll row (its `rollCenter`) and the left side-view instant centre (hinge axis in the wheel's fore-aft plane). */
export function trailingArmRollCentres(
  plan: TrailingArmPlan,
  at: PlacePoint,
  state: Float64Array,
  rollDeg: number,
  clean: (v: number) => number,
): RollCentres {
  const wc = at(plan.left.wheel);
  const side = axisInView(plan.left.axisA, plan.left.axisB, 'y', wc.y);
  return {
    rollCenter: trailingArmRollFields(plan, at, state, rollDeg, clean).rollCenter ?? null,
    instantCenter: side && 'point' in side ? { x: clean(side.point.u), z: clean(side.point.v) } : null,
  };
}
