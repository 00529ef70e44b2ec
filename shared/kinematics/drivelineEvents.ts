/**
 * The driveshaft's rules a fabricator checks, along one outward march of a sweep (events.ts):
 * - a joint running straighter than `minJointAngle` keeps its needle bearings in one place, so they
 *   wear there (common practice, no published source);
 * - two single Cardan joints cancel each other's speed fluctuation only when their operating angles
 *   match: a difference over `maxJointAngleMismatch` is flagged (common practice, no published source);
 * - a double-Cardan (CV) shaft puts the whole angle on the output joint and wants the pinion pointing
 *   at it: a pinion joint angle over `maxJointAngleMismatch` is flagged instead, and the pinion joint
 *   is not held to the minimum;
 * - the shaft's length, output to pinion joint centres, must stay within the slip yoke's travel.
 * Each event's `value` is the setting it crosses, so a rule already broken at ride is worded by its limit.
 */
import type { Driveline } from '../schema/sketch';
import {
  DEFAULT_DRIVESHAFT_TYPE,
  DEFAULT_MAX_JOINT_ANGLE_MISMATCH_DEG,
  DEFAULT_MIN_JOINT_ANGLE_DEG,
} from '../schema/sketchVocabulary';
import { firstCrossing, firstCrossingBelow, whereText, type Row, type SweepKind } from './crossings';
import type { SweepEvent } from './types';

/** A setting as typed, to two decimals at most: 0.5°, 1°. */
const deg = (v: number) => `${+v.toFixed(2)}°`;

/** The events of one outward march (rows ordered from ride outward). */
export function drivelineEvents(d: Driveline, kind: SweepKind, rows: Row[]): SweepEvent[] {
  const events: SweepEvent[] = [];
  const where = (at: number) => whereText(kind, at);
  const shaft = d.shaft ?? DEFAULT_DRIVESHAFT_TYPE;
  const minAngle = d.minJointAngle ?? DEFAULT_MIN_JOINT_ANGLE_DEG;
  const mismatch = d.maxJointAngleMismatch ?? DEFAULT_MAX_JOINT_ANGLE_MISMATCH_DEG;
  const angle = (joint: 'output' | 'pinion') => (r: Row) =>
    joint === 'output' ? r.driveline?.outputAngle : r.driveline?.pinionAngle;

  const lowJoints = shaft === 'double-cardan' ? (['output'] as const) : (['output', 'pinion'] as const);
  if (minAngle > 0) {
    for (const joint of lowJoints) {
      const c = firstCrossingBelow(rows, angle(joint), minAngle);
      if (c)
        events.push({
          kind: 'joint-angle-low',
          sweep: kind,
          at: c.at,
          joint,
          value: minAngle,
          message: `The ${joint} joint's operating angle is under ${deg(minAngle)} ${where(c.at)}: its needle bearings barely turn and wear in one place.`,
        });
    }
  }

  if (shaft === 'double-cardan') {
    const c = firstCrossing(rows, angle('pinion'), mismatch);
    if (c)
      events.push({
        kind: 'joint-angle-mismatch',
        sweep: kind,
        at: c.at,
        joint: 'pinion',
        shaft,
        value: mismatch,
        message: `The pinion joint's operating angle passes ${deg(mismatch)} ${where(c.at)}: with a double-Cardan shaft the pinion should point at the output joint, which takes the whole angle.`,
      });
  } else {
    const c = firstCrossing(
      rows,
      (r) => (r.driveline ? Math.abs(r.driveline.outputAngle - r.driveline.pinionAngle) : undefined),
      mismatch,
    );
    if (c)
      events.push({
        kind: 'joint-angle-mismatch',
        sweep: kind,
        at: c.at,
        shaft,
        value: mismatch,
        message: `The output and pinion joints' operating angles differ by more than ${deg(mismatch)} ${where(c.at)}: their speed fluctuations no longer cancel.`,
      });
  }

  if (d.slipYoke) {
    const { collapsed, extended } = d.slipYoke;
    const length = (r: Row) => r.driveline?.length;
    const long = firstCrossing(rows, length, extended);
    if (long)
      events.push({
        kind: 'slip-yoke',
        sweep: kind,
        at: long.at,
        end: 'extended',
        value: extended,
        message: `The driveshaft is longer than the slip yoke's extended length (${extended} mm) ${where(long.at)}.`,
      });
    const short = firstCrossingBelow(rows, length, collapsed);
    if (short)
      events.push({
        kind: 'slip-yoke',
        sweep: kind,
        at: short.at,
        end: 'collapsed',
        value: collapsed,
        message: `The driveshaft is shorter than the slip yoke's collapsed length (${collapsed} mm) ${where(short.at)}.`,
      });
  }
  return events;
}
