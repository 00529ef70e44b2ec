/**
 * What the board's sweep worker is asked and what it answers. The same `computeSweep`
 * runs inside the worker and, where workers are unavailable, on the main thread, so both
 * paths give the very result runSweep computes.
 */
// Straight from the modules, not the kinematics index: the board's eager code imports the index,
// and going through it would pull the solver into the board's own chunk.
import { runSweep } from '../../shared/kinematics/run';
import { isSketchValidationError } from '../../shared/schema/errors';
import type { SweepResult } from '../../shared/kinematics';

export interface SweepRequest {
  /** increases with every request; an answer is applied only if it is newer than the one shown */
  id: number;
  /** a plain (structured-cloneable) copy of the sketch document */
  doc: unknown;
}

export type SweepAnswer =
  | { id: number; ok: true; result: SweepResult; /** ms spent in runSweep */ ms: number }
  | { id: number; ok: false; /** one line each, naming the field */ problems: string[]; ms: number };

/** Runs the sweep and turns every failure into problems: bad input never becomes a crash. */
export function computeSweep(req: SweepRequest): SweepAnswer {
  const t0 = performance.now();
  try {
    const result = runSweep(req.doc);
    return { id: req.id, ok: true, result, ms: performance.now() - t0 };
  } catch (err) {
    const problems = isSketchValidationError(err)
      ? err.problems
      : [`The sweep could not run: ${err instanceof Error ? err.message : String(err)}`];
    return { id: req.id, ok: false, problems, ms: performance.now() - t0 };
  }
}
