/**
 * The plan view's geometry (src/canvas/steerPlan.ts, planView.ts) and the turned tyre's outline
 * (src/canvas/steerWheels.ts) against hand computations.
 *
 * The plan construction: each front wheel's axle line runs through its contact patch square to its heading
 * (cos δ, sin δ); on the rear axle line x = X it reaches y = P.y + (P.x − X)·cot δ, and the outer wheel's
 * line meets it at the turning centre, (P.x − X) / |sin δ| from the patch (plane geometry; the turning
 * radius of the outer front wheel R = L / sin δo for a patch a wheelbase L ahead of the rear axle line:
 * Gillespie, "Fundamentals of Vehicle Dynamics", SAE 1992, ch. 8, from memory, unverified). With the
 * Ackermann condition cot δo − cot δi = t / L both lines end at the same point.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import { KINGPIN_Y, trapezoid, trapezoidAngle as trapezoidDeg } from '../../reference/steerTrapezoid';
import { checkSketch, type Sketch, type SketchInput } from '../../../shared/schema/sketch';
import { axleLineToRear, steerPlanGeometry } from '../../../src/canvas/steerPlan';
import { arcPoints, planScene, rearAxleX } from '../../../src/canvas/planView';
import { tyreOutline } from '../../../src/canvas/steerWheels';
import { wishboneSketch } from '../../reference/wishboneRigs';

const DEG = Math.PI / 180;

function parsed(doc: SketchInput): Sketch {
  const c = checkSketch(doc);
  if (!c.ok) throw new Error(c.problems.join('; '));
  return c.sketch;
}

describe('the plan construction on an Ackermann layout given by its angles', () => {
  const L = 2800;
  const t = 1500;
  // Patches a wheelbase ahead of the rear axle line (x = 0), t apart; a left turn, the right wheel outer.
  const outer = 20 * DEG;
  const trueInner = Math.atan(1 / (1 / Math.tan(outer) - t / L));

  it('puts the turning centre at (0, −t/2 + L·cot δo), R = L / sin δo from the outer patch', () => {
    const g = steerPlanGeometry(
      [
        { side: 'left', patch: { x: L, y: t / 2 }, steer: 25 },
        { side: 'right', patch: { x: L, y: -t / 2 }, steer: outer / DEG },
      ],
      0,
    );
    expect(g.outer).toBe('right');
    expect(g.centre!.x).toBeCloseTo(0, 9);
    expect(g.centre!.y).toBeCloseTo(-t / 2 + L / Math.tan(outer), 6);
    expect(g.radius!).toBeCloseTo(L / Math.sin(outer), 6);
    // The inner wheel's line ends at t/2 + L·cot δi: not the centre, since 25° is not the Ackermann angle.
    const inner = g.axleLines.find((l) => l.side === 'left')!;
    expect(inner.to!.y).toBeCloseTo(t / 2 + L / Math.tan(25 * DEG), 6);
    expect(Math.abs(inner.to!.y - g.centre!.y)).toBeGreaterThan(100);
  });

  it('ends both Ackermann lines at the turning centre when the inner angle meets the Ackermann condition', () => {
    const g = steerPlanGeometry(
      [
        { side: 'left', patch: { x: L, y: t / 2 }, steer: trueInner / DEG },
        { side: 'right', patch: { x: L, y: -t / 2 }, steer: outer / DEG },
      ],
      0,
    );
    const [a, b] = g.axleLines.map((l) => l.to!);
    expect(a.y).toBeCloseTo(b.y, 6);
    expect(a.y).toBeCloseTo(g.centre!.y, 6);
  });

  it('turns right as a mirror: the left wheel outer, the centre on the right', () => {
    const g = steerPlanGeometry(
      [
        { side: 'left', patch: { x: L, y: t / 2 }, steer: -outer / DEG },
        { side: 'right', patch: { x: L, y: -t / 2 }, steer: -25 },
      ],
      0,
    );
    expect(g.outer).toBe('left');
    expect(g.centre!.y).toBeCloseTo(t / 2 - L / Math.tan(outer), 6);
    expect(g.radius!).toBeCloseTo(L / Math.sin(outer), 6);
  });

  it('has no centre and no radius straight ahead, and axle lines that never reach the rear axle line', () => {
    const g = steerPlanGeometry(
      [
        { side: 'left', patch: { x: L, y: t / 2 }, steer: 0 },
        { side: 'right', patch: { x: L, y: -t / 2 }, steer: 0 },
      ],
      0,
    );
    expect(g).toMatchObject({ outer: null, centre: null, radius: null });
    expect(g.axleLines.every((l) => l.to === null)).toBe(true);
    expect(axleLineToRear({ x: L, y: 0 }, 0, 0)).toBeNull();
  });

  it('draws the arc on the turning circle through the outer patch', () => {
    const c = { x: 0, y: 5000 };
    const p = { x: 2800, y: -750 };
    const r = Math.hypot(p.x - c.x, p.y - c.y);
    const arc = arcPoints(c, p, 0.5, 10);
    expect(arc).toHaveLength(11);
    for (const q of arc) expect(Math.hypot(q.x - c.x, q.y - c.y)).toBeCloseTo(r, 6);
    // The middle sample is the patch itself.
    expect(arc[5].x).toBeCloseTo(p.x, 6);
    expect(arc[5].y).toBeCloseTo(p.y, 6);
  });
});

/** mm, the trapezoid's wheel centres outboard of its kingpins (steerTrapezoid.ts). */
const SCRUB = 100;

