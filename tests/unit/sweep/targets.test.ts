import { describe, expect, it } from 'vitest';
import type { HeaveRow, RollRow, SweepResult } from '../../../shared/kinematics';
import { checkTarget, checkTargets, readTargets } from '../../../shared/display/targets';
import { editTarget, fieldText } from '../../../src/sweep/targetsEditor';
import { buildFlags } from '../../../shared/display/flags';

const pose = { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 };

/** A heave row with only the numbers a test sets (the rest are neutral). */
function heave(travel: number, over: Partial<HeaveRow> = {}): HeaveRow {
  return {
    travel,
    pose: { ...pose, z: travel },
    bodies: {},
    pinionAngleChange: 0,
    lateralShift: 0,
    foreAftShift: 0,
    instantCenter: null,
    antiSquat: null,
    rollCenterHeight: null,
    bind: 0,
    members: {},
    ...over,
  };
}

function roll(deg: number, over: Partial<RollRow> = {}): RollRow {
  return {
    roll: deg,
    pose: { ...pose, roll: deg },
    bodies: {},
    leftTravel: 0,
    rightTravel: 0,
    rollSteer: deg === 0 ? null : 0,
    bind: 0,
    members: {},
    ...over,
  };
}

function result(heaveRows: HeaveRow[], rollRows: RollRow[] = [], articulation = 8): SweepResult {
  return {
    heave: heaveRows,
    roll: rollRows,
    limits: {
      droop: heaveRows[0]?.travel ?? 0,
      bump: heaveRows.at(-1)?.travel ?? 0,
      articulation,
      rollMin: -articulation,
      rollMax: articulation,
      events: [],
    },
    warnings: [],
    ride: heaveRows.find((r) => r.travel === 0) ?? heave(0),
  };
}

// Pinion angle change rising 1° per 20 mm of bump, falling the same in droop: −5° … +5° over −100 … +100 mm.
const linearPinion = result(
  [-100, -80, -60, -40, -20, 0, 20, 40, 60, 80, 100].map((t) => heave(t, { pinionAngleChange: t / 20 })),
);

describe('checking target bands against a sweep', () => {
  it('finds where a band is first left, counting outwards from ride', () => {
    const c = checkTarget(linearPinion, 'pinionAngleChange', { min: -3, max: 3 });
    expect(c.status).toBe('missed');
    // |t/20| > 3 first at |t| = 80 mm; bump and droop are equally far, the sort keeps the droop row (listed first).
    expect(Math.abs(c.at!)).toBe(80);
    expect(Math.abs(c.value!)).toBe(4);
    expect(Math.abs(c.worst!)).toBe(5);
  });

  it('counts a value on the band edge as inside', () => {
    expect(checkTarget(linearPinion, 'pinionAngleChange', { min: -5, max: 5 }).status).toBe('met');
  });

  it('checks only inside the travel window', () => {
    expect(checkTarget(linearPinion, 'pinionAngleChange', { min: -3, max: 3, from: -60, to: 60 }).status).toBe('met');
    const c = checkTarget(linearPinion, 'pinionAngleChange', { max: 3, from: 0 });
    expect(c).toMatchObject({ status: 'missed', at: 80, value: 4 });
  });

  it('says "unknown" when the quantity is never defined (no instant centre, so no anti-squat)', () => {
    expect(checkTarget(linearPinion, 'antiSquat', { min: 60, max: 90 }).status).toBe('unknown');
  });

  it('checks articulation against the articulation reached', () => {
    const r = result([heave(0)], [roll(-6), roll(0), roll(6)], 6);
    expect(checkTarget(r, 'articulation', { min: 8 })).toMatchObject({ status: 'missed', value: 6 });
    expect(checkTarget(r, 'articulation', { min: 5 }).status).toBe('met');
  });

  it('reads roll quantities from the roll sweep', () => {
    const r = result([heave(0)], [roll(-4, { bind: 3 }), roll(0), roll(4, { bind: 3 })]);
    expect(checkTarget(r, 'bind', { max: 1.5 })).toMatchObject({ status: 'missed', value: 3 });
  });

  it('checks only the bands that say something', () => {
    const checks = checkTargets(linearPinion, { pinionAngleChange: { min: -3, max: 3 }, lateralShift: { from: -50 } });
    expect(checks.map((c) => c.metric)).toEqual(['pinionAngleChange']);
  });
});

describe('the targets field of a document', () => {
  it('reads a well-formed field and ignores a malformed one', () => {
    expect(readTargets({ targets: { antiSquat: { min: 60, max: 90 } } })).toEqual({ antiSquat: { min: 60, max: 90 } });
    expect(readTargets({ targets: { antiSquat: { min: 90, max: 60 } } })).toEqual({});
    expect(readTargets({ targets: 'all good' })).toEqual({});
    expect(readTargets({})).toEqual({});
  });
});

describe('typing a band', () => {
  it('takes lengths in inches and stores mm (1 in = 25.4 mm exactly, by the 1959 definition)', () => {
    const out = editTarget({}, 'lateralShift', 'max', '0.5', 'in');
    expect(out).toEqual({ ok: true, targets: { lateralShift: { max: 12.7 } } });
    expect(fieldText(out.ok ? out.targets : {}, 'lateralShift', 'max', 'in')).toBe('0.5');
  });

  it('keeps angles and percentages as typed, whatever the length unit', () => {
    expect(editTarget({}, 'antiSquat', 'min', '60', 'in')).toEqual({ ok: true, targets: { antiSquat: { min: 60 } } });
    expect(editTarget({}, 'pinionAngleChange', 'min', '\u22123', 'mm')).toEqual({
      ok: true,
      targets: { pinionAngleChange: { min: -3 } },
    });
  });

  it('refuses text that is not a number, and a band upside down, changing nothing', () => {
    expect(editTarget({}, 'antiSquat', 'min', 'sixty', 'mm')).toEqual({ ok: false, error: '“sixty” is not a number.' });
    expect(editTarget({ antiSquat: { max: 50 } }, 'antiSquat', 'min', '60', 'mm')).toEqual({
      ok: false,
      error: 'The lower end is above the upper end.',
    });
  });

  it('opens an end when its box is emptied, and drops a band left empty', () => {
    expect(editTarget({ antiSquat: { min: 60, max: 90 } }, 'antiSquat', 'max', '', 'mm')).toEqual({
      ok: true,
      targets: { antiSquat: { min: 60 } },
    });
    expect(editTarget({ antiSquat: { min: 60 } }, 'antiSquat', 'min', ' ', 'mm')).toEqual({ ok: true, targets: {} });
  });
});

describe('flags for missed targets', () => {
  it('say what was wanted and where it is first missed, in the user’s units', () => {
    const r = result([-100, -50, 0, 50, 100].map((t) => heave(t, { lateralShift: t / 5 })));
    const checks = checkTargets(r, { lateralShift: { min: -15, max: 15 } });
    const [flag] = buildFlags(r, [], checks, 'mm');
    expect(flag.title).toBe('Target missed: Lateral shift');
    expect(flag.detail).toBe('\u221220.0 mm at \u2212100.0 mm droop; wanted within ±15.0 mm.');
  });
});

describe('the sweep’s notes', () => {
  it('are not flags: only events and missed targets are, so the readout alone shows the notes', () => {
    const r = {
      ...result([-50, 0, 50].map((t) => heave(t))),
      warnings: ['The leaf springs locate the axle sideways; no lateral rod is modelled.'],
    };
    expect(buildFlags(r, [], [], 'mm')).toEqual([]);
  });
});
