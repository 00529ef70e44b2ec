/**
 * Readings of a steered solid front axle, added to the rows by rows.ts (the solid-axle links' readings, the
 * lateral shift and anti-dive among them, come first from solid-axle-links/):
 * - each wheel's steer angle change from ride (`wheelSteer`): the bump steer of the drag link against the
 *   track bar in heave, and the wheels' steer in roll; read from each knuckle's spin axis as the steer sweep
 *   reads it (steer/rows.ts), positive toward the vehicle's left. The sketch draws the wheels straight ahead at
 *   ride, so the ride row's value is 0;
 * - the left kingpin axis (the knuckle's hinge on the axle) and its caster change (metrics/kingpin.ts).
 */
import { kingpinForRow, kingpinReading } from '../../metrics/kingpin';
import type { SolvedRow } from '../../march';
import { steerAngle } from '../../steer/rows';
import type { HeaveRow, RollRow } from '../../types';
import type { PlacePoint } from '../types';
import type { SteeredAxlePlan } from './plan';

type Clean = (v: number) => number;

function wheelSteer(plan: SteeredAxlePlan, state: Float64Array, clean: Clean): { left: number; right: number } {
  return { left: clean(steerAngle(state, plan.left)), right: clean(steerAngle(state, plan.right)) };
}

/** The heave row's fields: both wheels' bump steer, the left kingpin and its caster change. */
export function steeredAxleHeaveFields(
  plan: SteeredAxlePlan,
  at: PlacePoint,
  solved: SolvedRow,
  clean: Clean,
): Pick<HeaveRow, 'wheelSteer' | 'casterChange' | 'kingpin'> {
  const [lo, hi] = plan.left.kingpin;
  // In the body's axes the ground has risen by the travel.
  const kp = kingpinReading(at(lo), at(hi), at(plan.left.wheel), solved.travel, 'left');
  return {
    wheelSteer: wheelSteer(plan, solved.state, clean),
    casterChange: kp && plan.rideKingpin ? clean(kp.caster - plan.rideKingpin.caster) : null,
    kingpin: kingpinForRow(kp, clean),
  };
}

/** The roll row's fields: both wheels' steer angle change. */
export function steeredAxleRollFields(
  plan: SteeredAxlePlan,
  solved: SolvedRow,
  clean: Clean,
): Pick<RollRow, 'wheelSteer'> {
  return { wheelSteer: wheelSteer(plan, solved.state, clean) };
}
