/**
 * The files a designer hands on, made from a stored sketch: the sweep's heave rows and the hardpoint
 * table, both CSV with their units in the header. A sketch that cannot be swept is answered 422 with
 * the reason, never 500.
 */
import { runSweep, sweepCsv } from '../../shared/kinematics';
import { hardpointsCsv } from '../../shared/hardpoints/table';
import { boardOnlyFields } from '../../shared/schema/boardFields';
import { isSketchValidationError } from '../../shared/schema/errors';
import { pointSchema } from '../../shared/schema/sketch';
import { z } from 'zod';
import type { LengthUnit } from '../../shared/units';
import { unprocessable } from '../middleware/http-error';
import type { StoredDocument } from './sketches';
import { downloadBaseName } from '../../shared/downloadName';

export interface CsvFile {
  fileName: string;
  text: string;
}

/**
 * What the sweep reads, as the board sweeps it: without the board-only fields (targets, tracing), which
 * the solver never reads, so that one of them cannot stop the sweep.
 */
function sweepInput(document: unknown): unknown {
  if (!document || typeof document !== 'object') return document;
  const copy = { ...(document as Record<string, unknown>) };
  for (const k of boardOnlyFields) delete copy[k];
  return copy;
}

/** The heave rows of the sketch's sweep, `travel` first, in `units`. */
export function sweepCsvFile(stored: StoredDocument, units: LengthUnit): CsvFile {
  let text: string;
  try {
    text = sweepCsv(runSweep(sweepInput(stored.document), { heaveOnly: true }), units);
  } catch (err) {
    const problems = isSketchValidationError(err)
      ? err.problems
      : [`the sweep could not run: ${err instanceof Error ? err.message : String(err)}`];
    throw unprocessable(`this sketch cannot be swept: ${problems[0]}`, problems);
  }
  return { fileName: `${downloadBaseName(stored.name)}-sweep.csv`, text };
}

/**
 * The sketch's pivots as a hardpoint table in `units`. Only the pivots are read, so a sketch that cannot be
 * swept (a member naming a pivot that is gone) still gives its table.
 */
export function hardpointsCsvFile(stored: StoredDocument, units: LengthUnit): CsvFile {
  const points = z.array(pointSchema).safeParse((stored.document as { points?: unknown } | null)?.points);
  if (!points.success) throw unprocessable("this sketch's pivots cannot be read");
  return {
    fileName: `${downloadBaseName(stored.name)}-hardpoints.csv`,
    text: hardpointsCsv({ points: points.data }, units),
  };
}
