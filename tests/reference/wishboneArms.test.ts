/**
 * Wishbones as arm bodies (each on a hinge about its two frame pivots, holding the knuckle at its ball joint):
 * - a coil-over on the lower arm of equal, parallel, level wishbones (a parallelogram: the knuckle moves without
 *   turning, so the wheel rises as the ball joint does): motion ratio d/L at ride by the lever rule, and at every
 *   row the closed form of the spring's length over the arm's angle (plain geometry);
 * - a shock whose line enters the upper arm's triangle in droop: the travel where it starts, from the arm's angle
 *   by hand; the crossing test on hand-built segments and triangles;
 * - the starter and the same starter with its wishbones written as two links each warn alike (their curves are
 *   checked against a knuckle solved in the test in wishboneKnuckle.test.ts);
 * - the schema refuses an arm without its hinge or ball joint, and a member from an arm to the other side.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../shared/kinematics';
import { segmentCrossesTriangle } from '../../shared/kinematics/armClash';
import { vec } from '../../shared/kinematics/vec';
import { checkSketch, type SketchInput } from '../../shared/schema/sketch';
import { wishboneArmsAsLinks } from './wishboneTwoLink';

/** Front-view arm length (mm): inner axis at y = 400, ball joints at y = 720, both arms level at ride. */
const L = 320;
/** mm, the coil-over's lower eye from the lower arm's inner axis. */
const D = 200;
const LOWER_Z = 200;
const UPPER_Z = 500;
/** mm: round-off of the solve (its step tolerance is 1e-6 mm). */
const TOL = 1e-6;

/** A parallelogram double wishbone with arm bodies on both sides; `shockTop` the z of the extra shock's frame eye. */
function armRig(shockTop?: number): SketchInput {
  const points: SketchInput['points'] = [];
  const members: SketchInput['members'] = [];
  for (const [s, sign, side] of [
    ['l', 1, 'left'],
    ['r', -1, 'right'],
  ] as const) {
    const knuckle = `knuckle-${side}` as const;
    const at = (id: string, body: SketchInput['points'][number]['body'], x: number, y: number, z: number) =>
      points.push({ id: `${id}.${s}`, body, x, y: sign * y, z });
    at('WC', knuckle, 0, 800, 350);
    at('LWf', 'frame', 180, 400, LOWER_Z);
    at('LWr', 'frame', -180, 400, LOWER_Z);
    at('LA', `lower-arm-${side}`, 0, 400 + L, LOWER_Z);
    at('LBJ', knuckle, 0, 400 + L, LOWER_Z);
    at('UWf', 'frame', 130, 400, UPPER_Z);
    at('UWr', 'frame', -130, 400, UPPER_Z);
    at('UA', `upper-arm-${side}`, 0, 400 + L, UPPER_Z);
    at('UBJ', knuckle, 0, 400 + L, UPPER_Z);
    at('TRi', 'frame', -150, 400, 350);
    at('TRo', knuckle, -150, 400 + L, 350);
    // The coil-over: straight up from the lower arm, D from its axis, to the frame above the upper arm's reach.
    at('COt', 'frame', 250, 400 + D, 800);
    at('COb', `lower-arm-${side}`, 250, 400 + D, LOWER_Z);
    members.push(
      { id: `LW${s}`, kind: 'hinge', body: `lower-arm-${side}`, a: `LWf.${s}`, b: `LWr.${s}` },
      { id: `LBJ${s}`, kind: 'ball-joint', a: `LA.${s}`, b: `LBJ.${s}` },
      { id: `UW${s}`, kind: 'hinge', body: `upper-arm-${side}`, a: `UWf.${s}`, b: `UWr.${s}` },
      { id: `UBJ${s}`, kind: 'ball-joint', a: `UA.${s}`, b: `UBJ.${s}` },
      { id: `TR${s}`, kind: 'tie-rod', a: `TRi.${s}`, b: `TRo.${s}` },
      { id: `SP${s}`, kind: 'spring', a: `COt.${s}`, b: `COb.${s}`, rate: 100 },
    );
    if (shockTop !== undefined) {
      // A shock at y = 600 from the frame below the upper arm down to the lower arm.
      at('SHt', 'frame', 0, 600, shockTop);
      at('SHb', `lower-arm-${side}`, 0, 600, LOWER_Z);
      members.push({ id: `SH${s}`, kind: 'shock', a: `SHt.${s}`, b: `SHb.${s}` });
    }
  }
  return {
    format: 'arcwright.sketch',
    version: 1,
    name: 'Arm-body parallelogram',
    layout: 'double-wishbone',
    vehicle: { wheelbase: 3000, cgHeight: 700, track: 1600, tireRadius: 350 },
    points,
    members,
    wheels: { left: 'WC.l', right: 'WC.r' },
    sweep: { droop: -100, bump: 100, step: 5, roll: 3, rollStep: 1 },
  };
}

