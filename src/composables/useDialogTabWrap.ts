/** While the app is mounted, Tab and Shift+Tab go round inside an open dialog (see keyboard/dialogTab.ts). */
import { useEventListener } from '@vueuse/core';
import { onDialogTab } from '../keyboard/dialogTab';

export function useDialogTabWrap(): void {
  useEventListener(document, 'keydown', onDialogTab);
}
