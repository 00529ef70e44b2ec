/**
 * The readout: the numbers of the sweep row at the slider position, as lines of text in
 * the user's units. A number the sweep does not define shows "—" with the reason.
 */
import type { HeaveRow, RollRow } from '../../shared/kinematics';
import type { LinkLoadSummary, WindUpReading } from '../../shared/kinematics/types';
import type { SketchMember } from '../../shared/schema/sketch';
import type { LengthUnit } from '../../shared/units';
import {
  fixed,
  MISSING,
  showAngle,
  showLength,
  showPercent,
  showPosition,
  showRate,
  showRatio,
  type Shown,
} from './format';

export interface ReadoutLine extends Shown {
  key: string;
  label: string;
  group: 'position' | 'axle' | 'geometry' | 'members' | 'leaf' | 'loads' | 'driveline';
  /** member to select on click, for member lines */
  member?: string;
  /** 'negative' when a shock sits at or past a limit, or a link load reverses or passes its limit */
  tone?: 'negative';
  /** a remark on a number that is shown (tooltip), e.g. an assumed load split */
  hint?: string;
}

/** What the readout shows of the sweep besides the row at the cursor (leaf-spring wind-up, link loads). */
export interface ReadoutExtras {
  windUp?: WindUpReading;
  loads?: LinkLoadSummary;
}

export type CursorRow = { sweep: 'heave'; row: HeaveRow } | { sweep: 'roll'; row: RollRow };

/**
 * What the readout, flags and plots need of the sketch besides the sweep: its members and
 * whether it has an axle. Kept apart from the points so that dragging a pivot, which changes
 * only points, does not redo their work before the new sweep arrives.
 */
export interface SweepContext {
  members: readonly SketchMember[];
  hasAxle: boolean;
}

export const EMPTY_CONTEXT: SweepContext = { members: [], hasAxle: false };

/** Reasons, in the user's words, for numbers the sweep leaves out. */
function reasons(ctx: SweepContext) {
  const members = ctx.members;
  const grouped =
    members.some((m) => m.kind === 'link' && m.group === 'upper') &&
    members.some((m) => m.kind === 'link' && m.group === 'lower');
  const hasRod = members.some((m) => m.kind === 'lateral-rod');
  const hasAxle = ctx.hasAxle;
  return {
    ic: grouped
      ? 'upper and lower links parallel in side view: no instant centre'
      : 'no upper and lower link pair: no side-view instant centre',
    rc: hasRod
      ? "the lateral rod's line does not cross the centreline"
      : 'no lateral rod: roll centre not defined by this layout',
    axle: hasAxle ? 'not defined at this position' : 'independent layout: no axle to measure',
  };
}

/** Optional fields that independent layouts add to heave rows (docs/sketch-format.md). */
interface IndependentFields {
  camberChange?: number | null;
  toeChange?: number | null;
  trackChange?: number | null;
  casterChange?: number | null;
  antiDive?: number | null;
  kingpin?: { inclination: number; caster: number; scrubRadius: number; trail: number } | null;
}

function memberLines(
  ctx: SweepContext,
  members: Record<string, { length: number; lengthChange: number; motionRatio?: number; wheelRate?: number }>,
  sweep: 'heave' | 'roll',
  u: LengthUnit,
  windUp?: WindUpReading,
): ReadoutLine[] {
  const lines: ReadoutLine[] = [];
  const shown = ctx.members.filter((m) => m.kind === 'shock' || m.kind === 'spring');
  for (const m of shown) {
    const r = members[m.id];
    if (!r) continue;
    const name = m.kind === 'shock' ? 'Shock' : 'Spring';
    const line: ReadoutLine = {
      key: `member-${m.id}`,
      label: `${name} ${m.id} length`,
      group: 'members',
      member: m.id,
      ...showLength(r.length, u),
    };
    if (m.kind === 'shock') {
      const lo = m.minLength;
      const hi = m.maxLength;
      if (lo !== undefined && hi !== undefined && hi > lo) {
        const used = ((r.length - lo) / (hi - lo)) * 100;
        line.text += ` (${Math.round(used)} % of stroke)`;
      }
      if ((lo !== undefined && r.length <= lo) || (hi !== undefined && r.length >= hi)) line.tone = 'negative';
    }
    lines.push(line);
    const mrReason =
      sweep === 'roll' ? 'motion ratio is taken in heave (wheel travel), not in roll' : 'not defined here';
    lines.push({
      key: `mr-${m.id}`,
      label: `${name} ${m.id} motion ratio`,
      group: 'members',
      member: m.id,
      ...showRatio(r.motionRatio, mrReason),
    });
    if (m.kind === 'spring' && m.rate !== undefined) {
      lines.push({
        key: `wr-${m.id}`,
        label: `Wheel rate (${m.id})`,
        group: 'members',
        member: m.id,
        ...showRate(r.wheelRate, mrReason),
      });
    }
    if (windUp) {
      // A leaf-sprung axle: the stroke each shock uses in travel and what the wind-up alone takes of it.
      lines.push({
        key: `dl-${m.id}`,
        label: `${name} ${m.id} length change (${sweep})`,
        group: 'members',
        member: m.id,
        ...showLength(r.lengthChange, u, undefined, true),
      });
      const w = windUp.members[m.id];
      lines.push({
        key: `wu-${m.id}`,
        label: `${name} ${m.id} length change (wind-up)`,
        group: 'members',
        member: m.id,
        ...showLength(w?.lengthChange, u, 'not solved under the wind-up', true),
      });
    }
  }
  return lines;
}

