import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Caller, demo, newMember, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';

/**
 * Random bodies to every write route: no answer may be a 5xx, and a refused call (4xx) must
 * leave every table as it was (sessions excepted: they are the caller's own bookkeeping).
 */
const RUNS_PER_ROUTE = 300;
const TABLES = [
  'users',
  'shops',
  'classes',
  'class_members',
  'sketches',
  'sketch_revisions',
  'uploads',
  'outbox',
  'password_resets',
  'share_recipients',
];

let server: TestServer;
let member: Caller;
let admin: Caller;
let guest: Caller;
let sketchId: number;
let targetUserId: number;

async function snapshot(): Promise<string> {
  // The tables are read side by side (a server database answers them on several connections), each one's rows in
  // a fixed order whatever order the database returns them in (not every table has an id column).
  const parts = await Promise.all(
    TABLES.map(async (table) => {
      const rows = await server.sequelize.getQueryInterface().select(null, table, {});
      return rows.map((row) => JSON.stringify(row)).sort();
    }),
  );
  return JSON.stringify(parts);
}

beforeAll(async () => {
  server = await startTestServer({
    LOGIN_MAX_PER_ADDRESS: '100000',
    LOGIN_MAX_PER_ACCOUNT: '100000',
    SIGNUP_MAX_PER_ADDRESS: '100000',
    SWEEP_MAX_PER_MINUTE: '100000',
    SHARE_MAIL_MAX_PER_HOUR: '100000',
    SHARE_MAIL_MAX_PER_RECIPIENT: '100000',
  });
  member = await newMember(server.app, 'fuzzed');
  admin = await new Caller(server.app).signIn(demo.admin.email, demo.admin.password);
  guest = new Caller(server.app);
  await guest.refreshToken();
  sketchId = (await member.post('/api/sketches').send({ name: 'Fuzz target', document: sketchFile() })).body.id;
  const target = await newMember(server.app, 'target');
  targetUserId = (await target.get('/api/auth/me')).body.user.id;
});
afterAll(async () => {
  await server.close();
});

/** Every path into a JSON value, as key lists. */
function pathsOf(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = [prefix];
  if (Array.isArray(value)) value.forEach((v, i) => out.push(...pathsOf(v, [...prefix, i])));
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) out.push(...pathsOf(v, [...prefix, k]));
  return out;
}

const base = sketchFile();
const basePaths = pathsOf(base).filter((p) => p.length > 0);

/** A valid sketch with one value replaced by anything, or removed. */
const mutatedSketch = fc
  .tuple(fc.nat({ max: basePaths.length - 1 }), fc.oneof(fc.jsonValue(), fc.constant(undefined)))
  .map(([i, value]) => {
    const doc = structuredClone(base) as Record<string, unknown>;
    const path = basePaths[i];
    let node = doc as Record<string | number, unknown>;
    for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
    const last = path[path.length - 1];
    if (value === undefined && !Array.isArray(node)) delete node[last];
    else node[last] = value ?? null;
    return doc;
  });

const text = fc.oneof(
  fc.string(),
  fc.emailAddress(),
  fc.constantFrom('', ' ', 'a'.repeat(300), 'maker@demo.test', '<script>', '\u0000'),
);
const anyValue = fc.oneof(fc.jsonValue(), text, fc.integer(), fc.double(), fc.boolean(), fc.constant(null));
const fieldsOf = (keys: string[]) =>
  fc.dictionary(fc.constantFrom(...keys, 'extra', '__proto__', 'constructor'), anyValue, { maxKeys: keys.length + 1 });

type Body = { json: unknown } | { raw: string };
const jsonBody = (arb: fc.Arbitrary<unknown>): fc.Arbitrary<Body> =>
  fc.oneof(
    { weight: 6, arbitrary: arb.map((json) => ({ json })) },
    { weight: 1, arbitrary: fc.jsonValue().map((json) => ({ json })) },
    { weight: 1, arbitrary: fc.string().map((raw) => ({ raw })) },
  );

interface WriteRoute {
  name: string;
  caller: () => Caller;
  method: 'post' | 'put' | 'patch';
  path: () => string;
  body: fc.Arbitrary<Body>;
  /** After a 2xx the caller's session may have changed (sign-in): fetch a new token. */
  refreshAfterSuccess?: boolean;
}

