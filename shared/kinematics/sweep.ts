/**
 * The sweep of a validated sketch: heave from ride height out to droop and to bump, roll
 * out to ±roll at ride height, each marching from the last solved row, then the metrics,
 * the flags and the limits reached.
 */
import type { Sketch } from '../schema/sketch';
import { cleanZero } from './clean';
import { driveBuild } from './drive';
import { marchPlan } from './grid';
import { march, rowRateFor, solveStart, type MarchContext, type SolvedRow } from './march';
import { linkageModelBuild, type LinkageModel } from './model';
import { POSE_COORD_NAMES, POSE_SIZE } from './pose';
import { pointVelocity, BodyRotations } from './residuals';
import { heaveRowBuild, rollRowBuild, rowPlanBuild } from './rows';
import { PoseSolver } from './solve';
import { sweepEvents } from './events';
import { linkLoads, linkLoadsApply } from './loads';
import { windUpReading } from './windUp';
import { rollSteerInTravel } from './rollSteerInTravel';
import { steerSweep } from './steer/sweep';
import type { HeaveRow, RollRow, SweepEvent, SweepResult } from './types';

/** A null-space motion that moves no point of its body faster than this (mm per unit) is idle (a shackle spinning on its own axis). */
export const IDLE_MOTION_TOLERANCE = 1e-9;

const COORD_WORDS: Record<(typeof POSE_COORD_NAMES)[number], string> = {
  x: 'fore-aft (x)',
  y: 'sideways (y)',
  z: 'vertically (z)',
  roll: 'in roll',
  pitch: 'in pitch',
  yaw: 'in yaw (steer)',
};

function unlocatedWarnings(model: LinkageModel, nullSpace: Float64Array[]): string[] {
  const out: string[] = [];
  const rot = new BodyRotations(model.bodies.length);
  rot.update(new Float64Array(model.stateSize));
  const v = new Float64Array(3),
    tmp = new Float64Array(3);
  for (const dir of nullSpace) {
    let moving = false;
    for (const p of model.points.values()) {
      pointVelocity(p, dir, rot, v, 0, tmp);
      if (Math.hypot(v[0], v[1], v[2]) > IDLE_MOTION_TOLERANCE) moving = true;
    }
    if (!moving) continue;
    let best = 0;
    for (let i = 0; i < dir.length; i++) {
      const scale = i % POSE_SIZE >= 3 ? 1000 : 1;
      if (Math.abs(dir[i]) * scale > Math.abs(dir[best]) * (best % POSE_SIZE >= 3 ? 1000 : 1)) best = i;
    }
    const body = model.bodies[Math.floor(best / POSE_SIZE)];
    const coord = POSE_COORD_NAMES[best % POSE_SIZE];
    out.push(
      `Nothing locates the ${body.id} ${COORD_WORDS[coord]}: add or move a member; the sweep holds it where it is at ride.`,
    );
  }
  return [...new Set(out)];
}

function lockUpEvent(kind: 'heave' | 'roll', at: number, reached: number): SweepEvent {
  const unit = kind === 'heave' ? 'mm' : '°';
  const show = (v: number) => `${v > 0 ? '+' : ''}${Number(v.toFixed(3))} ${unit}`;
  return {
    kind: 'lock-up',
    sweep: kind,
    at,
    message:
      kind === 'heave'
        ? `Lock-up: the linkage cannot reach ${show(at)} of travel; the heave sweep stops at ${show(reached)}.`
        : `Lock-up: the linkage cannot reach ${show(at)} of roll; the roll sweep stops at ${show(reached)}.`,
  };
}

export interface SweepSketchOptions {
  heaveOnly?: boolean;
  /**
   * false leaves the steer sweep's bump-steer map out (`steer.bumpSteer: null`): the board's preview while a
   * pivot is dragged, where the map would take most of the sweep's time; it is swept when the drag ends
   */
  bumpSteerMap?: boolean;
}

