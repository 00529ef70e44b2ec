import { ref } from 'vue';
import { errorMessage } from '../api/http';

/**
 * A task a screen runs and shows in place: `busy` while it runs (a spinner, a button's loading), `problem`
 * once it fails (a banner, a page's message). `describe` words a failure; the server's reason by default.
 */
export function useTask(describe: (err: unknown) => string = errorMessage) {
  const busy = ref(false);
  const problem = ref<string | null>(null);

  /** Runs `action`; a failure is kept in `problem`, never thrown. */
  async function run(action: () => Promise<unknown>): Promise<void> {
    busy.value = true;
    problem.value = null;
    try {
      await action();
    } catch (err) {
      problem.value = describe(err);
    } finally {
      busy.value = false;
    }
  }

  return { busy, problem, run };
}
