/**
 * The double-wishbone starter built the way it was before its wishbones became bodies: each wishbone two `link`s
 * of its group from the hinge's two frame pivots to the knuckle's ball-joint point. Points left on an arm (the
 * coil-over's lower eye) move to the knuckle of that side, where they stay put; the camber, toe and track curves do
 * not depend on them.
 */
import type { SketchInput } from '../../shared/schema/sketch';

const ARM = /^(upper|lower)-arm-(left|right)$/;

/** The same linkage with every wishbone arm body written as two links. */
export function wishboneArmsAsLinks(doc: SketchInput): SketchInput {
  const out = structuredClone(doc);
  const bodyOf = new Map(doc.points.map((p) => [p.id, p.body]));
  const jointPoints = new Set<string>();
  const members: SketchInput['members'] = [];
  for (const m of doc.members) {
    if (m.kind === 'ball-joint') continue;
    if (m.kind === 'hinge' && ARM.test(m.body)) {
      const group = ARM.exec(m.body)![1] as 'upper' | 'lower';
      const ball = doc.members.find((b) => b.kind === 'ball-joint' && bodyOf.get(b.a) === m.body)!;
      jointPoints.add(ball.a);
      members.push(
        { id: `${m.id}.f`, kind: 'link', group, a: m.a, b: ball.b },
        { id: `${m.id}.r`, kind: 'link', group, a: m.b, b: ball.b },
      );
      continue;
    }
    members.push(m);
  }
  out.members = members;
  out.points = doc.points
    .filter((p) => !jointPoints.has(p.id))
    .map((p) => {
      const arm = ARM.exec(p.body);
      return arm ? { ...p, body: arm[2] === 'left' ? ('knuckle-left' as const) : ('knuckle-right' as const) } : p;
    });
  return out;
}
