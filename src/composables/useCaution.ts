/**
 * The product's caution on the board (its words are in shared/display/caution.ts): shown once per user,
 * dismissible, and always reachable from the board's menu. Which users have dismissed it is
 * kept in local storage, so it stays dismissed across visits on this browser.
 */
import { computed, effectScope, ref, type Ref } from 'vue';
import { useStorage } from '@vueuse/core';
import { useSessionStore } from '../stores/session';

/** Storage key of one user's dismissal (the user's id, or 'guest'); stored as '1' once dismissed. */
export const CAUTION_SEEN_KEY_PREFIX = 'arcwright.caution-seen.';

/**
 * One stored flag a user, shared by every caution on screen (so they all hide at once). They
 * live for the page, not for the component that first asked. Blocked storage reads as not seen
 * (show it again rather than hide it) and a dismissal then holds for this visit only.
 */
const seenByUser = new Map<string, Ref<boolean>>();
const scope = effectScope(true);

function seenFlag(user: string): Ref<boolean> {
  let flag = seenByUser.get(user);
  if (!flag) {
    flag = scope.run(() =>
      useStorage<boolean>(CAUTION_SEEN_KEY_PREFIX + user, false, undefined, {
        serializer: { read: (raw) => raw === '1', write: (seen) => (seen ? '1' : '0') },
        writeDefaults: false,
        flush: 'sync',
        listenToStorageChanges: false,
        onError: () => undefined,
      }),
    )!;
    seenByUser.set(user, flag);
  }
  return flag;
}

/** True once this user has dismissed the caution. */
export function cautionSeen(user: string): boolean {
  return seenFlag(user).value;
}

/** Records the dismissal for this user. */
export function markCautionSeen(user: string): void {
  seenFlag(user).value = true;
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