const routes: WriteRoute[] = [
  {
    name: 'POST /api/auth/signup',
    caller: () => guest,
    method: 'post',
    path: () => '/api/auth/signup',
    body: jsonBody(fieldsOf(['email', 'password', 'name'])),
    refreshAfterSuccess: true,
  },
  {
    name: 'POST /api/auth/login',
    caller: () => guest,
    method: 'post',
    path: () => '/api/auth/login',
    body: jsonBody(fieldsOf(['email', 'password'])),
    refreshAfterSuccess: true,
  },
  {
    name: 'POST /api/auth/reset-request',
    caller: () => guest,
    method: 'post',
    path: () => '/api/auth/reset-request',
    body: jsonBody(fieldsOf(['email'])),
  },
  {
    name: 'POST /api/auth/reset',
    caller: () => guest,
    method: 'post',
    path: () => '/api/auth/reset',
    body: jsonBody(fieldsOf(['token', 'password'])),
  },
  {
    name: 'POST /api/sketches',
    caller: () => member,
    method: 'post',
    path: () => '/api/sketches',
    body: jsonBody(
      fc.oneof(
        fieldsOf(['name', 'document']),
        fc.record({ name: text, document: mutatedSketch }, { requiredKeys: ['document'] }),
      ),
    ),
  },
  {
    name: 'PUT /api/sketches/:id',
    caller: () => member,
    method: 'put',
    path: () => `/api/sketches/${sketchId}`,
    body: jsonBody(
      fc.oneof(
        fieldsOf(['name', 'document', 'version']),
        fc.record({ document: mutatedSketch, version: fc.oneof(fc.integer({ min: -2, max: 5 }), anyValue) }),
      ),
    ),
  },
  {
    name: 'POST /api/sketches/import',
    caller: () => member,
    method: 'post',
    path: () => '/api/sketches/import',
    body: jsonBody(mutatedSketch),
  },
  {
    name: 'POST /api/sketches/:id/share',
    caller: () => member,
    method: 'post',
    path: () => `/api/sketches/${sketchId}/share`,
    body: jsonBody(fieldsOf(['mode', 'email'])),
  },
  {
    name: 'PATCH /api/admin/users/:id',
    caller: () => admin,
    method: 'patch',
    path: () => `/api/admin/users/${targetUserId}`,
    body: jsonBody(fieldsOf(['role', 'disabled'])),
  },
  {
    name: 'POST /api/sweep',
    caller: () => guest,
    method: 'post',
    path: () => '/api/sweep',
    body: jsonBody(mutatedSketch),
  },
];

describe('fuzzed write routes', () => {
  for (const route of routes) {
    it(`${route.name}: ${RUNS_PER_ROUTE} random bodies, no 5xx, refused calls change nothing`, async () => {
      const seen = new Map<number, number>();
      await fc.assert(
        fc.asyncProperty(route.body, async (body) => {
          // Mail queued by an earlier accepted call must land before the snapshot, not during the next call.
          await server.mail.mailer.idle();
          const before = await snapshot();
          const caller = route.caller();
          const req = caller[route.method](route.path());
          // Serialized here so that primitives and odd keys reach the server as they are.
          const raw = 'raw' in body ? body.raw : JSON.stringify(body.json);
          const res = await req.set('Content-Type', 'application/json').send(raw);
          seen.set(res.status, (seen.get(res.status) ?? 0) + 1);
          expect(res.status, JSON.stringify(res.body)).toBeLessThan(500);
          expect(typeof res.body.error === 'string' || res.status < 400).toBe(true);
          if (res.status >= 400) {
            await server.mail.mailer.idle();
            expect(await snapshot()).toBe(before);
          } else if (route.refreshAfterSuccess) await caller.refreshToken();
        }),
        { numRuns: RUNS_PER_ROUTE },
      );
      // The generators must reach the validation, not only bounce off it.
      expect(seen.get(400) ?? 0).toBeGreaterThan(RUNS_PER_ROUTE / 4);
    }, 120_000);
  }

  it('random multipart bytes to the upload route: no 5xx, refused uploads store nothing', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.uint8Array({ maxLength: 2048 }),
        fc.constantFrom('file', 'photo', 'x'),
        async (bytes, field) => {
          const before = await snapshot();
          const res = await member.post(`/api/sketches/${sketchId}/uploads`).attach(field, Buffer.from(bytes), 'f.png');
          expect(res.status).toBeLessThan(500);
          if (res.status >= 400) expect(await snapshot()).toBe(before);
        },
      ),
      { numRuns: RUNS_PER_ROUTE },
    );
  }, 120_000);
});
