import { parseSketch } from '../../../schema/sketch';
import {
  baseParams,
  lateralRod,
  linkFrameEnd,
  pair,
  paramsResolve,
  rodParams,
  sketchShell,
  solidAxleBase,
} from '../starterParts';
import type { StarterParam, StarterSpec } from '../starterTypes';

const params: StarterParam[] = [
  ...baseParams,
  { key: 'upperSpread', label: 'Upper link spacing', unit: 'mm', default: 880, min: 400, max: 1400 },
  ...rodParams,
];

/** Four parallel links (two lower, two upper) and a lateral rod. */
export const fourLinkLateralRod: StarterSpec = {
  layout: 'four-link-lateral-rod',
  label: 'Four-link with lateral rod',
  description:
    'Two lower and two upper links, parallel in plan view, locate the axle fore-aft and in pitch; a lateral rod locates it sideways. Binds in articulation.',
  params,
  build(given) {
    const p = paramsResolve(params, given);
    const base = solidAxleBase(p);
    const ulA = { x: 70, z: p.tireRadius + p.upperRise };
    const ulF = linkFrameEnd(ulA.x, ulA.z, p.upperLength, p.upperAngle);
    const rod = lateralRod(p);
    const points = [
      ...base.points,
      ...pair('UL', 'frame', ulF.x, p.upperSpread / 2, ulF.z),
      ...pair('UL', 'axle', ulA.x, p.upperSpread / 2, ulA.z),
      ...rod.points,
    ];
    const members = [
      ...base.members,
      { id: 'ULl', kind: 'link' as const, group: 'upper' as const, a: 'UL.fl', b: 'UL.al' },
      { id: 'ULr', kind: 'link' as const, group: 'upper' as const, a: 'UL.fr', b: 'UL.ar' },
      ...rod.members,
    ];
    return parseSketch(sketchShell('four-link-lateral-rod', 'New four-link with lateral rod', p, points, members));
  },
};
