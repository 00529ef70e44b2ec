/**
 * The quantities of the heave sweep (travel imposed, roll 0), in the order of the CSV export.
 * Signs and units as shared/kinematics/types.ts documents each row field.
 */
import type { HeaveEntry, RollEntry } from './types';
import type { HalfShaftReading, HeaveRow, SweepEvent } from '../../types';
import type { Layout } from '../../../schema/sketchVocabulary';
import { ALL_LAYOUTS, INDEPENDENT, KINGPIN, LINKED_AXLE, SOLID_AXLE, STEERED_AXLE, WISHBONE } from './layouts';
import { ROLL_STEER_AXLE_SENSE } from './rollSteerSense';

/** Layouts whose side view has an instant centre (the leaf spring's from its three-link equivalent). */
const SIDE_VIEW_IC: readonly Layout[] = [
  'four-link-lateral-rod',
  'triangulated-four-link',
  'three-link-lateral-rod',
  'trailing-arm',
  'double-wishbone',
  'leaf-spring',
  'steered-front-axle',
];

const POSE_AXES = [
  ['x', 'length', 'mm forward of ride', 'fore-aft movement'],
  ['y', 'length', 'mm to the left of ride', 'sideways movement'],
  ['z', 'length', 'mm up from ride', 'vertical movement'],
  ['roll', 'angle', 'positive lifts the left side (ISO 8855)', 'roll angle'],
  ['pitch', 'angle', 'positive drops the nose (ISO 8855)', 'pitch angle'],
  ['yaw', 'angle', 'positive turns the nose left (ISO 8855)', 'yaw angle'],
] as const;

/** The moving body's pose (the axle's, or the body carrying the left wheel), CSV only. */
const pose: HeaveEntry[] = POSE_AXES.map(([axis, quantity, sign, words]) => ({
  key: `pose.${axis}`,
  id: `pose-${axis}`,
  label: `Pose ${axis}`,
  quantity,
  sweep: 'heave',
  read: (r) => r.pose[axis],
  signed: true,
  sign,
  definition:
    `The moving body's ${words} from ride (the axle's, or the body carrying the left wheel), ` + "in the body's axes.",
  layouts: ALL_LAYOUTS,
  csv: `pose.${axis}`,
}));

const DRIVELINE = [
  [
    'length',
    'ds-len',
    'Driveshaft length',
    'length',
    false,
    'output joint to pinion joint',
    'Length of the driveshaft between the centres of its output joint and its pinion joint.',
  ],
  [
    'plunge',
    'ds-plunge',
    'Driveshaft plunge',
    'length',
    true,
    'positive when the slip yoke extends',
    "Change of the driveshaft's length from its length at ride, which the slip yoke must take.",
  ],
  [
    'outputAngle',
    'ds-out',
    'Output joint angle',
    'angle',
    false,
    'operating angle, never negative',
    "Operating angle of the output joint: the 3-D angle between the gearbox's output shaft and the driveshaft.",
  ],
  [
    'pinionAngle',
    'ds-pin',
    'Pinion joint angle',
    'angle',
    false,
    'operating angle, never negative',
    "Operating angle of the pinion joint: the 3-D angle between the driveshaft and the axle's pinion shaft.",
  ],
] as const;

/** The driveshaft, for a sketch with a driveline; `sweep` picks the rows read (heave or roll). */
export function drivelineEntries<S extends 'heave' | 'roll'>(sweep: S, csv: boolean): Array<HeaveEntry | RollEntry> {
  return DRIVELINE.map(([field, id, label, quantity, signed, sign, definition]) => ({
    key: `driveline.${field}`,
    id,
    label,
    quantity,
    sweep,
    read: (r: { driveline?: HeaveRow['driveline'] }) => r.driveline?.[field],
    given: (r: { driveline?: HeaveRow['driveline'] }) => !!r.driveline,
    signed,
    sign,
    definition,
    layouts: SOLID_AXLE,
    group: 'driveline' as const,
    ...(csv ? { csv: `driveline.${field}` } : {}),
  })) as Array<HeaveEntry | RollEntry>;
}

