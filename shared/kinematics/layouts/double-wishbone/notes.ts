/**
 * Plain-sentence notes for a double-wishbone sweep (they go into the result's `warnings`):
 * - a knuckle carrying a wheel without both wishbones (no front-view construction);
 * - bump steer that is large, with where the tie rod's inner end should be. The tie rod should
 *   lie on the line from its outer end through the front-view instant centre (then it swings
 *   about the same centre as the knuckle and the wheel does not steer as it first moves; common
 *   practice, no published source), and be as long as keeps the wheel straight further out:
 *   the inner end the note gives is the centre of the steering arm's path with the wheel held
 *   straight, through ride and the two ends of the ±50 mm window (plain geometry).
 */
import type { LinkageModel } from '../../model';
import { outwardAxis, toeOfAxis, wheelAttitude } from '../../metrics/wheel';
import { poseApply } from '../../pose';
import type { HeaveRow, Pose } from '../../types';
import { vec, vecAdd, vecCross, vecDistance, vecDot, vecLength, vecScale, vecSub, type Vec3 } from '../../vec';
import { knuckleCarrying, type WishbonePlan, type WishboneSide } from './plan';

/** Bump steer is read over this much travel either side of ride (mm). */
export const BUMP_STEER_WINDOW_MM = 50;
/** Toe change (deg) within the window above which the note appears. Common practice, no published source. */
export const BUMP_STEER_NOTE_DEG = 0.25;
/** A suggested inner-end move longer than this (mm) means the construction does not apply (arms far from the usual shape). */
export const TIE_ROD_SUGGESTION_LIMIT_MM = 500;

const mm = (v: number) => `${Math.round(v)} mm`;

/** Newton steps for the zero-steer turn of a knuckle about its kingpin axis (each gains many digits; 6 is ample). */
const ZERO_STEER_ITERATIONS = 6;
/** rad: step of the numerical derivative of toe with the kingpin turn. */
const ZERO_STEER_DIFF_RAD = 1e-6;

/** `p` turned by `angle` (rad) about the axis through `o` along the unit vector `k` (Rodrigues' formula). */
function turnAbout(p: Vec3, o: Vec3, k: Vec3, angle: number): Vec3 {
  const v = vecSub(p, o);
  const c = Math.cos(angle),
    s = Math.sin(angle);
  const kxv = vecCross(k, v);
  const kv = vecDot(k, v);
  return vecAdd(o, vecAdd(vecAdd(vecScale(v, c), vecScale(kxv, s)), vecScale(k, kv * (1 - c))));
}

/**
 * The steering arm's outer end at a heave row with the wheel held straight (zero toe): the row's
 * knuckle turned back about its kingpin axis (the ball joints' line, its only freedom once both
 * joints are placed) until the spin axis has no toe.
 */
function outerEndWithoutSteer(s: WishboneSide, pose: Pose): Vec3 | null {
  const ref = s.body.reference;
  const place = (p: Vec3) => poseApply(pose, ref, p);
  const lower = place(s.lower.joint.ride),
    upper = place(s.upper.joint.ride);
  const axis = vecSub(upper, lower);
  const len = vecLength(axis);
  if (!(len > 0)) return null;
  const k = vecScale(axis, 1 / len);
  // The spin axis as a direction: the wheel centre and a point one unit outboard of it.
  const out = outwardAxis(s.side);
  const wc = place(s.wheel.ride);
  const tip = place(vecAdd(s.wheel.ride, out));
  const toeAt = (a: number) => toeOfAxis(vecSub(turnAbout(tip, lower, k, a), turnAbout(wc, lower, k, a)), s.side);
  let angle = 0;
  for (let i = 0; i < ZERO_STEER_ITERATIONS; i++) {
    const t = toeAt(angle);
    const slope = (toeAt(angle + ZERO_STEER_DIFF_RAD) - t) / ZERO_STEER_DIFF_RAD;
    if (!(Math.abs(slope) > 0)) return null;
    angle -= t / slope;
  }
  const outer = turnAbout(place(s.tieRod!.outer.ride), lower, k, angle);
  return Object.values(outer).every(Number.isFinite) ? outer : null;
}

