/**
 * The product's caution (the same words as README.md, "Cautions"): shown on the board once per user,
 * dismissible, and always reachable from the board's menu. Which users have dismissed it is
 * kept in localStorage, so it stays dismissed across visits on this browser.
 */
import { ref } from 'vue';

export const CAUTION_TITLE = 'Geometry only';

export const CAUTION_TEXT =
  'Arcwright computes where parts move, not whether they are strong enough. Link, bracket and weld design, ' +
  'rod-end and bushing ratings, and the vehicle’s road legality are for a qualified person and local regulations; ' +
  'a modified suspension must be checked on the vehicle before it is driven.';

const KEY_PREFIX = 'arcwright.caution-seen.';

function read(user: string): boolean {
  try {
    return localStorage.getItem(KEY_PREFIX + user) === '1';
  } catch {
    return false; // storage blocked: show it again rather than hide it
  }
}

/** Dismissals made in this page (so every caution on screen hides at once). */
const dismissed = ref<Record<string, boolean>>({});

/** True once this user has dismissed the caution. */
export function cautionSeen(user: string): boolean {
  return dismissed.value[user] ?? read(user);
}

/** Records the dismissal for this user. */
export function markCautionSeen(user: string): void {
  dismissed.value = { ...dismissed.value, [user]: true };
  try {
    localStorage.setItem(KEY_PREFIX + user, '1');
  } catch {
    // storage blocked: dismissed for this visit only
  }
}

/**
 * Whether the full caution is open. Shared, because the board menu's item asks for it while the
 * dialog itself belongs to the board's own caution (a dialog inside a menu would close with it).
 */
export const cautionDialogOpen = ref(false);