/** The driveline joints a sweep event can name (`SweepEvent.joint`), as the flags word them. */
export const driveJointNames: Record<NonNullable<SweepEvent['joint']>, string> = {
  output: 'Output joint',
  pinion: 'Pinion joint',
  'half-shaft-inner': 'Inner half-shaft joint',
  'half-shaft-outer': 'Outer half-shaft joint',
};

const HALF_SHAFT: ReadonlyArray<
  readonly [keyof HalfShaftReading, string, 'length' | 'angle', boolean, string, (side: string) => string]
> = [
  [
    'length',
    'length',
    'length',
    false,
    'inner joint to outer joint',
    (side) => `Length of the ${side} half-shaft between the centres of its inner and outer joints.`,
  ],
  [
    'plunge',
    'plunge',
    'length',
    true,
    'positive when the shaft must extend',
    (side) => `Change of the ${side} half-shaft's length from its length at ride, which its plunging joint must take.`,
  ],
  [
    'innerAngle',
    'inner joint angle',
    'angle',
    false,
    'operating angle, never negative',
    (side) =>
      `Operating angle of the ${side} inner joint: the 3-D angle between the drive unit's output and the shaft.`,
  ],
  [
    'outerAngle',
    'outer joint angle',
    'angle',
    false,
    'operating angle, never negative',
    (side) => `Operating angle of the ${side} outer joint: the 3-D angle between the shaft and the wheel's spin axis.`,
  ],
];

/** Half-shafts of independent wheels driven by a frame-mounted unit, per side. */
export function halfShaftEntries<S extends 'heave' | 'roll'>(sweep: S, csv: boolean): Array<HeaveEntry | RollEntry> {
  return (['left', 'right'] as const).flatMap((side) =>
    HALF_SHAFT.map(([field, words, quantity, signed, sign, definition]) => ({
      key: `halfShafts.${side}.${field}`,
      id: `hs-${side}-${field}`,
      label: `Half-shaft ${side} ${words}`,
      quantity,
      sweep,
      read: (r: { halfShafts?: HeaveRow['halfShafts'] }) => r.halfShafts?.[side]?.[field],
      given: (r: { halfShafts?: HeaveRow['halfShafts'] }) => !!r.halfShafts?.[side],
      signed,
      sign,
      definition: definition(side),
      layouts: INDEPENDENT,
      ...(csv ? { csv: `halfShafts.${side}.${field}` } : {}),
    })),
  ) as Array<HeaveEntry | RollEntry>;
}

const given =
  <K extends keyof HeaveRow>(field: K) =>
  (r: HeaveRow) =>
    r[field] !== undefined;

