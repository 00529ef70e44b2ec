/**
 * The readout: the numbers of the sweep row at the slider position, as lines of text in
 * the user's units. A number the sweep does not define shows "—" with the reason.
 */
import type { HeaveRow, RollRow } from '../../shared/kinematics';
import type { LinkLoadSummary, SteerResult, SteerRow, WindUpReading } from '../../shared/kinematics/types';
import { innerOuter } from '../../shared/kinematics/steer/readings';
import type { SketchMember } from '../../shared/schema/sketch';
import type { LengthUnit } from '../../shared/units';
import {
  isMetricRef,
  metricEntry,
  readoutHeaveView,
  readoutLeafMetric,
  readoutRollView,
  readoutSteerView,
  linkLoadEntry,
  memberEntry,
  metricHelp,
  windUpEntry,
  type AxleEnd,
  type MetricEntry,
  type MetricRef,
} from '../../shared/kinematics/metrics/registry';
import { DEFAULT_AXLE_TORQUE_NM } from '../../shared/schema/sketchVocabulary';
import {
  showAngle,
  showForce,
  showLength,
  showMetric,
  showPosition,
  showRate,
  showRatio,
  showTorque,
  type Shown,
} from '../../shared/display/format';
import { showSteerPosition, steerAt, type SteerInput } from '../../shared/display/steerInput';

export interface ReadoutLine extends Shown {
  key: string;
  label: string;
  group: 'position' | 'steer' | 'axle' | 'geometry' | 'members' | 'leaf' | 'loads' | 'driveline';
  /** member to select on click, for member lines */
  member?: string;
  /** 'negative' when a shock sits at or past a limit, or a link load reverses or passes its limit */
  tone?: 'negative';
  /** a remark on a number that is shown (tooltip), e.g. an assumed load split */
  hint?: string;
  /** what the number is and its sign convention, from the registry (the label's tooltip) */
  help?: string;
}

/** What the readout shows of the sweep besides the row at the cursor (leaf-spring wind-up, link loads). */
export interface ReadoutExtras {
  windUp?: WindUpReading;
  loads?: LinkLoadSummary;
  /** true when the sketch gives no axle torque, so wind-up and link loads use DEFAULT_AXLE_TORQUE_NM */
  torqueIsDefault?: boolean;
}

/**
 * The axle torque the loads assume, in words: the sketch's own, or the default when it gives none.
 * Shown with the link loads and the wind-up, so that a number is never read without its load.
 */
export function torqueAssumed(torqueNm: number, isDefault: boolean, u: LengthUnit): string {
  const shown = showTorque(torqueNm, u).text;
  return isDefault
    ? `Under an axle torque of ${shown}, the default (the sketch gives none; set it in the axle torque box).`
    : `Under the sketch's axle torque of ${shown}.`;
}

/** The default axle torque in the user's units, for the empty torque box's hint. */
export function defaultTorqueText(u: LengthUnit): string {
  return showTorque(DEFAULT_AXLE_TORQUE_NM, u).text;
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
  /** the end of the vehicle the suspension sits at (`vehicle.axle`), for the sign words of roll steer; rear when absent */
  axleEnd?: AxleEnd;
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

const LENGTH = memberEntry('length');
const LENGTH_CHANGE = memberEntry('lengthChange');
const MOTION_RATIO = memberEntry('motionRatio');
const WHEEL_RATE = memberEntry('wheelRate');

function capitalized(words: string): string {
  return words.charAt(0).toUpperCase() + words.slice(1);
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
      label: `${name} ${m.id} ${LENGTH.label}`,
      group: 'members',
      member: m.id,
      help: metricHelp(LENGTH),
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
      label: `${name} ${m.id} ${MOTION_RATIO.label}`,
      group: 'members',
      member: m.id,
      help: metricHelp(MOTION_RATIO),
      ...showRatio(r.motionRatio, mrReason),
    });
    if (m.kind === 'spring' && m.rate !== undefined) {
      lines.push({
        key: `wr-${m.id}`,
        // A wheel rate belongs to the wheel: named first, its spring after it.
        label: `${capitalized(WHEEL_RATE.label)} (${m.id})`,
        group: 'members',
        member: m.id,
        help: metricHelp(WHEEL_RATE),
        ...showRate(r.wheelRate, u, mrReason),
      });
    }
    if (windUp) {
      // A leaf-sprung axle: the stroke each shock uses in travel and what the wind-up alone takes of it.
      lines.push({
        key: `dl-${m.id}`,
        label: `${name} ${m.id} ${LENGTH_CHANGE.label} (${sweep})`,
        group: 'members',
        member: m.id,
        help: metricHelp(LENGTH_CHANGE),
        ...showLength(r.lengthChange, u, undefined, true),
      });
      const w = windUp.members[m.id];
      lines.push({
        key: `wu-${m.id}`,
        label: `${name} ${m.id} ${LENGTH_CHANGE.label} (wind-up)`,
        group: 'members',
        member: m.id,
        help: metricHelp(LENGTH_CHANGE),
        ...showLength(w?.lengthChange, u, 'not solved under the wind-up', true),
      });
    }
  }
  return lines;
}

