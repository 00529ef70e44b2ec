/**
 * The brackets of a line-up: which frame pivots of the variants compared one frame bracket can
 * serve, matched by position, whatever the pivots' ids and the variants' layouts (a leaf-spring
 * hanger and a four-link's lower link may well sit on one bracket). Pure geometry on the sketches
 * as given (mm, each on the sketch file's axes, which the variants of one frame share), no sweep involved.
 *
 * How pivots become brackets (deterministic, the same answer for the same line-up):
 * greedy agglomeration by distance with complete linkage. Every pair of pivots from two different
 * variants that lie within the tolerance is taken in order of distance (closest first; ties in
 * the order of the variants, then of each sketch's points), and the two pivots' brackets are
 * joined when (1) no variant would then have two pivots on one bracket and (2) every two pivots
 * of the joined bracket are still within the tolerance of each other.
 * Why not the plain connected components within the tolerance: they chain. Pivots A, B, C with
 * A–B and B–C 8 mm apart but A–C 16 mm apart, at a 10 mm tolerance, would make one "bracket"
 * whose ends are 16 mm apart, which no one bracket hole serves. Here the closer pair shares a
 * bracket and the third pivot stays alone, reported as a near miss when it is close enough.
 * So every bracket holds at most one pivot of each variant, and its spread never exceeds the tolerance.
 */
import { vecDistance, type Vec3 } from '../vec3';
import type { Mm } from '../units';
import type { FramePivot } from './framePivots';

/** mm: frame pivots of two variants at most this far apart can share a bracket, until the user sets another. */
export const DEFAULT_BRACKET_TOLERANCE_MM = 10;
/** mm: the tolerance the user may set (a hole's slop at the low end, a whole bracket's width at the high end). */
export const MIN_BRACKET_TOLERANCE_MM = 0.1;
export const MAX_BRACKET_TOLERANCE_MM = 100;
/** Pivots further apart than the tolerance, but within this many times it, are near misses. */
export const NEAR_MISS_FACTOR = 3;
/** mm: distances are compared with this much slack, so a pivot placed exactly at the tolerance counts as within it. */
const SLACK_MM = 1e-6;

/** One variant's frame pivot, with the variant's place in the line-up (0-based). */
export interface VariantPivot extends FramePivot {
  variant: number;
}

export type BracketShare =
  /** every variant compared has a pivot on it */
  | 'common'
  /** more than one variant, not all */
  | 'subset'
  /** one variant only */
  | 'unique';

export interface Bracket {
  /** one pivot per variant on it, in the line-up's order */
  pivots: VariantPivot[];
  /** the variants on it, in the line-up's order */
  variants: number[];
  share: BracketShare;
  /** mm: the mean of its pivots' positions */
  at: Vec3;
  /** mm: the largest distance between two of its pivots (0 for one pivot); never over the tolerance */
  spread: Mm;
}

/**
 * Two pivots on different brackets that are over the tolerance apart but within NEAR_MISS_FACTOR
 * times it: moving `move` by `by` straight towards `to` brings it within the tolerance of every
 * pivot on `to`'s bracket, and it can join that bracket.
 */
export interface NearMiss {
  move: VariantPivot;
  to: VariantPivot;
  /** mm, the two pivots' distance */
  apart: Mm;
  /** mm, how far `move` must go towards `to`: apart − tolerance */
  by: Mm;
}

export interface BracketMatch {
  /** mm */
  tolerance: Mm;
  /** the variants compared (their places in the line-up) */
  variants: number[];
  /** common ones first, then those a subset shares (more variants first), then those one variant needs */
  brackets: Bracket[];
  /** the smallest move for each pair of brackets that one move can join, smallest first */
  nearMisses: NearMiss[];
  /** per variant compared, in order: its brackets not common to all, and of those the ones it alone needs */
  perVariant: { variant: number; beyondCommon: number; own: number }[];
}

const within = (d: Mm, tolerance: Mm) => d <= tolerance + SLACK_MM;

/**
 * Matches the frame pivots of the variants by position. `pivots[k]` are the frame pivots of the
 * line-up's variant `variants[k]` (framePivots); `tolerance` in mm.
 */
