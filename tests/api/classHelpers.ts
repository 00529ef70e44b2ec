import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import { expect } from 'vitest';
import { Caller, newMember, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { User } from '../../server/models';
import { hashPassword } from '../../server/services/passwords';
import { classDetailSchema, inviteResultSchema, type ClassDetail } from '../../shared/schema/classes';

/**
 * A new account stored straight in the database and signed in: for a server whose mail cannot go, where
 * signing up (which finishes through a mailed link) cannot.
 */
export async function storedMember(app: Express, label = 'user') {
  const email = `${label}-${randomUUID()}@example.test`;
  const password = `stored-${label}-password-long`;
  await User.create({ email, name: label, passwordHash: await hashPassword(password) });
  return Object.assign(await new Caller(app).signIn(email, password), { email, password });
}

/** How a test makes an account: signing up as a person does, unless the test says otherwise. */
type MakeMember = (app: Express, label: string) => Promise<Caller & { email: string }>;

/** A new account made an instructor (as an admin would), signed in. */
export async function newInstructor(app: Express, label = 'teacher', make: MakeMember = newMember) {
  const caller = await make(app, label);
  await User.update({ role: 'instructor' }, { where: { email: caller.email } });
  return caller;
}

/** A class made by `instructor`, parsed with the API's schema. */
export async function newClass(instructor: Caller, name = 'Suspension Lab 101', term = 'Spring 2027') {
  const res = await instructor.post('/api/classes').send({ name, term });
  expect(res.status).toBe(201);
  return classDetailSchema.parse(res.body);
}

/** One of `owner`'s sketches, made from the test fixture (a four-link with lateral rod). */
export async function ownSketch(owner: Caller, name = 'Lab starter, rear four-link', extra: object = {}) {
  const res = await owner.post('/api/sketches').send({ name, document: { ...sketchFile(name), ...extra } });
  expect(res.status).toBe(201);
  return res.body as { id: number; version: number; document: Record<string, unknown> };
}

/** The invitation link in the newest mail to `email`: its token as the client route /invites/:token gets it. */
export async function invitationToken(server: TestServer, email: string): Promise<string> {
  const [mail] = await server.mailTo(email);
  expect(mail, `an invitation mail to ${email}`).toBeDefined();
  const match = /http:\/\/arcwright\.example\.test\/invites\/([A-Za-z0-9_-]+)/.exec(mail.text);
  expect(match, 'the link in the text part').not.toBeNull();
  expect(mail.html).toContain(`<a href="http://arcwright.example.test/invites/${match![1]}"`);
  return match![1];
}

/** Invites `emails` to the class and returns the parsed answer. */
export async function invite(instructor: Caller, klass: ClassDetail, emails: string | string[]) {
  const res = await instructor.post(`/api/classes/${klass.id}/invites`).send({ emails });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return inviteResultSchema.parse(res.body);
}

/** A new member who joined `klass` through its join code. */
export async function newStudent(app: Express, klass: ClassDetail, label = 'student', make: MakeMember = newMember) {
  const student = await make(app, label);
  await student.post('/api/classes/join').send({ joinCode: klass.joinCode }).expect(200);
  return student;
}

/** An ISO time `days` from now. */
export const daysFromNow = (days: number) => new Date(Date.now() + days * 24 * 3600_000).toISOString();