function drivelineLines(d: HeaveRow['driveline'], u: LengthUnit): ReadoutLine[] {
  if (!d) return [];
  return [
    { key: 'ds-out', label: 'Output joint angle', group: 'driveline', ...showAngle(d.outputAngle) },
    { key: 'ds-pin', label: 'Pinion joint angle', group: 'driveline', ...showAngle(d.pinionAngle) },
    { key: 'ds-plunge', label: 'Driveshaft plunge', group: 'driveline', ...showLength(d.plunge, u, undefined, true) },
    { key: 'ds-len', label: 'Driveshaft length', group: 'driveline', ...showLength(d.length, u) },
  ];
}

/** A force in N, shown in N in both unit systems as the sweep gives it; tension positive. */
export function showForce(v: number | null | undefined, reason = 'not defined here'): Shown {
  if (v === null || v === undefined || !Number.isFinite(v)) return { text: MISSING, reason };
  return { text: `${fixed(v, 0, true)} N` };
}

/** A torque in N·m. */
export function showTorque(v: number | null | undefined, reason = 'not defined here'): Shown {
  if (v === null || v === undefined || !Number.isFinite(v)) return { text: MISSING, reason };
  return { text: `${fixed(v, 0)} N·m` };
}

/** The leaf-spring lines: shackle angle at the cursor, the axle's wind-up at ride under the axle torque. */
function leafLines(
  shackleAngle: number | null | undefined,
  hasShackle: boolean,
  windUp: WindUpReading | undefined,
  u: LengthUnit,
): ReadoutLine[] {
  const lines: ReadoutLine[] = [];
  if (hasShackle)
    lines.push({
      key: 'shackle',
      label: 'Shackle angle',
      group: 'leaf',
      ...showAngle(shackleAngle, 'shackle angle is taken in heave, not in roll', true, 1),
    });
  if (!windUp) return lines;
  const torque = showTorque(windUp.torque).text;
  lines.push(
    {
      key: 'windup',
      label: `Wind-up at ride (${torque})`,
      group: 'leaf',
      ...showAngle(windUp.angle, 'the springs do not resist wind-up', true),
    },
    {
      key: 'windup-rate',
      label: 'Wind-up rate',
      group: 'leaf',
      ...(Number.isFinite(windUp.rate)
        ? { text: `${fixed(windUp.rate, 0)} N·m/°` }
        : { text: MISSING, reason: 'the springs have no rate' }),
    },
    { key: 'windup-bind', label: 'Bind under wind-up', group: 'leaf', ...showLength(windUp.bind, u) },
  );
  return lines;
}

/**
 * The axial load of every link and the lateral rod: at the cursor's row in heave (the loads
 * are found per heave row), at ride in roll. Marked when the load reverses within the travel,
 * passes the user's limit, or when the split among the links is the least-squares one.
 */
function loadLines(
  ctx: SweepContext,
  loads: LinkLoadSummary,
  rowLoads: Record<string, number> | undefined,
  sweep: 'heave' | 'roll',
): ReadoutLine[] {
  const lines: ReadoutLine[] = [];
  const split = loads.indeterminate
    ? 'more links than the axle motions they locate: the split shown is the least-squares one (equal bushing stiffness); real bushings share it differently'
    : undefined;
  if (split) lines.push({ key: 'load-split', label: 'Load split', group: 'loads', text: 'indeterminate', hint: split });
  for (const m of ctx.members) {
    const reading = loads.members[m.id];
    if (!reading) continue;
    const name = m.kind === 'lateral-rod' ? 'Lateral rod' : 'Link';
    const at = sweep === 'heave' ? rowLoads?.[m.id] : reading.ride;
    const shown = showForce(at, 'the links do not locate the axle at this position');
    const marks: string[] = [];
    if (reading.reverses) marks.push('reverses');
    if (reading.overLimit) marks.push('over limit');
    const line: ReadoutLine = {
      key: `load-${m.id}`,
      label: `${name} ${m.id} load${sweep === 'roll' ? ' at ride' : ''}`,
      group: 'loads',
      member: m.id,
      ...shown,
    };
    if (!shown.reason) {
      if (split) line.text = `≈ ${line.text}`;
      if (marks.length) line.text += ` (${marks.join(', ')})`;
      line.hint =
        [
          split,
          reading.reverses ? 'changes sign within the travel' : '',
          reading.overLimit && loads.limit !== null
            ? `passes the limit of ${fixed(loads.limit, 0)} N within the travel`
            : '',
        ]
          .filter(Boolean)
          .join('; ') || undefined;
    }
    if (reading.reverses || reading.overLimit) line.tone = 'negative';
    lines.push(line);
  }
  return lines;
}

