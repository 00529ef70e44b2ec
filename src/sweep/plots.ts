/**
 * Travel plots as data: which quantities are plotted against travel or roll, in the user's
 * units, with the target bands to shade and the shocks' stroke limits. Pure, so the chart
 * components only draw; no chart library is imported here.
 */
import type { HeaveRow, RollRow, SweepResult } from '../../shared/kinematics';
import type { SketchMember } from '../../shared/schema/sketch';
import type { LengthUnit } from '../../shared/units';
import { mmToUnit } from '../../shared/units';
import { bandIsSet, type TargetCheck, type Targets } from '../../shared/display/targets';
import {
  isMetricRef,
  memberEntry,
  metricEntry,
  metricHelp,
  plotsAxleView,
  plotsIndependentView,
  plotsSteerView,
  targetEntries,
  type AxleEnd,
  type MetricEntry,
} from '../../shared/kinematics/metrics/registry';
import { quantityUnit, toDisplay } from '../../shared/display/format';
import type { SweepContext } from './readout';
import type { BumpSteerCurve, BumpSteerMap, SteerRow } from '../../shared/kinematics/types';
import { showSteerPosition, steerAt, steerInputOf, type SteerInput } from '../../shared/display/steerInput';

export interface PlotPoint {
  x: number;
  /** null where the sweep does not define the quantity (a gap in the line, never a zero) */
  y: number | null;
}

export interface PlotSeries {
  label: string;
  points: PlotPoint[];
  color: string;
  /** dashed: a limit, not a computed curve */
  dash?: number[];
}

/** A target band in plot units; open ends are undefined. */
export interface PlotBand {
  yMin?: number;
  yMax?: number;
  xMin?: number;
  xMax?: number;
  missed: boolean;
}

export interface PlotSpec {
  key: string;
  title: string;
  /** what the plotted quantity is and its sign convention, from the registry (the title's tooltip) */
  help: string;
  /** what x is: heave travel, roll, or the steer input's position (mm of rack) */
  sweep: 'heave' | 'roll' | 'steer';
  /** axis titles with units */
  xTitle: string;
  yTitle: string;
  series: PlotSeries[];
  bands: PlotBand[];
  /** why the plot has nothing to draw (shown instead of an empty chart) */
  emptyReason?: string;
  /** true for a change from ride (shown with its sign: +1.2 mm), false for an amount (anti-squat, a length) */
  signed: boolean;
}

/** Our palette for curves (style: workshop steel blue, signal orange, and their companions). */
export const PLOT_COLORS = ['#2f5d7c', '#e07a1f', '#5b7f6a', '#8e5ba8', '#b5443a', '#3a87ad', '#a0812d', '#4d4d4d'];
/** The same hues lightened for the dark theme, where the deep ones would sink into the background. */
export const PLOT_COLORS_DARK: Record<string, string> = {
  '#2f5d7c': '#8fbfe0',
  '#e07a1f': '#f0a35e',
  '#5b7f6a': '#9cc7ab',
  '#8e5ba8': '#c59ada',
  '#b5443a': '#e5877e',
  '#3a87ad': '#7cc0e2',
  '#a0812d': '#d8b866',
  '#4d4d4d': '#b8b8b8',
};

type AnyRow = HeaveRow & RollRow;

/** A quantity plotted against travel (heave) or roll: an entry of the metric registry. */
type CurveDef = MetricEntry<'heave'> | MetricEntry<'roll'>;

function axisTitle(sweep: 'heave' | 'roll', u: LengthUnit): string {
  return sweep === 'heave' ? `travel (${u})` : 'roll (°)';
}

function xOf(sweep: 'heave' | 'roll', r: AnyRow, u: LengthUnit): number {
  return sweep === 'heave' ? mmToUnit(r.travel, u) : r.roll;
}

function bandsFor(def: CurveDef, targets: Targets, checks: TargetCheck[], u: LengthUnit): PlotBand[] {
  if (def.target !== true) return [];
  const metric = def.key;
  const band = targets[metric];
  if (!bandIsSet(band)) return [];
  const q = targetEntries[metric].quantity;
  const window = (v: number | undefined) =>
    v === undefined ? undefined : targetEntries[metric].sweep === 'heave' ? mmToUnit(v, u) : v;
  const check = checks.find((c) => c.metric === metric);
  return [
    {
      yMin: band.min === undefined ? undefined : toDisplay(band.min, q, u),
      yMax: band.max === undefined ? undefined : toDisplay(band.max, q, u),
      xMin: window(band.from),
      xMax: window(band.to),
      missed: check?.status === 'missed',
    },
  ];
}

