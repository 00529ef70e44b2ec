import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { newMember, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { Session, User } from '../../server/models';

// The session row and its account are read in one statement on every request: a change to the account
// (its name, its role, disabling it) must show on the very next request of a session that is already signed in,
// without that session being ended.

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

async function accountOf(email: string): Promise<User> {
  const user = await User.findOne({ where: { email } });
  if (!user) throw new Error(`no account ${email}`);
  return user;
}

describe('the account read with the session', () => {
  it('is the signed-in account, with its name and role as stored now', async () => {
    const member = await newMember(server.app, 'reader');
    const before = await member.get('/api/auth/me').expect(200);
    expect(before.body.user).toMatchObject({ email: member.email, role: 'member' });

    const user = await accountOf(member.email);
    await user.update({ name: 'Renamed Reader', role: 'instructor' });
    const after = await member.get('/api/auth/me').expect(200);
    expect(after.body.user).toEqual({ id: user.id, email: member.email, name: 'Renamed Reader', role: 'instructor' });
  });

  it('signs the request out once the account is disabled, although its session row is still there', async () => {
    const member = await newMember(server.app, 'disabled');
    await member.get('/api/sketches').expect(200);
    const user = await accountOf(member.email);
    await user.update({ disabled: true });
    expect(await Session.count({ where: { userId: user.id } })).toBeGreaterThan(0);
    await member.get('/api/sketches').expect(401);
    await member.get('/api/auth/me').expect(401);
  });

  it('signs the request out once the account is removed', async () => {
    const member = await newMember(server.app, 'removed');
    await member.get('/api/sketches').expect(200);
    const user = await accountOf(member.email);
    // The session row outlives the account here (userId is not a foreign key of sessions).
    await server.sequelize.query('DELETE FROM users WHERE id = ?', { replacements: [user.id] });
    await member.get('/api/sketches').expect(401);
  });

  it('names the caller as the owner of the sketch it reads and saves', async () => {
    const member = await newMember(server.app, 'owner');
    const created = await member
      .post('/api/sketches')
      .send({ name: 'Owner check', document: sketchFile() })
      .expect(201);
    const user = await accountOf(member.email);
    expect(created.body.owner).toEqual({ id: user.id, name: user.name });
    const read = await member.get(`/api/sketches/${created.body.id}`).expect(200);
    expect(read.body.owner).toEqual({ id: user.id, name: user.name });
    const saved = await member
      .put(`/api/sketches/${created.body.id}`)
      .send({ name: 'Owner check 2', document: read.body.document, version: read.body.version })
      .expect(200);
    expect(saved.body.owner).toEqual({ id: user.id, name: user.name });
  });
});
