/**
 * The page's main thread during a stretch of work, from a Chromium trace (CDP Tracing with the
 * DevTools timeline categories): how long it was busy in all (its top-level tasks), and where that
 * time went by event name (self time: Layout, UpdateLayoutTree, Paint, FunctionCall...), so a figure
 * per pointer move can be split into script, style, layout and paint.
 */
import type { CDPSession } from '@playwright/test';

/** One trace event as Chromium reports it (times in µs). */
interface TraceEvent {
  name: string;
  ph: string;
  pid: number;
  tid: number;
  ts: number;
  dur?: number;
  /** the thread's CPU time inside the event (µs), where Chromium records it */
  tdur?: number;
  args?: { name?: string; data?: { type?: string } };
}

export interface MainThreadSummary {
  /** ms from the first to the last event on the main thread */
  spanMs: number;
  /** ms the main thread spent in top-level tasks (wall time: includes time the thread waited for a core) */
  busyMs: number;
  /** ms of CPU time the main thread used in them (less disturbed by other work on the machine) */
  cpuMs: number;
  /** when the page dispatched each pointermove event, ms on the trace's clock */
  moveTimes: number[];
  /** requestAnimationFrame callbacks the page ran (FireAnimationFrame events) */
  animationFrames: number;
  /** self time by event name, ms (wall, and CPU where recorded), largest CPU time first */
  selfByName: Array<{ name: string; ms: number; cpuMs: number }>;
  /** the main thread's top-level tasks: start and wall and CPU duration, ms, in time order */
  tasks: Array<{ ts: number; ms: number; cpuMs: number }>;
}

const CATEGORIES = ['devtools.timeline', 'disabled-by-default-devtools.timeline', 'v8.execute', 'toplevel'];
/** The names Chromium gives a main-thread top-level task, by version. */
const TOP_LEVEL = new Set(['RunTask', 'ThreadControllerImpl::RunTask']);

/** Starts a trace on the page's session; `stop` ends it and summarises the renderer's main thread. */
export async function startMainThreadTrace(cdp: CDPSession): Promise<{ stop(): Promise<MainThreadSummary> }> {
  const events: TraceEvent[] = [];
  cdp.on('Tracing.dataCollected', (e) => {
    for (const ev of e.value) events.push(ev as unknown as TraceEvent);
  });
  await cdp.send('Tracing.start', {
    transferMode: 'ReportEvents',
    traceConfig: { includedCategories: CATEGORIES, excludedCategories: ['*'] },
  });
  return {
    async stop() {
      const done = new Promise<void>((resolve) => cdp.once('Tracing.tracingComplete', () => resolve()));
      await cdp.send('Tracing.end');
      await done;
      return summarise(events);
    },
  };
}

/** The renderer main thread that did the most work (the board's; other renderers idle). */
function mainThreadOf(events: TraceEvent[]): { pid: number; tid: number } | null {
  const mains = events.filter((e) => e.ph === 'M' && e.name === 'thread_name' && e.args?.name === 'CrRendererMain');
  let best: { pid: number; tid: number } | null = null;
  let bestMs = -1;
  for (const m of mains) {
    const ms = events
      .filter((e) => e.pid === m.pid && e.tid === m.tid && e.ph === 'X' && TOP_LEVEL.has(e.name))
      .reduce((s, e) => s + (e.dur ?? 0), 0);
    if (ms > bestMs) [best, bestMs] = [{ pid: m.pid, tid: m.tid }, ms];
  }
  return best;
}

export function summarise(all: TraceEvent[]): MainThreadSummary {
  const main = mainThreadOf(all);
  const events = all
    .filter((e) => main && e.pid === main.pid && e.tid === main.tid && e.ph === 'X' && e.dur !== undefined)
    .sort((a, b) => a.ts - b.ts || (b.dur ?? 0) - (a.dur ?? 0));
  // Self time: each complete event's duration less that of the events nested directly inside it.
  const self = new Map<string, { ms: number; cpuMs: number }>();
  const add = (name: string, us: number, cpuUs: number) => {
    const t = self.get(name) ?? { ms: 0, cpuMs: 0 };
    self.set(name, { ms: t.ms + us / 1000, cpuMs: t.cpuMs + cpuUs / 1000 });
  };
  const stack: Array<{ name: string; end: number }> = [];
  for (const e of events) {
    const end = e.ts + (e.dur ?? 0);
    while (stack.length && stack[stack.length - 1].end <= e.ts) stack.pop();
    const parent = stack[stack.length - 1];
    if (parent) add(parent.name, -Math.min(e.dur ?? 0, parent.end - e.ts), -(e.tdur ?? 0));
    add(e.name, e.dur ?? 0, e.tdur ?? 0);
    stack.push({ name: e.name, end });
  }
  // Top-level tasks not nested in another (Chromium nests one task name inside the other in some versions).
  const tasks: Array<{ ts: number; ms: number; cpuMs: number }> = [];
  let taskEnd = -Infinity;
  for (const e of events) {
    if (!TOP_LEVEL.has(e.name) || e.ts < taskEnd) continue;
    tasks.push({ ts: e.ts / 1000, ms: (e.dur ?? 0) / 1000, cpuMs: (e.tdur ?? 0) / 1000 });
    taskEnd = e.ts + (e.dur ?? 0);
  }
  const first = events[0]?.ts ?? 0;
  const last = events.reduce((m, e) => Math.max(m, e.ts + (e.dur ?? 0)), first);
  return {
    spanMs: (last - first) / 1000,
    busyMs: tasks.reduce((s, t) => s + t.ms, 0),
    cpuMs: tasks.reduce((s, t) => s + t.cpuMs, 0),
    moveTimes: events
      .filter((e) => e.name === 'EventDispatch' && e.args?.data?.type === 'pointermove')
      .map((e) => e.ts / 1000),
    animationFrames: events.filter((e) => e.name === 'FireAnimationFrame').length,
    selfByName: [...self]
      .map(([name, t]) => ({ name, ...t }))
      .filter((t) => t.ms > 0)
      .sort((a, b) => b.cpuMs - a.cpuMs || b.ms - a.ms),
    tasks,
  };
}

/** The main thread's busy time from each pointer move to the next (ms; wall and CPU), in time order. */
export function busyPerMove(s: MainThreadSummary): Array<{ ms: number; cpuMs: number }> {
  const out: Array<{ ms: number; cpuMs: number }> = [];
  for (let i = 0; i + 1 < s.moveTimes.length; i++) {
    const [from, to] = [s.moveTimes[i], s.moveTimes[i + 1]];
    // A task that holds the move itself starts just before it: tasks are assigned by where they end.
    const within = s.tasks.filter((t) => t.ts + t.ms > from && t.ts + t.ms <= to);
    out.push({ ms: within.reduce((sum, t) => sum + t.ms, 0), cpuMs: within.reduce((sum, t) => sum + t.cpuMs, 0) });
  }
  return out;
}
