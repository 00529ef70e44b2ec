// @vitest-environment happy-dom
/**
 * The composables the class screens share: a task's busy state and problem (useTask), the page loaded by its
 * route's id with one text for "missing or not yours" (useLoadById), and the notices and questions around an
 * action (useNotify). Each is run inside a small component, with promises the test settles itself.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { defineComponent, h, nextTick } from 'vue';
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils';
import { createMemoryHistory, createRouter } from 'vue-router';
import { Dialog, Notify, Quasar, useQuasar } from 'quasar';
import { ApiError } from '../../../src/api/http';
import { useTask } from '../../../src/composables/useTask';
import { useLoadById } from '../../../src/composables/useLoadById';
import { useNotify } from '../../../src/composables/useNotify';

/** A promise the test settles when it likes. */
function deferred() {
  let resolve!: () => void;
  let reject!: (err: unknown) => void;
  const promise = new Promise<void>((res, rej) => {
    resolve = res;
    reject = rej;
  });
  return { promise, resolve, reject };
}

/** Quasar reads the screen orientation at install; happy-dom has none. */
function provideScreenOrientation() {
  if (window.screen.orientation) return;
  Object.defineProperty(window.screen, 'orientation', {
    configurable: true,
    value: { type: 'landscape-primary', angle: 0, addEventListener() {}, removeEventListener() {} },
  });
}

let wrappers: VueWrapper[] = [];
afterEach(() => {
  wrappers.forEach((w) => w.unmount());
  wrappers = [];
});

/** Runs `setup` in a mounted component (with Quasar and `router` when given) and hands back what it returns. */
function run<T>(setup: () => T, plugins: unknown[] = []): T {
  let out!: T;
  const Host = defineComponent({
    setup() {
      out = setup();
      return () => h('div');
    },
  });
  provideScreenOrientation();
  wrappers.push(mount(Host, { global: { plugins: [[Quasar, { plugins: { Notify, Dialog } }], ...plugins] as never } }));
  return out;
}

describe('useTask', () => {
  it('is busy while its action runs, keeps the reason of a failure, and clears it on the next run', async () => {
    const task = run(() => useTask());
    const first = deferred();
    const running = task.run(() => first.promise);
    expect(task.busy.value).toBe(true);
    expect(task.problem.value).toBeNull();
    first.reject(new ApiError(400, 'Name: too long.'));
    await running; // a failure is kept, not thrown
    expect(task.busy.value).toBe(false);
    expect(task.problem.value).toBe('Name: too long.');

    const second = deferred();
    const again = task.run(() => second.promise);
    expect(task.problem.value).toBeNull();
    second.resolve();
    await again;
    expect(task.problem.value).toBeNull();
    expect(task.busy.value).toBe(false);
  });

  it('words a failure with its own text when given one', async () => {
    const task = run(() => useTask(() => 'Your sketches could not be listed.'));
    await task.run(() => Promise.reject(new Error('boom')));
    expect(task.problem.value).toBe('Your sketches could not be listed.');
  });
});

