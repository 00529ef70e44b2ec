import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { newMember, startTestServer, type Caller, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { Sketch, SketchRevision } from '../../server/models';
import { RESTORE_WINDOW_MS } from '../../server/services/sketches';
import { badInputCases } from '../unit/schema/badInputCases';

let server: TestServer;
let alice: Caller;
let bob: Caller;
beforeAll(async () => {
  server = await startTestServer();
  alice = await newMember(server.app, 'alice');
  bob = await newMember(server.app, 'bob');
});
afterAll(async () => {
  await server.close();
});

async function create(caller: Caller, name = 'Rear four-link A') {
  const res = await caller.post('/api/sketches').send({ name, document: sketchFile() });
  expect(res.status).toBe(201);
  return res.body as { id: number; version: number; document: { name: string; points: Array<{ x: number }> } };
}

describe('create and read', () => {
  it('creates a sketch at version 1 whose name is written into the document', async () => {
    const res = await alice.post('/api/sketches').send({ name: 'Trail rig rear', document: sketchFile('ignored') });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      name: 'Trail rig rear',
      layout: 'four-link-lateral-rod',
      version: 1,
      mine: true,
      canEdit: true,
      share: 'private',
      shareToken: null,
      deletedAt: null,
    });
    expect(res.body.document.name).toBe('Trail rig rear');
    expect(res.body.owner.name).toMatch(/alice/);
    const got = await alice.get(`/api/sketches/${res.body.id}`);
    expect(got.status).toBe(200);
    expect(got.body.document.points).toHaveLength(sketchFile().points.length);
  });

  it('refuses a bad document with 400 and path-named problems, storing nothing', async () => {
    const before = await Sketch.count();
    const doc = sketchFile();
    doc.points[3] = { ...doc.points[3], x: 'far' };
    const res = await alice.post('/api/sketches').send({ name: 'Broken', document: doc });
    expect(res.status).toBe(400);
    expect(res.body.details).toContain('document.points[3].x: expected a number');
    expect(await Sketch.count()).toBe(before);
  });

  it('refuses a missing document and unknown fields with 400', async () => {
    expect((await alice.post('/api/sketches').send({ name: 'x' })).status).toBe(400);
    const extra = await alice.post('/api/sketches').send({ name: 'x', document: sketchFile(), ownerId: 1 });
    expect(extra.status).toBe(400);
    expect(extra.body.details.join(' ')).toMatch(/ownerId/);
  });

  it('answers 401 when signed out', async () => {
    expect((await request(server.app).get('/api/sketches')).status).toBe(401);
    expect((await request(server.app).get('/api/sketches/1')).status).toBe(401);
  });

  it('answers 404 for ids that are not numbers', async () => {
    expect((await alice.get('/api/sketches/abc')).status).toBe(404);
    expect((await alice.get('/api/sketches/0')).status).toBe(404);
  });
});

describe('list', () => {
  it('lists only my sketches, with search, layout filter, sort and paging', async () => {
    const me = await newMember(server.app, 'lister');
    for (const name of ['Bravo 100%', 'alpha_rear', 'Charlie', 'Delta rear']) await create(me, name);
    await create(bob, 'Bob private rear');

    const all = await me.get('/api/sketches?sort=name&order=asc&pageSize=2&page=1');
    expect(all.status).toBe(200);
    expect(all.body).toMatchObject({ total: 4, page: 1, pageSize: 2 });
    expect(all.body.items.map((i: { name: string }) => i.name)).toEqual(['alpha_rear', 'Bravo 100%']);
    const page2 = await me.get('/api/sketches?sort=name&order=asc&pageSize=2&page=2');
    expect(page2.body.items.map((i: { name: string }) => i.name)).toEqual(['Charlie', 'Delta rear']);
    expect(page2.body.items[0]).toMatchObject({ mine: true, share: 'private', deletedAt: null });
    expect(page2.body.items[0].document).toBeUndefined();

    const rear = await me.get('/api/sketches?q=REAR');
    expect(rear.body.items.map((i: { name: string }) => i.name).sort()).toEqual(['Delta rear', 'alpha_rear']);
    // % and _ are plain characters in a search, not wildcards.
    expect((await me.get('/api/sketches?q=100%25')).body.total).toBe(1);
    expect((await me.get('/api/sketches?q=a_r')).body.total).toBe(1);

    expect((await me.get('/api/sketches?layout=four-link-lateral-rod')).body.total).toBe(4);
    expect((await me.get('/api/sketches?layout=leaf-spring')).body.total).toBe(0);
  });

  it('refuses bad query values with 400', async () => {
    for (const q of ['sort=owner', 'order=up', 'page=0', 'pageSize=1000', 'layout=boat', 'deleted=2', 'page=x']) {
      const res = await alice.get(`/api/sketches?${q}`);
      expect(res.status, q).toBe(400);
      expect(res.body.details.length, q).toBeGreaterThan(0);
    }
  });
});

