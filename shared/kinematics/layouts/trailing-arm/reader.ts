/** The trailing-arm readings (rows.ts): present when the left wheel rides on an arm with a hinge. */
import { cleanZero } from '../../clean';
import type { LayoutReader } from '../types';
import { trailingArmHeaveFields, trailingArmPlanBuild, trailingArmRollCentres, trailingArmRollFields } from './rows';

export const trailingArmReader: LayoutReader = {
  name: 'trailing arms',
  plan(model) {
    const plan = trailingArmPlanBuild(model);
    if (!plan) return null;
    return {
      heave: (at, solved) => trailingArmHeaveFields(plan, at, solved.state, solved.travel, cleanZero),
      roll: (at, solved) => trailingArmRollFields(plan, at, solved.state, solved.roll, cleanZero),
      rollCentres: (at, solved) => trailingArmRollCentres(plan, at, solved.state, solved.roll, cleanZero),
    };
  },
};
