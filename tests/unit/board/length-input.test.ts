import { describe, expect, it } from 'vitest';
import { lengthForInput, parseLength } from '../../../src/stores/board/lengthInput';

/** Conversions are exact apart from float rounding; 1 in = 25.4 mm by definition (1959). */
const MM_TOL = 1e-9;

describe('parseLength', () => {
  it('reads bare numbers in the user unit', () => {
    expect(parseLength('980', 'mm')).toEqual({ ok: true, mm: 980 });
    const r = parseLength('12.5', 'in');
    expect(r.ok && Math.abs(r.mm - 317.5)).toBeLessThan(MM_TOL);
  });

  it('reads a number with its own unit, whatever the user unit', () => {
    const r = parseLength('2 in', 'mm');
    expect(r.ok && Math.abs(r.mm - 50.8)).toBeLessThan(MM_TOL);
    expect(parseLength('890mm', 'in')).toEqual({ ok: true, mm: 890 });
    expect(parseLength('8.9 cm', 'mm')).toEqual({ ok: true, mm: 89 });
  });

  it('reads a decimal comma', () => {
    expect(parseLength('12,5', 'mm')).toEqual({ ok: true, mm: 12.5 });
  });

  it('refuses what is not a number, with a message', () => {
    for (const bad of ['', 'abc', '12..5', '1e999', '12 ft', 'NaN', 'Infinity']) {
      const r = parseLength(bad, 'mm');
      expect(r.ok, bad).toBe(false);
      if (!r.ok) expect(r.error.length).toBeGreaterThan(5);
    }
  });

  it('applies bounds', () => {
    expect(parseLength('0', 'mm', { min: 0, exclusiveMin: true }).ok).toBe(false);
    expect(parseLength('200000', 'mm').ok).toBe(false);
    expect(parseLength('-5', 'mm', { min: 0 }).ok).toBe(false);
  });
});

describe('lengthForInput', () => {
  it('shows mm to a tenth and inches to a thousandth, without -0', () => {
    expect(lengthForInput(980.04, 'mm')).toBe('980');
    expect(lengthForInput(25.4, 'in')).toBe('1');
    expect(lengthForInput(-0.01, 'mm')).toBe('0');
  });
});
