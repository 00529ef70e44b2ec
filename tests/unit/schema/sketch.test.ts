/* eslint-disable @typescript-eslint/no-explicit-any -- these tests poke at untyped JSON documents on purpose */
import { describe, expect, it } from 'vitest';
import { checkSketch, parseSketch, MAX_POINTS, type SketchInput } from '../../../shared/schema/sketch';
import { SketchValidationError, isSketchValidationError } from '../../../shared/schema/errors';
import { exampleSketch } from '../kinematics/helpers';

function problemsOf(doc: unknown): string[] {
  const r = checkSketch(doc);
  if (r.ok) throw new Error('expected the document to be refused');
  return r.problems;
}

function edit(f: (d: any) => void): SketchInput {
  const d = exampleSketch();
  f(d);
  return d;
}

describe('sketch schema', () => {
  it('accepts the example file and fills the sweep defaults', () => {
    const s = parseSketch(exampleSketch());
    expect(s.points).toHaveLength(24);
    expect(s.sweep).toMatchObject({
      droop: -130,
      bump: 110,
      step: 5,
      roll: 7,
      rollStep: 1,
      bindThreshold: 1.5,
      jointAngleLimit: 3,
    });
  });

  it('fills the whole sweep block when it is missing', () => {
    const s = parseSketch(edit((d) => delete d.sweep));
    expect(s.sweep).toEqual({
      droop: -150,
      bump: 150,
      step: 5,
      roll: 8,
      rollStep: 1,
      bindThreshold: 1.5,
      jointAngleLimit: 3,
    });
  });

  it('keeps fields it does not know (a richer document survives a round trip)', () => {
    const s = parseSketch(
      edit((d) => {
        d.notes = 'keep me';
        d.points[0].label = 'hub';
      }),
    );
    expect((s as Record<string, unknown>).notes).toBe('keep me');
    expect((s.points[0] as Record<string, unknown>).label).toBe('hub');
  });

  it('checks the board fields, targets and tracing, and keeps what it does not know in them', () => {
    const photo = {
      upload: 'a1',
      url: '/api/uploads/a1',
      width: 1600,
      height: 900,
      centre: { h: 0, v: 400 },
      mmPerPx: 2.5,
      opacity: 0.5,
      locked: false,
    };
    const s = parseSketch(
      edit((d) => {
        d.targets = { antiSquat: { min: 60, max: 90 }, camberGain: { max: 1 } };
        d.tracing = { side: { ...photo, caption: 'shop photo' } };
      }),
    );
    expect((s.targets as Record<string, unknown>).camberGain).toEqual({ max: 1 });
    expect((s.tracing!.side as Record<string, unknown>).caption).toBe('shop photo');

    expect(problemsOf(edit((d) => (d.targets = { antiSquat: { min: 90, max: 60 } })))).toContain(
      'targets.antiSquat: min must not be above max',
    );
    expect(problemsOf(edit((d) => (d.targets = { lateralShift: { max: 'wide' } })))).toContain(
      'targets.lateralShift.max: expected a number',
    );
    expect(
      problemsOf(edit((d) => (d.tracing = { side: { ...photo, opacity: 2 } }))).some((p) =>
        p.startsWith('tracing.side.opacity'),
      ),
    ).toBe(true);
    expect(
      problemsOf(edit((d) => (d.tracing = { rear: { ...photo, mmPerPx: 0 } }))).some((p) =>
        p.startsWith('tracing.rear.mmPerPx'),
      ),
    ).toBe(true);
  });

  it('names the path of a non-number', () => {
    expect(problemsOf(edit((d) => (d.points[3].x = 'a')))).toContain('points[3].x: expected a number');
  });

  it('names a missing field', () => {
    expect(problemsOf(edit((d) => delete d.vehicle.track))).toContain('vehicle.track: required, expected a number');
  });

  it('names an unknown point reference', () => {
    expect(problemsOf(edit((d) => (d.members[2].a = 'UL.x')))).toContain("members[2].a: no point 'UL.x'");
  });

  it('refuses duplicate ids', () => {
    expect(problemsOf(edit((d) => (d.points[4].id = 'LL.fl')))).toContain("points[4].id: duplicate id 'LL.fl'");
    expect(problemsOf(edit((d) => (d.members[1].id = 'LLl')))).toContain("members[1].id: duplicate id 'LLl'");
  });

  it('refuses a member joining two points of one body', () => {
    const p = problemsOf(edit((d) => (d.members[0].b = 'UL.fl')));
    expect(p.some((l) => l.startsWith('members[0].b: joins two points of one body'))).toBe(true);
  });

  it('refuses a zero-length link', () => {
    const p = problemsOf(
      edit((d) => {
        d.points[2].x = 980;
        d.points[2].y = 470;
        d.points[2].z = 330;
        d.points[2].body = 'axle';
      }),
    );
    expect(p.some((l) => l.startsWith('members[0]: zero length'))).toBe(true);
  });

  it('refuses missing wheels, unknown wheels and wheels on the frame', () => {
    expect(problemsOf(edit((d) => delete d.wheels))).toContain('wheels: required, expected an object');
    expect(problemsOf(edit((d) => (d.wheels.left = 'nope')))).toContain("wheels.left: no point 'nope'");
    expect(problemsOf(edit((d) => (d.wheels.right = 'LL.fr')))[0]).toMatch(/^wheels\.right: 'LL\.fr' is on the frame/);
  });

  it('refuses a bad sweep range', () => {
    expect(problemsOf(edit((d) => (d.sweep.step = 0)))).toContain('sweep.step: must be greater than 0');
    expect(problemsOf(edit((d) => (d.sweep.droop = 10)))).toContain('sweep.droop: must be less than 0');
    expect(problemsOf(edit((d) => (d.sweep.bump = 0)))).toContain('sweep.bump: must be greater than 0');
  });

  it('bounds sizes: points, members and rows a sweep', () => {
    const many = edit((d) => {
      d.points = Array.from({ length: MAX_POINTS + 1 }, (_, i) => ({ id: `P${i}`, body: 'frame', x: i, y: 0, z: 0 }));
    });
    expect(problemsOf(many)).toContain('points: at most 200 items');
    const rows = problemsOf(
      edit((d) => {
        d.sweep.step = 0.1;
      }),
    );
    expect(rows.some((l) => l.startsWith('sweep: at most 2000 rows a sweep'))).toBe(true);
  });

  it('checks shocks, hinges and the driveline', () => {
    expect(problemsOf(edit((d) => (d.members[2].minLength = 600)))).toContain(
      'members[2].maxLength: must be greater than minLength (600)',
    );
    const hinge = problemsOf(
      edit((d) => d.members.push({ id: 'H', kind: 'hinge', body: 'arm-left', a: 'LL.fl', b: 'LL.al' })),
    );
    expect(hinge).toContain("members[9].b: a hinge axis point must be on the frame ('LL.al' is on 'axle')");
    expect(hinge).toContain("members[9].body: no point is on 'arm-left'");
    expect(problemsOf(edit((d) => (d.driveline.pinion = 'DS.o')))[0]).toMatch(
      /^driveline\.pinion: 'DS\.o' must be on a moving body/,
    );
  });

  it('names a wrong kind, format and version', () => {
    expect(problemsOf(edit((d) => (d.members[0].kind = 'rod')))[0]).toMatch(
      /^members\[0\]\.kind: expected one of 'link', 'lateral-rod'/,
    );
    expect(problemsOf(edit((d) => (d.format = 'other')))).toContain("format: expected 'arcwright.sketch'");
    expect(problemsOf(edit((d) => (d.version = 2)))).toContain('version: expected 1');
  });

  it('refuses documents that are not objects', () => {
    for (const doc of [null, 3, 'text', [], undefined])
      expect(problemsOf(doc)).toEqual(['(document): expected an object']);
  });

  it('parseSketch throws SketchValidationError carrying the problems', () => {
    let caught: unknown;
    try {
      parseSketch(edit((d) => (d.points[3].x = 'a')));
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(SketchValidationError);
    expect(isSketchValidationError(caught)).toBe(true);
    expect((caught as SketchValidationError).problems).toContain('points[3].x: expected a number');
  });
});
