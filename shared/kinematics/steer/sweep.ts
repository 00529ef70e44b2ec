/**
 * The steer sweep (docs/sketch-format.md, "The steer sweep"): the rack marched from centre out to
 * `sweep.steer.rack` each way by `step`, the body at ride height, then the lock each way as an event
 * and the bump-steer map out to lock. Run by `sweepSketch` after the heave and roll sweeps, on their
 * solver; the rack's points are put back where the sketch has them before it returns. A sketch that
 * does not steer gets an empty result whose `problem` names the field, never an exception.
 */
import type { Sketch } from '../../schema/sketch';
import { marchPlan } from '../grid';
import { layoutReaders } from '../layouts/readers';
import type { MarchContext } from '../march';
import type { LinkageModel } from '../model';
import type { SteerResult, SteerRow } from '../types';
import { bumpSteerMap, mapRackPositions } from './bumpSteerMap';
import { lockEvent } from './events';
import { rackSet, type SteerLinkage } from './linkage';
import { marchRack, rackContextBuild, rackStart, type RackContext, type RackSolved } from './march';
import { steerRowBuild, steerRowPlanBuild } from './rows';

/** The steering a layout reader finds in the model; a sentence naming the problem when nothing can steer. */
export function steeringOf(model: LinkageModel): SteerLinkage | string {
  let problem: string | null = null;
  for (const reader of layoutReaders) {
    const found = reader.steering?.(model);
    if (found && typeof found !== 'string') return found;
    if (typeof found === 'string') problem ??= found;
  }
  return (
    problem ??
    `sweep.steer: the ${model.sketch.layout} layout does not steer (a steer sweep needs knuckles with tie rods ` +
      'from a rack), so there is no steer sweep; the heave and roll sweeps are not affected.'
  );
}

function noSteer(problem: string): SteerResult {
  return {
    input: 'rack',
    rows: [],
    rackDirection: null,
    rackPoints: [],
    rackMin: 0,
    rackMax: 0,
    events: [],
    bumpSteer: null,
    problem,
  };
}

export interface RackSweep {
  rc: RackContext;
  /** solved rows, −rack → +rack */
  solved: RackSolved[];
  rows: SteerRow[];
  events: SteerResult['events'];
}

/**
 * The rows of the rack march both ways from the solved ride state, and the lock events; the rack is left
 * centred. The steer sweep without its bump-steer map (the benchmark times this against the heave march).
 */
export function rackSweep(
  ctx: MarchContext,
  linkage: SteerLinkage,
  rideState: Float64Array,
  rack: number,
  step: number,
): RackSweep {
  const rc = rackContextBuild(ctx, linkage);
  const start = rackStart(rc, rideState);
  const plan = marchPlan(-rack, rack, step);
  const left = marchRack(rc, start, plan.up);
  const right = marchRack(rc, start, plan.down);
  const solved = [...right.rows.slice().reverse(), start, ...left.rows];
  const events = [
    lockEvent(ctx.model, linkage, rack, left.rows.at(-1) ?? start, left.limit),
    lockEvent(ctx.model, linkage, -rack, right.rows.at(-1) ?? start, right.limit),
  ];
  const rowPlan = steerRowPlanBuild(ctx.model, linkage);
  const rows = solved.map((s) => {
    // A row reads the rack's points (the tie rods' inner ends) where the rack is at that row.
    rackSet(linkage.input, s.rack);
    return steerRowBuild(rowPlan, s);
  });
  rackSet(linkage.input, 0);
  return { rc, solved, rows, events };
}

/**
 * The steer sweep of a validated sketch whose `sweep.steer` is set, on the heave sweep's solver; `withMap`
 * false leaves the bump-steer map out (null), for a quick preview.
 */
export function steerSweep(sketch: Sketch, ctx: MarchContext, rideState: Float64Array, withMap = true): SteerResult {
  const settings = sketch.sweep.steer;
  if (!settings) return noSteer('sweep.steer: not set, so there is no steer sweep.');
  const linkage = steeringOf(ctx.model);
  if (typeof linkage === 'string') return noSteer(linkage);
  try {
    const { rc, solved, rows, events } = rackSweep(ctx, linkage, rideState, settings.rack, settings.step);
    const sw = sketch.sweep;
    const bumpSteer = withMap ? bumpSteerMap(rc, mapRackPositions(solved), sw.droop, sw.bump, sw.step) : null;
    const u = linkage.input.direction;
    return {
      input: 'rack',
      rows,
      rackDirection: { x: u.x, y: u.y, z: u.z },
      rackPoints: linkage.input.points.map((p) => p.point.id),
      rackMin: rows[0].rack,
      rackMax: rows[rows.length - 1].rack,
      events,
      bumpSteer,
      problem: null,
    };
  } finally {
    rackSet(linkage.input, 0);
  }
}
