/**
 * Axial link loads of a solid axle on links, by statics, from the axle torque.
 *
 * The axle with its wheels is one free body. Driving torque T (N·m) at the wheels is reacted
 * by the ground as a tractive force F = T / r at the contact patches (half at each, r the tyre
 * radius); taken as a force on the axle at the patch, it carries both the push and the torque
 * reaction (F·r about the wheel centre). The links balance it in every coordinate they
 * locate — fore-aft, sideways, pitch and yaw; the springs take the vertical and roll parts
 * (the sweep imposes those), and how much they are unloaded is the anti-squat. By virtual
 * work, with J the Jacobian of the link lengths over those coordinates (rows.ts's solver
 * Jacobian) and Q the patch forces' generalised forces there,
 *   Jᵀ · f = Q,  f_i the tension of link i (N, positive pulling its ends together).
 * With as many links as located coordinates the answer is unique; with more (a four-link with
 * a lateral rod) the split depends on bushing stiffness, and the least-squares (minimum-norm)
 * split f = J·(JᵀJ)⁻¹·Q is the one of equal axial stiffness. The static weight is left out: on
 * a coil-sprung axle the springs carry it, not the links. Computed at every heave row, so a
 * load that changes sign within the travel, or passes sweep.linkLoadLimit, is flagged.
 */
import { CholeskyDecomposition, Matrix } from 'ml-matrix';
import { DEFAULT_AXLE_TORQUE_NM } from '../schema/sketchVocabulary';
import type { Drive } from './drive';
import type { SolvedRow } from './march';
import type { LinkageModel } from './model';
import { mat3Apply, POSE_ROLL, POSE_SIZE } from './pose';
import { residualsEvaluate, residualWorkCreate } from './residuals';
import type { LinkLoadSummary, SweepEvent } from './types';
import { vec, vecSub, type Vec3 } from './vec';

/** A load smaller than this share of the tractive force is round-off of a zero (no sign to reverse). */
export const LOAD_ZERO_RELATIVE = 1e-9;
/** N·mm per N·m. */
const NMM_PER_NM = 1000;

export interface LinkLoadsOutcome {
  /** per heave row (same order), N by member id; null for a row where the links do not locate the axle */
  rows: (Record<string, number> | null)[];
  summary: LinkLoadSummary;
  events: SweepEvent[];
}

/** True when the statics apply: one moving body, the axle, held by links alone. */
export function linkLoadsApply(model: LinkageModel): boolean {
  return (
    model.axle !== null &&
    model.bodies.length === 1 &&
    model.constraints.length > 0 &&
    model.constraints.every((c) => c.type === 'distance')
  );
}

/** Tensions (N) for one solved state; null when the links do not locate every free coordinate. */
interface LoadWork {
  residual: ReturnType<typeof residualWorkCreate>;
  r: Float64Array;
  J: Float64Array;
  N: Matrix;
  q: Matrix;
}

function rowLoads(
  model: LinkageModel,
  drive: Drive,
  state: Float64Array,
  patches: Vec3[],
  force: number,
  lw: LoadWork,
): number[] | null {
  const m = model.residualCount,
    n = drive.free.length,
    cols = model.stateSize;
  const { r, J, N, residual: work } = lw;
  residualsEvaluate(model, state, work, r, J);
  const rs = work.rot.sets[model.axle!.slot];
  // Generalised forces of the patch forces (each F/2 along +x) in the free coordinates.
  const q = lw.q;
  for (let j = 0; j < n; j++) q.set(j, 0, 0);
  const tmp = new Float64Array(3);
  drive.free.forEach((c, j) => {
    const k = c % POSE_SIZE;
    for (const local of patches) {
      if (k === 0) q.set(j, 0, q.get(j, 0) + force / 2);
      else if (k >= POSE_ROLL) {
        mat3Apply(rs, 9 * (k - POSE_ROLL + 1), local.x, local.y, local.z, tmp, 0);
        q.set(j, 0, q.get(j, 0) + (force / 2) * tmp[0]);
      }
    }
  });
  // Normal equations (JᵀJ)·x = Q, then f = J·x: the minimum-norm solution of Jᵀf = Q.
  for (let j = 0; j < n; j++) {
    for (let k = j; k < n; k++) {
      let v = 0;
      for (let i = 0; i < m; i++) v += J[i * cols + drive.free[j]] * J[i * cols + drive.free[k]];
      N.set(j, k, v);
      N.set(k, j, v);
    }
  }
  const chol = new CholeskyDecomposition(N);
  if (!chol.isPositiveDefinite()) return null;
  const x = chol.solve(q);
  const out: number[] = [];
  for (let i = 0; i < m; i++) {
    let v = 0;
    for (let j = 0; j < n; j++) v += J[i * cols + drive.free[j]] * x.get(j, 0);
    out.push(v);
  }
  return out.every(Number.isFinite) ? out : null;
}

