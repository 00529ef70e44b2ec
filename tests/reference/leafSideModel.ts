/**
 * One leaf spring in side view, written from the SAE three-link description (SAE AE-11 Spring Design
 * Manual; Blundell & Harty, fig. 6.15 — docs/references.md, from memory, unverified): for an axle pitch
 * at a travel, the front link fixes the axle's fore-aft position (a circle about the front eye), the rear
 * eye is where the rear link's circle meets the shackle's (@flatten-js/core circle intersection), and the
 * spring settles at the pitch of least bending energy Σ k_i·ℓ_i²·sin²(bend_i), found by golden-section
 * search. Independent of the sweep's solver; shared by the leaf-spring reference tests.
 */
import Flatten from '@flatten-js/core';
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
  const ang = (p: P2, q: P2) => Math.atan2(q.z - p.z, q.x - p.x);
  // Pitch p (rad, positive drops the nose) about the reference point, then the translation.
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
    const E = { x: near.x, z: near.y };
    // A bend is the half's side-view turn relative to the block (the block turns by −pitch).
    const bendF = ang(A, F) - ang(A0, F) + pitch;
    const bendR = ang(B, E) - ang(B0, E0) + pitch;
    const energy = k1 * l1 * l1 * Math.sin(bendF) ** 2 + k2 * l2 * l2 * Math.sin(bendR) ** 2;
    return { X, A, B, E, energy };
  }
  function settle(travel: number) {
    let lo = -0.1,
      hi = 0.1;
    const g = (Math.sqrt(5) - 1) / 2;
    const e = (p: number) => close(travel, p)?.energy ?? Number.POSITIVE_INFINITY;
    for (let i = 0; i < 120; i++) {
      const c = hi - g * (hi - lo),
        d = lo + g * (hi - lo);
      if (e(c) < e(d)) hi = d;
      else lo = c;
    }
    const pitch = (lo + hi) / 2;
    return { pitch, ...close(travel, pitch)! };
  }
  return { F, H, S, A0, l1, l2, s, k1, k2, close, settle, frontCantilever: dist(F, S), rearCantilever: dist(E0, S) };
}
