/**
 * Double-wishbone readings of one row (docs/sketch-format.md, "Double-wishbone layouts"), added to
 * the generic heave and roll rows by rows.ts when the sketch has knuckles on wishbones:
 * - heave: the left wheel's camber, toe (bump steer), track and caster change; the front-view
 *   instant centre and the roll-centre height by the format's construction; the side-view
 *   instant centre (in the contract's `instantCenter`) and anti-dive; the kingpin axis;
 * - roll (body roll; the left wheel up for positive roll): each wheel's camber relative to
 *   the tilted ground, and the roll centre where the two patch lines cross.
 */
import { degToRad } from '../../../units';
import { antiDivePercent } from '../../metrics/antiDive';
import { kingpinForRow, kingpinReading } from '../../metrics/kingpin';
import { wheelAttitude } from '../../metrics/wheel';
import {
  linesCrossing,
  lineAtCentre,
  patchLine,
  planeLineInCut,
  viewLineDirection,
  viewLinesCrossing,
  type ViewLine,
  type ViewPoint,
} from '../../metrics/wishbonePlanes';
import { poseFromState } from '../../pose';
import { OUTPUT_ZERO_TOLERANCE } from '../../clean';
import type { FrontPoint, HeaveRow, RollRow, SidePoint } from '../../types';
import type { Vec3 } from '../../vec';
import type { PlacePoint, RollCentres } from '../types';
import type { WishbonePlan, WishboneSide } from './plan';

const clean = (v: number) => (Math.abs(v) < OUTPUT_ZERO_TOLERANCE ? 0 : v);

/** The two wishbone lines of a side in the vertical plane `cut` through its wheel centre, and their crossing. */
export function wishboneView(
  s: WishboneSide,
  at: PlacePoint,
  cut: 'x' | 'y',
): { ic: ViewPoint | null; parallel: ViewLine | null; upper: ViewLine | null; lower: ViewLine | null } {
  const wc = at(s.wheel);
  const level = cut === 'x' ? wc.x : wc.y;
  const upper = planeLineInCut(at(s.upper.inner[0]), at(s.upper.inner[1]), at(s.upper.joint), cut, level);
  const lower = planeLineInCut(at(s.lower.inner[0]), at(s.lower.inner[1]), at(s.lower.joint), cut, level);
  const ic = upper && lower ? viewLinesCrossing(upper, lower) : null;
  // Parallel (or kilometres-apart) lines: the patch line runs parallel to them.
  return { ic, parallel: !ic && upper && lower ? upper : null, upper, lower };
}

const front = (p: ViewPoint | null): FrontPoint | null => (p ? { y: clean(p.u), z: clean(p.v) } : null);
const side = (p: ViewPoint | null): SidePoint | null => (p ? { x: clean(p.u), z: clean(p.v) } : null);
const orNull = (v: number | null) => (v === null ? null : clean(v));

/** The double-wishbone fields of a heave row at `travel` (mm); they replace the solid-axle instant centre, anti-squat and roll centre. */
export function wishboneHeaveFields(
  w: WishbonePlan,
  at: PlacePoint,
  state: Float64Array,
  travel: number,
): Partial<HeaveRow> {
  const s = w.left;
  const pose = poseFromState(state, s.body.slot);
  const attitude = wheelAttitude(pose, s.body.reference, s.wheel.ride, 'left');
  const wc = at(s.wheel);

  const fv = wishboneView(s, at, 'x');
  const rollLine = patchLine({ u: wc.y, v: travel }, fv.ic, fv.parallel);
  const rollCenterHeight = rollLine ? lineAtCentre(rollLine) : null;

  const sv = wishboneView(s, at, 'y');
  let slope: number | null = null;
  if (sv.parallel) {
    const d = viewLineDirection(sv.parallel);
    slope = Math.abs(d.u) > 0 ? d.v / d.u : null;
  }
  const antiDive = antiDivePercent(
    side(sv.ic),
    { x: wc.x, z: travel },
    w.frontBrakeShare,
    w.cgHeight,
    w.wheelbase,
    slope,
  );

  const kp = kingpinReading(at(s.lower.joint), at(s.upper.joint), wc, travel, 'left');
  return {
    camberChange: clean(attitude.camberChange),
    toeChange: clean(attitude.toeChange),
    trackChange: clean(attitude.trackChange),
    casterChange: kp && s.rideKingpin ? clean(kp.caster - s.rideKingpin.caster) : null,
    frontViewInstantCenter: front(fv.ic),
    rollCenterHeight: orNull(rollCenterHeight),
    instantCenter: side(sv.ic),
    antiSquat: null,
    antiDive: orNull(antiDive),
    kingpin: kingpinForRow(kp, clean),
  };
}

/** Foot of the perpendicular from a wheel centre onto the ground z = y·tan(roll) (front view, mm). */
function patchOnTiltedGround(wc: Vec3, rollRad: number): ViewPoint {
  // The roll sweep lifts the left wheel by halfTrack·tan(roll) and drops the right by as much:
  // in the frame's axes the ground is the line z = y·tan(roll) through the origin.
  const ny = -Math.sin(rollRad),
    nz = Math.cos(rollRad);
  const d = wc.y * ny + wc.z * nz;
  return { u: wc.y - d * ny, v: wc.z - d * nz };
}

/** The double-wishbone fields of a roll row at `rollDeg` (deg, the left wheel up for positive roll). */
export function wishboneRollFields(
  w: WishbonePlan,
  at: PlacePoint,
  state: Float64Array,
  rollDeg: number,
): Partial<RollRow> {
  const out: Partial<RollRow> = {};
  if (!w.right) return out;
  const lines = [w.left, w.right].map((s) => {
    const fv = wishboneView(s, at, 'x');
    return patchLine(patchOnTiltedGround(at(s.wheel), degToRad(rollDeg)), fv.ic, fv.parallel);
  });
  out.rollCenter = lines[0] && lines[1] ? front(linesCrossing(lines[0], lines[1])) : null;
  const camber = (s: WishboneSide) =>
    wheelAttitude(poseFromState(state, s.body.slot), s.body.reference, s.wheel.ride, s.side).camberChange;
  // The ground tilts by the roll (left side up): a wheel upright in the frame leans out by the
  // roll on the left, in by it on the right, relative to the ground.
  out.camberToGround = { left: clean(camber(w.left) + rollDeg), right: clean(camber(w.right) - rollDeg) };
  return out;
}

/** The roll centre of a roll row (its `rollCenter`) and the left side-view instant centre at that row. */
export function wishboneRollCentres(
  w: WishbonePlan,
  at: PlacePoint,
  state: Float64Array,
  rollDeg: number,
): RollCentres {
  return {
    rollCenter: wishboneRollFields(w, at, state, rollDeg).rollCenter ?? null,
    instantCenter: side(wishboneView(w.left, at, 'y').ic),
  };
}
