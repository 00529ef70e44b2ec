/**
 * The one entry the command line, the API and the board call: validate, then sweep.
 */
import { SketchValidationError } from '../schema/errors';
import { formatIssue, parseSketch, sweepSettingsSchema } from '../schema/sketch';
import { sweepSketch } from './sweep';
import type { SweepOptions, SweepResult } from './types';

/**
 * Validates `doc` (a parsed JSON value) as a sketch file and sweeps it.
 * Throws SketchValidationError listing every problem for bad input (including bad
 * `options.sweep` overrides); otherwise deterministic, and every number in the result is
 * finite (mm, deg, %, N/mm as documented in types.ts).
 */
export function runSweep(doc: unknown, options: SweepOptions = {}): SweepResult {
  const sketch = parseSketch(doc);
  if (options.sweep) {
    const merged = sweepSettingsSchema.safeParse({ ...sketch.sweep, ...options.sweep });
    if (!merged.success) {
      throw new SketchValidationError(
        merged.error.issues.map((i) => `options.${formatIssue({ ...i, path: ['sweep', ...i.path] })}`),
      );
    }
    return sweepSketch({ ...sketch, sweep: merged.data }, { heaveOnly: options.heaveOnly });
  }
  return sweepSketch(sketch, { heaveOnly: options.heaveOnly });
}
