import { describe, expect, it } from 'vitest';
import {
  formatLength,
  MM_PER_INCH,
  mmToUnit,
  N_PER_LBF,
  NM_PER_LBF_FT,
  quantityFileUnit,
  quantityToUnit,
  quantityUnitOf,
  unitToMm,
  unitToQuantity,
} from '../../../shared/units';

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

/**
 * The pound-force by its definition: the international avoirdupois pound is 0.45359237 kg exactly
 * (international yard and pound agreement, 1959) and standard gravity 9.80665 m/s² exactly (3rd CGPM,
 * 1901). NIST SP 811 (2008), appendix B.8 (factors for units listed alphabetically), lists 1 lbf =
 * 4.448 222 N, 1 lbf/in = 175.1268 N/m and 1 lbf·ft = 1.355 818 N·m from them (the table's rounded
 * digits quoted from memory, unverified; the exact checks use the definitions alone).
 */
describe('the inch-pound units of force, rate and torque', () => {
  const KG_PER_LB = 0.45359237;
  const STANDARD_GRAVITY = 9.80665;
  const M_PER_FT = 0.3048;

  it('take the pound-force from the pound and standard gravity', () => {
    expect(N_PER_LBF).toBe(4.4482216152605);
    expect(N_PER_LBF).toBeCloseTo(KG_PER_LB * STANDARD_GRAVITY, 13);
    // NIST SP 811 appendix B.8, rounded to its seven digits.
    expect(N_PER_LBF).toBeCloseTo(4.448222, 6);
  });

  it('take the lbf·ft as a pound-force at a foot (0.3048 m)', () => {
    expect(NM_PER_LBF_FT).toBeCloseTo(KG_PER_LB * STANDARD_GRAVITY * M_PER_FT, 14);
    // The exact product 1.3558179483314004, to 13 decimals.
    expect(NM_PER_LBF_FT).toBeCloseTo(1.3558179483314, 13);
    // NIST SP 811 appendix B.8: 1 lbf·ft = 1.355 818 N·m.
    expect(NM_PER_LBF_FT).toBeCloseTo(1.355818, 6);
  });

  it('convert each kind by its definition, and back', () => {
    // 1 lbf/in = 4.4482216152605 N / 25.4 mm; NIST SP 811 appendix B.8: 175.1268 N/m = 0.1751268 N/mm.
    expect(unitToQuantity(1, 'rate', 'in')).toBeCloseTo(0.1751268, 7);
    expect(unitToQuantity(1, 'rate', 'in')).toBeCloseTo((KG_PER_LB * STANDARD_GRAVITY) / 25.4, 15);
    expect(unitToQuantity(1, 'force', 'in')).toBeCloseTo(KG_PER_LB * STANDARD_GRAVITY, 13);
    expect(unitToQuantity(1, 'torque', 'in')).toBeCloseTo(KG_PER_LB * STANDARD_GRAVITY * M_PER_FT, 14);
    expect(unitToQuantity(1, 'angularRate', 'in')).toBeCloseTo(KG_PER_LB * STANDARD_GRAVITY * M_PER_FT, 14);
    for (const q of ['length', 'rate', 'force', 'torque', 'angularRate'] as const) {
      for (const v of [0.001, 1, 38, 4000, 1e6]) {
        // Relative round-off of two floating-point operations.
        expect(Math.abs(unitToQuantity(quantityToUnit(v, q, 'in'), q, 'in') - v)).toBeLessThan(1e-14 * v);
      }
      expect(quantityToUnit(38, q, 'mm')).toBe(38);
    }
  });

  it('name the units of each kind in both systems, the file keeping its own', () => {
    expect(quantityUnitOf('rate', 'in')).toBe('lbf/in');
    expect(quantityUnitOf('force', 'in')).toBe('lbf');
    expect(quantityUnitOf('torque', 'in')).toBe('lbf·ft');
    expect(quantityUnitOf('torque', 'mm')).toBe('N·m');
    for (const [q, file] of [
      ['length', 'mm'],
      ['rate', 'N/mm'],
      ['force', 'N'],
      ['torque', 'N·m'],
    ] as const)
      expect(quantityFileUnit(q)).toBe(file);
  });
});
