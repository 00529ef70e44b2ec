/**
 * Three rear suspensions of one frame for the line-up's browser test: the leaf-spring, four-link and
 * trailing-arm starters, with a few frame pivots placed by hand so that (at the 10 mm default tolerance)
 * - the shock tops of all three share a bracket each side: the four-link's SH.fl (−140, 530, 880), the leaf
 *   spring's SH.f.l 5 mm from it (0, +4, −3) and the trailing arm's SH.fl 5 mm from it (+4, 0, +3), √(16+16+36) ≈ 8.2 mm
 *   from the leaf spring's; mirrored on the right;
 * - the four-link's and the trailing arm's left spring seats share one: (−60, 470, 720) and 5 mm off (+3, +4, 0);
 * - their right spring seats are a near miss: 22 mm apart straight up, "move by 12 mm".
 * Every other frame pivot of the starters is over 30 mm from any other variant's.
 */
import { starters } from '../../shared/kinematics';
import type { Sketch } from '../../shared/schema/sketch';

function place(sketch: Sketch, id: string, x: number, y: number, z: number): void {
  const p = sketch.points.find((q) => q.id === id);
  if (!p) throw new Error(`no point ${id}`);
  Object.assign(p, { x, y, z });
}

export function platformVariants(): Sketch[] {
  const leaf = starters['leaf-spring']!.build();
  place(leaf, 'SH.f.l', -140, 534, 877);
  place(leaf, 'SH.f.r', -140, -534, 877);
  const fourLink = starters['four-link-lateral-rod']!.build();
  const trailing = starters['trailing-arm']!.build();
  place(trailing, 'SH.fl', -136, 530, 883);
  place(trailing, 'SH.fr', -136, -530, 883);
  place(trailing, 'SP.fl', -57, 474, 720);
  place(trailing, 'SP.fr', -60, -470, 742);
  return [leaf, fourLink, trailing];
}