export const heaveEntries: HeaveEntry[] = [
  {
    key: 'travel',
    id: 'travel',
    label: 'Travel',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.travel,
    signed: true,
    sign: 'bump positive, droop negative',
    definition:
      "Vertical movement from ride of the wheel centre (of a solid axle: its reference point), imposed by the sweep in the body's axes.",
    layouts: ALL_LAYOUTS,
    csv: 'travel',
  },
  ...pose,
  {
    key: 'pinionAngleChange',
    id: 'pinion',
    label: 'Pinion angle change',
    quantity: 'angle',
    sweep: 'heave',
    read: (r) => r.pinionAngleChange,
    axle: 'only',
    signed: true,
    sign: "positive when the axle's nose rises",
    definition:
      "Change from ride of the axle housing's side-view pitch against the body (body-fixed axes); the pinion shaft turns with it.",
    layouts: SOLID_AXLE,
    csv: 'pinionAngleChange',
    group: 'axle',
    why: 'axle',
    plotEmpty: 'No axle: this layout has no pinion angle to change.',
    target: true,
    bandEnds: ['min', 'max'],
  },
  {
    key: 'lateralShift',
    id: 'lateral',
    label: 'Lateral shift',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.lateralShift,
    axle: 'only',
    signed: true,
    sign: 'positive to the left',
    definition: "Sideways movement of the axle from its ride position, at its reference point in the body's axes.",
    layouts: SOLID_AXLE,
    csv: 'lateralShift',
    group: 'axle',
    why: 'axle',
    plotEmpty: 'No axle: this layout has no lateral shift.',
    target: true,
    bandEnds: ['min', 'max'],
  },
  {
    key: 'foreAftShift',
    id: 'foreaft',
    label: 'Fore-aft shift',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.foreAftShift,
    signed: true,
    sign: 'positive forward',
    definition:
      "Fore-aft movement from ride of the axle (without an axle: of the left wheel centre), in the body's axes.",
    layouts: ALL_LAYOUTS,
    csv: 'foreAftShift',
    group: 'axle',
    plotEmpty: 'Not defined for this layout.',
    target: true,
    bandEnds: ['min', 'max'],
  },
  {
    key: 'instantCenter.x',
    id: 'ic-x',
    label: 'Instant centre x',
    point: 'Instant centre',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.instantCenter?.x ?? null,
    signed: false,
    sign: "positive forward, in the frame's axes (ISO 8855)",
    definition:
      "Fore-aft position of the left side's side-view instant centre (where its upper and lower link " +
      "lines cross, or a trailing arm's pivot axis), in the body's axes.",
    layouts: SIDE_VIEW_IC,
    csv: 'instantCenter.x',
    group: 'geometry',
    why: 'ic',
  },
  {
    key: 'instantCenter.z',
    id: 'ic-z',
    label: 'Instant centre z (body-fixed)',
    point: 'Instant centre',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.instantCenter?.z ?? null,
    signed: false,
    sign: "z in the frame's axes (fixed to the body), from the ground at ride; not the height above the ground at this row",
    definition:
      "Height of the left side's side-view instant centre in the body-fixed axes, whose zero is the ground at ride.",
    layouts: SIDE_VIEW_IC,
    csv: 'instantCenter.z',
    group: 'geometry',
    why: 'ic',
  },
  {
    key: 'instantCenterAboveGround',
    id: 'ic-height',
    label: 'Instant centre height',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.instantCenterAboveGround,
    signed: false,
    sign:
      'above the ground the tyres stand on at this row (the plane through both contact points), square to it, ' +
      'in the fore-aft plane through the left wheel centre',
    definition:
      "Height of the left side's side-view instant centre above the ground the tyres stand on at this row, measured square to that ground.",
    layouts: SIDE_VIEW_IC,
    csv: 'instantCenterAboveGround',
    group: 'geometry',
    why: 'ic',
  },
  {
    key: 'antiSquat',
    id: 'antisquat',
    label: 'Anti-squat',
    quantity: 'percent',
    sweep: 'heave',
    read: (r) => r.antiSquat,
    // A front axle's rows carry anti-lift under power in its place (vehicle.axle).
    hidden: (r) => r.antiLift !== undefined,
    axle: 'or-defined',
    signed: false,
    sign: '100 % when the instant centre line meets the centre of gravity height at the front axle',
    definition:
      '100 × the slope of the line from the left contact patch (on trailing arms, whose drive is ' +
      'frame-mounted: the wheel centre) through the side-view instant centre, over CG height / wheelbase.',
    layouts: [
      'four-link-lateral-rod',
      'triangulated-four-link',
      'three-link-lateral-rod',
      'trailing-arm',
      'leaf-spring',
    ],
    csv: 'antiSquat',
    group: 'geometry',
    why: 'ic',
    plotEmpty: 'Anti-squat is not defined anywhere in the travel (no upper and lower link pair).',
    target: true,
    bandEnds: ['min', 'max'],
  },
  {
    key: 'rollCenterHeight',
    id: 'rc-body',
    label: 'Roll centre z (body-fixed)',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.rollCenterHeight,
    signed: false,
    sign: "z in the frame's axes (fixed to the body), from the ground at ride; not the height above the ground at this row",
    definition:
      'Roll centre height on the centreline in the body-fixed axes (zero: the ground at ride), from ' +
      "the lateral rod, link pairs, spring seats or the arms' contact-patch lines.",
    layouts: ALL_LAYOUTS,
    csv: 'rollCenterHeight',
    group: 'geometry',
    why: 'rc',
    target: true,
    bandEnds: ['min', 'max'],
  },
  {
    key: 'rollCenterAboveGround',
    id: 'rc',
    label: 'Roll centre height',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.rollCenterAboveGround,
    signed: false,
    sign:
      'on the centreline, above the ground the tyres stand on at this row (the plane through both contact ' +
      'points), square to it; the body is held still and the ground moves by the travel',
    definition:
      'Roll centre height on the centreline above the ground the tyres stand on at this row, from the ' +
      'same construction as the body-fixed roll centre.',
    layouts: ALL_LAYOUTS,
    csv: 'rollCenterAboveGround',
    group: 'geometry',
    why: 'rc',
  },
  {
    key: 'bind',
    id: 'bind',
    label: 'Bind',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.bind,
    signed: false,
    sign: 'largest constraint residual, never negative',
    definition:
      "The largest mismatch between a member's set length and the distance between its ends after the " +
      'solve: zero when the linkage moves freely.',
    layouts: ALL_LAYOUTS,
    csv: 'bind',
    group: 'geometry',
  },
  {
    key: 'camberChange',
    id: 'camber',
    label: 'Camber change',
    quantity: 'angle',
    sweep: 'heave',
    read: (r) => r.camberChange,
    given: given('camberChange'),
    signed: true,
    sign: 'left wheel, positive when the top leans out',
    definition:
      "Change from ride of the left wheel's camber in rear view, measured against the body (body-fixed axes), not against the ground.",
    layouts: INDEPENDENT,
    csv: 'camberChange',
    group: 'axle',
    plotEmpty: '',
  },
  {
    key: 'toeChange',
    id: 'toe',
    label: 'Toe change (bump steer)',
    quantity: 'angle',
    sweep: 'heave',
    read: (r) => r.toeChange,
    given: given('toeChange'),
    signed: true,
    digits: 3,
    sign: 'left wheel, positive toe-in',
    definition: "Change from ride of the left wheel's toe in top view, measured against the body: the bump steer.",
    layouts: INDEPENDENT,
    csv: 'toeChange',
    group: 'axle',
    plotEmpty: '',
  },
  ...(['left', 'right'] as const).map((side): HeaveEntry => ({
    key: `wheelSteer.${side}`,
    id: `wheel-steer-${side}`,
    label: `${side === 'left' ? 'Left' : 'Right'} wheel bump steer`,
    quantity: 'angle',
    sweep: 'heave',
    read: (r) => r.wheelSteer?.[side] ?? null,
    given: given('wheelSteer'),
    signed: true,
    digits: 3,
    sign: "positive when the wheel turns toward the vehicle's left (as yaw)",
    definition:
      `Change from ride of the ${side} wheel's heading in top view, its knuckle turned on the kingpin by the drag link ` +
      'and tie rod as the axle moves: the bump steer.',
    layouts: STEERED_AXLE,
    csv: `wheelSteer.${side}`,
    group: 'axle',
    plotEmpty: '',
  })),
  {
    key: 'contactTrackChange',
    id: 'contact-track',
    label: 'Contact patch track change',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.contactTrackChange,
    given: given('contactTrackChange'),
    signed: true,
    sign:
      "left tyre, positive when its contact point moves away from the vehicle's centreline along the ground " +
      "(the lowest point of the tyre circle of the vehicle's tyre radius in the wheel plane); the scrub to keep small",
    definition:
      "Change from ride of the left contact patch's distance from the centreline, measured along the " +
      'ground under the wheels (not at the wheel centre).',
    layouts: INDEPENDENT,
    csv: 'contactTrackChange',
    group: 'axle',
    plotEmpty: '',
  },
  {
    key: 'trackChange',
    id: 'track',
    label: 'Wheel centre track change',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.trackChange,
    given: given('trackChange'),
    signed: true,
    sign: "positive when the left wheel centre moves away from the vehicle's centreline",
    definition:
      "Change from ride of the left wheel centre's distance from the centreline, in the body's axes (not at the contact patch).",
    layouts: INDEPENDENT,
    csv: 'trackChange',
    group: 'axle',
    plotEmpty: '',
  },
  {
    key: 'casterChange',
    id: 'caster',
    label: 'Caster change',
    quantity: 'angle',
    sweep: 'heave',
    read: (r) => r.casterChange,
    given: given('casterChange'),
    signed: true,
    sign: 'positive when the top of the kingpin axis moves rearward',
    definition: "Change from ride of the left kingpin axis' side-view angle from the vertical, in the body's axes.",
    layouts: KINGPIN,
    csv: 'casterChange',
    group: 'axle',
  },
  {
    key: 'frontViewInstantCenter.y',
    id: 'fvic-y',
    label: 'Front-view instant centre y',
    point: 'Front-view instant centre',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.frontViewInstantCenter?.y ?? null,
    given: given('frontViewInstantCenter'),
    signed: false,
    sign: 'positive to the left, from the centreline',
    definition:
      "Sideways position of the left wheel carrier's front-view instant centre (its wishbone lines' " +
      "crossing, or a trailing arm's pivot axis), in the body's axes.",
    layouts: INDEPENDENT,
    csv: 'frontViewInstantCenter.y',
  },
  {
    key: 'frontViewInstantCenter.z',
    id: 'fvic-z',
    label: 'Front-view instant centre height',
    point: 'Front-view instant centre',
    quantity: 'length',
    sweep: 'heave',
    read: (r) => r.frontViewInstantCenter?.z ?? null,
    given: given('frontViewInstantCenter'),
    signed: false,
    sign: "height in the frame's axes, from the ground at ride",
    definition:
      "Height of the left wheel carrier's front-view instant centre in the body-fixed axes, whose zero is the ground at ride.",
    layouts: INDEPENDENT,
    csv: 'frontViewInstantCenter.z',
  },
  {
    key: 'antiDive',
    id: 'antidive',
    label: 'Anti-dive',
    quantity: 'percent',
    sweep: 'heave',
    read: (r) => r.antiDive,
    given: given('antiDive'),
    signed: false,
    sign: "100 % when the instant centre line carries all of the wheel's braking load transfer",
    definition:
      '100 × front brake share × the slope of the line from the left contact patch through the ' +
      'side-view instant centre × wheelbase / centre of gravity height.',
    layouts: [...LINKED_AXLE, ...WISHBONE],
    csv: 'antiDive',
    group: 'geometry',
    why: 'ic',
    plotEmpty: '',
  },
  {
    key: 'antiLift',
    id: 'antilift',
    label: 'Anti-lift under power',
    quantity: 'percent',
    sweep: 'heave',
    read: (r) => r.antiLift,
    given: given('antiLift'),
    signed: false,
    sign: "100 % when the instant centre line carries all of the front's load transfer under power (the axle driving alone)",
    definition:
      "A front solid axle's anti-lift under power, taking all the drive: 100 × the slope of the line from the left " +
      'contact patch through the side-view instant centre × wheelbase / CG height.',
    layouts: LINKED_AXLE,
    csv: 'antiLift',
    group: 'geometry',
    missing: 'needs a driveline and an upper and lower link',
    plotEmpty: '',
  },
  {
    key: 'antiLiftBraking',
    id: 'antilift-brake',
    label: 'Anti-lift in braking',
    quantity: 'percent',
    sweep: 'heave',
    read: (r) => r.antiLiftBraking,
    given: given('antiLiftBraking'),
    signed: false,
    sign: "100 % when the instant centre line carries all of the rear's braking load transfer",
    definition:
      "A rear solid axle's anti-lift in braking: 100 × rear brake share × the slope of the line from the left " +
      'contact patch through the side-view instant centre × wheelbase / CG height.',
    layouts: LINKED_AXLE,
    csv: 'antiLiftBraking',
    group: 'geometry',
    why: 'ic',
    plotEmpty: '',
  },
  ...(
    [
      [
        'inclination',
        'kpi',
        'Kingpin inclination',
        'angle',
        'positive when the top of the axis leans inboard',
        "Front-view angle from the vertical of the left kingpin axis (through the two ball joints), in the body's axes.",
      ],
      [
        'caster',
        'kp-caster',
        'Caster',
        'angle',
        'positive when the top of the axis leans rearward',
        "Side-view angle from the vertical of the left kingpin axis (through the two ball joints), in the body's axes.",
      ],
      [
        'scrubRadius',
        'scrub',
        'Scrub radius',
        'length',
        'positive when the axis meets the ground inboard of the patch',
        'Sideways distance, at the ground, from the left contact patch to where the kingpin axis meets the ground.',
      ],
      [
        'trail',
        'trail',
        'Mechanical trail',
        'length',
        'positive when the axis meets the ground ahead of the patch',
        'Fore-aft distance, at the ground, from the left contact patch to where the kingpin axis meets the ground.',
      ],
    ] as const
  ).map(([field, id, label, quantity, sign, definition]): HeaveEntry => ({
    key: `kingpin.${field}`,
    id,
    label,
    quantity,
    sweep: 'heave',
    read: (r) => r.kingpin?.[field] ?? null,
    given: given('kingpin'),
    signed: false,
    sign,
    definition,
    layouts: KINGPIN,
    csv: `kingpin.${field}`,
    group: 'geometry',
    missing: 'ball joints level: no kingpin axis',
  })),
  ...(drivelineEntries('heave', true) as HeaveEntry[]),
  {
    key: 'shackleAngle',
    id: 'shackle',
    label: 'Shackle angle',
    quantity: 'angle',
    sweep: 'heave',
    read: (r) => r.shackleAngle,
    given: given('shackleAngle'),
    signed: true,
    digits: 1,
    sign: 'left shackle from the vertical, positive when the spring eye lies rearward of the hanger',
    definition:
      "Side-view angle of the left shackle, from its frame hanger to the spring eye, against the vertical in the body's axes.",
    layouts: ['leaf-spring'],
    csv: 'shackleAngle',
    group: 'leaf',
    missing: 'shackle angle is taken in heave, not in roll',
  },
  ...(halfShaftEntries('heave', true) as HeaveEntry[]),
  {
    key: 'rollSteerInTravel',
    id: 'rollsteer-travel',
    label: 'Roll steer through the travel',
    shortLabel: 'Roll steer',
    quantity: 'percent',
    sweep: 'heave',
    read: (r) => r.rollSteerInTravel,
    given: given('rollSteerInTravel'),
    signed: true,
    sign: '100 · yaw / roll of a small roll at this travel: positive when the axle turns its nose left as its left side lifts',
    definition:
      "The axle's yaw against the body per unit of roll for a small roll about this heave row's pose, " +
      'as a percentage: the roll sweep’s roll steer, taken at every travel instead of at ride height only.',
    axleSense: ROLL_STEER_AXLE_SENSE,
    layouts: SOLID_AXLE,
    group: 'geometry',
    missing: 'no roll at this travel: roll steer is a ratio to the roll angle',
    plotEmpty: 'No roll sweep (articulation set to 0).',
  },
];
