/**
 * Which views of the board are drawn now, and their Konva stages, for exports that take a picture of
 * them (the views as PNG). Each view's canvas registers itself while it is mounted: the plan view only while
 * its tab is shown in place of the front view, and a phone shows one view at a time, so only that one is
 * listed then.
 */
import { onBeforeUnmount } from 'vue';
import type Konva from 'konva';
import type { ViewKind } from '../canvas/transform';

/** A view that can be in the picture: side, rear (front) or the steered front's plan view. */
export type PictureView = ViewKind | 'plan';

export interface ViewStage {
  view: PictureView;
  /** the view's title as the board shows it ("Side view", "Front view"...) */
  title: () => string;
  /** the view's stage, or null while it is not drawn (no size yet) */
  stage: () => Konva.Stage | null;
}

const mounted = new Map<PictureView, ViewStage>();

/** Registers a view's stage while the calling component is mounted. */
export function useViewStage(entry: ViewStage): void {
  mounted.set(entry.view, entry);
  onBeforeUnmount(() => {
    if (mounted.get(entry.view) === entry) mounted.delete(entry.view);
  });
}

/** The views drawn now, side view first. */
export function viewStages(): ViewStage[] {
  return (['side', 'rear', 'plan'] as const).flatMap((v) => {
    const e = mounted.get(v);
    return e && e.stage() ? [e] : [];
  });
}
