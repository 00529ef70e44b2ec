/** The notes for a solid axle the links do not locate in pitch, or locate the wrong way round for its end (`warnings`). */
import type { Sketch } from '../../../schema/sketch';
import { hasLeafSprings } from '../leaf-spring/rows';
import type { LinkEnds, SolidAxleLinksPlan } from './rows';

/** mm the frame end of a link lies ahead of its axle end (negative: behind), at ride. */
function forwardRun(sketch: Sketch, link: LinkEnds): number {
  const onFrame = (id: string) => sketch.points.find((p) => p.id === id)?.body === 'frame';
  const [frame, axle] = onFrame(link.a.id) ? [link.a, link.b] : [link.b, link.a];
  return frame.ride.x - axle.ride.x;
}

/**
 * A solid axle without a left upper and lower link: no instant centre or anti-squat (anti-dive at the front;
 * leaf springs have their own notes). A front axle whose links both run forward to the frame, as a rear
 * axle's do: its anti-dive and anti-lift come out negative, which is most often a rear sketch marked front.
 */
export function solidAxleLinksNotes(sketch: Sketch, plan: SolidAxleLinksPlan): string[] {
  if (hasLeafSprings(sketch) || !plan.axle) return [];
  const front = plan.axleEnd === 'front';
  if (!plan.upper || !plan.lower) {
    return [
      `No upper and lower link groups on the left side: no instant centre or ${front ? 'anti-dive' : 'anti-squat'}.`,
    ];
  }
  if (front && forwardRun(sketch, plan.upper) > 0 && forwardRun(sketch, plan.lower) > 0) {
    return [
      "The axle is set at the front but its links run forward to the frame, as a rear axle's do: its anti-dive and anti-lift are read as they stand (most often negative).",
    ];
  }
  return [];
}
