/**
 * The key numbers of a hand-in: which registry quantities the hand-ins table compares for each family of
 * layouts, and reading them from a sweep. The one place that choice is made; the server stores what this
 * gives when a student hands in, and the table only lays it out.
 */
import type { SweepResult } from '../kinematics/types';
import type { Layout, Sketch } from '../schema/sketch';
import type { KeyNumber } from '../schema/classes';
import { INDEPENDENT, SOLID_AXLE } from '../kinematics/metrics/registry/layouts';
import { metricEntry, metricShown, type MetricEntry, type MetricRef } from '../kinematics/metrics/registry';
import { quantityFileUnit } from '../units';
import { comparedFlags } from '../display/comparedFlags';
import { checkTargets, type Targets } from '../display/targets';

/** Where along the sweep a key number is read: ride height, full bump, or the whole sweep (articulation). */
export type HandInAt = 'ride' | 'bump' | 'articulation';

export interface HandInKey {
  metric: MetricRef;
  at: HandInAt;
}

export type LayoutFamily = 'solid-axle' | 'independent';

/**
 * The quantities per family. A solid axle: anti-squat at ride, pinion angle change and lateral shift at full
 * bump, the articulation reached. An independent layout: camber and toe change at full bump.
 */
export const handInKeys: Record<LayoutFamily, readonly HandInKey[]> = {
  'solid-axle': [
    { metric: { sweep: 'heave', key: 'antiSquat' }, at: 'ride' },
    { metric: { sweep: 'heave', key: 'pinionAngleChange' }, at: 'bump' },
    { metric: { sweep: 'heave', key: 'lateralShift' }, at: 'bump' },
    { metric: { sweep: 'limits', key: 'articulation' }, at: 'articulation' },
  ],
  independent: [
    { metric: { sweep: 'heave', key: 'camberChange' }, at: 'bump' },
    { metric: { sweep: 'heave', key: 'toeChange' }, at: 'bump' },
  ],
};

/** The family of a layout (every layout is in one: a test holds the two groups to cover them all). */
export function layoutFamily(layout: Layout): LayoutFamily {
  if (SOLID_AXLE.includes(layout)) return 'solid-axle';
  if (INDEPENDENT.includes(layout)) return 'independent';
  throw new Error(`Layout "${layout}" is in no family of key numbers.`);
}

/** The value of one key, in the registry's file unit; null where the sweep does not define it or it means nothing. */
function valueOf(key: HandInKey, layout: Layout, result: SweepResult): number | null {
  if (key.metric.sweep === 'limits') {
    const entry = metricEntry({ sweep: 'limits', key: key.metric.key });
    return finite(entry.read(result.limits));
  }
  const entry: MetricEntry<'heave'> = metricEntry({ sweep: 'heave', key: key.metric.key });
  if (!entry.layouts.includes(layout) || !metricShown(entry, result.ride)) return null;
  const row = key.at === 'ride' ? result.ride : result.heave[result.heave.length - 1];
  return row ? finite(entry.read(row)) : null;
}

const finite = (v: number | null | undefined): number | null =>
  typeof v === 'number' && Number.isFinite(v) ? v : null;

export interface HandInNumbers {
  keyNumbers: KeyNumber[];
  /** the flags the board raises, counted as the line-up counts them */
  flagCount: number;
  /** target bands missed somewhere in the sweep */
  missedTargetCount: number;
}

/** The key numbers of a swept sketch, with its flags and missed targets checked against `targets`. */
export function handInNumbers(document: Sketch, result: SweepResult, targets: Targets): HandInNumbers {
  const keyNumbers = handInKeys[layoutFamily(document.layout)].map((key): KeyNumber => {
    const entry = metricEntry(key.metric);
    return {
      key: entry.key,
      label: entry.label,
      at: key.at,
      value: valueOf(key, document.layout, result),
      unit: quantityFileUnit(entry.quantity),
    };
  });
  const checks = checkTargets(result, targets);
  return {
    keyNumbers,
    flagCount: comparedFlags(result, document.members, checks, 'mm').length,
    missedTargetCount: checks.filter((c) => c.status === 'missed').length,
  };
}
