import { computed, watch } from 'vue';
import { useRoute } from 'vue-router';
import { ApiError, errorMessage } from '../api/http';
import { useTask } from './useTask';

/**
 * Loads what the route's `:id` names whenever the id changes, while the route named `routeName` shows.
 * `loading` and `problem` are the page's states; a 404 or 403 reads `missing` (one text for both, so a
 * page tells no one whether something they may not see exists).
 */
export function useLoadById(routeName: string, load: (id: number) => Promise<unknown>, missing: string) {
  const route = useRoute();
  const id = computed(() => Number(route.params.id));
  const task = useTask((err) =>
    err instanceof ApiError && (err.status === 404 || err.status === 403) ? missing : errorMessage(err),
  );
  watch(
    id,
    () => {
      // Leaving the page changes the params too: nothing is loaded for the next page's id.
      if (route.name === routeName) void task.run(() => load(id.value));
    },
    { immediate: true },
  );
  return { id, loading: task.busy, problem: task.problem };
}
