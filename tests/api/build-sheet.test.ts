import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { extractText, getDocumentProxy } from 'unpdf';
import { newMember, startTestServer, type Caller, type TestServer } from './helpers';
import { sketchFile } from './fixtures';
import { Sketch } from '../../server/models';
import { starters } from '../../shared/kinematics';
import { CAUTION_TEXT } from '../../shared/display/caution';
import { DATUM_TEXT } from '../../shared/sheet/buildSheet';

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

type Doc = ReturnType<typeof sketchFile>;
type Point = { id: string; body: string; x: number; y: number; z: number };

async function create(caller: Caller, name: string, document: object = sketchFile()) {
  const res = await caller.post('/api/sketches').send({ name, document });
  expect(res.status).toBe(201);
  return res.body as { id: number; document: Doc };
}

/** supertest keeps a binary answer's bytes as they came. */
function asBytes(res: request.Response): Uint8Array {
  return new Uint8Array(res.body as Buffer);
}

const binary = (r: request.Test) =>
  r.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });

/** The PDF's text, every run of white space as one space (lines wrap where the layout says). */
async function pdfText(bytes: Uint8Array): Promise<{ text: string; pages: number; size: number[] }> {
  const pdf = await getDocumentProxy(bytes);
  const { text, totalPages } = await extractText(pdf, { mergePages: true });
  const page = await pdf.getPage(1);
  return { text: text.replace(/\s+/g, ' '), pages: totalPages, size: page.view };
}

const squash = (s: string) => s.replace(/\s+/g, ' ');
/** A coordinate as the sheet prints it: mm to one decimal, with a true minus sign. */
const mm = (v: number) => v.toFixed(1).replace('-', '\u2212');

describe('GET /api/sketches/:id/build-sheet', () => {
  it('answers a PDF download named for the sketch, holding the pivot table, the datum sentence and the caution', async () => {
    const { id, document } = await create(alice, 'Trail rig: rear <four-link> "B"');
    const res = await binary(alice.get(`/api/sketches/${id}/build-sheet?paper=a4&units=mm`));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    // The name keeps letters, digits and dashes only: no quote, slash or angle bracket reaches the header.
    expect(res.headers['content-disposition']).toBe('attachment; filename=Trail-rig-rear-four-link-B.build-sheet.pdf');
    const bytes = asBytes(res);
    expect(new TextDecoder().decode(bytes.slice(0, 5))).toBe('%PDF-');

    const { text } = await pdfText(bytes);
    expect(text).toContain(squash(DATUM_TEXT));
    expect(text).toContain(squash(CAUTION_TEXT));
    // Every frame pivot that carries a bracket, with its coordinates as stored (mm, one decimal).
    const points = document.points as unknown as Point[];
    const frame = points.filter((p) => p.body === 'frame' && !p.id.startsWith('DS.'));
    expect(frame.length).toBeGreaterThan(4);
    const brackets = text.slice(text.indexOf('Frame brackets'), text.indexOf('Axle pivots'));
    for (const p of frame) expect(brackets).toContain(`${p.id} ${mm(p.x)} ${mm(p.y)} ${mm(p.z)}`);
    // The driveshaft's joints place the driveline, they are no brackets (they get their own table).
    expect(brackets).not.toContain('DS.o');
    expect(text).toContain('Driveline reference points (not brackets)');
    // Each moving pivot too, and the drawings' scale and axes.
    const moving = points.filter((p) => p.body === 'axle' && !p.id.startsWith('DS.'));
    for (const p of moving) expect(text).toContain(`${p.id} axle ${mm(p.x)} ${mm(p.y)} ${mm(p.z)}`);
    expect(text).toMatch(/Side view, seen from the vehicle’s left, scale 1:\d+/);
    expect(text).toMatch(/Rear view, seen from behind, scale 1:\d+/);
    expect(text).toContain('+x forward');
    expect(text).toContain('+y left');
    expect(text).toContain('+z up');
  });

  it('gives the members centre to centre (Pythagoras on the stored pivots) and the lengths in inches when asked', async () => {
    const { id, document } = await create(alice, 'Inch sheet');
    const points = new Map((document.points as unknown as Point[]).map((p) => [p.id, p]));
    const members = document.members as unknown as { id: string; a: string; b: string }[];
    const link = members.find((m) => m.id === 'ULl')!;
    const [a, b] = [points.get(link.a)!, points.get(link.b)!];
    const length = Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z);

    const inMm = await pdfText(asBytes(await binary(alice.get(`/api/sketches/${id}/build-sheet`))));
    expect(inMm.text).toContain(`${length.toFixed(1)} mm`);

    const inch = await pdfText(asBytes(await binary(alice.get(`/api/sketches/${id}/build-sheet?units=in`))));
    // 25.4 mm to the inch (the international inch, by definition).
    expect(inch.text).toContain(`${(length / 25.4).toFixed(2)} in`);
    expect(inch.text).toContain('x (in)');
    const ul = points.get('UL.fl')!;
    expect(inch.text).toContain(`UL.fl ${(ul.x / 25.4).toFixed(2)} ${(ul.y / 25.4).toFixed(2)}`);
  });

  it('lays the sheet out on A4 or US Letter as asked', async () => {
    const { id } = await create(alice, 'Paper sizes');
    const a4 = await pdfText(asBytes(await binary(alice.get(`/api/sketches/${id}/build-sheet?paper=a4`))));
    const letter = await pdfText(asBytes(await binary(alice.get(`/api/sketches/${id}/build-sheet?paper=letter`))));
    // ISO 216: A4 is 210 × 297 mm; US Letter is 8.5 × 11 in; 72 pt to the inch.
    expect(a4.size[2]).toBeCloseTo((210 / 25.4) * 72, 0);
    expect(a4.size[3]).toBeCloseTo((297 / 25.4) * 72, 0);
    expect(letter.size[2]).toBeCloseTo(8.5 * 72, 5);
    expect(letter.size[3]).toBeCloseTo(11 * 72, 5);
    expect(a4.pages).toBeGreaterThan(1);
  });

  it('refuses a paper or unit it does not know with 400 naming the parameter', async () => {
    const { id } = await create(alice, 'Bad query');
    const paper = await alice.get(`/api/sketches/${id}/build-sheet?paper=a3`);
    expect(paper.status).toBe(400);
    expect(paper.body.details.join(' ')).toMatch(/^paper: /);
    const units = await alice.get(`/api/sketches/${id}/build-sheet?units=cm`);
    expect(units.status).toBe(400);
    expect(units.body.details.join(' ')).toMatch(/^units: /);
    const twice = await alice.get(`/api/sketches/${id}/build-sheet?paper=a4&paper=letter`);
    expect(twice.status).toBe(400);
    expect(twice.body.details.join(' ')).toMatch(/^paper: /);
    const unknown = await alice.get(`/api/sketches/${id}/build-sheet?scale=5`);
    expect(unknown.status).toBe(400);
    expect(unknown.body.details.join(' ')).toContain('scale');
  });

  it('is the owner’s alone: someone else gets 404, a guest 401', async () => {
    const { id } = await create(alice, 'Private sheet');
    expect((await bob.get(`/api/sketches/${id}/build-sheet`)).status).toBe(404);
    expect((await request(server.app).get(`/api/sketches/${id}/build-sheet`)).status).toBe(401);
  });

  it('prints a double wishbone’s own geometry (camber, toe, caster, roll centre, anti-dive) and no solid-axle lines', async () => {
    const { id } = await create(alice, 'Front wishbones', starters['double-wishbone']!.build());
    const { text } = await pdfText(asBytes(await binary(alice.get(`/api/sketches/${id}/build-sheet`))));
    const geometry = text.slice(text.indexOf('Geometry of the'), text.indexOf('Targets'));
    for (const label of [
      'Camber change over the travel',
      'Toe change (bump steer) over the travel',
      'Caster at ride',
      'Anti-dive at ride',
      'Roll centre height at ride',
      'Wheel centre track change over the travel',
    ])
      expect(geometry).toContain(label);
    for (const absent of ['Pinion angle', 'Lateral shift', 'Anti-squat']) expect(geometry).not.toContain(absent);
    expect(geometry).not.toContain('—');
    expect(text).toMatch(/Front view, drawn as seen from behind, scale 1:\d+/);
    expect(text).toContain('Knuckle pivots');
  });
});

