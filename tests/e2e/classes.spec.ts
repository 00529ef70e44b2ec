/**
 * A term's class from invitation to feedback, in the browser: the demo instructor makes a class and an
 * assignment and invites a new student by e-mail; the student follows the mailed link, makes an account,
 * joins, copies the assignment, drags a pivot and hands in; the instructor sees the hand-in with its key
 * numbers and writes feedback, which arrives in the student's mail and on their assignment page.
 */
import { test as base, expect, type APIRequestContext, type Browser, type Page } from '@playwright/test';
import { DEMO, inputOf, signIn } from './fixtures';
import { csrf } from './api';
import { $, boardReady, pivotAt, settled } from './board';
import { starters } from '../../shared/kinematics';

const test = base;
// One long story: a step that cannot happen fails at that step, not at the end of the whole test's time.
test.use({ actionTimeout: 20_000 });

/** The text area of a Quasar field, whether its data-test sits on the textarea or on the field around it. */
const areaOf = (page: Page, testId: string) =>
  page.locator(`textarea[data-test="${testId}"], [data-test="${testId}"] textarea`).first();

interface Mail {
  to: string;
  subject: string;
  text: string;
}

/** The outbox as the demo admin reads it (the local mail catcher keeps every message sent). */
async function mailTo(admin: APIRequestContext, address: string): Promise<Mail[]> {
  const res = await admin.get('/api/admin/outbox');
  expect(res.status()).toBe(200);
  const { items } = (await res.json()) as { items: Mail[] };
  return items.filter((m) => m.to.includes(address));
}

async function signedIn(browser: Browser, baseURL: string | undefined, who: { email: string; password: string }) {
  const context = await browser.newContext({ baseURL });
  const page = await context.newPage();
  await signIn(page, who);
  return { context, page };
}

/** Presses a pivot's handle and drags it by (dx, dy) screen pixels in small steps, as a hand would. */
async function drag(page: Page, id: string, dx: number, dy: number) {
  const at = await pivotAt(page, 'side', id);
  await page.mouse.move(at.x, at.y);
  await page.mouse.down();
  for (let i = 1; i <= 12; i++) await page.mouse.move(at.x + (dx * i) / 12, at.y + (dy * i) / 12);
  await page.mouse.up();
  await settled(page);
}

