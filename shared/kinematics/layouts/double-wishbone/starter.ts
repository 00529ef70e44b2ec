/**
 * Double-wishbone front starter: on each side a knuckle on an upper and a lower wishbone
 * (each an arm body turning about its two frame pivots, holding the knuckle at its ball joint), a tie
 * rod from the rack end to the steering arm, and a coil-over (a shock with a spring on the same two
 * eyes) from the frame to the lower arm. Geometry is invented and plausible for a mid-size pickup front: a short upper
 * and long lower arm (camber gain in bump), a low roll centre, a little caster and anti-dive,
 * and the tie rod placed on the line the wishbones ask for (next to no bump steer). The rack (720 mm between its
 * tie-rod pivots, 60 mm of travel each way, short of the tie rods' toggle) is a light truck's, and the sweep steers it.
 */
import { degToRad } from '../../../units';
import { parseSketch, type SketchInput } from '../../../schema/sketch';
import { paramsResolve, r1, type MemberIn, type Params, type PointIn } from '../starterParts';
import type { StarterParam, StarterSpec } from '../starterTypes';

/** Fore-aft spacing of each wishbone's two inner pivots (mm). */
const LOWER_PIVOT_SPACING_MM = 360;
const UPPER_PIVOT_SPACING_MM = 260;
/**
 * The steering arm's outer end, inboard of the wheel centre (mm). Behind the axle line with the tie rods square to
 * the car, the arm's inward slant sets the Ackermann: 110 mm gives about 67 % near centre and 92 % at the 60 mm
 * lock (the inner wheel gains on the outer as its arm swings toward its tie rod's line), typical of a light truck;
 * 125 mm gave 96 % near centre but 154 % at lock, the inner wheel running far ahead of the outer one.
 */
const TIE_ROD_OUTER_INSET_MM = 110;
/**
 * Coil-over: the bottom eye on the lower arm at this share of the way from the inner pivots to the ball joint
 * (a trade layout puts it at 55–75 %, for a motion ratio of 0.5–0.7), the top on the frame straight above it.
 */
const COIL_ARM_SHARE = 0.62;
const COIL_LENGTH_MM = 470;
/**
 * Fore-aft (mm, ahead of the axle line +): ahead of the upper arm's front leg, so the coil-over passes beside the
 * upper wishbone, not through it, and away from the tie rod behind the axle line.
 */
const COIL_X_MM = 90;
/** Shock stroke either side of the default sweep's range (mm). */
const SHOCK_MARGIN_MM = 15;
const SWEEP = { droop: -120, bump: 120, step: 5, roll: 6, rollStep: 1 };
/** Rack rows of the steer sweep (mm): 25 rows over ±60 mm. */
const RACK_STEP_MM = 5;

