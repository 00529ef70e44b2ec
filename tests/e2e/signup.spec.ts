import { test as anonymous, type APIRequestContext } from '@playwright/test';
import { DEMO, expect, inputOf, signIn, snap } from './fixtures';
import { csrf } from './api';

/** The sign-up link the server mailed to `to`, read from the admin's mail log (the catcher files every mail there). */
async function signupLinkMailedTo(request: APIRequestContext, to: string): Promise<string> {
  await request.post('/api/auth/login', { data: DEMO.admin, headers: { 'X-CSRF-Token': await csrf(request) } });
  let link: string | undefined;
  await expect(async () => {
    const outbox = (await (await request.get('/api/admin/outbox')).json()) as { items: { to: string; text: string }[] };
    link = outbox.items.find((m) => m.to === to)?.text.match(/https?:\/\/\S+\/signup\/confirm\?token=[\w-]+/)?.[0];
    expect(link).toBeDefined();
  }).toPass({ timeout: 10_000 });
  return link!;
}

anonymous(
  'signing up: a weak password is refused with a reason, then the mailed link creates the account',
  async ({ page, request }) => {
    const email = `new.maker-${Date.now()}@example.test`;
    const password = 'saddle-quarry-lantern-88';
    await page.goto('/signup');
    await inputOf(page, 'name').fill('Nell Framewright');
    await inputOf(page, 'email').fill(email);
    await inputOf(page, 'password').fill('password1234');
    await page.getByTestId('submit').click();
    await expect(page.getByTestId('error')).toContainText('too easy to guess');

    await inputOf(page, 'password').fill(password);
    await page.getByTestId('submit').click();
    await expect(page.getByTestId('check-mail')).toContainText(email);
    await snap(page, 'signup-check-mail');
    // Nobody is signed in by the sign-up itself.
    await page.goto('/library');
    await expect(page).toHaveURL(/\/signin/);

    await page.goto(await signupLinkMailedTo(request, email));
    await expect(page.getByTestId('done')).toContainText(email);
    await signIn(page, { email, password });
  },
);
