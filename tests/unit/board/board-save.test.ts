// @vitest-environment happy-dom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { ApiError } from '../../../src/api/http';
import { AUTOSAVE_DELAY_MS, useBoardStore } from '../../../src/stores/board';
import { detailOf, fourLink } from './fixture';

const calls: { method: string; url: string; body?: unknown }[] = [];
let putAnswer: (body: { document: unknown; version: number }) => unknown = (b) =>
  detailOf(b.document as never, { version: b.version + 1 });

vi.mock('../../../src/api/http', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../../src/api/http')>();
  return {
    ...real,
    api: {
      get: vi.fn(async (url: string) => {
        calls.push({ method: 'GET', url });
        if (url.endsWith('/revisions'))
          return {
            items: [
              { rev: 1, version: 1, name: 'r1', createdAt: 'x' },
              { rev: 2, version: 2, name: 'r2', createdAt: 'y' },
            ],
          };
        if (url.includes('/revisions/1')) {
          const d = fourLink();
          return {
            rev: 1,
            version: 1,
            name: 'r1',
            createdAt: 'x',
            document: {
              ...d,
              points: d.points.map((p) => (p.id === 'UL.fl' ? { ...p, x: p.x - 40, z: p.z + 30 } : p)),
            },
          };
        }
        return detailOf({ ...fourLink(), name: 'Changed elsewhere' }, { version: 9 });
      }),
      put: vi.fn(async (url: string, body: { document: unknown; version: number }) => {
        calls.push({ method: 'PUT', url, body });
        return putAnswer(body);
      }),
      post: vi.fn(async (url: string, body?: unknown) => {
        calls.push({ method: 'POST', url, body });
        if (url.includes('/restore/')) return detailOf(fourLink(), { version: 12 });
        return detailOf((body as { document?: never })?.document ?? fourLink(), { id: 99, version: 1 });
      }),
    },
  };
});

describe('board store: saving', () => {
  let board: ReturnType<typeof useBoardStore>;
  beforeEach(() => {
    vi.useFakeTimers();
    calls.length = 0;
    putAnswer = (b) => detailOf(b.document as never, { version: b.version + 1 });
    localStorage.clear();
    setActivePinia(createPinia());
    board = useBoardStore();
    board.setLoaded(detailOf(fourLink()));
  });
  afterEach(() => vi.useRealTimers());

  it('starts saved; an edit is unsaved, then saved once after a quiet spell, with the version', async () => {
    expect(board.saveState).toBe('saved');
    board.setPointCoordinate('LL.fl', 'x', 990);
    board.setPointCoordinate('LL.fl', 'x', 995);
    expect(board.saveState).toBe('unsaved');
    expect(board.hasUnsavedChanges).toBe(true);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    const puts = calls.filter((c) => c.method === 'PUT');
    expect(puts).toHaveLength(1);
    expect(puts[0].url).toBe('/api/sketches/7');
    expect(puts[0].body).toMatchObject({ version: 3, name: 'Test runabout, rear' });
    expect(board.saveState).toBe('saved');
    expect(board.meta!.version).toBe(4);
    expect(board.hasUnsavedChanges).toBe(false);
  });

  it('undoing back to the saved document counts as saved', async () => {
    board.setPointCoordinate('LL.fl', 'x', 990);
    board.undo();
    expect(board.saveState).toBe('saved');
  });

  it('does not save in the middle of a drag', async () => {
    board.beginDrag('side', 'UL.fl');
    board.dragTo({ h: 700, v: 600 });
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 3);
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0);
    board.endDrag();
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(1);
  });

  it('a stale version (409) becomes a conflict; the edit stays, and no more saves go out', async () => {
    putAnswer = () => {
      throw new ApiError(409, 'This sketch was changed elsewhere', { version: 9 });
    };
    board.setPointCoordinate('LL.fl', 'x', 990);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    expect(board.saveState).toBe('conflict');
    expect(board.conflictVersion).toBe(9);
    expect(board.document!.points.find((p) => p.id === 'LL.fl')!.x).toBe(990);
    board.setPointCoordinate('LL.fl', 'x', 991);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 3);
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(1);
  });

  it('after a conflict, taking the saved version is one undo step away from the user’s edit', async () => {
    putAnswer = () => {
      throw new ApiError(409, 'stale', { version: 9 });
    };
    board.setPointCoordinate('LL.fl', 'x', 990);
    const mine = board.document;
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    expect((await board.takeServerVersion()).ok).toBe(true);
    expect(board.document!.name).toBe('Changed elsewhere');
    expect(board.meta!.version).toBe(9);
    expect(board.saveState).toBe('saved');
    board.undo();
    expect(board.document).toEqual(mine);
    expect(board.saveState).toBe('unsaved');
  });

  it('after a conflict, save as copy posts the user’s document as a new sketch', async () => {
    putAnswer = () => {
      throw new ApiError(409, 'stale', { version: 9 });
    };
    board.setPointCoordinate('LL.fl', 'x', 990);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    const created = await board.saveAsCopy();
    expect(created.id).toBe(99);
    const post = calls.find((c) => c.method === 'POST' && c.url === '/api/sketches')!;
    const doc = (post.body as { document: { points: { id: string; x: number }[] } }).document;
    expect(doc.points.find((p) => p.id === 'LL.fl')!.x).toBe(990);
  });

  it('a failed save shows an error and keeps the edit; the next edit tries again', async () => {
    let fail = true;
    putAnswer = (b) => {
      if (fail) throw new ApiError(0, 'The server could not be reached.');
      return detailOf(b.document as never, { version: b.version + 1 });
    };
    board.setPointCoordinate('LL.fl', 'x', 990);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    expect(board.saveState).toBe('error');
    expect(board.saveError).toMatch(/could not be reached/);
    fail = false;
    board.setPointCoordinate('LL.fl', 'x', 991);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    expect(board.saveState).toBe('saved');
  });

  it('flush saves at once', async () => {
    board.setPointCoordinate('LL.fl', 'x', 990);
    await board.flush();
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(1);
    expect(board.saveState).toBe('saved');
  });

  it('revisions: list newest first, open read-only, compare lists the moved pivot and by how much', async () => {
    await board.loadRevisions();
    expect(board.revisions.map((r) => r.rev)).toEqual([2, 1]);
    await board.openRevision(1);
    expect(board.readOnly).toBe(true);
    expect(board.sketch!.points.find((p) => p.id === 'UL.fl')!.x).toBe(720);
    expect(board.setPointCoordinate('UL.fl', 'x', 1).ok).toBe(false);
    board.closeRevision();
    expect(board.readOnly).toBe(false);
    const cmp = await board.compareRevisions(1, 'current');
    expect(cmp.moved).toEqual([{ id: 'UL.fl', dx: 40, dy: 0, dz: -30, distance: 50 }]);
  });

  it('restore makes the revision current and can be undone', async () => {
    board.setPointCoordinate('LL.fl', 'x', 990);
    const mine = board.document;
    await board.restoreRevision(1);
    expect(calls.some((c) => c.method === 'POST' && c.url === '/api/sketches/7/restore/1')).toBe(true);
    expect(board.meta!.version).toBe(12);
    expect(board.saveState).toBe('saved');
    board.undo();
    expect(board.document).toEqual(mine);
  });
});
