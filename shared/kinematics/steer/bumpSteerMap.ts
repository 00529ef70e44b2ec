/**
 * Bump steer at straight ahead and out to lock: with the steering input (rack or pitman arm) held at a few
 * positions (centre, half way to each lock, each lock), the heave march of march.ts from that steer row, and each wheel's toe
 * change from the row at travel 0 there. Toe as the heave rows' (positive toe-in), so the straight-ahead
 * curve's left wheel is the heave sweep's `toeChange`. The heave grid is coarser than the sweep's
 * (at most MAP_INTERVALS steps over the travel): the map is for its shape and its worst value.
 */
import { marchPlan } from '../grid';
import { march, rowRateFor, type SolvedRow } from '../march';
import type { BumpSteerCurve, BumpSteerMap } from '../types';
import { cleanZero } from '../clean';
import { steerInputField, steerInputSet } from './linkage';
import type { InputContext, InputSolved } from './march';
import { steerAngle } from './rows';

/** Heave steps of each curve over the whole travel, at most (fewer when the sweep's own step is coarser). */
export const MAP_INTERVALS = 12;

/** The input positions of the map: each lock, half way to it, and centre (ordered −lock … +lock, no repeats). */
export function mapRackPositions(rows: readonly InputSolved[]): InputSolved[] {
  if (rows.length === 0) return [];
  const nearest = (target: number) =>
    rows.reduce((a, b) => (Math.abs(b.at - target) < Math.abs(a.at - target) ? b : a));
  const lo = rows[0].at;
  const hi = rows[rows.length - 1].at;
  const picks = [lo, lo / 2, 0, hi / 2, hi].map(nearest);
  return [...new Set(picks)];
}

export function bumpSteerMap(
  rc: InputContext,
  at: readonly InputSolved[],
  droop: number,
  bump: number,
  step: number,
): BumpSteerMap {
  const { ctx, input } = rc;
  const { linkage } = rc;
  const plan = marchPlan(droop, bump, Math.max(step, (bump - droop) / MAP_INTERVALS));
  const curves: BumpSteerCurve[] = [];
  let worst: BumpSteerMap['worst'] = null;
  let worstAt: BumpSteerMap['worstAt'] = null;
  for (const r of at) {
    steerInputSet(input, r.at);
    const start = rowRateFor(ctx, { travel: 0, roll: 0, state: r.state, rate: r.rate, bind: r.bind }, 'travel');
    const up = march(ctx, start, 'travel', plan.up).rows;
    const down = march(ctx, start, 'travel', plan.down).rows;
    const rows: SolvedRow[] = [...down.reverse(), start, ...up];
    const left0 = steerAngle(start.state, linkage.left);
    const right0 = steerAngle(start.state, linkage.right);
    const points = rows.map((s) => ({
      travel: s.travel,
      // Toe-in turns the left wheel's nose right (negative steer) and the right wheel's left.
      left: cleanZero(-(steerAngle(s.state, linkage.left) - left0)),
      right: cleanZero(steerAngle(s.state, linkage.right) - right0),
    }));
    for (const p of points)
      for (const side of ['left', 'right'] as const)
        if (worst === null || Math.abs(p[side]) > Math.abs(worst)) {
          worst = p[side];
          worstAt = Object.assign(steerInputField(input, r.at), { travel: p.travel, side });
        }
    curves.push(Object.assign(steerInputField(input, r.at), { points }));
  }
  steerInputSet(input, 0);
  return { curves, worst, worstAt };
}
