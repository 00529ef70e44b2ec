/**
 * A small invented rear four-link with a lateral rod, shocks and springs, for board tests.
 * Numbers are our own scenario (a workshop runabout), not any real vehicle.
 */
import type { Sketch } from '../../../shared/schema/sketch';
import type { SketchDetail } from '../../../src/api/types';

type Body = Sketch['points'][number]['body'];

function side(id: string, body: Body, x: number, y: number, z: number): Sketch['points'] {
  return [
    { id: `${id}l`, body, x, y, z },
    { id: `${id}r`, body, x, y: -y, z },
  ];
}

export function fourLink(): Sketch {
  return {
    format: 'arcwright.sketch',
    version: 1,
    name: 'Test runabout, rear',
    layout: 'four-link-lateral-rod',
    vehicle: { wheelbase: 3250, cgHeight: 700, track: 1580, tireRadius: 395 },
    points: [
      ...side('WC.', 'axle', 0, 790, 395),
      ...side('LL.f', 'frame', 980, 470, 330),
      ...side('LL.a', 'axle', 30, 470, 235),
      ...side('UL.f', 'frame', 760, 440, 600),
      ...side('UL.a', 'axle', 70, 440, 540),
      ...side('SH.f', 'frame', -140, 520, 780),
      ...side('SH.a', 'axle', -110, 520, 300),
      { id: 'LR.f', body: 'frame', x: -70, y: 560, z: 520 },
      { id: 'LR.a', body: 'axle', x: -70, y: -540, z: 360 },
      { id: 'DS.o', body: 'frame', x: 1580, y: 0, z: 500 },
      { id: 'DS.oa', body: 'frame', x: 1680, y: 0, z: 503 },
      { id: 'DS.p', body: 'axle', x: 190, y: 0, z: 410 },
      { id: 'DS.pa', body: 'axle', x: 90, y: 0, z: 406 },
    ],
    members: [
      { id: 'LLl', kind: 'link', group: 'lower', a: 'LL.fl', b: 'LL.al' },
      { id: 'LLr', kind: 'link', group: 'lower', a: 'LL.fr', b: 'LL.ar' },
      { id: 'ULl', kind: 'link', group: 'upper', a: 'UL.fl', b: 'UL.al' },
      { id: 'ULr', kind: 'link', group: 'upper', a: 'UL.fr', b: 'UL.ar' },
      { id: 'SHl', kind: 'shock', a: 'SH.fl', b: 'SH.al', minLength: 340, maxLength: 580 },
      { id: 'SHr', kind: 'spring', a: 'SH.fr', b: 'SH.ar', rate: 38 },
      { id: 'LR', kind: 'lateral-rod', a: 'LR.f', b: 'LR.a' },
    ],
    wheels: { left: 'WC.l', right: 'WC.r' },
    driveline: { output: 'DS.o', outputAxis: 'DS.oa', pinion: 'DS.p', pinionAxis: 'DS.pa' },
    sweep: { droop: -130, bump: 110, step: 5, roll: 7, rollStep: 1, bindThreshold: 1.5, jointAngleLimit: 3 },
  };
}

/** The API's answer for a sketch the user owns. */
export function detailOf(document: Sketch, over: Partial<SketchDetail> = {}): SketchDetail {
  return {
    id: 7,
    name: document.name,
    layout: document.layout,
    version: 3,
    updatedAt: '2026-01-05T10:00:00.000Z',
    createdAt: '2026-01-01T10:00:00.000Z',
    owner: { id: 2, name: 'Demo Maker' },
    mine: true,
    share: 'private',
    deletedAt: null,
    document,
    canEdit: true,
    shareToken: null,
    ...over,
  };
}