/** A date a week from now as the date field takes it (YYYY-MM-DD, local). */
function weekAhead(): string {
  const d = new Date(Date.now() + 7 * 24 * 3600 * 1000);
  const two = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${two(d.getMonth() + 1)}-${two(d.getDate())}`;
}

test('an instructor invites by e-mail, the student joins, hands in a changed copy, and gets feedback by mail', async ({
  browser,
  baseURL,
}) => {
  test.setTimeout(180_000);
  const stamp = Date.now();
  const className = `Chassis lab ${stamp}`;
  const starterName = `Lab starter ${stamp}`;
  const studentEmail = `ada.quill.${stamp}@example.test`;
  const feedbackText = `Good move on the upper link, Ada. Now check the pinion angle at full bump (${stamp}).`;

  const teacher = await signedIn(browser, baseURL, DEMO.instructor);
  const admin = await signedIn(browser, baseURL, DEMO.admin);
  const student = await browser.newContext({ baseURL });
  try {
    const t = teacher.page;
    // The starter the assignment hands out: one of the instructor's own sketches.
    const made = await t.request.post('/api/sketches', {
      data: { name: starterName, document: { ...starters['four-link-lateral-rod']!.build(), name: starterName } },
      headers: { 'X-CSRF-Token': await csrf(t.request) },
    });
    expect(made.status()).toBe(201);

    // A class, from the Classes page.
    await t.goto('/classes');
    await $(t, 'new-class').click();
    await inputOf(t, 'new-class-name').fill(className);
    await inputOf(t, 'new-class-term').fill('Spring 2027');
    await $(t, 'new-class-ok').click();
    await expect(t).toHaveURL(/\/classes\/\d+$/);
    const classUrl = t.url();
    await expect($(t, 'class-name')).toHaveText(className);
    await expect($(t, 'join-code-shown')).toHaveText(/^[A-Z0-9]{4,}/);

    // An assignment made from the starter, due in a week.
    await $(t, 'new-assignment').click();
    await inputOf(t, 'assignment-sketch').fill(starterName);
    await t.getByRole('option', { name: new RegExp(starterName) }).click();
    await inputOf(t, 'assignment-title').fill('Lab 1: move the upper links');
    await areaOf(t, 'assignment-instructions').fill('Raise anti-squat at ride; hand in your copy.');
    await inputOf(t, 'assignment-due-date').fill(weekAhead());
    await inputOf(t, 'assignment-due-time').fill('17:00');
    await $(t, 'assignment-ok').click();
    await expect(t).toHaveURL(/\/assignments\/\d+$/);
    const assignmentUrl = t.url();
    await expect($(t, 'assignment-title-shown')).toHaveText('Lab 1: move the upper links');
    await expect($(t, 'hand-ins-table')).toContainText('Nothing handed in yet.');

    // Invitations: one good address, one malformed; the bad one is named and not sent.
    await t.getByRole('link', { name: `Back to ${className}` }).click();
    await expect(t).toHaveURL(classUrl);
    await areaOf(t, 'invite-emails').fill(`${studentEmail}\nada.quill@`);
    await $(t, 'invite-send').click();
    await expect($(t, 'invite-sent')).toContainText(studentEmail);
    await expect($(t, 'invite-refused')).toContainText('ada.quill@');
    await expect($(t, 'invites-table')).toContainText(studentEmail);
    await expect($(t, 'invites-table')).toContainText('Waiting');
    await t.screenshot({ path: '/tmp/classes-class.png', fullPage: true });

    // The student's mail holds the link; it leads to the class signed out.
    const invites = await mailTo(admin.page.request, studentEmail);
    expect(invites).toHaveLength(1);
    const link = invites[0].text.match(/https?:\/\/\S+\/invites\/[A-Za-z0-9_%-]+/)?.[0];
    expect(link, 'the invitation link in the mail').toBeTruthy();
    const s = await student.newPage();
    await s.goto(link!);
    await expect($(s, 'invite-class')).toHaveText(className);
    await $(s, 'invite-signup').click();
    await expect(s).toHaveURL(/\/signup\?next=/);
    await inputOf(s, 'name').fill('Ada Quill');
    await inputOf(s, 'email').fill(studentEmail);
    await inputOf(s, 'password').fill(`Harbour-Quill-${stamp}`);
    await $(s, 'submit').click();
    // Sign-up finishes through a mailed link; signing in then goes back to the invitation.
    await expect($(s, 'check-mail')).toContainText(studentEmail);
    let confirm: string | undefined;
    await expect(async () => {
      const mails = await mailTo(admin.page.request, studentEmail);
      confirm = mails.map((m) => m.text.match(/https?:\/\/\S+\/signup\/confirm\?token=[\w-]+/)?.[0]).find(Boolean);
      expect(confirm, 'the sign-up link in the mail').toBeTruthy();
    }).toPass({ timeout: 10_000 });
    await s.goto(confirm!);
    await expect($(s, 'done')).toContainText(studentEmail);
    await $(s, 'done').getByRole('link', { name: 'Sign in' }).click();
    await expect(s).toHaveURL(/\/signin\?next=/);
    await inputOf(s, 'email').fill(studentEmail);
    await inputOf(s, 'password').fill(`Harbour-Quill-${stamp}`);
    await $(s, 'submit').click();
    await expect(s).toHaveURL(/\/invites\//);
    await $(s, 'invite-join').click();
    await expect(s).toHaveURL(/\/classes\/\d+$/);
    await expect($(s, 'class-name')).toHaveText(className);

    // The student copies the assignment, moves a pivot on the board, and hands in.
    await s.getByText('Lab 1: move the upper links').click();
    await expect(s).toHaveURL(assignmentUrl);
    await $(s, 'start-copy').click();
    await expect(s).toHaveURL(/\/sketches\/\d+$/);
    // The first sweep of a fresh board can take a while on a busy machine.
    await expect($(s, 'readout-antisquat')).toContainText('%', { timeout: 45_000 });
    await boardReady(s);
    await drag(s, 'UL.fl', 0, -40);
    await expect($(s, 'save-state')).toHaveAttribute('data-state', 'saved', { timeout: 30_000 });
    await s.goto(assignmentUrl);
    await expect($(s, 'open-copy')).toBeVisible();
    // Due next week: nothing says a hand-in would be late.
    await expect($(s, 'my-copy')).toContainText('You may hand in again before the due date.');
    await expect($(s, 'past-due')).toHaveCount(0);
    await $(s, 'hand-in').click();
    await s.getByRole('button', { name: 'Hand in' }).last().click();
    await expect($(s, 'my-hand-ins').locator('.q-item')).toHaveCount(1);

    // The instructor sees it with its numbers and writes feedback.
    await t.goto(assignmentUrl);
    const table = $(t, 'hand-ins-table');
    const row = table.locator('tbody tr', { hasText: 'Ada Quill' });
    await expect(row).toHaveCount(1);
    await expect(table.locator('thead')).toContainText('Anti-squat at ride');
    await expect(row).toContainText('%');
    await expect(row).toContainText('°');
    await t.screenshot({ path: '/tmp/classes-assignment.png', fullPage: true });
    await row.getByRole('button', { name: /Write feedback/ }).click();
    await areaOf(t, 'feedback-text').fill(feedbackText);
    await $(t, 'feedback-save').click();
    await expect(t.getByText('Feedback saved and mailed to Ada Quill')).toBeVisible();

    // It arrives in the student's mail and on their page.
    await expect
      .poll(async () => (await mailTo(admin.page.request, studentEmail)).some((m) => m.text.includes(feedbackText)))
      .toBe(true);
    await s.reload();
    await expect($(s, 'my-feedback')).toContainText(feedbackText);
    await s.screenshot({ path: '/tmp/classes-student.png', fullPage: true });
  } finally {
    await student.close();
    await admin.context.close();
    await teacher.context.close();
  }
});

test("a student's assignment past its due date says a hand-in now is marked late", async ({ browser, baseURL }) => {
  // The demo seed's "Lab 3" fell due two days before the seed ran.
  const { context, page } = await signedIn(browser, baseURL, DEMO.student);
  try {
    await page.goto('/classes');
    await page.getByText('Chassis Design 210').click();
    await page.getByText('Lab 3').first().click();
    await expect($(page, 'assignment-due')).toContainText('ago');
    await expect($(page, 'past-due')).toHaveText('The due date has passed: a hand-in now is marked late.');
    await expect($(page, 'my-copy')).not.toContainText('before the due date');
  } finally {
    await context.close();
  }
});
