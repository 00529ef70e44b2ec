import { useQuasar } from 'quasar';
import { errorMessage } from '../api/http';

/** How long a notice with "Undo" stays (ms): long enough to read it and change one's mind. */
const UNDO_MS = 8000;

/**
 * What a screen tells the user around an action taken from a button or a menu: the question before it,
 * a notice once it has worked, and the server's reason when it has not.
 */
export function useNotify() {
  const $q = useQuasar();

  /** The reason an action failed, in a red notice. */
  function failed(err: unknown): void {
    $q.notify({ type: 'negative', message: errorMessage(err) });
  }

  /** A green notice: the action worked. */
  function done(message: string): void {
    $q.notify({ type: 'positive', message });
  }

  /** Runs `action`; a failure is told with `failed`, never thrown. */
  async function attempt(action: () => Promise<unknown>): Promise<void> {
    try {
      await action();
    } catch (err) {
      failed(err);
    }
  }

  /** A notice that the action worked, with "Undo" running `undo` (whose failure is told too). */
  function undoable(message: string, undo: () => Promise<unknown>): void {
    $q.notify({
      message,
      timeout: UNDO_MS,
      actions: [{ label: 'Undo', color: 'accent', handler: () => void attempt(undo) }],
    });
  }

  /**
   * Asks first; on OK runs `action` through `attempt`. The OK button says what it does (`ok`). A red one
   * (the default) cannot be taken back, so the focus starts on Cancel: Enter alone must not do it.
   */
  function confirm(
    ask: { title: string; message: string; ok: string; color?: 'negative' | 'primary' },
    action: () => Promise<unknown>,
  ): void {
    $q.dialog({
      title: ask.title,
      message: ask.message,
      cancel: true,
      ok: { label: ask.ok, color: ask.color ?? 'negative', flat: true },
      focus: (ask.color ?? 'negative') === 'negative' ? 'cancel' : 'ok',
    }).onOk(() => void attempt(action));
  }

  return { failed, done, attempt, undoable, confirm };
}
