import { test, expect } from './fixtures';
import { $, boardReady } from './board';

test('edits that cannot be saved: leaving the board asks first, Stay keeps them, and closing the tab warns too', async ({
  page,
}) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  const url = page.url();

  // From here the server refuses every save, as when the connection has gone.
  await page.route('**/api/sketches/*', (route) =>
    route.request().method() === 'PUT'
      ? route.fulfill({
          status: 503,
          contentType: 'application/json',
          body: JSON.stringify({ error: 'The server is not answering.' }),
        })
      : route.continue(),
  );
  const z = $(page, 'pivot-UL.fl-z');
  await z.fill('1111');
  await z.press('Enter');
  await expect(z).toHaveValue('1111');

  await page.getByLabel('Back to the library').click();
  const dialog = page.getByRole('dialog');
  await expect(dialog).toContainText('Leave without saving?');
  await expect(dialog).toContainText('The server is not answering.');
  await dialog.getByRole('button', { name: 'Stay' }).click();
  await expect(page).toHaveURL(url);
  await expect(z).toHaveValue('1111');
  await expect($(page, 'save-state')).toHaveAttribute('data-state', 'error');

  // Closing the tab: the browser's own "leave this site?" prompt, which the user can refuse.
  const prompts: string[] = [];
  page.once('dialog', (d) => {
    prompts.push(d.type());
    void d.dismiss();
  });
  await page.close({ runBeforeUnload: true });
  await expect.poll(() => prompts).toEqual(['beforeunload']);
  expect(page.isClosed()).toBe(false);

  // Leaving after all: the edit is given up, and the library opens.
  await page.getByLabel('Back to the library').click();
  await page.getByRole('dialog').getByRole('button', { name: 'Leave and lose them' }).click();
  await expect(page).toHaveURL(/\/library/);
});
