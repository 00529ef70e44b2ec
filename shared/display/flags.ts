/**
 * Flags: the warnings a sweep raised (lock-up, bind, shock limits, joint angles, the driveshaft's
 * joint-angle rules and slip yoke, link loads) and the targets it misses, each with where it starts
 * and, where there is one, the member concerned so a click can select it. Built from the result's structured events; the
 * words are written here in the user's units. The sweep's plain-sentence notes (its
 * assumptions) are not flags: the readout shows them beside the numbers they qualify.
 */
import type { HeaveRow, RollRow, SweepEvent, SweepResult } from '../kinematics';
import type { SteerEvent } from '../kinematics/types';
import { showSteerPosition, steerInputOf, type SteerInput } from './steerInput';
import type { SketchMember } from '../schema/sketch';
import type { LengthUnit } from '../units';
import type { TargetCheck } from './targets';
import { driveJointNames, targetEntries } from '../kinematics/metrics/registry';
import {
  fixed,
  quantityUnit,
  showAngle,
  showForce,
  showLength,
  showPosition,
  showQuantity,
  showTorque,
  toDisplay,
} from './format';

export type FlagKind = SweepEvent['kind'] | SteerEvent['kind'] | 'steer-problem' | 'target';

export interface Flag {
  /** stable within one result (for v-for keys and tests) */
  key: string;
  kind: FlagKind;
  /** 'negative' stops the design (lock-up, bind, shock limits), 'warning' asks for a look */
  severity: 'negative' | 'warning' | 'info';
  title: string;
  detail: string;
  /** where it starts (`at` in mm of travel, deg of roll, or the steer input's unit: mm of rack) */
  sweep?: 'heave' | 'roll' | 'steer';
  at?: number;
  where?: string;
  /** member to select on click */
  member?: string;
}

/** A member whose length change is smaller than this carries no share of bind worth naming (mm). */
export const BIND_MEMBER_MIN_MM = 0.01;

const RIGID_KINDS = new Set(['link', 'lateral-rod', 'tie-rod', 'shackle']);

const JOINT_NAMES: Record<string, string> = driveJointNames;

/** A link load smaller than this share of the tractive force is round-off of a zero, as the sweep judges it. */
const LOAD_SIGN_RELATIVE = 1e-9;

/** The row whose position (travel, roll, steer) is nearest `at`; null when there are no rows. */
export function nearestRow<T>(rows: readonly T[], pos: (r: T) => number, at: number): T | null {
  let best: T | null = null;
  let bestD = Infinity;
  for (const r of rows) {
    const d = Math.abs(pos(r) - at);
    if (d < bestD) {
      bestD = d;
      best = r;
    }
  }
  return best;
}

/** The rigid member that stretches or shrinks most at a row: the one taking the bind (or stopping the sweep). */
export function mostStrainedMember(
  members: readonly SketchMember[],
  row: HeaveRow | RollRow | undefined,
): string | undefined {
  if (!row) return undefined;
  const kinds = new Map(members.map((m) => [m.id, m.kind] as const));
  let best: string | undefined;
  let bestAbs = BIND_MEMBER_MIN_MM;
  for (const [id, reading] of Object.entries(row.members)) {
    const kind = kinds.get(id);
    if (kind !== undefined && !RIGID_KINDS.has(kind)) continue;
    const abs = Math.abs(reading.lengthChange);
    if (abs > bestAbs) {
      bestAbs = abs;
      best = id;
    }
  }
  return best;
}

function eventRow(result: SweepResult, e: SweepEvent): HeaveRow | RollRow | undefined {
  const row =
    e.sweep === 'roll' ? nearestRow(result.roll, (r) => r.roll, e.at) : nearestRow(result.heave, (r) => r.travel, e.at);
  return row ?? undefined;
}

/**
 * The sign of a link's load just above a reversal: the first heave row past the crossing with a
 * load clearly off zero (rows run droop to bump, so the load reverses going up).
 */
function loadSignAbove(result: SweepResult, id: string, at: number): number {
  const zero = LOAD_SIGN_RELATIVE * Math.abs(result.loads?.tractiveForce ?? 0);
  for (const r of result.heave) {
    const v = r.linkLoads?.[id];
    if (r.travel > at && v !== undefined && Math.abs(v) > zero) return Math.sign(v);
  }
  return 0;
}

/** A link-load event in words and the user's units: where it happens, under which axle torque. */
function loadSentence(result: SweepResult, e: SweepEvent, u: LengthUnit): string {
  const loads = result.loads;
  if (!loads || e.member === undefined) return e.message;
  const link = `Link ${e.member}'s load`;
  const under = `under ${showTorque(loads.torque, u).text}`;
  const travel = `${showLength(e.at, u, undefined, true).text} travel`;
  if (e.kind === 'load-reversal') {
    const sign = loadSignAbove(result, e.member, e.at);
    const how = sign > 0 ? ' (compression to tension going up)' : sign < 0 ? ' (tension to compression going up)' : '';
    return `${link} reverses${how} at ${travel} ${under}.`;
  }
  const limit = showForce(e.value, u).text;
  const ride = loads.members[e.member]?.ride;
  if (e.at === 0 && ride !== undefined && e.value !== undefined && Math.abs(ride) > e.value)
    return `${link} (${showForce(ride, u, undefined, true).text}) is beyond the ${limit} limit at ride height ${under}.`;
  return `${link} passes the ${limit} limit at ${travel} ${under}.`;
}

