import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import { buildSheet } from '../../../shared/sheet/buildSheet';

const fourLink = () => starters['four-link-lateral-rod']!.build();

describe('the build sheet', () => {
  it('gives every member centre to centre from its two pivots (Pythagoras), in the user\u2019s unit', () => {
    const doc = fourLink();
    const sheet = buildSheet(doc, runSweep(doc), null, 'mm');
    const link = doc.members.find((m) => m.id === 'ULl')!;
    const a = doc.points.find((p) => p.id === link.a)!;
    const b = doc.points.find((p) => p.id === link.b)!;
    const expected = Math.sqrt((a.x - b.x) ** 2 + (a.y - b.y) ** 2 + (a.z - b.z) ** 2);
    expect(sheet.members.find((m) => m.id === 'ULl')!.length).toBe(`${expected.toFixed(1)} mm`);
    // 25.4 mm to the inch (the international inch, by definition).
    expect(buildSheet(doc, null, null, 'in').members.find((m) => m.id === 'ULl')!.length).toBe(
      `${(expected / 25.4).toFixed(2)} in`,
    );
  });

  it('lists frame brackets apart from the moving pivots and the driveline reference points, every pivot once', () => {
    const doc = fourLink();
    const sheet = buildSheet(doc, null, null, 'mm');
    // The driveshaft's joint centres and shaft axes place the driveline: a fabricator cuts no bracket for them.
    const d = doc.driveline!;
    const reference = [d.output, d.outputAxis, d.pinion, d.pinionAxis];
    expect(sheet.frame.map((p) => p.id)).toEqual(
      doc.points.filter((p) => p.body === 'frame' && !reference.includes(p.id)).map((p) => p.id),
    );
    expect(sheet.driveline.map((p) => p.id).sort()).toEqual([...reference].sort());
    expect(sheet.frame.length + sheet.moving.length + sheet.driveline.length).toBe(doc.points.length);
    const ul = doc.points.find((p) => p.id === 'UL.fl')!;
    expect(sheet.frame.find((p) => p.id === 'UL.fl')).toMatchObject({ x: ul.x.toFixed(1), z: ul.z.toFixed(1) });
  });

  it('gives each shock the lengths the sweep asks of it beside its stroke', () => {
    const doc = fourLink();
    const result = runSweep(doc);
    const shock = doc.members.find((m) => m.kind === 'shock')!;
    const lengths = result.heave.map((r) => r.members[shock.id].length);
    const note = buildSheet(doc, result, null, 'mm').members.find((m) => m.id === shock.id)!.note;
    expect(note).toContain(
      `${Math.min(...lengths).toFixed(1)} mm to ${Math.max(...lengths).toFixed(1)} mm over the travel`,
    );
    expect(note).toMatch(/^stroke \d/);
  });

  it('says why there is no geometry for a sketch that cannot be swept, and keeps its pivots and members', () => {
    const doc = fourLink();
    const sheet = buildSheet(doc, null, 'The sketch cannot be swept: members[0].a: no point', 'mm');
    expect(sheet.geometry).toEqual([]);
    expect(sheet.problem).toContain('cannot be swept');
    expect(sheet.members).toHaveLength(doc.members.length);
  });
});
