import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Caller, demo, newMember, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { Sketch, SketchRevision } from '../../server/models';

/**
 * Two people, each with a sketch. Every sketch route is called with the other person's id:
 * the answer must be 404 (indistinguishable from a missing sketch) and nothing may change.
 * Signed out, every route answers 401.
 */
let server: TestServer;
let alice: Caller;
let bob: Caller;
let aliceSketch: number;
let bobSketch: number;

type Route = { method: 'get' | 'post' | 'put' | 'delete'; path: (id: number) => string; body?: () => unknown };

const routes: Route[] = [
  { method: 'get', path: (id) => `/api/sketches/${id}` },
  {
    method: 'put',
    path: (id) => `/api/sketches/${id}`,
    body: () => ({ document: sketchFile('Hijacked'), version: 1 }),
  },
  { method: 'delete', path: (id) => `/api/sketches/${id}` },
  { method: 'post', path: (id) => `/api/sketches/${id}/undelete` },
  { method: 'get', path: (id) => `/api/sketches/${id}/revisions` },
  { method: 'get', path: (id) => `/api/sketches/${id}/revisions/1` },
  { method: 'post', path: (id) => `/api/sketches/${id}/restore/1` },
  { method: 'post', path: (id) => `/api/sketches/${id}/copy` },
  { method: 'get', path: (id) => `/api/sketches/${id}/export` },
  { method: 'get', path: (id) => `/api/sketches/${id}/share` },
  { method: 'get', path: (id) => `/api/sketches/${id}/build-sheet` },
  { method: 'post', path: (id) => `/api/sketches/${id}/share`, body: () => ({ mode: 'link' }) },
  {
    method: 'post',
    path: (id) => `/api/sketches/${id}/share`,
    body: () => ({ mode: 'link', email: 'someone@example.test' }),
  },
  { method: 'post', path: (id) => `/api/sketches/${id}/uploads` },
];

async function snapshot() {
  const sketches = await Sketch.findAll({ order: [['id', 'ASC']], raw: true });
  return { sketches, revisions: await SketchRevision.count() };
}

beforeAll(async () => {
  server = await startTestServer();
  alice = await newMember(server.app, 'alice');
  bob = await newMember(server.app, 'bob');
  aliceSketch = (await alice.post('/api/sketches').send({ name: 'Alice rear', document: sketchFile() })).body.id;
  bobSketch = (await bob.post('/api/sketches').send({ name: 'Bob rear', document: sketchFile() })).body.id;
});
afterAll(async () => {
  await server.close();
});

describe("someone else's sketch", () => {
  for (const route of routes) {
    it(`${route.method.toUpperCase()} ${route.path(0).replace('/0', '/:id')} answers 404 both ways and changes nothing`, async () => {
      const before = await snapshot();
      for (const [caller, id] of [
        [alice, bobSketch],
        [bob, aliceSketch],
      ] as const) {
        const req = caller[route.method](route.path(id));
        const res = route.body ? await req.send(route.body() as object) : await req;
        expect(res.status, `${route.method} ${route.path(id)}`).toBe(404);
        expect(res.body.error).toBeTruthy();
      }
      expect(await snapshot()).toEqual(before);
    });
  }

  it("does not list the other's sketches", async () => {
    const list = await alice.get('/api/sketches?pageSize=100');
    expect(list.body.items.map((i: { id: number }) => i.id)).toEqual([aliceSketch]);
  });

  it("is 404 for an admin too (admins manage accounts, not other people's work)", async () => {
    const admin = await new Caller(server.app).signIn(demo.admin.email, demo.admin.password);
    expect((await admin.get(`/api/sketches/${aliceSketch}`)).status).toBe(404);
  });

  it("a soft-deleted sketch of the other's is 404 on undelete too", async () => {
    await bob.delete(`/api/sketches/${bobSketch}`).expect(204);
    expect((await alice.post(`/api/sketches/${bobSketch}/undelete`)).status).toBe(404);
    await bob.post(`/api/sketches/${bobSketch}/undelete`).expect(200);
  });
});

describe('signed out', () => {
  for (const route of [
    ...routes,
    { method: 'get', path: () => '/api/sketches' } as Route,
    { method: 'post', path: () => '/api/sketches/import' } as Route,
  ]) {
    it(`${route.method.toUpperCase()} ${route.path(0)} answers 401 (or 403 for a write without a session token)`, async () => {
      const anon = new Caller(server.app);
      await anon.refreshToken();
      const res = route.body
        ? await anon[route.method](route.path(aliceSketch)).send(route.body() as object)
        : await anon[route.method](route.path(aliceSketch));
      expect(res.status).toBe(401);
      // Without any token a write is refused before authentication.
      if (route.method !== 'get')
        expect((await request(server.app)[route.method](route.path(aliceSketch))).status).toBe(403);
    });
  }
});
