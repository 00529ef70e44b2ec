/**
 * The build sheet as data: what a fabricator needs from a sketch to cut and weld it, in the
 * user's unit. Every pivot's position (frame brackets apart from the axle's or arms' mounts and
 * from the driveline's reference points), every member centre to centre at ride height, the
 * shocks' lengths across the travel against their stroke, the geometry the sweep reads for the
 * layout, and the targets and flags. Pure: the browser's printable page and the server's PDF
 * both lay out this one model.
 */
import { drivelineReferenceIds } from '../drivelineReferences';
import type { SweepResult } from '../kinematics/types';
import type { Sketch } from '../schema/sketch';
import { formatLength, mmToUnit, type LengthUnit } from '../units';
import { vecDistance } from '../vec3';
import { fixed, MISSING, showMetric, showRate, showRatio } from '../display/format';
import { bandText, buildFlags, type Flag } from '../display/flags';
import { bandIsSet, checkTargets, readTargets, type TargetCheck } from '../display/targets';
import type { TargetMetric } from '../schema/boardFields';
import { starters } from '../kinematics/starters';
import { crossViewOf, suspensionOf } from '../suspensions';
import {
  axleEndOf,
  memberEntry,
  metricEntry,
  metricHelp,
  metricShown,
  sheetView,
  targetEntries,
  type AxleEnd,
  type MetricEntry,
  type SheetItem,
} from '../kinematics/metrics/registry';
import { kindLabel } from '../display/memberKinds';

export interface SheetPivot {
  id: string;
  body: string;
  /** x, y, z in the user's unit, as text */
  x: string;
  y: string;
  z: string;
}

export interface SheetMember {
  id: string;
  kind: string;
  ends: string;
  /** centre to centre at ride height */
  length: string;
  /** shocks: shortest and longest the travel asks of it, against its stroke; springs: rate and motion ratio */
  note: string;
}

export interface SheetLine {
  label: string;
  value: string;
  /** why the value is missing ("—"), where it is */
  reason?: string;
  /** what the quantity is and its sign convention, from the registry (the label's tooltip) */
  help?: string;
}

/** One target band and how the sweep meets it. */
export interface SheetTarget {
  label: string;
  /** the band in words ("60.0–90.0 %") */
  band: string;
  /** "met", or where it is missed, or why it cannot be checked */
  status: string;
}

export interface SheetFlag {
  severity: Flag['severity'];
  title: string;
  detail: string;
}

export interface BuildSheet {
  /** the layout's name */
  layout: string;
  /** the cross (y–z) view's name: a front layout's is its front view */
  crossView: 'front' | 'rear';
  /** the moving pivots' table title ("Axle pivots", "Knuckle pivots") */
  movingTitle: string;
  vehicle: SheetLine[];
  /** frame pivots that carry a bracket */
  frame: SheetPivot[];
  moving: SheetPivot[];
  /** the driveline's and half-shafts' reference points (on the frame or a moving body): not brackets */
  driveline: SheetPivot[];
  members: SheetMember[];
  /** the sweep's readings; empty with `problem` set when the sketch cannot be swept */
  geometry: SheetLine[];
  targets: SheetTarget[];
  flags: SheetFlag[];
  problem: string | null;
}

/** Where the sketch's datum is and which way its axes point (docs/sketch-format.md, "Axes and signs"). */
export const DATUM_TEXT =
  'Datum: x = 0 is the line under the wheel centres, y = 0 the vehicle\u2019s centreline, z = 0 the ground at ride ' +
  'height. x points forward, y to the vehicle\u2019s left, z up. Every coordinate on this sheet is measured from ' +
  'this datum.';

function coordinate(v: number, u: LengthUnit): string {
  const d = u === 'in' ? 2 : 1;
  return fixed(mmToUnit(v, u), d);
}

