import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import Papa from 'papaparse';
import { newMember, startTestServer, type Caller, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { Sketch } from '../../server/models';
import { runSweep } from '../../shared/kinematics';

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

async function create(name = 'Shop rig, rear four-link') {
  const res = await alice.post('/api/sketches').send({ name, document: sketchFile() });
  expect(res.status).toBe(201);
  return res.body as { id: number };
}

/** The CSV as rows of cells (the last line ends with CRLF, so the empty tail is dropped). */
function rowsOf(text: string): string[][] {
  return Papa.parse<string[]>(text.trimEnd()).data;
}

const column = (rows: string[][], name: string) => {
  const i = rows[0].indexOf(name);
  expect(i, `column ${name}`).toBeGreaterThanOrEqual(0);
  return rows.slice(1).map((r) => Number(r[i]));
};

describe('GET /api/sketches/:id/sweep.csv', () => {
  it('answers the heave rows as a CSV attachment, travel first, each column with its unit', async () => {
    const s = await create();
    const res = await alice.get(`/api/sketches/${s.id}/sweep.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?Shop-rig-rear-four-link-sweep\.csv"?$/);
    const rows = rowsOf(res.text);
    expect(rows[0][0]).toBe('travel (mm)');
    expect(rows[0]).toContain('antiSquat (%)');
    expect(rows[0]).toContain('pinionAngleChange (°)');
    expect(rows[0]).toContain('members.LLl.length (mm)');
    // Every column names a unit but the plain ratios (motion ratios).
    for (const name of rows[0]) if (!name.endsWith('.motionRatio')) expect(name, name).toMatch(/ \(.+\)$/);

    // The fixture sweeps −130..110 mm by 5 mm: (110 + 130) / 5 + 1 = 49 rows (grid rule of shared/kinematics/grid.ts),
    // which is also what the library's own sweep of the file gives.
    expect(rows.length - 1).toBe(49);
    expect(rows.length - 1).toBe(runSweep(sketchFile()).heave.length);
    const travel = column(rows, 'travel (mm)');
    expect(travel[0]).toBe(-130);
    expect(travel[travel.length - 1]).toBe(110);
  });

  it('gives lengths in inches with units=in (25.4 mm to the inch, exact by definition) and angles as they are', async () => {
    const s = await create();
    const mm = rowsOf((await alice.get(`/api/sketches/${s.id}/sweep.csv?units=mm`).expect(200)).text);
    const inch = rowsOf((await alice.get(`/api/sketches/${s.id}/sweep.csv?units=in`).expect(200)).text);
    expect(inch[0][0]).toBe('travel (in)');
    expect(inch.length).toBe(mm.length);
    const travelIn = column(inch, 'travel (in)');
    column(mm, 'travel (mm)').forEach((v, i) => expect(travelIn[i]).toBeCloseTo(v / 25.4, 12));
    const lengthIn = column(inch, 'members.LLl.length (in)');
    column(mm, 'members.LLl.length (mm)').forEach((v, i) => expect(lengthIn[i]).toBeCloseTo(v / 25.4, 10));
    expect(column(inch, 'pinionAngleChange (°)')).toEqual(column(mm, 'pinionAngleChange (°)'));
  });

  it('refuses a unit it does not know with 400', async () => {
    const s = await create();
    const res = await alice.get(`/api/sketches/${s.id}/sweep.csv?units=cm`);
    expect(res.status).toBe(400);
    expect(res.body.details[0]).toMatch(/^units:/);
  });

  it('answers 422 saying why for a stored sketch that cannot be swept', async () => {
    const s = await create('Broken rig');
    // A file stored before a member lost its pivot: the member's end names a pivot that is gone.
    const doc = sketchFile('Broken rig');
    doc.points = doc.points.filter((p) => p.id !== 'LL.fl');
    await Sketch.update({ document: JSON.stringify(doc) }, { where: { id: s.id } });
    const res = await alice.get(`/api/sketches/${s.id}/sweep.csv`);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/^this sketch cannot be swept: members\[\d+\]\.a: no point 'LL\.fl'/);
    // Its pivots still come out as a table.
    const table = await alice.get(`/api/sketches/${s.id}/hardpoints.csv`);
    expect(table.status).toBe(200);
    expect(rowsOf(table.text).length - 1).toBe(doc.points.length);
  });

  it("is someone else's sketch 404, and signed out 401", async () => {
    const s = await create();
    expect((await bob.get(`/api/sketches/${s.id}/sweep.csv`)).status).toBe(404);
    expect((await bob.get(`/api/sketches/${s.id}/hardpoints.csv`)).status).toBe(404);
    expect((await request(server.app).get(`/api/sketches/${s.id}/sweep.csv`)).status).toBe(401);
  });

  it('comes through a read-only link for a guest, and stops when the link is revoked', async () => {
    const s = await create();
    const on = await alice.post(`/api/sketches/${s.id}/share`).send({ mode: 'link' });
    const token = on.body.shareToken as string;
    const sweep = await request(server.app).get(`/api/shared/${token}/sweep.csv?units=in`);
    expect(sweep.status).toBe(200);
    expect(rowsOf(sweep.text)[0][0]).toBe('travel (in)');
    const table = await request(server.app).get(`/api/shared/${token}/hardpoints.csv`);
    expect(table.status).toBe(200);
    await alice.post(`/api/sketches/${s.id}/share`).send({ mode: 'private' }).expect(200);
    expect((await request(server.app).get(`/api/shared/${token}/sweep.csv`)).status).toBe(404);
    expect((await request(server.app).get(`/api/shared/${token}/hardpoints.csv`)).status).toBe(404);
  });
});

describe('GET /api/sketches/:id/hardpoints.csv', () => {
  it('lists every pivot once: id, body and x, y, z with the unit in the header', async () => {
    const s = await create('Hardpoints rig');
    const res = await alice.get(`/api/sketches/${s.id}/hardpoints.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?Hardpoints-rig-hardpoints\.csv"?$/);
    const rows = rowsOf(res.text);
    expect(rows[0]).toEqual(['id', 'body', 'x (mm)', 'y (mm)', 'z (mm)']);
    const doc = sketchFile();
    expect(rows.length - 1).toBe(doc.points.length);
    // The fixture's first pivot, as the file gives it.
    expect(rows[1]).toEqual(['WC.l', 'axle', '0', '790', '395']);
    expect(rows.slice(1).map((r) => r[0])).toEqual(doc.points.map((p) => p.id));
  });

  it('gives inches with units=in: 790 mm is 31.102362 in to six places (790 / 25.4)', async () => {
    const s = await create();
    const rows = rowsOf((await alice.get(`/api/sketches/${s.id}/hardpoints.csv?units=in`).expect(200)).text);
    expect(rows[0]).toEqual(['id', 'body', 'x (in)', 'y (in)', 'z (in)']);
    expect(rows[1]).toEqual(['WC.l', 'axle', '0', '31.102362', '15.551181']);
  });
});
