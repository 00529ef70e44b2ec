import { describe, expect, it } from 'vitest';
import { formatLength, MM_PER_INCH, mmToUnit, unitToMm } from '../../../shared/units';

describe('units', () => {
  it('converts by the international inch (25.4 mm exactly)', () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(mmToUnit(254, 'in')).toBeCloseTo(10, 12);
    expect(unitToMm(2, 'in')).toBeCloseTo(50.8, 12);
    expect(mmToUnit(12.5, 'mm')).toBe(12.5);
    expect(unitToMm(mmToUnit(123.456, 'in'), 'in')).toBeCloseTo(123.456, 10);
  });

  it('formats lengths without NaN or negative zero', () => {
    expect(formatLength(25.4, 'in')).toBe('1.00 in');
    expect(formatLength(12.34, 'mm')).toBe('12.3 mm');
    expect(formatLength(-0.01, 'mm')).toBe('0.0 mm');
    expect(formatLength(Number.NaN, 'mm')).toBe('–');
    expect(formatLength(1000, 'mm', 0)).toBe('1000 mm');
  });
});
