/**
 * Readings of a solid axle located by links (the four-link, triangulated four-link and
 * three-link layouts share them), added to every heave row by rows.ts:
 * - the side-view instant centre where the left upper and lower links' lines cross, and from it
 *   (metrics/instantCenter.ts): at the rear, anti-squat under power and anti-lift in braking
 *   (metrics/antiSquat.ts, metrics/antiLift.ts); at the front (`vehicle.axle`), anti-dive in braking
 *   and, with a driveline, anti-lift under power (metrics/antiDive.ts, metrics/antiLift.ts);
 * - the roll-centre height from the lateral rod, else from the upper and lower link pairs
 *   (metrics/rollCenter.ts).
 * They come from the link groups and the rod wherever a sketch has them; the readers of the
 * other layouts that come later in the reading order replace them where their own apply.
 */
import type { Sketch } from '../../../schema/sketch';
import { DEFAULT_AXLE_END, DEFAULT_FRONT_BRAKE_SHARE_PERCENT, type AxleEnd } from '../../../schema/sketchVocabulary';
import { antiDivePercent } from '../../metrics/antiDive';
import { frontAntiLiftPowerPercent, rearAntiLiftBrakingPercent } from '../../metrics/antiLift';
import { antiSquatPercent } from '../../metrics/antiSquat';
import { leftGroupLink, sideViewCrossing } from '../../metrics/instantCenter';
import { rollCenterFromLinkPairs, rollCenterFromRod } from '../../metrics/rollCenter';
import type { SolvedRow } from '../../march';
import type { BodyModel, PointModel } from '../../model';
import { POSE_SIZE } from '../../pose';
import type { HeaveRow, SidePoint } from '../../types';
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
  /** which end the axle is (the file's, or rear) */
  axleEnd: AxleEnd;
  /** % of braking on the front axle (the file's, or the default) */
  frontBrakeShare: number;
  /** the sketch has a driveline (the axle is driven) */
  driven: boolean;
}

/** The side-view readings of one end of the vehicle. */
type EndFields = Pick<HeaveRow, 'antiSquat' | 'antiDive' | 'antiLift' | 'antiLiftBraking'>;

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
    axleEnd: sketch.vehicle.axle ?? DEFAULT_AXLE_END,
    frontBrakeShare: sketch.vehicle.frontBrakeShare ?? DEFAULT_FRONT_BRAKE_SHARE_PERCENT,
    driven: sketch.driveline !== undefined,
  };
}

/**
 * Anti-squat and anti-lift in braking at the rear; anti-dive and anti-lift under power at the front
 * (never anti-squat there). Null where the side view has no upper and lower link.
 */
function endFields(
  plan: SolidAxleLinksPlan,
  ic: SidePoint | null,
  cp: SidePoint,
  parallelSlope: number | null,
  clean: (v: number) => number,
): EndFields {
  const linked = plan.upper !== null && plan.lower !== null;
  const { cgHeight: h, wheelbase: l } = plan;
  const out = (v: number | null) => (linked && v !== null ? clean(v) : null);
  const antiSquat = () => out(antiSquatPercent(ic, cp, h, l, parallelSlope));
  // Without an axle body (arms, knuckles) the later readers give these, and a rear axle without links (leaf
  // springs) has none of them: only the anti-squat is kept, as before. A front axle always carries its own.
  if (!plan.axle || (!linked && plan.axleEnd === 'rear')) return { antiSquat: antiSquat() };
  if (plan.axleEnd === 'front') {
    return {
      antiSquat: null,
      antiDive: out(antiDivePercent(ic, cp, plan.frontBrakeShare, h, l, parallelSlope)),
      antiLift: plan.driven ? out(frontAntiLiftPowerPercent(ic, cp, h, l, parallelSlope)) : null,
    };
  }
  return {
    antiSquat: antiSquat(),
    antiLiftBraking: out(rearAntiLiftBrakingPercent(ic, cp, 100 - plan.frontBrakeShare, h, l, parallelSlope)),
  };
}

/** The instant centre, the side-view anti readings (endFields) and roll-centre height of a heave row. */
export function solidAxleLinksHeaveFields(
  plan: SolidAxleLinksPlan,
  at: PlacePoint,
  solved: SolvedRow,
  clean: (v: number) => number,
): Pick<HeaveRow, 'instantCenter' | 'rollCenterHeight'> & EndFields {
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
  const ends = endFields(plan, instantCenter, cp, parallelSlope, clean);

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
    ...ends,
    rollCenterHeight: rollCenterHeight === null ? null : clean(rollCenterHeight),
  };
}
