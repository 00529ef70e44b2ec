/**
 * Universal (Cardan) joint: tanφ2 = tanφ1 / cosβ, ω2/ω1 = cosβ / (1 − sin²β·cos²φ1); the speed
 * ratio swings between cosβ and 1/cosβ (standard kinematics texts). docs/references.md:
 * 1/cosβ − cosβ = 0.002743 at 3°, 0.007625 at 5°, 0.03062 at 10°.
 * The rig's driveline is built with a known joint angle β at the output; the solver's
 * operating angle must be β, and the speed fluctuation computed from it the table's.
 * Compound angle √(T² + S²) for a joint bent in both views (driveline installation guides;
 * common practice, a small-angle approximation).
 */
import { dot, norm } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../shared/kinematics';
import { translatingAxle } from './rigs';

const rad = (d: number) => (d * Math.PI) / 180;

/** A driveline whose gearbox shaft is bent by `side` (deg, side view) and `plan` (deg, plan view) from the driveshaft. */
function rig(side: number, plan: number) {
  const out = { x: 1500, y: 0, z: 500 };
  const pin = { x: 200, y: 0, z: 420 };
  const s = { x: pin.x - out.x, y: 0, z: pin.z - out.z };
  const len = Math.hypot(s.x, s.z);
  const u = { x: s.x / len, z: s.z / len };
  // Gearbox shaft direction (pointing rearward into the joint): the shaft direction turned by `side` in x–z, then given a plan-view slope.
  const c = Math.cos(rad(side)),
    sn = Math.sin(rad(side));
  const g = {
    x: u.x * c - u.z * sn,
    y: Math.tan(rad(plan)) * Math.hypot(u.x * c - u.z * sn, 0),
    z: u.x * sn + u.z * c,
  };
  return translatingAxle(
    { frame: [-100, 550, 400], axle: [-100, -550, 400] },
    {
      points: [
        { id: 'DS.o', body: 'frame', ...out },
        { id: 'DS.oa', body: 'frame', x: out.x - 100 * g.x, y: out.y - 100 * g.y, z: out.z - 100 * g.z },
        { id: 'DS.p', body: 'axle', ...pin },
        { id: 'DS.pa', body: 'axle', x: pin.x + 100 * u.x, y: 0, z: pin.z + 100 * u.z },
      ],
    },
    {
      driveline: { output: 'DS.o', outputAxis: 'DS.oa', pinion: 'DS.p', pinionAxis: 'DS.pa' },
      sweep: { droop: -10, bump: 10, step: 5, roll: 0, rollStep: 1 },
    },
  );
}

/** Max − min of ω2/ω1 over a turn, sampled every 0.5°. */
function speedSwing(betaDeg: number): number {
  const b = rad(betaDeg);
  let lo = Infinity,
    hi = -Infinity;
  for (let k = 0; k < 720; k++) {
    const phi = rad(k / 2);
    const w = Math.cos(b) / (1 - Math.sin(b) ** 2 * Math.cos(phi) ** 2);
    lo = Math.min(lo, w);
    hi = Math.max(hi, w);
  }
  return hi - lo;
}

describe('Cardan joint', () => {
  const table: [number, number][] = [
    [3, 0.002743],
    [5, 0.007625],
    [10, 0.03062],
  ];
  for (const [beta, swing] of table) {
    it(`joint at ${beta}°: the solver reads ${beta}° and the speed swings by ${swing}`, () => {
      const r = runSweep(rig(beta, 0));
      const angle = r.ride.driveline!.outputAngle;
      expect(angle).toBeCloseTo(beta, 9);
      expect(r.ride.driveline!.pinionAngle).toBeCloseTo(0, 9);
      // Table values to four significant figures.
      expect(Math.abs(speedSwing(angle) - swing)).toBeLessThan(swing * 5e-4);
      expect(Math.abs(1 / Math.cos(rad(angle)) - Math.cos(rad(angle)) - swing)).toBeLessThan(swing * 5e-4);
    });
  }

  it("tanφ2 = tanφ1 / cosβ with the solver's 10° joint: φ1 = 30° gives φ2 = 30.38°", () => {
    const b = rad(runSweep(rig(10, 0)).ride.driveline!.outputAngle);
    const phi1 = rad(30);
    const phi2 = Math.atan(Math.tan(phi1) / Math.cos(b));
    expect((phi2 * 180) / Math.PI).toBeCloseTo(30.38, 2); // tan⁻¹(tan 30° / cos 10°), by hand
  });

  it('a joint bent 3° in side view and 4° in plan view operates at about √(3² + 4²) = 5°', () => {
    const d = rig(3, 4);
    const r = runSweep(d);
    const p = (id: string) => d.points.find((q) => q.id === id)!;
    // The exact 3-D angle between the two shafts, by mathjs (an independent library).
    const shaft = [p('DS.p').x - p('DS.o').x, p('DS.p').y - p('DS.o').y, p('DS.p').z - p('DS.o').z];
    const gearbox = [p('DS.o').x - p('DS.oa').x, p('DS.o').y - p('DS.oa').y, p('DS.o').z - p('DS.oa').z];
    const exact =
      (Math.acos((dot(shaft, gearbox) as number) / ((norm(shaft) as number) * (norm(gearbox) as number))) * 180) /
      Math.PI;
    expect(r.ride.driveline!.outputAngle).toBeCloseTo(exact, 9);
    // The √(T² + S²) rule is a small-angle approximation: a few hundredths of a degree off at 5°.
    expect(Math.abs(r.ride.driveline!.outputAngle - 5)).toBeLessThan(0.05);
  });

  it('the joint angle grows as the axle moves off the line of the shaft', () => {
    const r = runSweep(rig(0, 0));
    const row = r.heave.find((h) => h.travel === 10)!;
    // Pinion 10 mm up on a 1302 mm shaft that pivots about the output: the shaft turns by atan(10·cos/len).
    expect(row.driveline!.pinionAngle).toBeGreaterThan(0.3);
    expect(row.driveline!.pinionAngle).toBeCloseTo(row.driveline!.outputAngle, 9);
  });
});
