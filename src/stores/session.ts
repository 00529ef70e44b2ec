import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { api, ApiError, resetCsrfToken } from '../api/http';
import type { User } from '../api/types';

/** Who is signed in. The only place that changes the client's idea of the session. */
export const useSessionStore = defineStore('session', () => {
  const user = ref<User | null>(null);
  /** True once the server has been asked who we are. */
  const checked = ref(false);

  const signedIn = computed(() => user.value !== null);
  const isAdmin = computed(() => user.value?.role === 'admin');
  const isInstructor = computed(() => user.value?.role === 'instructor' || user.value?.role === 'admin');

  async function refresh(): Promise<User | null> {
    try {
      const answer = await api.get<{ user: User }>('/api/auth/me');
      user.value = answer.user;
    } catch (err) {
      if (!(err instanceof ApiError) || err.status !== 401) throw err;
      user.value = null;
    } finally {
      checked.value = true;
    }
    return user.value;
  }

  async function ensureChecked(): Promise<User | null> {
    return checked.value ? user.value : refresh();
  }

  async function login(email: string, password: string) {
    const answer = await api.post<{ user: User }>('/api/auth/login', { email, password });
    resetCsrfToken(); // the session id changed at sign-in
    user.value = answer.user;
    checked.value = true;
  }

  /**
   * Asks for an account. Nobody is signed in: the server mails a link that finishes the sign-up (or, when the
   * address has an account already, a note to its owner) and answers both alike.
   */
  async function signup(name: string, email: string, password: string): Promise<void> {
    await api.post<{ status: string }>('/api/auth/signup', { name, email, password });
  }

  async function logout() {
    try {
      await api.post('/api/auth/logout');
    } finally {
      resetCsrfToken();
      user.value = null;
    }
  }

  return { user, checked, signedIn, isAdmin, isInstructor, refresh, ensureChecked, login, signup, logout };
});
