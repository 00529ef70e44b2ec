/**
 * Poses solved inside the reference tests, independently of the sweep's solver: a general-purpose
 * Gauss–Newton least-squares search (ml-matrix QR on a central-difference Jacobian) over residuals written
 * here from the sketch's hardpoints only. Nothing here imports the sweep's model, residuals or metrics.
 *
 * Rotation convention (docs/sketch-format.md; ISO 8855, from memory, unverified): R = Rz(yaw)·Ry(pitch)·Rx(roll)
 * about a body's reference point; roll positive lifts the left side, pitch positive drops the nose, yaw
 * positive turns the nose left.
 *
 * - A solid axle: the midpoint of the wheel centres is its reference point; its z (the travel) and roll are
 *   imposed, x, y, pitch and yaw are free; every link and lateral rod keeps its ride length.
 * - A double-wishbone knuckle: its wheel centre is its reference point; its z is imposed, the other five
 *   coordinates free; each ball joint keeps its distance from both inner pivots of its wishbone (two links, or
 *   an arm body's hinge, the joint then at the arm's point, which the knuckle carries), and the tie rod its length.
 * - A trailing arm: one angle about its hinge axis (Rodrigues' rotation formula), set so the wheel centre
 *   reaches the travel.
 */
import type { Sketch, SketchPoint } from '../../shared/schema/sketch';
import {
  add,
  DEG,
  gaussNewton as solveLeastSquares,
  rodrigues as turnBy,
  rotateIso,
  scale,
  sub,
  type V3,
} from './rigidPose';

export type { V3 };
export { DEG };

export const dist = (a: V3, b: V3) => Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
export const xyzOf = (p: SketchPoint): V3 => [p.x, p.y, p.z];

/** v turned by R = Rz(yaw)·Ry(pitch)·Rx(roll) (rad). */
export const rotate = rotateIso;

/** Rodrigues' rotation of v by θ (rad) about the unit axis u: v·cosθ + (u × v)·sinθ + u·(u·v)·(1 − cosθ). */
export const rodrigues = (u: V3, v: V3, theta: number): V3 => turnBy(scale(u, theta), v);

export interface LeastSquares {
  q: number[];
  /** the residuals at q (mm) */
  residuals: number[];
  /** mm, the largest absolute residual left */
  worst: number;
}

/**
 * Gauss–Newton least squares (rigidPose.ts) with the residuals left at the answer: stops when the step is below
 * `stepTol` or after `iterations`.
 */
export function gaussNewton(
  residuals: (q: number[]) => number[],
  start: number[],
  { iterations = 200, stepTol = 1e-12 } = {},
): LeastSquares {
  const q = solveLeastSquares(residuals, start, { h: 1e-6, stepTolerance: stepTol, maxIterations: iterations });
  const r = residuals(q);
  return { q, residuals: r, worst: Math.max(...r.map(Math.abs)) };
}

/** Ride positions by id. */
function pointMap(sketch: Sketch) {
  const m = new Map(sketch.points.map((p) => [p.id, p]));
  return (id: string) => m.get(id)!;
}

// ——— Solid axle ———

/** A solid axle's links (frame end, axle end relative to the reference point, ride length) from the hardpoints. */
export function axleRig(sketch: Sketch) {
  const at = pointMap(sketch);
  const wl = xyzOf(at(sketch.wheels.left)),
    wr = xyzOf(at(sketch.wheels.right));
  const ref: V3 = [(wl[0] + wr[0]) / 2, (wl[1] + wr[1]) / 2, (wl[2] + wr[2]) / 2];
  const links = sketch.members
    .filter((m) => m.kind === 'link' || m.kind === 'lateral-rod')
    .map((m) => {
      const [a, b] = [at(m.a), at(m.b)];
      const [frame, axle] = a.body === 'frame' ? [a, b] : [b, a];
      if (frame.body !== 'frame' || axle.body !== 'axle') throw new Error(`${m.id} is not frame to axle`);
      return { id: m.id, F: xyzOf(frame), local: sub(xyzOf(axle), ref), L: dist(xyzOf(a), xyzOf(b)) };
    });
  return { ref, links };
}
export type AxleRig = ReturnType<typeof axleRig>;

/** Axle pose: q = [x, y, pitch, yaw] (mm, rad) with the travel (mm) and roll (rad) imposed. */
export interface AxlePose {
  travel: number;
  roll: number;
  q: number[];
  /** mm, the largest link-length residual left (the bind) */
  worst: number;
  residuals: number[];
}

/** Where a ride point `p` (frame coordinates at ride) of the axle is in the pose. */
export function axlePlace(rig: AxleRig, pose: AxlePose, p: V3): V3 {
  const r = rotate(pose.roll, pose.q[2], pose.q[3], sub(p, rig.ref));
  return add(add(rig.ref, [pose.q[0], pose.q[1], pose.travel]), r);
}

function axleResiduals(rig: AxleRig, q: number[], travel: number, roll: number): number[] {
  const pose = { travel, roll, q, worst: 0, residuals: [] };
  return rig.links.map(({ F, local, L }) => dist(axlePlace(rig, pose, add(rig.ref, local)), F) - L);
}

