/**
 * Link loads: consistent with the anti-squat geometry, linear in the torque, flags for a
 * load that reverses within the travel or passes the limit, and absent where they do not apply.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import { nonFinite, sketchOf } from './helpers';

/** N: loads agree to this share of the tractive force (solver convergence, round-off). */
const LOAD_TOL = 1e-6;

describe('link loads', () => {
  const spec = starters['three-link-lateral-rod']!;
  const doc = spec.build();
  const result = runSweep(doc);
  const loads = result.loads!;

  it('balance the tractive force and lift the frame by the anti-squat share of the load transfer', () => {
    // Milliken & Milliken / Gillespie (docs/references.md): the links' vertical force on the sprung
    // mass is %AS/100 × F·h/L. Computed here from the placed links and their loads.
    const F = loads.tractiveForce;
    expect(F).toBeCloseTo((4000 * 1000) / doc.vehicle.tireRadius, 9);
    const pts = Object.fromEntries(doc.points.map((p) => [p.id, p]));
    let fx = 0,
      fz = 0;
    for (const m of doc.members.filter((x) => x.kind === 'link' || x.kind === 'lateral-rod')) {
      const a = pts[m.a],
        b = pts[m.b];
      const L = Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z);
      const f = result.ride.linkLoads![m.id];
      // Tension pulls the axle end towards the frame end.
      fx += (f * (a.x - b.x)) / L;
      fz += (f * (a.z - b.z)) / L;
    }
    expect(fx + F).toBeCloseTo(0, 6);
    const transfer = (F * doc.vehicle.cgHeight) / doc.vehicle.wheelbase;
    // The frame gets −fz: up when the links pull the axle down.
    expect(-fz / transfer).toBeCloseTo(result.ride.antiSquat! / 100, 6);
  });

  it('under drive: lower links in compression, the upper link in tension (the torque reaction)', () => {
    expect(loads.members.LLl.ride).toBeLessThan(0);
    expect(loads.members.LLr.ride).toBeLessThan(0);
    expect(loads.members.UL.ride).toBeGreaterThan(0);
    expect(loads.indeterminate).toBe(false);
    expect(nonFinite(result)).toEqual([]);
  });

  it('are linear in the torque and reverse with it', () => {
    const half = runSweep(doc, { sweep: { axleTorque: -2000 }, heaveOnly: true });
    for (const id of Object.keys(loads.members)) {
      expect(Math.abs(half.ride.linkLoads![id] + loads.members[id].ride / 2)).toBeLessThan(
        LOAD_TOL * loads.tractiveForce,
      );
    }
  });

  it('flag a load over the limit at ride, and only with a limit set', () => {
    expect(result.limits.events.some((e) => e.kind === 'load-limit')).toBe(false);
    const limited = runSweep(doc, { sweep: { linkLoadLimit: 9000 }, heaveOnly: true });
    const flags = limited.limits.events.filter((e) => e.kind === 'load-limit');
    expect(flags.map((e) => e.member)).toEqual(['LLl']);
    expect(flags[0].at).toBe(0);
    expect(limited.loads!.members.LLl.overLimit).toBe(true);
    expect(limited.loads!.members.LLr.overLimit).toBe(false);
  });

  it('flag a load that passes the limit within the travel at the interpolated travel', () => {
    const limit = (loads.members.UL.ride + loads.members.UL.max) / 2;
    const r = runSweep(doc, { sweep: { linkLoadLimit: limit }, heaveOnly: true });
    const e = r.limits.events.find((x) => x.kind === 'load-limit' && x.member === 'UL')!;
    const dir = Math.sign(e.at);
    // The two rows either side of the crossing, on the event's side of ride.
    const side = r.heave
      .filter((h) => Math.sign(h.travel) === dir || h.travel === 0)
      .sort((p, q) => Math.abs(p.travel) - Math.abs(q.travel));
    const k = side.findIndex((h) => Math.abs(h.linkLoads!.UL) > limit);
    const [before, after] = [side[k - 1], side[k]];
    expect(Math.abs(before.travel)).toBeLessThanOrEqual(Math.abs(e.at));
    expect(Math.abs(after.travel)).toBeGreaterThanOrEqual(Math.abs(e.at));
    const t = (limit - before.linkLoads!.UL) / (after.linkLoads!.UL - before.linkLoads!.UL);
    expect(e.at).toBeCloseTo(before.travel + t * (after.travel - before.travel), 9);
  });

  it('flag a link whose load changes sign within the travel', () => {
    // A rig whose lower links' line runs through the contact patches at ride: the lowers then
    // take the whole torque reaction and the upper link none, and as the lowers swing with the
    // travel the upper's share changes sign at ride.
    const rig = sketchOf({
      points: [
        { id: 'WC.l', body: 'axle', x: 0, y: 800, z: 400 },
        { id: 'WC.r', body: 'axle', x: 0, y: -800, z: 400 },
        { id: 'LL.al', body: 'axle', x: -300, y: 500, z: -60 },
        { id: 'LL.fl', body: 'frame', x: 700, y: 500, z: 140 },
        { id: 'LL.ar', body: 'axle', x: -300, y: -500, z: -60 },
        { id: 'LL.fr', body: 'frame', x: 700, y: -500, z: 140 },
        { id: 'UL.a', body: 'axle', x: 50, y: 0, z: 600 },
        { id: 'UL.f', body: 'frame', x: 750, y: 0, z: 620 },
        { id: 'LR.f', body: 'frame', x: -100, y: 600, z: 400 },
        { id: 'LR.a', body: 'axle', x: -100, y: -600, z: 400 },
      ],
      members: [
        { id: 'LLl', kind: 'link', group: 'lower', a: 'LL.fl', b: 'LL.al' },
        { id: 'LLr', kind: 'link', group: 'lower', a: 'LL.fr', b: 'LL.ar' },
        { id: 'UL', kind: 'link', group: 'upper', a: 'UL.f', b: 'UL.a' },
        { id: 'LR', kind: 'lateral-rod', a: 'LR.f', b: 'LR.a' },
      ],
      sweep: { droop: -100, bump: 100, step: 10, roll: 0, rollStep: 1 },
    });
    const r = runSweep(rig, { heaveOnly: true });
    const s = r.loads!.members.UL;
    expect(Math.abs(s.ride)).toBeLessThan(LOAD_TOL * r.loads!.tractiveForce);
    expect(s.reverses).toBe(true);
    expect(s.min).toBeLessThan(0);
    expect(s.max).toBeGreaterThan(0);
    const e = r.limits.events.filter((x) => x.kind === 'load-reversal');
    expect(e.map((x) => x.member)).toEqual(['UL']);
    const below = r.heave.find((h) => h.travel === -10)!.linkLoads!.UL,
      above = r.heave.find((h) => h.travel === 10)!.linkLoads!.UL;
    expect(Math.sign(below)).not.toBe(Math.sign(above));
    expect(e[0].at).toBeCloseTo(-10 + (20 * below) / (below - above), 9);
    expect(r.loads!.members.LLl.reverses).toBe(false);
  });

  it('are split by least squares where the links over-locate the axle, and absent without links', () => {
    const four = runSweep(starters['four-link-lateral-rod']!.build(), { heaveOnly: true });
    expect(four.loads!.indeterminate).toBe(true);
    expect(four.loads!.members.LLl.ride).toBeCloseTo(four.loads!.members.LLr.ride, 6);
    expect(runSweep(starters['leaf-spring']!.build(), { heaveOnly: true }).loads).toBeUndefined();
    expect(runSweep(starters['trailing-arm']!.build(), { heaveOnly: true }).loads).toBeUndefined();
  });
});
