import { createRouter, createWebHistory } from 'vue-router';
import { routes } from './routes';
import { useSessionStore } from '../stores/session';
import { nextPath } from './next';

export const router = createRouter({
  history: createWebHistory(),
  routes,
});

router.beforeEach(async (to) => {
  const session = useSessionStore();
  const user = await session.ensureChecked().catch(() => null);
  if (to.meta.auth && !user) return { name: 'signin', query: { next: to.fullPath } };
  if (to.meta.admin && user?.role !== 'admin') return { name: 'library' };
  if (to.meta.guest && user) return nextPath(to.query.next);
  return true;
});
