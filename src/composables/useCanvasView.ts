/**
 * Zoom and pan of one board view: the stage size and the transform from plane mm to stage
 * pixels (see canvasTransform.ts). The first time the stage has a size, the view fits the
 * sketch; after that only the user moves it (wheel, pinch, pan, the fit button).
 */
import { ref, shallowRef } from 'vue';
import {
  boundsOf,
  fitTransform,
  panBy,
  zoomAt,
  type PlaneBounds,
  type PlanePoint,
  type ViewTransform,
} from '../canvas/transform';

/** One wheel notch zooms by this factor. */
export const WHEEL_ZOOM_STEP = 1.15;
/** The buttons zoom by this factor. */
export const BUTTON_ZOOM_STEP = 1.4;
/** Room kept round the sketch when fitting, px. */
const FIT_MARGIN_PX = 36;

export function useCanvasView(contentOf: () => PlanePoint[]) {
  const width = ref(0);
  const height = ref(0);
  const transform = shallowRef<ViewTransform>({ scale: 0.3, originX: 0, originY: 0 });
  let fitted = false;

  function fit(bounds: PlaneBounds | null = boundsOf(contentOf())) {
    if (!bounds || width.value <= 0 || height.value <= 0) return;
    transform.value = fitTransform(bounds, width.value, height.value, FIT_MARGIN_PX);
    fitted = true;
  }

  function setSize(w: number, h: number) {
    const first = !fitted;
    // Keep the middle of the view in the middle when the splitter moves.
    if (!first && width.value > 0 && height.value > 0) {
      transform.value = panBy(transform.value, (w - width.value) / 2, (h - height.value) / 2);
    }
    width.value = Math.max(0, Math.floor(w));
    height.value = Math.max(0, Math.floor(h));
    if (first) fit();
  }

  function zoom(factor: number, px = width.value / 2, py = height.value / 2) {
    transform.value = zoomAt(transform.value, factor, px, py);
  }

  function pan(dx: number, dy: number) {
    transform.value = panBy(transform.value, dx, dy);
  }

  /** Forget the fit, so that the next sketch loaded is fitted again. */
  function reset() {
    fitted = false;
    fit();
  }

  return { width, height, transform, fit, setSize, zoom, pan, reset };
}

export type CanvasView = ReturnType<typeof useCanvasView>;
