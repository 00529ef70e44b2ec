/** The leaf-spring readings (rows.ts): present when the sketch has leaf-spring halves. */
import { cleanZero } from '../../clean';
import type { LayoutReader } from '../types';
import { leafSpringNotes } from './notes';
import { leafSpringHeaveFields, leafSpringPlanBuild } from './rows';

export const leafSpringReader: LayoutReader = {
  name: 'leaf springs',
  plan(model) {
    const plan = leafSpringPlanBuild(model);
    if (!plan) return null;
    return {
      heave: (at, solved) => leafSpringHeaveFields(plan, at, solved, cleanZero),
      notes: () => leafSpringNotes(plan),
    };
  },
};
