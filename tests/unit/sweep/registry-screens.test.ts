/**
 * The readout and the travel plots as the metric registry drives them, on every starter: each
 * metric line and plot carries its entry's label and the number the entry reads from the row,
 * in the user's unit (1 in = 25.4 mm exactly, international inch, 1959), in the view's order.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import type { HeaveRow, RollRow, SweepResult } from '../../../shared/kinematics';
import {
  isMetricRef,
  metricEntry,
  plotsAxleView,
  plotsIndependentView,
  readoutHeaveView,
  readoutRollView,
  targetEntries,
  type MetricEntry,
  type MetricRef,
} from '../../../shared/kinematics/metrics/registry';
import { targetMetrics, type Targets } from '../../../shared/schema/boardFields';
import type { Layout } from '../../../shared/schema/sketchVocabulary';
import type { LengthUnit } from '../../../shared/units';
import { readoutLines, type ReadoutLine, type SweepContext } from '../../../src/sweep/readout';
import { buildPlots } from '../../../src/sweep/plots';
import { checkTargets } from '../../../shared/display/targets';

const INCH_MM = 25.4;

type RowEntry = MetricEntry<'heave'> | MetricEntry<'roll'>;

const cases = (Object.keys(starters) as Layout[]).map((layout) => {
  const sketch = starters[layout]!.build();
  const result: SweepResult = runSweep(sketch);
  const ctx: SweepContext = { members: sketch.members, hasAxle: sketch.points.some((p) => p.body === 'axle') };
  return { layout, result, ctx };
});

/** The number a readout text shows ("+1.2 mm", "−0.35°", "63.4 %"), parsed back here. */
function shownNumber(text: string): number {
  return Number.parseFloat(text.replace('\u2212', '-'));
}

/** Digits the readout writes for an entry: lengths 1 (mm) or 2 (in), angles the entry's (2 by default), % 1. */
function digitsOf(e: RowEntry, u: LengthUnit): number {
  if (e.quantity === 'length') return u === 'in' ? 2 : 1;
  if (e.quantity === 'angle') return e.digits ?? 2;
  return 1;
}

function expectLineShows(line: ReadoutLine, e: RowEntry, row: HeaveRow | RollRow, u: LengthUnit, where: string) {
  expect(line.label, where).toBe(e.shortLabel ?? e.label);
  const v = (e.read as (r: HeaveRow | RollRow) => number | null | undefined)(row);
  if (v === null || v === undefined) {
    expect(line.text, where).toBe('—');
    expect(line.reason, where).toBeTruthy();
    return;
  }
  const shown = e.quantity === 'length' && u === 'in' ? v / INCH_MM : v;
  const d = digitsOf(e, u);
  expect(Math.abs(shownNumber(line.text) - shown), `${where}: ${line.text} for ${v}`).toBeLessThanOrEqual(
    0.5 * 10 ** -d + 1e-9,
  );
  if (e.signed && shownNumber(line.text) > 0) expect(line.text.startsWith('+'), where).toBe(true);
}

/** Positions of `keys` in `order`, which must rise when the keys follow that order. */
function followsOrder(keys: string[], order: string[]): boolean {
  const at = keys.map((k) => order.indexOf(k));
  return at.every((i, n) => i >= 0 && (n === 0 || i > at[n - 1]));
}

describe('the readout, driven by the metric registry', () => {
  for (const { layout, result, ctx } of cases) {
    it(`labels and values every metric line from its entry, in the view's order (${layout})`, () => {
      for (const u of ['mm', 'in'] as const) {
        for (const [sweep, view, rows] of [
          ['heave', readoutHeaveView, [result.heave[0], result.ride, result.heave[result.heave.length - 1]]],
          ['roll', readoutRollView, [result.roll[0], result.roll[result.roll.length - 1]]],
        ] as const) {
          const refs = view.filter(isMetricRef) as MetricRef[];
          const byId = new Map(refs.map((r) => [metricEntry(r).id, metricEntry(r) as RowEntry]));
          for (const row of rows) {
            const lines = readoutLines(
              sweep === 'heave' ? { sweep, row: row as HeaveRow } : { sweep, row: row as RollRow },
              ctx,
              u,
              { windUp: result.windUp, loads: result.loads },
            );
            const metricLines = lines.filter((l) => byId.has(l.key));
            expect(metricLines.length, `${layout} ${sweep}`).toBeGreaterThan(2);
            for (const line of metricLines) expectLineShows(line, byId.get(line.key)!, row, u, `${layout} ${line.key}`);
            const keys = metricLines.map((l) => l.key);
            expect(followsOrder(keys, [...byId.keys()]), `${layout} ${sweep}: ${keys.join(' ')}`).toBe(true);
            // A metric the view lists and the row gives a number for is never left out on a layout that lists it.
            for (const e of byId.values()) {
              const v = (e.read as (r: unknown) => unknown)(row);
              if (e.axle === 'only' && !ctx.hasAxle) expect(keys).not.toContain(e.id);
              else if (typeof v === 'number' && e.layouts.includes(layout)) expect(keys, `${layout}`).toContain(e.id);
            }
          }
        }
      }
    });
  }
});

describe('the travel plots, driven by the metric registry', () => {
  for (const { layout, result, ctx } of cases) {
    it(`titles, units and points of every curve come from its entry, in the view's order (${layout})`, () => {
      // A band on every target metric: the middle of its values, so each plotted one is shaded.
      const targets: Targets = {};
      for (const m of targetMetrics) targets[m] = { min: -1, max: 2 };
      const checks = checkTargets(result, targets);
      const view = ctx.hasAxle ? plotsAxleView : plotsIndependentView;
      const order = view.map((i) => (isMetricRef(i) ? metricEntry(i).id : 'shocks'));
      for (const u of ['mm', 'in'] as const) {
        const plots = buildPlots(result, ctx, targets, checks, u);
        expect(
          followsOrder(
            plots.map((p) => p.key),
            order,
          ),
          layout,
        ).toBe(true);
        for (const ref of view.filter(isMetricRef)) {
          const e = metricEntry(ref) as RowEntry;
          const plot = plots.find((p) => p.key === e.id && p.sweep === e.sweep);
          const rows = (e.sweep === 'heave' ? result.heave : result.roll) as Array<HeaveRow & RollRow>;
          const read = e.read as (r: HeaveRow & RollRow) => number | null | undefined;
          const anyNumber = rows.some((r) => typeof read(r) === 'number' && Number.isFinite(read(r)));
          if (!plot) {
            expect(anyNumber && e.axle !== 'only', `${layout} ${e.id} left out though it has numbers`).toBe(false);
            continue;
          }
          expect(plot.title).toBe(e.label);
          const scale = e.quantity === 'length' && u === 'in' ? 1 / INCH_MM : 1;
          expect(plot.yTitle).toBe(e.quantity === 'length' ? u : e.quantity === 'angle' ? '°' : '%');
          if (plot.series.length) {
            plot.series[0].points.forEach((p, i) => {
              const v = read(rows[i]);
              if (typeof v === 'number') expect(p.y!).toBeCloseTo(v * scale, 12);
              else expect(p.y).toBeNull();
            });
          }
          if (e.target === true) {
            expect(plot.bands, `${layout} ${e.id}`).toHaveLength(1);
            const q = targetEntries[e.key].quantity;
            expect(plot.bands[0].yMin).toBeCloseTo(q === 'length' ? -1 * scale : -1, 12);
            expect(plot.bands[0].yMax).toBeCloseTo(q === 'length' ? 2 * scale : 2, 12);
          } else expect(plot.bands).toEqual([]);
        }
      }
    });
  }
});
