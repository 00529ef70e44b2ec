/**
 * The tracing's working state: the upload in progress, the two-point scale being picked,
 * and the actions on the photo. The photo itself lives in the document (`tracing`), so
 * every change goes through the board store as one undo step and saves with the sketch.
 */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { api, errorMessage } from '../api/http';
import { useBoardStore, type EditResult } from './board';
import type { PlanePoint, ViewKind } from '../canvas/transform';
import {
  DEFAULT_TRACING_OPACITY,
  initialPlacement,
  photoProblem,
  readTracing,
  rescaleFromPicks,
  withTracing,
} from '../canvas/tracingGeometry';
import type { TracingImage } from '../../shared/schema/boardFields';
import type { UploadInfo } from '../../shared/schema/apiResponses';
import type { Mm } from '../../shared/units';

/** Reads an image's own size in the browser (the photo must decode before it can be placed). */
async function imageSize(url: string): Promise<{ width: number; height: number }> {
  const img = new Image();
  img.src = url;
  await img.decode();
  return { width: img.naturalWidth, height: img.naturalHeight };
}

export const useTracingStore = defineStore('tracing', () => {
  const board = useBoardStore();

  const uploading = ref(false);
  const error = ref('');
  /** The view whose photo is being scaled; null when no scale is being picked. */
  const picking = ref<ViewKind | null>(null);
  /** The points picked so far (plane mm at the photo's present scale). */
  const picks = ref<PlanePoint[]>([]);

  // Parsed again only when the document's tracing field itself changes (documents are immutable,
  // so a pivot drag keeps it): the photo layer is not redrawn on every pointer move.
  const field = computed(() => (board.sketch as { tracing?: unknown } | null)?.tracing);
  const image = (view: ViewKind) => computed(() => readTracing({ tracing: field.value }, view));
  const side = image('side');
  const rear = image('rear');

  function current(view: ViewKind): TracingImage | null {
    return view === 'side' ? side.value : rear.value;
  }

  function write(view: ViewKind, img: TracingImage | null, label: string, coalesce?: string): EditResult {
    const r = board.setTracing(withTracing(board.sketch, view, img), { label, coalesce });
    error.value = r.ok ? '' : r.error;
    return r;
  }

  /** Uploads a photo and puts it behind the view (replacing any photo there). */
  async function upload(view: ViewKind, file: File): Promise<boolean> {
    error.value = '';
    const problem = photoProblem(file);
    if (problem) {
      error.value = problem;
      return false;
    }
    const id = board.sketchId;
    if (id === null || board.readOnly) {
      error.value = board.readOnly ? 'This sketch is read-only.' : 'Save the sketch before adding a tracing.';
      return false;
    }
    uploading.value = true;
    try {
      const form = new FormData();
      form.append('file', file);
      const up = await api.post<UploadInfo>(`/api/sketches/${id}/uploads`, form);
      const { width, height } = await imageSize(up.url);
      if (!(width > 0 && height > 0)) throw new Error('The photo could not be read.');
      const old = current(view);
      const placed = initialPlacement(view, width, height, board.sketch?.vehicle);
      const img: TracingImage = {
        upload: up.id,
        url: up.url,
        width,
        height,
        ...placed,
        opacity: old?.opacity ?? DEFAULT_TRACING_OPACITY,
        locked: false,
      };
      cancelScale();
      return write(view, img, 'Add tracing').ok;
    } catch (err) {
      error.value = errorMessage(err);
      return false;
    } finally {
      uploading.value = false;
    }
  }

  function startScale(view: ViewKind) {
    if (!current(view)) return;
    picking.value = view;
    picks.value = [];
  }

  /** A click on the photo while picking; returns true when both points are in. */
  function addPick(p: PlanePoint): boolean {
    if (!picking.value || picks.value.length >= 2) return picks.value.length >= 2;
    picks.value = [...picks.value, p];
    return picks.value.length === 2;
  }

  function cancelScale() {
    picking.value = null;
    picks.value = [];
  }

  /** Sets the scale from the two picks and their real distance (mm). */
  function applyScale(realMm: Mm): EditResult {
    const view = picking.value;
    const img = view ? current(view) : null;
    if (!view || !img || picks.value.length < 2) return { ok: false, error: 'Click two points on the photo first.' };
    const out = rescaleFromPicks(img, picks.value[0], picks.value[1], realMm);
    if (!out.ok) {
      error.value = out.error;
      return out;
    }
    const r = write(view, out.image, 'Scale tracing');
    if (r.ok) cancelScale();
    return r;
  }

  function setOpacity(view: ViewKind, opacity: number) {
    const img = current(view);
    if (img)
      write(view, { ...img, opacity: Math.min(1, Math.max(0, opacity)) }, 'Tracing opacity', `tracing-opacity:${view}`);
  }

  function setLocked(view: ViewKind, locked: boolean) {
    const img = current(view);
    if (img) write(view, { ...img, locked }, locked ? 'Lock tracing' : 'Unlock tracing');
  }

  /** Moves the photo so its centre sits at `centre` (mm); one undo step (the canvas calls it at drag end). */
  function moveTo(view: ViewKind, centre: PlanePoint) {
    const img = current(view);
    if (img && !img.locked) write(view, { ...img, centre }, 'Move tracing');
  }

  function remove(view: ViewKind) {
    if (current(view)) write(view, null, 'Remove tracing');
    if (picking.value === view) cancelScale();
  }

  return {
    uploading,
    error,
    picking,
    picks,
    side,
    rear,
    current,
    upload,
    startScale,
    addPick,
    cancelScale,
    applyScale,
    setOpacity,
    setLocked,
    moveTo,
    remove,
  };
});
