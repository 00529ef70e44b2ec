/**
 * The steered front axle's starter: an invented off-road truck's front, a solid axle on three links (two lower,
 * one upper) and a track bar, its knuckles on kingpins, steered by a box on the right frame rail whose pitman
 * arm pushes a drag link across to the left knuckle's steering arm, with a tie rod behind the axle. The drag
 * link and the track bar are drawn parallel in front view and of similar length, as a good build has them.
 * The axle's links, springs, shocks and driveshaft are the solid-axle starters' (starterParts.ts) turned to
 * face the rear, as a front axle's are. All numbers are invented.
 */
import { parseSketch } from '../../../schema/sketch';
import { degToRad } from '../../../units';
import { baseParams, linkFrameEnd, paramsResolve, r1, sketchShell, solidAxleBase, type PointIn } from '../starterParts';
import type { StarterParam, StarterSpec } from '../starterTypes';

/** An off-road truck's front, in place of the solid-axle starters' rear. */
const FRONT_DEFAULTS: Record<string, number> = {
  track: 1650,
  tireRadius: 420,
  wheelbase: 3000,
  cgHeight: 850,
  rideHeight: 700,
  lowerLength: 1000,
  lowerAngle: 7,
  lowerDrop: 170,
  lowerSpread: 860,
  upperLength: 900,
  upperAngle: 3,
  upperRise: 180,
  springRate: 60,
};

const params: StarterParam[] = [
  ...baseParams.map((p) => (p.key in FRONT_DEFAULTS ? { ...p, default: FRONT_DEFAULTS[p.key] } : p)),
  {
    key: 'upperOffset',
    label: 'Upper link offset from centre (left +)',
    unit: 'mm',
    default: 150,
    min: -400,
    max: 400,
  },
  { key: 'kingpinInclination', label: 'Kingpin inclination', unit: 'deg', default: 8, min: 0, max: 15 },
  { key: 'caster', label: 'Caster', unit: 'deg', default: 5, min: -2, max: 12 },
  { key: 'pitmanLength', label: 'Pitman arm length', unit: 'mm', default: 180, min: 100, max: 300 },
  {
    key: 'steeringArm',
    label: 'Steering arm length (kingpin to drag link)',
    unit: 'mm',
    default: 220,
    min: 120,
    max: 350,
  },
  { key: 'ballHeight', label: 'Pitman ball height', unit: 'mm', default: 540, min: 300, max: 900 },
  { key: 'trackBarHeight', label: 'Track bar frame end height', unit: 'mm', default: 430, min: 200, max: 800 },
];

/** mm, half the kingpin's ball joints' spread about the wheel centre's height. */
const KINGPIN_HALF_SPAN = 115;
/** mm, the lower ball joint inboard of the wheel centre. */
const KINGPIN_INSET = 120;
/** mm, the steering arm's drag-link end above the wheel centre (a high-steer arm on top of the knuckle). */
const ARM_RISE = 180;
/** mm, the tie-rod arms behind the kingpin and below the wheel centre. */
const TIE_ROD_ARM = 150;
const TIE_ROD_DROP = 90;
/** mm, the steering box's output axis ahead of the axle, and the track bar behind it. */
const BOX_X = 300;
const TRACK_BAR_X = -100;
/** mm, the track bar's axle end inboard of the left wheel centre. */
const TRACK_BAR_INSET = 265;

