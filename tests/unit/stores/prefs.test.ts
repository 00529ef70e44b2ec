// @vitest-environment happy-dom
/**
 * Preferences are kept in localStorage under keys and encodings users already have: these tests
 * write the stored strings by hand (as an earlier visit left them) and read what a change stores.
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { DARK_KEY, SNAP_KEY, UNITS_KEY, usePrefsStore } from '../../../src/stores/prefs';
import { CAUTION_SEEN_KEY_PREFIX, cautionSeen, markCautionSeen } from '../../../src/composables/useCaution';
import { MM_PER_INCH } from '../../../shared/units';

/** A fresh store, as on a new page load. */
function freshPrefs() {
  setActivePinia(createPinia());
  return usePrefsStore();
}

describe('preferences in localStorage', () => {
  beforeEach(() => localStorage.clear());

  it('keeps the storage keys users already have', () => {
    expect([UNITS_KEY, DARK_KEY, SNAP_KEY]).toEqual(['arcwright.units', 'arcwright.dark', 'arcwright.board.snap']);
    expect(CAUTION_SEEN_KEY_PREFIX).toBe('arcwright.caution-seen.');
  });

  it('a first visit starts in mm, light, snap on at 5 mm / 0.25 in, and stores nothing', () => {
    const prefs = freshPrefs();
    expect(prefs.units).toBe('mm');
    expect(prefs.dark).toBe(false);
    expect(prefs.snapOn).toBe(true);
    expect(prefs.snapStep).toBe(5);
    expect(localStorage.length).toBe(0);
    prefs.setUnits('in');
    expect(prefs.snapStep).toBe(0.25);
  });

  it('reads what an earlier visit stored', () => {
    localStorage.setItem(UNITS_KEY, 'in');
    localStorage.setItem(DARK_KEY, '1');
    localStorage.setItem(SNAP_KEY, JSON.stringify({ on: false, step: { mm: 10, in: 0.5 } }));
    const prefs = freshPrefs();
    expect(prefs.units).toBe('in');
    expect(prefs.dark).toBe(true);
    expect(prefs.snapOn).toBe(false);
    expect(prefs.snapStep).toBe(0.5);
    // 0.5 in is 12.7 mm (1 in = 25.4 mm exactly, by definition).
    expect(prefs.snapStepMm).toBeCloseTo(0.5 * MM_PER_INCH, 9);
    expect(prefs.snapStepMm).toBeCloseTo(12.7, 9);
  });

  it('reads unusable stored values as the defaults', () => {
    localStorage.setItem(UNITS_KEY, 'furlongs');
    localStorage.setItem(DARK_KEY, 'true');
    localStorage.setItem(SNAP_KEY, '{not json');
    let prefs = freshPrefs();
    expect(prefs.units).toBe('mm');
    expect(prefs.dark).toBe(false);
    expect(prefs.snapOn).toBe(true);
    expect(prefs.snapStep).toBe(5);
    localStorage.setItem(SNAP_KEY, JSON.stringify({ on: false, step: { mm: -3, in: 'x' } }));
    prefs = freshPrefs();
    expect(prefs.snapOn).toBe(false);
    expect(prefs.snapStep).toBe(5);
    prefs.setUnits('in');
    expect(prefs.snapStep).toBe(0.25);
  });

  it('stores each change at once in the same encodings', () => {
    const prefs = freshPrefs();
    prefs.setUnits('in');
    expect(localStorage.getItem(UNITS_KEY)).toBe('in');
    prefs.toggleUnits();
    expect(localStorage.getItem(UNITS_KEY)).toBe('mm');
    prefs.setDark(true);
    expect(localStorage.getItem(DARK_KEY)).toBe('1');
    prefs.setDark(false);
    expect(localStorage.getItem(DARK_KEY)).toBe('0');
    prefs.setSnap(false);
    expect(JSON.parse(localStorage.getItem(SNAP_KEY)!)).toEqual({ on: false, step: { mm: 5, in: 0.25 } });
    expect(prefs.setSnapStep(2)).toEqual({ ok: true });
    prefs.setUnits('in');
    prefs.setSnapStep(0.1);
    expect(JSON.parse(localStorage.getItem(SNAP_KEY)!)).toEqual({ on: false, step: { mm: 2, in: 0.1 } });
    // What was stored is what the next visit reads.
    const next = freshPrefs();
    expect(next.units).toBe('in');
    expect(next.snapStep).toBe(0.1);
    expect(next.snapOn).toBe(false);
  });

  it('refuses a snap step that is not a positive number and stores nothing for it', () => {
    const prefs = freshPrefs();
    for (const bad of [0, -1, Number.NaN, Number.POSITIVE_INFINITY]) {
      const r = prefs.setSnapStep(bad);
      expect(r).toEqual({ ok: false, error: 'The snap step must be a positive number.' });
    }
    expect(localStorage.getItem(SNAP_KEY)).toBeNull();
    expect(prefs.snapStep).toBe(5);
  });

  it('the caution stays dismissed per user under its own key', () => {
    // Users unique to this test: dismissals are kept for the whole page.
    localStorage.setItem(`${CAUTION_SEEN_KEY_PREFIX}prefs-test-earlier`, '1');
    expect(cautionSeen('prefs-test-earlier')).toBe(true);
    expect(cautionSeen('prefs-test-new')).toBe(false);
    expect(localStorage.getItem(`${CAUTION_SEEN_KEY_PREFIX}prefs-test-new`)).toBeNull();
    markCautionSeen('prefs-test-new');
    expect(cautionSeen('prefs-test-new')).toBe(true);
    expect(localStorage.getItem(`${CAUTION_SEEN_KEY_PREFIX}prefs-test-new`)).toBe('1');
    expect(cautionSeen('prefs-test-other')).toBe(false);
  });
});