const params: StarterParam[] = [
  { key: 'track', label: 'Track', unit: 'mm', default: 1620, min: 1200, max: 2200 },
  { key: 'tireRadius', label: 'Tyre radius', unit: 'mm', default: 385, min: 250, max: 600 },
  { key: 'wheelbase', label: 'Wheelbase', unit: 'mm', default: 3100, min: 2000, max: 5000 },
  { key: 'cgHeight', label: 'Centre of gravity height', unit: 'mm', default: 680, min: 300, max: 1500 },
  { key: 'frontBrakeShare', label: 'Braking on the front axle', unit: '%', default: 65, min: 40, max: 90 },
  { key: 'lowerArmLength', label: 'Lower wishbone length (front view)', unit: 'mm', default: 400, min: 250, max: 600 },
  { key: 'upperArmLength', label: 'Upper wishbone length (front view)', unit: 'mm', default: 270, min: 150, max: 500 },
  { key: 'lowerPivotHeight', label: 'Lower wishbone inner pivot height', unit: 'mm', default: 255, min: 100, max: 450 },
  { key: 'upperPivotHeight', label: 'Upper wishbone inner pivot height', unit: 'mm', default: 600, min: 400, max: 900 },
  { key: 'lowerJointHeight', label: 'Lower ball joint height', unit: 'mm', default: 225, min: 80, max: 400 },
  { key: 'upperJointHeight', label: 'Upper ball joint height', unit: 'mm', default: 615, min: 420, max: 900 },
  {
    key: 'lowerJointInset',
    label: 'Lower ball joint inboard of the wheel centre',
    unit: 'mm',
    default: 55,
    min: 0,
    max: 200,
  },
  {
    key: 'upperJointInset',
    label: 'Upper ball joint inboard of the wheel centre',
    unit: 'mm',
    default: 115,
    min: 0,
    max: 250,
  },
  { key: 'caster', label: 'Caster (upper ball joint rearward)', unit: 'deg', default: 4, min: -2, max: 10 },
  {
    key: 'upperAxisAngle',
    label: 'Upper pivot axis, side view (front end up)',
    unit: 'deg',
    default: 5,
    min: -10,
    max: 15,
  },
  {
    key: 'lowerAxisAngle',
    label: 'Lower pivot axis, side view (front end up)',
    unit: 'deg',
    default: 0,
    min: -10,
    max: 15,
  },
  {
    key: 'tieRodX',
    label: 'Tie rod fore-aft (ahead of the axle line +)',
    unit: 'mm',
    default: -140,
    min: -250,
    max: 250,
  },
  { key: 'tieRodOuterHeight', label: 'Tie rod outer end height', unit: 'mm', default: 300, min: 120, max: 600 },
  { key: 'tieRodInnerHeight', label: 'Tie rod inner end (rack) height', unit: 'mm', default: 317, min: 120, max: 650 },
  { key: 'rackHalfLength', label: 'Rack end from the centreline', unit: 'mm', default: 360, min: 150, max: 700 },
  { key: 'rackTravel', label: 'Rack travel each way', unit: 'mm', default: 60, min: 10, max: 200 },
  { key: 'springRate', label: 'Coil-over spring rate', unit: 'N/mm', default: 130, min: 5, max: 300 },
];

type StarterBody = 'frame' | 'knuckle' | 'upper-arm' | 'lower-arm';

/** A left point and its mirror on the right: ids `<id>.l` / `<id>.r`. */
function mirrored(id: string, body: StarterBody, x: number, y: number, z: number): PointIn[] {
  const on = (side: 'left' | 'right') => (body === 'frame' ? 'frame' : (`${body}-${side}` as const));
  return [
    { id: `${id}.l`, body: on('left'), x: r1(x), y: r1(y), z: r1(z) },
    { id: `${id}.r`, body: on('right'), x: r1(x), y: r1(-y), z: r1(z) },
  ];
}

/** A wishbone's inner pivots: spaced fore-aft about the axle line, the axis tilted `angleDeg` front end up. */
function innerPivots(id: string, y: number, z: number, spacing: number, angleDeg: number): PointIn[] {
  const half = spacing / 2;
  const rise = half * Math.tan(degToRad(angleDeg));
  return [...mirrored(`${id}.f`, 'frame', half, y, z + rise), ...mirrored(`${id}.r`, 'frame', -half, y, z - rise)];
}

