/**
 * The readings taken from the ground under the wheels (metrics/ground.ts), for every layout,
 * after the layout readers have filled a row: the heights of the roll centre and the side-view
 * instant centre above that ground, and, for wheels on their own carriers (arms, knuckles), the
 * contact points' track change and each wheel's camber to the ground. Each tyre's spin axis is
 * the lateral axis at ride (a sketch has no static camber or toe), turned by its body's pose.
 */
import { cleanZero } from './clean';
import {
  contactDistanceFromCentreline,
  groundCamberOfAxis,
  groundUnder,
  heightAboveGround,
  type GroundUnder,
  type TyreCircle,
} from './metrics/ground';
import type { LinkageModel, PointModel } from './model';
import { FRAME_SLOT } from './model';
import { POSE_SIZE, rotationSetCreate, rotationSetFill } from './pose';
import type { FrontPoint, HeaveRow, RollRow, SidePoint } from './types';
import type { Vec3 } from './vec';

const clean = cleanZero;

interface WheelPlan {
  point: PointModel;
  /** the wheel's body slot (FRAME_SLOT: the wheel never moves) */
  slot: number;
  /** outward lateral direction: +1 on the left, −1 on the right */
  out: 1 | -1;
}

export interface GroundPlan {
  /** mm, `vehicle.tireRadius` */
  radius: number;
  left: WheelPlan;
  right: WheelPlan;
  /** both wheels ride on their own carriers (arms, knuckles): the per-wheel readings apply */
  independent: boolean;
  /** mm, each contact point's distance from the centreline along the ground at ride; null without a ride ground */
  rideContact: { left: number; right: number } | null;
}

const rotation = rotationSetCreate();

/** The tyre of `w` at the state (its wheel centre placed at `centre`). */
function tyreAt(w: WheelPlan, centre: Vec3, state: Float64Array | null): TyreCircle {
  if (!state || w.slot === FRAME_SLOT) return { centre, axis: { x: 0, y: w.out, z: 0 } };
  const o = w.slot * POSE_SIZE;
  rotationSetFill(rotation, state[o + 3], state[o + 4], state[o + 5]);
  // The rotation's second column is the body's lateral axis.
  return { centre, axis: { x: w.out * rotation[1], y: w.out * rotation[4], z: w.out * rotation[7] } };
}

export function groundPlanBuild(model: LinkageModel): GroundPlan {
  const wheel = (point: PointModel, out: 1 | -1): WheelPlan => ({ point, slot: point.slot, out });
  const left = wheel(model.wheelLeft, 1),
    right = wheel(model.wheelRight, -1);
  const carrier = (w: WheelPlan) => w.slot !== FRAME_SLOT && model.bodies[w.slot]?.role === 'wheel-carrier';
  const radius = model.sketch.vehicle.tireRadius;
  const ride = groundUnder(tyreAt(left, left.point.ride, null), tyreAt(right, right.point.ride, null), radius, 0);
  return {
    radius,
    left,
    right,
    independent: carrier(left) && carrier(right),
    rideContact: ride
      ? { left: contactDistanceFromCentreline(ride, 'left'), right: contactDistanceFromCentreline(ride, 'right') }
      : null,
  };
}

function groundAt(plan: GroundPlan, wl: Vec3, wr: Vec3, state: Float64Array, rollDeg: number): GroundUnder | null {
  return groundUnder(
    tyreAt(plan.left, wl, state),
    tyreAt(plan.right, wr, state),
    plan.radius,
    (rollDeg * Math.PI) / 180,
  );
}

function contactChange(plan: GroundPlan, g: GroundUnder | null): { left: number; right: number } | null {
  if (!g || !plan.rideContact) return null;
  return {
    left: clean(contactDistanceFromCentreline(g, 'left') - plan.rideContact.left),
    right: clean(contactDistanceFromCentreline(g, 'right') - plan.rideContact.right),
  };
}

function heights(
  g: GroundUnder | null,
  rollCenter: FrontPoint | null,
  instantCenter: SidePoint | null,
  wl: Vec3,
): Pick<HeaveRow, 'rollCenterAboveGround' | 'instantCenterAboveGround'> {
  return {
    rollCenterAboveGround: g && rollCenter ? clean(heightAboveGround(g, rollCenter.y, rollCenter.z)) : null,
    // The side view is taken in the fore-aft plane through the left wheel centre.
    instantCenterAboveGround: g && instantCenter ? clean(heightAboveGround(g, wl.y, instantCenter.z)) : null,
  };
}

/** The ground readings of a heave row whose layout fields are filled in; `wl`, `wr` the placed wheel centres. */
export function heaveGroundFields(
  plan: GroundPlan,
  row: HeaveRow,
  wl: Vec3,
  wr: Vec3,
  state: Float64Array,
): Partial<HeaveRow> {
  const g = groundAt(plan, wl, wr, state, 0);
  const rc = row.rollCenterHeight === null ? null : { y: 0, z: row.rollCenterHeight };
  const out: Partial<HeaveRow> = heights(g, rc, row.instantCenter, wl);
  if (plan.independent) out.contactTrackChange = contactChange(plan, g)?.left ?? null;
  return out;
}

/** The ground readings of a roll row at `rollDeg`, from the layout readers' roll centre and instant centre. */
export function rollGroundFields(
  plan: GroundPlan,
  centres: { rollCenter: FrontPoint | null; instantCenter: SidePoint | null },
  wl: Vec3,
  wr: Vec3,
  state: Float64Array,
  rollDeg: number,
): Partial<RollRow> {
  const g = groundAt(plan, wl, wr, state, rollDeg);
  const out: Partial<RollRow> = heights(g, centres.rollCenter, centres.instantCenter, wl);
  if (plan.independent) {
    out.contactTrackChange = contactChange(plan, g);
    out.trackChange = {
      left: clean(Math.abs(wl.y) - Math.abs(plan.left.point.ride.y)),
      right: clean(Math.abs(wr.y) - Math.abs(plan.right.point.ride.y)),
    };
    out.groundCamber = g
      ? {
          left: clean(groundCamberOfAxis(tyreAt(plan.left, wl, state).axis, g.normal)),
          right: clean(groundCamberOfAxis(tyreAt(plan.right, wr, state).axis, g.normal)),
        }
      : null;
  }
  return out;
}
