import { parseSketch } from '../../../schema/sketch';
import { baseParams, linkFrameEnd, paramsResolve, r1, sketchShell, solidAxleBase } from '../starterParts';
import type { StarterParam, StarterSpec } from '../starterTypes';

const params: StarterParam[] = [
  ...baseParams.map((p) => (p.key === 'upperLength' ? { ...p, default: 650 } : p)),
  {
    key: 'upperFrameSpread',
    label: 'Upper links, spacing at the frame',
    unit: 'mm',
    default: 900,
    min: 400,
    max: 1400,
  },
  { key: 'upperAxleSpread', label: 'Upper links, spacing at the axle', unit: 'mm', default: 300, min: 100, max: 900 },
];

/** Parallel lower links and two upper links converging on the axle: no lateral rod. */
export const triangulatedFourLink: StarterSpec = {
  layout: 'triangulated-four-link',
  label: 'Triangulated four-link',
  description:
    'Two parallel lower links and two upper links angled in plan view towards the axle centre; the angled uppers locate the axle sideways, so there is no lateral rod and no bind.',
  params,
  build(given) {
    const p = paramsResolve(params, given);
    const base = solidAxleBase(p);
    const ulA = { x: 70, z: p.tireRadius + p.upperRise };
    const ulF = linkFrameEnd(ulA.x, ulA.z, p.upperLength, p.upperAngle);
    const points = [
      ...base.points,
      { id: 'UL.fl', body: 'frame' as const, x: r1(ulF.x), y: r1(p.upperFrameSpread / 2), z: r1(ulF.z) },
      { id: 'UL.fr', body: 'frame' as const, x: r1(ulF.x), y: r1(-p.upperFrameSpread / 2), z: r1(ulF.z) },
      { id: 'UL.al', body: 'axle' as const, x: ulA.x, y: r1(p.upperAxleSpread / 2), z: r1(ulA.z) },
      { id: 'UL.ar', body: 'axle' as const, x: ulA.x, y: r1(-p.upperAxleSpread / 2), z: r1(ulA.z) },
    ];
    const members = [
      ...base.members,
      { id: 'ULl', kind: 'link' as const, group: 'upper' as const, a: 'UL.fl', b: 'UL.al' },
      { id: 'ULr', kind: 'link' as const, group: 'upper' as const, a: 'UL.fr', b: 'UL.ar' },
    ];
    return parseSketch(sketchShell('triangulated-four-link', 'New triangulated four-link', p, points, members));
  },
};
