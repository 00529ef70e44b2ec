/**
 * The pieces the reference tests solve poses with, independently of the sweep's solver: plain 3-vectors,
 * Rodrigues' rotation formula, the ISO 8855 yaw–pitch–roll rotation R = Rz(yaw)·Ry(pitch)·Rx(roll) (ISO 8855,
 * from memory, unverified), Gauss–Newton least squares with a central-difference Jacobian and ml-matrix's QR,
 * and a wheel's heading from its spin axis. Shared by every reference test that solves a pose (independentPose.ts builds
 * its axle, knuckle and arm rigs on them).
 */
import { Matrix, QR } from 'ml-matrix';

export type V3 = [number, number, number];
export const DEG = Math.PI / 180;

export const sub = (a: V3, b: V3): V3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
export const add = (a: V3, b: V3): V3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
export const scale = (a: V3, k: number): V3 => [a[0] * k, a[1] * k, a[2] * k];
export const dot = (a: V3, b: V3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
export const norm = (a: V3) => Math.hypot(a[0], a[1], a[2]);
export const cross = (a: V3, b: V3): V3 => [
  a[1] * b[2] - a[2] * b[1],
  a[2] * b[0] - a[0] * b[2],
  a[0] * b[1] - a[1] * b[0],
];

/** Rodrigues' rotation of v by the rotation vector w (rad). */
export function rodrigues(w: V3, v: V3): V3 {
  const th = norm(w);
  if (th < 1e-15) return [...v];
  const k: V3 = [w[0] / th, w[1] / th, w[2] / th];
  const kv = cross(k, v);
  const kd = dot(k, v);
  const c = Math.cos(th),
    s = Math.sin(th);
  return [0, 1, 2].map((i) => v[i] * c + kv[i] * s + k[i] * kd * (1 - c)) as V3;
}

/** v turned by R = Rz(yaw)·Ry(pitch)·Rx(roll) (rad): Rx first, then Ry, then Rz. */
export function rotateIso(roll: number, pitch: number, yaw: number, v: V3): V3 {
  const [cr, sr, cp, sp, cy, sy] = [
    Math.cos(roll),
    Math.sin(roll),
    Math.cos(pitch),
    Math.sin(pitch),
    Math.cos(yaw),
    Math.sin(yaw),
  ];
  const x1 = v[0],
    y1 = cr * v[1] - sr * v[2],
    z1 = sr * v[1] + cr * v[2];
  const x2 = cp * x1 + sp * z1,
    z2 = -sp * x1 + cp * z1;
  return [cy * x2 - sy * y1, sy * x2 + cy * y1, z2];
}

/**
 * Gauss–Newton from `start` on the residuals f(q) (mm): central-difference Jacobian (step `h`), each step the
 * least-squares solution of J·dq = −r by ml-matrix's QR (Newton's step for a square system); stops when the
 * step is below `stepTolerance` or after `maxIterations`.
 */
export function gaussNewton(
  f: (q: number[]) => number[],
  start: number[],
  { h = 1e-7, stepTolerance = 1e-13, maxIterations = 60 } = {},
): number[] {
  const q = [...start];
  for (let it = 0; it < maxIterations; it++) {
    const r = f(q);
    const J = new Matrix(r.length, q.length);
    for (let k = 0; k < q.length; k++) {
      const up = [...q],
        dn = [...q];
      up[k] += h;
      dn[k] -= h;
      const ru = f(up),
        rd = f(dn);
      for (let i = 0; i < r.length; i++) J.set(i, k, (ru[i] - rd[i]) / (2 * h));
    }
    const step = new QR(J).solve(Matrix.columnVector(r.map((v) => -v))).to1DArray();
    for (let k = 0; k < q.length; k++) q[k] += step[k];
    if (Math.max(...step.map(Math.abs)) < stepTolerance) break;
  }
  return q;
}

/**
 * deg, the heading of the line where a wheel plane with spin axis `n` meets the level ground (n × up, taken
 * pointing forward), positive toward the vehicle's left (as yaw): plain vector geometry.
 */
export function headingOfSpin(n: V3): number {
  let f = cross(n, [0, 0, 1]);
  if (f[0] < 0) f = [-f[0], -f[1], -f[2]];
  return Math.atan2(f[1], f[0]) / DEG;
}
