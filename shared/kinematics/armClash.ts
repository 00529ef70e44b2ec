/**
 * A shock or spring whose line passes through a wishbone arm (an arm body's triangle: its two frame pivots and
 * its ball joint) at some row: the `arm-clash` flag, at the first row of each outward march where it does.
 * A member with an end on the arm is mounted on it and not checked against that arm.
 */
import type { Sketch } from '../schema/sketch';
import { wishboneArmBodyIds, type WishboneArmBodyId } from '../schema/sketchVocabulary';
import { outward, param, whereText, type Row, type SweepKind } from './crossings';
import { pointsAt } from './points';
import type { SweepEvent } from './types';
import { vecCross, vecDot, vecSub, type Vec3 } from './vec';

/** Relative tolerance of the crossing test (barycentric and segment parameters); round-off only. */
const CROSSING_EPSILON = 1e-12;

/**
 * True when the segment p→q crosses the triangle (a, b, c), edges and ends included
 * (Möller–Trumbore ray–triangle test, J. Graphics Tools 2(1), 1997, limited to the segment).
 */
export function segmentCrossesTriangle(p: Vec3, q: Vec3, a: Vec3, b: Vec3, c: Vec3): boolean {
  const dir = vecSub(q, p);
  const e1 = vecSub(b, a);
  const e2 = vecSub(c, a);
  const h = vecCross(dir, e2);
  const det = vecDot(e1, h);
  // A segment in the triangle's plane does not pass through it (it can only graze it).
  if (Math.abs(det) < CROSSING_EPSILON * vecDot(dir, dir) * Math.sqrt(vecDot(e1, e1) * vecDot(e2, e2))) return false;
  const s = vecSub(p, a);
  const u = vecDot(s, h) / det;
  if (u < -CROSSING_EPSILON || u > 1 + CROSSING_EPSILON) return false;
  const k = vecCross(s, e1);
  const v = vecDot(dir, k) / det;
  if (v < -CROSSING_EPSILON || u + v > 1 + CROSSING_EPSILON) return false;
  const t = vecDot(e2, k) / det;
  return t >= -CROSSING_EPSILON && t <= 1 + CROSSING_EPSILON;
}

interface ArmTriangle {
  body: WishboneArmBodyId;
  pivots: [string, string];
  joint: string;
}

function armTriangles(sketch: Sketch): ArmTriangle[] {
  const bodyOf = new Map(sketch.points.map((p) => [p.id, p.body]));
  const out: ArmTriangle[] = [];
  for (const body of wishboneArmBodyIds) {
    const hinge = sketch.members.find((m) => m.kind === 'hinge' && m.body === body);
    const ball = sketch.members.find((m) => m.kind === 'ball-joint' && bodyOf.get(m.a) === body);
    if (hinge && ball) out.push({ body, pivots: [hinge.a, hinge.b], joint: ball.a });
  }
  return out;
}

/** The `arm-clash` events of one sweep (`rows` in the sweep's order, ride among them). */
export function armClashEvents(sketch: Sketch, kind: SweepKind, rows: Row[]): SweepEvent[] {
  const arms = armTriangles(sketch);
  if (arms.length === 0) return [];
  const bodyOf = new Map(sketch.points.map((p) => [p.id, p.body]));
  const checks = sketch.members
    .filter((m) => m.kind === 'shock' || m.kind === 'spring')
    .flatMap((m) =>
      arms.filter((arm) => bodyOf.get(m.a) !== arm.body && bodyOf.get(m.b) !== arm.body).map((arm) => ({ m, arm })),
    );
  if (checks.length === 0) return [];
  const events: SweepEvent[] = [];
  const seen = new Set<string>();
  for (const march of outward(rows)) {
    const found = new Set<string>();
    for (const row of march) {
      const at = pointsAt(sketch, row.bodies);
      for (const { m, arm } of checks) {
        const key = `${m.id}|${arm.body}`;
        if (found.has(key)) continue;
        if (!segmentCrossesTriangle(at[m.a], at[m.b], at[arm.pivots[0]], at[arm.pivots[1]], at[arm.joint])) continue;
        found.add(key);
        const start = param(row);
        // A clash already at ride shows on both marches; report it once.
        if (seen.has(`${key}|${start}`)) continue;
        seen.add(`${key}|${start}`);
        events.push({
          kind: 'arm-clash',
          sweep: kind,
          at: start,
          member: m.id,
          body: arm.body,
          message: `The ${m.kind} ${m.id} passes through the ${arm.body} ${whereText(kind, start)}.`,
        });
      }
    }
  }
  return events;
}
