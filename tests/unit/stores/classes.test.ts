// @vitest-environment happy-dom
/**
 * The classes store against a fake API that answers as the contract (shared/schema/classes.ts) says: the
 * calls it makes, what it keeps, and bad input refused with the field named before anything is sent.
 */
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { ApiError } from '../../../src/api/http';
import { useClassesStore } from '../../../src/stores/classes';
import type { AssignmentDetail, ClassDetail, HandInRow } from '../../../shared/schema/classes';
import { handInRow } from '../classes/fixtures';

type Call = { method: string; url: string; body?: unknown };
const calls: Call[] = [];
/** What the fake API answers next, by "METHOD url". */
const answers = new Map<string, unknown>();

function answer(method: string, url: string, body?: unknown) {
  calls.push(body === undefined ? { method, url } : { method, url, body });
  const key = `${method} ${url}`;
  if (!answers.has(key)) throw new ApiError(404, `No answer for ${key}`);
  const a = answers.get(key);
  if (a instanceof ApiError) throw a;
  return structuredClone(a);
}

vi.mock('../../../src/api/http', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../../src/api/http')>();
  return {
    ...real,
    api: {
      get: vi.fn(async (url: string) => answer('GET', url)),
      post: vi.fn(async (url: string, body?: unknown) => answer('POST', url, body)),
      patch: vi.fn(async (url: string, body: unknown) => answer('PATCH', url, body)),
      del: vi.fn(async (url: string) => answer('DELETE', url)),
    },
  };
});

const T0 = '2026-12-01T09:00:00.000Z';

function classDetail(over: Partial<ClassDetail> = {}): ClassDetail {
  return {
    id: 3,
    name: 'Chassis 210',
    term: 'Spring 2027',
    role: 'instructor',
    instructor: { id: 1, name: 'Morgan Hale' },
    closed: false,
    deletedAt: null,
    studentCount: 0,
    assignmentCount: 0,
    nextDueAt: null,
    createdAt: T0,
    joinCode: 'K7M2QX',
    members: [],
    invites: [],
    assignments: [],
    ...over,
  };
}

function assignmentDetail(over: Partial<AssignmentDetail> = {}): AssignmentDetail {
  return {
    id: 7,
    classId: 3,
    className: 'Chassis 210',
    classClosed: false,
    role: 'instructor',
    title: 'Lab 3',
    instructions: 'Bring anti-squat into the band.',
    dueAt: '2027-01-10T17:00:00.000Z',
    published: false,
    createdAt: T0,
    starterSketchId: 40,
    copy: null,
    handIns: [],
    ...over,
  };
}

const { joinCode: _c, members: _m, invites: _i, assignments: _a, ...summary } = classDetail();

