/**
 * The legend of the pivot codes on the build sheet's drawings: for each pivot id, the body it is on
 * and what it joins (the members that end at it, the wheel it centres, the driveline joint or steering box part
 * it places),
 * so a fabricator can read a code without the board. Pure.
 */
import type { Sketch } from '../schema/sketch';
import { kindLabel } from '../display/memberKinds';

export interface PivotLegendEntry {
  id: string;
  /** the body, in words ("frame", "axle", "lower arm left") */
  on: string;
  /** what meets there, in words */
  joins: string;
}

/** What the driveline, half-shaft and pitman-arm blocks name each of their points. */
function drivelineRoles(sketch: Sketch): Map<string, string> {
  const roles = new Map<string, string>();
  const d = sketch.driveline;
  if (d) {
    roles.set(d.output, 'driveshaft joint at the gearbox output (reference point, not a bracket)');
    roles.set(d.outputAxis, 'point on the gearbox output axis (reference point, not a bracket)');
    roles.set(d.pinion, 'driveshaft joint at the pinion (reference point)');
    roles.set(d.pinionAxis, 'point on the pinion axis (reference point)');
  }
  for (const side of ['left', 'right'] as const) {
    const h = sketch.halfShafts?.[side];
    if (!h) continue;
    roles.set(h.inner, `${side} half-shaft inner joint (reference point, not a bracket)`);
    roles.set(h.innerAxis, `point on the drive unit's ${side} output axis (reference point, not a bracket)`);
    roles.set(h.outer, `${side} half-shaft outer joint (reference point)`);
    roles.set(h.outerAxis, `point on the ${side} wheel's spin axis (reference point)`);
  }
  const pitman = sketch.pitmanArm;
  if (pitman?.pivot) roles.set(pitman.pivot, 'steering box output shaft, where the pitman arm turns');
  if (pitman?.axis) roles.set(pitman.axis, "point on the steering box's output axis");
  if (pitman?.ball) roles.set(pitman.ball, "pitman arm's ball");
  return roles;
}

export function pivotLegend(sketch: Sketch): PivotLegendEntry[] {
  const driveline = drivelineRoles(sketch);
  return sketch.points.map((p) => {
    const joins: string[] = [];
    if (p.id === sketch.wheels.left) joins.push('left wheel centre');
    if (p.id === sketch.wheels.right) joins.push('right wheel centre');
    const role = driveline.get(p.id);
    if (role) joins.push(role);
    for (const m of sketch.members) {
      const ends = [m.a, m.b];
      if (m.kind === 'leaf-half') ends.push(m.seat);
      if (!ends.includes(p.id)) continue;
      const end = m.kind === 'leaf-half' && m.seat === p.id ? 'seat of' : m.kind === 'hinge' ? 'axis of' : 'end of';
      joins.push(`${end} ${m.id} (${kindLabel(m.kind)})`);
    }
    return { id: p.id, on: p.body.replace(/-/g, ' '), joins: joins.join('; ') || 'no member' };
  });
}
