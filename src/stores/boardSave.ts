import { defineStore } from 'pinia';
import { computed, ref, shallowRef, watch } from 'vue';
import { api, ApiError, errorMessage } from '../api/http';
import type { SketchDetail } from '../api/types';
import type { Sketch } from '../../shared/schema/sketch';
import { deepEqual } from './board/history';
import { useBoardStore } from './board';
import type { EditResult } from './editResult';

/** Quiet time after the last edit before the sketch is saved (ms): long enough to finish typing a number. */
export const AUTOSAVE_DELAY_MS = 1200;

export type SaveState = 'saved' | 'saving' | 'unsaved' | 'error' | 'conflict';

/**
 * The saving of the board's sketch: the autosave after each change, the save state the toolbar
 * shows, a save refused as stale (409, a conflict) and its two ways out, and copies.
 *
 * It follows the board's `changeCount` and `loadCount`, so it must exist before the first edit:
 * the board page starts it together with the board.
 */
export const useBoardSaveStore = defineStore('boardSave', () => {
  const board = useBoardStore();

  /** The document as the server last confirmed it. */
  const savedDocument = shallowRef<Sketch | null>(board.document);
  const saving = ref(false);
  const saveError = ref<string | null>(null);
  /** The server's version when a save was refused as stale (409). */
  const conflictVersion = ref<number | null>(null);
  const lastSavedAt = ref<Date | null>(null);
  let timer: ReturnType<typeof setTimeout> | null = null;
  let pending: Promise<void> | null = null;

  const dirty = computed(() => !!board.document && !deepEqual(savedDocument.value, board.document));
  const saveState = computed<SaveState>(() => {
    if (conflictVersion.value !== null) return 'conflict';
    if (saving.value) return 'saving';
    if (saveError.value && dirty.value) return 'error';
    return dirty.value ? 'unsaved' : 'saved';
  });
  /** True when leaving now would lose something. */
  const hasUnsavedChanges = computed(() => board.canEdit && (dirty.value || saving.value));

  function clearTimer() {
    if (timer) clearTimeout(timer);
    timer = null;
  }

  /** After every change: schedule the autosave (not while a drag is still going). */
  function changed() {
    if (!board.canEdit || board.dragging) return;
    clearTimer();
    timer = setTimeout(() => void save(), AUTOSAVE_DELAY_MS);
  }

  /** A new sketch on the board: what it holds is what the server has. */
  function reset() {
    clearTimer();
    savedDocument.value = board.document;
    saveError.value = null;
    conflictVersion.value = null;
  }

  // Synchronous, as if the board called these itself: a change schedules the save at once.
  watch(() => board.changeCount, changed, { flush: 'sync' });
  watch(() => board.loadCount, reset, { flush: 'sync' });

  /** Saves the working document now (PUT with the version); resolves when the server has answered. */
  async function save(): Promise<void> {
    clearTimer();
    if (pending) {
      await pending;
      if (dirty.value && conflictVersion.value === null && !saveError.value) return save();
      return;
    }
    const doc = board.document;
    const m = board.meta;
    if (!doc || !m || !board.canEdit || conflictVersion.value !== null || !dirty.value) return;
    if (board.problems.length) {
      saveError.value = `Not saved: ${board.problems.slice(0, 2).join('; ')}`;
      return;
    }
    saving.value = true;
    pending = (async () => {
      try {
        const detail = await api.put<SketchDetail>(`/api/sketches/${m.id}`, {
          document: doc,
          name: doc.name,
          version: m.version,
        });
        board.setMeta(detail);
        savedDocument.value = doc;
        saveError.value = null;
        lastSavedAt.value = new Date();
      } catch (err) {
        if (err instanceof ApiError && err.status === 409) {
          const v = (err.details as { version?: unknown } | undefined)?.version;
          conflictVersion.value = typeof v === 'number' ? v : (m.version ?? 0) + 1;
        } else saveError.value = errorMessage(err);
      } finally {
        saving.value = false;
        pending = null;
      }
    })();
    await pending;
    // Edits made while the request was out go in the next save.
    if (dirty.value && conflictVersion.value === null && !saveError.value) changed();
  }

  /** Saves at once if anything is waiting (before leaving the page). */
  async function flush(): Promise<void> {
    board.endDrag();
    if (timer || dirty.value) await save();
    else if (pending) await pending;
  }

  /** The server now holds `doc` for this sketch (a revision it restored): nothing is waiting to be saved. */
  function markSaved(doc: Sketch) {
    savedDocument.value = doc;
  }

  /**
   * After a conflict: takes the server's version. The step from the user's document to it is
   * recorded as an undo step, so their edit is one Ctrl+Z away and never lost.
   */
  async function takeServerVersion(): Promise<EditResult> {
    const m = board.meta;
    if (!m || !board.document) return { ok: false, error: 'No sketch is open.' };
    try {
      const detail = await api.get<SketchDetail>(`/api/sketches/${m.id}`);
      conflictVersion.value = null;
      saveError.value = null;
      savedDocument.value = detail.document;
      board.adoptServerDocument(detail, 'Load the saved version');
      return { ok: true };
    } catch (err) {
      return { ok: false, error: errorMessage(err) };
    }
  }

  /** Saves the working document as a new sketch of the user's (after a conflict); resolves to its id. */
  async function saveAsCopy(): Promise<SketchDetail> {
    const doc = board.document;
    if (!doc) throw new Error('No sketch is open.');
    const name = `${doc.name} (my copy)`.slice(0, 200);
    const created = await api.post<SketchDetail>('/api/sketches', { name, document: { ...doc, name } });
    // The copy holds the edit now: the conflicted sketch has nothing left to save.
    savedDocument.value = doc;
    conflictVersion.value = null;
    return created;
  }

  /** Copies a sketch the user may only read into their library; resolves to the new sketch. */
  async function copyToLibrary(): Promise<SketchDetail> {
    if (board.sharedToken) return api.post<SketchDetail>(`/api/shared/${encodeURIComponent(board.sharedToken)}/copy`);
    // A hand-in is a frozen document, not a sketch the viewer may read: its copy is a new sketch of theirs.
    if (board.handIn && board.document) {
      const name = `${board.document.name} (${board.handIn.studentName}'s hand-in)`.slice(0, 200);
      return api.post<SketchDetail>('/api/sketches', { name, document: { ...board.document, name } });
    }
    if (!board.meta) throw new Error('No sketch is open.');
    return api.post<SketchDetail>(`/api/sketches/${board.meta.id}/copy`);
  }

  /** Leaves the board: stops the autosave timer (call flush() first to keep edits). */
  function dispose() {
    clearTimer();
  }

  return {
    saveState,
    saveError,
    conflictVersion,
    lastSavedAt,
    dirty,
    hasUnsavedChanges,
    save,
    flush,
    markSaved,
    takeServerVersion,
    saveAsCopy,
    copyToLibrary,
    dispose,
  };
});
