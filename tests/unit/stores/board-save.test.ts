// @vitest-environment happy-dom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { ApiError } from '../../../src/api/http';
import { useBoardStore } from '../../../src/stores/board';
import { AUTOSAVE_DELAY_MS, useBoardSaveStore } from '../../../src/stores/boardSave';
import { useRevisionsStore } from '../../../src/stores/revisions';
import { detailOf, fourLink } from '../board/fixture';

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

describe('board save and revisions stores', () => {
  let board: ReturnType<typeof useBoardStore>;
  let saving: ReturnType<typeof useBoardSaveStore>;
  let revisions: ReturnType<typeof useRevisionsStore>;
  beforeEach(() => {
    vi.useFakeTimers();
    calls.length = 0;
    putAnswer = (b) => detailOf(b.document as never, { version: b.version + 1 });
    localStorage.clear();
    setActivePinia(createPinia());
    board = useBoardStore();
    // As the board page does: saving and revisions start with the board, before the sketch loads.
    saving = useBoardSaveStore();
    revisions = useRevisionsStore();
    board.setLoaded(detailOf(fourLink()));
  });
  afterEach(() => vi.useRealTimers());

  it('starts saved; an edit is unsaved, then saved once after a quiet spell, with the version', async () => {
    expect(saving.saveState).toBe('saved');
    board.setPointCoordinate('LL.fl', 'x', 990);
    board.setPointCoordinate('LL.fl', 'x', 995);
    expect(saving.saveState).toBe('unsaved');
    expect(saving.hasUnsavedChanges).toBe(true);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    const puts = calls.filter((c) => c.method === 'PUT');
    expect(puts).toHaveLength(1);
    expect(puts[0].url).toBe('/api/sketches/7');
    expect(puts[0].body).toMatchObject({ version: 3, name: 'Test runabout, rear' });
    expect(saving.saveState).toBe('saved');
    expect(board.meta!.version).toBe(4);
    expect(saving.hasUnsavedChanges).toBe(false);
  });

  it('undoing back to the saved document counts as saved', async () => {
    board.setPointCoordinate('LL.fl', 'x', 990);
    board.undo();
    expect(saving.saveState).toBe('saved');
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
    expect(saving.saveState).toBe('conflict');
    expect(saving.conflictVersion).toBe(9);
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
    expect((await saving.takeServerVersion()).ok).toBe(true);
    expect(board.document!.name).toBe('Changed elsewhere');
    expect(board.meta!.version).toBe(9);
    expect(saving.saveState).toBe('saved');
    board.undo();
    expect(board.document).toEqual(mine);
    expect(saving.saveState).toBe('unsaved');
  });

  it('after a conflict, save as copy posts the user’s document as a new sketch', async () => {
    putAnswer = () => {
      throw new ApiError(409, 'stale', { version: 9 });
    };
    board.setPointCoordinate('LL.fl', 'x', 990);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    const created = await saving.saveAsCopy();
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
    expect(saving.saveState).toBe('error');
    expect(saving.saveError).toMatch(/could not be reached/);
    fail = false;
    board.setPointCoordinate('LL.fl', 'x', 991);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    expect(saving.saveState).toBe('saved');
  });

  it('flush saves at once', async () => {
    board.setPointCoordinate('LL.fl', 'x', 990);
    await saving.flush();
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(1);
    expect(saving.saveState).toBe('saved');
  });

  it('revisions: list newest first, open read-only, compare lists the moved pivot and by how much', async () => {
    await revisions.load();
    expect(revisions.items.map((r) => r.rev)).toEqual([2, 1]);
    await revisions.open(1);
    expect(board.readOnly).toBe(true);
    expect(board.sketch!.points.find((p) => p.id === 'UL.fl')!.x).toBe(720);
    expect(board.setPointCoordinate('UL.fl', 'x', 1).ok).toBe(false);
    revisions.close();
    expect(board.readOnly).toBe(false);
    const cmp = await revisions.compare(1, 'current');
    expect(cmp.moved).toEqual([{ id: 'UL.fl', dx: 40, dy: 0, dz: -30, distance: 50 }]);
  });

  it('restore makes the revision current and can be undone', async () => {
    board.setPointCoordinate('LL.fl', 'x', 990);
    const mine = board.document;
    await revisions.restore(1);
    expect(calls.some((c) => c.method === 'POST' && c.url === '/api/sketches/7/restore/1')).toBe(true);
    expect(board.meta!.version).toBe(12);
    expect(saving.saveState).toBe('saved');
    board.undo();
    expect(board.document).toEqual(mine);
  });

  it('another sketch on the board drops the waiting save, the conflict and the revision list', async () => {
    putAnswer = () => {
      throw new ApiError(409, 'stale', { version: 9 });
    };
    board.setPointCoordinate('LL.fl', 'x', 990);
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS + 10);
    await revisions.load();
    expect(saving.saveState).toBe('conflict');
    expect(revisions.items).toHaveLength(2);
    board.setPointCoordinate('LL.fl', 'x', 991);
    board.setLoaded(detailOf({ ...fourLink(), name: 'Second runabout' }, { id: 8 }));
    expect(saving.saveState).toBe('saved');
    expect(saving.conflictVersion).toBeNull();
    expect(revisions.items).toEqual([]);
    const putsBefore = calls.filter((c) => c.method === 'PUT').length;
    board.setPointCoordinate('LL.fl', 'x', 992);
    board.setLoaded(detailOf(fourLink()));
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 3);
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(putsBefore);
  });

  it('leaving the board stops the autosave timer; flush still saves what waits', async () => {
    board.setPointCoordinate('LL.fl', 'x', 990);
    saving.dispose();
    await vi.advanceTimersByTimeAsync(AUTOSAVE_DELAY_MS * 3);
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0);
    expect(saving.hasUnsavedChanges).toBe(true);
    await saving.flush();
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(1);
  });

  it('a read-only link is never saved, and copying it goes through the link', async () => {
    board.setLoaded(detailOf(fourLink(), { canEdit: true }), 'tok/123');
    expect(board.setPointCoordinate('LL.fl', 'x', 990).ok).toBe(false);
    await saving.save();
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0);
    expect(saving.hasUnsavedChanges).toBe(false);
    await saving.copyToLibrary();
    expect(calls.at(-1)).toMatchObject({ method: 'POST', url: '/api/shared/tok%2F123/copy' });
  });
});