const fmt = (v: number) => `${v > 0 ? '+' : ''}${v.toFixed(0)} mm`;
const kN = (v: number) => `${(v / 1000).toFixed(1)} kN`;

/**
 * Loads at every heave row (`heave` ordered droop → bump, `rideIndex` its travel-0 row), the
 * summary and the flags. Call only when linkLoadsApply(model).
 */
export function linkLoads(model: LinkageModel, drive: Drive, heave: SolvedRow[], rideIndex: number): LinkLoadsOutcome {
  const { sketch } = model;
  const torque = sketch.sweep.axleTorque ?? DEFAULT_AXLE_TORQUE_NM;
  const force = (torque * NMM_PER_NM) / sketch.vehicle.tireRadius;
  const ref = model.axle!.reference;
  const patches = [model.wheelLeft, model.wheelRight].map((w) =>
    vecSub(vec(w.ride.x, w.ride.y, w.ride.z - sketch.vehicle.tireRadius), ref),
  );
  const n = drive.free.length;
  const work: LoadWork = {
    residual: residualWorkCreate(model),
    r: new Float64Array(model.residualCount),
    J: new Float64Array(model.residualCount * model.stateSize),
    N: new Matrix(n, n),
    q: new Matrix(n, 1),
  };
  const ids = model.constraints.map((c) => c.member.id);
  const zero = LOAD_ZERO_RELATIVE * Math.abs(force);
  const rows = heave.map((row) => {
    const f = rowLoads(model, drive, row.state, patches, force, work);
    if (!f) return null;
    return Object.fromEntries(ids.map((id, i) => [id, Math.abs(f[i]) < zero ? 0 : f[i]]));
  });
  const limit = sketch.sweep.linkLoadLimit ?? null;
  const summary: LinkLoadSummary = {
    torque,
    tractiveForce: force,
    limit,
    indeterminate: model.residualCount > drive.free.length,
    members: {},
  };
  const events: SweepEvent[] = [];
  const ride = rows[rideIndex];
  for (const id of ids) {
    const values = rows.map((r) => (r ? r[id] : null));
    const known = values.filter((v): v is number => v !== null);
    if (!ride || known.length === 0) continue;
    const min = Math.min(...known),
      max = Math.max(...known);
    summary.members[id] = {
      ride: ride[id],
      min,
      max,
      reverses: min < -zero && max > zero,
      overLimit: limit !== null && Math.max(-min, max) > limit,
    };
    // Every sign change along the travel (a zero, e.g. at ride, has no sign: the change is
    // placed between the loads on either side of it).
    let last: { travel: number; value: number } | null = null;
    heave.forEach((row, i) => {
      const v = values[i];
      if (v === null || Math.abs(v) <= zero) return;
      if (last && Math.sign(last.value) !== Math.sign(v)) {
        const at = last.travel + ((0 - last.value) / (v - last.value)) * (row.travel - last.travel);
        events.push({
          kind: 'load-reversal',
          sweep: 'heave',
          at,
          member: id,
          value: 0,
          message: `Link ${id}'s load reverses (${v > 0 ? 'compression to tension' : 'tension to compression'} going ${row.travel > last.travel ? 'up' : 'down'}) at ${fmt(at)} travel under ${torque} N·m.`,
        });
      }
      last = { travel: row.travel, value: v };
    });
    // Outward from ride each way: the first pass beyond the limit.
    for (const dir of [1, -1]) {
      if (limit === null || Math.abs(ride[id]) > limit) break;
      for (let i = rideIndex + dir; i >= 0 && i < values.length; i += dir) {
        const a = values[i - dir],
          b = values[i];
        if (a === null || b === null) break;
        if (Math.abs(b) > limit) {
          const t0 = heave[i - dir].travel,
            t1 = heave[i].travel;
          const at = t0 + ((limit - Math.abs(a)) / (Math.abs(b) - Math.abs(a))) * (t1 - t0);
          events.push({
            kind: 'load-limit',
            sweep: 'heave',
            at,
            member: id,
            value: limit,
            message: `Link ${id}'s load passes the ${kN(limit)} limit at ${fmt(at)} travel under ${torque} N·m.`,
          });
          break;
        }
      }
    }
    if (limit !== null && Math.abs(ride[id]) > limit) {
      events.push({
        kind: 'load-limit',
        sweep: 'heave',
        at: 0,
        member: id,
        value: limit,
        message: `Link ${id}'s load (${kN(ride[id])}) is beyond the ${kN(limit)} limit at ride height under ${torque} N·m.`,
      });
    }
  }
  return { rows, summary, events };
}
