/**
 * The double-wishbone readings (rows.ts): present when the left wheel is on a knuckle with both
 * wishbones; the notes also run without them (a knuckle lacking its wishbones is noted).
 */
import type { LayoutReader } from '../types';
import { wishboneNotes } from './notes';
import { wishbonePlanBuild } from './plan';
import { wishboneSteering } from './steering';
import { wishboneHeaveFields, wishboneRollCentres, wishboneRollFields } from './rows';

export const doubleWishboneReader: LayoutReader = {
  name: 'double wishbones',
  plan(model) {
    const plan = wishbonePlanBuild(model);
    return {
      ...(plan
        ? {
            heave: (at, solved) => wishboneHeaveFields(plan, at, solved.state, solved.travel),
            roll: (at, solved) => wishboneRollFields(plan, at, solved.state, solved.roll),
            rollCentres: (at, solved) => wishboneRollCentres(plan, at, solved.state, solved.roll),
          }
        : {}),
      notes: (heave) => wishboneNotes(model, plan, heave),
    };
  },
  steering: (model) => wishboneSteering(wishbonePlanBuild(model)),
};
