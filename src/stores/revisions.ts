import { defineStore } from 'pinia';
import { ref, watch } from 'vue';
import { api } from '../api/http';
import type { Revision, SketchDetail } from '../api/types';
import { compareSketches, type SketchComparison } from './board/compare';
import { useBoardStore, type RevisionDetail } from './board';
import { useBoardSaveStore } from './boardSave';

/**
 * The revisions of the sketch on the board: the list, one opened read-only in place of the
 * working document, comparisons, and restoring one as the newest version.
 */
export const useRevisionsStore = defineStore('revisions', () => {
  const board = useBoardStore();
  const saving = useBoardSaveStore();

  /** Newest first. */
  const items = ref<Revision[]>([]);
  const loading = ref(false);

  // Another sketch on the board: the list was the previous one's.
  watch(
    () => board.loadCount,
    () => {
      items.value = [];
    },
    { flush: 'sync' },
  );

  async function load(): Promise<void> {
    if (!board.meta || board.sharedToken || board.handIn) return;
    loading.value = true;
    try {
      const { items: list } = await api.get<{ items: Revision[] }>(`/api/sketches/${board.meta.id}/revisions`);
      items.value = [...list].sort((a, b) => b.rev - a.rev);
    } finally {
      loading.value = false;
    }
  }

  async function fetchRevision(rev: number): Promise<RevisionDetail> {
    if (!board.meta) throw new Error('No sketch is open.');
    return api.get<RevisionDetail>(`/api/sketches/${board.meta.id}/revisions/${rev}`);
  }

  /** Shows a revision read-only in place of the working document (which stays as it is). */
  async function open(rev: number): Promise<void> {
    board.endDrag();
    board.showRevision(await fetchRevision(rev));
  }

  /** Back to the working document. */
  function close() {
    board.showRevision(null);
  }

  /** Compares two revisions, or a revision with the working document (`to` = 'current'). */
  async function compare(from: number, to: number | 'current'): Promise<SketchComparison> {
    const a = await fetchRevision(from);
    const b = to === 'current' ? board.document : (await fetchRevision(to)).document;
    if (!b) throw new Error('No sketch is open.');
    return compareSketches(a.document, b);
  }

  /**
   * Restores a revision: the server makes it the newest version. Unsaved edits are saved first;
   * the step back is recorded for undo like any other.
   */
  async function restore(rev: number): Promise<void> {
    const m = board.meta;
    if (!m || !board.canEdit) throw new Error('This sketch is read-only.');
    await saving.flush();
    if (saving.conflictVersion !== null) throw new Error('Resolve the conflict with the saved version first.');
    const detail = await api.post<SketchDetail>(`/api/sketches/${m.id}/restore/${rev}`);
    saving.markSaved(detail.document);
    board.adoptServerDocument(detail, `Restore revision ${rev}`, { closeRevision: true });
    await load().catch(() => undefined);
  }

  return { items, loading, load, open, close, compare, restore };
});
