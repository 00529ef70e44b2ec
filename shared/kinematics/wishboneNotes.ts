/**
 * Plain-sentence notes for a double-wishbone sweep (they go into the result's `warnings`):
 * - a knuckle carrying a wheel without both wishbones (no front-view construction);
 * - bump steer that is large, with where the tie rod's inner end should be. The tie rod should
 *   lie on the line from its outer end through the front-view instant centre, with its inner
 *   end on the line through the wishbones' inner pivot axes (front view): then it swings
 *   about the same centre as the knuckle and the wheel does not steer as it moves. Common
 *   practice, no published source.
 */
import type { LinkageModel } from './model';
import { wheelAttitude } from './metrics/wheel';
import { linesCrossing, patchLine, type ViewPoint } from './metrics/wishbonePlanes';
import type { HeaveRow } from './types';
import type { Vec3 } from './vec';
import { knuckleCarrying, type WishboneArm, type WishbonePlan, type WishboneSide } from './wishbone';
import { wishboneView } from './wishboneRows';

/** Bump steer is read over this much travel either side of ride (mm). */
export const BUMP_STEER_WINDOW_MM = 50;
/** Toe change (deg) within the window above which the note appears. Common practice, no published source. */
export const BUMP_STEER_NOTE_DEG = 0.25;
/** A suggested inner-end move longer than this (mm) means the construction does not apply (arms far from the usual shape). */
export const TIE_ROD_SUGGESTION_LIMIT_MM = 500;
/** An inner pivot axis closer than this (mm) to perpendicular to x has no piercing point: its midpoint stands for it. */
const AXIS_RUN_EPSILON_MM = 1e-6;

const mm = (v: number) => `${Math.round(v)} mm`;

/** Where a wishbone's inner pivot axis pierces the cross plane x = `x` (front view, mm). */
function axisPierce(arm: WishboneArm, x: number): ViewPoint {
  const [p, q] = arm.inner.map((i) => i.ride);
  const run = q.x - p.x;
  if (Math.abs(run) < AXIS_RUN_EPSILON_MM) return { u: (p.y + q.y) / 2, v: (p.z + q.z) / 2 };
  const t = (x - p.x) / run;
  return { u: p.y + t * (q.y - p.y), v: p.z + t * (q.z - p.z) };
}

/** The inner-end position (front view, at the rod's own x) the wishbones ask for, at ride; null when the construction fails. */
export function tieRodInnerTarget(s: WishboneSide): ViewPoint | null {
  if (!s.tieRod) return null;
  const outer = s.tieRod.outer.ride;
  const inner = s.tieRod.inner.ride;
  const fv = wishboneView(s, (p) => p.ride, 'x');
  const toIc = patchLine({ u: outer.y, v: outer.z }, fv.ic, fv.parallel);
  const pu = axisPierce(s.upper, inner.x);
  const pl = axisPierce(s.lower, inner.x);
  const len = Math.hypot(pl.u - pu.u, pl.v - pu.v);
  if (!toIc || !(len > 0)) return null;
  return linesCrossing(toIc, { point: pu, direction: { u: (pl.u - pu.u) / len, v: (pl.v - pu.v) / len } });
}

function bumpSteer(s: WishboneSide, heave: HeaveRow[]): number {
  let worst = 0;
  for (const row of heave) {
    if (Math.abs(row.travel) > BUMP_STEER_WINDOW_MM) continue;
    const pose = row.bodies[s.body.id];
    if (!pose) continue;
    const toe = wheelAttitude(pose, s.body.reference, s.wheel.ride, s.side).toeChange;
    if (Math.abs(toe) > Math.abs(worst)) worst = toe;
  }
  return worst;
}

function bumpSteerNote(s: WishboneSide, heave: HeaveRow[]): string | null {
  if (!s.tieRod) return null;
  const worst = bumpSteer(s, heave);
  if (!(Math.abs(worst) > BUMP_STEER_NOTE_DEG)) return null;
  const { member, inner, outer } = s.tieRod;
  const head =
    `Bump steer: the ${s.side} wheel's toe changes by up to ${worst.toFixed(2)}° within ±${BUMP_STEER_WINDOW_MM} mm of ride ` +
    `(tie rod ${member}).`;
  const target = tieRodInnerTarget(s);
  const now: Vec3 = inner.ride;
  if (!target || Math.hypot(target.u - now.y, target.v - now.z) > TIE_ROD_SUGGESTION_LIMIT_MM) {
    return `${head} Put the tie rod on the line from its outer end through the front-view instant centre.`;
  }
  const o = outer.ride;
  const lengthNow = Math.hypot(o.x - now.x, o.y - now.y, o.z - now.z);
  const lengthThen = Math.hypot(o.x - now.x, o.y - target.u, o.z - target.v);
  const dz = target.v - now.z;
  const dl = lengthThen - lengthNow;
  return (
    `${head} The wishbones ask for its inner end on the line from its outer end through the front-view instant centre, ` +
    `at about y ${mm(target.u)}, z ${mm(target.v)} (now y ${mm(now.y)}, z ${mm(now.z)}): ` +
    `${dz >= 0 ? 'raise' : 'lower'} it ${mm(Math.abs(dz))} and make the rod ${mm(Math.abs(dl))} ${dl >= 0 ? 'longer' : 'shorter'}.`
  );
}

/** Notes for the result's warnings list. */
export function wishboneNotes(model: LinkageModel, plan: WishbonePlan | null, heave: HeaveRow[]): string[] {
  const out: string[] = [];
  for (const sideName of ['left', 'right'] as const) {
    const knuckle = knuckleCarrying(model, sideName);
    const found = plan && (sideName === 'left' ? plan.left : plan.right);
    if (knuckle && !found) {
      out.push(
        `The ${knuckle.id} has no upper and lower wishbone (two upper and two lower links from the frame, each pair to one ball joint): ` +
          'no front-view instant centre, roll centre, kingpin or anti-dive for it.',
      );
    }
  }
  if (plan) {
    for (const s of [plan.left, plan.right]) {
      const note = s && bumpSteerNote(s, heave);
      if (note) out.push(note);
    }
  }
  return out;
}
