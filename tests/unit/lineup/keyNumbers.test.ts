import { describe, expect, it } from 'vitest';
import { runSweep, starters } from '../../../shared/kinematics';
import { keyNumbers, NOT_APPLICABLE, type KeyRow } from '../../../src/lineup/keyNumbers';

const swept = (layout: 'four-link-lateral-rod' | 'double-wishbone' | 'trailing-arm') => {
  const document = starters[layout]!.build();
  return { document, result: runSweep(document), problem: null };
};
const row = (rows: KeyRow[], label: string, at: KeyRow['at']) => rows.find((r) => r.label === label && r.at === at);

describe('the line-up key numbers', () => {
  it('read each variant at full bump and full droop: the travel its sketch sweeps to', () => {
    const rows = keyNumbers([swept('four-link-lateral-rod'), swept('double-wishbone')], 'mm');
    // The starters sweep ±150 mm (four-link) and ±120 mm (double wishbone), their sweep settings, and reach them.
    expect(row(rows, 'Travel', 'bump')!.cells.map((c) => c.text)).toEqual(['+150.0 mm', '+120.0 mm']);
    expect(row(rows, 'Travel', 'droop')!.cells.map((c) => c.text)).toEqual(['−150.0 mm', '−120.0 mm']);
    // A change from ride is 0 at ride by definition: no ride row for it.
    expect(row(rows, 'Travel', 'ride')).toBeUndefined();
    expect(row(rows, 'Anti-squat', 'ride')).toBeDefined();
  });

  it('show the user unit: 150 mm is 5.91 in (150 / 25.4)', () => {
    const rows = keyNumbers([swept('four-link-lateral-rod'), swept('trailing-arm')], 'in');
    expect(row(rows, 'Travel', 'bump')!.cells[0].text).toBe('+5.91 in');
  });

  it('say n/a, with why, where a quantity does not apply, and leave out a row no variant has', () => {
    const rows = keyNumbers([swept('four-link-lateral-rod'), swept('double-wishbone')], 'mm');
    // A solid axle has no camber change of its own (registry: independent layouts only); a front axle no anti-squat.
    const camber = row(rows, 'Camber change', 'bump')!;
    expect(camber.cells[0]).toMatchObject({ text: NOT_APPLICABLE, reason: expect.stringContaining('does not apply') });
    expect(camber.cells[1].text).not.toBe(NOT_APPLICABLE);
    expect(row(rows, 'Anti-squat', 'ride')!.cells[1].text).toBe(NOT_APPLICABLE);

    const rear = keyNumbers([swept('four-link-lateral-rod'), swept('four-link-lateral-rod')], 'mm');
    expect(rear.some((r) => r.label === 'Camber change' || r.label === 'Anti-dive')).toBe(false);
    expect(rear.map((r) => r.label)).toContain('Articulation');
    expect(rear.every((r) => r.help.length > 20)).toBe(true);
  });

  it('give a variant that could not be swept a dash and the reason, never a number', () => {
    const ok = swept('four-link-lateral-rod');
    const rows = keyNumbers([ok, { document: ok.document, result: null, problem: 'The linkage locks at ride.' }], 'mm');
    for (const r of rows) {
      expect(r.cells[1].text, r.label).toBe('—');
      expect(r.cells[1].reason, r.label).toContain('The linkage locks at ride.');
    }
  });

  it('list the flags, none for a sketch that raises none', () => {
    const rows = keyNumbers([swept('four-link-lateral-rod'), swept('double-wishbone')], 'mm');
    const flags = rows.find((r) => r.label === 'Flags')!;
    // The double-wishbone starter is laid out to raise no flag; the four-link's driveshaft joints run near straight.
    expect(flags.cells[1]).toMatchObject({ text: 'none', flags: [] });
    expect(Number(flags.cells[0].text)).toBeGreaterThan(0);
    expect(flags.cells[0].flags!.join(' ')).toMatch(/Joint angle/);
  });
});
