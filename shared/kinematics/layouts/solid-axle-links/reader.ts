/** The solid-axle link readings (rows.ts), shared by the four-link, triangulated four-link and three-link layouts. */
import { cleanZero } from '../../clean';
import type { LayoutReader } from '../types';
import { solidAxleLinksNotes } from './notes';
import { solidAxleLinksHeaveFields, solidAxleLinksPlanBuild } from './rows';

export const solidAxleLinksReader: LayoutReader = {
  name: 'solid-axle links',
  plan(model) {
    const plan = solidAxleLinksPlanBuild(model.sketch, model.points, model.axle, model.wheelLeft);
    return {
      heave: (at, solved) => solidAxleLinksHeaveFields(plan, at, solved, cleanZero),
      // The same constructions hold at a rolled row: the rod's (or link pairs') crossing of y = 0, the left links' crossing.
      rollCentres: (at, solved) => {
        const f = solidAxleLinksHeaveFields(plan, at, solved, cleanZero);
        return {
          rollCenter: f.rollCenterHeight === null ? null : { y: 0, z: f.rollCenterHeight },
          instantCenter: f.instantCenter,
        };
      },
      notes: () => solidAxleLinksNotes(model.sketch, plan),
    };
  },
};
