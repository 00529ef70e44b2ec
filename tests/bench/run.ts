/**
 * `npm run bench`: median time of a full sweep of each starter (61 heave rows −150..+150 mm
 * by 5 and 17 roll rows ±8° by 1) and of a 21 × 21 heave × roll envelope. Targets: a full
 * sweep ≤ 1 ms median (the board re-sweeps on every pointer move), the envelope ≤ 40 ms.
 * A benchmark, not a test: it prints figures and never fails on time.
 *
 * Then the steer sweep of the double-wishbone starter: 25 rack rows (±60 mm by 5) beside 25 heave rows
 * (±60 mm by 5), each marched and read on one solver from the solved ride row, and the starter's full sweep
 * with and without its steer block (the difference is the steer sweep with its bump-steer map). The two
 * sweeps are timed in turn in one loop (heave, steer, heave, steer…), so that other work on the machine
 * falls on both alike, and their ratio is printed with the Newton iterations each took and the load average.
 * `npm run bench -- --steer` prints that comparison alone.
 */
import os from 'node:os';
import { runSweep, starters, sweepEnvelope, sweepSketch } from '../../shared/kinematics';
import { parseSketch } from '../../shared/schema/sketch';
import { driveBuild } from '../../shared/kinematics/drive';
import { marchPlan } from '../../shared/kinematics/grid';
import { march, solveStart, type MarchContext } from '../../shared/kinematics/march';
import { linkageModelBuild } from '../../shared/kinematics/model';
import { heaveRowBuild, rowPlanBuild } from '../../shared/kinematics/rows';
import { PoseSolver } from '../../shared/kinematics/solve';
import { steerInputSweep, steeringOf } from '../../shared/kinematics/steer/sweep';

const FULL = { droop: -150, bump: 150, step: 5, roll: 8, rollStep: 1 };
const GRID = { droop: -150, bump: 150, step: 15, roll: 8, rollStep: 0.8 };

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** Runs `f` for warm-up, then `n` timed runs; returns the median and the 90th percentile in ms. */
function time(f: () => unknown, n: number, warm = Math.max(20, n >> 2)): { median: number; p90: number } {
  for (let i = 0; i < warm; i++) f();
  const t: number[] = [];
  for (let i = 0; i < n; i++) {
    const t0 = performance.now();
    f();
    t.push(performance.now() - t0);
  }
  t.sort((a, b) => a - b);
  return { median: median(t), p90: t[Math.floor(t.length * 0.9)] };
}

/**
 * Times `a` and `b` in turn, `n` runs each after a warm-up: the median and 95th percentile of each (wall ms),
 * and each one's mean CPU time (ms of this process's user + system time per run), which a busy machine
 * does not inflate by the time the process waits for a core.
 */
function timePair(
  a: () => unknown,
  b: () => unknown,
  n: number,
): Record<'a' | 'b', { median: number; p95: number; cpu: number }> {
  for (let i = 0; i < Math.max(20, n >> 2); i++) {
    a();
    b();
  }
  const ta: number[] = [];
  const tb: number[] = [];
  let ca = 0;
  let cb = 0;
  const cpu = () => {
    const u = process.cpuUsage();
    return (u.user + u.system) / 1000;
  };
  for (let i = 0; i < n; i++) {
    let c0 = cpu();
    let t0 = performance.now();
    a();
    ta.push(performance.now() - t0);
    ca += cpu() - c0;
    c0 = cpu();
    t0 = performance.now();
    b();
    tb.push(performance.now() - t0);
    cb += cpu() - c0;
  }
  const figures = (t: number[], c: number) => {
    t.sort((x, y) => x - y);
    return { median: median(t), p95: t[Math.floor(t.length * 0.95)], cpu: c / n };
  };
  return { a: figures(ta, ca), b: figures(tb, cb) };
}

const loadAverage = () =>
  os
    .loadavg()
    .map((v) => v.toFixed(2))
    .join(' / ');

