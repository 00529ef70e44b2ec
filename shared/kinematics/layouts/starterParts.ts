/**
 * Parts every solid-axle starter shares: the vehicle block, wheel centres, coil springs,
 * shocks, lower links and the driveshaft, all from a few numbers. Geometry is invented and
 * plausible for a mid-size truck rear; frame-side pivots are placed from link lengths and
 * angles so that a parameter change keeps the linkage sensible.
 */
import { degToRad } from '../../units';
import type { SketchInput } from '../../schema/sketch';
import type { StarterParam } from './starterTypes';

export type Params = Record<string, number>;
export type PointIn = SketchInput['points'][number];
export type MemberIn = SketchInput['members'][number];

/** Shock stroke left either side of the default sweep range, mm. */
const SHOCK_MARGIN_MM = 15;

export const baseParams: StarterParam[] = [
  { key: 'track', label: 'Track', unit: 'mm', default: 1580, min: 1200, max: 2200 },
  { key: 'tireRadius', label: 'Tyre radius', unit: 'mm', default: 395, min: 250, max: 700 },
  { key: 'wheelbase', label: 'Wheelbase', unit: 'mm', default: 3250, min: 2000, max: 5000 },
  { key: 'cgHeight', label: 'Centre of gravity height', unit: 'mm', default: 700, min: 300, max: 1500 },
  { key: 'rideHeight', label: 'Frame rail height at ride', unit: 'mm', default: 600, min: 350, max: 1200 },
  { key: 'lowerLength', label: 'Lower link length (side view)', unit: 'mm', default: 950, min: 500, max: 1600 },
  { key: 'lowerAngle', label: 'Lower link angle (frame end up)', unit: 'deg', default: 6, min: -10, max: 20 },
  { key: 'lowerDrop', label: 'Lower link axle mount below wheel centre', unit: 'mm', default: 160, min: 60, max: 300 },
  { key: 'lowerSpread', label: 'Lower link spacing', unit: 'mm', default: 940, min: 500, max: 1400 },
  { key: 'upperLength', label: 'Upper link length (side view)', unit: 'mm', default: 700, min: 350, max: 1400 },
  { key: 'upperAngle', label: 'Upper link angle (frame end up)', unit: 'deg', default: 4, min: -10, max: 20 },
  { key: 'upperRise', label: 'Upper link axle mount above wheel centre', unit: 'mm', default: 145, min: 60, max: 350 },
  { key: 'springRate', label: 'Spring rate', unit: 'N/mm', default: 38, min: 5, max: 300 },
];

/** Parameters with defaults filled in and every value clamped to its range. */
export function paramsResolve(spec: StarterParam[], given: Partial<Record<string, number>> = {}): Params {
  const out: Params = {};
  for (const p of spec) {
    const v = given[p.key];
    out[p.key] = typeof v === 'number' && Number.isFinite(v) ? Math.min(p.max, Math.max(p.min, v)) : p.default;
  }
  return out;
}

/** Rounds a coordinate to 0.1 mm so starter files read cleanly. */
export const r1 = (v: number) => Math.round(v * 10) / 10;

/** Left and right copies of a point; `y` is the left side's (positive) y. */
export function pair(id: string, body: 'frame' | 'axle', x: number, y: number, z: number): PointIn[] {
  return [
    { id: `${id}.${body === 'frame' ? 'f' : 'a'}l`, body, x: r1(x), y: r1(y), z: r1(z) },
    { id: `${id}.${body === 'frame' ? 'f' : 'a'}r`, body, x: r1(x), y: r1(-y), z: r1(z) },
  ];
}

/** A link from an axle point, running forward by `length` (side view) at `angleDeg` up. */
export function linkFrameEnd(axleX: number, axleZ: number, length: number, angleDeg: number): { x: number; z: number } {
  const a = degToRad(angleDeg);
  return { x: axleX + length * Math.cos(a), z: axleZ + length * Math.sin(a) };
}