function pivot(p: Sketch['points'][number], u: LengthUnit): SheetPivot {
  return {
    id: p.id,
    body: p.body.replace('-', ' '),
    x: coordinate(p.x, u),
    y: coordinate(p.y, u),
    z: coordinate(p.z, u),
  };
}

/** The span a member's length takes over the heave sweep (mm), or null when the sweep has no reading of it. */
function lengthSpan(result: SweepResult | null, id: string): { min: number; max: number } | null {
  const lengths = (result?.heave ?? []).map((r) => r.members[id]?.length).filter((v): v is number => v !== undefined);
  return lengths.length ? { min: Math.min(...lengths), max: Math.max(...lengths) } : null;
}

function memberNote(m: Sketch['members'][number], result: SweepResult | null, u: LengthUnit): string {
  if (m.kind === 'shock') {
    const span = lengthSpan(result, m.id);
    const used = span ? `${formatLength(span.min, u)} to ${formatLength(span.max, u)} over the travel` : 'not swept';
    const stroke =
      m.minLength !== undefined && m.maxLength !== undefined
        ? `stroke ${formatLength(m.minLength, u)} to ${formatLength(m.maxLength, u)}`
        : 'no stroke given';
    return `${stroke}; ${used}`;
  }
  if (m.kind === 'spring') {
    const mr = result?.ride.members[m.id]?.motionRatio;
    const rate = m.rate === undefined ? 'no rate given' : showRate(m.rate, u).text;
    return `${rate}; ${memberEntry('motionRatio').label} ${showRatio(mr).text} at ride`;
  }
  if (m.kind === 'link' && m.group) return `${m.group} link`;
  return '';
}

/** Why a number of the build sheet is missing. */
const SHEET_MISSING = { reached: 'no roll sweep', ride: 'not defined' } as const;

/**
 * Whether the sheet has a line for the item: only where the sketch's layout gives the quantity (the
 * registry's `layouts`), and a reading of the travel only where the sweep gives it for this sketch and it
 * means something there (no anti-squat for a front axle, no anti-dive for a rear one).
 */
function sheetShows(item: SheetItem, result: SweepResult, layout: string): boolean {
  const refs = 'metric' in item ? [item.metric] : item.metrics;
  const entries = refs.map((r) => metricEntry(r));
  if (!entries.every((e) => (e.layouts as readonly string[]).includes(layout))) return false;
  if (item.at === 'reached') return true;
  return entries.every((e) => metricShown(e as MetricEntry<'heave'>, result.ride));
}

/** One geometry line of the build sheet: a metric's limit, its value at ride, or its span over the travel. */
function sheetLine(item: SheetItem, result: SweepResult, u: LengthUnit, end: AxleEnd): SheetLine {
  const heave = result.heave;
  if (item.at === 'ride-point') {
    const [ex, ez] = item.metrics.map((m) => metricEntry(m) as MetricEntry<'heave'>);
    const [x, z] = [ex.read(result.ride), ez.read(result.ride)];
    const axes = item.metrics.map((m) => m.key.split('.').pop()).join(', ');
    return {
      label: `${ex.point} at ride (${axes})`,
      help: `${metricHelp(ex, end)} ${metricHelp(ez, end)}`,
      value:
        x !== null && x !== undefined && z !== null && z !== undefined
          ? `${formatLength(x, u)}, ${formatLength(z, u)}`
          : MISSING,
    };
  }
  const entry = metricEntry(item.metric);
  const help = metricHelp(entry, end);
  if (item.at === 'reached') {
    if (entry.sweep === 'limits') {
      const v = (entry as MetricEntry<'limits'>).read(result.limits);
      return { label: `${entry.label} reached`, help, value: showMetric(entry, v, u, SHEET_MISSING.reached).text };
    }
    // Travel: how far the sweep reached each way.
    return {
      label: `${entry.label} reached`,
      help,
      value: `${formatLength(-result.limits.droop, u)} droop, ${formatLength(result.limits.bump, u)} bump`,
    };
  }
  const read = (entry as MetricEntry<'heave'>).read;
  if (item.at === 'ride') {
    const shown = showMetric(entry, read(result.ride), u, SHEET_MISSING.ride);
    return { label: `${entry.label} at ride`, help, value: shown.text, reason: shown.reason };
  }
  const vals = heave.map(read).filter((x): x is number => x !== null && x !== undefined && Number.isFinite(x));
  const show = (v: number) => showMetric(entry, v, u, '').text;
  return {
    label: `${entry.label} over the travel`,
    help,
    value: vals.length ? `${show(Math.min(...vals))} to ${show(Math.max(...vals))}` : MISSING,
    reason: vals.length ? undefined : 'not defined anywhere in the travel',
  };
}

