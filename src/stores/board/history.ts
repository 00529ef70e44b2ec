/**
 * Undo history as inverse changes between two plain documents.
 *
 * Documents are treated as immutable: an edit builds a new document that shares every
 * untouched object with the old one, so `diffDocs` walks only the parts that differ
 * (reference equality short-cuts the rest). A change replaces the value at one path;
 * where an object's key list or an array's length differ, the whole object or array is
 * replaced, so undoing restores the exact earlier document, key order included.
 */

export type Path = readonly (string | number)[];

/** One replaced value: what was at `path` before the edit and what is there after it. */
export interface Change {
  path: Path;
  before: unknown;
  after: unknown;
}

/** One undo step: the changes of one user action, with a label for the menu ("Move LL.fl"). */
export interface HistoryEntry {
  label: string;
  changes: Change[];
  /** Consecutive entries with the same key (e.g. arrow-key nudges of one selection) merge. */
  coalesce?: string;
  /** ms since epoch of the last merge, to merge only edits that follow each other closely. */
  at: number;
}

function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function sameKeys(a: Record<string, unknown>, b: Record<string, unknown>): boolean {
  const ka = Object.keys(a);
  const kb = Object.keys(b);
  return ka.length === kb.length && ka.every((k, i) => k === kb[i]);
}

/** Deep equality of plain JSON-like data (objects, arrays, primitives). */
export function deepEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((v, i) => deepEqual(v, b[i]));
  if (isPlainObject(a) && isPlainObject(b)) return sameKeys(a, b) && Object.keys(a).every((k) => deepEqual(a[k], b[k]));
  return Number.isNaN(a) && Number.isNaN(b);
}

/** The changes that turn `before` into `after` (empty when they are equal). */
export function diffDocs(before: unknown, after: unknown, path: Path = []): Change[] {
  if (before === after) return [];
  if (Array.isArray(before) && Array.isArray(after) && before.length === after.length) {
    return before.flatMap((v, i) => diffDocs(v, after[i], [...path, i]));
  }
  if (isPlainObject(before) && isPlainObject(after) && sameKeys(before, after)) {
    return Object.keys(before).flatMap((k) => diffDocs(before[k], after[k], [...path, k]));
  }
  if (deepEqual(before, after)) return [];
  return [{ path, before, after }];
}

/** `doc` with the value at `path` replaced, copying only the objects along the path. */
function setAt(doc: unknown, path: Path, value: unknown): unknown {
  if (path.length === 0) return value;
  const [head, ...rest] = path;
  if (Array.isArray(doc) && typeof head === 'number') {
    const copy = doc.slice();
    copy[head] = setAt(doc[head], rest, value);
    return copy;
  }
  if (isPlainObject(doc) && typeof head === 'string') {
    return { ...doc, [head]: setAt(doc[head], rest, value) };
  }
  throw new Error(`History path ${path.join('.')} does not fit the document`);
}

/** Applies the changes' `after` (redo) or `before` (undo) values to `doc`; `doc` itself is not touched. */
export function applyChanges<T>(doc: T, changes: readonly Change[], side: 'before' | 'after'): T {
  let out: unknown = doc;
  for (const c of changes) out = setAt(out, c.path, c[side]);
  return out as T;
}

/** Bounded undo and redo stacks. */
export class History {
  private undoStack: HistoryEntry[] = [];
  private redoStack: HistoryEntry[] = [];

  constructor(readonly limit = 500) {}

  get canUndo(): boolean {
    return this.undoStack.length > 0;
  }

  get canRedo(): boolean {
    return this.redoStack.length > 0;
  }

  get undoLabel(): string | null {
    return this.undoStack.at(-1)?.label ?? null;
  }

  get redoLabel(): string | null {
    return this.redoStack.at(-1)?.label ?? null;
  }

  get size(): number {
    return this.undoStack.length;
  }

  /**
   * Records the step from `before` to `after`. Returns false when nothing changed.
   * With a `coalesce` key equal to the top entry's and within `windowMs`, the step joins it.
   */
  record(
    label: string,
    before: unknown,
    after: unknown,
    opts: { coalesce?: string; windowMs?: number; now?: number } = {},
  ): boolean {
    const now = opts.now ?? Date.now();
    const top = this.undoStack.at(-1);
    if (opts.coalesce && top?.coalesce === opts.coalesce && now - top.at <= (opts.windowMs ?? 1000)) {
      // The earliest document of the run against the latest one.
      const start = applyChanges(before, top.changes, 'before');
      top.changes = diffDocs(start, after);
      top.at = now;
      if (top.changes.length === 0) this.undoStack.pop();
      this.redoStack = [];
      return true;
    }
    const changes = diffDocs(before, after);
    if (changes.length === 0) return false;
    this.undoStack.push({ label, changes, coalesce: opts.coalesce, at: now });
    if (this.undoStack.length > this.limit) this.undoStack.shift();
    this.redoStack = [];
    return true;
  }

  /** The document one step back, or null when there is nothing to undo. */
  undo<T>(doc: T): T | null {
    const entry = this.undoStack.pop();
    if (!entry) return null;
    this.redoStack.push(entry);
    return applyChanges(doc, entry.changes, 'before');
  }

  /** The document one step forward again, or null when there is nothing to redo. */
  redo<T>(doc: T): T | null {
    const entry = this.redoStack.pop();
    if (!entry) return null;
    this.undoStack.push(entry);
    return applyChanges(doc, entry.changes, 'after');
  }

  clear(): void {
    this.undoStack = [];
    this.redoStack = [];
  }
}