/**
 * The inner-end position (mm, at the rack end's own fore-aft station) that keeps the wheel
 * straight at ride and at the outermost heave rows within ±BUMP_STEER_WINDOW_MM: the point
 * equally far from the steering arm's three zero-steer positions. It lies (to first order) on
 * the line from the outer end through the front-view instant centre. Null when the rows or the
 * geometry do not allow it.
 */
export function tieRodInnerIdeal(s: WishboneSide, heave: HeaveRow[]): Vec3 | null {
  if (!s.tieRod) return null;
  const within = heave.filter((r) => Math.abs(r.travel) <= BUMP_STEER_WINDOW_MM);
  const ends = [within[0], within[within.length - 1]];
  const ride = heave.find((r) => r.travel === 0);
  if (!ride || !ends[0] || !(ends[0].travel < 0) || !(ends[1].travel > 0)) return null;
  const at = [ends[0], ride, ends[1]].map((r) => {
    const pose = r.bodies[s.body.id];
    return pose ? outerEndWithoutSteer(s, pose) : null;
  });
  if (at.some((p) => !p)) return null;
  const [p1, p0, p2] = at as Vec3[];
  const X = s.tieRod.inner.ride.x;
  // |C − Pi|² equal for C = (X, y, z): two linear equations in y and z.
  const row = (p: Vec3) => ({
    a: 2 * (p.y - p0.y),
    b: 2 * (p.z - p0.z),
    c: vecDot(p, p) - vecDot(p0, p0) - 2 * X * (p.x - p0.x),
  });
  const e1 = row(p1),
    e2 = row(p2);
  const det = e1.a * e2.b - e2.a * e1.b;
  if (!(Math.abs(det) > 0)) return null;
  const y = (e1.c * e2.b - e2.c * e1.b) / det;
  const z = (e1.a * e2.c - e2.a * e1.c) / det;
  return Number.isFinite(y) && Number.isFinite(z) ? vec(X, y, z) : null;
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
  const target = tieRodInnerIdeal(s, heave);
  const now: Vec3 = inner.ride;
  if (!target || vecDistance(target, now) > TIE_ROD_SUGGESTION_LIMIT_MM) {
    return `${head} Put the tie rod on the line from its outer end through the front-view instant centre.`;
  }
  const lengthNow = vecDistance(outer.ride, now);
  const lengthThen = vecDistance(outer.ride, target);
  const dz = target.z - now.z;
  const dl = lengthThen - lengthNow;
  const height = Math.abs(dz) < 0.5 ? 'keep its height' : `${dz > 0 ? 'raise' : 'lower'} it ${mm(Math.abs(dz))}`;
  const length =
    Math.abs(dl) < 0.5 ? "keep the rod's length" : `make the rod ${mm(Math.abs(dl))} ${dl > 0 ? 'longer' : 'shorter'}`;
  return (
    `${head} The wishbones ask for its inner end at about y ${mm(target.y)}, z ${mm(target.z)} ` +
    `(on the line from its outer end through the front-view instant centre; now y ${mm(now.y)}, z ${mm(now.z)}): ` +
    `${height} and ${length}.`
  );
}

/** A ball joint's two points further apart than this (mm) are worth a note: below any drawing precision. */
export const BALL_JOINT_APART_MM = 0.5;

/**
 * A ball joint whose arm point and knuckle point are apart: the sweep puts the joint at the arm's point
 * (the knuckle's is its copy), so the knuckle's own point is not where the joint is and its readings would
 * mislead; the note says so and which point was used.
 */
function ballJointApartNotes(model: LinkageModel): string[] {
  const out: string[] = [];
  for (const m of model.sketch.members) {
    if (m.kind !== 'ball-joint') continue;
    const a = model.points.get(m.a),
      b = model.points.get(m.b);
    if (!a || !b) continue;
    const apart = vecDistance(a.ride, b.ride);
    if (apart > BALL_JOINT_APART_MM)
      out.push(
        `Ball joint ${m.id}: its arm point ${m.a} and knuckle point ${m.b} are ${apart.toFixed(1)} mm apart; ` +
          `the joint is taken at ${m.a}. Put ${m.b} on it.`,
      );
  }
  return out;
}

/** Notes for the result's warnings list. */
export function wishboneNotes(model: LinkageModel, plan: WishbonePlan | null, heave: HeaveRow[]): string[] {
  const out: string[] = ballJointApartNotes(model);
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
