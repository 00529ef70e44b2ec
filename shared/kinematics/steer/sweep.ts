/**
 * The steer sweep (docs/sketch-format.md, "The steer sweep"): the steering input (a rack, `sweep.steer.rack` mm
 * each way; or a pitman arm, `sweep.steer.pitman` degrees each way) marched from centre by `step`, the body at
 * ride height, then the lock each way as an event and the bump-steer map out to lock. Run by `sweepSketch` after
 * the heave and roll sweeps, on their solver; the input's points are put back where the sketch has them before
 * it returns. A sketch that does not steer gets an empty result whose `problem` names the field, never an
 * exception.
 */
import type { Sketch } from '../../schema/sketch';
import { marchPlan } from '../grid';
import { layoutReaders } from '../layouts/readers';
import type { MarchContext } from '../march';
import type { LinkageModel } from '../model';
import type { SteerResult, SteerRow } from '../types';
import { bumpSteerMap, mapRackPositions } from './bumpSteerMap';
import { lockEvent } from './events';
import { steerInputSet, type SteerLinkage } from './linkage';
import { marchInput, inputContextBuild, inputStart, type InputContext, type InputSolved } from './march';
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
      'from a rack or a pitman arm), so there is no steer sweep; the heave and roll sweeps are not affected.'
  );
}

function noSteer(problem: string, input: SteerResult['input'] = 'rack'): SteerResult {
  return {
    input,
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

export interface SteerInputSweep {
  rc: InputContext;
  /** solved rows, −travel → +travel */
  solved: InputSolved[];
  rows: SteerRow[];
  events: SteerResult['events'];
}

/**
 * The rows of the input's march both ways from the solved ride state, and the lock events; the input is left
 * centred. The steer sweep without its bump-steer map (the benchmark times this against the heave march).
 * `travel` and `step` in the input's unit (mm of rack, degrees of pitman arm).
 */
export function steerInputSweep(
  ctx: MarchContext,
  linkage: SteerLinkage,
  rideState: Float64Array,
  travel: number,
  step: number,
): SteerInputSweep {
  const rc = inputContextBuild(ctx, linkage);
  const start = inputStart(rc, rideState);
  const plan = marchPlan(-travel, travel, step);
  const left = marchInput(rc, start, plan.up);
  // The first row to the left is the row before centre for the march to the right (a cubic predictor there too).
  const right = marchInput(rc, start, plan.down, left.rows[0] ?? null);
  const solved = [...right.rows.slice().reverse(), start, ...left.rows];
  const events = [
    lockEvent(ctx.model, linkage, travel, left.rows.at(-1) ?? start, left.limit),
    lockEvent(ctx.model, linkage, -travel, right.rows.at(-1) ?? start, right.limit),
  ];
  const rowPlan = steerRowPlanBuild(ctx.model, linkage, rc.rot);
  const rows = solved.map((s) => {
    // A row reads the input's points (the tie rods' inner ends, the pitman ball) where the input is at that row.
    steerInputSet(linkage.input, s.at);
    return steerRowBuild(rowPlan, s);
  });
  steerInputSet(linkage.input, 0);
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
  if (typeof linkage === 'string') return noSteer(linkage, settings.pitman !== undefined ? 'pitman' : 'rack');
  const kind = linkage.input.kind;
  const travel = settings[kind];
  if (travel === undefined)
    return noSteer(
      `sweep.steer.${kind}: this sketch steers by a ${kind === 'rack' ? 'rack (mm each way)' : 'pitman arm (degrees each way)'}, ` +
        'and sweep.steer does not give its travel, so there is no steer sweep; the heave and roll sweeps are not affected.',
      kind,
    );
  try {
    const { rc, solved, rows, events } = steerInputSweep(ctx, linkage, rideState, travel, settings.step);
    const sw = sketch.sweep;
    const bumpSteer = withMap ? bumpSteerMap(rc, mapRackPositions(solved), sw.droop, sw.bump, sw.step) : null;
    const first = solved[0].at;
    const last = solved[solved.length - 1].at;
    const input = linkage.input;
    if (input.kind === 'pitman') {
      const v = (p: { x: number; y: number; z: number }) => ({ x: p.x, y: p.y, z: p.z });
      return {
        ...noSteer('', 'pitman'),
        rows,
        pitmanArm: {
          ball: input.ball.point.id,
          pivot: v(input.pivot),
          axis: v(input.axis),
          length: input.length,
          min: first,
          max: last,
        },
        events,
        bumpSteer,
        problem: null,
      };
    }
    const u = input.direction;
    return {
      input: 'rack',
      rows,
      rackDirection: { x: u.x, y: u.y, z: u.z },
      rackPoints: input.points.map((p) => p.point.id),
      rackMin: first,
      rackMax: last,
      events,
      bumpSteer,
      problem: null,
    };
  } finally {
    steerInputSet(linkage.input, 0);
  }
}
