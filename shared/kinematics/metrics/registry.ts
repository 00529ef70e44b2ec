/**
 * The metric registry: one entry per quantity the sweep reports (registry/heave.ts,
 * registry/roll.ts), and the views saying where each screen shows which (registry/views.ts).
 * Adding a metric: its formula, its entry, its place in the views, its tests; no screen changes.
 */
import type { TargetMetric } from '../../schema/boardFields';
import { heaveEntries } from './registry/heave';
import { limitsEntries, rollEntries } from './registry/roll';
import { bumpSteerEntries, steerEntries } from './registry/steer';
import type { AnyEntry, MetricEntry, MetricSweep, SweepRowOf, TargetEntry, TargetSweep } from './registry/types';
import type { MetricRef } from './registry/views';

export type * from './registry/types';
export * from './registry/views';
export * from './registry/members';
export * from './registry/windUp';
export * from './registry/help';
export { bumpSteerEntries, heaveEntries, limitsEntries, rollEntries, steerEntries };
export { driveJointNames } from './registry/heave';

/** Every entry, heave then roll then the whole-sweep readings, then the steer sweep's. */
export const metricEntries: readonly AnyEntry[] = [
  ...heaveEntries,
  ...rollEntries,
  ...limitsEntries,
  ...steerEntries,
  ...bumpSteerEntries,
];

const bySweep: Record<MetricSweep, Map<string, AnyEntry>> = {
  heave: new Map(heaveEntries.map((e) => [e.key, e])),
  roll: new Map(rollEntries.map((e) => [e.key, e])),
  limits: new Map(limitsEntries.map((e) => [e.key, e])),
  steer: new Map(steerEntries.map((e) => [e.key, e])),
  bumpSteer: new Map(bumpSteerEntries.map((e) => [e.key, e])),
};

/** The entry a view names; throws for a name no entry has (a slip in a view, caught by the tests). */
export function metricEntry<S extends MetricSweep>(ref: { sweep: S; key: string }): MetricEntry<S> {
  const e = bySweep[ref.sweep].get(ref.key);
  if (!e) throw new Error(`No ${ref.sweep} metric named "${ref.key}" in the registry.`);
  return e as unknown as MetricEntry<S>;
}

/**
 * Whether a screen shows the metric for the sketch swept, judged on one of its rows: the sweep gives it
 * (`given`) and it means something there (not `hidden`, e.g. anti-squat of a front axle).
 */
export function metricShown<S extends MetricSweep>(entry: MetricEntry<S>, row: SweepRowOf[S]): boolean {
  if (entry.given && !entry.given(row)) return false;
  return !entry.hidden?.(row);
}

/** True for a view item that names a metric (not a `*` section). */
export function isMetricRef(item: MetricRef | string): item is MetricRef {
  return typeof item !== 'string';
}

type TargetCapable = TargetEntry<'heave'> | TargetEntry<'roll'> | TargetEntry<'limits'>;
const targetSweepEntries = [...heaveEntries, ...rollEntries, ...limitsEntries];

/** The entries a target band can be set on, by target key. */
export const targetEntries = Object.fromEntries(
  targetSweepEntries.filter((e): e is TargetCapable => e.target === true).map((e) => [e.key, e]),
) as Record<TargetMetric, TargetEntry<TargetSweep>>;

/** The target-capable keys in registry order (a test holds them equal to the schema's list). */
export const registryTargetKeys: TargetMetric[] = targetSweepEntries
  .filter((e): e is TargetCapable => e.target === true)
  .map((e) => e.key);
