/**
 * A hand-in's key numbers in the user's unit. Expected texts use 1 in = 25.4 mm exactly (the international
 * inch, 1959 agreement) and the unchanged degree and percent; signs follow the registry (a change from ride
 * carries its sign, a reading at ride does not).
 */
import { describe, expect, it } from 'vitest';
import { keyColumns, keyNumberLabel, showKeyNumber } from '../../../src/classes/keyNumbers';
import type { KeyNumber } from '../../../shared/schema/classes';
import { handInRow, solidAxleKeys } from './fixtures';

const MINUS = '\u2212';
const key = (over: Partial<KeyNumber>): KeyNumber => ({
  key: 'lateralShift',
  label: 'Lateral shift',
  at: 'bump',
  value: 25.4,
  unit: 'mm',
  ...over,
});

describe('showKeyNumber', () => {
  it('shows a length change in mm or in inches, with its sign (25.4 mm is one inch)', () => {
    expect(showKeyNumber(key({}), 'mm').text).toBe('+25.4 mm');
    expect(showKeyNumber(key({}), 'in').text).toBe('+1.00 in');
    expect(showKeyNumber(key({ value: -12.7 }), 'in').text).toBe(`${MINUS}0.50 in`);
  });

  it('shows angles and percentages alike in both unit systems', () => {
    const pinion = key({ key: 'pinionAngleChange', label: 'Pinion angle change', value: -2.345, unit: '°' });
    expect(showKeyNumber(pinion, 'mm').text).toBe(`${MINUS}2.35°`);
    expect(showKeyNumber(pinion, 'in').text).toBe(`${MINUS}2.35°`);
    const antiSquat = key({ key: 'antiSquat', label: 'Anti-squat', at: 'ride', value: 61.26, unit: '%' });
    expect(showKeyNumber(antiSquat, 'in').text).toBe('61.3 %');
    // Articulation is read over the whole sweep, to one digit.
    const articulation = key({
      key: 'articulation',
      label: 'Articulation',
      at: 'articulation',
      value: 8.26,
      unit: '°',
    });
    expect(showKeyNumber(articulation, 'mm').text).toBe('8.3°');
  });

  it('shows a missing number as a dash with the reason, never NaN', () => {
    const shown = showKeyNumber(key({ value: null }), 'in');
    expect(shown.text).toBe('—');
    expect(shown.reason).toMatch(/not defined/i);
  });

  it('shows a quantity it does not know by its unit', () => {
    expect(showKeyNumber(key({ key: 'newReading', label: 'New reading', value: 50.8 }), 'in').text).toBe('2.00 in');
    expect(showKeyNumber(key({ key: 'newRatio', label: 'New ratio', value: 0.5, unit: 'x' }), 'mm').text).toBe(
      '0.50 x',
    );
  });
});

describe('keyNumberLabel', () => {
  it('says where along the travel, and nothing more for a whole-sweep reading', () => {
    expect(keyNumberLabel({ label: 'Toe change', at: 'bump' })).toBe('Toe change at full bump');
    expect(keyNumberLabel({ label: 'Articulation', at: 'articulation' })).toBe('Articulation');
  });
});

describe('keyColumns', () => {
  it('gives one column per quantity and point of the travel, in the order the rows bring them', () => {
    const rows = [
      handInRow(1),
      handInRow(2, { keyNumbers: [...solidAxleKeys(50, 2, 7)].reverse() }),
      handInRow(3, {
        keyNumbers: [{ key: 'camberChange', label: 'Camber change', at: 'bump', value: -1.2, unit: '°' }],
      }),
    ];
    expect(keyColumns(rows)).toEqual([
      { id: 'antiSquat@ride', label: 'Anti-squat at ride' },
      { id: 'pinionAngleChange@bump', label: 'Pinion angle change at full bump' },
      { id: 'lateralShift@bump', label: 'Lateral shift at full bump' },
      { id: 'articulation@articulation', label: 'Articulation' },
      { id: 'camberChange@bump', label: 'Camber change at full bump' },
    ]);
  });
});
