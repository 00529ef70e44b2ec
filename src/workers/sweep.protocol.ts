/**
 * What the board's sweep worker is asked and what it answers. The page validates the sketch
 * (checkSketch, the same zod schema runSweep parses with) and sends the parsed sketch; the
 * worker only sweeps it, so it carries the solver without the validator. The same
 * `computeSweep` runs inside the worker and, where workers are unavailable, on the main
 * thread: either way the result is what runSweep computes for that document.
 */
// Straight from the module, not the kinematics index: the board's eager code imports the index,
// and going through it would pull the solver into the board's own chunk.
import { sweepSketch } from '../../shared/kinematics/sweep';
import type { SweepResult } from '../../shared/kinematics/types';
import type { Sketch } from '../../shared/schema/sketch';

export interface SweepRequest {
  /** increases with every request; an answer is applied only if it is newer than the one shown */
  id: number;
  /** the sketch as checkSketch parsed it (defaults filled in): a plain, structured-cloneable copy */
  sketch: Sketch;
  /** a quick preview while a pivot is dragged: the steer sweep's bump-steer map is left out */
  preview?: boolean;
}

export type SweepAnswer =
  | {
      id: number;
      ok: true;
      result: SweepResult;
      /** ms spent sweeping */
      ms: number;
      /** true when the request was a preview (no bump-steer map) */
      preview?: boolean;
    }
  | { id: number; ok: false; /** one line each, naming the field */ problems: string[]; ms: number };

/** Sweeps a validated sketch; a failure inside the solver becomes a problem line, never a crash. */
export function computeSweep(req: SweepRequest): SweepAnswer {
  const t0 = performance.now();
  try {
    const result = sweepSketch(req.sketch, { bumpSteerMap: !req.preview });
    return { id: req.id, ok: true, result, ms: performance.now() - t0, ...(req.preview ? { preview: true } : {}) };
  } catch (err) {
    const problems = [`The sweep could not run: ${err instanceof Error ? err.message : String(err)}`];
    return { id: req.id, ok: false, problems, ms: performance.now() - t0 };
  }
}