describe('coil-over on the lower arm: motion ratio (lever rule)', () => {
  const r = runSweep(armRig());

  it('is d/L at ride, and the wheel rate is k·(d/L)²', () => {
    // Lever rule: on a rigid lever, a point at d from the pivot moves d/L as far as one at L (statics of the lever;
    // the motion-ratio form as in Milliken & Milliken, Race Car Vehicle Dynamics, ch. 16 — from memory, unverified).
    expect(Math.abs(r.ride.members.SPl.motionRatio! - D / L)).toBeLessThan(TOL);
    expect(r.ride.members.SPl.wheelRate!).toBeCloseTo(100 * (D / L) ** 2, 6);
  });

  it("matches the spring's length over the arm's angle at every row (plain geometry)", () => {
    // Parallelogram: travel t = L·sinθ; the eye at (400 + D·cosθ, LOWER_Z + D·sinθ), the top fixed at (400 + D, 800).
    for (const h of r.heave) {
      const th = Math.asin(h.travel / L);
      const dy = 400 + D * Math.cos(th) - (400 + D),
        dz = LOWER_Z + D * Math.sin(th) - 800;
      const len = Math.hypot(dy, dz);
      const dLen = (dy * -D * Math.sin(th) + dz * D * Math.cos(th)) / len;
      expect(Math.abs(h.members.SPl.length - len)).toBeLessThan(TOL);
      expect(Math.abs(h.members.SPl.motionRatio! - Math.abs(dLen / (L * Math.cos(th))))).toBeLessThan(TOL);
      expect(Math.abs(h.camberChange!)).toBeLessThan(1e-6);
    }
    expect(r.limits.events).toEqual([]);
  });
});

describe('a shock through a wishbone arm (arm-clash)', () => {
  it('crosses hand-built triangles where it should (plain geometry)', () => {
    const a = vec(0, 0, 0),
      b = vec(100, 0, 0),
      c = vec(0, 100, 0);
    expect(segmentCrossesTriangle(vec(20, 20, -5), vec(20, 20, 5), a, b, c)).toBe(true);
    // Beside the hypotenuse, short of the plane, and lying in it.
    expect(segmentCrossesTriangle(vec(60, 60, -5), vec(60, 60, 5), a, b, c)).toBe(false);
    expect(segmentCrossesTriangle(vec(20, 20, 1), vec(20, 20, 5), a, b, c)).toBe(false);
    expect(segmentCrossesTriangle(vec(-10, 20, 0), vec(50, 20, 0), a, b, c)).toBe(false);
    // Slanting through.
    expect(segmentCrossesTriangle(vec(-50, 10, -10), vec(90, 30, 10), a, b, c)).toBe(true);
  });

  it('starts in droop where the upper arm comes down to the shock’s top eye (arm angle by hand)', () => {
    // Top eye 20 mm under the upper arm at 200 mm from its axis: the arm reaches it at tanθ = −20/200, where the
    // wheel is at t = L·sinθ (parallelogram), −31.8 mm. Rows every 5 mm: the first row beyond is −35.
    const r = runSweep(armRig(UPPER_Z - 20));
    const t = L * Math.sin(Math.atan(-20 / 200));
    const clashes = r.limits.events.filter((e) => e.kind === 'arm-clash' && e.member === 'SHl' && e.sweep === 'heave');
    expect(clashes).toHaveLength(1);
    expect(clashes[0].body).toBe('upper-arm-left');
    // In roll the left wheel drops 800·tan(3°) = 42 mm at −3°: past the same point, so the roll sweep has it too.
    expect(r.limits.events.some((e) => e.kind === 'arm-clash' && e.member === 'SHl' && e.sweep === 'roll')).toBe(true);
    expect(clashes[0].at).toBeLessThanOrEqual(t);
    expect(clashes[0].at).toBeGreaterThan(t - 5);
    expect(clashes[0].at).toBe(-35);
  });

  it('is not raised for a shock beside the arm', () => {
    const doc = armRig(UPPER_Z - 20);
    doc.points = doc.points.map((p) => (p.id.startsWith('SH') ? { ...p, x: 200 } : p));
    expect(runSweep(doc).limits.events.filter((e) => e.kind === 'arm-clash')).toEqual([]);
  });
});

