import type { Layout } from '../schema/sketch';

/**
 * What the board draws over the linkage for a layout, beyond the pivots and members:
 * - `wishbone`: the double-wishbone constructions (BoardCanvasWishbone), in place of the
 *   solid-axle instant-centre and roll-centre lines (BoardCanvasGeometry);
 * - `leaf-arm`: the leaf-spring packs or the trailing arms (BoardCanvasLeafArm), on top of them;
 * - null: the solid-axle lines alone.
 */
export type CanvasOverlay = 'wishbone' | 'leaf-arm' | null;

/** How the client shows one layout type: its name, its drawing and the words for its moving bodies. */
export interface SuspensionDescriptor {
  layout: Layout;
  /** the layout's name as the UI shows it */
  label: string;
  overlay: CanvasOverlay;
  /** the cross (y–z) view's name: a front layout's is its front view (still drawn as seen from behind) */
  crossView: 'front' | 'rear';
  /** the moving bodies' names: in the side view's legend ("… pivot"), and as the build sheet's pivot table title */
  moving: { legend: string; pivotsTitle: string };
  /** where the board's side-view anti-squat line starts: the contact patch, or the wheel centre (frame-mounted drive) */
  antiSquatFrom: 'contact-patch' | 'wheel-centre';
}