/** rad, the trapezoid's knuckle angle solved by hand (steerTrapezoid.ts gives degrees). */
const trapezoidAngle = (side: 1 | -1, rack: number) => (trapezoidDeg(side, rack) * Math.PI) / 180;

describe('the plan view of a swept trapezoid against its hand solution', () => {
  const doc = wishboneSketch(trapezoid, {
    droop: -40,
    bump: 40,
    step: 10,
    roll: 2,
    rollStep: 1,
    steer: { rack: 60, step: 10 },
  } as Parameters<typeof wishboneSketch>[1]);
  const sketch = parsed(doc);
  const result = runSweep(doc);
  const steer = result.steer!;
  const L = sketch.vehicle.wheelbase;

  it('puts the rear axle line a wheelbase behind the wheel centres', () => {
    expect(rearAxleX(sketch)).toBeCloseTo(-L, 9);
  });

  it('finds each turning centre and both Ackermann lines where the hand solution puts them', () => {
    let checked = 0;
    for (const row of steer.rows.filter((r) => r.rack !== 0)) {
      const g = planScene(sketch, steer, row)!.geometry;
      const ends: Record<string, { y: number }> = {};
      for (const side of [1, -1] as const) {
        const d = trapezoidAngle(side, row.rack!);
        // The wheel centre swings about the kingpin; its patch is straight below (no camber in this rig).
        const P = { x: -side * SCRUB * Math.sin(d), y: side * (KINGPIN_Y + SCRUB * Math.cos(d)) };
        ends[side > 0 ? 'left' : 'right'] = { y: P.y + (P.x + L) / Math.tan(d) };
      }
      const leftTurn = trapezoidAngle(1, row.rack!) + trapezoidAngle(-1, row.rack!) > 0;
      const outer = leftTurn ? 'right' : 'left';
      expect(g.outer, `rack ${row.rack!}`).toBe(outer);
      for (const l of g.axleLines) {
        expect(l.to!.x).toBeCloseTo(-L, 6);
        expect(l.to!.y, `rack ${row.rack!} ${l.side}`).toBeCloseTo(ends[l.side].y, 3);
      }
      expect(g.centre!.y).toBeCloseTo(ends[outer].y, 3);
      const dOuter = trapezoidAngle(outer === 'left' ? 1 : -1, row.rack!);
      const Px = -(outer === 'left' ? 1 : -1) * SCRUB * Math.sin(dOuter);
      expect(g.radius!, `rack ${row.rack!}`).toBeCloseTo(Math.abs((Px + L) / Math.sin(dOuter)), 3);
      // The drawing and the readout tell the same radius.
      expect(g.radius!).toBeCloseTo(row.turningRadius!, 6);
      checked++;
    }
    expect(checked).toBeGreaterThanOrEqual(10);
  });

  it('moves the rack’s frame points with the rack in the drawing', () => {
    const row = steer.rows.at(-1)!;
    const scene = planScene(sketch, steer, row)!;
    for (const id of steer.rackPoints) {
      const ride = sketch.points.find((p) => p.id === id)!;
      expect(scene.points[id].y - ride.y).toBeCloseTo(row.rack!, 9);
      expect(scene.points[id].x).toBeCloseTo(ride.x, 9);
    }
    // The tie rods keep their length at the row: the drawn linkage is the solved one.
    for (const s of ['l', 'r']) {
      const a = scene.points[`TRi.${s}`],
        b = scene.points[`TRo.${s}`];
      expect(Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z)).toBeCloseTo(360, 4);
    }
  });
});

