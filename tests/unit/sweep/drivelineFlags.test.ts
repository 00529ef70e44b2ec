import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import type { SketchInput } from '../../../shared/schema/sketch';
import { buildFlags } from '../../../shared/display/flags';

const starter = starters['four-link-lateral-rod'].build();
const withDriveline = (settings: Record<string, unknown>): SketchInput => ({
  ...starter,
  driveline: { ...starter.driveline!, ...settings },
});

describe('the driveshaft flags on the board', () => {
  it('words a joint under its minimum, and joints whose angles differ, with where each starts', () => {
    const r = runSweep(starter);
    const flags = buildFlags(r, starter.members, [], 'mm');
    const low = flags.filter((f) => f.kind === 'joint-angle-low' && f.sweep === 'heave');
    expect(low.map((f) => f.title)).toEqual(['Joint angle too small', 'Joint angle too small']);
    expect(low[0].detail).toMatch(
      /^Output joint operating angle is under 0\.5° from \+\d+\.\d mm bump; its needle bearings barely turn and wear in one place\.$/,
    );
    // The starter's joints run at about 2° at ride: the shaft straightens in bump, never at ride, and roll alone
    // leaves the joints' angles where they are.
    for (const f of low) expect(f.where).toMatch(/^\+\d+\.\d mm bump$/);
    expect(flags.filter((f) => f.kind === 'joint-angle-low' && f.sweep === 'roll')).toEqual([]);
    const mismatch = flags.filter((f) => f.kind === 'joint-angle-mismatch' && f.sweep === 'heave');
    expect(mismatch).toHaveLength(1);
    expect(mismatch[0].title).toBe('Joint angles differ');
    expect(mismatch[0].detail).toMatch(
      /^Output and pinion joint operating angles differ by more than 1\.0° beyond \+\d+\.\d mm bump; the shaft's speed fluctuation no longer cancels\.$/,
    );
  });

  it('says a double-Cardan shaft wants the pinion pointing at the output, instead of the mismatch', () => {
    const r = runSweep(withDriveline({ shaft: 'double-cardan', maxJointAngleMismatch: 2 }));
    const flags = buildFlags(r, starter.members, [], 'mm').filter((f) => f.kind === 'joint-angle-mismatch');
    expect(flags.length).toBeGreaterThan(0);
    for (const f of flags) {
      expect(f.title).toBe('Pinion off the shaft line');
      expect(f.detail).toContain('Pinion joint operating angle is over 2.0° beyond');
      expect(f.detail).toContain('with a double-Cardan shaft the pinion should point at the output joint');
    }
  });

  it('words the slip yoke in the user’s units, as a flag that stops the design', () => {
    const ride = runSweep(starter).ride.driveline!.length;
    const yoke = { collapsed: Math.round(ride - 7), extended: Math.round(ride) + 0.5 };
    const r = runSweep(withDriveline({ slipYoke: yoke }));
    const inches = buildFlags(r, starter.members, [], 'in').filter((f) => f.kind === 'slip-yoke');
    expect(inches.map((f) => f.title).sort()).toEqual(['Slip yoke bottoms out', 'Slip yoke pulls out']);
    for (const f of inches) expect(f.severity).toBe('negative');
    const out = inches.find((f) => f.title === 'Slip yoke pulls out')!;
    // 1 in = 25.4 mm exactly (NIST SP 811, appendix B).
    expect(out.detail).toContain(
      `longer than the slip yoke’s extended length (${(yoke.extended / 25.4).toFixed(2)} in)`,
    );
    expect(out.where).toMatch(/^\+\d+\.\d\d in bump$/);
  });
});
