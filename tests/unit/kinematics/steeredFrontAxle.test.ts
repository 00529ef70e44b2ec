/**
 * The steered front axle: its schema rules (sweep.steer's pitman swing, the kingpin hinge, pitmanArm), its
 * layout module and starter, its sweeps, and its bad input (a pitman arm missing a part, a swing past the
 * linkage's reach). The angles themselves are checked against independent solves in
 * tests/reference/steeredFrontAxle.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import { layoutModules } from '../../../shared/kinematics/layouts';
import { steeredAxlePlanBuild } from '../../../shared/kinematics/layouts/steered-front-axle/plan';
import { linkageModelBuild } from '../../../shared/kinematics/model';
import { steeringOf } from '../../../shared/kinematics/steer/sweep';
import { checkSketch, type Sketch, type SketchInput } from '../../../shared/schema/sketch';
import { hasSolidAxle, suspensions } from '../../../shared/suspensions';
import { nonFinite } from './helpers';

const starter = (): Sketch => starters['steered-front-axle']!.build();
const withSteer = (doc: SketchInput, steer: unknown): SketchInput =>
  ({ ...doc, sweep: { ...doc.sweep, steer } }) as SketchInput;
const problemsOf = (doc: unknown) => {
  const res = checkSketch(doc);
  return res.ok ? [] : res.problems;
};
const memberIndex = (doc: SketchInput, id: string) => doc.members.findIndex((m) => m.id === id);

describe('the steered front axle in the sketch file', () => {
  it('takes sweep.steer.pitman (degrees each way) and refuses a rack, naming the field', () => {
    expect(checkSketch(withSteer(starter(), { pitman: 30, step: 5 })).ok).toBe(true);
    expect(problemsOf(withSteer(starter(), { rack: 40, step: 5 }))).toEqual([
      'sweep.steer.rack: the steered-front-axle layout turns a pitman arm, not a rack: give sweep.steer.pitman (degrees each way) instead',
    ]);
  });

  it.each([
    [{ step: 5 }, 'sweep.steer.pitman: required, the pitman arm swing in degrees each way'],
    [{ pitman: 0, step: 5 }, 'sweep.steer.pitman: must be greater than 0'],
    [{ pitman: 120, step: 5 }, 'sweep.steer.pitman: must be at most 90'],
    [{ pitman: 'far', step: 5 }, 'sweep.steer.pitman: expected a number'],
    [{ pitman: 20, step: 25 }, 'sweep.steer.step: must be at most the pitman swing (20°)'],
    [{ pitman: 20, rack: 40, step: 5 }, 'sweep.steer.pitman: give rack (mm) or pitman (degrees), not both'],
  ])('refuses %j naming the field', (steer, message) => {
    expect(problemsOf(withSteer(starter(), steer))).toContain(message);
  });

  it('refuses a pitman swing on a layout steered by a rack, naming the field', () => {
    const wishbone = starters['double-wishbone']!.build();
    expect(problemsOf(withSteer(wishbone, { pitman: 30, step: 5 }))).toEqual([
      'sweep.steer.pitman: the double-wishbone layout has no pitman arm: give sweep.steer.rack (mm each way) instead',
    ]);
    // A version-1 file's rack block is as valid as before.
    expect(checkSketch(withSteer(wishbone, { rack: 60, step: 5 })).ok).toBe(true);
  });

  it("counts the pitman swing's rows toward the row limit", () => {
    const problems = problemsOf(withSteer(starter(), { pitman: 90, step: 0.05 }));
    expect(problems.some((p) => /^sweep: at most 2000 rows a sweep/.test(p))).toBe(true);
  });

  it("holds a knuckle's hinge to the axle and an arm's hinge to the frame", () => {
    const doc = starter();
    const i = memberIndex(doc, 'KPl');
    const onFrame = {
      ...doc,
      points: doc.points.map((p) => (p.id === 'KP.ll' ? { ...p, body: 'frame' as const } : p)),
    };
    expect(problemsOf(onFrame)).toContain(
      `members[${i}].a: a knuckle's hinge (kingpin) axis point must be on the axle ('KP.ll' is on 'frame')`,
    );
    const trailing = starters['trailing-arm']!.build();
    const h = trailing.members.findIndex((m) => m.kind === 'hinge');
    const hinge = trailing.members[h] as { a: string };
    const onAxle = {
      ...trailing,
      points: trailing.points.map((p) => (p.id === hinge.a ? { ...p, body: 'axle' as const } : p)),
    };
    expect(problemsOf(onAxle)).toContain(
      `members[${h}].a: a hinge axis point must be on the frame ('${hinge.a}' is on 'axle')`,
    );
  });

  it("refuses a pitman arm field that is not a point id, and keeps one that is missing for the sweep's word", () => {
    expect(problemsOf({ ...starter(), pitmanArm: { pivot: 42, axis: 'SB.a', ball: 'PM.b' } })).toEqual([
      'pitmanArm.pivot: expected a string',
    ]);
    expect(checkSketch({ ...starter(), pitmanArm: { axis: 'SB.a', ball: 'PM.b' } }).ok).toBe(true);
  });
});

describe('the steered front axle layout module and starter', () => {
  const doc = starter();
  const model = linkageModelBuild(doc);

  it('is registered with its starter, its reader and a client descriptor seen from the front', () => {
    const module = layoutModules['steered-front-axle'];
    expect(module.starter).toBe(starters['steered-front-axle']);
    expect(module.reader.plan(model)).not.toBeNull();
    expect(suspensions['steered-front-axle'].crossView).toBe('front');
    expect(suspensions['steered-front-axle'].label).toBe('Steered front axle (three-link, track bar)');
    // Always a front axle: the board offers no front / rear choice for it.
    expect(hasSolidAxle('steered-front-axle')).toBe(false);
    expect(hasSolidAxle('three-link-lateral-rod')).toBe(true);
  });

  it('is a front axle with a pitman arm, swept 35° each way by 2.5°', () => {
    expect(doc.vehicle.axle).toBe('front');
    expect(doc.pitmanArm).toEqual({ pivot: 'SB.p', axis: 'SB.a', ball: 'PM.b' });
    expect(doc.sweep.steer).toEqual({ pitman: 35, step: 2.5 });
  });

  it('finds both knuckles on their kingpins, the tie rod between them and the drag link from the pitman ball', () => {
    const plan = steeredAxlePlanBuild(model)!;
    expect(plan.left.kingpin.map((p) => p.id)).toEqual(['KP.ll', 'KP.ul']);
    expect(plan.right.kingpin.map((p) => p.id)).toEqual(['KP.lr', 'KP.ur']);
    expect(plan.tieRod!.member).toBe('TR');
    expect(plan.dragLink).toMatchObject({ member: 'DL', side: 'left' });
    expect(plan.dragLink!.a.id).toBe('PM.b');
    const steering = steeringOf(model);
    expect(typeof steering).not.toBe('string');
    if (typeof steering !== 'string') expect(steering.input.kind).toBe('pitman');
  });

  it('draws the drag link and the track bar parallel in front view and of similar length, as a good build has them', () => {
    const at = (id: string) => doc.points.find((p) => p.id === id)!;
    const front = (a: string, b: string) => Math.atan2(at(b).z - at(a).z, at(b).y - at(a).y);
    const length = (a: string, b: string) => Math.hypot(at(a).x - at(b).x, at(a).y - at(b).y, at(a).z - at(b).z);
    // Both run from the right frame rail to the left: 0.1° is the rounding of the points to 0.1 mm over ~1 m.
    expect(Math.abs(front('PM.b', 'SA.l') - front('TB.f', 'TB.a')) / (Math.PI / 180)).toBeLessThan(0.1);
    expect(length('PM.b', 'SA.l') / length('TB.f', 'TB.a')).toBeGreaterThan(1);
    expect(length('PM.b', 'SA.l') / length('TB.f', 'TB.a')).toBeLessThan(1.1);
  });

  it('keeps every parameter inside its range to a valid sketch that sweeps', () => {
    for (const p of starters['steered-front-axle']!.params) {
      for (const v of [p.min, p.max]) {
        const built = starters['steered-front-axle']!.build({ [p.key]: v });
        expect(checkSketch(built).ok, `${p.key} = ${v}`).toBe(true);
      }
    }
  });
});

describe('the sweeps of the steered front axle starter', () => {
  const result = runSweep(starter());

  it('reports bump steer, lateral shift, caster change and anti-dive on every heave row, every number finite', () => {
    expect(nonFinite(result)).toEqual([]);
    expect(result.ride.wheelSteer).toEqual({ left: 0, right: 0 });
    for (const row of result.heave) {
      expect(row.wheelSteer, `${row.travel}`).toBeDefined();
      expect(row.lateralShift, `${row.travel}`).not.toBeNull();
      expect(row.casterChange, `${row.travel}`).not.toBeNull();
      expect(row.antiDive, `${row.travel}`).not.toBeNull();
      expect(row.antiSquat).toBeNull();
    }
    // Three links and a track bar locate the axle exactly; the kingpins and rods the knuckles: nothing binds.
    expect(Math.max(...result.heave.map((r) => r.bind))).toBeLessThan(1e-6);
    expect(result.ride.antiDive!).toBeGreaterThan(20);
    expect(result.ride.antiDive!).toBeLessThan(80);
  });

  it('reports each wheel’s steer in the roll sweep, zero at roll 0', () => {
    expect(result.roll.find((r) => r.roll === 0)!.wheelSteer).toEqual({ left: 0, right: 0 });
    expect(result.roll.every((r) => r.wheelSteer !== undefined)).toBe(true);
  });

  it('turns the pitman arm from −35° to +35° by 2.5°, the rows carrying `pitman` and no `rack`', () => {
    const steer = result.steer!;
    expect(steer.problem).toBeNull();
    expect(steer.input).toBe('pitman');
    expect(steer.rows.map((r) => r.pitman)).toEqual(Array.from({ length: 29 }, (_, i) => -35 + 2.5 * i));
    expect(steer.rows.every((r) => !('rack' in r))).toBe(true);
    expect(steer.rackDirection).toBeNull();
    expect(steer.pitmanArm).toMatchObject({ min: -35, max: 35, length: 180 });
    expect(steer.events.map((e) => e.kind)).toEqual(['steer-lock', 'steer-lock']);
    expect(steer.events[0].message).toMatch(
      /^Steering lock at \+35\.0° of pitman arm \(the end of sweep\.steer\.pitman\)/,
    );
  });

  it('maps bump steer at pitman positions out to lock, the straight-ahead curve the heave rows’ bump steer', () => {
    const map = result.steer!.bumpSteer!;
    expect(map.curves.map((c) => c.pitman)).toEqual([-35, -17.5, 0, 17.5, 35]);
    expect(map.worstAt!.pitman).toBeDefined();
    const centre = map.curves.find((c) => c.pitman === 0)!;
    for (const p of centre.points) {
      const row = result.heave.find((r) => r.travel === p.travel)!;
      // The map's toe change is positive toe-in: the left wheel's is minus its steer, the right wheel's its steer.
      expect(p.left).toBeCloseTo(-row.wheelSteer!.left, 6);
      expect(p.right).toBeCloseTo(row.wheelSteer!.right, 6);
    }
  });
});

describe('the steered front axle on bad input', () => {
  const plain = runSweep(starter());

  const expectNoSteerButSweeps = (doc: SketchInput, problem: RegExp) => {
    const result = runSweep(doc);
    expect(result.steer!.rows).toEqual([]);
    expect(result.steer!.input).toBe('pitman');
    expect(result.steer!.problem).toMatch(problem);
    expect(result.warnings).toContain(result.steer!.problem);
    expect(result.heave).toEqual(plain.heave);
    expect(result.roll).toEqual(plain.roll);
    expect(nonFinite(result)).toEqual([]);
  };

  it('a pitman arm missing its box pivot: no steer rows, the field named, heave and roll as always', () => {
    const doc = starter();
    expectNoSteerButSweeps(
      { ...doc, pitmanArm: { axis: 'SB.a', ball: 'PM.b' } },
      /^pitmanArm\.pivot: the pitman arm has no box pivot .* the heave and roll sweeps are not affected\.$/,
    );
  });

  it.each([
    ['no pitmanArm at all', (d: Sketch) => ({ ...d, pitmanArm: undefined }), /^pitmanArm: /],
    [
      'a pivot that is no point',
      (d: Sketch) => ({ ...d, pitmanArm: { ...d.pitmanArm, pivot: 'XX' } }),
      /^pitmanArm\.pivot: no point 'XX'/,
    ],
    [
      'a pivot on the axle',
      (d: Sketch) => ({ ...d, pitmanArm: { ...d.pitmanArm, pivot: 'KP.ll' } }),
      /^pitmanArm\.pivot: 'KP\.ll' must be on the frame/,
    ],
    [
      'an axis point at the pivot',
      (d: Sketch) => ({ ...d, pitmanArm: { ...d.pitmanArm, axis: 'SB.p' } }),
      /^pitmanArm\.axis: 'SB\.p' is at the box pivot/,
    ],
    [
      'a ball on the box axis',
      (d: Sketch) => ({ ...d, pitmanArm: { ...d.pitmanArm, ball: 'SB.a' } }),
      /^pitmanArm\.ball: no drag link/,
    ],
    [
      'no drag link',
      (d: Sketch) => ({ ...d, members: d.members.filter((m) => m.id !== 'DL') }),
      /^pitmanArm\.ball: no drag link \(a tie-rod member\) runs from 'PM\.b'/,
    ],
    [
      'no tie rod',
      (d: Sketch) => ({ ...d, members: d.members.filter((m) => m.id !== 'TR') }),
      /^members: no tie rod \(a tie-rod member\) joins the two knuckles/,
    ],
  ])('%s: no steer rows, the field named, no NaN', (_, edit, problem) => {
    const doc = edit(starter()) as SketchInput;
    const result = runSweep(doc);
    expect(result.steer!.rows).toEqual([]);
    expect(result.steer!.problem).toMatch(problem);
    expect(result.heave.length).toBe(plain.heave.length);
    expect(result.roll.length).toBe(plain.roll.length);
    expect(nonFinite(result)).toEqual([]);
  });

  it('a ball on the box axis itself: the arm has no length, pitmanArm.ball named', () => {
    const doc = starter();
    const ball = doc.points.find((p) => p.id === 'PM.b')!;
    const pivot = doc.points.find((p) => p.id === 'SB.p')!;
    const onAxis = {
      ...doc,
      points: doc.points.map((p) => (p === ball ? { ...ball, z: pivot.z, x: pivot.x - 100 } : p)),
    };
    const result = runSweep(onAxis);
    expect(result.steer!.problem).toMatch(/^pitmanArm\.ball: 'PM\.b' lies on the box's output axis/);
    expect(nonFinite(result)).toEqual([]);
  });

  it('a swing past the linkage’s reach: stops where a rod and arm come into line, names sweep.steer.pitman', () => {
    const result = runSweep(withSteer(starter(), { pitman: 90, step: 5 }));
    const steer = result.steer!;
    const [up, down] = steer.events;
    // +90°: the arm swings to level and the wheels follow; −90°: the right tie rod comes into line with its arm first.
    expect(up.kind).toBe('steer-lock');
    expect(down).toMatchObject({ kind: 'steer-toggle', side: 'right', part: 'tie-rod' });
    expect(down.at).toBeLessThan(-35);
    expect(down.at).toBeGreaterThan(-90);
    expect(down.message).toMatch(
      /^sweep\.steer\.pitman: -90\.0° is past the steering linkage's reach: the right tie rod/,
    );
    expect(steer.pitmanArm!.min).toBe(Math.ceil(down.at / 5) * 5);
    expect(result.heave).toEqual(plain.heave);
    expect(nonFinite(result)).toEqual([]);
  });
});
