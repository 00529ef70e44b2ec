/**
 * The heave × roll envelope: the pose and bind at every combination of travel and roll
 * (e.g. 21 × 21), for an articulation map. Each travel is reached by the heave march from
 * ride height; from there the roll march goes out both ways, each step from the last.
 */
import type { Sketch } from '../schema/sketch';
import { driveBuild } from './drive';
import { marchPlan } from './grid';
import { march, rowRateFor, solveStart, type MarchContext, type SolvedRow } from './march';
import { linkageModelBuild } from './model';
import { poseFromState } from './pose';
import { PoseSolver } from './solve';
import type { Pose } from './types';

export interface EnvelopeCell {
  /** mm */
  travel: number;
  /** deg */
  roll: number;
  /** pose of the axle (or the left wheel's body); null where the linkage locked before this cell */
  pose: Pose | null;
  /** mm; null where locked */
  bind: number | null;
}

export interface EnvelopeSettings {
  /** mm, ≤ 0 */ droop: number;
  /** mm, ≥ 0 */ bump: number;
  /** mm */ step: number;
  /** deg, ≥ 0 */ roll: number;
  /** deg */ rollStep: number;
}

/** Cells ordered by travel (droop → bump), then roll (−roll → +roll). */
export function sweepEnvelope(sketch: Sketch, s: EnvelopeSettings): EnvelopeCell[][] {
  const model = linkageModelBuild(sketch);
  const drive = driveBuild(model);
  const solver = new PoseSolver(model, drive);
  const ctx: MarchContext = { model, drive, solver, redundancy: 0 };
  const slot = model.axle ? model.axle.slot : model.wheelLeft.slot;
  const ride = solveStart(ctx, 'travel');
  const hp = marchPlan(s.droop, s.bump, s.step);
  const rp = marchPlan(-s.roll, s.roll, s.rollStep);
  const travels = [...hp.down.slice().reverse(), 0, ...hp.up];
  const rolls = [...rp.down.slice().reverse(), 0, ...rp.up];
  const empty = (travel: number): EnvelopeCell[] => rolls.map((roll) => ({ travel, roll, pose: null, bind: null }));
  if (!ride) return travels.map(empty);
  const { rank } = solver.rankAnalysis();
  ctx.redundancy = Math.max(0, solver.m - rank);
  // Every free coordinate located: plain QR of J needs no Tikhonov rows.
  solver.regularize = rank < solver.n;

  const heaveRows = new Map<number, SolvedRow>([[0, ride]]);
  for (const side of [hp.up, hp.down])
    for (const r of march(ctx, ride, 'travel', side).rows) heaveRows.set(r.travel, r);

  return travels.map((travel) => {
    const start = heaveRows.get(travel);
    if (!start) return empty(travel);
    const centre = rowRateFor(ctx, start, 'roll');
    const cells = new Map<number, SolvedRow>([[0, centre]]);
    for (const side of [rp.up, rp.down]) for (const r of march(ctx, centre, 'roll', side).rows) cells.set(r.roll, r);
    return rolls.map((roll) => {
      const c = cells.get(roll);
      return c
        ? { travel, roll, pose: poseFromState(c.state, slot), bind: c.bind }
        : { travel, roll, pose: null, bind: null };
    });
  });
}