function curvePlot(
  def: CurveDef,
  result: SweepResult,
  targets: Targets,
  checks: TargetCheck[],
  u: LengthUnit,
  end: AxleEnd | undefined,
): PlotSpec {
  const rows = (def.sweep === 'heave' ? result.heave : result.roll) as AnyRow[];
  const read = def.read as (r: AnyRow) => number | null | undefined;
  const points = rows.map((r) => {
    const v = read(r);
    return {
      x: xOf(def.sweep, r, u),
      y: v === null || v === undefined || !Number.isFinite(v) ? null : toDisplay(v, def.quantity, u),
    };
  });
  const empty = points.every((p) => p.y === null);
  return {
    key: def.id,
    title: def.label,
    help: metricHelp(def, end),
    sweep: def.sweep,
    xTitle: axisTitle(def.sweep, u),
    yTitle: quantityUnit(def.quantity, u),
    series: empty ? [] : [{ label: def.label, points, color: PLOT_COLORS[0] }],
    bands: bandsFor(def, targets, checks, u),
    emptyReason: empty ? (rows.length === 0 ? 'No rows in this sweep.' : (def.plotEmpty ?? '')) : undefined,
    signed: def.signed,
  };
}

/** Shock lengths over travel, each with its stroke limits as dashed lines in the same colour. */
function shockPlot(result: SweepResult, members: readonly SketchMember[], u: LengthUnit): PlotSpec {
  const shocks = members.filter((m) => m.kind === 'shock');
  const series: PlotSeries[] = [];
  const xs = result.heave.map((r) => mmToUnit(r.travel, u));
  const xEnds = xs.length ? [xs[0], xs[xs.length - 1]] : [];
  shocks.forEach((m, i) => {
    const color = PLOT_COLORS[(i + 1) % PLOT_COLORS.length];
    const points = result.heave.map((r, k) => {
      const len = r.members[m.id]?.length;
      return { x: xs[k], y: len === undefined || !Number.isFinite(len) ? null : mmToUnit(len, u) };
    });
    series.push({ label: m.id, points, color });
    for (const [which, v] of [
      ['shortest', m.minLength],
      ['longest', m.maxLength],
    ] as const) {
      if (v === undefined || xEnds.length < 2) continue;
      series.push({
        label: `${m.id} ${which}`,
        points: xEnds.map((x) => ({ x, y: mmToUnit(v, u) })),
        color,
        dash: [6, 4],
      });
    }
  });
  return {
    key: 'shocks',
    title: 'Shock lengths and stroke limits',
    help:
      `${metricHelp(memberEntry('length'))} ` +
      "The dashed lines are each shock's shortest and longest length, in its own colour.",
    sweep: 'heave',
    xTitle: axisTitle('heave', u),
    yTitle: u,
    series,
    bands: [],
    emptyReason:
      shocks.length === 0
        ? 'No shocks in this sketch.'
        : result.heave.length === 0
          ? 'No rows in this sweep.'
          : undefined,
    signed: false,
  };
}

/** Every travel plot of a result, in board order. */
export function buildPlots(
  result: SweepResult | null,
  ctx: SweepContext,
  targets: Targets,
  checks: TargetCheck[],
  u: LengthUnit,
): PlotSpec[] {
  if (!result) return [];
  const out: PlotSpec[] = [];
  for (const item of ctx.hasAxle ? plotsAxleView : plotsIndependentView) {
    if (!isMetricRef(item)) {
      out.push(shockPlot(result, ctx.members, u));
      continue;
    }
    const def = metricEntry(item) as CurveDef;
    // Quantities of a solid axle are not shown at all for a layout without one.
    if (!ctx.hasAxle && def.axle === 'only') continue;
    // A quantity that means nothing for this sketch (anti-squat of a front axle) is left out.
    if (item.sweep === 'heave' && (def as MetricEntry<'heave'>).hidden?.(result.ride)) continue;
    const spec = curvePlot(def, result, targets, checks, u, ctx.axleEnd);
    // A quantity the sweep never gives is left out where it is an extra (given only by some layouts), or where
    // the layout has no axle (anti-squat of a front suspension); for an axle it stays, with the reason, because
    // it should exist.
    if (spec.series.length === 0 && (def.given !== undefined || !ctx.hasAxle)) continue;
    out.push(spec);
  }
  return out;
}