/** The leaf-spring lines: shackle angle at the cursor, the axle's wind-up at ride under the axle torque. */
function leafLines(
  shackleAngle: number | null | undefined,
  hasShackle: boolean,
  windUp: WindUpReading | undefined,
  u: LengthUnit,
  torqueIsDefault: boolean,
): ReadoutLine[] {
  const lines: ReadoutLine[] = [];
  if (hasShackle) {
    const shackle = metricEntry(readoutLeafMetric);
    lines.push({
      key: shackle.id,
      label: shackle.label,
      group: 'leaf',
      help: metricHelp(shackle),
      ...showMetric(shackle, shackleAngle, u, shackle.missing),
    });
  }
  if (!windUp) return lines;
  const torque = showTorque(windUp.torque, u).text;
  const [angle, rate, bind] = (['angle', 'rate', 'bind'] as const).map(windUpEntry);
  const under = torqueAssumed(windUp.torque, torqueIsDefault, u);
  lines.push(
    {
      key: angle.id,
      label: `${angle.label} (${torque})`,
      group: 'leaf',
      help: `${metricHelp(angle)} ${under}`,
      ...showAngle(angle.read(windUp), angle.missing, true),
    },
    {
      key: rate.id,
      label: rate.label,
      group: 'leaf',
      help: metricHelp(rate),
      ...showMetric(rate, rate.read(windUp), u, rate.missing),
    },
    {
      key: bind.id,
      label: bind.label,
      group: 'leaf',
      help: `${metricHelp(bind)} ${under}`,
      ...showLength(bind.read(windUp), u),
    },
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
  u: LengthUnit,
  torqueIsDefault: boolean,
): ReadoutLine[] {
  const lines: ReadoutLine[] = [];
  const help = `${metricHelp(linkLoadEntry)} ${torqueAssumed(loads.torque, torqueIsDefault, u)}`;
  const split = loads.indeterminate
    ? 'more links than the axle motions they locate: the split shown is the least-squares one (equal bushing stiffness); real bushings share it differently'
    : undefined;
  if (split) lines.push({ key: 'load-split', label: 'Load split', group: 'loads', text: 'indeterminate', hint: split });
  for (const m of ctx.members) {
    const reading = loads.members[m.id];
    if (!reading) continue;
    const name = m.kind === 'lateral-rod' ? 'Lateral rod' : 'Link';
    const at = sweep === 'heave' ? rowLoads?.[m.id] : reading.ride;
    const shown = showForce(at, u, 'the links do not locate the axle at this position', linkLoadEntry.signed);
    const marks: string[] = [];
    if (reading.reverses) marks.push('reverses');
    if (reading.overLimit) marks.push('over limit');
    const line: ReadoutLine = {
      key: `load-${m.id}`,
      label: `${name} ${m.id} ${linkLoadEntry.label}${sweep === 'roll' ? ' at ride' : ''}`,
      group: 'loads',
      member: m.id,
      help,
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
            ? `passes the limit of ${showForce(loads.limit, u).text} within the travel`
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

type Reasons = ReturnType<typeof reasons>;

/**
 * The line of one registry metric at a row, or none where the readout leaves it out: a solid
 * axle's quantity without an axle, or an addition the sweep does not give for this sketch.
 */
function metricLine(
  ref: MetricRef,
  row: HeaveRow | RollRow,
  ctx: SweepContext,
  why: Reasons,
  u: LengthUnit,
): ReadoutLine | null {
  const entry = metricEntry(ref) as MetricEntry<'heave'> | MetricEntry<'roll'>;
  const read = entry.read as (r: HeaveRow | RollRow) => number | null | undefined;
  const given = entry.given as ((r: HeaveRow | RollRow) => boolean) | undefined;
  if (entry.axle === 'only' && !ctx.hasAxle) return null;
  if (entry.axle === 'or-defined' && !ctx.hasAxle && read(row) === null) return null;
  if (given && !given(row)) return null;
  if (entry.hidden && (entry.hidden as (r: HeaveRow | RollRow) => boolean)(row)) return null;
  return {
    key: entry.id,
    label: entry.shortLabel ?? entry.label,
    group: entry.group ?? 'geometry',
    help: metricHelp(entry, ctx.axleEnd),
    ...showMetric(entry, read(row), u, entry.why ? why[entry.why] : entry.missing),
  };
}

/** The readout lines for the row at the cursor, in the order of the registry's readout views. */
export function readoutLines(
  cursor: CursorRow | null,
  ctx: SweepContext,
  u: LengthUnit,
  extras: ReadoutExtras = {},
): ReadoutLine[] {
  if (!cursor) return [];
  const why = reasons(ctx);
  const hasShackle = ctx.members.some((m) => m.kind === 'leaf-half');
  const r = cursor.row;
  const heave = cursor.sweep === 'heave' ? cursor.row : undefined;
  const lines: ReadoutLine[] = [];
  for (const item of cursor.sweep === 'heave' ? readoutHeaveView : readoutRollView) {
    if (isMetricRef(item)) {
      const line = metricLine(item, r, ctx, why, u);
      if (line) lines.push(line);
    } else if (item === '*position') {
      const at = heave ? heave.travel : (r as RollRow).roll;
      lines.push({ key: 'position', label: 'Position', group: 'position', text: showPosition(cursor.sweep, at, u) });
    } else if (item === '*leaf') {
      lines.push(...leafLines(heave?.shackleAngle, hasShackle, extras.windUp, u, !!extras.torqueIsDefault));
    } else if (item === '*loads') {
      if (extras.loads) {
        lines.push(...loadLines(ctx, extras.loads, heave?.linkLoads, cursor.sweep, u, !!extras.torqueIsDefault));
      }
    } else lines.push(...memberLines(ctx, r.members, cursor.sweep, u, extras.windUp));
  }
  return lines;
}

/**
 * The readout lines at the steer slider, in the order of the registry's steer view: the input's position,
 * each wheel's steer angle named inner or outer for the way the wheels turn, Ackermann %, the turning radius
 * and the worst bump steer of the map out to lock. A view item the rows do not carry (another layout's
 * input) is left out.
 */
export function steerReadoutLines(steer: SteerResult, row: SteerRow, input: SteerInput, u: LengthUnit): ReadoutLine[] {
  const io = innerOuter(row.leftSteer, row.rightSteer);
  const inner = io ? (io.sense > 0 ? 'leftSteer' : 'rightSteer') : null;
  const lines: ReadoutLine[] = [
    { key: 'position', label: 'Position', group: 'position', text: showSteerPosition(steerAt(row, input), input, u) },
  ];
  for (const ref of readoutSteerView) {
    if (ref.sweep === 'bumpSteer') {
      const entry = metricEntry(ref);
      const map = steer.bumpSteer;
      lines.push({
        key: entry.id,
        label: entry.label,
        group: 'steer',
        help: metricHelp(entry),
        ...showMetric(entry, map ? entry.read(map) : null, u, map ? entry.missing : 'not swept yet'),
      });
      continue;
    }
    const entry = metricEntry(ref as MetricRef & { sweep: 'steer' });
    const v = (entry.read as (r: SteerRow) => number | null | undefined)(row);
    if (v === undefined) continue;
    const role = entry.key === inner ? ' (inner)' : io && /Steer$/.test(entry.key) ? ' (outer)' : '';
    lines.push({
      key: entry.id,
      label: `${entry.shortLabel ?? entry.label}${role}`,
      group: 'steer',
      help: metricHelp(entry),
      ...showMetric(entry, v, u, entry.missing),
    });
  }
  return lines;
}
