/**
 * axe-core on every screen, in the light and the dark theme: no serious or critical finding.
 * The screens are listed in a11yScreens.ts.
 */
import { test, expect, type APIRequestContext, type Browser, type BrowserContext, type Page } from '@playwright/test';
import { starters } from '../../shared/kinematics';
import { DARK_KEY } from '../../src/stores/prefs';
import { csrf } from './api';
import { expectAccessible } from './axe';
import { BOARD_LAYOUTS, PHONE, SCREENS, type BoardLayout, type Made, type Viewer } from './a11yScreens';
import { DEMO, inputOf } from './fixtures';

type SavedState = Awaited<ReturnType<BrowserContext['storageState']>>;

const signedIn: Partial<Record<Viewer, SavedState>> = {};
let made: Made;

async function signedInState(browser: Browser, baseURL: string | undefined, who: keyof typeof DEMO) {
  const context = await browser.newContext({ baseURL });
  const page = await context.newPage();
  await page.goto('/signin');
  await inputOf(page, 'email').fill(DEMO[who].email);
  await inputOf(page, 'password').fill(DEMO[who].password);
  await page.getByTestId('submit').click();
  // Signing in hashes the password on purpose slowly; on a busy machine that takes more than the usual wait.
  await expect(page).toHaveURL(/\/library/, { timeout: 45_000 });
  return { context, page, state: await context.storageState() };
}

/** The demo class (by its name) and its assignment (the one whose title starts "Lab 3"), as the instructor sees them. */
async function demoClass(request: APIRequestContext): Promise<{ classId: number; assignmentId: number }> {
  const list = await request.get('/api/classes');
  expect(list.status()).toBe(200);
  const { items } = (await list.json()) as { items: { id: number; name: string }[] };
  const klass = items.find((c) => c.name === 'Chassis Design 210');
  expect(klass, 'the demo class').toBeTruthy();
  const detail = await request.get(`/api/classes/${klass!.id}`);
  const { assignments } = (await detail.json()) as { assignments: { id: number; title: string }[] };
  const lab = assignments.find((a) => a.title.startsWith('Lab 3'));
  expect(lab, 'the demo assignment').toBeTruthy();
  return { classId: klass!.id, assignmentId: lab!.id };
}

/** Invites a new address to the class and reads the invitation's path from its mail in the outbox (as the admin). */
async function invitation(instructor: APIRequestContext, admin: APIRequestContext, classId: number): Promise<string> {
  const email = `lee.fennick.${Date.now()}@example.test`;
  const sent = await instructor.post(`/api/classes/${classId}/invites`, {
    data: { emails: email },
    headers: { 'X-CSRF-Token': await csrf(instructor) },
  });
  expect(sent.status()).toBe(200);
  let path: string | undefined;
  await expect
    .poll(async () => {
      const outbox = await admin.get('/api/admin/outbox');
      const { items } = (await outbox.json()) as { items: { to: string; text: string }[] };
      path = items.find((m) => m.to.includes(email))?.text.match(/\/invites\/[A-Za-z0-9_%-]+/)?.[0];
      return path;
    }, 'the invitation mail')
    .toBeTruthy();
  return path!;
}

test.beforeAll(async ({ browser, baseURL }) => {
  // Five sign-ins, each hashing a password on purpose slowly, and the sketches made: on a busy machine, minutes.
  test.setTimeout(300_000);
  const admin = await signedInState(browser, baseURL, 'admin');
  signedIn.admin = admin.state;
  const instructor = await signedInState(browser, baseURL, 'instructor');
  signedIn.instructor = instructor.state;
  const classwork = await demoClass(instructor.page.request);
  const invitePath = await invitation(instructor.page.request, admin.page.request, classwork.classId);
  await instructor.context.close();
  await admin.context.close();
  const student = await signedInState(browser, baseURL, 'student');
  signedIn.student = student.state;
  await student.context.close();

  const maker = await signedInState(browser, baseURL, 'maker');
  signedIn.maker = maker.state;
  const headers = { 'X-CSRF-Token': await csrf(maker.page.request) };
  const sketch = {} as Record<BoardLayout, number>;
  for (const layout of BOARD_LAYOUTS) {
    const document = starters[layout]!.build();
    const res = await maker.page.request.post('/api/sketches', { data: { name: document.name, document }, headers });
    expect(res.status()).toBe(201);
    sketch[layout] = ((await res.json()) as { id: number }).id;
  }
  const share = await maker.page.request.post(`/api/sketches/${sketch['four-link-lateral-rod']}/share`, {
    data: { mode: 'link' },
    headers,
  });
  expect(share.status()).toBe(200);
  made = { sketch, sharedToken: ((await share.json()) as { shareToken: string }).shareToken, ...classwork, invitePath };
  await maker.context.close();
});

/** Waits for CSS transitions (a dialog fading in, a drawer sliding) to end: axe reads colours as they stand. */
async function transitionsDone(page: Page): Promise<void> {
  await page.evaluate(() =>
    Promise.all(
      document
        .getAnimations()
        .filter((a) => a instanceof CSSTransition)
        .map((a) => a.finished.catch(() => undefined)),
    ),
  );
}

for (const theme of ['light', 'dark'] as const) {
  for (const screen of SCREENS) {
    test(`${screen.name}, ${theme} theme`, async ({ browser, baseURL }) => {
      // A board sweeps its sketch and axe reads a few thousand elements: on a busy machine that takes a while.
      test.setTimeout(150_000);
      const context = await browser.newContext({
        baseURL,
        storageState: screen.as === 'guest' ? undefined : signedIn[screen.as],
        viewport: screen.phone ? PHONE : undefined,
      });
      try {
        // The theme is the stored preference, read when the app starts.
        await context.addInitScript(([key, value]) => localStorage.setItem(key, value), [
          DARK_KEY,
          theme === 'dark' ? '1' : '0',
        ] as const);
        const page = await context.newPage();
        await screen.open(page, made);
        await expect(page.locator('body')).toHaveClass(theme === 'dark' ? /body--dark/ : /body--light/);
        await transitionsDone(page);
        await expectAccessible(page, `${screen.name} (${theme} theme)`);
      } finally {
        await context.close();
      }
    });
  }
}
