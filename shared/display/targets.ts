/**
 * Targets: bands the designer wants a sweep quantity to stay within (anti-squat 60–90 %,
 * pinion angle change within ±3°, ...). Kept in the sketch document as the optional
 * `targets` field so they save, export and travel with the sketch. Values are in the
 * file's units: % for anti-squat and roll steer, degrees for angles, mm for lengths. The
 * field's schema is the shared one (shared/schema/boardFields.ts), so the server checks it too.
 */
import { targetMetrics, targetsSchema, type TargetBand, type Targets } from '../schema/boardFields';
import type { TargetMetric } from '../schema/boardFields';
import type { HeaveRow, RollRow, SweepResult } from '../kinematics';
import { targetEntries, type TargetSweep } from '../kinematics/metrics/registry';
import type { Deg, Mm } from '../units';

// The board's stores and components take the band types from here, beside the checks.
export type { TargetBand, Targets };

/**
 * Bands to start from when a designer has none. Common practice, no published source:
 * these are the examples the product brief gives, not recommendations for any vehicle.
 */
export const startingTargets: Targets = {
  antiSquat: { min: 60, max: 90 },
  pinionAngleChange: { min: -3, max: 3 },
  lateralShift: { min: -15, max: 15 },
  articulation: { min: 8 },
};

/** The targets of a document, or none when the field is absent or malformed. */
export function readTargets(doc: unknown): Targets {
  const raw = (doc as { targets?: unknown } | null | undefined)?.targets;
  if (raw === undefined) return {};
  const res = targetsSchema.safeParse(raw);
  return res.success ? res.data : {};
}

/** True when a band says something (at least one end). */
export function bandIsSet(b: TargetBand | undefined): b is TargetBand {
  return !!b && (b.min !== undefined || b.max !== undefined);
}

/** Tolerance on a band's edge: a value this close to the edge counts as inside (solver residuals are far smaller). */
export const BAND_EDGE_TOLERANCE = 1e-6;

export interface TargetCheck {
  metric: TargetMetric;
  band: TargetBand;
  /** 'unknown' when the metric has no value anywhere in the window (e.g. no instant centre) */
  status: 'met' | 'missed' | 'unknown';
  /** where the value first leaves the band: mm of travel or deg of roll (absent for articulation) */
  at?: Mm | Deg;
  /** the value there (or the articulation reached), in the metric's file unit */
  value?: number;
  /** the worst value in the window, file unit */
  worst?: number;
  sweep: TargetSweep;
}

function inBand(v: number, b: TargetBand): boolean {
  return (
    (b.min === undefined || v >= b.min - BAND_EDGE_TOLERANCE) &&
    (b.max === undefined || v <= b.max + BAND_EDGE_TOLERANCE)
  );
}

/** How far outside the band a value lies (0 inside). */
function excess(v: number, b: TargetBand): number {
  if (b.min !== undefined && v < b.min) return b.min - v;
  if (b.max !== undefined && v > b.max) return v - b.max;
  return 0;
}

/**
 * Rows ordered from ride outwards, so "where it starts" is the miss closest to ride height:
 * the first point a designer meets when the suspension leaves ride.
 */
function outwardFromRide<T>(rows: T[], pos: (r: T) => number): T[] {
  return [...rows].sort((a, b) => Math.abs(pos(a)) - Math.abs(pos(b)));
}

/** Checks one band against a sweep result. */
export function checkTarget(result: SweepResult, metric: TargetMetric, band: TargetBand): TargetCheck {
  const spec = targetEntries[metric];
  if (spec.sweep === 'limits') {
    const value = spec.read(result.limits) as number;
    return { metric, band, sweep: spec.sweep, status: inBand(value, band) ? 'met' : 'missed', value, worst: value };
  }
  const read = spec.read as (r: HeaveRow | RollRow) => number | null | undefined;
  const rows = (spec.sweep === 'heave' ? result.heave : result.roll) as Array<HeaveRow & RollRow>;
  const pos = (r: HeaveRow & RollRow) => (spec.sweep === 'heave' ? r.travel : r.roll);
  const inWindow = rows.filter(
    (r) => (band.from === undefined || pos(r) >= band.from) && (band.to === undefined || pos(r) <= band.to),
  );
  let first: { at: number; value: number } | undefined;
  let worst: number | undefined;
  let worstExcess = -1;
  let seen = 0;
  for (const r of outwardFromRide(inWindow, pos)) {
    const v = read(r);
    if (v === null || v === undefined || !Number.isFinite(v)) continue;
    seen++;
    const e = excess(v, band);
    if (e > worstExcess) {
      worstExcess = e;
      worst = v;
    }
    if (!first && !inBand(v, band)) first = { at: pos(r), value: v };
  }
  if (seen === 0) return { metric, band, sweep: spec.sweep, status: 'unknown' };
  return first
    ? { metric, band, sweep: spec.sweep, status: 'missed', at: first.at, value: first.value, worst }
    : { metric, band, sweep: spec.sweep, status: 'met', worst };
}

/** Checks every band that is set. */
export function checkTargets(result: SweepResult, targets: Targets): TargetCheck[] {
  return targetMetrics.filter((m) => bandIsSet(targets[m])).map((m) => checkTarget(result, m, targets[m]!));
}