/** A steer quantity against the steer input's position (rack travel), from the steer sweep's rows. */
function steerCurvePlot(
  def: MetricEntry<'steer'>,
  rows: readonly SteerRow[],
  input: SteerInput,
  u: LengthUnit,
): PlotSpec {
  const read = def.read as (r: SteerRow) => number | null | undefined;
  const points = rows.map((r) => {
    const v = read(r);
    return {
      x: toDisplay(steerAt(r, input), input.quantity, u),
      y: v === null || v === undefined || !Number.isFinite(v) ? null : toDisplay(v, def.quantity, u),
    };
  });
  const empty = points.every((p) => p.y === null);
  return {
    key: def.id,
    title: def.label,
    help: metricHelp(def),
    sweep: 'steer',
    xTitle: `${input.label.toLowerCase()} (${quantityUnit(input.quantity, u)})`,
    yTitle: quantityUnit(def.quantity, u),
    series: empty ? [] : [{ label: def.label, points, color: PLOT_COLORS[3] }],
    bands: [],
    emptyReason: empty ? (def.missing ?? 'not defined in this sweep') : undefined,
    signed: def.signed,
  };
}

/**
 * The bump-steer map of one wheel: toe change against heave travel, one curve per steer position (straight
 * ahead first, then out to each lock), in the order the map gives them.
 */
function bumpSteerMapPlot(
  curves: readonly BumpSteerCurve[],
  side: 'left' | 'right',
  input: SteerInput,
  u: LengthUnit,
): PlotSpec {
  const at = (c: BumpSteerCurve) => steerAt(c, input);
  const ordered = [...curves].sort((a, b) => Math.abs(at(a)) - Math.abs(at(b)) || at(a) - at(b));
  const series = ordered.map((c, i) => ({
    label: showSteerPosition(at(c), input, u),
    points: c.points.map((p) => ({ x: mmToUnit(p.travel, u), y: p[side] })),
    color: PLOT_COLORS[i % PLOT_COLORS.length],
  }));
  const worst = metricEntry({ sweep: 'bumpSteer', key: 'worst' });
  return {
    key: `bump-steer-map-${side}`,
    title: `Bump steer to lock, ${side} wheel`,
    help:
      `Toe change of the ${side} wheel over heave travel (positive toe-in), straight ahead and at steer positions ` +
      `out to each lock, one curve each. ${metricHelp(worst)}`,
    sweep: 'heave',
    xTitle: axisTitle('heave', u),
    yTitle: '°',
    series: series.filter((x) => x.points.length > 0),
    bands: [],
    emptyReason: series.some((x) => x.points.length > 0) ? undefined : 'No rows in the bump-steer map.',
    signed: true,
  };
}

/**
 * The map's two plots, made once per map and unit: a drag's previews keep the last map, and the same specs then
 * leave those charts alone (a chart redraws when its spec changes).
 */
const mapPlotCache = new WeakMap<BumpSteerMap, { key: string; plots: PlotSpec[] }>();
function mapPlots(map: BumpSteerMap, input: SteerInput, u: LengthUnit): PlotSpec[] {
  const key = `${input.key}|${u}`;
  const hit = mapPlotCache.get(map);
  if (hit?.key === key) return hit.plots;
  const plots = [bumpSteerMapPlot(map.curves, 'left', input, u), bumpSteerMapPlot(map.curves, 'right', input, u)];
  mapPlotCache.set(map, { key, plots });
  return plots;
}

/**
 * The steer sweep's plots, in the order of the registry's steer view: each quantity against the steer input,
 * then the bump-steer map (each wheel's toe change against travel, one curve per steer position). None when
 * the result has no steer rows; the map's plots are left out while it is not swept (a drag).
 */
export function buildSteerPlots(result: SweepResult | null, u: LengthUnit): PlotSpec[] {
  const steer = result?.steer;
  const input = steerInputOf(steer);
  if (!steer || !input) return [];
  const out: PlotSpec[] = [];
  for (const item of plotsSteerView) {
    if (isMetricRef(item)) {
      const def = metricEntry(item) as MetricEntry<'steer'>;
      if (steer.rows.some((r) => (def.read as (r: SteerRow) => unknown)(r) !== undefined))
        out.push(steerCurvePlot(def, steer.rows, input, u));
    } else if (steer.bumpSteer) {
      out.push(...mapPlots(steer.bumpSteer, input, u));
    }
  }
  return out;
}
