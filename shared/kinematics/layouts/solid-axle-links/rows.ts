/**
 * Readings of a solid axle located by links (the four-link, triangulated four-link and
 * three-link layouts share them), added to every heave row by rows.ts:
 * - the side-view instant centre where the left upper and lower links' lines cross, and the
 *   anti-squat from it (metrics/instantCenter.ts, metrics/antiSquat.ts);
 * - the roll-centre height from the lateral rod, else from the upper and lower link pairs
 *   (metrics/rollCenter.ts).
 * They come from the link groups and the rod wherever a sketch has them; the readers of the
 * other layouts that come later in the reading order replace them where their own apply.
 */
import type { Sketch } from '../../../schema/sketch';
import { antiSquatPercent } from '../../metrics/antiSquat';
import { leftGroupLink, sideViewCrossing } from '../../metrics/instantCenter';
import { rollCenterFromLinkPairs, rollCenterFromRod } from '../../metrics/rollCenter';
import type { SolvedRow } from '../../march';
import type { BodyModel, PointModel } from '../../model';
import { POSE_SIZE } from '../../pose';
import type { HeaveRow } from '../../types';
import type { Vec3 } from '../../vec';
import type { PlacePoint } from '../types';

/** A member's two points. */
export interface LinkEnds {
  a: PointModel;
  b: PointModel;
}

export interface SolidAxleLinksPlan {
  /** the left upper and lower links (the side-view instant centre) */
  upper: LinkEnds | null;
  lower: LinkEnds | null;
  /** the lateral rod (the roll centre) */
  rod: LinkEnds | null;
  /** both upper and both lower links, when each group has exactly two (the roll centre without a rod) */
  upperPair: [LinkEnds, LinkEnds] | null;
  lowerPair: [LinkEnds, LinkEnds] | null;
  /** the solid axle, if the sketch has one */
  axle: BodyModel | null;
  wheelLeft: PointModel;
  cgHeight: number;
  wheelbase: number;
}

export function solidAxleLinksPlanBuild(
  sketch: Sketch,
  points: Map<string, PointModel>,
  axle: BodyModel | null,
  wheelLeft: PointModel,
): SolidAxleLinksPlan {
  const ends = (m: { a: string; b: string } | null | undefined): LinkEnds | null =>
    m ? { a: points.get(m.a)!, b: points.get(m.b)! } : null;
  const pair = (group: 'upper' | 'lower'): [LinkEnds, LinkEnds] | null => {
    const g = sketch.members.filter((m) => m.kind === 'link' && m.group === group);
    return g.length === 2 ? [ends(g[0])!, ends(g[1])!] : null;
  };
  return {
    upper: ends(leftGroupLink(sketch, 'upper')),
    lower: ends(leftGroupLink(sketch, 'lower')),
    rod: ends(sketch.members.find((m) => m.kind === 'lateral-rod')),
    upperPair: pair('upper'),
    lowerPair: pair('lower'),
    axle,
    wheelLeft,
    cgHeight: sketch.vehicle.cgHeight,
    wheelbase: sketch.vehicle.wheelbase,
  };
}

/** The instant centre, anti-squat and roll-centre height of a heave row. */
export function solidAxleLinksHeaveFields(
  plan: SolidAxleLinksPlan,
  at: PlacePoint,
  solved: SolvedRow,
  clean: (v: number) => number,
): Pick<HeaveRow, 'instantCenter' | 'antiSquat' | 'rollCenterHeight'> {
  const axle = plan.axle;
  const wl = at(plan.wheelLeft);
  let instantCenter = null;
  let parallelSlope: number | null = null;
  if (plan.upper && plan.lower) {
    const u1 = at(plan.upper.a),
      u2 = at(plan.upper.b);
    const l1 = at(plan.lower.a),
      l2 = at(plan.lower.b);
    instantCenter = sideViewCrossing(u1, u2, l1, l2);
    if (!instantCenter && Math.abs(l2.x - l1.x) > 0) parallelSlope = (l2.z - l1.z) / (l2.x - l1.x);
  }
  const cp = { x: wl.x, z: solved.travel };
  const antiSquat =
    plan.upper && plan.lower ? antiSquatPercent(instantCenter, cp, plan.cgHeight, plan.wheelbase, parallelSlope) : null;

  let rollCenterHeight: number | null = null;
  if (plan.rod) rollCenterHeight = rollCenterFromRod(at(plan.rod.a), at(plan.rod.b));
  else if (plan.upperPair && plan.lowerPair && axle) {
    const seg = (p: LinkEnds): [Vec3, Vec3] => [at(p.a), at(p.b)];
    const refX = axle.reference.x + solved.state[axle.slot * POSE_SIZE];
    rollCenterHeight = rollCenterFromLinkPairs(
      [seg(plan.upperPair[0]), seg(plan.upperPair[1])],
      [seg(plan.lowerPair[0]), seg(plan.lowerPair[1])],
      refX,
    );
  }
  return {
    instantCenter: instantCenter ? { x: clean(instantCenter.x), z: clean(instantCenter.z) } : null,
    antiSquat: antiSquat === null ? null : clean(antiSquat),
    rollCenterHeight: rollCenterHeight === null ? null : clean(rollCenterHeight),
  };
}
