/**
 * Test rigs for the reference checks: small sketches whose geometry makes a published
 * formula apply exactly (or to a known, tiny error).
 */
import type { SketchInput } from '../../shared/schema/sketch';

type Pt = SketchInput['points'][number];
type Mb = SketchInput['members'][number];

export function doc(points: Pt[], members: Mb[], extra: Partial<SketchInput> = {}): SketchInput {
  return {
    format: 'arcwright.sketch',
    version: 1,
    name: 'Reference rig',
    layout: 'four-link-lateral-rod',
    vehicle: { wheelbase: 3000, cgHeight: 600, track: 1600, tireRadius: 400 },
    points,
    members,
    wheels: { left: 'WC.l', right: 'WC.r' },
    ...extra,
  };
}

/** Length of the rig's links (mm): long, so the axle's fore-aft arc (z²/2L) is tiny. */
export const RIG_LINK_MM = 20000;

/**
 * An axle that translates without rotating: four equal, parallel links along x (a
 * parallelogram in side view, so no pitch; equal left and right, so no yaw) and a lateral
 * rod given by its two ends. At ride the axle points move straight up with the travel.
 */
export function translatingAxle(
  rod: { frame: [number, number, number]; axle: [number, number, number] },
  more: { points?: Pt[]; members?: Mb[] } = {},
  extra: Partial<SketchInput> = {},
): SketchInput {
  const L = RIG_LINK_MM;
  const points: Pt[] = [
    { id: 'WC.l', body: 'axle', x: 0, y: 800, z: 400 },
    { id: 'WC.r', body: 'axle', x: 0, y: -800, z: 400 },
    { id: 'LL.al', body: 'axle', x: 0, y: 500, z: 250 },
    { id: 'LL.fl', body: 'frame', x: L, y: 500, z: 250 },
    { id: 'LL.ar', body: 'axle', x: 0, y: -500, z: 250 },
    { id: 'LL.fr', body: 'frame', x: L, y: -500, z: 250 },
    { id: 'UL.al', body: 'axle', x: 0, y: 400, z: 600 },
    { id: 'UL.fl', body: 'frame', x: L, y: 400, z: 600 },
    { id: 'UL.ar', body: 'axle', x: 0, y: -400, z: 600 },
    { id: 'UL.fr', body: 'frame', x: L, y: -400, z: 600 },
    { id: 'LR.f', body: 'frame', x: rod.frame[0], y: rod.frame[1], z: rod.frame[2] },
    { id: 'LR.a', body: 'axle', x: rod.axle[0], y: rod.axle[1], z: rod.axle[2] },
    ...(more.points ?? []),
  ];
  const members: Mb[] = [
    { id: 'LLl', kind: 'link', group: 'lower', a: 'LL.fl', b: 'LL.al' },
    { id: 'LLr', kind: 'link', group: 'lower', a: 'LL.fr', b: 'LL.ar' },
    { id: 'ULl', kind: 'link', group: 'upper', a: 'UL.fl', b: 'UL.al' },
    { id: 'ULr', kind: 'link', group: 'upper', a: 'UL.fr', b: 'UL.ar' },
    { id: 'LR', kind: 'lateral-rod', a: 'LR.f', b: 'LR.a' },
    ...(more.members ?? []),
  ];
  return doc(points, members, extra);
}

const rad = (d: number) => (d * Math.PI) / 180;
const deg = (r: number) => (r * 180) / Math.PI;

export type Branch = 'open' | 'crossed';

/** Norton's closed form (Design of Machinery, ch. 4), as written in docs/references.md. */
export function nortonAngles(a: number, b: number, c: number, d: number, theta2Deg: number, branch: Branch) {
  const t2 = rad(theta2Deg);
  const K1 = d / a,
    K2 = d / c,
    K3 = (a * a - b * b + c * c + d * d) / (2 * a * c);
  const K4 = d / b,
    K5 = (c * c - d * d - a * a - b * b) / (2 * a * b);
  const A = Math.cos(t2) - K1 - K2 * Math.cos(t2) + K3;
  const B = -2 * Math.sin(t2);
  const C = K1 - (K2 + 1) * Math.cos(t2) + K3;
  const D = Math.cos(t2) - K1 + K4 * Math.cos(t2) + K5;
  const E = -2 * Math.sin(t2);
  const F = K1 + (K4 - 1) * Math.cos(t2) + K5;
  const s = branch === 'open' ? -1 : 1;
  const t4 = 2 * Math.atan2(-B + s * Math.sqrt(B * B - 4 * A * C), 2 * A);
  const t3 = 2 * Math.atan2(-E + s * Math.sqrt(E * E - 4 * D * F), 2 * D);
  const wrap = (x: number) => deg(Math.atan2(Math.sin(x), Math.cos(x)));
  return { theta3: wrap(t3), theta4: wrap(t4) };
}

