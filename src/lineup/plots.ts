/**
 * The line-up's travel plots as data: each plot of the board (buildPlots) with one curve per
 * variant, in the variant's colour. Only the computed curves are overlaid (a shock's stroke
 * limits belong to its own sketch, so the shock plot is left out); a plot no variant defines is
 * dropped. Pure, like useSweepPlots.
 */
import type { SweepResult } from '../../shared/kinematics/types';
import type { Sketch } from '../../shared/schema/sketch';
import type { LengthUnit } from '../../shared/units';
import { axleEndOf } from '../../shared/kinematics/metrics/registry';
import { buildPlots, PLOT_COLORS, type PlotSpec } from '../sweep/plots';

/** One colour per variant, from our plot palette (blue, orange, green, violet). */
export const VARIANT_COLORS = PLOT_COLORS.slice(0, 4);

export interface PlottedVariant {
  name: string;
  document: Sketch;
  result: SweepResult | null;
  /** left out of the plots by the user's toggle; the others keep their colours */
  hidden?: boolean;
}

export function lineupPlots(variants: readonly PlottedVariant[], u: LengthUnit): PlotSpec[] {
  const perVariant = variants.map((v) =>
    v.result && !v.hidden
      ? buildPlots(
          v.result,
          {
            members: v.document.members,
            hasAxle: v.document.points.some((p) => p.body === 'axle'),
            axleEnd: axleEndOf(v.document.vehicle),
          },
          {},
          [],
          u,
        )
      : [],
  );
  const keys: string[] = [];
  for (const plots of perVariant)
    for (const p of plots) if (p.key !== 'shocks' && !keys.includes(p.key)) keys.push(p.key);

  const out: PlotSpec[] = [];
  for (const key of keys) {
    const first = perVariant.flat().find((p) => p.key === key && p.series.length > 0);
    if (!first) continue;
    const series = perVariant.flatMap((plots, i) => {
      const spec = plots.find((p) => p.key === key);
      const curves = spec?.series.filter((s) => !s.dash) ?? [];
      return curves.map((s) => ({
        ...s,
        color: VARIANT_COLORS[i % VARIANT_COLORS.length],
        label: curves.length > 1 ? `${variants[i].name}: ${s.label}` : variants[i].name,
      }));
    });
    out.push({ ...first, series, bands: [], emptyReason: undefined });
  }
  return out;
}