describe('save with versions', () => {
  it('saves a new version and a revision, and refuses a stale version with 409 and the current one', async () => {
    const s = await create(alice);
    const doc = { ...s.document, points: s.document.points.map((p, i) => (i === 1 ? { ...p, x: p.x + 25 } : p)) };
    const ok = await alice.put(`/api/sketches/${s.id}`).send({ document: doc, version: 1 });
    expect(ok.status).toBe(200);
    expect(ok.body.version).toBe(2);
    expect(ok.body.document.points[1].x).toBe(s.document.points[1].x + 25);

    const stale = await alice.put(`/api/sketches/${s.id}`).send({ document: s.document, version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.details).toEqual({ version: 2 });
    const row = await Sketch.findByPk(s.id);
    expect(row!.version).toBe(2);
    expect(JSON.parse(row!.document).points[1].x).toBe(s.document.points[1].x + 25);
    expect(await SketchRevision.count({ where: { sketchId: s.id } })).toBe(2);
  });

  it('refuses a save whose targets or tracing are malformed, naming the field, and keeps the stored version', async () => {
    const s = await create(alice);
    const bad = await alice
      .put(`/api/sketches/${s.id}`)
      .send({ document: { ...s.document, targets: { antiSquat: { min: 90, max: 60 } } }, version: 1 });
    expect(bad.status).toBe(400);
    expect(bad.body.details).toContain('document.targets.antiSquat: min must not be above max');
    const photo = {
      upload: 'a1',
      url: '/api/uploads/a1',
      width: 10,
      height: 10,
      centre: { h: 0, v: 0 },
      mmPerPx: 1,
      opacity: -1,
      locked: false,
    };
    const badPhoto = await alice
      .put(`/api/sketches/${s.id}`)
      .send({ document: { ...s.document, tracing: { side: photo } }, version: 1 });
    expect(badPhoto.status).toBe(400);
    expect((badPhoto.body.details as string[]).some((d) => d.startsWith('document.tracing.side.opacity'))).toBe(true);
    const row = await Sketch.findByPk(s.id);
    expect(row!.version).toBe(1);
  });

  it('lets exactly one of several concurrent saves of the same version through', async () => {
    const s = await create(alice);
    const results = await Promise.all(
      [1, 2, 3, 4, 5].map((n) =>
        alice.put(`/api/sketches/${s.id}`).send({ document: s.document, name: `Racer ${n}`, version: 1 }),
      ),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409, 409, 409, 409]);
    const winner = results.find((r) => r.status === 200)!;
    const row = await Sketch.findByPk(s.id);
    expect(row!.name).toBe(winner.body.name);
    expect(row!.version).toBe(2);
  });

  it('renames with name and refuses a bad version field', async () => {
    const s = await create(alice);
    const renamed = await alice
      .put(`/api/sketches/${s.id}`)
      .send({ document: s.document, name: 'Renamed', version: 1 });
    expect(renamed.body).toMatchObject({ name: 'Renamed', version: 2 });
    expect(renamed.body.document.name).toBe('Renamed');
    for (const version of [0, -1, 1.5, '2', null]) {
      expect((await alice.put(`/api/sketches/${s.id}`).send({ document: s.document, version })).status).toBe(400);
    }
  });
});

