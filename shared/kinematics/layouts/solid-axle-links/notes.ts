/** The note for a solid axle the links do not locate in pitch (it goes into the result's `warnings`). */
import type { Sketch } from '../../../schema/sketch';
import { hasLeafSprings } from '../leaf-spring/rows';
import type { SolidAxleLinksPlan } from './rows';

/** A solid axle without a left upper and lower link: no instant centre or anti-squat (leaf springs have their own notes). */
export function solidAxleLinksNotes(sketch: Sketch, plan: SolidAxleLinksPlan): string[] {
  if (hasLeafSprings(sketch) || !plan.axle || (plan.upper && plan.lower)) return [];
  return ['No upper and lower link groups on the left side: no instant centre or anti-squat.'];
}