describe('the build sheet of a sketch that cannot be swept', () => {
  it('still prints its pivots and members and says why the sweep is missing', async () => {
    const { id } = await create(alice, 'Broken rig');
    // A row saved before a rule was added can hold a document the sweep refuses: a member to a point that is gone.
    const row = (await Sketch.findByPk(id))!;
    const doc = JSON.parse(row.document) as Doc & { members: { id: string; b: string }[] };
    doc.members.find((m) => m.id === 'ULl')!.b = 'GONE';
    await row.update({ document: JSON.stringify(doc) });

    const res = await binary(alice.get(`/api/sketches/${id}/build-sheet`));
    expect(res.status).toBe(200);
    const { text } = await pdfText(asBytes(res));
    expect(text).toContain('No sweep. The sketch cannot be swept:');
    expect(text).toContain("no point 'GONE'");
    const ll = (doc.points as unknown as Point[]).find((p) => p.id === 'LL.fl')!;
    expect(text).toContain(`LL.fl ${mm(ll.x)} ${mm(ll.y)} ${mm(ll.z)}`);
    expect(text).toContain(squash(CAUTION_TEXT));
  });
});

describe('GET /api/shared/:token/build-sheet', () => {
  it('gives anyone with the read-only link the PDF, and nothing once the link is revoked', async () => {
    const { id } = await create(alice, 'Customer copy');
    const shared = await alice.post(`/api/sketches/${id}/share`).send({ mode: 'link' });
    expect(shared.status).toBe(200);
    const token = shared.body.shareToken as string;

    const guest = await binary(request(server.app).get(`/api/shared/${token}/build-sheet?paper=letter&units=in`));
    expect(guest.status).toBe(200);
    expect(guest.headers['content-type']).toBe('application/pdf');
    expect(guest.headers['content-disposition']).toBe('attachment; filename=Customer-copy.build-sheet.pdf');
    const { text, size } = await pdfText(asBytes(guest));
    expect(size[2]).toBeCloseTo(8.5 * 72, 5);
    expect(text).toContain(squash(DATUM_TEXT));
    expect(text).toContain('x (in)');

    const bad = await request(server.app).get(`/api/shared/${token}/build-sheet?paper=tabloid`);
    expect(bad.status).toBe(400);
    expect(bad.body.details.join(' ')).toMatch(/^paper: /);

    await alice.post(`/api/sketches/${id}/share`).send({ mode: 'private' }).expect(200);
    expect((await request(server.app).get(`/api/shared/${token}/build-sheet`)).status).toBe(404);
  });
});