/** Sweeps a validated sketch (settings from `sketch.sweep`). Never throws for a valid sketch. */
export function sweepSketch(sketch: Sketch, options: SweepSketchOptions = {}): SweepResult {
  const model = linkageModelBuild(sketch);
  const drive = driveBuild(model);
  const solver = new PoseSolver(model, drive);
  const ctx: MarchContext = { model, drive, solver, redundancy: 0 };
  const plan = rowPlanBuild(model);
  const warnings: string[] = [];
  const events: SweepEvent[] = [];

  // Ride height satisfies every constraint by definition (lengths are measured there).
  let ride: SolvedRow = solveStart(ctx, 'travel') ?? {
    travel: 0,
    roll: 0,
    state: new Float64Array(model.stateSize),
    rate: new Float64Array(model.stateSize),
    bind: 0,
  };
  const { rank, nullSpace } = solver.rankAnalysis();
  ctx.redundancy = Math.max(0, solver.m - rank);
  // Every free coordinate located: plain QR of J needs no Tikhonov rows.
  solver.regularize = rank < solver.n;
  // The ride row's sensitivity again without the Tikhonov rows it was first found with: they
  // bias the direction the soft rows settle (a leaf spring's pitch) by far more than round-off.
  if (!solver.regularize) ride = rowRateFor(ctx, ride, 'travel');
  warnings.push(...unlocatedWarnings(model, nullSpace));

  const sw = sketch.sweep;
  const heavePlan = marchPlan(sw.droop, sw.bump, sw.step);
  const up = march(ctx, ride, 'travel', heavePlan.up);
  const down = march(ctx, ride, 'travel', heavePlan.down);
  const heaveSolved = [...down.rows.slice().reverse(), ride, ...up.rows];
  const heave: HeaveRow[] = heaveSolved.map((r) => heaveRowBuild(plan, r));
  const rideRow = heave[down.rows.length];
  const loads = linkLoadsApply(model) ? linkLoads(model, drive, heaveSolved, down.rows.length) : null;
  if (loads) {
    loads.rows.forEach((r, i) => {
      if (r) heave[i].linkLoads = r;
    });
    events.push(...loads.events);
  }
  const windUp = windUpReading(model, drive, ride.state, undefined, solver.regularize);
  if (up.lockedAt !== null) events.push(lockUpEvent('heave', up.lockedAt, up.rows.at(-1)?.travel ?? 0));
  if (down.lockedAt !== null) events.push(lockUpEvent('heave', down.lockedAt, down.rows.at(-1)?.travel ?? 0));
  events.push(...sweepEvents(sketch, 'heave', heave));
  for (const layout of plan.layouts) if (layout.notes) warnings.push(...layout.notes(heave));

  let roll: RollRow[] = [];
  let rollMin = 0;
  let rollMax = 0;
  if (!options.heaveOnly) {
    if (model.axle) {
      const steer = rollSteerInTravel(ctx, heaveSolved, model.axle.slot);
      steer.forEach((v, i) => (heave[i].rollSteerInTravel = v === null ? null : cleanZero(v)));
    }
    const rollStart = rowRateFor(ctx, ride, 'roll');
    const rollPlan = marchPlan(-sw.roll, sw.roll, sw.rollStep);
    const left = march(ctx, rollStart, 'roll', rollPlan.up);
    const right = march(ctx, rollStart, 'roll', rollPlan.down);
    const rollSolved = [...right.rows.slice().reverse(), rollStart, ...left.rows];
    roll = rollSolved.map((r) => rollRowBuild(plan, r));
    rollMin = rollSolved[0].roll;
    rollMax = rollSolved[rollSolved.length - 1].roll;
    if (left.lockedAt !== null) events.push(lockUpEvent('roll', left.lockedAt, rollMax));
    if (right.lockedAt !== null) events.push(lockUpEvent('roll', right.lockedAt, rollMin));
    events.push(...sweepEvents(sketch, 'roll', roll));
  }

  // Last, on the same solver: the steer sweep moves the rack's frame points and puts them back.
  const steer =
    sw.steer && !options.heaveOnly ? steerSweep(sketch, ctx, ride.state, options.bumpSteerMap !== false) : undefined;
  if (steer?.problem) warnings.push(steer.problem);

  return {
    heave,
    roll,
    limits: {
      droop: heave[0].travel,
      bump: heave[heave.length - 1].travel,
      articulation: Math.min(-rollMin, rollMax),
      rollMin,
      rollMax,
      events,
    },
    warnings,
    ride: rideRow,
    ...(windUp ? { windUp } : {}),
    ...(loads ? { loads: loads.summary } : {}),
    ...(steer ? { steer } : {}),
  };
}
