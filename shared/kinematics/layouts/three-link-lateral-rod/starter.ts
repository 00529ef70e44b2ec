import { parseSketch } from '../../../schema/sketch';
import {
  baseParams,
  lateralRod,
  linkFrameEnd,
  paramsResolve,
  r1,
  rodParams,
  sketchShell,
  solidAxleBase,
} from '../starterParts';
import type { StarterParam, StarterSpec } from '../starterTypes';

const params: StarterParam[] = [
  ...baseParams.map((p) => (p.key === 'upperLength' ? { ...p, default: 750 } : p)),
  {
    key: 'upperOffset',
    label: 'Upper link offset from centre (left +)',
    unit: 'mm',
    default: 150,
    min: -400,
    max: 400,
  },
  ...rodParams,
];

/** Two lower links, one central upper link and a lateral rod: exactly determined, no bind. */
export const threeLinkLateralRod: StarterSpec = {
  layout: 'three-link-lateral-rod',
  label: 'Three-link with lateral rod',
  description:
    'Two lower links and one upper link near the centre locate the axle fore-aft and in pitch; a lateral rod locates it sideways. Articulates without bind.',
  params,
  build(given) {
    const p = paramsResolve(params, given);
    const base = solidAxleBase(p);
    const ulA = { x: 70, z: p.tireRadius + p.upperRise };
    const ulF = linkFrameEnd(ulA.x, ulA.z, p.upperLength, p.upperAngle);
    const rod = lateralRod(p);
    const points = [
      ...base.points,
      { id: 'UL.f', body: 'frame' as const, x: r1(ulF.x), y: r1(p.upperOffset), z: r1(ulF.z) },
      { id: 'UL.a', body: 'axle' as const, x: ulA.x, y: r1(p.upperOffset), z: r1(ulA.z) },
      ...rod.points,
    ];
    const members = [
      ...base.members,
      { id: 'UL', kind: 'link' as const, group: 'upper' as const, a: 'UL.f', b: 'UL.a' },
      ...rod.members,
    ];
    return parseSketch(sketchShell('three-link-lateral-rod', 'New three-link with lateral rod', p, points, members));
  },
};
