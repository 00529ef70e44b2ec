// @vitest-environment happy-dom
/** The build sheet's store when the sketch cannot be fetched: a revoked read-only link reads as on the board. */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { ApiError } from '../../../src/api/http';
import { useBuildSheetStore } from '../../../src/stores/buildSheet';
import { SHARED_LINK_GONE } from '../../../src/stores/board';

let refusal: ApiError;

vi.mock('../../../src/api/http', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../../src/api/http')>();
  return {
    ...real,
    api: {
      get: vi.fn(async () => {
        throw refusal;
      }),
    },
  };
});

beforeEach(() => setActivePinia(createPinia()));

describe('the build sheet that cannot open', () => {
  it('says a revoked read-only link no longer works, in the board’s words', async () => {
    refusal = new ApiError(404, 'this link is not shared (any more)');
    const sheet = useBuildSheetStore();
    await sheet.load({ token: 'tok-0123456789abcdef' });
    expect(sheet.error).toBe(SHARED_LINK_GONE);
    expect(sheet.detail).toBeNull();
  });

  it('names the server’s reason for the owner’s own sketch, and for any other refusal of a link', async () => {
    refusal = new ApiError(404, 'no such sketch');
    const sheet = useBuildSheetStore();
    await sheet.load({ id: 99 });
    expect(sheet.error).toBe('The build sheet could not open: no such sketch.');
    refusal = new ApiError(0, 'The server could not be reached. Check the connection and try again');
    await sheet.load({ token: 'tok-0123456789abcdef' });
    expect(sheet.error).toBe(
      'The build sheet could not open: The server could not be reached. Check the connection and try again.',
    );
  });
});
