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

  it('gives a double wishbone its own geometry lines and none of a solid axle, every one with a value', () => {
    const doc = starters['double-wishbone']!.build();
    const sheet = buildSheet(doc, runSweep(doc), null, 'mm');
    const labels = sheet.geometry.map((l) => l.label);
    for (const l of [
      'Camber change over the travel',
      'Toe change (bump steer) over the travel',
      'Caster at ride',
      'Caster change over the travel',
      'Anti-dive at ride',
      'Roll centre height at ride',
      'Wheel centre track change over the travel',
    ])
      expect(labels).toContain(l);
    for (const l of labels) expect(l).not.toMatch(/Pinion|Lateral shift|Anti-squat|Anti-lift/);
    for (const l of sheet.geometry) expect(l.value, l.label).not.toBe('—');
    expect(sheet.crossView).toBe('front');
    expect(sheet.movingTitle).toBe('Knuckle pivots');
  });

  it('gives a solid axle no wheel-attitude lines (camber, toe, kingpin): its layout does not give them', () => {
    const doc = fourLink();
    const labels = buildSheet(doc, runSweep(doc), null, 'mm').geometry.map((l) => l.label);
    expect(labels).toContain('Pinion angle change over the travel');
    for (const l of labels) expect(l).not.toMatch(/Camber|Toe|Caster|Kingpin|Scrub|trail|track change/i);
  });

  it('keeps the half-shafts\u2019 joints and axes of a trailing arm out of the frame brackets', () => {
    const doc = starters['trailing-arm']!.build();
    const sheet = buildSheet(doc, null, null, 'mm');
    const h = doc.halfShafts!.left!;
    for (const id of [h.inner, h.innerAxis]) {
      expect(sheet.frame.map((p) => p.id)).not.toContain(id);
      expect(sheet.driveline.map((p) => p.id)).toContain(id);
    }
    expect(sheet.frame.map((p) => p.id)).toContain('HA.ol');
  });

  it('lists each target band with how the sweep meets it, and a missed one where it leaves the band', () => {
    const doc = { ...fourLink(), targets: { antiSquat: { min: 90, max: 120 }, lateralShift: { min: -15, max: 15 } } };
    const result = runSweep(doc);
    const sheet = buildSheet(doc, result, null, 'mm');
    // The band sits above the anti-squat the sweep reads at ride, so the sheet must call it missed there.
    expect(result.ride.antiSquat!).toBeLessThan(90);
    const anti = sheet.targets.find((t) => t.label === 'Anti-squat')!;
    expect(anti.band).toBe('90.0–120.0 %');
    expect(anti.status).toMatch(/^missed: .* wanted 90\.0–120\.0 %\.$/);
    expect(sheet.targets.find((t) => t.label === 'Lateral shift')!.band).toBe('within ±15.0 mm');
    expect(buildSheet(doc, null, 'cannot', 'mm').targets.map((t) => t.status)).toEqual(['not checked', 'not checked']);
  });
});
