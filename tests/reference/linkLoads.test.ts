/**
 * Link loads against a hand statics case. Side view of a three-link axle with level links:
 * two lower links at height z_l, one central upper link at z_u, all running forward from the
 * axle, a level lateral rod; the tractive force F = T / r acts forward at the contact patches
 * (ground, z = 0), the springs take the vertical. Equilibrium of the axle (hand statics, any
 * mechanics text), tensions f positive, a tension pulling the axle forward (frame end ahead):
 *   fore-aft:                 F + 2·f_l + f_u = 0
 *   pitch about the wheel centre (height z_w):  −z_w·F + 2·f_l·(z_l − z_w) + f_u·(z_u − z_w) = 0
 * so f_l = −F·(z_u)/(2·(z_u − z_l)) and f_u = F·z_l/(z_u − z_l); the lateral rod carries nothing.
 * Numbers: T = 4000 N·m, r = 400 mm → F = 10 000 N; z_l = 250, z_u = 600, z_w = 400 →
 * f_l = −8571.4 N (compression), f_u = +7142.9 N (tension).
 */
import { describe, expect, it } from 'vitest';
import { runSweep } from '../../shared/kinematics';
import { doc } from './rigs';

/** N: round-off on 10 kN numbers. */
const LOAD_TOL_N = 1e-6;

describe('link loads against hand statics (level three-link)', () => {
  const zl = 250,
    zu = 600;
  const sketch = doc(
    [
      { id: 'WC.l', body: 'axle', x: 0, y: 800, z: 400 },
      { id: 'WC.r', body: 'axle', x: 0, y: -800, z: 400 },
      { id: 'LL.al', body: 'axle', x: 0, y: 500, z: zl },
      { id: 'LL.fl', body: 'frame', x: 900, y: 500, z: zl },
      { id: 'LL.ar', body: 'axle', x: 0, y: -500, z: zl },
      { id: 'LL.fr', body: 'frame', x: 900, y: -500, z: zl },
      { id: 'UL.a', body: 'axle', x: 0, y: 0, z: zu },
      { id: 'UL.f', body: 'frame', x: 700, y: 0, z: zu },
      { id: 'LR.f', body: 'frame', x: -100, y: 600, z: 380 },
      { id: 'LR.a', body: 'axle', x: -100, y: -600, z: 380 },
    ],
    [
      { id: 'LLl', kind: 'link', group: 'lower', a: 'LL.fl', b: 'LL.al' },
      { id: 'LLr', kind: 'link', group: 'lower', a: 'LL.fr', b: 'LL.ar' },
      { id: 'UL', kind: 'link', group: 'upper', a: 'UL.f', b: 'UL.a' },
      { id: 'LR', kind: 'lateral-rod', a: 'LR.f', b: 'LR.a' },
    ],
    {
      vehicle: { wheelbase: 3000, cgHeight: 600, track: 1600, tireRadius: 400 },
      sweep: { droop: -50, bump: 50, step: 10, roll: 0, rollStep: 1, axleTorque: 4000 },
    },
  );
  const r = runSweep(sketch, { heaveOnly: true });

  it('gives the hand values at ride height', () => {
    const F = (4000 * 1000) / 400;
    const fl = (-F * zu) / (2 * (zu - zl));
    const fu = (F * zl) / (zu - zl);
    expect(fl).toBeCloseTo(-8571.43, 2);
    expect(fu).toBeCloseTo(7142.86, 2);
    expect(r.loads!.tractiveForce).toBeCloseTo(F, 9);
    expect(Math.abs(r.ride.linkLoads!.LLl - fl)).toBeLessThan(LOAD_TOL_N * F);
    expect(Math.abs(r.ride.linkLoads!.LLr - fl)).toBeLessThan(LOAD_TOL_N * F);
    expect(Math.abs(r.ride.linkLoads!.UL - fu)).toBeLessThan(LOAD_TOL_N * F);
    expect(Math.abs(r.ride.linkLoads!.LR)).toBeLessThan(LOAD_TOL_N * F);
    expect(r.loads!.indeterminate).toBe(false);
  });

  it('satisfies the fore-aft and pitch balance as written', () => {
    const F = r.loads!.tractiveForce,
      f = r.ride.linkLoads!;
    expect(F + f.LLl + f.LLr + f.UL).toBeCloseTo(0, 6);
    expect(-400 * F + (f.LLl + f.LLr) * (zl - 400) + f.UL * (zu - 400)).toBeCloseTo(0, 3);
  });
});
