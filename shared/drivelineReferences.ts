/**
 * The points that only place the driveline or the half-shafts: joint centres and shaft axes, on the
 * frame or on a moving body. Nothing pivots on them, so no bracket is cut for them: the build sheet lists
 * them apart and the line-up never matches them as brackets.
 */
import type { Sketch } from './schema/sketch';

export function drivelineReferenceIds(sketch: Pick<Sketch, 'driveline' | 'halfShafts'>): Set<string> {
  const ids = new Set<string>();
  const d = sketch.driveline;
  if (d) for (const id of [d.output, d.outputAxis, d.pinion, d.pinionAxis]) ids.add(id);
  for (const h of [sketch.halfShafts?.left, sketch.halfShafts?.right])
    if (h) for (const id of [h.inner, h.innerAxis, h.outer, h.outerAxis]) ids.add(id);
  return ids;
}
