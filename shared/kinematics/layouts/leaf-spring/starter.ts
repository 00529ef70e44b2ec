/**
 * A live axle on two semi-elliptic leaf springs, each with its front eye on a frame hanger and
 * its rear eye on a shackle to a second hanger, built as the SAE three-link model
 * (constraints.ts): each half becomes a link from its eye to a pivot a quarter of the way from
 * the seat towards that eye (the link is about ¾ of the cantilever length — docs/references.md,
 * from memory, unverified), the shackle is the third link. Shocks are staggered, the left one
 * ahead of the axle and the right one behind, to fight axle wind-up. Geometry is invented and
 * plausible for a mid-size truck rear.
 */
import { degToRad } from '../../../units';
import { parseSketch, type SketchInput } from '../../../schema/sketch';
import { driveshaftPoints, paramsResolve, r1, type MemberIn, type Params, type PointIn } from '../starterParts';
import type { StarterParam, StarterSpec } from '../starterTypes';

/** The equivalent link's share of the cantilever length (SAE three-link model, from memory, unverified). */
export const LEAF_LINK_SHARE = 0.75;

const params: StarterParam[] = [
  { key: 'track', label: 'Track', unit: 'mm', default: 1600, min: 1200, max: 2200 },
  { key: 'tireRadius', label: 'Tyre radius', unit: 'mm', default: 395, min: 250, max: 700 },
  { key: 'wheelbase', label: 'Wheelbase', unit: 'mm', default: 3300, min: 2000, max: 5000 },
  { key: 'cgHeight', label: 'Centre of gravity height', unit: 'mm', default: 720, min: 300, max: 1500 },
  { key: 'rideHeight', label: 'Frame rail height at ride', unit: 'mm', default: 620, min: 350, max: 1200 },
  { key: 'springSpread', label: 'Spring spacing', unit: 'mm', default: 1100, min: 600, max: 1600 },
  { key: 'springLength', label: 'Spring length (eye to eye)', unit: 'mm', default: 1400, min: 800, max: 2000 },
  {
    key: 'frontShare',
    label: 'Seat position: front half share of the length',
    unit: '%',
    default: 47,
    min: 30,
    max: 70,
  },
  { key: 'springArc', label: 'Spring arc at ride (eyes above the seat)', unit: 'mm', default: 70, min: -60, max: 200 },
  {
    key: 'seatHeight',
    label: 'Axle seat above wheel centre (negative: underslung)',
    unit: 'mm',
    default: 65,
    min: -150,
    max: 150,
  },
  { key: 'shackleLength', label: 'Shackle length', unit: 'mm', default: 110, min: 50, max: 250 },
  {
    key: 'shackleAngle',
    label: 'Shackle angle from vertical (eye rearward +)',
    unit: 'deg',
    default: 12,
    min: -30,
    max: 45,
  },
  { key: 'springRate', label: 'Spring rate at the seat (each spring)', unit: 'N/mm', default: 150, min: 20, max: 600 },
  {
    key: 'shockStagger',
    label: 'Shock stagger (left ahead, right behind the axle)',
    unit: 'mm',
    default: 120,
    min: 0,
    max: 300,
  },
];

/** Shock stroke left either side of the default sweep range, mm (wider than the coil starters': the axle pitches as the spring bends). */
const SHOCK_MARGIN_MM = 30;
const TRAVEL_MM = 150;

