/** Test helpers for the kinematics core: sketch files, finite-number walks. */
import { readFileSync } from 'node:fs';
import type { SketchInput } from '../../../shared/schema/sketch';

/** The example sketch file the format documentation ships (docs/examples). */
export function exampleSketch(): SketchInput {
  const url = new URL('../../../docs/examples/workshop-runabout.sketch.json', import.meta.url);
  return JSON.parse(readFileSync(url, 'utf8')) as SketchInput;
}

/** Every number inside a value, with its path. */
export function numbersIn(
  v: unknown,
  path = '',
  out: { path: string; value: number }[] = [],
): { path: string; value: number }[] {
  if (typeof v === 'number') out.push({ path, value: v });
  else if (Array.isArray(v)) v.forEach((x, i) => numbersIn(x, `${path}[${i}]`, out));
  else if (v && typeof v === 'object')
    for (const [k, x] of Object.entries(v)) numbersIn(x, path ? `${path}.${k}` : k, out);
  return out;
}

/** Paths of non-finite numbers (NaN, ±Infinity) inside a value. */
export function nonFinite(v: unknown): string[] {
  return numbersIn(v)
    .filter((n) => !Number.isFinite(n.value))
    .map((n) => n.path);
}

/** A deep copy of a sketch with every point moved by `f`. */
export function mapPoints(
  doc: SketchInput,
  f: (p: { x: number; y: number; z: number }) => { x: number; y: number; z: number },
): SketchInput {
  const copy = structuredClone(doc);
  copy.points = copy.points.map((p) => ({ ...p, ...f(p) }));
  return copy;
}

/** A minimal valid document around the given points and members. */
export function sketchOf(parts: {
  points: SketchInput['points'];
  members: SketchInput['members'];
  vehicle?: Partial<SketchInput['vehicle']>;
  sweep?: SketchInput['sweep'];
  wheels?: SketchInput['wheels'];
  driveline?: SketchInput['driveline'];
}): SketchInput {
  return {
    format: 'arcwright.sketch',
    version: 1,
    name: 'Test sketch',
    layout: 'four-link-lateral-rod',
    vehicle: { wheelbase: 3000, cgHeight: 600, track: 1600, tireRadius: 400, ...parts.vehicle },
    points: parts.points,
    members: parts.members,
    wheels: parts.wheels ?? { left: 'WC.l', right: 'WC.r' },
    ...(parts.driveline ? { driveline: parts.driveline } : {}),
    ...(parts.sweep ? { sweep: parts.sweep } : {}),
  };
}
