import { defineStore } from 'pinia';
import { api, ApiError, resetCsrfToken } from '../api/http';
import type { User } from '../api/types';

/** Who is signed in. The only place that changes the client's idea of the session. */
export const useSessionStore = defineStore('session', {
  state: () => ({
    user: null as User | null,
    /** True once the server has been asked who we are. */
    checked: false,
  }),
  getters: {
    signedIn: (s) => s.user !== null,
    isAdmin: (s) => s.user?.role === 'admin',
    isInstructor: (s) => s.user?.role === 'instructor' || s.user?.role === 'admin',
  },
  actions: {
    async refresh(): Promise<User | null> {
      try {
        const { user } = await api.get<{ user: User }>('/api/auth/me');
        this.user = user;
      } catch (err) {
        if (!(err instanceof ApiError) || err.status !== 401) throw err;
        this.user = null;
      } finally {
        this.checked = true;
      }
      return this.user;
    },
    async ensureChecked(): Promise<User | null> {
      return this.checked ? this.user : this.refresh();
    },
    async login(email: string, password: string) {
      const { user } = await api.post<{ user: User }>('/api/auth/login', { email, password });
      resetCsrfToken(); // the session id changed at sign-in
      this.user = user;
      this.checked = true;
    },
    async signup(name: string, email: string, password: string) {
      const { user } = await api.post<{ user: User }>('/api/auth/signup', { name, email, password });
      resetCsrfToken();
      this.user = user;
      this.checked = true;
    },
    async logout() {
      try {
        await api.post('/api/auth/logout');
      } finally {
        resetCsrfToken();
        this.user = null;
      }
    },
  },
});