/** One spring and its shock; `s` is 'l' or 'r', `y` the spring's y. */
function side(p: Params, s: 'l' | 'r', y: number, shockX: number): { points: PointIn[]; members: MemberIn[] } {
  const seat = { x: 0, z: p.tireRadius + p.seatHeight };
  const l1 = (p.frontShare / 100) * p.springLength;
  const l2 = p.springLength - l1;
  const eyeZ = seat.z + p.springArc;
  const front = { x: l1, z: eyeZ };
  const rear = { x: -l2, z: eyeZ };
  const share = 1 - LEAF_LINK_SHARE;
  const pivotF = { x: seat.x + share * (front.x - seat.x), z: seat.z + share * (front.z - seat.z) };
  const pivotR = { x: seat.x + share * (rear.x - seat.x), z: seat.z + share * (rear.z - seat.z) };
  // Shackle hanging from its hanger; a positive angle puts the spring eye rearward of the hanger.
  const a = degToRad(p.shackleAngle);
  const hanger = { x: rear.x + p.shackleLength * Math.sin(a), z: rear.z + p.shackleLength * Math.cos(a) };
  // Cantilever rates that leave the seat level under a vertical load (k1·L1 = k2·L2), so the
  // spring's wind-up rate is K·L1·L2 (windUp.ts, docs/references.md).
  const k1 = (p.springRate * l2) / p.springLength;
  const k2 = (p.springRate * l1) / p.springLength;
  const shackleBody = s === 'l' ? 'shackle-left' : 'shackle-right';
  const shAz = p.tireRadius - 140;
  const shFz = Math.max(p.rideHeight + 280, shAz + 380);
  const shRide = Math.hypot(20, shFz - shAz);
  const pt = (id: string, body: PointIn['body'], q: { x: number; z: number }, yy = y): PointIn => ({
    id: `${id}.${s}`,
    body,
    x: r1(q.x),
    y: r1(yy),
    z: r1(q.z),
  });
  const shockY = y > 0 ? y + 90 : y - 90;
  return {
    points: [
      pt('LF', 'frame', front),
      pt('LH', 'frame', hanger),
      pt('LE', shackleBody, rear),
      pt('LS', 'axle', seat),
      pt('LA', 'axle', pivotF),
      pt('LB', 'axle', pivotR),
      pt('SH.f', 'frame', { x: shockX - 20, z: shFz }, shockY),
      pt('SH.a', 'axle', { x: shockX, z: shAz }, shockY),
    ],
    members: [
      { id: `LFH${s}`, kind: 'leaf-half', a: `LF.${s}`, b: `LA.${s}`, seat: `LS.${s}`, rate: Math.round(k1 * 10) / 10 },
      { id: `LRH${s}`, kind: 'leaf-half', a: `LE.${s}`, b: `LB.${s}`, seat: `LS.${s}`, rate: Math.round(k2 * 10) / 10 },
      { id: `LK${s}`, kind: 'shackle', a: `LH.${s}`, b: `LE.${s}` },
      {
        id: `SH${s}`,
        kind: 'shock',
        a: `SH.f.${s}`,
        b: `SH.a.${s}`,
        minLength: Math.round((shRide - TRAVEL_MM - SHOCK_MARGIN_MM) / 5) * 5,
        maxLength: Math.round((shRide + TRAVEL_MM + SHOCK_MARGIN_MM) / 5) * 5,
      },
    ],
  };
}

export const leafSpring: StarterSpec = {
  layout: 'leaf-spring',
  label: 'Leaf spring with shackle',
  description:
    'A live axle on two leaf springs: each front eye on a frame hanger, each rear eye on a swinging shackle. The leaves locate the axle fore-aft and sideways and take its torque by bending (axle wind-up); staggered shocks help against wind-up hop.',
  params,
  build(given) {
    const p = paramsResolve(params, given);
    const half = p.springSpread / 2;
    const left = side(p, 'l', half, p.shockStagger);
    const right = side(p, 'r', -half, -p.shockStagger);
    const wc = p.tireRadius;
    const doc: SketchInput = {
      format: 'arcwright.sketch',
      version: 1,
      name: 'New leaf-spring axle',
      layout: 'leaf-spring',
      vehicle: { wheelbase: p.wheelbase, cgHeight: p.cgHeight, track: p.track, tireRadius: p.tireRadius },
      points: [
        { id: 'WC.l', body: 'axle', x: 0, y: r1(p.track / 2), z: r1(wc) },
        { id: 'WC.r', body: 'axle', x: 0, y: r1(-p.track / 2), z: r1(wc) },
        ...left.points,
        ...right.points,
        ...driveshaftPoints(wc),
      ],
      members: [...left.members, ...right.members],
      wheels: { left: 'WC.l', right: 'WC.r' },
      driveline: { output: 'DS.o', outputAxis: 'DS.oa', pinion: 'DS.p', pinionAxis: 'DS.pa' },
      sweep: { droop: -TRAVEL_MM, bump: TRAVEL_MM, step: 5, roll: 8, rollStep: 1 },
    };
    return parseSketch(doc);
  },
};
