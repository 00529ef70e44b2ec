/**
 * The leaf-sprung axle's wind-up at ride height under the axle torque (shared/kinematics/windUp.ts):
 * one reading of the whole sweep, not of a row. The readout shows it in its leaf-spring section.
 */
import type { QuantityKind } from '../../../units';
import type { WindUpReading } from '../../types';

export interface WindUpEntry {
  key: 'angle' | 'rate' | 'bind';
  /** short id on the board (readout line key) */
  id: string;
  label: string;
  quantity: QuantityKind;
  read: (w: WindUpReading) => number;
  signed: boolean;
  sign: string;
  /** what the number is, in one sentence (types.ts `definition`) */
  definition: string;
  /** why the readout shows "—" */
  missing?: string;
}

export const windUpEntries: WindUpEntry[] = [
  {
    key: 'angle',
    id: 'windup',
    label: 'Wind-up at ride',
    quantity: 'angle',
    read: (w) => w.angle,
    signed: true,
    sign: "the axle housing's pitch, positive when the pinion nose rises",
    definition:
      "The axle housing's pitch against the body at ride height under the axle torque, as the leaf springs wind up.",
    missing: 'the springs do not resist wind-up',
  },
  {
    key: 'rate',
    id: 'windup-rate',
    label: 'Wind-up rate',
    quantity: 'angularRate',
    read: (w) => w.rate,
    signed: false,
    sign: 'N·m of axle torque per degree of wind-up, never negative',
    definition: 'Axle torque per degree of housing wind-up at ride height: how stiffly the leaf springs resist it.',
    missing: 'the springs have no rate',
  },
  {
    key: 'bind',
    id: 'windup-bind',
    label: 'Bind under wind-up',
    quantity: 'length',
    read: (w) => w.bind,
    signed: false,
    sign: 'largest residual of the wound-up solve, never negative',
    definition:
      "The largest mismatch between a member's set length and the distance between its ends in the " +
      'wound-up solve: zero when the axle winds up freely.',
  },
];

/** The wind-up reading a screen names. */
export function windUpEntry(key: WindUpEntry['key']): WindUpEntry {
  return windUpEntries.find((e) => e.key === key)!;
}
