/**
 * The double wishbone's steering: a rack through the two tie rods' inner ends, each knuckle turning
 * about the line from its lower to its upper ball joint. Needs both knuckles on both wishbones, each
 * with its tie rod.
 */
import { rackInput, type SteerLinkage, type SteerSide } from '../../steer/linkage';
import type { WishbonePlan, WishboneSide } from './plan';

function sideOf(s: WishboneSide): SteerSide | null {
  if (!s.tieRod) return null;
  return {
    side: s.side,
    body: s.body,
    wheel: s.wheel,
    axis: [s.lower.joint, s.upper.joint],
    tieRod: { member: s.tieRod.member, inner: s.tieRod.inner, outer: s.tieRod.outer },
  };
}

/** The steering of a double-wishbone plan; a sentence naming what is missing; null without wishbones. */
export function wishboneSteering(plan: WishbonePlan | null): SteerLinkage | string | null {
  if (!plan) return null;
  const left = sideOf(plan.left);
  const right = plan.right ? sideOf(plan.right) : null;
  if (!left || !right)
    return (
      'sweep.steer: a steer sweep needs both knuckles on their wishbones, each with a tie rod from the frame; ' +
      'this sketch lacks one, so there is no steer sweep.'
    );
  const input = rackInput(left.tieRod.inner, right.tieRod.inner);
  if (typeof input === 'string') return input;
  return { input, left, right };
}
