/**
 * runSweep for the screens that show a saved sketch's sweep once (the line-up, the build sheet page
 * and its PDF): the result, or why the sketch cannot be swept in one line. The board sweeps through
 * its worker instead (src/stores/sweep.ts).
 */
import type { SweepResult } from '../kinematics/types';
import { runSweep } from '../kinematics/run';
import { isSketchValidationError } from '../schema/errors';

export function sweepOnce(doc: unknown): { result: SweepResult; problem: null } | { result: null; problem: string } {
  try {
    return { result: runSweep(doc), problem: null };
  } catch (err) {
    const why = isSketchValidationError(err) ? err.problems[0] : err instanceof Error ? err.message : String(err);
    return { result: null, problem: `The sketch cannot be swept: ${why}` };
  }
}
