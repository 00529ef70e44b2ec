import { defineStore } from 'pinia';
import { api } from '../api/http';
import type { Page, SketchDetail, SketchSummary } from '../api/types';
import type { Sketch } from '../../shared/schema/sketch';
import type { LibraryQuery } from '../../shared/schema/sketchRequests';

/** The Library: one page of the user's sketches and those shared with them, and the edits made from it. */
export const useLibraryStore = defineStore('library', {
  state: () => ({
    query: { q: '', layout: null, sort: 'updatedAt', order: 'desc', page: 1, pageSize: 20 } as LibraryQuery,
    items: [] as SketchSummary[],
    total: 0,
    loading: false,
  }),
  actions: {
    async load(patch: Partial<LibraryQuery> = {}) {
      Object.assign(this.query, patch);
      const p = new URLSearchParams({
        q: this.query.q,
        sort: this.query.sort,
        order: this.query.order,
        page: String(this.query.page),
        pageSize: String(this.query.pageSize),
      });
      if (this.query.layout) p.set('layout', this.query.layout);
      this.loading = true;
      try {
        const page = await api.get<Page<SketchSummary>>(`/api/sketches?${p.toString()}`);
        this.items = page.items;
        this.total = page.total;
      } finally {
        this.loading = false;
      }
    },
    async create(name: string, document: Sketch): Promise<SketchDetail> {
      return api.post<SketchDetail>('/api/sketches', { name, document });
    },
    async importFile(document: unknown): Promise<SketchDetail> {
      const created = await api.post<SketchDetail>('/api/sketches/import', document);
      await this.load();
      return created;
    },
    async rename(item: SketchSummary, name: string) {
      const full = await api.get<SketchDetail>(`/api/sketches/${item.id}`);
      await api.put<SketchDetail>(`/api/sketches/${item.id}`, {
        document: { ...full.document, name },
        name,
        version: full.version,
      });
      await this.load();
    },
    async copy(item: SketchSummary): Promise<SketchDetail> {
      const created = await api.post<SketchDetail>(`/api/sketches/${item.id}/copy`);
      await this.load();
      return created;
    },
    async remove(item: SketchSummary) {
      await api.del(`/api/sketches/${item.id}`);
      await this.load();
    },
    async restore(item: SketchSummary) {
      await api.post(`/api/sketches/${item.id}/undelete`);
      await this.load();
    },
  },
});
