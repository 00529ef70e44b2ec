/**
 * What the metric registry says about one quantity the sweep reports: its name on every
 * screen, its kind (so shared/units.ts converts it for display), the sweep it belongs to, how
 * to read it from a row, whether a target band can be set on it, its CSV column, its sign in
 * words and the layouts whose sweep gives it. Screens list metrics only through the views
 * (views.ts), never by their own lists.
 */
import type { Layout } from '../../../schema/sketchVocabulary';
import type { TargetMetric } from '../../../schema/boardFields';
import type { QuantityKind } from '../../../units';
import type { BumpSteerMap, HeaveRow, RollRow, SteerRow, SweepResult } from '../../types';

/**
 * The sweep a metric is read from; `limits` holds the one-number readings of the whole sweep (articulation),
 * `steer` the steer sweep's rows, `bumpSteer` the one-number readings of its bump-steer map.
 */
export type MetricSweep = 'heave' | 'roll' | 'limits' | 'steer' | 'bumpSteer';

/** The sweeps whose metrics a target band can be set on (the steer sweep's take none yet). */
export type TargetSweep = 'heave' | 'roll' | 'limits';

/** A row of each sweep; `limits` metrics read the result's limits, `bumpSteer` metrics the map (`steer.bumpSteer`). */
export interface SweepRowOf {
  heave: HeaveRow;
  roll: RollRow;
  limits: SweepResult['limits'];
  steer: SteerRow;
  bumpSteer: BumpSteerMap;
}

/** Which end of the vehicle a sketch's suspension sits at (`vehicle.axle`; rear when the sketch does not say). */
export type AxleEnd = 'front' | 'rear';

/** Why a number is missing, where the reason depends on the sketch (the readout words it). */
export type MissingWhy = 'axle' | 'ic' | 'rc';

interface EntryBase<S extends MetricSweep> {
  /** the quantity's name in the sweep result (a path such as `kingpin.caster`); unique within its sweep */
  key: string;
  /** short id of the quantity on the board (readout line and plot keys); unique within its sweep */
  id: string;
  /** the name screens show */
  label: string;
  /** the name where the sweep goes without saying (the readout of that sweep); `label` when absent */
  shortLabel?: string;
  /** the common name of a point's coordinates (e.g. the instant centre's x and z) */
  point?: string;
  quantity: QuantityKind;
  sweep: S;
  /** the value in the file's unit (mm, deg, %, N/mm, N); null or undefined where the sweep does not define it */
  read: (row: SweepRowOf[S]) => number | null | undefined;
  /**
   * whether the sweep gives this quantity at all for the sketch swept, judged on one row (the
   * optional additions of some layouts); absent: always given
   */
  given?: (row: SweepRowOf[S]) => boolean;
  /**
   * true where the quantity means nothing for the sketch swept although its layout gives it, judged on
   * one row: no screen shows it then (anti-squat of a solid axle at the front); absent: never hidden
   */
  hidden?: (row: SweepRowOf[S]) => boolean;
  /**
   * how it belongs to a solid axle: `only` is not shown for a layout without one, `or-defined`
   * is shown without an axle only where the sweep defines it
   */
  axle?: 'only' | 'or-defined';
  /** a change from ride, shown with its sign (+1.2 mm); a band on it is naturally symmetric ("within ±3°") */
  signed: boolean;
  /** digits after the point where an angle shows more or fewer than two */
  digits?: number;
  /** the sign convention in words */
  sign: string;
  /**
   * what the number is, in one sentence ending with a period (at most ~200 characters), with the
   * point it is taken at (wheel centre or contact patch) and the axes it is measured in (body-fixed
   * or above the ground); the readout, plots, targets and build sheet show it as the quantity's help
   */
  definition: string;
  /** for a quantity whose positive sign reads differently on a front and a rear axle: the words for each */
  axleSense?: Record<AxleEnd, string>;
  /** the layouts whose sweep gives this number (the schema's layout names) */
  layouts: readonly Layout[];
  /** the CSV column of the heave rows' export; absent when not exported */
  csv?: string;
  /** the readout's section */
  group?: 'axle' | 'geometry' | 'leaf' | 'driveline';
  /** why the readout shows "—": a reason that depends on the sketch */
  why?: MissingWhy;
  /** why the readout shows "—": a fixed reason */
  missing?: string;
  /** the sentence a travel plot shows when the sweep never defines the quantity */
  plotEmpty?: string;
}

/** A metric a target band can be set on: its key is one of the schema's target metrics. */
export interface TargetEntry<S extends MetricSweep = MetricSweep> extends EntryBase<S> {
  key: TargetMetric;
  target: true;
  /** the ends of the band the designer sets: `min` only where only a lower end means anything */
  bandEnds: readonly ('min' | 'max')[];
}

export interface PlainEntry<S extends MetricSweep = MetricSweep> extends EntryBase<S> {
  target?: false;
}

export type MetricEntry<S extends MetricSweep = MetricSweep> = TargetEntry<S> | PlainEntry<S>;

export type HeaveEntry = MetricEntry<'heave'>;
export type RollEntry = MetricEntry<'roll'>;
export type LimitsEntry = MetricEntry<'limits'>;
export type SteerEntry = MetricEntry<'steer'>;
export type BumpSteerEntry = MetricEntry<'bumpSteer'>;
export type AnyEntry = HeaveEntry | RollEntry | LimitsEntry | SteerEntry | BumpSteerEntry;
