// @vitest-environment happy-dom
/** Who is signed in, and what their role lets them see. Invented people at example.test. */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { ApiError } from '../../../src/api/http';
import type { User } from '../../../src/api/types';
import { useSessionStore } from '../../../src/stores/session';

const INSTRUCTOR: User = { id: 3, email: 'mara.quill@example.test', name: 'Mara Quill', role: 'instructor' };
let meAnswer: () => { user: User } = () => ({ user: INSTRUCTOR });
const posts: string[] = [];

vi.mock('../../../src/api/http', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../../src/api/http')>();
  return {
    ...real,
    api: {
      get: vi.fn(async () => meAnswer()),
      post: vi.fn(async (url: string, body?: { email?: string }) => {
        posts.push(url);
        return { user: { ...INSTRUCTOR, email: body?.email ?? INSTRUCTOR.email } };
      }),
    },
  };
});

describe('session store', () => {
  beforeEach(() => {
    posts.length = 0;
    meAnswer = () => ({ user: INSTRUCTOR });
    setActivePinia(createPinia());
  });

  it('asks the server once, then answers from what it knows', async () => {
    const session = useSessionStore();
    expect(session.checked).toBe(false);
    expect(await session.ensureChecked()).toEqual(INSTRUCTOR);
    expect(session.signedIn).toBe(true);
    expect(session.isInstructor).toBe(true);
    expect(session.isAdmin).toBe(false);
    meAnswer = () => {
      throw new Error('asked twice');
    };
    expect(await session.ensureChecked()).toEqual(INSTRUCTOR);
  });

  it('a 401 means nobody is signed in; any other failure is passed on', async () => {
    const session = useSessionStore();
    meAnswer = () => {
      throw new ApiError(401, 'Sign in first');
    };
    expect(await session.refresh()).toBeNull();
    expect(session.checked).toBe(true);
    expect(session.signedIn).toBe(false);
    meAnswer = () => {
      throw new ApiError(0, 'The server could not be reached.');
    };
    await expect(session.refresh()).rejects.toThrow('The server could not be reached.');
  });

  it('sign-in sets the user; sign-out clears it', async () => {
    const session = useSessionStore();
    await session.login('tomas.reed@example.test', 'correct horse');
    expect(session.user?.email).toBe('tomas.reed@example.test');
    expect(session.checked).toBe(true);
    await session.logout();
    expect(session.user).toBeNull();
    expect(posts).toEqual(['/api/auth/login', '/api/auth/logout']);
  });

  it('an admin is an instructor too', async () => {
    const session = useSessionStore();
    meAnswer = () => ({ user: { ...INSTRUCTOR, role: 'admin' } });
    await session.refresh();
    expect(session.isAdmin).toBe(true);
    expect(session.isInstructor).toBe(true);
  });
});
