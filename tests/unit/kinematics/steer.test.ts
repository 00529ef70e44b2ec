/**
 * The steer sweep's settings, its result on the double-wishbone starter (rows, lock events, the bump-steer
 * map) and its bad input: a layout that does not steer, a rack travel past the tie rods' reach. The angles
 * themselves are checked against independent solves in tests/reference/steer.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import { checkSketch, type SketchInput } from '../../../shared/schema/sketch';
import { exampleSketch, nonFinite } from './helpers';

const starter = (): SketchInput => starters['double-wishbone']!.build();
const withSteer = (doc: SketchInput, steer: unknown): SketchInput =>
  ({ ...doc, sweep: { ...doc.sweep, steer } }) as SketchInput;
const problemsOf = (doc: unknown) => {
  const res = checkSketch(doc);
  return res.ok ? [] : res.problems;
};

describe('sweep.steer in the sketch file', () => {
  it('is optional: a version-1 file without it is valid and gets no steer sweep', () => {
    const doc = starter();
    const { steer: _, ...sweep } = doc.sweep!;
    const without = { ...doc, sweep };
    expect(checkSketch(without).ok).toBe(true);
    expect(runSweep(without).steer).toBeUndefined();
    expect(checkSketch(withSteer(doc, { rack: 60, step: 5 })).ok).toBe(true);
  });

  it.each([
    [{ rack: 60, step: 0 }, 'sweep.steer.step: must be greater than 0'],
    [{ rack: 60, step: -5 }, 'sweep.steer.step: must be greater than 0'],
    [{ rack: 0, step: 5 }, 'sweep.steer.rack: must be greater than 0'],
    [{ rack: -60, step: 5 }, 'sweep.steer.rack: must be greater than 0'],
    [{ rack: 600, step: 5 }, 'sweep.steer.rack: must be at most 500'],
    [{ rack: 20, step: 25 }, 'sweep.steer.step: must be at most the rack travel (20 mm)'],
    [{ rack: 'far', step: 5 }, 'sweep.steer.rack: expected a number'],
    [{ rack: 60 }, 'sweep.steer.step: required, expected a number'],
    [5, 'sweep.steer: expected an object'],
  ])('refuses %j naming the field', (steer, message) => {
    expect(problemsOf(withSteer(starter(), steer))).toContain(message);
  });

  it('counts the steer rows toward the row limit', () => {
    const problems = problemsOf(withSteer(starter(), { rack: 500, step: 0.25 }));
    expect(problems.some((p) => /^sweep: at most 2000 rows a sweep/.test(p))).toBe(true);
  });

  it('is in the double-wishbone starter: a light truck’s rack, 60 mm each way by 5', () => {
    expect(starter().sweep!.steer).toEqual({ rack: 60, step: 5 });
  });
});

describe('the steer sweep of the double-wishbone starter', () => {
  const result = runSweep(starter());
  const steer = result.steer!;

  it('has rows from −60 to +60 mm of rack by 5, straight ahead at centre, every number finite', () => {
    expect(steer.problem).toBeNull();
    expect(steer.rows.map((r) => r.rack)).toEqual(Array.from({ length: 25 }, (_, i) => -60 + 5 * i));
    expect(steer.rackMin).toBe(-60);
    expect(steer.rackMax).toBe(60);
    const centre = steer.rows[12];
    expect(centre.leftSteer).toBe(0);
    expect(centre.rightSteer).toBe(0);
    expect(centre.ackermann).toBeNull();
    expect(centre.turningRadius).toBeNull();
    expect(nonFinite(result)).toEqual([]);
    for (const r of steer.rows.filter((x) => x.rack !== 0)) {
      expect(r.ackermann, `rack ${r.rack}`).not.toBeNull();
      expect(r.turningRadius!, `rack ${r.rack}`).toBeGreaterThan(0);
    }
  });

  it('turns the mirror-image linkage the mirror-image way: left at −r is minus right at +r', () => {
    for (const r of steer.rows) {
      const m = steer.rows.find((x) => x.rack === -r.rack!)!;
      // Mirror symmetry about y = 0 (the starter is built mirrored); tolerance: the solver's convergence.
      expect(r.leftSteer).toBeCloseTo(-m.rightSteer, 8);
    }
  });

  it('turns the wheels right for positive rack: the tie rods run behind the axle line', () => {
    // Pushing the rack left pushes each steering arm (behind the wheel centre) left: the wheels' noses go right.
    const end = steer.rows.at(-1)!;
    expect(end.leftSteer).toBeLessThan(0);
    expect(end.rightSteer).toBeLessThan(0);
    // The inner wheel (the right one in a right turn) turns more.
    expect(Math.abs(end.rightSteer)).toBeGreaterThan(Math.abs(end.leftSteer));
  });

  it('reports the lock each way where the rack travel ends, with the wheels’ angles there', () => {
    expect(steer.events.map((e) => [e.kind, e.sweep, e.at])).toEqual([
      ['steer-lock', 'steer', 60],
      ['steer-lock', 'steer', -60],
    ]);
    const [up, down] = steer.events;
    expect(up.leftSteer).toBeCloseTo(steer.rows.at(-1)!.leftSteer, 9);
    expect(up.rightSteer).toBeCloseTo(steer.rows.at(-1)!.rightSteer, 9);
    expect(down.leftSteer).toBeCloseTo(steer.rows[0].leftSteer, 9);
    expect(up.message).toMatch(/^Steering lock at \+60 mm of rack/);
  });

  it('maps bump steer at centre, half way and at each lock; the centre curve is the heave sweep’s toe change', () => {
    const map = steer.bumpSteer!;
    expect(map.curves.map((c) => c.rack)).toEqual([-60, -30, 0, 30, 60]);
    const centre = map.curves.find((c) => c.rack === 0)!;
    for (const p of centre.points) {
      const row = result.heave.find((h) => h.travel === p.travel)!;
      expect(row, `travel ${p.travel}`).toBeDefined();
      // Two marches of one linkage to one travel (coarser steps here): equal to the solver's convergence.
      expect(p.left).toBeCloseTo(row.toeChange!, 8);
      // Straight ahead the mirror-image right wheel toes in by as much.
      expect(p.right).toBeCloseTo(p.left, 8);
    }
    const all = map.curves.flatMap((c) => c.points.flatMap((p) => [p.left, p.right]));
    expect(Math.abs(map.worst!)).toBe(Math.max(...all.map(Math.abs)));
    const at = map.worstAt!;
    const point = map.curves.find((c) => c.rack === at.rack)!.points.find((p) => p.travel === at.travel)!;
    expect(point[at.side]).toBe(map.worst);
    // Each curve runs from droop to bump (in at most 12 steps) and passes travel 0 with no toe change.
    for (const c of map.curves) {
      expect(c.points.length).toBeLessThanOrEqual(13);
      expect(c.points.find((p) => p.travel === 0)).toEqual({ travel: 0, left: 0, right: 0 });
    }
  });

  it('leaves the heave and roll sweeps as they are without it, and skips it with heaveOnly', () => {
    const doc = starter();
    const { steer: _, ...sweep } = doc.sweep!;
    const plain = runSweep({ ...doc, sweep });
    expect(result.heave).toEqual(plain.heave);
    expect(result.roll).toEqual(plain.roll);
    expect(result.limits).toEqual(plain.limits);
    expect(runSweep(doc, { heaveOnly: true }).steer).toBeUndefined();
  });
});

describe('steer sweep on bad input', () => {
  it('on a layout that does not steer: no rows, a warning naming sweep.steer, heave and roll as always', () => {
    const doc = withSteer(exampleSketch(), { rack: 60, step: 5 });
    const result = runSweep(doc);
    const plain = runSweep(exampleSketch());
    expect(result.steer!.rows).toEqual([]);
    expect(result.steer!.bumpSteer).toBeNull();
    expect(result.steer!.problem).toMatch(/^sweep\.steer: the four-link-lateral-rod layout does not steer/);
    expect(result.warnings).toContain(result.steer!.problem);
    expect(result.heave).toEqual(plain.heave);
    expect(result.roll).toEqual(plain.roll);
    expect(nonFinite(result)).toEqual([]);
  });

  it('on knuckles without tie rods: no rows, a warning naming sweep.steer, heave and roll still swept', () => {
    const doc = starter();
    const noTieRods = { ...doc, members: doc.members.filter((m) => m.kind !== 'tie-rod') };
    const result = runSweep(noTieRods);
    expect(result.steer!.rows).toEqual([]);
    expect(result.steer!.problem).toMatch(/^sweep\.steer: a steer sweep needs both knuckles .* tie rod/);
    expect(result.heave.length).toBe(49);
    expect(result.roll.length).toBeGreaterThan(0);
    expect(nonFinite(result)).toEqual([]);
  });

  it('with a rack travel past the tie rods’ reach: stops at the toggle, names sweep.steer.rack, no NaN', () => {
    const doc = withSteer(starter(), { rack: 100, step: 5 });
    const result = runSweep(doc);
    const steer = result.steer!;
    expect(steer.events.map((e) => [e.kind, e.side])).toEqual([
      ['steer-toggle', 'right'],
      ['steer-toggle', 'left'],
    ]);
    const [up, down] = steer.events;
    expect(up.at).toBeGreaterThan(60);
    expect(up.at).toBeLessThan(100);
    expect(down.at).toBeCloseTo(-up.at, 6);
    expect(up.message).toMatch(/^sweep\.steer\.rack: \+100 mm is past the tie rods' reach: the right tie rod/);
    // Rows stop at the last multiple of the step short of the toggle.
    expect(steer.rackMax).toBe(Math.floor(up.at / 5) * 5);
    expect(steer.rackMin).toBe(-steer.rackMax);
    expect(result.heave).toEqual(runSweep(starter()).heave);
    expect(nonFinite(result)).toEqual([]);
  });
});
