/**
 * The line-up's key numbers as data: the registry's line-up view (lineupView) read from each
 * variant's sweep, side by side, in the user's unit. A quantity a variant's layout does not give, or
 * that means nothing for it (anti-squat of a front axle), reads "n/a" with the reason; a row no
 * variant has is left out. Pure; the table only lays it out.
 */
import type { SweepResult } from '../../shared/kinematics/types';
import type { Sketch } from '../../shared/schema/sketch';
import type { LengthUnit } from '../../shared/units';
import {
  axleEndOf,
  lineupView,
  metricEntry,
  metricHelp,
  metricShown,
  type MetricEntry,
} from '../../shared/kinematics/metrics/registry';
import { showMetric, type Shown } from '../../shared/display/format';
import { comparedFlags } from '../../shared/display/comparedFlags';
import { checkTargets, readTargets } from '../../shared/display/targets';
import { layoutLabel } from '../../shared/suspensions';

export interface KeyVariant {
  document: Sketch;
  result: SweepResult | null;
  /** why the sketch could not be swept */
  problem: string | null;
}

export type KeyAt = 'ride' | 'bump' | 'droop';

export interface KeyRow {
  /** the quantity's name (the registry's label) */
  label: string;
  /** where along the travel, for a quantity read at ride, full bump and full droop */
  at: KeyAt | null;
  /** what the quantity is and its sign convention (the registry's words) */
  help: string;
  /** per variant, in the line-up's order; `flags` rows give the sentences in `flags` */
  cells: (Shown & { flags?: string[] })[];
}

export const NOT_APPLICABLE = 'n/a';
export const KEY_AT_LABEL: Record<KeyAt, string> = { ride: 'at ride', bump: 'at full bump', droop: 'at full droop' };

const notSwept = (v: KeyVariant): Shown => ({ text: '—', reason: `Not swept: ${v.problem ?? 'no sweep'}` });

function heaveCells(entry: MetricEntry<'heave'>, at: KeyAt, variants: readonly KeyVariant[], u: LengthUnit) {
  return variants.map((v): Shown => {
    const r = v.result;
    if (!r) return notSwept(v);
    if (!entry.layouts.includes(v.document.layout) || !metricShown(entry, r.ride))
      return {
        text: NOT_APPLICABLE,
        reason: `${entry.label} does not apply to this ${layoutLabel(v.document.layout)}.`,
      };
    const row = at === 'ride' ? r.ride : at === 'bump' ? r.heave[r.heave.length - 1] : r.heave[0];
    return showMetric(entry, row ? entry.read(row) : null, u, 'Not defined here');
  });
}

export function keyNumbers(variants: readonly KeyVariant[], u: LengthUnit): KeyRow[] {
  // A sign that reads differently at the two ends is told for the line-up's end; for a mixed line-up, not at all.
  const ends = new Set(variants.map((v) => axleEndOf(v.document.vehicle)));
  const helpOf = (entry: MetricEntry) =>
    ends.size === 1 ? metricHelp(entry, [...ends][0]) : metricHelp({ ...entry, axleSense: undefined });
  const rows: KeyRow[] = [];
  for (const item of lineupView) {
    if (item === '*flags') {
      rows.push({
        label: 'Flags',
        at: null,
        help: "The flags each variant's board raises: lock-up, bind, shock stroke, joint angles, link loads, targets missed.",
        cells: variants.map((v) => {
          if (!v.result) return notSwept(v);
          const checks = checkTargets(v.result, readTargets(v.document));
          const titles = comparedFlags(v.result, v.document.members, checks, u).map((f) => f.title);
          // One line per kind of flag, with how many times it is raised ("4 × Joint angle too small").
          const flags = [...new Set(titles)].map((t) => {
            const n = titles.filter((x) => x === t).length;
            return n > 1 ? `${n} × ${t}` : t;
          });
          return { text: titles.length ? String(titles.length) : 'none', flags };
        }),
      });
      continue;
    }
    const entry = metricEntry(item.metric);
    const help = helpOf(entry);
    if (item.at === 'whole') {
      const limits = entry as MetricEntry<'limits'>;
      const cells = variants.map((v) => (v.result ? showMetric(limits, limits.read(v.result.limits), u) : notSwept(v)));
      rows.push({ label: entry.label, at: null, help, cells });
      continue;
    }
    const heave = entry as MetricEntry<'heave'>;
    const ats: KeyAt[] = heave.signed ? ['bump', 'droop'] : ['ride', 'bump', 'droop'];
    const group = ats.map((at) => ({ label: entry.label, at, help, cells: heaveCells(heave, at, variants, u) }));
    // A quantity no variant has is no row at all.
    if (group[0].cells.some((c) => c.text !== NOT_APPLICABLE)) rows.push(...group);
  }
  return rows;
}