export const steeredFrontAxle: StarterSpec = {
  layout: 'steered-front-axle',
  label: 'Steered front axle (three-link, track bar)',
  description:
    'A solid front axle on two lower links, one upper link and a track bar; each knuckle turns on its kingpin, ' +
    'steered by a pitman arm, a drag link and a tie rod. The drag link against the track bar decides the bump steer.',
  params,
  build(given) {
    const p = paramsResolve(params, given);
    // The solid-axle starters' base, mirrored fore and aft: the links run rearward to the frame.
    const base = solidAxleBase(p);
    const mirrored = base.points.map((q) => ({ ...q, x: r1(-q.x) }));
    const half = p.track / 2;
    const R = p.tireRadius;
    const ulA = { x: 70, z: R + p.upperRise };
    const ulF = linkFrameEnd(ulA.x, ulA.z, p.upperLength, p.upperAngle);

    // The left kingpin: through the wheel centre's height at the wheel's fore-aft station (side view), leaning
    // in by the inclination and back by the caster.
    const lo = {
      x: KINGPIN_HALF_SPAN * Math.tan(degToRad(p.caster)),
      y: half - KINGPIN_INSET,
      z: R - KINGPIN_HALF_SPAN,
    };
    const lean = { x: -Math.tan(degToRad(p.caster)), y: -Math.tan(degToRad(p.kingpinInclination)) };
    const axisAt = (z: number) => ({ x: lo.x + lean.x * (z - lo.z), y: lo.y + lean.y * (z - lo.z), z });
    const hi = axisAt(R + KINGPIN_HALF_SPAN);
    // The steering arm reaches forward from the kingpin; the tie-rod arms reach back and in toward the rear axle's
    // centre (the common Ackermann rule of thumb; no published source).
    const armAt = axisAt(R + ARM_RISE);
    const arm = { x: armAt.x + p.steeringArm, y: armAt.y, z: armAt.z };
    const trAt = axisAt(R - TIE_ROD_DROP);
    const inward = (TIE_ROD_ARM * trAt.y) / p.wheelbase;
    const tieArm = { x: trAt.x - TIE_ROD_ARM, y: trAt.y - inward, z: trAt.z };
    // The box on the right frame rail, its output shaft fore and aft, the arm hanging down.
    const rail = -p.lowerSpread / 2;
    const ball = { x: BOX_X, y: rail, z: p.ballHeight };
    // The track bar parallel to the drag link in front view: its axle end rises as the drag link does.
    const slope = (arm.z - ball.z) / (arm.y - ball.y);
    const tbFrame = { x: TRACK_BAR_X, y: rail - 30, z: p.trackBarHeight };
    const tbAxleY = half - TRACK_BAR_INSET;
    const tbAxle = { x: TRACK_BAR_X, y: tbAxleY, z: tbFrame.z + slope * (tbAxleY - tbFrame.y) };

    const at = (id: string, body: PointIn['body'], v: { x: number; y: number; z: number }): PointIn => ({
      id,
      body,
      x: r1(v.x),
      y: r1(v.y),
      z: r1(v.z),
    });
    const mirrorY = (v: { x: number; y: number; z: number }) => ({ ...v, y: -v.y });
    const points: PointIn[] = [
      ...mirrored,
      at('UL.f', 'frame', { x: -ulF.x, y: p.upperOffset, z: ulF.z }),
      at('UL.a', 'axle', { x: -ulA.x, y: p.upperOffset, z: ulA.z }),
      at('TB.f', 'frame', tbFrame),
      at('TB.a', 'axle', tbAxle),
      at('KP.ll', 'axle', lo),
      at('KP.ul', 'axle', hi),
      at('KP.lr', 'axle', mirrorY(lo)),
      at('KP.ur', 'axle', mirrorY(hi)),
      at('SA.l', 'knuckle-left', arm),
      at('TA.l', 'knuckle-left', tieArm),
      at('TA.r', 'knuckle-right', mirrorY(tieArm)),
      at('SB.p', 'frame', { x: BOX_X, y: rail, z: p.ballHeight + p.pitmanLength }),
      at('SB.a', 'frame', { x: BOX_X + 100, y: rail, z: p.ballHeight + p.pitmanLength }),
      at('PM.b', 'frame', ball),
    ];
    const members = [
      ...base.members,
      { id: 'UL', kind: 'link' as const, group: 'upper' as const, a: 'UL.f', b: 'UL.a' },
      { id: 'TB', kind: 'lateral-rod' as const, a: 'TB.f', b: 'TB.a' },
      { id: 'KPl', kind: 'hinge' as const, body: 'knuckle-left' as const, a: 'KP.ll', b: 'KP.ul' },
      { id: 'KPr', kind: 'hinge' as const, body: 'knuckle-right' as const, a: 'KP.lr', b: 'KP.ur' },
      { id: 'TR', kind: 'tie-rod' as const, a: 'TA.l', b: 'TA.r' },
      { id: 'DL', kind: 'tie-rod' as const, a: 'PM.b', b: 'SA.l' },
    ];
    const shell = sketchShell('steered-front-axle', 'New steered front axle', p, points, members);
    return parseSketch({
      ...shell,
      vehicle: { ...shell.vehicle, axle: 'front', frontBrakeShare: 65 },
      pitmanArm: { pivot: 'SB.p', axis: 'SB.a', ball: 'PM.b' },
      sweep: { ...shell.sweep, steer: { pitman: 35, step: 2.5 } },
    });
  },
};
