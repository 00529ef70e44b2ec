/**
 * One leaf spring in side view, for the leaf-spring reference tests, independent of the sweep's solver:
 * - its geometry from the SAE three-link description (SAE AE-11 Spring Design Manual; Blundell & Harty, fig.
 *   6.15 — docs/references.md, from memory, unverified): for an axle pitch at a travel, the front link fixes the
 *   axle's fore-aft position (a circle about the front eye), the rear eye is where the rear link's circle meets
 *   the shackle's (@flatten-js/core circle intersection);
 * - its stiffness as an Euler–Bernoulli beam: two beam elements clamped together at the seat, each pinned at its
 *   eye, solved by a general finite-element assembly with ml-matrix (element stiffness EI/L³·[12, 6L, −12, 6L;
 *   6L, 4L², −6L, 2L²; −12, −6L, 12, −6L; 6L, 2L², −6L, 4L²], D. L. Logan, A First Course in the Finite Element
 *   Method, ch. 4 — from memory, unverified). Each half's EI is set so that the half, clamped at the seat, has
 *   its `rate` at the eye: a cantilever's tip rate is 3EI/L³ (any strength-of-materials text).
 */
import Flatten from '@flatten-js/core';
import { Matrix, solve } from 'ml-matrix';
import type { Sketch } from '../../shared/schema/sketch';

export type P2 = { x: number; z: number };

/** One spring in side view, from the sketch's left-spring points. */
export function sideModel(sketch: Sketch) {
  const at = (id: string): P2 => {
    const p = sketch.points.find((q) => q.id === id)!;
    return { x: p.x, z: p.z };
  };
  const F = at('LF.l'),
    H = at('LH.l'),
    E0 = at('LE.l'),
    A0 = at('LA.l'),
    B0 = at('LB.l'),
    S = at('LS.l');
  const ref = { x: 0, z: sketch.vehicle.tireRadius };
  const dist = (p: P2, q: P2) => Math.hypot(p.x - q.x, p.z - q.z);
  const l1 = dist(F, A0),
    l2 = dist(E0, B0),
    s = dist(H, E0);
  const halves = sketch.members.filter((m) => m.kind === 'leaf-half' && m.seat === 'LS.l');
  const k1 = (halves.find((m) => m.a === 'LF.l') as { rate: number }).rate;
  const k2 = (halves.find((m) => m.a === 'LE.l') as { rate: number }).rate;
  /** A ride point of the axle at pitch p (rad, positive drops the nose) about the reference point, then moved. */
  const place = (p0: P2, pitch: number, X: number, travel: number): P2 => {
    const dx = p0.x - ref.x,
      dz = p0.z - ref.z;
    return {
      x: ref.x + X + dx * Math.cos(pitch) + dz * Math.sin(pitch),
      z: ref.z + travel - dx * Math.sin(pitch) + dz * Math.cos(pitch),
    };
  };
  /** The linkage at (travel, pitch): axle fore-aft X, pivots, rear eye; null when it cannot close. */
  function close(travel: number, pitch: number) {
    const a = place(A0, pitch, 0, travel);
    const h = l1 * l1 - (a.z - F.z) ** 2;
    if (h < 0) return null;
    const X = F.x - Math.sqrt(h) - a.x; // the pivot stays behind the front eye
    const A = place(A0, pitch, X, travel),
      B = place(B0, pitch, X, travel);
    const hits = new Flatten.Circle(new Flatten.Point(B.x, B.z), l2).intersect(
      new Flatten.Circle(new Flatten.Point(H.x, H.z), s),
    );
    if (hits.length === 0) return null;
    const near = hits.reduce((best, q) =>
      Math.hypot(q.x - E0.x, q.y - E0.z) < Math.hypot(best.x - E0.x, best.y - E0.z) ? q : best,
    );
    return { X, A, B, E: { x: near.x, z: near.y } };
  }
  return {
    F,
    H,
    S,
    A0,
    ref,
    l1,
    l2,
    s,
    k1,
    k2,
    place,
    close,
    frontCantilever: dist(F, S),
    rearCantilever: dist(E0, S),
  };
}

/** Beam element stiffness (Euler–Bernoulli), DOFs [w_i, θ_i, w_j, θ_j]; mm, N, rad. */
function element(EI: number, L: number): number[][] {
  const c = EI / L ** 3;
  return [
    [12 * c, 6 * L * c, -12 * c, 6 * L * c],
    [6 * L * c, 4 * L * L * c, -6 * L * c, 2 * L * L * c],
    [-12 * c, -6 * L * c, 12 * c, -6 * L * c],
    [6 * L * c, 2 * L * L * c, -6 * L * c, 4 * L * L * c],
  ];
}

/**
 * The spring as a beam from its rear eye (x = −L2) through the seat (x = 0) to its front eye (x = +L1), both eyes
 * pinned (no vertical movement, free to turn), the halves' vertical rates at their eyes k1 (front), k2 (rear).
 * Returns the seat's slope dw/dx (rad) per mm of seat rise when nothing turns it (the seat's pitch in heave, nose
 * up positive), and the moment (N·mm) per rad of seat turn with the seat held at its height (the wind-up rate).
 */
export function beamSeat(k1: number, L1: number, k2: number, L2: number) {
  // Global DOFs: 0 w_rear, 1 θ_rear, 2 w_seat, 3 θ_seat, 4 w_front, 5 θ_front.
  const K = Matrix.zeros(6, 6);
  const assemble = (k: number[][], dofs: number[]) =>
    dofs.forEach((gi, i) => dofs.forEach((gj, j) => K.set(gi, gj, K.get(gi, gj) + k[i][j])));
  assemble(element((k2 * L2 ** 3) / 3, L2), [0, 1, 2, 3]);
  assemble(element((k1 * L1 ** 3) / 3, L1), [2, 3, 4, 5]);
  /** Displacements with `imposed` DOFs set and the `free` ones unloaded. */
  const solveWith = (imposed: Record<number, number>, free: number[]) => {
    const fixed = Object.keys(imposed).map(Number);
    const Kff = new Matrix(free.map((i) => free.map((j) => K.get(i, j))));
    const rhs = Matrix.columnVector(free.map((i) => -fixed.reduce((acc, j) => acc + K.get(i, j) * imposed[j], 0)));
    const uf = solve(Kff, rhs).to1DArray();
    const u = new Array(6).fill(0);
    fixed.forEach((j) => (u[j] = imposed[j]));
    free.forEach((i, n) => (u[i] = uf[n]));
    return u;
  };
  const heave = solveWith({ 0: 0, 2: 1, 4: 0 }, [1, 3, 5]);
  const windUp = solveWith({ 0: 0, 2: 0, 3: 1, 4: 0 }, [1, 5]);
  const seatMoment = windUp.reduce((acc, v, j) => acc + K.get(3, j) * v, 0);
  return { slopePerMm: heave[3], windUpNmmPerRad: seatMoment };
}
