import { defineStore } from 'pinia';
import { api } from '../api/http';
import type { AdminUser, OutboxMessage, Role } from '../api/types';

/** Site administration: accounts and the outgoing mail log. */
export const useAdminStore = defineStore('admin', {
  state: () => ({
    users: [] as AdminUser[],
    outbox: [] as OutboxMessage[],
    loading: false,
  }),
  actions: {
    async loadUsers() {
      this.loading = true;
      try {
        this.users = (await api.get<{ items: AdminUser[] }>('/api/admin/users')).items;
      } finally {
        this.loading = false;
      }
    },
    async updateUser(id: number, patch: { role?: Role; disabled?: boolean }) {
      await api.patch(`/api/admin/users/${id}`, patch);
      await this.loadUsers();
    },
    async loadOutbox() {
      this.loading = true;
      try {
        this.outbox = (await api.get<{ items: OutboxMessage[] }>('/api/admin/outbox')).items;
      } finally {
        this.loading = false;
      }
    },
  },
});
