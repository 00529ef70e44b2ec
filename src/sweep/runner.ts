/**
 * Latest-wins sweep runner. Every edit asks for a sweep; during a drag that is one request
 * per pointer move. Only one request is ever in the worker: a newer request replaces the
 * one waiting (the stale one is dropped, never run), and an answer older than the one
 * already shown is thrown away. Where a Web Worker cannot be made (unit tests, very old
 * browsers, a worker that fails to load) the same computation runs on the main thread,
 * coalesced to one run per macrotask.
 *
 * The document is validated here, on the main thread, where the board has the schema loaded
 * anyway: an invalid sketch is answered at once with its problems and never reaches the
 * solver, and the worker receives the parsed sketch and need not carry the validator.
 */
import { boardOnlyFields } from '../../shared/schema/boardFields';
import { checkSketch } from '../../shared/schema/sketch';
import type { SweepAnswer, SweepRequest } from '../workers/sweep.protocol';

type Compute = (req: SweepRequest) => SweepAnswer;

/**
 * The main-thread path loads the solver only when it is needed: in the browser the worker
 * carries it, so the board's own chunk stays free of it.
 */
async function loadCompute(): Promise<Compute> {
  return (await import('../workers/sweep.protocol')).computeSweep;
}

export type RunnerMode = 'worker' | 'main-thread';

export interface SweepRunner {
  /**
   * Ask for a sweep of this document (validated and copied now; later edits to it do not leak in); a
   * `preview` leaves the steer sweep's bump-steer map out (while a pivot is dragged).
   */
  request(doc: unknown, preview?: boolean): void;
  /** Resolves once nothing is running or waiting (for tests and benchmarks). */
  whenIdle(): Promise<void>;
  readonly mode: RunnerMode;
  /** How many requests were superseded before they ran (a measure of latest-wins at work). */
  readonly dropped: number;
  dispose(): void;
}

export interface RunnerOptions {
  /** false forces the main-thread path */
  useWorker?: boolean;
  /** makes the worker; the default is Vite's module worker for src/workers/sweep.worker.ts */
  createWorker?: () => Worker;
}

function defaultWorker(): Worker {
  return new Worker(new URL('../workers/sweep.worker.ts', import.meta.url), { type: 'module' });
}

/**
 * A plain copy of what the sweep reads: structured clone cannot take Vue's reactive proxies, JSON
 * can and drops nothing a sketch holds. The board-only fields (targets, tracing) are left out: the
 * solver never reads them, so a bad target must not stop the sweep (the board names it, and it
 * blocks saving, where it matters).
 */
function snapshot(doc: unknown): unknown {
  if (doc === undefined) return undefined;
  const copy = JSON.parse(JSON.stringify(doc)) as unknown;
  if (copy && typeof copy === 'object') for (const k of boardOnlyFields) delete (copy as Record<string, unknown>)[k];
  return copy;
}

/** The request for a valid document, or the answer (its problems) for an invalid one. */
function prepare(id: number, doc: unknown, preview: boolean): { request: SweepRequest } | { answer: SweepAnswer } {
  const t0 = performance.now();
  const check = checkSketch(snapshot(doc));
  if (check.ok) return { request: { id, sketch: check.sketch, ...(preview ? { preview } : {}) } };
  return { answer: { id, ok: false, problems: check.problems, ms: performance.now() - t0 } };
}

export function createSweepRunner(onAnswer: (answer: SweepAnswer) => void, options: RunnerOptions = {}): SweepRunner {
  let nextId = 0;
  let lastApplied = 0;
  let inFlight: SweepRequest | null = null;
  let waiting: SweepRequest | null = null;
  let dropped = 0;
  let idleWaiters: Array<() => void> = [];
  let worker: Worker | null = null;
  let mainTimer: ReturnType<typeof setTimeout> | null = null;
  let mainRunning = false;
  let compute: Compute | null = null;
  let disposed = false;

  const wantWorker = options.useWorker ?? typeof Worker !== 'undefined';
  if (wantWorker) {
    try {
      worker = (options.createWorker ?? defaultWorker)();
      worker.onmessage = (e: MessageEvent<SweepAnswer>) => settle(e.data);
      // A worker that cannot load its module reports here; from then on run on the main thread.
      worker.onerror = (e) => {
        e.preventDefault?.();
        fallBackToMainThread();
      };
    } catch {
      worker = null;
    }
  }

  function isIdle() {
    return !inFlight && !waiting && mainTimer === null && !mainRunning;
  }

  function notifyIdle() {
    if (!isIdle()) return;
    const waiters = idleWaiters;
    idleWaiters = [];
    waiters.forEach((w) => w());
  }

  function apply(answer: SweepAnswer) {
    if (disposed || answer.id <= lastApplied) return; // older than what is shown: stale
    lastApplied = answer.id;
    onAnswer(answer);
  }

  function settle(answer: SweepAnswer) {
    apply(answer);
    inFlight = null;
    const next = waiting;
    waiting = null;
    if (next) send(next);
    else notifyIdle();
  }

  function send(req: SweepRequest) {
    if (worker) {
      inFlight = req;
      worker.postMessage(req);
    } else {
      waiting = req;
      scheduleMainThread();
    }
  }

  function scheduleMainThread() {
    if (mainTimer !== null || mainRunning) return;
    mainTimer = setTimeout(() => void runMainThread(), 0);
  }

  async function runMainThread() {
    mainTimer = null;
    mainRunning = true;
    try {
      compute ??= await loadCompute();
      const req = waiting;
      waiting = null;
      if (req) apply(compute(req));
    } finally {
      mainRunning = false;
    }
    // A request that came while the solver loaded or ran goes next (latest wins).
    if (waiting && !disposed) scheduleMainThread();
    else notifyIdle();
  }

  function fallBackToMainThread() {
    worker?.terminate();
    worker = null;
    const redo = waiting ?? inFlight;
    inFlight = null;
    waiting = null;
    if (redo) send(redo);
    else notifyIdle();
  }

  return {
    request(doc: unknown, preview = false) {
      if (disposed) return;
      const prepared = prepare(++nextId, doc, preview);
      if (waiting) dropped++;
      if ('answer' in prepared) {
        // Nothing to sweep: the problems replace whatever was waiting, and an older sweep
        // still running will be thrown away as stale when it answers.
        waiting = null;
        apply(prepared.answer);
        notifyIdle();
      } else if (worker && inFlight)
        waiting = prepared.request; // replaces (drops) any older waiting request
      else send(prepared.request);
    },
    whenIdle() {
      return isIdle() ? Promise.resolve() : new Promise<void>((resolve) => idleWaiters.push(resolve));
    },
    get mode(): RunnerMode {
      return worker ? 'worker' : 'main-thread';
    },
    get dropped() {
      return dropped;
    },
    dispose() {
      disposed = true;
      worker?.terminate();
      worker = null;
      if (mainTimer !== null) clearTimeout(mainTimer);
      mainTimer = null;
      inFlight = null;
      waiting = null;
      notifyIdle();
    },
  };
}
