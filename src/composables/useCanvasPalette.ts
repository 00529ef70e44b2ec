/** The board's canvas colours for the page's present theme (light or dark, from the preferences). */
import { computed } from 'vue';
import { usePrefsStore } from '../stores/prefs';
import { DARK_PALETTE, LIGHT_PALETTE, type CanvasPalette } from '../canvas/palette';

export function useCanvasPalette() {
  const prefs = usePrefsStore();
  return computed<CanvasPalette>(() => (prefs.dark ? DARK_PALETTE : LIGHT_PALETTE));
}
