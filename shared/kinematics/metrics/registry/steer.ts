/**
 * The quantities of the steer sweep (the rack moved, or the pitman arm turned, the body at ride height;
 * steer/sweep.ts) and the worst value of its bump-steer map. Signs and units as shared/kinematics/types.ts
 * documents SteerRow. The input's entry is keyed by the rows' field that holds it (`SteerResult.input`).
 */
import type { BumpSteerEntry, SteerEntry } from './types';
import { RACK_STEERED, STEERED, STEERED_AXLE } from './layouts';

export const steerEntries: SteerEntry[] = [
  {
    key: 'rack',
    id: 'rack',
    label: 'Rack travel',
    quantity: 'length',
    sweep: 'steer',
    read: (r) => r.rack,
    signed: true,
    sign: "positive toward the vehicle's left, along the line through the tie rods' inner ends",
    definition: "The rack's travel from centre along the line through the two tie rods' inner ends, at ride height.",
    layouts: RACK_STEERED,
  },
  {
    key: 'pitman',
    id: 'pitman',
    label: 'Pitman arm angle',
    quantity: 'angle',
    sweep: 'steer',
    read: (r) => r.pitman,
    signed: true,
    digits: 1,
    sign: "positive when the pitman arm's ball swings toward the vehicle's left",
    definition:
      "The pitman arm's turn from straight ahead about the steering box's output axis (the box pivot to its axis point), at ride height.",
    layouts: STEERED_AXLE,
  },
  {
    key: 'leftSteer',
    id: 'steer-left',
    label: 'Left wheel steer angle',
    quantity: 'angle',
    sweep: 'steer',
    read: (r) => r.leftSteer,
    signed: true,
    digits: 2,
    sign: "positive when the wheel turns toward the vehicle's left (as yaw)",
    definition:
      "The left wheel's heading from straight ahead in top view, where its wheel plane meets the ground, at ride height.",
    layouts: STEERED,
  },
  {
    key: 'rightSteer',
    id: 'steer-right',
    label: 'Right wheel steer angle',
    quantity: 'angle',
    sweep: 'steer',
    read: (r) => r.rightSteer,
    signed: true,
    digits: 2,
    sign: "positive when the wheel turns toward the vehicle's left (as yaw)",
    definition:
      "The right wheel's heading from straight ahead in top view, where its wheel plane meets the ground, at ride height.",
    layouts: STEERED,
  },
  {
    key: 'ackermann',
    id: 'ackermann',
    label: 'Ackermann',
    quantity: 'percent',
    sweep: 'steer',
    read: (r) => r.ackermann,
    signed: true,
    digits: 1,
    sign: '100 is true Ackermann, 0 parallel steer, negative when the inner wheel turns less than the outer',
    definition:
      "How much more the inner wheel turns than the outer, as a share of what the Ackermann condition asks for the outer wheel's angle.",
    layouts: STEERED,
    missing: 'not defined straight ahead',
  },
  {
    key: 'turningRadius',
    id: 'turning-radius',
    label: 'Turning radius',
    quantity: 'length',
    sweep: 'steer',
    read: (r) => r.turningRadius,
    signed: false,
    sign: 'to the outer front wheel, never negative',
    definition:
      "Distance from the turning centre on the rear axle line to the outer front wheel's contact patch, from the outer wheel's angle.",
    layouts: STEERED,
    missing: 'not defined straight ahead',
  },
];

export const bumpSteerEntries: BumpSteerEntry[] = [
  {
    key: 'worst',
    id: 'bump-steer-worst',
    label: 'Worst bump steer to lock',
    quantity: 'angle',
    sweep: 'bumpSteer',
    read: (m) => m.worst,
    signed: true,
    digits: 3,
    sign: 'positive toe-in, of the wheel and place where its size is largest',
    definition:
      'The largest toe change over the travel of either wheel, at straight ahead and at steering positions ' +
      '(rack or pitman arm) out to lock.',
    layouts: STEERED,
  },
];
