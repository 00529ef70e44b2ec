/**
 * The readout: the numbers of the sweep row at the slider position, as lines of text in
 * the user's units. A number the sweep does not define shows "—" with the reason.
 */
import type { HeaveRow, RollRow } from '../../shared/kinematics';
import type { SketchMember } from '../../shared/schema/sketch';
import type { LengthUnit } from '../../shared/units';
import { showAngle, showLength, showPercent, showPosition, showRate, showRatio, type Shown } from './useSweepFormat';

export interface ReadoutLine extends Shown {
  key: string;
  label: string;
  group: 'position' | 'axle' | 'geometry' | 'members' | 'driveline';
  /** member to select on click, for member lines */
  member?: string;
  /** 'negative' when a shock sits at or past a limit */
  tone?: 'negative';
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
  const grouped = members.some((m) => m.kind === 'link' && m.group === 'upper') && members.some((m) => m.kind === 'link' && m.group === 'lower');
  const hasRod = members.some((m) => m.kind === 'lateral-rod');
  const hasAxle = ctx.hasAxle;
  return {
    ic: grouped
      ? 'upper and lower links parallel in side view: no instant centre'
      : 'no upper and lower link pair: no side-view instant centre',
    rc: hasRod ? "the lateral rod's line does not cross the centreline" : 'no lateral rod: roll centre not defined by this layout',
    axle: hasAxle ? 'not defined at this position' : 'independent layout: no axle to measure',
  };
}

/** Optional fields that independent layouts add to heave rows (sketch-format.md). */
interface IndependentFields {
  camberChange?: number | null;
  toeChange?: number | null;
  trackChange?: number | null;
  casterChange?: number | null;
  antiDive?: number | null;
  kingpin?: { inclination: number; caster: number; scrubRadius: number; trail: number } | null;
}

function memberLines(ctx: SweepContext, members: Record<string, { length: number; lengthChange: number; motionRatio?: number; wheelRate?: number }>, sweep: 'heave' | 'roll', u: LengthUnit): ReadoutLine[] {
  const lines: ReadoutLine[] = [];
  const shown = ctx.members.filter((m) => m.kind === 'shock' || m.kind === 'spring');
  for (const m of shown) {
    const r = members[m.id];
    if (!r) continue;
    const name = m.kind === 'shock' ? 'Shock' : 'Spring';
    const line: ReadoutLine = { key: `member-${m.id}`, label: `${name} ${m.id} length`, group: 'members', member: m.id, ...showLength(r.length, u) };
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
    const mrReason = sweep === 'roll' ? 'motion ratio is taken in heave (wheel travel), not in roll' : 'not defined here';
    lines.push({ key: `mr-${m.id}`, label: `${name} ${m.id} motion ratio`, group: 'members', member: m.id, ...showRatio(r.motionRatio, mrReason) });
    if (m.kind === 'spring' && m.rate !== undefined) {
      lines.push({ key: `wr-${m.id}`, label: `Wheel rate (${m.id})`, group: 'members', member: m.id, ...showRate(r.wheelRate, mrReason) });
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

/** The readout lines for the row at the cursor. */
export function readoutLines(cursor: CursorRow | null, ctx: SweepContext, u: LengthUnit): ReadoutLine[] {
  if (!cursor) return [];
  const why = reasons(ctx);
  if (cursor.sweep === 'heave') {
    const r = cursor.row;
    const ind = r as HeaveRow & IndependentFields;
    const lines: ReadoutLine[] = [
      { key: 'position', label: 'Position', group: 'position', text: showPosition('heave', r.travel, u) },
      // Pinion angle and lateral shift belong to a solid axle: an independent layout does not list them.
      ...(ctx.hasAxle
        ? [
            { key: 'pinion', label: 'Pinion angle change', group: 'axle' as const, ...showAngle(r.pinionAngleChange, why.axle, true) },
            { key: 'lateral', label: 'Lateral shift', group: 'axle' as const, ...showLength(r.lateralShift, u, why.axle, true) },
          ]
        : []),
      { key: 'foreaft', label: 'Fore-aft shift', group: 'axle', ...showLength(r.foreAftShift, u, undefined, true) },
      ...(ctx.hasAxle || r.antiSquat !== null ? [{ key: 'antisquat', label: 'Anti-squat', group: 'geometry' as const, ...showPercent(r.antiSquat, why.ic) }] : []),
      { key: 'ic-x', label: 'Instant centre x', group: 'geometry', ...showLength(r.instantCenter?.x, u, why.ic) },
      { key: 'ic-z', label: 'Instant centre height', group: 'geometry', ...showLength(r.instantCenter?.z, u, why.ic) },
      { key: 'rc', label: 'Roll centre height', group: 'geometry', ...showLength(r.rollCenterHeight, u, why.rc) },
      { key: 'bind', label: 'Bind', group: 'geometry', ...showLength(r.bind, u) },
    ];
    if (ind.camberChange !== undefined) lines.push({ key: 'camber', label: 'Camber change', group: 'axle', ...showAngle(ind.camberChange, undefined, true) });
    if (ind.toeChange !== undefined) lines.push({ key: 'toe', label: 'Toe change (bump steer)', group: 'axle', ...showAngle(ind.toeChange, undefined, true, 3) });
    if (ind.trackChange !== undefined) lines.push({ key: 'track', label: 'Track change', group: 'axle', ...showLength(ind.trackChange, u, undefined, true) });
    if (ind.casterChange !== undefined) lines.push({ key: 'caster', label: 'Caster change', group: 'axle', ...showAngle(ind.casterChange, undefined, true) });
    if (ind.antiDive !== undefined) lines.push({ key: 'antidive', label: 'Anti-dive', group: 'geometry', ...showPercent(ind.antiDive, why.ic) });
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
    return [...lines, ...memberLines(ctx, r.members, 'heave', u), ...drivelineLines(r.driveline, u)];
  }
  const r = cursor.row;
  return [
    { key: 'position', label: 'Position', group: 'position', text: showPosition('roll', r.roll, u) },
    { key: 'left', label: 'Left wheel travel', group: 'axle', ...showLength(r.leftTravel, u, undefined, true) },
    { key: 'right', label: 'Right wheel travel', group: 'axle', ...showLength(r.rightTravel, u, undefined, true) },
    { key: 'rollsteer', label: 'Roll steer', group: 'geometry', ...showPercent(r.rollSteer, 'no roll: roll steer is a ratio to the roll angle', true) },
    { key: 'bind', label: 'Bind', group: 'geometry', ...showLength(r.bind, u) },
    ...memberLines(ctx, r.members, 'roll', u),
    ...drivelineLines(r.driveline, u),
  ];
}
