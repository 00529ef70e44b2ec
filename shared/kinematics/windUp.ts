/**
 * Axle wind-up of a leaf-sprung axle at ride height.
 *
 * Rate (cantilever model; docs/references.md gives K_vertical·L1·L2 as a derivation, not a
 * published value): each half of a spring is a cantilever clamped at the seat, of length L_i
 * (seat to eye, side view) and vertical rate k_i at its eye. Turning the seat by a small angle φ
 * lifts one eye's cantilever tip by L_i·φ relative to the seat, so the eye pushes back with
 * k_i·L_i·φ at lever L_i: the spring resists with T = (k1·L1² + k2·L2²)·φ. A spring whose seat
 * stays level under a vertical load K·δ has k1·L1 = k2·L2 with k1 + k2 = K, so k1 = K·L2/(L1+L2),
 * k2 = K·L1/(L1+L2), and the rate is K·L1·L2 — the form in docs/references.md. Each half's `rate`
 * is its k_i; the rates of both springs add. The SAE three-link model gives the same rate for
 * small angles (its link of length ℓ = ¾·L_i with a torsional spring k_i·ℓ² at its root).
 *
 * Angle: φ = T / rate, the axle housing turning against the drive (pinion nose up for forward
 * drive torque). The linkage is then solved at ride height with that pitch imposed, so each
 * shock's, spring's and the driveshaft's change under wind-up is read off the placed points.
 * Left out: the vertical load the torque also puts into the springs (anti-squat), the pinion
 * torque about x, and the spring's own large-angle stiffening.
 */
import { DEFAULT_AXLE_TORQUE_NM } from '../schema/sketchVocabulary';
import { radToDeg } from '../units';
import type { Drive } from './drive';
import { driveApply } from './drive';
import { drivelineReading } from './metrics/driveline';
import type { LinkageModel, PointModel } from './model';
import { poseFromState, POSE_PITCH, POSE_SIZE } from './pose';
import { BodyRotations, pointPlace } from './residuals';
import { PoseSolver } from './solve';
import type { BodyPoses, LeafSpringWindUp, WindUpReading } from './types';
import { vec, vecDistance, type Vec3 } from './vec';

/** N·mm per N·m. */
const NMM_PER_NM = 1000;

/** The springs of a sketch, each with its two halves' rates and cantilever lengths; null when a half has no rate. */
export function leafSpringsOf(model: LinkageModel): LeafSpringWindUp[] | null {
  const { sketch, points } = model;
  const bySeat = new Map<string, { eye: Vec3; rate: number | undefined; id: string }[]>();
  for (const m of sketch.members) {
    if (m.kind !== 'leaf-half') continue;
    const list = bySeat.get(m.seat) ?? [];
    list.push({ eye: points.get(m.a)!.ride, rate: m.rate, id: m.id });
    bySeat.set(m.seat, list);
  }
  const out: LeafSpringWindUp[] = [];
  for (const [seatId, halves] of bySeat) {
    if (halves.length !== 2 || halves.some((h) => h.rate === undefined)) return null;
    const seat = points.get(seatId)!.ride;
    const [front, rear] = halves[0].eye.x >= halves[1].eye.x ? halves : [halves[1], halves[0]];
    const side = (h: { eye: Vec3 }) => Math.hypot(h.eye.x - seat.x, h.eye.z - seat.z);
    const frontLength = side(front),
      rearLength = side(rear);
    const nmmPerRad = front.rate! * frontLength ** 2 + rear.rate! * rearLength ** 2;
    out.push({
      side: seat.y >= 0 ? 'left' : 'right',
      front: front.id,
      rear: rear.id,
      verticalRate: front.rate! + rear.rate!,
      frontLength,
      rearLength,
      rate: nmmPerRad / NMM_PER_NM / radToDeg(1),
    });
  }
  return out.length > 0 ? out : null;
}

/**
 * Wind-up at ride height from the ride state (mm, rad) under `torqueNm` (N·m; the sketch's
 * sweep.axleTorque, else DEFAULT_AXLE_TORQUE_NM). Null without an axle on leaf springs whose
 * halves all have rates. `regularize` false when the sweep's rank at ride showed every free
 * coordinate located: imposing the pitch too leaves the rest located, so plain QR serves.
 */
export function windUpReading(
  model: LinkageModel,
  drive: Drive,
  rideState: Float64Array,
  torqueNm = model.sketch.sweep.axleTorque ?? DEFAULT_AXLE_TORQUE_NM,
  regularize = true,
): WindUpReading | null {
  const axle = model.axle;
  if (!axle) return null;
  const springs = leafSpringsOf(model);
  if (!springs) return null;
  const rate = springs.reduce((s, x) => s + x.rate, 0); // N·m per degree
  const angle = torqueNm / rate;

  // The same linkage with the axle's pitch imposed too: pinion nose up is negative pitch.
  const imposed = new Uint8Array(drive.imposed);
  const pitchIndex = axle.slot * POSE_SIZE + POSE_PITCH;
  imposed[pitchIndex] = 1;
  const free: number[] = [];
  for (let i = 0; i < imposed.length; i++) if (!imposed[i]) free.push(i);
  const solver = new PoseSolver(model, { imposed, free: Int32Array.from(free) });
  solver.regularize = regularize;
  const state = new Float64Array(rideState);
  driveApply(model, state, 0, 0);
  state[pitchIndex] = -(angle * Math.PI) / 180;
  const outcome = solver.solve(state);

  const rot = new BodyRotations(model.bodies.length);
  rot.update(state);
  const buf = new Float64Array(3);
  const place = (p: PointModel) => {
    pointPlace(model, p, state, rot, buf, 0);
    return vec(buf[0], buf[1], buf[2]);
  };
  const members: WindUpReading['members'] = {};
  for (const m of model.sketch.members) {
    if (m.kind !== 'shock' && m.kind !== 'spring') continue;
    const a = model.points.get(m.a)!,
      b = model.points.get(m.b)!;
    members[m.id] = { lengthChange: vecDistance(place(a), place(b)) - vecDistance(a.ride, b.ride) };
  }
  const bodies: BodyPoses = {};
  for (const b of model.bodies) bodies[b.id] = poseFromState(state, b.slot);
  const reading: WindUpReading = {
    torque: torqueNm,
    rate,
    angle,
    springs,
    pose: poseFromState(state, axle.slot),
    bodies,
    members,
    bind: outcome.maxResidual,
  };
  const d = model.sketch.driveline;
  if (d) {
    const o = model.points.get(d.output)!,
      oa = model.points.get(d.outputAxis)!;
    const pn = model.points.get(d.pinion)!,
      pa = model.points.get(d.pinionAxis)!;
    reading.driveline = drivelineReading(place(o), place(oa), place(pn), place(pa), vecDistance(o.ride, pn.ride));
  }
  return reading;
}
