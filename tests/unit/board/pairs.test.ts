import { describe, expect, it } from 'vitest';
import { findPairs, mirrorBody, oppositeId } from '../../../src/stores/board/pairs';
import { fourLink } from './fixture';

describe('oppositeId', () => {
  it('swaps a trailing side mark', () => {
    expect(oppositeId('LL.fl')).toBe('LL.fr');
    expect(oppositeId('WC.r')).toBe('WC.l');
    expect(oppositeId('UCA-left')).toBe('UCA-right');
    expect(oppositeId('A.R')).toBe('A.L');
    expect(oppositeId('DS.pa')).toBeNull();
    expect(oppositeId('l')).toBeNull();
  });
});

describe('mirrorBody', () => {
  it('swaps arms and knuckles, keeps frame and axle', () => {
    expect(mirrorBody('arm-left')).toBe('arm-right');
    expect(mirrorBody('knuckle-right')).toBe('knuckle-left');
    expect(mirrorBody('frame')).toBe('frame');
    expect(mirrorBody('axle')).toBe('axle');
  });
});

describe('findPairs', () => {
  it('pairs left and right pivots by name, both ways, and leaves central ones alone', () => {
    const pairs = findPairs(fourLink().points);
    expect(pairs.get('LL.fl')).toBe('LL.fr');
    expect(pairs.get('LL.fr')).toBe('LL.fl');
    expect(pairs.get('WC.l')).toBe('WC.r');
    expect(pairs.has('DS.p')).toBe(false);
    expect(pairs.has('LR.f')).toBe(false);
  });

  it('pairs unnamed pivots placed as mirror images, but not those on the centre plane', () => {
    const pairs = findPairs([
      { id: 'P1', body: 'frame', x: 100, y: 300, z: 200 },
      { id: 'P2', body: 'frame', x: 100, y: -300, z: 200 },
      { id: 'C1', body: 'frame', x: 0, y: 0, z: 0 },
      { id: 'C2', body: 'frame', x: 0, y: 0, z: 0 },
      { id: 'Q1', body: 'arm-left', x: 5, y: 400, z: 9 },
      { id: 'Q2', body: 'axle', x: 5, y: -400, z: 9 },
    ]);
    expect(pairs.get('P1')).toBe('P2');
    expect(pairs.has('C1')).toBe(false);
    // An arm point and an axle point are not mirror images of each other.
    expect(pairs.has('Q1')).toBe(false);
  });

  it('does not pair by name across bodies that are not mirror images', () => {
    const pairs = findPairs([
      { id: 'X.l', body: 'frame', x: 0, y: 1, z: 0 },
      { id: 'X.r', body: 'axle', x: 0, y: -1, z: 0 },
    ]);
    expect(pairs.size).toBe(0);
  });
});
