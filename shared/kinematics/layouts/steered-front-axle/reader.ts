/**
 * The steered front axle's readings (rows.ts) and steering (steering.ts): present when the wheels are on one
 * axle with a knuckle on a kingpin each side. The solid-axle links' reader, earlier in the order, gives the
 * instant centre, anti-dive and roll centre as for any linked front axle.
 */
import { cleanZero } from '../../clean';
import type { LayoutReader } from '../types';
import { steeredAxleNotes } from './notes';
import { steeredAxlePlanBuild } from './plan';
import { steeredAxleHeaveFields, steeredAxleRollFields } from './rows';
import { steeredAxleSteering } from './steering';

export const steeredFrontAxleReader: LayoutReader = {
  name: 'steered front axle',
  plan(model) {
    const plan = steeredAxlePlanBuild(model);
    if (!plan) return null;
    return {
      heave: (at, solved) => steeredAxleHeaveFields(plan, at, solved, cleanZero),
      roll: (_at, solved) => steeredAxleRollFields(plan, solved, cleanZero),
      notes: (heave) => steeredAxleNotes(model, plan, heave),
    };
  },
  steering: (model) => steeredAxleSteering(model, steeredAxlePlanBuild(model)),
};
