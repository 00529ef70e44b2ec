import { defineStore } from 'pinia';
import { Dark } from 'quasar';
import type { LengthUnit } from '../../shared/units';

const UNITS_KEY = 'arcwright.units';
const DARK_KEY = 'arcwright.dark';

function readUnits(): LengthUnit {
  return localStorage.getItem(UNITS_KEY) === 'in' ? 'in' : 'mm';
}

/** The user's display preferences, kept in localStorage across visits. Files and the API stay in mm. */
export const usePrefsStore = defineStore('prefs', {
  state: () => ({
    units: readUnits(),
    dark: localStorage.getItem(DARK_KEY) === '1',
  }),
  actions: {
    setUnits(units: LengthUnit) {
      this.units = units;
      localStorage.setItem(UNITS_KEY, units);
    },
    toggleUnits() {
      this.setUnits(this.units === 'mm' ? 'in' : 'mm');
    },
    setDark(dark: boolean) {
      this.dark = dark;
      localStorage.setItem(DARK_KEY, dark ? '1' : '0');
      this.applyDark();
    },
    applyDark() {
      Dark.set(this.dark);
    },
  },
});
