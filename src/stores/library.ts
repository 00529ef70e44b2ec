import { defineStore } from 'pinia';
import { ref } from 'vue';
import { api } from '../api/http';
import type { Page, SketchDetail, SketchSummary } from '../api/types';
import type { Layout } from '../../shared/schema/sketch';
import { PAGE_SIZE_MAX, type LibraryQuery, type ShareMode } from '../../shared/schema/sketchRequests';

/** Longest sketch name the server takes. */
const MAX_SKETCH_NAME = 200;

/** The Library: one page of the user's sketches and those shared with them, and the edits made from it. */
export const useLibraryStore = defineStore('library', () => {
  const query = ref<LibraryQuery>({ q: '', layout: null, sort: 'updatedAt', order: 'desc', page: 1, pageSize: 20 });
  const items = ref<SketchSummary[]>([]);
  const total = ref(0);
  const loading = ref(false);

  async function load(patch: Partial<LibraryQuery> = {}) {
    Object.assign(query.value, patch);
    const q = query.value;
    const p = new URLSearchParams({
      q: q.q,
      sort: q.sort,
      order: q.order,
      page: String(q.page),
      pageSize: String(q.pageSize),
    });
    if (q.layout) p.set('layout', q.layout);
    loading.value = true;
    try {
      const page = await api.get<Page<SketchSummary>>(`/api/sketches?${p.toString()}`);
      items.value = page.items;
      total.value = page.total;
    } finally {
      loading.value = false;
    }
  }

  /**
   * Creates a sketch from a starter layout (the one way a new sketch begins): `params` are the
   * starter's sizes in its own units (mm, degrees), missing ones at their defaults; without a
   * name it is called after the starter. Resolves to the new sketch. The starters are fetched
   * here, when one is used: the board and the library list do not need them to paint.
   */
  async function createFromStarter(
    layout: Layout,
    opts: { name?: string; params?: Partial<Record<string, number>> } = {},
  ): Promise<SketchDetail> {
    const { starters } = await import('../../shared/kinematics/starters');
    const spec = starters[layout];
    if (!spec) throw new Error(`There is no starter '${layout}'.`);
    const name = opts.name ?? `New ${spec.label.toLowerCase()}`.slice(0, MAX_SKETCH_NAME);
    const document = { ...spec.build(opts.params), name };
    return api.post<SketchDetail>('/api/sketches', { name, document });
  }

  async function importFile(document: unknown): Promise<SketchDetail> {
    const created = await api.post<SketchDetail>('/api/sketches/import', document);
    await load();
    return created;
  }

  async function rename(item: SketchSummary, name: string) {
    const full = await api.get<SketchDetail>(`/api/sketches/${item.id}`);
    await api.put<SketchDetail>(`/api/sketches/${item.id}`, {
      document: { ...full.document, name },
      name,
      version: full.version,
    });
    await load();
  }

  async function copy(item: SketchSummary): Promise<SketchDetail> {
    const created = await api.post<SketchDetail>(`/api/sketches/${item.id}/copy`);
    await load();
    return created;
  }

  async function remove(item: SketchSummary) {
    await api.del(`/api/sketches/${item.id}`);
    await load();
  }

  async function restore(item: SketchSummary) {
    await api.post(`/api/sketches/${item.id}/undelete`);
    await load();
  }

  /**
   * The user's own sketches, newest first (up to one page of the largest size), for a picker such as the
   * starter of an assignment. Leaves the library page's list and query as they are.
   */
  async function listMine(): Promise<SketchSummary[]> {
    const p = new URLSearchParams({ sort: 'updatedAt', order: 'desc', page: '1', pageSize: String(PAGE_SIZE_MAX) });
    const page = await api.get<Page<SketchSummary>>(`/api/sketches?${p.toString()}`);
    return page.items.filter((s) => s.mine && s.deletedAt === null);
  }

  /** The sketch's read-only link was turned on or revoked (the share dialog): its row says so at once. */
  function noteShare(id: number, share: ShareMode) {
    const row = items.value.find((s) => s.id === id);
    if (row) row.share = share;
  }

  return {
    query,
    items,
    total,
    loading,
    load,
    listMine,
    noteShare,
    createFromStarter,
    importFile,
    rename,
    copy,
    remove,
    restore,
  };
});
