/**
 * Independent trailing (or semi-trailing) arms with a frame-mounted drive unit: each arm turns
 * about a hinge axis through two frame pivots ahead of the wheel, carrying the wheel centre, a
 * coil-spring seat, a shock mount and the outer joint of a half-shaft. Geometry is invented and
 * plausible for a mid-size rear: a sweep angle of 0 gives a pure trailing arm (axis parallel to y).
 */
import { degToRad } from '../../../units';
import { vecDistance } from '../../../vec3';
import { parseSketch, type SketchInput } from '../../../schema/sketch';
import { paramsResolve, r1, type MemberIn, type Params, type PointIn } from '../starterParts';
import type { StarterParam, StarterSpec } from '../starterTypes';

const params: StarterParam[] = [
  { key: 'track', label: 'Track', unit: 'mm', default: 1560, min: 1200, max: 2200 },
  { key: 'tireRadius', label: 'Tyre radius', unit: 'mm', default: 370, min: 250, max: 700 },
  { key: 'wheelbase', label: 'Wheelbase', unit: 'mm', default: 3100, min: 2000, max: 5000 },
  { key: 'cgHeight', label: 'Centre of gravity height', unit: 'mm', default: 650, min: 300, max: 1500 },
  { key: 'rideHeight', label: 'Frame rail height at ride', unit: 'mm', default: 560, min: 350, max: 1200 },
  {
    key: 'armLength',
    label: 'Arm length (wheel centre to hinge axis, side view)',
    unit: 'mm',
    default: 480,
    min: 250,
    max: 900,
  },
  {
    key: 'hingeRise',
    label: 'Hinge axis above wheel centre (side view)',
    unit: 'mm',
    default: 40,
    min: -150,
    max: 200,
  },
  {
    key: 'sweepAngle',
    label: 'Hinge sweep angle (plan view, inboard end rearward)',
    unit: 'deg',
    default: 18,
    min: 0,
    max: 35,
  },
  { key: 'axisTilt', label: 'Hinge tilt (rear view, inboard end up)', unit: 'deg', default: 0, min: -10, max: 10 },
  { key: 'hingeInset', label: 'Outer pivot inboard of the wheel centre', unit: 'mm', default: 200, min: 100, max: 500 },
  { key: 'hingeSpan', label: 'Pivot spacing (across the car)', unit: 'mm', default: 300, min: 120, max: 600 },
  {
    key: 'springPosition',
    label: 'Spring seat, share of the arm from the wheel',
    unit: '%',
    default: 30,
    min: 0,
    max: 70,
  },
  { key: 'springRate', label: 'Spring rate', unit: 'N/mm', default: 60, min: 5, max: 300 },
  {
    key: 'driveInset',
    label: 'Half-shaft inner joint from the centreline',
    unit: 'mm',
    default: 140,
    min: 60,
    max: 400,
  },
  {
    key: 'driveRise',
    label: 'Half-shaft inner joint above wheel centre',
    unit: 'mm',
    default: 10,
    min: -150,
    max: 200,
  },
];

/** Shock stroke left either side of the default sweep range, mm (as the solid-axle starters). */
const SHOCK_MARGIN_MM = 15;
/** Default heave range of the starters, mm. */
const TRAVEL_MM = 150;

type P3 = { x: number; y: number; z: number };

/** Rodrigues' rotation of `p` by `angle` (rad) about the unit axis `u` through `a`. */
function rotateAbout(p: P3, a: P3, u: P3, angle: number): P3 {
  const v = { x: p.x - a.x, y: p.y - a.y, z: p.z - a.z };
  const c = Math.cos(angle),
    s = Math.sin(angle);
  const dot = u.x * v.x + u.y * v.y + u.z * v.z;
  const cr = { x: u.y * v.z - u.z * v.y, y: u.z * v.x - u.x * v.z, z: u.x * v.y - u.y * v.x };
  return {
    x: a.x + v.x * c + cr.x * s + u.x * dot * (1 - c),
    y: a.y + v.y * c + cr.y * s + u.y * dot * (1 - c),
    z: a.z + v.z * c + cr.z * s + u.z * dot * (1 - c),
  };
}

/** The arm angle (rad) that lifts `wheel` by `travel` (mm), by bisection on the arm's swing. */
function angleFor(wheel: P3, a: P3, u: P3, travel: number): number {
  const lift = (t: number) => rotateAbout(wheel, a, u, t).z - wheel.z - travel;
  let lo = -Math.PI / 2,
    hi = Math.PI / 2;
  const rising = lift(hi) > lift(lo);
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (lift(mid) > 0 === rising) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}