export const O2 = { x: 1500, z: 300 };

/** The four-bar as a sketch at crank angle θ2 (positions from Norton's closed form). */
export function fourBarSketch(
  a: number,
  b: number,
  c: number,
  d: number,
  theta2: number,
  branch: Branch,
  travelTo: number,
): SketchInput {
  const { theta3 } = nortonAngles(a, b, c, d, theta2, branch);
  const A = { x: O2.x + a * Math.cos(rad(theta2)), z: O2.z + a * Math.sin(rad(theta2)) };
  const B = { x: A.x + b * Math.cos(rad(theta3)), z: A.z + b * Math.sin(rad(theta3)) };
  const O4 = { x: O2.x + d, z: O2.z };
  const pts: SketchInput['points'] = [];
  for (const [side, y] of [
    ['l', 400],
    ['r', -400],
  ] as const) {
    pts.push(
      { id: `O2.${side}`, body: 'frame', x: O2.x, y, z: O2.z },
      { id: `O4.${side}`, body: 'frame', x: O4.x, y, z: O4.z },
      { id: `A.${side}`, body: 'axle', x: A.x, y, z: A.z },
      { id: `B.${side}`, body: 'axle', x: B.x, y, z: B.z },
    );
  }
  pts.push({ id: 'WC.l', body: 'axle', x: A.x, y: 800, z: A.z }, { id: 'WC.r', body: 'axle', x: A.x, y: -800, z: A.z });
  const members: SketchInput['members'] = ['l', 'r'].flatMap((s) => [
    { id: `crank.${s}`, kind: 'link' as const, a: `O2.${s}`, b: `A.${s}` },
    { id: `rocker.${s}`, kind: 'link' as const, a: `O4.${s}`, b: `B.${s}` },
  ]);
  const step = travelTo / 8;
  return doc(pts, members, {
    sweep: { droop: -Math.abs(travelTo), bump: Math.abs(travelTo), step: Math.abs(step), roll: 0, rollStep: 1 },
  });
}

/**
 * A rear four-link whose side-view instant centre sits, by construction, 1000 mm ahead of the
 * axle and 300 mm high: the lower links lie on the line through (0, 200) and the instant centre,
 * the uppers on the line through (0, 600) and it. With a lateral rod behind the axle.
 */
export const IC_RIG_POINTS: Pt[] = [
  { id: 'WC.l', body: 'axle', x: 0, y: 800, z: 400 },
  { id: 'WC.r', body: 'axle', x: 0, y: -800, z: 400 },
  { id: 'LL.al', body: 'axle', x: 0, y: 500, z: 200 },
  { id: 'LL.fl', body: 'frame', x: 600, y: 500, z: 260 },
  { id: 'LL.ar', body: 'axle', x: 0, y: -500, z: 200 },
  { id: 'LL.fr', body: 'frame', x: 600, y: -500, z: 260 },
  { id: 'UL.al', body: 'axle', x: 0, y: 400, z: 600 },
  { id: 'UL.fl', body: 'frame', x: 500, y: 400, z: 450 },
  { id: 'UL.ar', body: 'axle', x: 0, y: -400, z: 600 },
  { id: 'UL.fr', body: 'frame', x: 500, y: -400, z: 450 },
  { id: 'LR.f', body: 'frame', x: -100, y: 550, z: 420 },
  { id: 'LR.a', body: 'axle', x: -100, y: -550, z: 420 },
];

/** The links and the lateral rod of IC_RIG_POINTS. */
export const IC_RIG_MEMBERS: Mb[] = [
  { id: 'LLl', kind: 'link', group: 'lower', a: 'LL.fl', b: 'LL.al' },
  { id: 'LLr', kind: 'link', group: 'lower', a: 'LL.fr', b: 'LL.ar' },
  { id: 'ULl', kind: 'link', group: 'upper', a: 'UL.fl', b: 'UL.al' },
  { id: 'ULr', kind: 'link', group: 'upper', a: 'UL.fr', b: 'UL.ar' },
  { id: 'LR', kind: 'lateral-rod', a: 'LR.f', b: 'LR.a' },
];
