/** The classes pages' small helpers: the hand-ins filter, due dates, invitation states, hand-ins as sketches. */
import { describe, expect, it } from 'vitest';
import { filterHandIns } from '../../../src/classes/handInFilter';
import { dueFromInputs, howFar } from '../../../src/classes/due';
import { inviteGoneText } from '../../../src/classes/invite';
import { handInAsSketch, handInOnBoard } from '../../../src/classes/handInSketch';
import { bodyProblem, readAnswer } from '../../../src/classes/answers';
import { nextPath } from '../../../src/router/next';
import { HAND_IN_WORDS, parseLineupIds } from '../../../src/stores/lineup/ids';
import { createClassBody, handInRowSchema } from '../../../shared/schema/classes';
import { fourLink } from '../board/fixture';
import { handInRow } from './fixtures';

describe('filterHandIns', () => {
  const rows = [
    handInRow(1, { student: { id: 1, name: 'Ada Quill' } }),
    handInRow(2, { student: { id: 2, name: 'Ben Quillan' }, late: true }),
    handInRow(3, { student: { id: 3, name: 'Cleo Marsh' }, late: true, flagCount: 2 }),
    handInRow(4, { student: { id: 4, name: 'Dev Orr' }, flagCount: 1 }),
  ];
  const ids = (f: Parameters<typeof filterHandIns>[1]) => filterHandIns(rows, f).map((r) => r.id);

  it('keeps every row with no filter', () => {
    expect(ids({ text: '', lateOnly: false, withFlags: false })).toEqual([1, 2, 3, 4]);
  });
  it('matches part of the name in any case, ignoring spaces around it', () => {
    expect(ids({ text: ' quill ', lateOnly: false, withFlags: false })).toEqual([1, 2]);
    expect(ids({ text: 'MARSH', lateOnly: false, withFlags: false })).toEqual([3]);
  });
  it('narrows to late ones, flagged ones, or both', () => {
    expect(ids({ text: '', lateOnly: true, withFlags: false })).toEqual([2, 3]);
    expect(ids({ text: '', lateOnly: false, withFlags: true })).toEqual([3, 4]);
    expect(ids({ text: '', lateOnly: true, withFlags: true })).toEqual([3]);
    expect(ids({ text: 'quill', lateOnly: false, withFlags: true })).toEqual([]);
  });
});

describe('due dates', () => {
  const now = new Date('2026-12-05T12:00:00Z');
  it('turns a local date and time into the same instant', () => {
    const due = dueFromInputs('2026-12-18', '17:30', now);
    expect(due.ok).toBe(true);
    if (!due.ok) return;
    const back = new Date(due.iso);
    // Read back in the local time zone it was typed in.
    expect([back.getFullYear(), back.getMonth() + 1, back.getDate(), back.getHours(), back.getMinutes()]).toEqual([
      2026, 12, 18, 17, 30,
    ]);
  });
  it('refuses a past date, a missing day or time, and a day that does not exist, naming the field', () => {
    expect(dueFromInputs('2026-12-01', '09:00', now)).toEqual({
      ok: false,
      problem: 'Due: the date and time must lie in the future.',
    });
    expect(dueFromInputs('', '09:00', now)).toMatchObject({ ok: false, problem: expect.stringMatching(/^Due date/) });
    expect(dueFromInputs('2026-12-20', '', now)).toMatchObject({
      ok: false,
      problem: expect.stringMatching(/^Due time/),
    });
    expect(dueFromInputs('2026-13-45', '09:00', now)).toMatchObject({ ok: false });
  });
  it('says how far away a date is', () => {
    expect(howFar('2026-12-08T12:00:00Z', now)).toBe('in 3 days');
    expect(howFar('2026-12-05T17:00:00Z', now)).toBe('in 5 hours');
    expect(howFar('2026-12-04T12:00:00Z', now)).toBe('1 day ago');
    expect(howFar('2026-12-05T12:00:20Z', now)).toBe('now');
  });
});

describe('inviteGoneText', () => {
  const base = { instructorName: 'Morgan Hale', expiresAt: '2026-12-19T12:00:00.000Z' };
  it('is null while the invitation waits, and names what happened otherwise', () => {
    expect(inviteGoneText({ ...base, state: 'pending' })).toBeNull();
    expect(inviteGoneText({ ...base, state: 'accepted' })).toMatch(/used already/);
    expect(inviteGoneText({ ...base, state: 'expired' })).toMatch(/^This invitation expired on .*Ask Morgan Hale/);
    expect(inviteGoneText({ ...base, state: 'withdrawn' })).toBe(
      'Morgan Hale withdrew this invitation. Ask them if you should still join.',
    );
  });
});

describe('a hand-in as the board holds it', () => {
  const detail = {
    ...handInRow(5, { late: true }),
    assignmentTitle: 'Lab 3',
    classId: 2,
    document: fourLink(),
  };
  it('is the frozen document under the student, never editable', () => {
    const s = handInAsSketch(detail);
    expect(s).toMatchObject({
      id: 205,
      version: 3,
      owner: { id: 105, name: 'Student 5' },
      mine: false,
      canEdit: false,
    });
    expect(s.document).toBe(detail.document);
    expect(handInOnBoard(detail)).toEqual({
      id: 5,
      assignmentId: 7,
      assignmentTitle: 'Lab 3',
      studentName: 'Student 5',
      handedInAt: '2026-12-04T16:00:00.000Z',
      late: true,
    });
  });
});

describe('reading and checking the classes API', () => {
  it('names the field of a body the schema refuses', () => {
    expect(bodyProblem(createClassBody, { name: '   ' }, { name: 'Name' })).toBe('Name: must not be empty');
    expect(bodyProblem(createClassBody, { name: 'Chassis 210' })).toBeNull();
  });
  it('refuses an answer of another shape with a plain message', () => {
    expect(() => readAnswer(handInRowSchema, { id: 'x' }, 'the hand-in')).toThrow(
      /^The server's answer about the hand-in could not be read \(/,
    );
    expect(readAnswer(handInRowSchema, handInRow(1), 'the hand-in').id).toBe(1);
  });
});

describe('nextPath', () => {
  it('goes back to a page of this app, and nowhere else', () => {
    expect(nextPath('/invites/abc')).toBe('/invites/abc');
    expect(nextPath('//elsewhere.example.test/x')).toBe('/library');
    expect(nextPath('/\\elsewhere.example.test')).toBe('/library');
    expect(nextPath('https://elsewhere.example.test')).toBe('/library');
    expect(nextPath(['/a', '/b'])).toBe('/library');
    expect(nextPath(undefined, '/classes')).toBe('/classes');
  });
});

describe('lining up hand-ins', () => {
  it('speaks of hand-ins and where to pick them', () => {
    expect(parseLineupIds('4,9', HAND_IN_WORDS)).toEqual({ ok: true, ids: [4, 9] });
    expect(parseLineupIds('4', HAND_IN_WORDS)).toEqual({
      ok: false,
      error: "A line-up compares 2 to 4 hand-ins; pick them on the assignment's page.",
    });
    expect(parseLineupIds('4,x', HAND_IN_WORDS)).toMatchObject({ error: expect.stringContaining('not a hand-in') });
  });
});
