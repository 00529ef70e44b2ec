/**
 * The sweep range of a sketch as the sliders and plots use it: the file's `sweep` block
 * with the format's defaults filled in (docs/sketch-format.md; shared/schema/sketch.ts).
 */
import { sweepSettingsSchema } from '../../shared/schema/sketch';
import type { Deg, Mm } from '../../shared/units';

export interface SweepRange {
  droop: Mm;
  bump: Mm;
  step: Mm;
  roll: Deg;
  rollStep: Deg;
}

const DEFAULTS: SweepRange = sweepSettingsSchema.parse(undefined);

/** The sketch's sweep range; a malformed or missing block gives the defaults, so the sliders always work. */
export function sweepRange(doc: unknown): SweepRange {
  const raw = (doc as { sweep?: unknown } | null | undefined)?.sweep;
  const res = sweepSettingsSchema.safeParse(raw ?? {});
  const s = res.success ? res.data : DEFAULTS;
  return { droop: s.droop, bump: s.bump, step: s.step, roll: s.roll, rollStep: s.rollStep };
}