describe('a turned tyre’s outline', () => {
  const r = 400;
  const w = 250;
  const d = 30 * DEG;
  const wheel = { centre: { x: 0, y: 800, z: 400 }, axis: { x: -Math.sin(d), y: Math.cos(d), z: 0 } };
  const span = (pts: { px: number; py: number }[], k: 'px' | 'py') =>
    Math.max(...pts.map((p) => p[k])) - Math.min(...pts.map((p) => p[k]));

  it('from above is the tyre’s section: 2r along the heading, w across it', () => {
    // Plan: project to (x, y) and rotate by −δ so the heading lies along px.
    const hull = tyreOutline(wheel, r, w, (p) => ({
      px: p.x * Math.cos(d) + (p.y - 800) * Math.sin(d),
      py: -p.x * Math.sin(d) + (p.y - 800) * Math.cos(d),
    }));
    expect(span(hull, 'px')).toBeCloseTo(2 * r, 0);
    expect(span(hull, 'py')).toBeCloseTo(w, 6);
  });

  it('from the side is 2r·cos δ + w·sin δ long and 2r high (a cylinder seen at δ)', () => {
    const hull = tyreOutline(wheel, r, w, (p) => ({ px: p.x, py: p.z }));
    expect(span(hull, 'px')).toBeCloseTo(2 * r * Math.cos(d) + w * Math.sin(d), 0);
    expect(span(hull, 'py')).toBeCloseTo(2 * r, 0);
  });
});

describe('the plan view of the double-wishbone starter', () => {
  const doc = starters['double-wishbone']!.build();
  const sketch = parsed(doc);
  const result = runSweep(doc);
  const steer = result.steer!;

  it('draws the readout’s turning radius at every turned row, the centre on the rear axle line', () => {
    for (const row of steer.rows.filter((r) => r.rack !== 0)) {
      const g = planScene(sketch, steer, row)!.geometry;
      expect(g.centre!.x).toBeCloseTo(rearAxleX(sketch)!, 6);
      expect(g.radius!).toBeCloseTo(row.turningRadius!, 6);
    }
  });
});

describe('the plan view of each steered starter against the turning radius its readout gives', () => {
  for (const layout of ['double-wishbone', 'steered-front-axle'] as const) {
    it(`draws the ${layout} starter's turning circle through the outer patch at the readout's radius, at every turned row`, () => {
      const sketch = parsed(starters[layout]!.build());
      const steer = runSweep(sketch).steer!;
      const turned = steer.rows.filter((r) => r.turningRadius !== null);
      expect(turned.length).toBeGreaterThan(4);
      for (const row of turned) {
        const scene = planScene(sketch, steer, row)!;
        expect(scene.geometry.radius!).toBeCloseTo(row.turningRadius!, 6);
        // The drawn tyres carry the row's steer angles.
        for (const w of scene.wheels) expect(w.steer).toBe(w.side === 'left' ? row.leftSteer : row.rightSteer);
      }
    });
  }
});