export function matchBrackets(
  pivots: readonly (readonly FramePivot[])[],
  tolerance: Mm = DEFAULT_BRACKET_TOLERANCE_MM,
  variants: readonly number[] = pivots.map((_, k) => k),
): BracketMatch {
  const all: VariantPivot[] = pivots.flatMap((list, k) => list.map((p) => ({ ...p, variant: variants[k] })));
  // Each pivot's bracket, as an index into `groups`; pivots listed in the line-up's order.
  const groupOf = all.map((_, i) => i);
  const groups: number[][] = all.map((_, i) => [i]);
  const dist = (i: number, j: number) => vecDistance(all[i].at, all[j].at);

  const pairs: { i: number; j: number; d: Mm }[] = [];
  for (let i = 0; i < all.length; i++)
    for (let j = i + 1; j < all.length; j++) {
      if (all[i].variant === all[j].variant) continue;
      const d = dist(i, j);
      if (within(d, tolerance)) pairs.push({ i, j, d });
    }
  // A stable sort: equal distances keep the order the pivots were listed in.
  pairs.sort((a, b) => a.d - b.d);
  for (const { i, j } of pairs) {
    const [gi, gj] = [groupOf[i], groupOf[j]];
    if (gi === gj) continue;
    const a = groups[gi];
    const b = groups[gj];
    const onA = new Set(a.map((k) => all[k].variant));
    if (b.some((k) => onA.has(all[k].variant))) continue;
    if (!a.every((x) => b.every((y) => within(dist(x, y), tolerance)))) continue;
    a.push(...b);
    for (const k of b) groupOf[k] = gi;
    groups[gj] = [];
  }

  const n = variants.length;
  const brackets: Bracket[] = groups
    .filter((g) => g.length > 0)
    .map((g) => {
      const on = g.map((k) => all[k]).sort((p, q) => variants.indexOf(p.variant) - variants.indexOf(q.variant));
      let spread = 0;
      for (const p of on) for (const q of on) spread = Math.max(spread, vecDistance(p.at, q.at));
      const mean = (axis: keyof Vec3) => on.reduce((s, p) => s + p.at[axis], 0) / on.length;
      return {
        pivots: on,
        variants: on.map((p) => p.variant),
        share: on.length === n && n > 1 ? 'common' : on.length > 1 ? 'subset' : 'unique',
        at: { x: mean('x'), y: mean('y'), z: mean('z') },
        spread,
      } satisfies Bracket;
    });
  // Common first, then shared by more variants, then (stably) as the pivots were listed.
  brackets.sort((p, q) => q.pivots.length - p.pivots.length);

  const bracketOf = new Map<VariantPivot, Bracket>();
  for (const b of brackets) for (const p of b.pivots) bracketOf.set(p, b);
  const nearMisses = findNearMisses(brackets, bracketOf, tolerance);

  const perVariant = variants.map((variant) => {
    const mine = brackets.filter((b) => b.variants.includes(variant) && b.share !== 'common');
    return { variant, beyondCommon: mine.length, own: mine.filter((b) => b.share === 'unique').length };
  });
  return { tolerance, variants: [...variants], brackets, nearMisses, perVariant };
}

/** Where `p` ends up moved `by` mm straight towards `q`. */
function movedTowards(p: Vec3, q: Vec3, by: Mm): Vec3 {
  const d = vecDistance(p, q);
  const f = by / d;
  return { x: p.x + (q.x - p.x) * f, y: p.y + (q.y - p.y) * f, z: p.z + (q.z - p.z) * f };
}

/**
 * The near misses. For two pivots of different variants on different brackets, over the tolerance
 * apart and within NEAR_MISS_FACTOR times it, one may move by (distance − tolerance) towards the other,
 * the least that brings the pair within the tolerance. The move is offered only when it lets the
 * pivot join the other's bracket (its variant not on it yet, and the moved pivot within the tolerance
 * of every pivot there), and only for a pivot alone on its bracket: moving a pivot off a shared bracket
 * would lose one share to win another. When both pivots could move, the later variant's does.
 * One near miss per pair of brackets: the smallest move.
 */
function findNearMisses(brackets: Bracket[], bracketOf: Map<VariantPivot, Bracket>, tolerance: Mm): NearMiss[] {
  const all = brackets.flatMap((b) => b.pivots);
  const joins = (move: VariantPivot, to: VariantPivot, by: Mm): boolean => {
    const target = bracketOf.get(to)!;
    if (bracketOf.get(move)!.pivots.length > 1 || target.variants.includes(move.variant)) return false;
    const moved = movedTowards(move.at, to.at, by);
    return target.pivots.every((p) => within(vecDistance(moved, p.at), tolerance));
  };
  const best = new Map<string, NearMiss>();
  for (let i = 0; i < all.length; i++)
    for (let j = i + 1; j < all.length; j++) {
      const [p, q] = [all[i], all[j]];
      const [bp, bq] = [bracketOf.get(p)!, bracketOf.get(q)!];
      if (p.variant === q.variant || bp === bq) continue;
      const apart = vecDistance(p.at, q.at);
      if (within(apart, tolerance) || !within(apart, NEAR_MISS_FACTOR * tolerance)) continue;
      const by = apart - tolerance;
      // The later variant's pivot tries first, then the earlier one's.
      const [later, earlier] = q.variant > p.variant ? [q, p] : [p, q];
      const order: [VariantPivot, VariantPivot][] = [
        [later, earlier],
        [earlier, later],
      ];
      const found = order.find(([m, t]) => joins(m, t, by));
      if (!found) continue;
      const key = [brackets.indexOf(bp), brackets.indexOf(bq)].sort((a, b) => a - b).join(':');
      const old = best.get(key);
      if (!old || by < old.by) best.set(key, { move: found[0], to: found[1], apart, by });
    }
  return [...best.values()].sort((a, b) => a.by - b.by);
}