/** Wheels, lower links, shocks, springs and the driveshaft common to the solid-axle starters. */
export function solidAxleBase(p: Params): { points: PointIn[]; members: MemberIn[] } {
  const half = p.track / 2;
  const wc = p.tireRadius;
  const points: PointIn[] = [
    { id: 'WC.l', body: 'axle', x: 0, y: r1(half), z: r1(wc) },
    { id: 'WC.r', body: 'axle', x: 0, y: r1(-half), z: r1(wc) },
  ];
  const members: MemberIn[] = [];

  const llA = { x: 30, z: wc - p.lowerDrop };
  const llF = linkFrameEnd(llA.x, llA.z, p.lowerLength, p.lowerAngle);
  points.push(
    ...pair('LL', 'frame', llF.x, p.lowerSpread / 2, llF.z),
    ...pair('LL', 'axle', llA.x, p.lowerSpread / 2, llA.z),
  );
  members.push(
    { id: 'LLl', kind: 'link', group: 'lower', a: 'LL.fl', b: 'LL.al' },
    { id: 'LLr', kind: 'link', group: 'lower', a: 'LL.fr', b: 'LL.ar' },
  );

  // Shocks behind the axle, outboard of the springs, nearly upright.
  const shY = Math.min(half - 200, p.lowerSpread / 2 + 60);
  const shAz = wc - 150;
  // At least 380 mm between the shock's eyes, so its stroke covers the sweep whatever the frame height.
  const shFz = Math.max(p.rideHeight + 280, shAz + 380);
  points.push(...pair('SH', 'frame', -140, shY, shFz), ...pair('SH', 'axle', -110, shY, shAz));
  const shRide = Math.hypot(30, shFz - shAz);
  const shMin = Math.round((shRide - 150 - SHOCK_MARGIN_MM) / 5) * 5;
  const shMax = Math.round((shRide + 150 + SHOCK_MARGIN_MM) / 5) * 5;
  members.push(
    { id: 'SHl', kind: 'shock', a: 'SH.fl', b: 'SH.al', minLength: shMin, maxLength: shMax },
    { id: 'SHr', kind: 'shock', a: 'SH.fr', b: 'SH.ar', minLength: shMin, maxLength: shMax },
  );

  // Coil springs seated on the axle tube above the lower links.
  const spFz = Math.max(p.rideHeight + 120, wc + 15 + 200);
  points.push(
    ...pair('SP', 'frame', -60, p.lowerSpread / 2, spFz),
    ...pair('SP', 'axle', -60, p.lowerSpread / 2, wc + 15),
  );
  members.push(
    { id: 'SPl', kind: 'spring', a: 'SP.fl', b: 'SP.al', rate: p.springRate },
    { id: 'SPr', kind: 'spring', a: 'SP.fr', b: 'SP.ar', rate: p.springRate },
  );

  points.push(...driveshaftPoints(wc));
  return { points, members };
}

/** Each driveshaft joint's operating angle at ride in the starters (deg): within the usual 1–3° (common practice, no published source). */
const STARTER_JOINT_ANGLE_DEG = 2;

/**
 * A one-piece driveshaft from the gearbox output to the pinion. The output shaft and the pinion point
 * parallel to each other, each STARTER_JOINT_ANGLE_DEG off the shaft's line at ride: equal angles whose
 * speed fluctuations cancel, and enough angle to keep the needle bearings turning. Heights above the
 * wheel centre `wc` (mm); each axis point 100 mm from its joint.
 */
export function driveshaftPoints(wc: number): PointIn[] {
  const out = { x: 1600, z: r1(wc + 90) };
  const pin = { x: 190, z: r1(wc + 15) };
  const axisSlope = Math.atan2(out.z - pin.z, out.x - pin.x) - degToRad(STARTER_JOINT_ANGLE_DEG);
  const ax = 100 * Math.cos(axisSlope),
    az = 100 * Math.sin(axisSlope);
  return [
    { id: 'DS.o', body: 'frame', x: out.x, y: 0, z: out.z },
    { id: 'DS.oa', body: 'frame', x: r1(out.x + ax), y: 0, z: r1(out.z + az) },
    { id: 'DS.p', body: 'axle', x: pin.x, y: 0, z: pin.z },
    { id: 'DS.pa', body: 'axle', x: r1(pin.x - ax), y: 0, z: r1(pin.z - az) },
  ];
}

/** The document around points and members. */
export function sketchShell(
  layout: SketchInput['layout'],
  name: string,
  p: Params,
  points: PointIn[],
  members: MemberIn[],
): SketchInput {
  return {
    format: 'arcwright.sketch',
    version: 1,
    name,
    layout,
    vehicle: { wheelbase: p.wheelbase, cgHeight: p.cgHeight, track: p.track, tireRadius: p.tireRadius },
    points,
    members,
    wheels: { left: 'WC.l', right: 'WC.r' },
    driveline: { output: 'DS.o', outputAxis: 'DS.oa', pinion: 'DS.p', pinionAxis: 'DS.pa' },
    sweep: { droop: -150, bump: 150, step: 5, roll: 8, rollStep: 1 },
  };
}

/** A level lateral rod behind the axle: frame end on the left, axle end on the right. */
export function lateralRod(p: Params): { points: PointIn[]; members: MemberIn[] } {
  const half = p.rodLength / 2;
  return {
    points: [
      { id: 'LR.f', body: 'frame', x: -70, y: r1(half), z: r1(p.rodHeight) },
      { id: 'LR.a', body: 'axle', x: -70, y: r1(-half), z: r1(p.rodHeight) },
    ],
    members: [{ id: 'LR', kind: 'lateral-rod', a: 'LR.f', b: 'LR.a' }],
  };
}

export const rodParams: StarterParam[] = [
  { key: 'rodLength', label: 'Lateral rod length', unit: 'mm', default: 1100, min: 600, max: 1600 },
  { key: 'rodHeight', label: 'Lateral rod height', unit: 'mm', default: 380, min: 150, max: 800 },
];
