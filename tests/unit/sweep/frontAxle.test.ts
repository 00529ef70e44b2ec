/**
 * A solid axle at the front (`vehicle.axle`): the four-link starter mirrored fore and aft (x → −x, its links
 * running rearward to the frame) reads anti-dive and anti-lift under power, and no screen shows anti-squat
 * for it: not the readout, the travel plots, the CSV, the build sheet, nor the targets' hidden rule. The
 * figures are checked against the side-view instant centre ratio worked here from the row's own instant
 * centre (Milliken & Milliken, Race Car Vehicle Dynamics, ch. 17; from memory, unverified); the rig checks
 * with the instant centre placed by construction are in tests/reference/frontAxle.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { heaveRowsCsv, runSweep, starters } from '../../../shared/kinematics';
import { metricEntry, type MetricEntry } from '../../../shared/kinematics/metrics/registry';
import type { Sketch } from '../../../shared/schema/sketch';
import { readoutLines, type SweepContext } from '../../../src/sweep/readout';
import { buildPlots } from '../../../src/sweep/plots';
import { buildSheet } from '../../../shared/sheet/buildSheet';
import { crossViewOf } from '../../../shared/suspensions';

function frontFourLink(): Sketch {
  const d = starters['four-link-lateral-rod'].build();
  return { ...d, points: d.points.map((p) => ({ ...p, x: -p.x })), vehicle: { ...d.vehicle, axle: 'front' } };
}

const rear = starters['four-link-lateral-rod'].build();
const front = frontFourLink();
const rearResult = runSweep(rear);
const frontResult = runSweep(front);
const ctx: SweepContext = { members: front.members, hasAxle: true };

describe('the four-link starter as a front axle', () => {
  it('has a driveline, as the starter does, so it reads anti-lift under power', () => {
    expect(front.driveline).toBeDefined();
  });

  it('reads anti-dive with the default front brake share (65 %) and anti-lift with the whole drive, at every row', () => {
    const { wheelbase: l, cgHeight: h } = front.vehicle;
    const wcX = front.points.find((p) => p.id === front.wheels.left)!.x;
    for (const row of frontResult.heave) {
      const ic = row.instantCenter!;
      // tanθ of the line from the patch rising rearward to the instant centre (worked here from the row's IC).
      const tan = (ic.z - row.travel) / (wcX + row.foreAftShift - ic.x);
      expect(row.antiDive!).toBeCloseTo(0.65 * tan * (l / h) * 100, 6);
      expect(row.antiLift!).toBeCloseTo(tan * (l / h) * 100, 6);
      expect(row.antiSquat).toBeNull();
    }
    // The ride figures the report quotes.
    expect(frontResult.ride.antiDive!).toBeCloseTo(39.84, 2);
    expect(frontResult.ride.antiLift!).toBeCloseTo(61.3, 1);
  });

  it('mirrors the rear starter: its anti-lift under power equals the rear anti-squat', () => {
    frontResult.heave.forEach((row, i) => expect(row.antiLift!).toBeCloseTo(rearResult.heave[i].antiSquat!, 6));
  });

  it('no screen shows anti-squat; the readout and plots show anti-dive and anti-lift', () => {
    const ids = readoutLines({ sweep: 'heave', row: frontResult.ride }, ctx, 'mm').map((l) => l.key);
    expect(ids).not.toContain('antisquat');
    expect(ids).toEqual(expect.arrayContaining(['antidive', 'antilift']));
    const plots = buildPlots(frontResult, ctx, {}, [], 'mm').map((p) => p.key);
    expect(plots).not.toContain('antisquat');
    expect(plots).toEqual(expect.arrayContaining(['antidive', 'antilift']));
    const header = heaveRowsCsv(frontResult).split('\n')[0].split(',');
    expect(header).not.toContain('antiSquat');
    expect(header).toEqual(expect.arrayContaining(['antiDive', 'antiLift']));
    const sheet = buildSheet(front, frontResult, null, 'mm').geometry.map((g) => g.label);
    expect(sheet).not.toContain('Anti-squat at ride');
    expect(sheet).toEqual(expect.arrayContaining(['Anti-dive at ride', 'Anti-lift under power at ride']));
    const antiSquat = metricEntry({ sweep: 'heave', key: 'antiSquat' }) as MetricEntry<'heave'>;
    expect(antiSquat.hidden!(frontResult.ride)).toBe(true);
  });

  it('the rear starter keeps anti-squat on every screen and adds anti-lift in braking', () => {
    const rctx: SweepContext = { members: rear.members, hasAxle: true };
    const ids = readoutLines({ sweep: 'heave', row: rearResult.ride }, rctx, 'mm').map((l) => l.key);
    expect(ids).toEqual(expect.arrayContaining(['antisquat', 'antilift-brake']));
    expect(ids).not.toContain('antidive');
    expect(ids).not.toContain('antilift');
    const header = heaveRowsCsv(rearResult).split('\n')[0].split(',');
    expect(header).toEqual(expect.arrayContaining(['antiSquat', 'antiLiftBraking']));
    expect(buildSheet(rear, rearResult, null, 'mm').geometry.map((g) => g.label)).toContain('Anti-squat at ride');
    // Rear brake share 35 % of the default: anti-lift in braking is 0.35 of the anti-squat (same line, same ratio).
    expect(rearResult.ride.antiLiftBraking!).toBeCloseTo(0.35 * rearResult.ride.antiSquat!, 9);
  });

  it('its cross view is the front view; the rear axle keeps the rear view', () => {
    expect(crossViewOf(front)).toBe('front');
    expect(crossViewOf(rear)).toBe('rear');
    expect(crossViewOf(starters['double-wishbone'].build())).toBe('front');
    expect(crossViewOf({ ...starters['trailing-arm'].build(), vehicle: { ...rear.vehicle, axle: 'front' } })).toBe(
      'rear',
    );
  });

  it('notes a front axle whose links run forward, as a rear sketch marked front would', () => {
    const unmirrored = runSweep({ ...rear, vehicle: { ...rear.vehicle, axle: 'front' } });
    const note = (w: string) => w.includes('links run forward');
    expect(unmirrored.warnings.some(note)).toBe(true);
    expect(unmirrored.ride.antiDive!).toBeLessThan(0);
    expect(frontResult.warnings.some(note)).toBe(false);
    expect(rearResult.warnings.some(note)).toBe(false);
  });
});