/** Each target band with how the sweep meets it; a missed one in the words of its flag (where it leaves the band). */
function sheetTargets(sketch: Sketch, checks: TargetCheck[] | null, flags: Flag[], u: LengthUnit): SheetTarget[] {
  if (!checks) {
    return Object.entries(readTargets(sketch))
      .filter(([, band]) => bandIsSet(band))
      .map(([metric, band]) => {
        const m = metric as TargetMetric;
        return { label: targetEntries[m].label, band: bandText({ metric: m, band: band! }, u), status: 'not checked' };
      });
  }
  return checks.map((c) => {
    const flag = flags.find((f) => f.key === `target-${c.metric}`);
    return {
      label: targetEntries[c.metric].label,
      band: bandText(c, u),
      status: c.status === 'met' ? 'met' : `${c.status === 'missed' ? 'missed' : 'not checked'}: ${flag?.detail ?? ''}`,
    };
  });
}

export function buildSheet(
  sketch: Sketch,
  result: SweepResult | null,
  problem: string | null,
  u: LengthUnit,
): BuildSheet {
  const byId = new Map(sketch.points.map((p) => [p.id, p] as const));
  const v = sketch.vehicle;
  const vehicle: SheetLine[] = [
    { label: 'Wheelbase', value: formatLength(v.wheelbase, u) },
    { label: 'Track', value: formatLength(v.track, u) },
    { label: 'Tyre radius', value: formatLength(v.tireRadius, u) },
    { label: 'Centre of gravity height', value: formatLength(v.cgHeight, u) },
  ];
  const members: SheetMember[] = sketch.members.map((m) => {
    const a = byId.get(m.a);
    const b = byId.get(m.b);
    const length = a && b ? formatLength(vecDistance(a, b), u) : '—';
    return { id: m.id, kind: kindLabel(m.kind), ends: `${m.a} – ${m.b}`, length, note: memberNote(m, result, u) };
  });

  const geometry: SheetLine[] = result
    ? sheetView
        .filter((item) => sheetShows(item, result, sketch.layout))
        .map((item) => sheetLine(item, result, u, axleEndOf(v)))
    : [];
  const reference = drivelineReferenceIds(sketch);
  const checks = result ? checkTargets(result, readTargets(sketch)) : null;
  const flags = buildFlags(result, sketch.members, checks ?? [], u);
  return {
    layout: starters[sketch.layout]?.label ?? sketch.layout,
    crossView: crossViewOf(sketch),
    movingTitle: suspensionOf(sketch.layout)?.moving.pivotsTitle ?? 'Axle pivots',
    vehicle,
    frame: sketch.points.filter((p) => p.body === 'frame' && !reference.has(p.id)).map((p) => pivot(p, u)),
    moving: sketch.points.filter((p) => p.body !== 'frame' && !reference.has(p.id)).map((p) => pivot(p, u)),
    driveline: sketch.points.filter((p) => reference.has(p.id)).map((p) => pivot(p, u)),
    members,
    geometry,
    targets: sheetTargets(sketch, checks, flags, u),
    flags: flags.map((f) => ({ severity: f.severity, title: f.title, detail: f.detail })),
    problem,
  };
}
