/**
 * `npm run bench`: median time of a full sweep of each starter (61 heave rows −150..+150 mm
 * by 5 and 17 roll rows ±8° by 1) and of a 21 × 21 heave × roll envelope. Targets: a full
 * sweep ≤ 1 ms median (the board re-sweeps on every pointer move), the envelope ≤ 40 ms.
 * A benchmark, not a test: it prints figures and never fails on time.
 *
 * Then the steer sweep of the double-wishbone starter: 25 rack rows (±60 mm by 5) beside 25 heave rows
 * (±60 mm by 5), each with its own set-up, its first row solved and the march both ways read on one solver from
 * the solved ride row (steerTable says what each includes), and the starter's full sweep with and without its
 * steer block (the difference is the steer sweep with its bump-steer map). The sweeps are timed in turn in one
 * loop (heave, heave as first timed, steer, heave…), so that other work on the machine falls on all alike, and
 * their ratios are printed with the Newton iterations and factorisations each took and the load average.
 * `npm run bench -- --steer` prints that comparison alone.
 */
import os from 'node:os';
import { runSweep, starters, sweepEnvelope, sweepSketch } from '../../shared/kinematics';
import { parseSketch } from '../../shared/schema/sketch';
import { driveBuild } from '../../shared/kinematics/drive';
import { marchPlan } from '../../shared/kinematics/grid';
import { march, solveStart, type MarchContext, type SolvedRow } from '../../shared/kinematics/march';
import { linkageModelBuild } from '../../shared/kinematics/model';
import { heaveRowBuild, rowPlanBuild, type RowPlan } from '../../shared/kinematics/rows';
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

interface PairFigures {
  median: number;
  p95: number;
  cpu: number;
}

/**
 * Times the functions in turn (one run of each, round after round), `n` runs each after a warm-up: the median and
 * 95th percentile of each (wall ms), and each one's mean CPU time (ms of this process's user + system time per
 * run), which a busy machine does not inflate by the time the process waits for a core.
 */
function timeInTurn(fs: (() => unknown)[], n: number): PairFigures[] {
  for (let i = 0; i < Math.max(20, n >> 2); i++) for (const f of fs) f();
  const wall = fs.map(() => [] as number[]);
  const cpuTotal = fs.map(() => 0);
  const cpu = () => {
    const u = process.cpuUsage();
    return (u.user + u.system) / 1000;
  };
  for (let i = 0; i < n; i++) {
    fs.forEach((f, k) => {
      const c0 = cpu();
      const t0 = performance.now();
      f();
      wall[k].push(performance.now() - t0);
      cpuTotal[k] += cpu() - c0;
    });
  }
  return wall.map((t, k) => {
    t.sort((x, y) => x - y);
    return { median: median(t), p95: t[Math.floor(t.length * 0.95)], cpu: cpuTotal[k] / n };
  });
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

/**
 * 25 steer rows against 25 heave rows of the double-wishbone starter, on one solver from the solved ride row. Each
 * sweep as sweepSketch runs it after the rank analysis at ride: its own set-up (heave: its row plan; steer: its
 * input's context and row plan), its first row solved with its rate (heave: the ride row; steer: the centre row),
 * the march both ways and the rows read (steer: and the lock events). The heave sweep is also timed as this
 * benchmark first timed it, with the ride row and the row plan given (24 rows solved, not 25).
 */
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
  const givenPlan = rowPlanBuild(model);
  const heavePlan = marchPlan(-60, 60, 5);
  const heaveFrom = (start: SolvedRow, rowPlan: RowPlan) => {
    const up = march(ctx, start, 'travel', heavePlan.up).rows;
    const down = march(ctx, start, 'travel', heavePlan.down).rows;
    return [...down.reverse(), start, ...up].map((r) => heaveRowBuild(rowPlan, r));
  };
  const heave = () => heaveFrom(solveStart(ctx, 'travel')!, rowPlanBuild(model));
  const heaveGiven = () => heaveFrom(ride, givenPlan);
  const linkage = steeringOf(model);
  if (typeof linkage === 'string') throw new Error(linkage);
  const steer = () => steerInputSweep(ctx, linkage, ride.state, 60, 5).rows;
  // Newton iterations and QR factorisations of one run of each (the solver's counts, over the rows' solves).
  let iterations = 0;
  let solves = 0;
  const solve = solver.solve.bind(solver);
  solver.solve = (...args) => {
    const outcome = solve(...args);
    iterations += outcome.iterations;
    solves++;
    return outcome;
  };
  const counted = (f: () => unknown[]) => {
    iterations = 0;
    solves = 0;
    const factorisations = solver.factorisations;
    const rows = f().length;
    return { rows, solves, iterations, factorisations: solver.factorisations - factorisations };
  };
  const counts = [counted(heave), counted(heaveGiven), counted(steer)];
  solver.solve = solve;
  const loadBefore = loadAverage();
  const [h, hg, st] = timeInTurn([heave, heaveGiven, steer], 1000);
  const loadAfter = loadAverage();
  const { steer: _, ...plainSweep } = sketch.sweep;
  const plainDoc = { ...doc, sweep: plainSweep };
  const full = time(() => runSweep(doc), 200);
  const plain = time(() => runSweep(plainDoc), 200);
  console.log(`Node ${process.version}, ${os.cpus().length} × ${os.cpus()[0]?.model ?? 'cpu'}`);
  console.log(`load average ${loadBefore} before, ${loadAfter} after the runs in turn (1 / 5 / 15 min)`);
  console.log('double-wishbone starter, 1000 runs of each in turn, ms (median / p95 wall; mean CPU):');
  const it = (c: (typeof counts)[number]) =>
    `${c.rows} rows (${c.solves} solved), ${c.iterations} Newton iterations (${(c.iterations / c.solves).toFixed(2)} ` +
    `a solve), ${c.factorisations} factorisations`;
  const fig = (f: PairFigures) => `${f.median.toFixed(3)} / ${f.p95.toFixed(3)}; CPU ${f.cpu.toFixed(3)}`;
  console.log(`  heave sweep, ${it(counts[0])}:  ${fig(h)}`);
  console.log(`  heave sweep with the ride row and row plan given, ${it(counts[1])}:  ${fig(hg)}`);
  console.log(`  steer sweep, ${it(counts[2])}:  ${fig(st)}`);
  const ratio = (base: PairFigures, k: keyof PairFigures) => `${(st[k] / base[k]).toFixed(2)}×`;
  for (const [base, name] of [
    [h, 'heave'],
    [hg, 'heave with the ride row given'],
  ] as const)
    console.log(
      `  steer / ${name}: ${ratio(base, 'median')} at the median, ${ratio(base, 'p95')} at the p95, ` +
        `${ratio(base, 'cpu')} in CPU time`,
    );
  console.log(
    `  full sweep with sweep.steer (steer rows + bump-steer map): ${full.median.toFixed(3)} / ${full.p90.toFixed(3)}`,
  );
  console.log(`  full sweep without sweep.steer: ${plain.median.toFixed(3)} / ${plain.p90.toFixed(3)}`);
  console.log('target: the steer sweep costs no more than the heave sweep of the same row count');
}

if (!process.argv.includes('--steer')) startersTable();
steerTable();
