import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  MISSING,
  showAngle,
  showLength,
  showPercent,
  showPosition,
  showRatio,
  fixed,
} from '../../../shared/display/format';

describe('numbers on the board', () => {
  it('never show NaN: a missing number is a dash with its reason', () => {
    for (const v of [null, undefined, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(showLength(v as number | null, 'mm', 'links parallel: no instant centre')).toEqual({
        text: MISSING,
        reason: 'links parallel: no instant centre',
      });
      expect(showAngle(v as number | null).text).toBe(MISSING);
      expect(showPercent(v as number | null).text).toBe(MISSING);
      expect(showRatio(v as number | null).text).toBe(MISSING);
    }
  });

  it('show any finite number as digits, in either unit', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e5, max: 1e5, noNaN: true }),
        fc.constantFrom('mm' as const, 'in' as const),
        (v, u) => {
          const shown = showLength(v, u, undefined, true).text;
          expect(shown).not.toMatch(/NaN|Infinity|undefined/);
          expect(shown.endsWith(` ${u}`)).toBe(true);
        },
      ),
    );
  });

  it('convert mm to inches by the exact 25.4 (international inch, 1959)', () => {
    expect(showLength(254, 'in').text).toBe('10.00 in');
    expect(showLength(-12.7, 'in', undefined, true).text).toBe('\u22120.50 in');
  });

  it('write no "-0" and a true minus sign', () => {
    expect(fixed(-0.00001, 1)).toBe('0.0');
    expect(fixed(-2.5, 1)).toBe('\u22122.5');
    expect(fixed(2.5, 1, true)).toBe('+2.5');
    expect(fixed(0, 1, true)).toBe('0.0');
  });

  it('name the position on the sweep', () => {
    expect(showPosition('heave', 0, 'mm')).toBe('ride height');
    expect(showPosition('heave', 45, 'mm')).toBe('+45.0 mm bump');
    expect(showPosition('heave', -25.4, 'in')).toBe('\u22121.00 in droop');
    expect(showPosition('roll', 6, 'mm')).toBe('+6.0° roll');
  });
});