/** The readout lines for the row at the cursor. */
export function readoutLines(
  cursor: CursorRow | null,
  ctx: SweepContext,
  u: LengthUnit,
  extras: ReadoutExtras = {},
): ReadoutLine[] {
  if (!cursor) return [];
  const why = reasons(ctx);
  const hasShackle = ctx.members.some((m) => m.kind === 'leaf-half');
  if (cursor.sweep === 'heave') {
    const r = cursor.row;
    const ind = r as HeaveRow & IndependentFields;
    const lines: ReadoutLine[] = [
      { key: 'position', label: 'Position', group: 'position', text: showPosition('heave', r.travel, u) },
      // Pinion angle and lateral shift belong to a solid axle: an independent layout does not list them.
      ...(ctx.hasAxle
        ? [
            {
              key: 'pinion',
              label: 'Pinion angle change',
              group: 'axle' as const,
              ...showAngle(r.pinionAngleChange, why.axle, true),
            },
            {
              key: 'lateral',
              label: 'Lateral shift',
              group: 'axle' as const,
              ...showLength(r.lateralShift, u, why.axle, true),
            },
          ]
        : []),
      { key: 'foreaft', label: 'Fore-aft shift', group: 'axle', ...showLength(r.foreAftShift, u, undefined, true) },
      ...(ctx.hasAxle || r.antiSquat !== null
        ? [{ key: 'antisquat', label: 'Anti-squat', group: 'geometry' as const, ...showPercent(r.antiSquat, why.ic) }]
        : []),
      { key: 'ic-x', label: 'Instant centre x', group: 'geometry', ...showLength(r.instantCenter?.x, u, why.ic) },
      { key: 'ic-z', label: 'Instant centre height', group: 'geometry', ...showLength(r.instantCenter?.z, u, why.ic) },
      { key: 'rc', label: 'Roll centre height', group: 'geometry', ...showLength(r.rollCenterHeight, u, why.rc) },
      { key: 'bind', label: 'Bind', group: 'geometry', ...showLength(r.bind, u) },
    ];
    if (ind.camberChange !== undefined)
      lines.push({
        key: 'camber',
        label: 'Camber change',
        group: 'axle',
        ...showAngle(ind.camberChange, undefined, true),
      });
    if (ind.toeChange !== undefined)
      lines.push({
        key: 'toe',
        label: 'Toe change (bump steer)',
        group: 'axle',
        ...showAngle(ind.toeChange, undefined, true, 3),
      });
    if (ind.trackChange !== undefined)
      lines.push({
        key: 'track',
        label: 'Track change',
        group: 'axle',
        ...showLength(ind.trackChange, u, undefined, true),
      });
    if (ind.casterChange !== undefined)
      lines.push({
        key: 'caster',
        label: 'Caster change',
        group: 'axle',
        ...showAngle(ind.casterChange, undefined, true),
      });
    if (ind.antiDive !== undefined)
      lines.push({ key: 'antidive', label: 'Anti-dive', group: 'geometry', ...showPercent(ind.antiDive, why.ic) });
    if (ind.kingpin !== undefined) {
      const k = ind.kingpin;
      const level = 'ball joints level: no kingpin axis';
      lines.push(
        { key: 'kpi', label: 'Kingpin inclination', group: 'geometry', ...showAngle(k?.inclination, level) },
        { key: 'kp-caster', label: 'Caster', group: 'geometry', ...showAngle(k?.caster, level) },
        { key: 'scrub', label: 'Scrub radius', group: 'geometry', ...showLength(k?.scrubRadius, u, level) },
        { key: 'trail', label: 'Mechanical trail', group: 'geometry', ...showLength(k?.trail, u, level) },
      );
    }
    return [
      ...lines,
      ...leafLines(r.shackleAngle, hasShackle, extras.windUp, u),
      ...(extras.loads ? loadLines(ctx, extras.loads, r.linkLoads, 'heave') : []),
      ...memberLines(ctx, r.members, 'heave', u, extras.windUp),
      ...drivelineLines(r.driveline, u),
    ];
  }
  const r = cursor.row;
  return [
    { key: 'position', label: 'Position', group: 'position', text: showPosition('roll', r.roll, u) },
    { key: 'left', label: 'Left wheel travel', group: 'axle', ...showLength(r.leftTravel, u, undefined, true) },
    { key: 'right', label: 'Right wheel travel', group: 'axle', ...showLength(r.rightTravel, u, undefined, true) },
    {
      key: 'rollsteer',
      label: 'Roll steer',
      group: 'geometry',
      ...showPercent(r.rollSteer, 'no roll: roll steer is a ratio to the roll angle', true),
    },
    { key: 'bind', label: 'Bind', group: 'geometry', ...showLength(r.bind, u) },
    ...leafLines(undefined, hasShackle, extras.windUp, u),
    ...(extras.loads ? loadLines(ctx, extras.loads, undefined, 'roll') : []),
    ...memberLines(ctx, r.members, 'roll', u, extras.windUp),
    ...drivelineLines(r.driveline, u),
  ];
}
