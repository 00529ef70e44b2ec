/**
 * The one error that bad sketch input raises. Each problem is one line that names
 * the path and the problem, e.g. "points[3].x: expected a number" or
 * "members[2].a: no point 'UL.x'". The server answers 400 with `problems`, the CLI
 * prints them one a line, the board shows them beside the import.
 */
export class SketchValidationError extends Error {
  readonly problems: string[];

  constructor(problems: string[]) {
    const list = problems.length > 0 ? problems : ['(document): not a valid sketch'];
    super(`Invalid sketch: ${list[0]}${list.length > 1 ? ` (and ${list.length - 1} more)` : ''}`);
    this.name = 'SketchValidationError';
    this.problems = list;
  }
}

/** True for a SketchValidationError, also across bundles where `instanceof` may fail. */
export function isSketchValidationError(e: unknown): e is SketchValidationError {
  return (
    e instanceof SketchValidationError ||
    (typeof e === 'object' &&
      e !== null &&
      (e as { name?: unknown }).name === 'SketchValidationError' &&
      Array.isArray((e as { problems?: unknown }).problems))
  );
}

/**
 * The one way a validation path is printed, for every problem the server, the command line and the board show:
 * "points[3].x" from ['points', 3, 'x'] (list positions in brackets, field names after dots). An empty path is
 * the whole value checked, named by `root`: "(document)" for a sketch file, "(body)" for a request body.
 */
export function formatPath(path: readonly PropertyKey[], root = '(document)'): string {
  let out = '';
  for (const seg of path) {
    if (typeof seg === 'number') out += `[${seg}]`;
    else out += out === '' ? String(seg) : `.${String(seg)}`;
  }
  return out === '' ? root : out;
}
