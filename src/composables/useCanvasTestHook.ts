/**
 * A small window hook for browser tests and the frame-time benchmark: where a pivot is drawn on
 * the page (client px), so a script can press and drag it as a user would. Read-only; it moves
 * nothing itself.
 */
import { onBeforeUnmount } from 'vue';
import type { ViewKind, ViewTransform } from '../canvas/transform';

export interface CanvasHook {
  /** client-pixel centre of a pivot's handle, or null when it is not drawn */
  pivotAt(id: string): { x: number; y: number } | null;
  transform(): ViewTransform;
}

declare global {
  interface Window {
    arcwrightBoard?: Partial<Record<ViewKind, CanvasHook>>;
  }
}

export function useCanvasTestHook(view: ViewKind, hook: CanvasHook) {
  window.arcwrightBoard ??= {};
  window.arcwrightBoard[view] = hook;
  onBeforeUnmount(() => {
    if (window.arcwrightBoard?.[view] === hook) delete window.arcwrightBoard[view];
  });
}
