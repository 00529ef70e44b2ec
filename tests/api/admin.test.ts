import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Caller, demo, newMember, startTestServer, type TestServer } from './helpers';
import { Session, User } from '../../server/models';

let server: TestServer;
let admin: Caller;
beforeAll(async () => {
  server = await startTestServer();
  admin = await new Caller(server.app).signIn(demo.admin.email, demo.admin.password);
});
afterAll(async () => {
  await server.close();
});

describe('admin routes', () => {
  it('lists users without password hashes', async () => {
    const res = await admin.get('/api/admin/users');
    expect(res.status).toBe(200);
    const emails = res.body.items.map((u: { email: string }) => u.email);
    expect(emails).toEqual(
      expect.arrayContaining(['admin@demo.test', 'instructor@demo.test', 'maker@demo.test', 'student@demo.test']),
    );
    expect(res.body.items[0]).toEqual({
      id: expect.any(Number),
      email: expect.any(String),
      name: expect.any(String),
      role: expect.any(String),
      disabled: false,
      createdAt: expect.any(String),
    });
  });

  it('answers 403 to members and instructors, 401 to guests', async () => {
    const member = await new Caller(server.app).signIn(demo.maker.email, demo.maker.password);
    const instructor = await new Caller(server.app).signIn(demo.instructor.email, demo.instructor.password);
    for (const caller of [member, instructor]) {
      expect((await caller.get('/api/admin/users')).status).toBe(403);
      expect((await caller.get('/api/admin/outbox')).status).toBe(403);
      expect((await caller.patch('/api/admin/users/1').send({ role: 'admin' })).status).toBe(403);
    }
    expect((await request(server.app).get('/api/admin/users')).status).toBe(401);
    const maker = await User.findOne({ where: { email: demo.maker.email } });
    expect(maker!.role).toBe('member');
  });

  it('changes a role', async () => {
    const user = await newMember(server.app, 'promoted');
    const id = (await user.get('/api/auth/me')).body.user.id;
    const res = await admin.patch(`/api/admin/users/${id}`).send({ role: 'instructor' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('instructor');
    expect((await user.get('/api/auth/me')).body.user.role).toBe('instructor');
  });

  it('disabling an account ends its sessions and stops sign-in; enabling lets it back', async () => {
    const user = await newMember(server.app, 'disabled');
    const id = (await user.get('/api/auth/me')).body.user.id;
    expect(await Session.count({ where: { userId: id } })).toBe(1);
    const res = await admin.patch(`/api/admin/users/${id}`).send({ disabled: true });
    expect(res.status).toBe(200);
    expect(res.body.disabled).toBe(true);
    expect(await Session.count({ where: { userId: id } })).toBe(0);
    expect((await user.get('/api/auth/me')).status).toBe(401);
    const again = new Caller(server.app);
    await again.refreshToken();
    // The right password of a disabled account is told the account is disabled (a wrong one gets the usual 401).
    const refused = await again.post('/api/auth/login').send({ email: user.email, password: user.password });
    expect(refused.status).toBe(403);
    expect(refused.body.error).toMatch(/disabled/);
    await admin.patch(`/api/admin/users/${id}`).send({ disabled: false }).expect(200);
    expect((await again.post('/api/auth/login').send({ email: user.email, password: user.password })).status).toBe(200);
  });

  it('refuses bad patches with 400, unknown users with 404, and self-lockout with 400', async () => {
    const me = (await admin.get('/api/auth/me')).body.user.id;
    expect((await admin.patch('/api/admin/users/2').send({ role: 'owner' })).status).toBe(400);
    expect((await admin.patch('/api/admin/users/2').send({})).status).toBe(400);
    expect((await admin.patch('/api/admin/users/2').send({ disabled: 'yes' })).status).toBe(400);
    expect((await admin.patch('/api/admin/users/99999').send({ role: 'member' })).status).toBe(404);
    expect((await admin.patch(`/api/admin/users/${me}`).send({ disabled: true })).status).toBe(400);
    expect((await admin.patch(`/api/admin/users/${me}`).send({ role: 'member' })).status).toBe(400);
    expect((await User.findByPk(me))!.role).toBe('admin');
  });

  it('shows the outbox, newest first', async () => {
    const anon = new Caller(server.app);
    await anon.refreshToken();
    await anon.post('/api/auth/reset-request').send({ email: demo.student.email }).expect(202);
    await server.mail.mailer.idle();
    const res = await admin.get('/api/admin/outbox');
    expect(res.status).toBe(200);
    expect(res.body.items[0]).toMatchObject({ to: 'student@demo.test', subject: 'Arcwright: reset your password' });
    expect(res.body.items[0].text).toContain('/reset?token=');
    expect(res.body.items[0].html).toContain('<a href=');
    expect(Date.parse(res.body.items[0].sentAt)).toBeGreaterThan(0);
  });
});
