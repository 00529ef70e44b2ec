/**
 * The metric registry against real sweeps of every starter: each entry reads the field its key
 * names, each layout's rows carry the layout's metrics, the views and the CSV columns name each
 * quantity once, and the target-capable entries are the schema's target metrics.
 */
import { describe, expect, it } from 'vitest';
import { heaveRowsCsv, runSweep, starters } from '../../../shared/kinematics';
import type { SweepResult } from '../../../shared/kinematics';
import {
  csvView,
  lineupView,
  isMetricRef,
  plotsSteerView,
  readoutSteerView,
  linkLoadEntry,
  memberEntries,
  metricEntries,
  metricEntry,
  plotsAxleView,
  plotsIndependentView,
  readoutHeaveView,
  readoutRollView,
  registryTargetKeys,
  sheetView,
  targetEntries,
  targetsView,
  windUpEntries,
  type AnyEntry,
  type MetricRef,
} from '../../../shared/kinematics/metrics/registry';
import { targetMetrics, targetsSchema } from '../../../shared/schema/boardFields';
import { layouts, type Layout } from '../../../shared/schema/sketchVocabulary';
import { quantityToUnit, quantityUnitOf, unitToQuantity } from '../../../shared/units';

const swept: Array<{ layout: Layout; result: SweepResult }> = (Object.keys(starters) as Layout[]).map((layout) => ({
  layout,
  result: runSweep(starters[layout]!.build()),
}));

/** The rows an entry reads: its sweep's rows, the whole sweep's limits, or the steer sweep's rows or map. */
function rowsOf(e: AnyEntry, result: SweepResult): unknown[] {
  switch (e.sweep) {
    case 'heave':
      return result.heave;
    case 'roll':
      return result.roll;
    case 'limits':
      return [result.limits];
    case 'steer':
      return result.steer?.rows ?? [];
    case 'bumpSteer':
      return result.steer?.bumpSteer ? [result.steer.bumpSteer] : [];
  }
}

const readOf = (e: AnyEntry) => e.read as (row: unknown) => number | null | undefined;
const givenOf = (e: AnyEntry) => e.given as ((row: unknown) => boolean) | undefined;

/** The value at a dotted path of a row, walked here independently of the registry's reader. */
function atPath(row: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((v, k) => (v === null || v === undefined ? v : (v as never)[k]), row);
}

const isFiniteNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

