import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { runSweep } from '../../shared/kinematics';
import { badInputCases } from '../unit/schema/badInputCases';

let server: TestServer;
let guest: Caller;
beforeAll(async () => {
  server = await startTestServer();
  guest = new Caller(server.app);
  await guest.refreshToken();
});
afterAll(async () => {
  await server.close();
});

describe('POST /api/sweep', () => {
  it('answers exactly what runSweep computes for the same file', async () => {
    const doc = sketchFile();
    const res = await guest.post('/api/sweep').send(doc);
    expect(res.status).toBe(200);
    // JSON round trip: the API result is the library result serialized.
    expect(res.body).toEqual(JSON.parse(JSON.stringify(runSweep(doc))));
    expect(res.body.heave.length).toBeGreaterThan(0);
  });

  it('answers 400 with the problems for a bad sketch', async () => {
    const doc = sketchFile();
    doc.points[0] = { ...doc.points[0], z: null };
    const res = await guest.post('/api/sweep').send(doc);
    expect(res.status).toBe(400);
    expect(res.body.details).toContain('points[0].z: expected a number');
  });

  it('answers 400 naming the field for slip-yoke limits in the wrong order', async () => {
    const doc = sketchFile();
    doc.driveline = { ...(doc.driveline as object), slipYoke: { collapsed: 1500, extended: 1300 } };
    const res = await guest.post('/api/sweep').send(doc);
    expect(res.status).toBe(400);
    expect(res.body.details).toContain('driveline.slipYoke.extended: must be longer than collapsed (1500 mm)');
  });

  for (const c of badInputCases) {
    it(`answers 400 naming the field for ${c.name}`, async () => {
      const res = await guest.post('/api/sweep').send(c.doc());
      expect(res.status).toBe(400);
      expect(res.body.details).toContain(c.problem);
    });
  }

  it('answers 413 above 256 KB', async () => {
    const doc = { ...sketchFile(), padding: 'x'.repeat(260 * 1024) };
    const res = await guest.post('/api/sweep').send(doc);
    expect(res.status).toBe(413);
  });

  it('needs the CSRF token like every write', async () => {
    expect((await guest.agent.post('/api/sweep').send(sketchFile())).status).toBe(403);
  });
});
