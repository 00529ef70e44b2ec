/**
 * Lock-up: a lateral rod of length L whose axle end starts level with its frame end cannot
 * lift that end more than L (the rod would have to stretch) — plain arc geometry.
 */
import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import type { SketchInput } from '../../../shared/schema/sketch';
import { nonFinite } from './helpers';

const ROD_MM = 260;

function shortRodSketch(): SketchInput {
  const doc = structuredClone(starters['three-link-lateral-rod']!.build()) as SketchInput;
  const f = doc.points.find((p) => p.id === 'LR.f')!;
  const a = doc.points.find((p) => p.id === 'LR.a')!;
  f.y = ROD_MM / 2;
  a.y = -ROD_MM / 2;
  f.z = a.z;
  doc.sweep = { droop: -150, bump: 400, step: 10, roll: 8, rollStep: 1 };
  // Shocks long enough not to matter here.
  for (const m of doc.members)
    if (m.kind === 'shock') {
      m.minLength = 10;
      m.maxLength = 2000;
    }
  return doc;
}

describe('lock-up', () => {
  const r = runSweep(shortRodSketch());

  it("stops the heave sweep at the rod's reach and says so", () => {
    const lock = r.limits.events.filter((e) => e.kind === 'lock-up');
    expect(lock).toHaveLength(1);
    expect(lock[0].sweep).toBe('heave');
    expect(lock[0].at).toBeGreaterThan(ROD_MM - 30);
    expect(lock[0].at).toBeLessThanOrEqual(ROD_MM + 10);
    expect(r.limits.bump).toBe(lock[0].at - 10);
    expect(r.heave.at(-1)!.travel).toBe(r.limits.bump);
    expect(lock[0].message).toMatch(/Lock-up/);
  });

  it('invents no rows and prints no NaN', () => {
    expect(r.heave.every((h) => h.travel <= r.limits.bump)).toBe(true);
    expect(r.heave[0].travel).toBe(-150);
    expect(nonFinite(r)).toEqual([]);
    for (const h of r.heave) expect(h.members.LR.lengthChange).toBeLessThan(0.01);
  });
});
