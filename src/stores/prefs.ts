import { defineStore } from 'pinia';
import { Dark } from 'quasar';
import { computed } from 'vue';
import { useStorage, type UseStorageOptions } from '@vueuse/core';
import { unitToMm, type LengthUnit, type Mm } from '../../shared/units';
import type { EditResult } from './editResult';

/** Storage keys: users keep their settings across visits, so these and their encodings never change. */
export const UNITS_KEY = 'arcwright.units';
export const DARK_KEY = 'arcwright.dark';
export const SNAP_KEY = 'arcwright.board.snap';

/** Snap and nudge steps a new user starts with, in each display unit. */
export const DEFAULT_SNAP_STEP = { mm: 5, in: 0.25 } as const;

export interface SnapSettings {
  on: boolean;
  /** the step in each display unit (mm, in) */
  step: { mm: number; in: number };
}

/**
 * Each setting is written when the user changes it (never the default on first visit), at once
 * (flush 'sync'), and read only at start: a change made in another tab shows on the next visit,
 * as before. Storage that is blocked leaves the defaults in place without an error.
 */
function storedOptions<T>(read: (raw: string) => T, write: (value: T) => string): UseStorageOptions<T> {
  return {
    serializer: { read, write },
    writeDefaults: false,
    flush: 'sync',
    listenToStorageChanges: false,
    onError: () => undefined,
  };
}

/** Units are stored as 'mm' or 'in'; anything else reads as mm. */
const readUnits = (raw: string): LengthUnit => (raw === 'in' ? 'in' : 'mm');
/** Dark mode is stored as '1' or '0'. */
const readDark = (raw: string): boolean => raw === '1';
/** Snap is stored as JSON; a missing or unusable part reads as its default. */
function readSnap(raw: string): SnapSettings {
  try {
    const parsed = JSON.parse(raw) as Partial<SnapSettings> | null;
    const mm = Number(parsed?.step?.mm);
    const inch = Number(parsed?.step?.in);
    return {
      on: parsed?.on ?? true,
      step: { mm: mm > 0 ? mm : DEFAULT_SNAP_STEP.mm, in: inch > 0 ? inch : DEFAULT_SNAP_STEP.in },
    };
  } catch {
    return defaultSnap();
  }
}
const defaultSnap = (): SnapSettings => ({ on: true, step: { ...DEFAULT_SNAP_STEP } });

/**
 * The user's display and drawing preferences, kept in localStorage across visits: units, dark
 * mode, and the board's snap. Files and the API stay in mm.
 */
export const usePrefsStore = defineStore('prefs', () => {
  const units = useStorage<LengthUnit>(UNITS_KEY, 'mm', undefined, storedOptions(readUnits, String));
  const dark = useStorage<boolean>(
    DARK_KEY,
    false,
    undefined,
    storedOptions(readDark, (d) => (d ? '1' : '0')),
  );
  const snap = useStorage<SnapSettings>(SNAP_KEY, defaultSnap(), undefined, storedOptions(readSnap, JSON.stringify));

  function setUnits(next: LengthUnit) {
    units.value = next;
  }
  function toggleUnits() {
    setUnits(units.value === 'mm' ? 'in' : 'mm');
  }
  function setDark(next: boolean) {
    dark.value = next;
    applyDark();
  }
  function applyDark() {
    Dark.set(dark.value);
  }

  const snapOn = computed(() => snap.value.on);
  /** Snap step in the user's unit. */
  const snapStep = computed(() => snap.value.step[units.value]);
  const snapStepMm = computed<Mm>(() => unitToMm(snapStep.value, units.value));

  function setSnap(on: boolean) {
    snap.value = { ...snap.value, on };
  }
  /** Sets the snap step in the user's unit; refuses a step that is not a positive number. */
  function setSnapStep(step: number): EditResult {
    if (!(Number.isFinite(step) && step > 0)) return { ok: false, error: 'The snap step must be a positive number.' };
    snap.value = { ...snap.value, step: { ...snap.value.step, [units.value]: step } };
    return { ok: true };
  }

  return {
    units,
    dark,
    snapOn,
    snapStep,
    snapStepMm,
    setUnits,
    toggleUnits,
    setDark,
    applyDark,
    setSnap,
    setSnapStep,
  };
});