describe('revisions', () => {
  it('lists revisions newest first, returns one, and restores it as a new version', async () => {
    const s = await create(alice, 'History one');
    await alice
      .put(`/api/sketches/${s.id}`)
      .send({ document: s.document, name: 'History two', version: 1 })
      .expect(200);
    await alice
      .put(`/api/sketches/${s.id}`)
      .send({ document: s.document, name: 'History three', version: 2 })
      .expect(200);

    const list = await alice.get(`/api/sketches/${s.id}/revisions`);
    expect(list.status).toBe(200);
    expect(list.body.items.map((r: { rev: number; name: string }) => [r.rev, r.name])).toEqual([
      [3, 'History three'],
      [2, 'History two'],
      [1, 'History one'],
    ]);
    const one = await alice.get(`/api/sketches/${s.id}/revisions/1`);
    expect(one.body).toMatchObject({ rev: 1, version: 1, name: 'History one' });
    expect(one.body.document.name).toBe('History one');

    const restored = await alice.post(`/api/sketches/${s.id}/restore/1`);
    expect(restored.status).toBe(200);
    expect(restored.body).toMatchObject({ name: 'History one', version: 4 });
    expect((await alice.get(`/api/sketches/${s.id}/revisions`)).body.items).toHaveLength(4);
    expect((await alice.get(`/api/sketches/${s.id}/revisions/99`)).status).toBe(404);
  });
});

describe('delete and undelete', () => {
  it('soft-deletes, lists under deleted=1, and restores', async () => {
    const s = await create(alice, 'To be deleted');
    expect((await alice.delete(`/api/sketches/${s.id}`)).status).toBe(204);
    expect((await alice.get(`/api/sketches/${s.id}`)).status).toBe(404);
    const live = await alice.get('/api/sketches?pageSize=100');
    expect(live.body.items.some((i: { id: number }) => i.id === s.id)).toBe(false);
    const deleted = await alice.get('/api/sketches?deleted=1&pageSize=100');
    const item = deleted.body.items.find((i: { id: number }) => i.id === s.id);
    expect(item.deletedAt).toBeTruthy();

    const back = await alice.post(`/api/sketches/${s.id}/undelete`);
    expect(back.status).toBe(200);
    expect(back.body.deletedAt).toBeNull();
    expect((await alice.post(`/api/sketches/${s.id}/undelete`)).status).toBe(404);
  });

  it('refuses to undelete after 30 days', async () => {
    const s = await create(alice, 'Long gone');
    await alice.delete(`/api/sketches/${s.id}`).expect(204);
    await Sketch.update({ deletedAt: new Date(Date.now() - RESTORE_WINDOW_MS - 60_000) }, { where: { id: s.id } });
    expect((await alice.post(`/api/sketches/${s.id}/undelete`)).status).toBe(404);
    expect(
      (await alice.get('/api/sketches?deleted=1&pageSize=100')).body.items.some((i: { id: number }) => i.id === s.id),
    ).toBe(false);
  });
});

describe('copy, import and export', () => {
  it('copies my sketch as a new private sketch', async () => {
    const s = await create(alice, 'Original');
    await alice.post(`/api/sketches/${s.id}/share`).send({ mode: 'link' }).expect(200);
    const copy = await alice.post(`/api/sketches/${s.id}/copy`);
    expect(copy.status).toBe(201);
    expect(copy.body).toMatchObject({ name: 'Original (copy)', version: 1, share: 'private', mine: true });
    expect(copy.body.id).not.toBe(s.id);
  });

  it('imports a sketch file and exports it back as an attachment', async () => {
    const imported = await alice.post('/api/sketches/import').send(sketchFile('Imported rear'));
    expect(imported.status).toBe(201);
    expect(imported.body.name).toBe('Imported rear');
    const exported = await alice.get(`/api/sketches/${imported.body.id}/export`);
    expect(exported.status).toBe(200);
    expect(exported.headers['content-disposition']).toMatch(
      /^attachment; filename="?Imported-rear\.arcwright\.json"?$/,
    );
    const file = JSON.parse(exported.text);
    expect(file.format).toBe('arcwright.sketch');
    expect(file.points).toEqual(imported.body.document.points);
  });

  for (const c of badInputCases) {
    it(`refuses to create, import or save ${c.name}, naming the field and storing nothing`, async () => {
      const before = await Sketch.count();
      const imported = await alice.post('/api/sketches/import').send(c.doc());
      expect(imported.status).toBe(400);
      expect(imported.body.details).toContain(c.problem);
      const created = await alice.post('/api/sketches').send({ name: 'Faulty', document: c.doc() });
      expect(created.status).toBe(400);
      expect(created.body.details).toContain(`document.${c.problem}`);
      expect(await Sketch.count()).toBe(before);
      // A save of a stored sketch with the fault is refused alike and keeps the stored version.
      const s = await create(alice);
      const saved = await alice.put(`/api/sketches/${s.id}`).send({ document: c.doc(), version: 1 });
      expect(saved.status).toBe(400);
      expect(saved.body.details).toContain(`document.${c.problem}`);
      expect((await Sketch.findByPk(s.id))!.version).toBe(1);
    });
  }

  it('refuses to import something that is not a sketch, naming the problems', async () => {
    const res = await alice.post('/api/sketches/import').send({ format: 'other', points: 3 });
    expect(res.status).toBe(400);
    expect(res.body.details.some((d: string) => d.startsWith('format:'))).toBe(true);
    const arr = await alice.post('/api/sketches/import').send([1, 2]);
    expect(arr.status).toBe(400);
  });
});

