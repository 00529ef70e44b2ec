import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Caller, startTestServer, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { runSweep, starters } from '../../shared/kinematics';
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

  it('answers the steer sweep of a steered sketch: rows, lock events and the bump-steer map', async () => {
    const doc = starters['double-wishbone']!.build();
    const res = await guest.post('/api/sweep').send(doc);
    expect(res.status).toBe(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(runSweep(doc))));
    expect(res.body.steer.rows).toHaveLength(25);
    expect(res.body.steer.events.map((e: { kind: string }) => e.kind)).toEqual(['steer-lock', 'steer-lock']);
    expect(res.body.steer.bumpSteer.curves.length).toBe(5);
  });

  it('answers 400 naming sweep.steer for a bad rack step', async () => {
    const doc = sketchFile();
    doc.sweep = { ...(doc.sweep as object), steer: { rack: 40, step: 0 } };
    const res = await guest.post('/api/sweep').send(doc);
    expect(res.status).toBe(400);
    expect(res.body.details).toContain('sweep.steer.step: must be greater than 0');
    doc.sweep = { ...(doc.sweep as object), steer: { rack: 40, step: 50 } };
    const larger = await guest.post('/api/sweep').send(doc);
    expect(larger.status).toBe(400);
    expect(larger.body.details).toContain('sweep.steer.step: must be at most the rack travel (40 mm)');
  });

  it('answers 200 with heave and roll and a warning naming sweep.steer for a layout that does not steer', async () => {
    const doc = sketchFile();
    doc.sweep = { ...(doc.sweep as object), steer: { rack: 40, step: 5 } };
    const res = await guest.post('/api/sweep').send(doc);
    expect(res.status).toBe(200);
    expect(res.body.heave.length).toBeGreaterThan(0);
    expect(res.body.roll.length).toBeGreaterThan(0);
    expect(res.body.steer.rows).toEqual([]);
    expect(res.body.steer.problem).toMatch(/^sweep\.steer: /);
    expect(res.body.warnings).toContain(res.body.steer.problem);
  });

  it('answers the steered front axle: pitman rows, a pitman arm missing its box pivot, a rack refused', async () => {
    const doc = starters['steered-front-axle']!.build();
    const res = await guest.post('/api/sweep').send(doc);
    expect(res.status).toBe(200);
    expect(res.body.steer.input).toBe('pitman');
    expect(res.body.steer.rows).toHaveLength(29);
    expect(res.body.steer.rows[0]).toMatchObject({ pitman: -35 });
    expect(res.body.ride.wheelSteer).toEqual({ left: 0, right: 0 });

    const noPivot = { ...doc, pitmanArm: { axis: 'SB.a', ball: 'PM.b' } };
    const missing = await guest.post('/api/sweep').send(noPivot);
    expect(missing.status).toBe(200);
    expect(missing.body.steer.rows).toEqual([]);
    expect(missing.body.steer.problem).toMatch(/^pitmanArm\.pivot: the pitman arm has no box pivot/);
    expect(missing.body.warnings).toContain(missing.body.steer.problem);
    expect(missing.body.heave).toEqual(JSON.parse(JSON.stringify(runSweep(doc).heave)));
    expect(missing.body.roll.length).toBeGreaterThan(0);

    const rack = { ...doc, sweep: { ...doc.sweep, steer: { rack: 40, step: 5 } } };
    const refused = await guest.post('/api/sweep').send(rack);
    expect(refused.status).toBe(400);
    expect(refused.body.details).toContain(
      'sweep.steer.rack: the steered-front-axle layout turns a pitman arm, not a rack: give sweep.steer.pitman (degrees each way) instead',
    );

    const far = { ...doc, sweep: { ...doc.sweep, steer: { pitman: 90, step: 5 } } };
    const past = await guest.post('/api/sweep').send(far);
    expect(past.status).toBe(200);
    expect(past.body.steer.events[1].message).toMatch(
      /^sweep\.steer\.pitman: -90\.0° is past the steering linkage's reach/,
    );
  });

  it('answers 200 with the toggle named for a rack travel past the tie rods’ reach, heave and roll as always', async () => {
    const doc = starters['double-wishbone']!.build();
    const far = { ...doc, sweep: { ...doc.sweep, steer: { rack: 100, step: 5 } } };
    const res = await guest.post('/api/sweep').send(far);
    expect(res.status).toBe(200);
    const [up] = res.body.steer.events;
    expect(up.kind).toBe('steer-toggle');
    expect(up.message).toMatch(/^sweep\.steer\.rack: \+100 mm is past the tie rods' reach/);
    expect(res.body.heave).toEqual(JSON.parse(JSON.stringify(runSweep(doc).heave)));
    // JSON would write NaN as null: the library's own result is walked for a number that is not finite.
    const notFinite: string[] = [];
    JSON.stringify(runSweep(far), (key, v) => {
      if (typeof v === 'number' && !Number.isFinite(v)) notFinite.push(key);
      return v;
    });
    expect(notFinite).toEqual([]);
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
