/**
 * The quantities of the roll (articulation) sweep at ride height, and the one-number readings
 * of the whole sweep. Signs and units as shared/kinematics/types.ts documents each field.
 */
import type { LimitsEntry, RollEntry } from './types';
import { drivelineEntries, halfShaftEntries } from './heave';
import { ALL_LAYOUTS, INDEPENDENT, LINKED_AXLE, SOLID_AXLE, STEERED_AXLE } from './layouts';

import { ROLL_STEER_AXLE_SENSE } from './rollSteerSense';

const wishboneOnly = (r: { camberToGround?: unknown; rollCenter?: unknown }) =>
  r.camberToGround !== undefined || r.rollCenter !== undefined;

export const rollEntries: RollEntry[] = [
  {
    key: 'roll',
    id: 'roll',
    label: 'Roll',
    quantity: 'angle',
    sweep: 'roll',
    read: (r) => r.roll,
    signed: true,
    sign: 'positive lifts the left wheel',
    definition: 'Roll angle imposed on the axle (or on the wheels) against the body by the roll sweep, at ride height.',
    layouts: ALL_LAYOUTS,
  },
  {
    key: 'leftTravel',
    id: 'left',
    label: 'Left wheel travel',
    quantity: 'length',
    sweep: 'roll',
    read: (r) => r.leftTravel,
    signed: true,
    sign: 'positive up',
    definition: "Vertical movement from ride of the left wheel centre in the roll sweep, in the body's axes.",
    layouts: ALL_LAYOUTS,
    group: 'axle',
  },
  {
    key: 'rightTravel',
    id: 'right',
    label: 'Right wheel travel',
    quantity: 'length',
    sweep: 'roll',
    read: (r) => r.rightTravel,
    signed: true,
    sign: 'positive up',
    definition: "Vertical movement from ride of the right wheel centre in the roll sweep, in the body's axes.",
    layouts: ALL_LAYOUTS,
    group: 'axle',
  },
  {
    key: 'rollSteer',
    id: 'rollsteer',
    label: 'Roll steer',
    quantity: 'percent',
    sweep: 'roll',
    read: (r) => r.rollSteer,
    signed: true,
    sign: '100 · yaw / roll: positive when the axle turns its nose left as its left side lifts',
    definition:
      "The axle's yaw against the body per unit of roll in the roll sweep at ride height, as a percentage: 100 × yaw / roll.",
    axleSense: ROLL_STEER_AXLE_SENSE,
    layouts: SOLID_AXLE,
    group: 'geometry',
    missing: 'no roll: roll steer is a ratio to the roll angle',
    plotEmpty: 'No roll sweep (articulation set to 0).',
    target: true,
    bandEnds: ['min', 'max'],
  },
  {
    key: 'bind',
    id: 'bind',
    label: 'Bind in roll',
    shortLabel: 'Bind',
    quantity: 'length',
    sweep: 'roll',
    read: (r) => r.bind,
    signed: false,
    sign: 'largest constraint residual, never negative',
    definition:
      "The largest mismatch between a member's set length and the distance between its ends in the " +
      'roll sweep: zero when the linkage rolls freely.',
    layouts: ALL_LAYOUTS,
    group: 'geometry',
    plotEmpty: 'No roll sweep (articulation set to 0).',
    target: true,
    bandEnds: ['min', 'max'],
  },
  ...(
    [
      ['left', 'Left camber to ground'],
      ['right', 'Right camber to ground'],
    ] as const
  ).map(([side, label]): RollEntry => ({
    key: `camberToGround.${side}`,
    id: `camber-ground-${side}`,
    label,
    quantity: 'angle',
    sweep: 'roll',
    read: (r) => r.camberToGround?.[side],
    given: wishboneOnly,
    signed: true,
    sign: 'change from ride, positive when the top leans out',
    definition: `Change from ride of the ${side} wheel's camber against the ground, tilted by the roll in the body's axes.`,
    layouts: INDEPENDENT,
  })),
  ...(
    [
      [
        'y',
        'Roll centre y',
        'positive to the left, from the centreline',
        'Sideways position of the roll centre in roll, where the lines from each contact patch through ' +
          "its front-view instant centre cross, in the body's axes.",
      ],
      [
        'z',
        'Roll centre height in roll',
        "height in the frame's axes, from the ground at ride",
        "Height of the roll centre in roll (the contact-patch lines' crossing) in the body-fixed axes, whose zero is the ground at ride.",
      ],
    ] as const
  ).map(([axis, label, sign, definition]): RollEntry => ({
    key: `rollCenter.${axis}`,
    id: `rc-${axis}`,
    label,
    point: 'Roll centre',
    quantity: 'length',
    sweep: 'roll',
    read: (r) => r.rollCenter?.[axis] ?? null,
    given: wishboneOnly,
    signed: false,
    sign,
    definition,
    layouts: INDEPENDENT,
  })),
  ...(
    [
      [
        'contactTrackChange',
        'contact-track',
        'contact patch track change',
        'length',
        "change from ride of the contact point's distance from the centreline along the ground, positive outward",
        "contact patch's distance from the centreline, measured along the ground under the wheels (not at the wheel centre)",
      ],
      [
        'trackChange',
        'track',
        'wheel centre track change',
        'length',
        "change from ride of the wheel centre's distance from y = 0 in the frame's axes, positive outward",
        "wheel centre's distance from the centreline, in the body's axes (not at the contact patch)",
      ],
      [
        'groundCamber',
        'ground-camber',
        'camber to the ground',
        'angle',
        "the wheel plane's angle from the normal of the ground through both contact points, positive when the top leans out",
        "wheel's camber against the ground the tyres stand on at this row",
      ],
    ] as const
  ).flatMap(([field, id, words, quantity, sign, what]) =>
    (['left', 'right'] as const).map((side): RollEntry => ({
      key: `${field}.${side}`,
      id: `${id}-${side}`,
      label: `${side === 'left' ? 'Left' : 'Right'} ${words}`,
      quantity,
      sweep: 'roll',
      read: (r) => r[field]?.[side] ?? null,
      given: (r) => r[field] !== undefined,
      signed: true,
      sign,
      definition:
        field === 'groundCamber'
          ? `The ${side} ${what} (not a change: the wheels stand square at ride).`
          : `Change from ride, in the roll sweep, of the ${side} ${what}.`,
      layouts: INDEPENDENT,
      group: 'axle',
    })),
  ),
  ...(['left', 'right'] as const).map((side): RollEntry => ({
    key: `wheelSteer.${side}`,
    // Apart from the heave rows' bump steer, which the same list of plots shows.
    id: `roll-wheel-steer-${side}`,
    label: `${side === 'left' ? 'Left' : 'Right'} wheel steer in roll`,
    quantity: 'angle',
    sweep: 'roll',
    read: (r) => r.wheelSteer?.[side] ?? null,
    given: (r) => r.wheelSteer !== undefined,
    signed: true,
    digits: 2,
    sign: "positive when the wheel turns toward the vehicle's left (as yaw)",
    definition:
      `Change from ride, in the roll sweep, of the ${side} wheel's heading in top view: the axle's roll steer and its ` +
      'knuckle turned by the drag link.',
    layouts: STEERED_AXLE,
    group: 'axle',
  })),
  {
    key: 'rollCenterAboveGround',
    id: 'rc',
    label: 'Roll centre height',
    quantity: 'length',
    sweep: 'roll',
    read: (r) => r.rollCenterAboveGround,
    signed: false,
    sign:
      'above the ground the tyres stand on at this row (the plane through both contact points, tilted by the ' +
      'roll), square to it; a solid axle on links: where the rod or the link pairs cross the centreline',
    definition:
      "Roll centre height above the ground the tyres stand on at this row: the rod's or link pairs' " +
      "centreline crossing on a solid axle, else the arms' contact-patch lines.",
    layouts: [...LINKED_AXLE, ...INDEPENDENT],
    group: 'geometry',
    why: 'rc',
  },
  {
    key: 'instantCenterAboveGround',
    id: 'ic-height',
    label: 'Instant centre height',
    quantity: 'length',
    sweep: 'roll',
    read: (r) => r.instantCenterAboveGround,
    signed: false,
    sign:
      "the left side's side-view instant centre above the ground the tyres stand on at this row, square to it, " +
      'in the fore-aft plane through the left wheel centre',
    definition:
      "Height of the left side's side-view instant centre above the ground the tyres stand on at this " +
      'row of the roll sweep, measured square to that ground.',
    layouts: [...LINKED_AXLE, ...INDEPENDENT],
    group: 'geometry',
    why: 'ic',
  },
  ...(drivelineEntries('roll', false) as RollEntry[]),
  ...(halfShaftEntries('roll', false) as RollEntry[]),
];

export const limitsEntries: LimitsEntry[] = [
  {
    key: 'articulation',
    id: 'articulation',
    label: 'Articulation',
    quantity: 'angle',
    sweep: 'limits',
    read: (l) => l.articulation,
    signed: false,
    digits: 1,
    sign: 'the roll reached both ways (the smaller side), never negative',
    definition: 'The roll the sweep reaches each way before the linkage stops solving, the smaller of the two.',
    layouts: ALL_LAYOUTS,
    target: true,
    bandEnds: ['min'],
  },
];
