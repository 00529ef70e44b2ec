import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import type { SweepResult } from '../../../shared/kinematics';
import { buildPlots } from '../../../src/sweep/plots';
import { checkTargets } from '../../../shared/display/targets';
import type { SweepContext } from '../../../src/sweep/readout';

/** 1 in = 25.4 mm exactly (international inch, 1959); conversions are one multiplication, so 1e-9 is generous. */
const TOL = 1e-9;

function sweepOf(layout: keyof typeof starters): { result: SweepResult; ctx: SweepContext } {
  const sketch = starters[layout]!.build();
  return {
    result: runSweep(sketch),
    ctx: { members: sketch.members, hasAxle: sketch.points.some((p) => p.body === 'axle') },
  };
}

describe('travel plots of a solid axle', () => {
  const { result, ctx } = sweepOf('four-link-lateral-rod');

  it('plots the travel quantities, the shocks, then bind and roll steer in roll, then roll steer through the travel', () => {
    const plots = buildPlots(result, ctx, {}, [], 'mm');
    expect(plots.map((p) => p.key)).toEqual([
      'pinion',
      'lateral',
      'antisquat',
      'antilift-brake',
      'foreaft',
      'rc',
      'ic-height',
      'shocks',
      'bind',
      'rollsteer',
      'rollsteer-travel',
    ]);
    expect(plots.filter((p) => p.sweep === 'roll').map((p) => p.key)).toEqual(['bind', 'rollsteer']);
    const travel = plots.find((p) => p.key === 'rollsteer-travel')!;
    expect(travel.title).toBe('Roll steer through the travel');
    expect(travel.series[0].points).toHaveLength(result.heave.length);
    expect(travel.series[0].points.every((p) => p.y !== null)).toBe(true);
  });

  it('draws every heave row, x in the user’s unit and y as the sweep gives it', () => {
    const lateral = buildPlots(result, ctx, {}, [], 'in').find((p) => p.key === 'lateral')!;
    expect(lateral.xTitle).toBe('travel (in)');
    expect(lateral.series[0].points).toHaveLength(result.heave.length);
    result.heave.forEach((row, i) => {
      expect(Math.abs(lateral.series[0].points[i].x - row.travel / 25.4)).toBeLessThan(TOL);
      expect(Math.abs(lateral.series[0].points[i].y! - row.lateralShift! / 25.4)).toBeLessThan(TOL);
    });
  });

  it('leaves a gap, not a zero, where a quantity is not defined (roll steer at zero roll)', () => {
    const steer = buildPlots(result, ctx, {}, [], 'mm').find((p) => p.key === 'rollsteer')!;
    const atZero = steer.series[0].points.find((p) => p.x === 0)!;
    expect(atZero.y).toBeNull();
  });

  it('draws each shock with its stroke limits as dashed lines', () => {
    const shocks = buildPlots(result, ctx, {}, [], 'mm').find((p) => p.key === 'shocks')!;
    const shl = ctx.members.find((m) => m.id === 'SHl')!;
    const limits = shocks.series.filter((s) => s.label.startsWith('SHl ') && s.dash);
    expect(limits.map((s) => s.points[0].y)).toEqual([
      shl.kind === 'shock' ? shl.minLength : NaN,
      shl.kind === 'shock' ? shl.maxLength : NaN,
    ]);
  });

  it('shades a target band in plot units, red where the target is missed', () => {
    const targets = { lateralShift: { min: -5, max: 5 }, antiSquat: { min: 60, max: 90 } };
    const plots = buildPlots(result, ctx, targets, checkTargets(result, targets), 'in');
    const lateral = plots.find((p) => p.key === 'lateral')!;
    expect(lateral.bands[0].yMax).toBeCloseTo(5 / 25.4, 12);
    // The starter's lateral shift reaches about 10 mm at full bump: the ±5 mm band is missed.
    expect(lateral.bands[0].missed).toBe(true);
    expect(plots.find((p) => p.key === 'antisquat')!.bands[0]).toMatchObject({ yMin: 60, yMax: 90 });
  });
});

describe('travel plots of independent layouts', () => {
  it('show the wheel’s camber, toe and track (contact patch first) and leave out the axle’s quantities', () => {
    const { result, ctx } = sweepOf('double-wishbone');
    const keys = buildPlots(result, ctx, {}, [], 'mm').map((p) => p.key);
    expect(keys.slice(0, 4)).toEqual(['camber', 'toe', 'contact-track', 'track']);
    expect(keys).not.toContain('pinion');
    expect(keys).not.toContain('lateral');
    expect(keys).toContain('antidive');
  });

  it('plot anti-squat of trailing arms where the sweep defines it', () => {
    const { result, ctx } = sweepOf('trailing-arm');
    const plots = buildPlots(result, ctx, {}, [], 'mm');
    const defined = result.heave.some((r) => r.antiSquat !== null);
    expect(plots.some((p) => p.key === 'antisquat')).toBe(defined);
  });
});