describe('classes store', () => {
  beforeEach(() => {
    calls.length = 0;
    answers.clear();
    setActivePinia(createPinia());
  });

  it('lists the classes, and a class made comes first in the list', async () => {
    answers.set('GET /api/classes', { items: [{ ...summary, id: 2, name: 'Older class' }] });
    const store = useClassesStore();
    await store.loadList();
    expect(store.list.map((c) => c.name)).toEqual(['Older class']);

    answers.set('POST /api/classes', classDetail());
    const made = await store.create({ name: '  Chassis 210 ', term: ' Spring 2027 ' });
    expect(made.joinCode).toBe('K7M2QX');
    expect(calls.at(-1)).toEqual({
      method: 'POST',
      url: '/api/classes',
      body: { name: 'Chassis 210', term: 'Spring 2027' },
    });
    expect(store.list.map((c) => c.id)).toEqual([3, 2]);
    // The list holds summaries: no roster or join code in it.
    expect(store.list[0]).not.toHaveProperty('joinCode');
  });

  it('refuses an empty name or a term too long before sending anything', async () => {
    const store = useClassesStore();
    await expect(store.create({ name: '   ' })).rejects.toThrow('Name: must not be empty');
    await expect(store.create({ name: 'Chassis 210', term: 'x'.repeat(61) })).rejects.toThrow(/^Term: /);
    expect(calls).toEqual([]);
  });

  it('refuses an answer that is not a class, with a plain message', async () => {
    answers.set('GET /api/classes/3', { id: 3, name: 'Chassis 210' });
    await expect(useClassesStore().loadClass(3)).rejects.toThrow(
      /^The server's answer about this class could not be read/,
    );
  });

  it('deletes a class and restores it: the list row follows', async () => {
    answers.set('GET /api/classes', { items: [summary] });
    const store = useClassesStore();
    await store.loadList();
    answers.set('DELETE /api/classes/3', classDetail({ deletedAt: '2026-12-05T10:00:00.000Z' }));
    await store.remove(3);
    expect(store.list[0].deletedAt).toBe('2026-12-05T10:00:00.000Z');
    answers.set('POST /api/classes/3/restore', classDetail());
    await store.restore(3);
    expect(store.list[0].deletedAt).toBeNull();
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual([
      'GET /api/classes',
      'DELETE /api/classes/3',
      'POST /api/classes/3/restore',
    ]);
  });

  it('sends a pasted list as it is, keeps what each address came to, and reads the class again', async () => {
    const store = useClassesStore();
    const pasted = 'ada@example.test, not-an-address\nada@example.test';
    const invite = {
      id: 11,
      email: 'ada@example.test',
      state: 'pending',
      sentAt: T0,
      expiresAt: '2026-12-15T09:00:00.000Z',
      acceptedAt: null,
    } as const;
    answers.set('POST /api/classes/3/invites', {
      sent: [invite],
      refused: [{ email: 'not-an-address', problem: 'not an e-mail address' }],
      skipped: [{ email: 'ada@example.test', reason: 'named twice in the list' }],
    });
    answers.set('GET /api/classes/3', classDetail({ invites: [invite] }));
    const result = await store.invite(3, pasted);
    expect(calls[0]).toEqual({ method: 'POST', url: '/api/classes/3/invites', body: { emails: pasted } });
    expect(calls[1]).toEqual({ method: 'GET', url: '/api/classes/3' });
    expect(result.refused).toEqual([{ email: 'not-an-address', problem: 'not an e-mail address' }]);
    expect(store.lastInvites?.classId).toBe(3);
    expect(store.current?.invites).toHaveLength(1);

    // Withdrawn: the row says so at once; resent: the fresh invitation takes its place.
    await store.withdrawInvite(3, 11).catch(() => undefined);
    expect(calls.at(-1)).toEqual({ method: 'DELETE', url: '/api/classes/3/invites/11' });
    expect(store.current?.invites?.[0].state).toBe('pending');
    answers.set('DELETE /api/classes/3/invites/11', undefined);
    await store.withdrawInvite(3, 11);
    expect(store.current?.invites?.[0].state).toBe('withdrawn');
    answers.set('POST /api/classes/3/invites/11/resend', { ...invite, sentAt: '2026-12-05T11:00:00.000Z' });
    await store.resendInvite(3, 11);
    expect(store.current?.invites?.[0]).toMatchObject({ state: 'pending', sentAt: '2026-12-05T11:00:00.000Z' });
  });

  it('refuses an empty list of addresses without sending it', async () => {
    await expect(useClassesStore().invite(3, '  \n ')).rejects.toThrow('Addresses: paste at least one e-mail address.');
    expect(calls).toEqual([]);
  });

  it('joins by code (spaces trimmed) and by invitation, then reads the list again', async () => {
    const store = useClassesStore();
    answers.set('POST /api/classes/join', { classId: 3, className: 'Chassis 210' });
    answers.set('POST /api/invites/tok%2F1/accept', { classId: 3, className: 'Chassis 210' });
    answers.set('GET /api/classes', { items: [{ ...summary, role: 'student' }] });
    expect(await store.join('  k7m2qx ')).toEqual({ classId: 3, className: 'Chassis 210' });
    expect(calls[0]).toEqual({ method: 'POST', url: '/api/classes/join', body: { joinCode: 'k7m2qx' } });
    await store.acceptInvite('tok/1');
    expect(calls.map((c) => c.url)).toEqual([
      '/api/classes/join',
      '/api/classes',
      '/api/invites/tok%2F1/accept',
      '/api/classes',
    ]);
    await expect(store.join('   ')).rejects.toThrow('Join code: must not be empty');
  });

  it('refuses an assignment due in the past without sending it', async () => {
    const store = useClassesStore();
    const body = {
      sketchId: 40,
      title: 'Lab 3',
      instructions: '',
      dueAt: '2020-01-01T00:00:00.000Z',
      withTargets: true,
    };
    await expect(store.createAssignment(3, body)).rejects.toThrow('Due: must lie in the future.');
    await expect(store.createAssignment(3, { ...body, title: ' ' })).rejects.toThrow('Title: must not be empty');
    expect(calls).toEqual([]);
  });

  it('starts a copy, hands in (the new row first) and passes on the server refusing a closed class', async () => {
    const store = useClassesStore();
    answers.set('GET /api/assignments/7', assignmentDetail({ role: 'student', handIns: [handInRow(1)] }));
    await store.loadAssignment(7);
    answers.set('POST /api/assignments/7/copy', { sketchId: 90, createdAt: T0 });
    expect(await store.startCopy(7)).toEqual({ sketchId: 90, createdAt: T0 });
    expect(store.assignment?.copy?.sketchId).toBe(90);

    answers.set('POST /api/assignments/7/hand-ins', handInRow(2, { late: true }));
    await store.handIn(7);
    expect(store.assignment?.handIns.map((h) => h.id)).toEqual([2, 1]);

    answers.set(
      'POST /api/assignments/7/hand-ins',
      new ApiError(409, 'The class is closed: nothing more can be handed in.'),
    );
    await expect(store.handIn(7)).rejects.toThrow('The class is closed: nothing more can be handed in.');
    expect(store.assignment?.handIns).toHaveLength(2);
  });

  it('writes feedback on one hand-in and shows it in its row', async () => {
    const store = useClassesStore();
    answers.set('GET /api/assignments/7', assignmentDetail({ handIns: [handInRow(1), handInRow(2)] }));
    await store.loadAssignment(7);
    const feedback = {
      text: 'Check the pinion angle at full bump.',
      writtenAt: T0,
      author: { id: 1, name: 'Morgan Hale' },
    };
    answers.set('POST /api/hand-ins/2/feedback', { ...handInRow(2), feedback } satisfies HandInRow);
    await store.writeFeedback(2, '  Check the pinion angle at full bump. ');
    expect(calls.at(-1)?.body).toEqual({ text: 'Check the pinion angle at full bump.' });
    expect(store.assignment?.handIns.map((h) => h.feedback?.text ?? null)).toEqual([
      null,
      'Check the pinion angle at full bump.',
    ]);
    await expect(store.writeFeedback(2, '   ')).rejects.toThrow('Feedback: must not be empty');
  });

  it('publishes an assignment and leaves a class', async () => {
    const store = useClassesStore();
    answers.set('GET /api/assignments/7', assignmentDetail());
    await store.loadAssignment(7);
    answers.set('PATCH /api/assignments/7', assignmentDetail({ published: true }));
    await store.updateAssignment(7, { published: true });
    expect(store.assignment?.published).toBe(true);

    answers.set('GET /api/classes', { items: [{ ...summary, role: 'student' }] });
    await store.loadList();
    answers.set('POST /api/classes/3/leave', undefined);
    await store.leave(3);
    expect(store.list).toEqual([]);
  });
});
