import { defineStore } from 'pinia';
import { ref } from 'vue';
import { api } from '../api/http';
import type { AdminUser, OutboxMessage, Role } from '../api/types';

/** Site administration: accounts and the outgoing mail log. */
export const useAdminStore = defineStore('admin', () => {
  const users = ref<AdminUser[]>([]);
  const outbox = ref<OutboxMessage[]>([]);
  const loading = ref(false);

  async function loadUsers() {
    loading.value = true;
    try {
      users.value = (await api.get<{ items: AdminUser[] }>('/api/admin/users')).items;
    } finally {
      loading.value = false;
    }
  }

  async function updateUser(id: number, patch: { role?: Role; disabled?: boolean }) {
    await api.patch(`/api/admin/users/${id}`, patch);
    await loadUsers();
  }

  async function loadOutbox() {
    loading.value = true;
    try {
      outbox.value = (await api.get<{ items: OutboxMessage[] }>('/api/admin/outbox')).items;
    } finally {
      loading.value = false;
    }
  }

  return { users, outbox, loading, loadUsers, updateUser, loadOutbox };
});
