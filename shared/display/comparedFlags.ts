/**
 * The flags counted when sketches are compared side by side (the line-up, the hand-ins table): the board's
 * flags less the steering lock at the end of the rack travel asked for. That is where the steer sweep ends by
 * design: the board lists it as a note, but it is nothing to compare between variants.
 */
import type { SweepResult } from '../kinematics/types';
import type { SketchMember } from '../schema/sketch';
import type { LengthUnit } from '../units';
import { buildFlags, type Flag } from './flags';
import type { TargetCheck } from './targets';

export function comparedFlags(
  result: SweepResult,
  members: readonly SketchMember[],
  checks: TargetCheck[],
  u: LengthUnit,
): Flag[] {
  return buildFlags(result, members, checks, u).filter((f) => f.kind !== 'steer-lock');
}