/** Points and members of the left side; the right side mirrors them. */
function leftSide(p: Params): { points: PointIn[]; members: MemberIn[] } {
  const half = p.track / 2;
  const wc = { x: 0, y: half, z: p.tireRadius };
  // The axis crosses the wheel's fore-aft plane at the side-view instant centre.
  const ic = { x: p.armLength, y: half, z: p.tireRadius + p.hingeRise };
  const tanSweep = Math.tan(degToRad(p.sweepAngle)),
    tanTilt = Math.tan(degToRad(p.axisTilt));
  // Moving inboard by d along y: rearward by d·tan(sweep), up by d·tan(tilt).
  const along = (d: number) => ({ x: ic.x - d * tanSweep, y: ic.y - d, z: ic.z + d * tanTilt });
  const outer = along(p.hingeInset),
    inner = along(p.hingeInset + p.hingeSpan);
  const len = vecDistance(inner, outer);
  const u = { x: (inner.x - outer.x) / len, y: (inner.y - outer.y) / len, z: (inner.z - outer.z) / len };

  const spring = { x: r1((p.springPosition / 100) * p.armLength), y: r1(half - 170), z: r1(p.tireRadius - 40) };
  const springTop = { x: spring.x, y: spring.y, z: r1(Math.max(p.rideHeight + 60, spring.z + 230)) };
  const shock = { x: -70, y: r1(half - 130), z: r1(p.tireRadius - 90) };
  // At least 380 mm between the shock's eyes, so its stroke covers the sweep whatever the frame height.
  const shockTop = { x: -110, y: shock.y, z: r1(Math.max(p.rideHeight + 250, shock.z + 380)) };
  const lengthAt = (t: number) => {
    const q = rotateAbout(shock, outer, u, angleFor(wc, outer, u, t));
    return vecDistance(q, shockTop);
  };
  // With the ride length too: an arm too short to reach the whole range must not leave the shock short at ride.
  const ends = [lengthAt(-TRAVEL_MM), lengthAt(0), lengthAt(TRAVEL_MM)];
  const shMin = Math.floor((Math.min(...ends) - SHOCK_MARGIN_MM) / 5) * 5;
  const shMax = Math.ceil((Math.max(...ends) + SHOCK_MARGIN_MM) / 5) * 5;

  // The drive unit's outputs sit on the wheel centres' cross line, so the shafts run straight across at ride.
  const drive = { x: 0, y: r1(p.driveInset), z: r1(p.tireRadius + p.driveRise) };
  const points: PointIn[] = [
    { id: 'WC.l', body: 'arm-left', x: wc.x, y: r1(wc.y), z: r1(wc.z) },
    { id: 'HA.ol', body: 'frame', x: r1(outer.x), y: r1(outer.y), z: r1(outer.z) },
    { id: 'HA.il', body: 'frame', x: r1(inner.x), y: r1(inner.y), z: r1(inner.z) },
    { id: 'SP.fl', body: 'frame', ...springTop },
    { id: 'SP.al', body: 'arm-left', ...spring },
    { id: 'SH.fl', body: 'frame', ...shockTop },
    { id: 'SH.al', body: 'arm-left', ...shock },
    { id: 'HS.il', body: 'frame', ...drive },
    { id: 'HS.ial', body: 'frame', x: drive.x, y: r1(drive.y - 100), z: drive.z },
    { id: 'HS.ol', body: 'arm-left', x: wc.x, y: r1(wc.y - 60), z: r1(wc.z) },
    { id: 'HS.oal', body: 'arm-left', x: wc.x, y: r1(wc.y + 40), z: r1(wc.z) },
  ];
  const members: MemberIn[] = [
    { id: 'HAl', kind: 'hinge', body: 'arm-left', a: 'HA.ol', b: 'HA.il' },
    { id: 'SPl', kind: 'spring', a: 'SP.fl', b: 'SP.al', rate: p.springRate },
    { id: 'SHl', kind: 'shock', a: 'SH.fl', b: 'SH.al', minLength: shMin, maxLength: shMax },
  ];
  return { points, members };
}

/** The mirror image of a left-side id ('.l'/'.ol'/'l' endings, arm-left) and point. */
const mirrorId = (id: string) => id.replace(/l$/, 'r');
function mirror(side: { points: PointIn[]; members: MemberIn[] }): { points: PointIn[]; members: MemberIn[] } {
  const body = (b: PointIn['body']): PointIn['body'] => (b === 'arm-left' ? 'arm-right' : b);
  return {
    points: side.points.map((q) => ({ ...q, id: mirrorId(q.id), body: body(q.body), y: -q.y })),
    members: side.members.map((m) => {
      const out = { ...m, id: mirrorId(m.id), a: mirrorId(m.a), b: mirrorId(m.b) };
      return m.kind === 'hinge' ? { ...out, body: 'arm-right' as const } : out;
    }),
  };
}

export const trailingArm: StarterSpec = {
  layout: 'trailing-arm',
  label: 'Independent trailing arms',
  description:
    'Each wheel rides on its own arm turning about a hinge axis through two frame pivots; the drive unit is on the frame and drives the wheels through half-shafts. A swept hinge axis (semi-trailing) adds camber and toe change.',
  params,
  build(given) {
    const p = paramsResolve(params, given);
    const left = leftSide(p);
    const right = mirror(left);
    const doc: SketchInput = {
      format: 'arcwright.sketch',
      version: 1,
      name: 'New trailing arms',
      layout: 'trailing-arm',
      vehicle: { wheelbase: p.wheelbase, cgHeight: p.cgHeight, track: p.track, tireRadius: p.tireRadius },
      points: [...left.points, ...right.points],
      members: [...left.members, ...right.members],
      wheels: { left: 'WC.l', right: 'WC.r' },
      halfShafts: {
        left: { inner: 'HS.il', innerAxis: 'HS.ial', outer: 'HS.ol', outerAxis: 'HS.oal' },
        right: { inner: 'HS.ir', innerAxis: 'HS.iar', outer: 'HS.or', outerAxis: 'HS.oar' },
      },
      sweep: { droop: -TRAVEL_MM, bump: TRAVEL_MM, step: 5, roll: 8, rollStep: 1 },
    };
    return parseSketch(doc);
  },
};
