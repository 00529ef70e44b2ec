/**
 * Double-wishbone rigs for the reference checks: knuckles on two wishbones whose inner pivot
 * axes run straight fore-aft (along x), so the front view is the same at every x and plain
 * plane geometry gives the answers.
 */
import type { SketchInput } from '../../shared/schema/sketch';

type Pt = SketchInput['points'][number];
type Mb = SketchInput['members'][number];
export type Y = number;
export type Z = number;

/** Front-view (y, z) positions of the left side; the right side is their mirror. Inner pivots sit at x = ±spacing/2. */
export interface WishboneRig {
  wheel: [Y, Z];
  lowerInner: [Y, Z];
  lowerJoint: [Y, Z];
  upperInner: [Y, Z];
  upperJoint: [Y, Z];
  /** tie rod: x of both ends, and (y, z) of the inner (frame) and outer (knuckle) end */
  tieRodX: number;
  tieRodInner: [Y, Z];
  tieRodOuter: [Y, Z];
  lowerSpacing?: number;
  upperSpacing?: number;
}

/** A sketch of the rig, both sides, with a sweep of ±`travel` mm by `step` and ±`roll`°. */
export function wishboneSketch(
  r: WishboneRig,
  sweep = { droop: -100, bump: 100, step: 5, roll: 5, rollStep: 1 },
): SketchInput {
  const ls = (r.lowerSpacing ?? 360) / 2;
  const us = (r.upperSpacing ?? 260) / 2;
  const points: Pt[] = [];
  const members: Mb[] = [];
  for (const [s, sign, body] of [
    ['l', 1, 'knuckle-left'],
    ['r', -1, 'knuckle-right'],
  ] as const) {
    const at = (id: string, b: 'frame' | typeof body, x: number, yz: [Y, Z]) =>
      points.push({ id: `${id}.${s}`, body: b, x, y: sign * yz[0], z: yz[1] });
    at('WC', body, 0, r.wheel);
    at('LWf', 'frame', ls, r.lowerInner);
    at('LWr', 'frame', -ls, r.lowerInner);
    at('LBJ', body, 0, r.lowerJoint);
    at('UWf', 'frame', us, r.upperInner);
    at('UWr', 'frame', -us, r.upperInner);
    at('UBJ', body, 0, r.upperJoint);
    at('TRi', 'frame', r.tieRodX, r.tieRodInner);
    at('TRo', body, r.tieRodX, r.tieRodOuter);
    members.push(
      { id: `LF${s}`, kind: 'link', group: 'lower', a: `LWf.${s}`, b: `LBJ.${s}` },
      { id: `LR${s}`, kind: 'link', group: 'lower', a: `LWr.${s}`, b: `LBJ.${s}` },
      { id: `UF${s}`, kind: 'link', group: 'upper', a: `UWf.${s}`, b: `UBJ.${s}` },
      { id: `UR${s}`, kind: 'link', group: 'upper', a: `UWr.${s}`, b: `UBJ.${s}` },
      { id: `TR${s}`, kind: 'tie-rod', a: `TRi.${s}`, b: `TRo.${s}` },
    );
  }
  return {
    format: 'arcwright.sketch',
    version: 1,
    name: 'Wishbone rig',
    layout: 'double-wishbone',
    vehicle: { wheelbase: 2700, cgHeight: 500, track: 2 * r.wheel[0], tireRadius: r.wheel[1] },
    points,
    members,
    wheels: { left: 'WC.l', right: 'WC.r' },
    sweep,
  };
}

/**
 * Equal, parallel wishbones, level at ride (a parallelogram in the front view), with the tie
 * rod a third equal, parallel arm: the knuckle translates without turning.
 */
export const parallelogram: WishboneRig = {
  wheel: [800, 400],
  lowerInner: [400, 250],
  lowerJoint: [720, 250],
  upperInner: [400, 600],
  upperJoint: [720, 600],
  tieRodX: -140,
  tieRodInner: [400, 330],
  tieRodOuter: [720, 330],
};

/** A short upper and long lower arm (the usual front), tie rod to be placed by the test. */
export const shortLong: WishboneRig = {
  wheel: [800, 385],
  lowerInner: [345, 255],
  lowerJoint: [745, 225],
  upperInner: [415, 600],
  upperJoint: [685, 615],
  tieRodX: -140,
  tieRodInner: [370, 315],
  tieRodOuter: [675, 300],
};