describe('the starter sweeps alike with arm bodies and with two-link wishbones', () => {
  const doc = starters['double-wishbone']!.build();
  const arms = runSweep(doc);
  const links = runSweep(wishboneArmsAsLinks(doc));

  it('warns alike (the curves of both are checked against a knuckle solved in the test: wishboneKnuckle.test.ts)', () => {
    expect(links.heave.map((h) => h.travel)).toEqual(arms.heave.map((h) => h.travel));
    expect(links.warnings).toEqual(arms.warnings);
  });

  it('puts the coil-over on the lower arm at 62 % of its length: MR 0.5–0.7 (common practice, no published source)', () => {
    expect(doc.points.find((p) => p.id === 'CO.b.l')!.body).toBe('lower-arm-left');
    expect(arms.ride.members.SPl.motionRatio!).toBeGreaterThan(0.5);
    expect(arms.ride.members.SPl.motionRatio!).toBeLessThan(0.7);
    expect(arms.limits.events).toEqual([]);
  });
});

describe('the schema refuses a half-built arm', () => {
  const doc = () => structuredClone(starters['double-wishbone']!.build()) as SketchInput;
  const problems = (d: SketchInput) => {
    const res = checkSketch(d);
    return res.ok ? [] : res.problems;
  };

  it('an arm body without its hinge', () => {
    const d = doc();
    d.members = d.members.filter((m) => m.id !== 'LWl');
    const i = d.points.findIndex((p) => p.body === 'lower-arm-left');
    expect(problems(d)).toContain(
      `points[${i}].body: 'lower-arm-left' has no hinge: a wishbone arm turns about two frame pivots`,
    );
  });

  it('an arm body without its ball joint', () => {
    const d = doc();
    d.members = d.members.filter((m) => m.id !== 'UBJr');
    const i = d.points.findIndex((p) => p.body === 'upper-arm-right');
    expect(problems(d)).toContain(
      `points[${i}].body: 'upper-arm-right' has no ball joint: a wishbone arm holds the knuckle at one point`,
    );
  });

  it('a member from an arm to a body of the other side', () => {
    const d = doc();
    const i = d.members.findIndex((m) => m.id === 'SPl');
    d.members[i] = { ...d.members[i], a: 'TR.o.r' };
    expect(problems(d)).toContain(
      `members[${i}].b: joins 'knuckle-right' to 'lower-arm-left': a member on a wishbone arm must stay on its side`,
    );
  });

  it('a ball joint whose first point is not on an arm', () => {
    const d = doc();
    const i = d.members.findIndex((m) => m.id === 'LBJl');
    d.members[i] = { ...d.members[i], a: 'WC.l', b: 'LW.bj.l' };
    expect(
      problems(d).some((p) => p.startsWith(`members[${i}].a: a ball joint's first point must be on a wishbone arm`)),
    ).toBe(true);
  });
});