describe('useLoadById', () => {
  const MISSING = 'This class does not exist, or you are not in it.';

  async function pageAt(path: string, load: (id: number) => Promise<unknown>) {
    const Blank = { render: () => h('div') };
    const router = createRouter({
      history: createMemoryHistory(),
      routes: [
        { path: '/classes/:id', name: 'class', component: Blank },
        { path: '/assignments/:id', name: 'assignment', component: Blank },
      ],
    });
    await router.push(path);
    await router.isReady();
    const page = run(() => useLoadById('class', load, MISSING), [router]);
    return { page, router };
  }

  it('loads the id in the route, and again when it changes, but not for another page', async () => {
    const asked: number[] = [];
    const first = deferred();
    const { page, router } = await pageAt('/classes/7', (id) => {
      asked.push(id);
      return asked.length === 1 ? first.promise : Promise.resolve();
    });
    expect(page.loading.value).toBe(true); // from the first render: the page opens on its spinner
    first.resolve();
    await flushPromises();
    expect(page.loading.value).toBe(false);
    expect(page.id.value).toBe(7);
    await router.push('/classes/9');
    await flushPromises();
    await router.push('/assignments/11'); // leaving: the id changes, but this page loads nothing for it
    await flushPromises();
    expect(asked).toEqual([7, 9]);
  });

  it('says the one "missing" text for a 404 and for a 403, and the server reason otherwise', async () => {
    for (const [err, shown] of [
      [new ApiError(404, 'not found'), MISSING],
      [new ApiError(403, 'not yours'), MISSING],
      [new ApiError(500, 'The database is not answering.'), 'The database is not answering.'],
    ] as const) {
      const { page } = await pageAt('/classes/3', () => Promise.reject(err));
      await flushPromises();
      expect(page.problem.value).toBe(shown);
      expect(page.loading.value).toBe(false);
    }
  });
});

describe('useNotify', () => {
  it('tells a failure with the server reason, in red, and does not throw it', async () => {
    const { notify, $q } = run(() => ({ notify: useNotify(), $q: useQuasar() }));
    const shown = vi.spyOn($q, 'notify');
    await notify.attempt(() => Promise.reject(new ApiError(409, 'The class is closed.')));
    expect(shown).toHaveBeenCalledWith({ type: 'negative', message: 'The class is closed.' });
  });

  it('runs the action only once the question is answered OK', async () => {
    const { notify, $q } = run(() => ({ notify: useNotify(), $q: useQuasar() }));
    let ok: (() => void) | undefined;
    const asked = vi.spyOn($q, 'dialog').mockImplementation(((opts: unknown) => {
      void opts;
      return { onOk: (fn: () => void) => void (ok = fn) };
    }) as never);
    const action = vi.fn(() => Promise.resolve());
    notify.confirm({ title: 'Withdraw the invitation?', message: 'The link stops working.', ok: 'Withdraw' }, action);
    expect(asked).toHaveBeenCalledWith({
      title: 'Withdraw the invitation?',
      message: 'The link stops working.',
      cancel: true,
      ok: { label: 'Withdraw', color: 'negative', flat: true },
      // It cannot be taken back: Enter alone must not do it.
      focus: 'cancel',
    });
    expect(action).not.toHaveBeenCalled();
    ok!();
    await nextTick();
    expect(action).toHaveBeenCalledTimes(1);
  });

  it('starts a question on OK only when OK is not a red, final one', () => {
    const { notify, $q } = run(() => ({ notify: useNotify(), $q: useQuasar() }));
    const asked = vi.spyOn($q, 'dialog').mockImplementation((() => ({ onOk: () => undefined })) as never);
    notify.confirm({ title: 'Hand in your copy?', message: 'It is frozen.', ok: 'Hand in', color: 'primary' }, () =>
      Promise.resolve(),
    );
    expect(asked).toHaveBeenCalledWith(expect.objectContaining({ focus: 'ok' }));
  });

  it('offers Undo on a notice, and tells a failed undo', async () => {
    const { notify, $q } = run(() => ({ notify: useNotify(), $q: useQuasar() }));
    const shown = vi.spyOn($q, 'notify').mockImplementation((() => () => undefined) as never);
    notify.undoable('Deleted “Chassis lab”', () => Promise.reject(new ApiError(404, 'That class is gone.')));
    const first = shown.mock.calls[0]![0] as { message: string; actions: { label: string; handler: () => void }[] };
    expect(first.message).toBe('Deleted “Chassis lab”');
    expect(first.actions.map((a) => a.label)).toEqual(['Undo']);
    first.actions[0]!.handler();
    await flushPromises();
    expect(shown).toHaveBeenLastCalledWith({ type: 'negative', message: 'That class is gone.' });
  });
});