function eventFlag(
  result: SweepResult,
  members: readonly SketchMember[],
  e: SweepEvent,
  i: number,
  u: LengthUnit,
): Flag {
  const where = showPosition(e.sweep, e.at, u);
  const base = { key: `event-${i}-${e.kind}`, kind: e.kind, sweep: e.sweep, at: e.at, where } as const;
  switch (e.kind) {
    case 'lock-up': {
      const member = mostStrainedMember(members, eventRow(result, e));
      return {
        ...base,
        severity: 'negative',
        title: 'Lock-up',
        detail: `The linkage cannot move further than ${where}; the sweep stops there.${member ? ` Most strained: ${member}.` : ''}`,
        member,
      };
    }
    case 'bind': {
      const member = mostStrainedMember(members, eventRow(result, e));
      const amount = e.value !== undefined ? ` more than ${showLength(e.value, u).text}` : '';
      return {
        ...base,
        severity: 'negative',
        title: 'Bind',
        detail: `Beyond ${where} the links must stretch or shrink${amount} for the axle to move; the bushings have to take that.${member ? ` Most: ${member}.` : ''}`,
        member,
      };
    }
    case 'shock-extended':
    case 'shock-compressed': {
      const out = e.kind === 'shock-extended';
      const len = e.value !== undefined ? ` at ${showLength(e.value, u).text}` : '';
      return {
        ...base,
        severity: 'negative',
        title: out ? 'Shock tops out' : 'Shock bottoms out',
        detail: `${e.member ?? 'A shock'} reaches its ${out ? 'longest' : 'shortest'} length${len} from ${where}.`,
        member: e.member,
      };
    }
    case 'joint-angle': {
      const side = e.side ? ` (${e.side})` : '';
      const joint = JOINT_NAMES[e.joint ?? ''] ? `${JOINT_NAMES[e.joint ?? '']}${side}` : 'A driveline joint';
      const limit = e.value !== undefined ? showAngle(e.value, undefined, false, 1).text : 'its limit';
      return {
        ...base,
        severity: 'warning',
        title: 'Joint angle',
        detail: `${joint} operating angle is over ${limit} beyond ${where}.`,
      };
    }
    case 'joint-angle-low': {
      const joint = JOINT_NAMES[e.joint ?? ''] ?? 'A driveline joint';
      const limit = e.value !== undefined ? showAngle(e.value, undefined, false, 1).text : 'its minimum';
      return {
        ...base,
        severity: 'warning',
        title: 'Joint angle too small',
        detail: `${joint} operating angle is under ${limit} from ${where}; its needle bearings barely turn and wear in one place.`,
      };
    }
    case 'joint-angle-mismatch': {
      const limit = e.value !== undefined ? showAngle(e.value, undefined, false, 1).text : 'the allowed difference';
      if (e.shaft === 'double-cardan')
        return {
          ...base,
          severity: 'warning',
          title: 'Pinion off the shaft line',
          detail: `Pinion joint operating angle is over ${limit} beyond ${where}; with a double-Cardan shaft the pinion should point at the output joint, which takes the whole angle.`,
        };
      return {
        ...base,
        severity: 'warning',
        title: 'Joint angles differ',
        detail: `Output and pinion joint operating angles differ by more than ${limit} beyond ${where}; the shaft's speed fluctuation no longer cancels.`,
      };
    }
    case 'slip-yoke': {
      const out = e.end === 'extended';
      const len = e.value !== undefined ? ` (${showLength(e.value, u).text})` : '';
      return {
        ...base,
        severity: 'negative',
        title: out ? 'Slip yoke pulls out' : 'Slip yoke bottoms out',
        detail: `The driveshaft is ${out ? 'longer than the slip yoke’s extended' : 'shorter than the slip yoke’s collapsed'} length${len} beyond ${where}.`,
      };
    }
    case 'arm-clash':
      return {
        ...base,
        severity: 'negative',
        title: 'Coil-over through an arm',
        detail: `${e.member ?? 'A shock or spring'} passes through the ${e.body ?? 'wishbone arm'} from ${where}.`,
        member: e.member,
      };
    case 'load-reversal':
    case 'load-limit':
      // Loads come from statics of the axle torque; the sentence is written here in the user's units.
      return {
        ...base,
        severity: 'warning',
        title: e.kind === 'load-reversal' ? 'Link load reverses' : 'Link load over its limit',
        detail: `${loadSentence(result, e, u)} (from ${where})`,
        member: e.member,
      };
    default:
      return { ...base, severity: 'warning', title: 'Sweep', detail: (e as SweepEvent).message };
  }
}