export function axleSolve(rig: AxleRig, travel: number, roll: number, start = [0, 0, 0, 0]): AxlePose {
  const s = gaussNewton((q) => axleResiduals(rig, q, travel, roll), start);
  return { travel, roll, q: s.q, worst: s.worst, residuals: s.residuals };
}

/**
 * The axle at (travel, roll), reached from ride in steps of at most 10 mm and 1° (each solve starting from the
 * last, to stay on the linkage's branch).
 */
export function axleAt(rig: AxleRig, travel: number, roll = 0): AxlePose {
  const steps = Math.max(1, Math.ceil(Math.abs(travel) / 10), Math.ceil(Math.abs(roll) / DEG));
  let pose = axleSolve(rig, 0, 0);
  for (let k = 1; k <= steps; k++) pose = axleSolve(rig, (travel * k) / steps, (roll * k) / steps, pose.q);
  return pose;
}

// ——— Double-wishbone knuckle ———

/** The left or right knuckle's constraints from the hardpoints: each a frame point, a knuckle point and a length. */
export function knuckleRig(sketch: Sketch, side: 'left' | 'right') {
  const at = pointMap(sketch);
  const knuckle = `knuckle-${side}`;
  const wc = xyzOf(at(side === 'left' ? sketch.wheels.left : sketch.wheels.right));
  const rods: { F: V3; K: V3; L: number }[] = [];
  const tie = (f: SketchPoint, k: SketchPoint) => rods.push({ F: xyzOf(f), K: xyzOf(k), L: dist(xyzOf(f), xyzOf(k)) });
  for (const m of sketch.members) {
    const a = at(m.a),
      b = at(m.b);
    if ((m.kind === 'link' || m.kind === 'tie-rod') && a.body === 'frame' && b.body === knuckle) tie(a, b);
    if ((m.kind === 'link' || m.kind === 'tie-rod') && b.body === 'frame' && a.body === knuckle) tie(b, a);
    if (m.kind === 'ball-joint' && b.body === knuckle) {
      // An arm body: the joint is at the arm's point `a` (docs/sketch-format.md: the knuckle is held at `a`), the
      // knuckle carrying that place; it stays at its ride distance from both frame pivots of the arm's hinge.
      const hinge = sketch.members.find((h) => h.kind === 'hinge' && h.body === a.body)!;
      tie(at(hinge.a), a);
      tie(at(hinge.b), a);
    }
  }
  return { wc, rods, side };
}
export type KnuckleRig = ReturnType<typeof knuckleRig>;

/** Knuckle pose: q = [x, y, roll, pitch, yaw] (mm, rad) about the wheel centre, its z the travel (mm). */
export interface KnucklePose {
  travel: number;
  q: number[];
  worst: number;
}

export function knucklePlace(rig: KnuckleRig, pose: KnucklePose, p: V3): V3 {
  const [x, y, roll, pitch, yaw] = pose.q;
  return add(add(rig.wc, [x, y, pose.travel]), rotate(roll, pitch, yaw, sub(p, rig.wc)));
}

function knuckleResiduals(rig: KnuckleRig, q: number[], travel: number): number[] {
  const pose = { travel, q, worst: 0 };
  return rig.rods.map(({ F, K, L }) => dist(knucklePlace(rig, pose, K), F) - L);
}

/** The knuckle with its wheel centre `travel` mm above ride, reached in steps of at most 10 mm. */
export function knuckleAt(rig: KnuckleRig, travel: number): KnucklePose {
  const steps = Math.max(1, Math.ceil(Math.abs(travel) / 10));
  let q = [0, 0, 0, 0, 0],
    worst = 0;
  for (let k = 1; k <= steps; k++) {
    const s = gaussNewton((v) => knuckleResiduals(rig, v, (travel * k) / steps), q);
    q = s.q;
    worst = s.worst;
  }
  return { travel, q, worst };
}

// ——— Trailing arm ———

/** The arm carrying `wheel` turned about its hinge so that the wheel centre is `travel` mm above ride. */
export function armAt(sketch: Sketch, wheel: string, travel: number) {
  const at = pointMap(sketch);
  const w = at(wheel);
  const hinge = sketch.members.find((m) => m.kind === 'hinge' && m.body === w.body)!;
  const a = xyzOf(at(hinge.a)),
    b = xyzOf(at(hinge.b));
  const len = dist(a, b);
  const u = sub(b, a).map((c) => c / len) as V3;
  const place = (theta: number, p: V3) => add(a, rodrigues(u, sub(p, a), theta));
  const s = gaussNewton((q) => [place(q[0], xyzOf(w))[2] - (w.z + travel)], [0]);
  return { theta: s.q[0], worst: s.worst, place: (p: V3) => place(s.q[0], p), axis: u };
}

/** Every frame and axle point of the sketch with the axle at `pose`, by id (mm). */
export function axlePoints(
  sketch: Sketch,
  rig: AxleRig,
  pose: AxlePose,
): Record<string, { x: number; y: number; z: number }> {
  const out: Record<string, { x: number; y: number; z: number }> = {};
  for (const p of sketch.points) {
    if (p.body !== 'frame' && p.body !== 'axle') continue;
    const [x, y, z] = p.body === 'frame' ? xyzOf(p) : axlePlace(rig, pose, xyzOf(p));
    out[p.id] = { x, y, z };
  }
  return out;
}
