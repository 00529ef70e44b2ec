/**
 * runSweep for the pages that show a saved sketch's sweep once (the line-up, the build sheet):
 * the result, or why the sketch cannot be swept in one line. The board sweeps through its
 * worker instead (stores/sweep.ts).
 */
import type { SweepResult } from '../../shared/kinematics/types';
import { runSweep } from '../../shared/kinematics/run';
import { isSketchValidationError } from '../../shared/schema/errors';
import { errorMessage } from '../api/http';

export function sweepOnce(doc: unknown): { result: SweepResult; problem: null } | { result: null; problem: string } {
  try {
    return { result: runSweep(doc), problem: null };
  } catch (err) {
    return {
      result: null,
      problem: `The sketch cannot be swept: ${isSketchValidationError(err) ? err.problems[0] : errorMessage(err)}`,
    };
  }
}