/** A target band in words, in the user's unit ("60.0–90.0 %", "within ±3.0°", "at least 8.0°"). */
export function bandText(check: Pick<TargetCheck, 'metric' | 'band'>, u: LengthUnit): string {
  const q = targetEntries[check.metric].quantity;
  const unit = quantityUnit(q, u);
  const d = (v: number) => fixed(toDisplay(v, q, u), q === 'length' && u === 'in' ? 2 : 1);
  const { min, max } = check.band;
  if (min !== undefined && max !== undefined) {
    if (targetEntries[check.metric].signed && Math.abs(min + max) < 1e-9) return `within ±${d(max)} ${unit}`;
    return `${d(min)}–${d(max)} ${unit}`;
  }
  if (min !== undefined) return `at least ${d(min)} ${unit}`;
  return `at most ${d(max!)} ${unit}`;
}

function targetFlag(check: TargetCheck, u: LengthUnit): Flag | null {
  if (check.status === 'met') return null;
  const spec = targetEntries[check.metric];
  const wanted = bandText(check, u);
  const key = `target-${check.metric}`;
  if (check.status === 'unknown') {
    return {
      key,
      kind: 'target',
      severity: 'info',
      title: `Target not checked: ${spec.label}`,
      detail: `${spec.label} is not defined anywhere in the sweep, so ${wanted} cannot be checked.`,
    };
  }
  const value = showQuantity(check.value, spec.quantity, u, spec.signed).text;
  if (check.sweep === 'limits') {
    return {
      key,
      kind: 'target',
      severity: 'warning',
      title: `Target missed: ${spec.label}`,
      detail: `Reaches ${value}; wanted ${wanted}.`,
    };
  }
  const where = showPosition(check.sweep as 'heave' | 'roll', check.at!, u);
  const worst =
    check.worst !== undefined && check.worst !== check.value
      ? ` (worst ${showQuantity(check.worst, spec.quantity, u, spec.signed).text})`
      : '';
  return {
    key,
    kind: 'target',
    severity: 'warning',
    title: `Target missed: ${spec.label}`,
    detail: `${value} at ${where}${worst}; wanted ${wanted}.`,
    sweep: check.sweep as 'heave' | 'roll',
    at: check.at,
    where,
  };
}

/** Both wheels' angles at a steer event, in words. */
function wheelAngles(e: SteerEvent): string {
  const a = (v: number) => showAngle(v, undefined, true, 1).text;
  return `left wheel ${a(e.leftSteer)}, right wheel ${a(e.rightSteer)}`;
}

/**
 * A steer event as a flag, its position worded as the steering input's travel (rack travel), never as
 * heave travel: the lock at the end of the travel asked for is a note; a tie rod coming into line with its
 * steering arm, or a linkage that cannot follow, asks for a look.
 */
function steerFlag(e: SteerEvent, i: number, input: SteerInput | null, u: LengthUnit): Flag {
  const where = input ? showSteerPosition(e.at, input, u) : `${fixed(e.at, 1, true)}`;
  const base = { key: `steer-${i}-${e.kind}`, kind: e.kind, sweep: 'steer', at: e.at, where } as const;
  if (e.kind === 'steer-lock')
    return {
      ...base,
      severity: 'info',
      title: 'Steering lock',
      detail: `The steering reaches the end of its travel at ${where}: ${wheelAngles(e)}.`,
    };
  if (e.kind === 'steer-toggle')
    return {
      ...base,
      severity: 'warning',
      title: 'Tie rod in line with its steering arm',
      detail:
        `The ${e.side ? `${e.side} ` : ''}tie rod and steering arm come into line at ${where} (${wheelAngles(e)}): the steering ` +
        `locks there, short of the travel asked for in sweep.steer.${input?.key ?? 'rack'}, and would go over centre past it.`,
    };
  return {
    ...base,
    severity: 'warning',
    title: 'Steering stops short',
    detail: `The linkage cannot follow the steering past ${where} (${wheelAngles(e)}). ${e.message}`,
  };
}

const SEVERITY_ORDER = { negative: 0, warning: 1, info: 2 } as const;

/** Every flag of a result, the design-stopping ones first, then by distance from ride. */
export function buildFlags(
  result: SweepResult | null,
  members: readonly SketchMember[],
  checks: TargetCheck[],
  u: LengthUnit,
): Flag[] {
  if (!result) return [];
  const flags: Flag[] = result.limits.events.map((e, i) => eventFlag(result, members, e, i, u));
  const steer = result.steer;
  if (steer) {
    const input = steerInputOf(steer);
    steer.events.forEach((e, i) => flags.push(steerFlag(e, i, input, u)));
    if (steer.problem)
      flags.push({
        key: 'steer-problem',
        kind: 'steer-problem',
        severity: 'warning',
        title: 'No steer sweep',
        detail: steer.problem,
      });
  }
  for (const c of checks) {
    const f = targetFlag(c, u);
    if (f) flags.push(f);
  }
  return flags.sort(
    (a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity] || Math.abs(a.at ?? 0) - Math.abs(b.at ?? 0),
  );
}