describe('the metric registry', () => {
  it('has a starter for every layout of the schema, so each check below covers every layout', () => {
    expect(swept.map((s) => s.layout).sort()).toEqual([...layouts].sort());
  });

  it('reads on every row of every starter exactly the field its key names (a number, null or absent, never NaN)', () => {
    for (const { layout, result } of swept) {
      for (const e of metricEntries) {
        for (const row of rowsOf(e, result)) {
          const v = readOf(e)(row);
          const field = atPath(row, e.key);
          // An absent point (e.g. no instant centre) reads as null; otherwise the reader gives the field itself.
          if (field === undefined && v === null) continue;
          expect(v, `${layout} ${e.sweep}.${e.key}`).toBe(field);
          if (v !== null && v !== undefined) expect(Number.isFinite(v), `${layout} ${e.sweep}.${e.key}`).toBe(true);
        }
      }
    }
  });

  it("gives each layout's rows the layout's metrics as finite numbers, and no number to a layout it does not list", () => {
    for (const { layout, result } of swept) {
      for (const e of metricEntries) {
        const rows = rowsOf(e, result);
        const finite = rows.some((r) => isFiniteNumber(readOf(e)(r)));
        const where = `${layout} ${e.sweep}.${e.key}`;
        if (!e.layouts.includes(layout)) {
          expect(finite, `${where} gives a number to a layout it does not list`).toBe(false);
          continue;
        }
        // A metric tied to a part some sketches of the layout lack (a drive unit's half-shafts) says so by `given`.
        const given = givenOf(e);
        if (given && !given(rows[0])) continue;
        expect(finite, `${where} gives no number`).toBe(true);
      }
    }
  });

  it('judges `given` the same on every row of a sweep, so the CSV and the readout can judge it on one row', () => {
    for (const { result } of swept) {
      for (const e of metricEntries) {
        const given = givenOf(e);
        if (!given) continue;
        const rows = rowsOf(e, result);
        expect(new Set(rows.map(given)).size, `${e.sweep}.${e.key}`).toBeLessThanOrEqual(1);
      }
    }
  });

  it('names each quantity once per sweep: keys, board ids and labels are unique within a sweep', () => {
    for (const sweep of ['heave', 'roll', 'limits', 'steer', 'bumpSteer'] as const) {
      const of = metricEntries.filter((e) => e.sweep === sweep);
      for (const field of ['key', 'id', 'label'] as const) {
        const names = of.map((e) => e[field]);
        expect(new Set(names).size, `${sweep} ${field}`).toBe(names.length);
      }
    }
  });

  it('lists only the schema’s layouts and sign conventions in words', () => {
    for (const e of metricEntries) {
      for (const l of e.layouts) expect(layouts).toContain(l);
      expect(e.sign.trim().length, `${e.sweep}.${e.key}`).toBeGreaterThan(5);
      expect(e.label.trim()).toBe(e.label);
    }
  });

  it('has exactly the schema’s target metrics as target-capable entries, in the targets table in schema order', () => {
    expect([...registryTargetKeys].sort()).toEqual([...targetMetrics].sort());
    expect(targetsView.map((r) => r.key)).toEqual([...targetMetrics]);
    for (const m of targetMetrics) {
      const e = targetEntries[m];
      expect(e.key).toBe(m);
      expect(e.target).toBe(true);
      expect(metricEntry(targetsView.find((r) => r.key === m)!)).toBe(e);
      expect(e.bandEnds.length).toBeGreaterThan(0);
    }
    // The zod schema built from the list accepts a band on each and refuses a band upside down.
    for (const m of targetMetrics) {
      expect(targetsSchema.safeParse({ [m]: { min: 1, max: 2 } }).success).toBe(true);
      expect(targetsSchema.safeParse({ [m]: { min: 2, max: 1 } }).success).toBe(false);
    }
  });

  it('views name only registry entries, each at most once', () => {
    const views: Array<[string, Array<MetricRef | string>]> = [
      ['readout heave', readoutHeaveView],
      ['readout roll', readoutRollView],
      ['plots axle', plotsAxleView],
      ['plots independent', plotsIndependentView],
      ['csv', csvView],
      ['targets', targetsView],
      ['readout steer', readoutSteerView],
      ['plots steer', plotsSteerView],
      ['sheet', sheetView.flatMap((i) => ('metric' in i ? [i.metric] : i.metrics))],
      ['line-up', lineupView.map((i) => (typeof i === 'string' ? i : i.metric))],
    ];
    for (const [name, view] of views) {
      const refs = view.filter(isMetricRef);
      for (const r of refs) expect(() => metricEntry(r), `${name}: ${r.sweep}.${r.key}`).not.toThrow();
      const ids = refs.map((r) => `${r.sweep}.${r.key}`);
      expect(new Set(ids).size, name).toBe(ids.length);
    }
    expect(() => metricEntry({ sweep: 'heave', key: 'noSuchMetric' })).toThrow(/noSuchMetric/);
  });

  it('exports every heave entry with a CSV column in the CSV view, and no column twice', () => {
    const inView = new Set(csvView.filter(isMetricRef).map((r) => r.key));
    const withColumn = metricEntries.filter((e) => e.csv !== undefined);
    for (const e of withColumn) {
      expect(e.sweep).toBe('heave');
      expect(inView.has(e.key), e.key).toBe(true);
    }
    const columns = withColumn.map((e) => e.csv);
    expect(new Set(columns).size).toBe(columns.length);
    for (const { layout, result } of swept) {
      const header = heaveRowsCsv(result).split('\r\n')[0].split(',');
      expect(new Set(header).size, layout).toBe(header.length);
    }
  });

  it('writes in each CSV cell the value the registry reads from that row (RFC 4180 text, parsed back here)', () => {
    for (const { layout, result } of swept) {
      const lines = heaveRowsCsv(result).split('\r\n').filter(Boolean);
      const header = lines[0].split(',');
      for (const e of metricEntries.filter((m) => m.csv !== undefined)) {
        const col = header.indexOf(e.csv!);
        const given = givenOf(e);
        if (given && !given(result.ride)) {
          expect(col, `${layout} ${e.csv} has a column though the sweep does not give it`).toBe(-1);
          continue;
        }
        // A quantity that means nothing for the sketch (a front axle's anti-squat) is hidden: no column either.
        const hidden = e.hidden as ((row: unknown) => boolean) | undefined;
        if (hidden?.(result.ride)) {
          expect(col, `${layout} ${e.csv} has a column though it is hidden`).toBe(-1);
          continue;
        }
        expect(col, `${layout} ${e.csv}`).toBeGreaterThanOrEqual(0);
        result.heave.forEach((row, i) => {
          const cell = lines[i + 1].split(',')[col];
          const v = readOf(e)(row);
          expect(cell === '' ? null : Number(cell), `${layout} ${e.csv} row ${i}`).toBe(isFiniteNumber(v) ? v : null);
        });
      }
    }
  });

  it("writes each member's readings and each link's load in the CSV under the registry's columns", () => {
    let loads = 0;
    for (const { layout, result } of swept) {
      const lines = heaveRowsCsv(result).split('\r\n').filter(Boolean);
      const header = lines[0].split(',');
      for (const [id, ride] of Object.entries(result.ride.members)) {
        for (const e of memberEntries) {
          const col = header.indexOf(e.csv(id));
          if (e.given && !e.given(ride)) {
            expect(col, `${layout} ${e.csv(id)}`).toBe(-1);
            continue;
          }
          expect(col, `${layout} ${e.csv(id)}`).toBeGreaterThanOrEqual(0);
          result.heave.forEach((row, i) => {
            // The reader gives the reading's own field (MemberReading in types.ts), checked by name here.
            expect(e.read(row.members[id])).toBe(row.members[id][e.key]);
            expect(Number(lines[i + 1].split(',')[col])).toBe(row.members[id][e.key]);
          });
        }
      }
      for (const id of Object.keys(result.ride.linkLoads ?? {})) {
        loads++;
        const col = header.indexOf(linkLoadEntry.csv(id));
        expect(col, `${layout} ${id}`).toBeGreaterThanOrEqual(0);
        result.heave.forEach((row, i) => {
          const cell = lines[i + 1].split(',')[col];
          expect(cell === '' ? undefined : Number(cell)).toBe(row.linkLoads?.[id]);
        });
      }
    }
    // At least one starter is a solid axle on links, so the loads above were checked at all.
    expect(loads).toBeGreaterThan(0);
  });

  it("reads the leaf-spring starter's wind-up as finite numbers, labels unique", () => {
    const leaf = swept.find((s) => s.layout === 'leaf-spring')!.result;
    expect(leaf.windUp).toBeDefined();
    for (const e of windUpEntries) {
      expect(e.read(leaf.windUp!)).toBe(leaf.windUp![e.key]);
      expect(Number.isFinite(e.read(leaf.windUp!)), e.key).toBe(true);
    }
    expect(new Set(windUpEntries.map((e) => e.label)).size).toBe(windUpEntries.length);
    expect(new Set(memberEntries.map((e) => e.label)).size).toBe(memberEntries.length);
  });

  it('converts each quantity kind for display: lengths by the international inch (1959: 25.4 mm), forces by the pound-force', () => {
    expect(quantityToUnit(254, 'length', 'in')).toBeCloseTo(10, 12);
    expect(unitToQuantity(10, 'length', 'in')).toBeCloseTo(254, 12);
    expect(quantityToUnit(254, 'length', 'mm')).toBe(254);
    // Angles, percentages and ratios are the same numbers in both unit systems.
    for (const q of ['angle', 'percent', 'ratio'] as const) {
      expect(quantityToUnit(12.5, q, 'in')).toBe(12.5);
      expect(unitToQuantity(12.5, q, 'in')).toBe(12.5);
    }
    // With mm chosen every kind shows in the file's unit, untouched.
    for (const q of ['rate', 'force', 'torque', 'angularRate'] as const) {
      expect(quantityToUnit(12.5, q, 'mm')).toBe(12.5);
      expect(unitToQuantity(12.5, q, 'mm')).toBe(12.5);
    }
    // 1 lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N (NIST SP 811, appendix B); 1 ft = 0.3048 m.
    expect(quantityToUnit(4.4482216152605, 'force', 'in')).toBeCloseTo(1, 12);
    expect(quantityToUnit(4.4482216152605 / 25.4, 'rate', 'in')).toBeCloseTo(1, 12);
    expect(quantityToUnit(4.4482216152605 * 0.3048, 'torque', 'in')).toBeCloseTo(1, 12);
    expect(quantityUnitOf('length', 'in')).toBe('in');
    expect(quantityUnitOf('angle', 'mm')).toBe('°');
    expect(quantityUnitOf('percent', 'mm')).toBe('%');
    expect(quantityUnitOf('rate', 'mm')).toBe('N/mm');
    expect(quantityUnitOf('rate', 'in')).toBe('lbf/in');
    expect(quantityUnitOf('force', 'in')).toBe('lbf');
    expect(quantityUnitOf('torque', 'in')).toBe('lbf·ft');
    expect(quantityUnitOf('angularRate', 'mm')).toBe('N·m/°');
    expect(quantityUnitOf('angularRate', 'in')).toBe('lbf·ft/°');
  });
});
