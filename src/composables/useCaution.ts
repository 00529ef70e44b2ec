/**
 * The product's caution on the board (its words are in src/board/caution.ts): shown once per user,
 * dismissible, and always reachable from the board's menu. Which users have dismissed it is
 * kept in localStorage, so it stays dismissed across visits on this browser.
 */
import { computed, ref } from 'vue';
import { useSessionStore } from '../stores/session';

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
const cautionDialogOpen = ref(false);

/**
 * The caution as the signed-in user (or a guest) sees it: whether they have dismissed it, the
 * dismissal, and the full caution's dialog.
 */
export function useCaution() {
  const session = useSessionStore();
  const userKey = computed(() => (session.user ? String(session.user.id) : 'guest'));
  return {
    seen: computed(() => cautionSeen(userKey.value)),
    dismiss: () => markCautionSeen(userKey.value),
    dialogOpen: cautionDialogOpen,
  };
}
