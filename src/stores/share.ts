import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { api, errorMessage } from '../api/http';
import type { ShareState } from '../api/types';
import { emailField } from '../../shared/schema/accounts';
import { useLibraryStore } from './library';

/** What the share dialog is doing: nothing, turning the link on, sending it, or revoking it. */
export type ShareAction = 'link' | 'send' | 'revoke';

/**
 * Sharing one sketch by its read-only link (the share dialog): whether the link is live, the link, who it
 * was mailed to; turning it on, mailing it to one address, revoking it. The library's Shared column follows.
 */
export const useShareStore = defineStore('share', () => {
  const sketchId = ref<number | null>(null);
  const state = ref<ShareState | null>(null);
  const loading = ref(false);
  const busy = ref<ShareAction | null>(null);
  /** Why the share state could not be read or changed. */
  const error = ref<string | null>(null);
  /** Why the last send was refused (a bad address, too many sends), shown under the address. */
  const sendProblem = ref<string | null>(null);

  const live = computed(() => state.value?.share === 'link' && state.value.url !== null);
  const url = computed(() => (live.value ? state.value!.url : null));
  const recipients = computed(() => state.value?.recipients ?? []);

  const path = () => `/api/sketches/${sketchId.value}/share`;

  function apply(next: ShareState) {
    state.value = next;
    if (sketchId.value !== null) useLibraryStore().noteShare(sketchId.value, next.share);
  }

  /** Reads the share state of sketch `id` (the dialog opening). */
  async function open(id: number) {
    sketchId.value = id;
    state.value = null;
    error.value = null;
    sendProblem.value = null;
    loading.value = true;
    try {
      const answer = await api.get<ShareState>(path());
      if (sketchId.value === id) state.value = answer;
    } catch (err) {
      if (sketchId.value === id) error.value = errorMessage(err);
    } finally {
      loading.value = false;
    }
  }

  async function change(action: ShareAction, body: { mode: 'link' | 'private'; email?: string }): Promise<boolean> {
    if (sketchId.value === null || busy.value) return false;
    busy.value = action;
    error.value = null;
    try {
      apply(await api.post<ShareState>(path(), body));
      return true;
    } catch (err) {
      if (action === 'send') sendProblem.value = errorMessage(err);
      else error.value = errorMessage(err);
      return false;
    } finally {
      busy.value = null;
    }
  }

  /** Turns the read-only link on (a new link; the one already live is kept). */
  const createLink = () => change('link', { mode: 'link' });

  /**
   * Mails the link to one address: one message per call. A bad address is refused here with the
   * problem named, and nothing is sent. Resolves to whether the mail was sent.
   */
  async function send(address: string): Promise<boolean> {
    const parsed = emailField.safeParse(address);
    if (!parsed.success) {
      const typed = address.trim();
      sendProblem.value = typed ? `E-mail address: “${typed}” is not an e-mail address.` : 'E-mail address: type one.';
      return false;
    }
    sendProblem.value = null;
    return change('send', { mode: 'link', email: parsed.data });
  }

  /** Revokes the link: it stops working for everyone who has it. */
  const revoke = () => change('revoke', { mode: 'private' });

  function clearSendProblem() {
    sendProblem.value = null;
  }

  return {
    sketchId,
    state,
    loading,
    busy,
    error,
    sendProblem,
    live,
    url,
    recipients,
    open,
    createLink,
    send,
    revoke,
    clearSendProblem,
  };
});