describe('share links', () => {
  it('shares read-only by link to a guest, who can copy after signing in; revoking ends the link', async () => {
    const s = await create(alice, 'Shared rear');
    const on = await alice.post(`/api/sketches/${s.id}/share`).send({ mode: 'link' });
    expect(on.status).toBe(200);
    expect(on.body.share).toBe('link');
    expect(on.body.shareToken).toMatch(/^[A-Za-z0-9_-]{32}$/);
    expect(on.body.url).toBe(`http://arcwright.example.test/shared/${on.body.shareToken}`);
    // Sharing again keeps the link people already have.
    const again = await alice.post(`/api/sketches/${s.id}/share`).send({ mode: 'link' });
    expect(again.body.shareToken).toBe(on.body.shareToken);
    expect((await alice.get(`/api/sketches/${s.id}`)).body.shareToken).toBe(on.body.shareToken);

    const guest = await request(server.app).get(`/api/shared/${on.body.shareToken}`);
    expect(guest.status).toBe(200);
    expect(guest.body).toMatchObject({ id: s.id, name: 'Shared rear', canEdit: false, mine: false, shareToken: null });
    expect(guest.body.document.points.length).toBeGreaterThan(0);

    const asBob = await bob.get(`/api/shared/${on.body.shareToken}`);
    expect(asBob.body.canEdit).toBe(false);
    const copy = await bob.post(`/api/shared/${on.body.shareToken}/copy`);
    expect(copy.status).toBe(201);
    expect(copy.body).toMatchObject({ name: 'Shared rear (copy)', mine: true, canEdit: true });
    expect((await request(server.app).post(`/api/shared/${on.body.shareToken}/copy`)).status).toBe(403);

    const off = await alice.post(`/api/sketches/${s.id}/share`).send({ mode: 'private' });
    expect(off.body).toEqual({ share: 'private', shareToken: null, url: null, recipients: [] });
    expect((await request(server.app).get(`/api/shared/${on.body.shareToken}`)).status).toBe(404);

    const reshared = await alice.post(`/api/sketches/${s.id}/share`).send({ mode: 'link' });
    expect(reshared.body.shareToken).not.toBe(on.body.shareToken);
    expect((await request(server.app).get(`/api/shared/${on.body.shareToken}`)).status).toBe(404);
    expect((await request(server.app).get(`/api/shared/${reshared.body.shareToken}`)).status).toBe(200);
  });

  it('refuses a bad share mode with 400, and an unknown token with 404', async () => {
    const s = await create(alice);
    expect((await alice.post(`/api/sketches/${s.id}/share`).send({ mode: 'public' })).status).toBe(400);
    expect((await request(server.app).get('/api/shared/notarealtokenatall0000')).status).toBe(404);
    expect((await request(server.app).get('/api/shared/x')).status).toBe(404);
  });

  it('hides a deleted sketch from its link', async () => {
    const s = await create(alice);
    const on = await alice.post(`/api/sketches/${s.id}/share`).send({ mode: 'link' });
    await alice.delete(`/api/sketches/${s.id}`).expect(204);
    expect((await request(server.app).get(`/api/shared/${on.body.shareToken}`)).status).toBe(404);
  });
});