function startersTable(): void {
  const rows: string[][] = [];
  for (const spec of Object.values(starters)) {
    const doc = { ...spec!.build(), sweep: FULL };
    const sketch = parseSketch(doc);
    const check = runSweep(doc);
    const full = time(() => runSweep(doc), 400);
    const solveOnly = time(() => sweepSketch(sketch), 400);
    const grid = time(() => sweepEnvelope(sketch, GRID), 40, 5);
    const cells = sweepEnvelope(sketch, GRID).flat();
    rows.push([
      spec!.layout,
      `${check.heave.length}+${check.roll.length}`,
      full.median.toFixed(3),
      full.p90.toFixed(3),
      solveOnly.median.toFixed(3),
      `${cells.filter((c) => c.pose).length}/${cells.length}`,
      grid.median.toFixed(2),
      grid.p90.toFixed(2),
    ]);
  }

  const head = [
    'starter',
    'rows',
    'full sweep median ms',
    'p90 ms',
    'without validation ms',
    'grid cells',
    '21×21 grid median ms',
    'p90 ms',
  ];
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (cells: string[]) => `| ${cells.map((c, i) => c.padEnd(widths[i])).join(' | ')} |`;
  console.log(`Node ${process.version}, ${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}`);
  console.log(line(head));
  console.log(`|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
  for (const r of rows) console.log(line(r));
  console.log('targets: full sweep ≤ 1 ms median, grid ≤ 40 ms median');
}

/** 25 steer rows against 25 heave rows of the double-wishbone starter, on one solver from the solved ride row. */
function steerTable(): void {
  const doc = starters['double-wishbone']!.build();
  const sketch = parseSketch(doc);
  const model = linkageModelBuild(sketch);
  const drive = driveBuild(model);
  const solver = new PoseSolver(model, drive);
  const ctx: MarchContext = { model, drive, solver, redundancy: 0 };
  const ride = solveStart(ctx, 'travel')!;
  const { rank } = solver.rankAnalysis();
  ctx.redundancy = Math.max(0, solver.m - rank);
  solver.regularize = rank < solver.n;
  const rowPlan = rowPlanBuild(model);
  const heavePlan = marchPlan(-60, 60, 5);
  const heave = () => {
    const up = march(ctx, ride, 'travel', heavePlan.up).rows;
    const down = march(ctx, ride, 'travel', heavePlan.down).rows;
    return [...down.reverse(), ride, ...up].map((r) => heaveRowBuild(rowPlan, r));
  };
  const linkage = steeringOf(model);
  if (typeof linkage === 'string') throw new Error(linkage);
  const steer = () => steerInputSweep(ctx, linkage, ride.state, 60, 5).rows;
  // Newton iterations of one run of each (the solver's count, summed over the rows' solves).
  let iterations = 0;
  const solve = solver.solve.bind(solver);
  solver.solve = (state, chordStepMm) => {
    const outcome = solve(state, chordStepMm);
    iterations += outcome.iterations;
    return outcome;
  };
  const counted = (f: () => unknown[]) => {
    iterations = 0;
    const rows = f().length;
    return { rows, iterations };
  };
  const heaveCount = counted(heave);
  const steerCount = counted(steer);
  solver.solve = solve;
  const loadBefore = loadAverage();
  const { a: h, b: st } = timePair(heave, steer, 1000);
  const loadAfter = loadAverage();
  const { steer: _, ...plainSweep } = sketch.sweep;
  const plainDoc = { ...doc, sweep: plainSweep };
  const full = time(() => runSweep(doc), 200);
  const plain = time(() => runSweep(plainDoc), 200);
  console.log(`Node ${process.version}, ${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}`);
  console.log(`load average ${loadBefore} before, ${loadAfter} after the paired runs (1 / 5 / 15 min)`);
  console.log('double-wishbone starter, 1000 runs of each in turn, ms (median / p95 wall; mean CPU):');
  const it = (c: { rows: number; iterations: number }) => `${c.rows} rows, ${c.iterations} Newton iterations`;
  const fig = (f: { median: number; p95: number; cpu: number }) =>
    `${f.median.toFixed(3)} / ${f.p95.toFixed(3)}; CPU ${f.cpu.toFixed(3)}`;
  console.log(`  heave sweep, ${it(heaveCount)}:  ${fig(h)}`);
  console.log(`  steer sweep, ${it(steerCount)}:  ${fig(st)}`);
  const ratio = (k: 'median' | 'p95' | 'cpu') => `${(st[k] / h[k]).toFixed(2)}×`;
  console.log(
    `  steer / heave: ${ratio('median')} at the median, ${ratio('p95')} at the p95, ${ratio('cpu')} in CPU time`,
  );
  console.log(
    `  full sweep with sweep.steer (steer rows + bump-steer map): ${full.median.toFixed(3)} / ${full.p90.toFixed(3)}`,
  );
  console.log(`  full sweep without sweep.steer: ${plain.median.toFixed(3)} / ${plain.p90.toFixed(3)}`);
  console.log('target: the steer sweep costs no more than the heave sweep of the same row count');
}

if (!process.argv.includes('--steer')) startersTable();
steerTable();
