/**
 * Every quantity the registry names says what it is: a definition of one sentence, ending with a
 * period, short enough for a tooltip; the help the screens show is built from it and the sign
 * convention; roll steer says what positive means at the sketch's end of the vehicle.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  axleEndOf,
  linkLoadEntry,
  memberEntries,
  metricEntries,
  metricEntry,
  metricHelp,
  windUpEntries,
} from '../../../shared/kinematics/metrics/registry';

/** Longest definition a tooltip carries, characters. */
const MAX_DEFINITION_CHARS = 200;

const named: Array<{ name: string; definition: unknown; sign: string }> = [
  ...metricEntries.map((e) => ({ name: `${e.sweep} ${e.key}`, definition: e.definition, sign: e.sign })),
  ...memberEntries.map((e) => ({ name: `member ${e.key}`, definition: e.definition, sign: e.sign })),
  { name: 'link load', definition: linkLoadEntry.definition, sign: linkLoadEntry.sign },
  ...windUpEntries.map((e) => ({ name: `wind-up ${e.key}`, definition: e.definition, sign: e.sign })),
];

describe('the definitions of the registry', () => {
  it('covers every entry: metrics, member readings, link loads and wind-up', () => {
    expect(named.length).toBe(metricEntries.length + memberEntries.length + 1 + windUpEntries.length);
    expect(named.length).toBeGreaterThan(40);
  });

  it.each(named)('$name has a definition of one sentence ending with a period, at most 200 characters', (e) => {
    expect(typeof e.definition).toBe('string');
    const d = e.definition as string;
    expect(d.length).toBeGreaterThan(20);
    expect(d.length).toBeLessThanOrEqual(MAX_DEFINITION_CHARS);
    expect(d).toMatch(/^[A-Z0-9]/);
    expect(d.endsWith('.')).toBe(true);
    // One sentence: no full stop followed by a new sentence inside it.
    expect(d.slice(0, -1)).not.toMatch(/\.\s+[A-Z]/);
    // The definition says what the number is, not its sign again.
    expect(d.toLowerCase()).not.toBe(e.sign.toLowerCase());
  });

  it('gives each quantity its own words within a sweep (no definition copied onto another quantity)', () => {
    for (const sweep of ['heave', 'roll', 'steer'] as const) {
      const defs = metricEntries.filter((e) => e.sweep === sweep).map((e) => e.definition);
      expect(new Set(defs).size).toBe(defs.length);
    }
  });

  it('writes the help as the definition, then the convention, each a sentence', () => {
    const camber = metricEntry({ sweep: 'heave', key: 'camberChange' });
    const help = metricHelp(camber);
    expect(help.startsWith(camber.definition)).toBe(true);
    expect(help).toContain('Convention: Left wheel, positive when the top leans out.');
  });

  it('says roll steer is roll oversteer on a rear axle and roll understeer on a front one', () => {
    // Positive roll steer turns the axle's nose left as its left side rises against the body, which
    // is what a right-hand turn does (the body rolls outward, to the left): the axle steers toward
    // the outside of the turn. Rear wheels steered out of the turn add yaw (oversteer); front
    // wheels steered out of it take yaw away (understeer). Milliken & Milliken, Race Car Vehicle
    // Dynamics, "roll steer" (from memory, unverified).
    const steer = metricEntry({ sweep: 'roll', key: 'rollSteer' });
    expect(steer.sign).toContain('nose left as its left side lifts');
    expect(metricHelp(steer, 'rear')).toContain('roll oversteer');
    expect(metricHelp(steer, 'rear')).not.toContain('understeer');
    expect(metricHelp(steer, 'front')).toContain('roll understeer');
    expect(metricHelp(steer, 'front')).not.toContain('oversteer');
    expect(metricHelp(steer)).toBe(metricHelp(steer, 'rear'));
  });

  it("reads the sketch's end from vehicle.axle, and takes the rear when it does not say", () => {
    expect(axleEndOf({ wheelbase: 2800, axle: 'front' })).toBe('front');
    expect(axleEndOf({ wheelbase: 2800, axle: 'rear' })).toBe('rear');
    expect(axleEndOf({ wheelbase: 2800 })).toBe('rear');
    expect(axleEndOf({ axle: 42 })).toBe('rear');
    expect(axleEndOf(undefined)).toBe('rear');
  });

  it('are written in the file format document word for word, so the document and the screens say the same', () => {
    // The document inside this repository (docs/sketch-format.md, "What each reading means").
    const doc = readFileSync(new URL('../../../docs/sketch-format.md', import.meta.url), 'utf8').replace(/\s+/g, ' ');
    for (const e of named)
      expect(doc, e.name).toContain(`${e.definition as string} Sign: ${e.sign}`.replace(/\s+/g, ' '));
  });
});