function build(p: Params): SketchInput {
  const wcY = p.track / 2;
  const wcZ = p.tireRadius;
  const lbjY = wcY - p.lowerJointInset;
  const ubjY = wcY - p.upperJointInset;
  const ubjX = -(p.upperJointHeight - p.lowerJointHeight) * Math.tan(degToRad(p.caster));
  const lowerInnerY = lbjY - p.lowerArmLength;
  // The coil-over's bottom eye on the lower arm's line from its inner axis to its ball joint (front view).
  const coilY = lowerInnerY + COIL_ARM_SHARE * p.lowerArmLength;
  const coilBottomZ = p.lowerPivotHeight + COIL_ARM_SHARE * (p.lowerJointHeight - p.lowerPivotHeight);
  const points: PointIn[] = [
    ...mirrored('WC', 'knuckle', 0, wcY, wcZ),
    ...innerPivots('LW', lowerInnerY, p.lowerPivotHeight, LOWER_PIVOT_SPACING_MM, p.lowerAxisAngle),
    ...mirrored('LW.bj', 'knuckle', 0, lbjY, p.lowerJointHeight),
    ...mirrored('LA.bj', 'lower-arm', 0, lbjY, p.lowerJointHeight),
    ...innerPivots('UW', ubjY - p.upperArmLength, p.upperPivotHeight, UPPER_PIVOT_SPACING_MM, p.upperAxisAngle),
    ...mirrored('UW.bj', 'knuckle', ubjX, ubjY, p.upperJointHeight),
    ...mirrored('UA.bj', 'upper-arm', ubjX, ubjY, p.upperJointHeight),
    ...mirrored('TR.i', 'frame', p.tieRodX, p.rackHalfLength, p.tieRodInnerHeight),
    ...mirrored('TR.o', 'knuckle', p.tieRodX, wcY - TIE_ROD_OUTER_INSET_MM, p.tieRodOuterHeight),
    ...mirrored('CO.t', 'frame', COIL_X_MM, coilY, coilBottomZ + COIL_LENGTH_MM),
    ...mirrored('CO.b', 'lower-arm', COIL_X_MM, coilY, coilBottomZ),
  ];
  // The stroke: the wheel's travel scaled by the lever (eye from the inner axis over the wheel centre from it).
  const lever = (coilY - lowerInnerY) / (wcY - lowerInnerY);
  const shMin = Math.max(1, Math.round((COIL_LENGTH_MM + SWEEP.droop * 1.1 * lever - SHOCK_MARGIN_MM) / 5) * 5);
  const shMax = Math.round((COIL_LENGTH_MM + SWEEP.bump * 1.1 * lever + SHOCK_MARGIN_MM) / 5) * 5;
  const members: MemberIn[] = [];
  for (const s of ['l', 'r']) {
    const side = s === 'l' ? 'left' : 'right';
    members.push(
      { id: `LW${s}`, kind: 'hinge', body: `lower-arm-${side}`, a: `LW.f.${s}`, b: `LW.r.${s}` },
      { id: `LBJ${s}`, kind: 'ball-joint', a: `LA.bj.${s}`, b: `LW.bj.${s}` },
      { id: `UW${s}`, kind: 'hinge', body: `upper-arm-${side}`, a: `UW.f.${s}`, b: `UW.r.${s}` },
      { id: `UBJ${s}`, kind: 'ball-joint', a: `UA.bj.${s}`, b: `UW.bj.${s}` },
      { id: `TR${s}`, kind: 'tie-rod', a: `TR.i.${s}`, b: `TR.o.${s}` },
      { id: `SH${s}`, kind: 'shock', a: `CO.t.${s}`, b: `CO.b.${s}`, minLength: shMin, maxLength: shMax },
      { id: `SP${s}`, kind: 'spring', a: `CO.t.${s}`, b: `CO.b.${s}`, rate: p.springRate },
    );
  }
  return {
    format: 'arcwright.sketch',
    version: 1,
    name: 'New double-wishbone front',
    layout: 'double-wishbone',
    vehicle: {
      wheelbase: p.wheelbase,
      cgHeight: p.cgHeight,
      track: p.track,
      tireRadius: p.tireRadius,
      frontBrakeShare: p.frontBrakeShare,
    },
    points,
    members,
    wheels: { left: 'WC.l', right: 'WC.r' },
    sweep: { ...SWEEP, steer: { rack: p.rackTravel, step: Math.min(RACK_STEP_MM, p.rackTravel) } },
  };
}

/** Independent front: upper and lower wishbones, rack-and-pinion tie rods, coil-overs on the lower arms. */
export const doubleWishbone: StarterSpec = {
  layout: 'double-wishbone',
  label: 'Double wishbone (front)',
  description:
    'An upper and a lower wishbone on each side hold the knuckle; a tie rod from the rack steers it and a coil-over from the frame carries it. ' +
    'Read camber gain, bump steer, roll centre, caster change and anti-dive through the travel. The coil-over is mounted on the lower wishbone.',
  params,
  build(given) {
    return parseSketch(build(paramsResolve(params, given)));
  },
};
