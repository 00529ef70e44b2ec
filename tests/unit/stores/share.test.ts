// @vitest-environment happy-dom
/** The share dialog's store: reading the link's state, turning it on, mailing it, revoking it. */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { ApiError } from '../../../src/api/http';
import type { ShareState, SketchSummary } from '../../../src/api/types';
import { useShareStore } from '../../../src/stores/share';
import { useLibraryStore } from '../../../src/stores/library';

const calls: { method: string; url: string; body?: unknown }[] = [];
const LINK = 'http://arcwright.example.test/shared/tok-0123456789abcdef';
let server: ShareState;
let refusal: ApiError | null = null;

vi.mock('../../../src/api/http', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../../src/api/http')>();
  return {
    ...real,
    api: {
      get: vi.fn(async (url: string) => {
        calls.push({ method: 'GET', url });
        return structuredClone(server);
      }),
      // Answers as the server does: the link on or off, and one recipient per address sent.
      post: vi.fn(async (url: string, body: { mode: 'link' | 'private'; email?: string }) => {
        calls.push({ method: 'POST', url, body });
        if (refusal) throw refusal;
        if (body.mode === 'private') {
          server = {
            share: 'private',
            shareToken: null,
            url: null,
            recipients: server.recipients.map((r) => ({ ...r, live: false })),
          };
        } else {
          server = { ...server, share: 'link', shareToken: 'tok-0123456789abcdef', url: LINK };
          if (body.email)
            server.recipients = [
              { email: body.email, sentAt: '2026-12-05T10:00:00.000Z', live: true },
              ...server.recipients,
            ];
        }
        return structuredClone(server);
      }),
    },
  };
});

function row(id: number, share: 'private' | 'link'): SketchSummary {
  return {
    id,
    name: `Sketch ${id}`,
    layout: 'leaf-spring',
    version: 1,
    updatedAt: '2026-12-05T09:00:00.000Z',
    createdAt: '2026-12-05T09:00:00.000Z',
    owner: { id: 1, name: 'Owner' },
    mine: true,
    share,
    deletedAt: null,
  };
}

describe('share store', () => {
  beforeEach(() => {
    calls.length = 0;
    refusal = null;
    server = { share: 'private', shareToken: null, url: null, recipients: [] };
    setActivePinia(createPinia());
    useLibraryStore().items = [row(5, 'private'), row(6, 'private')];
  });

  it('opens on a private sketch: no link, nobody to list', async () => {
    const share = useShareStore();
    await share.open(5);
    expect(calls).toEqual([{ method: 'GET', url: '/api/sketches/5/share' }]);
    expect(share.live).toBe(false);
    expect(share.url).toBeNull();
    expect(share.recipients).toEqual([]);
  });

  it('creates the link, and the library row says it is live', async () => {
    const share = useShareStore();
    await share.open(5);
    expect(await share.createLink()).toBe(true);
    expect(calls[1]).toEqual({ method: 'POST', url: '/api/sketches/5/share', body: { mode: 'link' } });
    expect(share.live).toBe(true);
    expect(share.url).toBe(LINK);
    const library = useLibraryStore();
    expect(library.items.map((r) => r.share)).toEqual(['link', 'private']);
  });

  it('sends one mail per call to the address as typed (trimmed, lower-cased) and lists it', async () => {
    const share = useShareStore();
    await share.open(5);
    await share.createLink();
    expect(await share.send('  Fitter@Example.test ')).toBe(true);
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(2);
    expect(calls[2].body).toEqual({ mode: 'link', email: 'fitter@example.test' });
    expect(share.recipients).toEqual([
      { email: 'fitter@example.test', sentAt: '2026-12-05T10:00:00.000Z', live: true },
    ]);
    expect(share.sendProblem).toBeNull();
  });

  it('refuses a bad address itself, naming the field, and calls nobody', async () => {
    const share = useShareStore();
    await share.open(5);
    await share.createLink();
    const before = calls.length;
    expect(await share.send('fitter@')).toBe(false);
    expect(share.sendProblem).toBe('E-mail address: “fitter@” is not an e-mail address.');
    expect(await share.send('   ')).toBe(false);
    expect(share.sendProblem).toBe('E-mail address: type one.');
    expect(calls.length).toBe(before);
    share.clearSendProblem();
    expect(share.sendProblem).toBeNull();
  });

  it("shows the server's refusal of a send (too many mails) under the address, and keeps the state", async () => {
    const share = useShareStore();
    await share.open(5);
    await share.createLink();
    refusal = new ApiError(429, 'too many share mails from this account; try again within 60 minutes');
    expect(await share.send('buyer@example.test')).toBe(false);
    expect(share.sendProblem).toBe('too many share mails from this account; try again within 60 minutes');
    expect(share.live).toBe(true);
    expect(share.recipients).toEqual([]);
    expect(share.busy).toBeNull();
  });

  it('revokes: no link, the recipients stay listed as revoked, the row says private', async () => {
    const share = useShareStore();
    await share.open(5);
    await share.createLink();
    await share.send('buyer@example.test');
    expect(await share.revoke()).toBe(true);
    expect(calls.at(-1)).toEqual({ method: 'POST', url: '/api/sketches/5/share', body: { mode: 'private' } });
    expect(share.live).toBe(false);
    expect(share.url).toBeNull();
    expect(share.recipients.map((r) => r.live)).toEqual([false]);
    expect(useLibraryStore().items[0].share).toBe('private');
  });

  it('says why the state could not be read', async () => {
    const share = useShareStore();
    const { api } = await import('../../../src/api/http');
    vi.mocked(api.get).mockRejectedValueOnce(new ApiError(404, 'no such sketch'));
    await share.open(6);
    expect(share.error).toBe('no such sketch');
    expect(share.state).toBeNull();
    expect(share.loading).toBe(false);
  });
});
