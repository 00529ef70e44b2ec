import { test, expect, snap, inputOf } from './fixtures';
import { csrf } from './api';
import { $, boardReady } from './board';
import { starters } from '../../shared/kinematics';

test('share from the library: a guest opens the link read-only, and sees it no longer works once revoked', async ({
  page,
  browser,
  baseURL,
}) => {
  const name = `Customer rear ${Date.now()}`;
  const made = await page.request.post('/api/sketches', {
    data: { name, document: { ...starters['four-link-lateral-rod']!.build(), name } },
    headers: { 'X-CSRF-Token': await csrf(page.request) },
  });
  expect(made.status()).toBe(201);
  const id = ((await made.json()) as { id: number }).id;
  await page.context().grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseURL });

  await page.reload();
  await inputOf(page, 'search').fill(name);
  const table = page.getByTestId('library-table');
  await expect(table.locator('tbody tr')).toHaveCount(1);
  const shared = $(page, `share-${id}`);
  await expect(shared).toHaveText(/Private/);

  // The Shared column opens the dialog.
  await shared.click();
  const dialog = $(page, 'share-dialog');
  await expect(dialog).toContainText(`Share “${name}”`);
  await expect($(page, 'share-status')).toContainText('Private.');
  await $(page, 'share-create').click();
  await expect($(page, 'share-status')).toContainText('A read-only link is live.');
  const url = await inputOf(page, 'share-url').inputValue();
  expect(url).toMatch(new RegExp(`^${baseURL}/shared/[A-Za-z0-9_-]{32}$`));

  await $(page, 'share-copy').click();
  await expect($(page, 'share-copied')).toContainText('Link copied');
  expect(await page.evaluate(() => navigator.clipboard.readText())).toBe(url);

  // A bad address is refused with the field named; a good one is sent once and listed.
  await inputOf(page, 'share-email').fill('customer@');
  await $(page, 'share-send').click();
  await expect(dialog).toContainText('E-mail address: “customer@” is not an e-mail address.');
  await expect($(page, 'share-recipients')).toHaveCount(0);
  await inputOf(page, 'share-email').fill('customer@example.test');
  await $(page, 'share-send').click();
  await expect(page.getByText('Sent the link to customer@example.test')).toBeVisible();
  await expect($(page, 'share-recipients')).toContainText('customer@example.test');
  await snap(page, 'share-dialog');
  await $(page, 'share-close').click();
  await expect(dialog).toBeHidden();
  await expect(shared).toHaveText(/Link live/);

  // The guest: a fresh browser context, never signed in.
  const guestContext = await browser.newContext();
  try {
    const guest = await guestContext.newPage();
    await guest.goto(url);
    await boardReady(guest);
    await expect($(guest, 'readonly-banner')).toContainText('through a read-only link');
    await expect($(guest, 'save-state')).toHaveAttribute('data-state', 'readonly');
    await expect($(guest, 'undo')).toHaveCount(0);
    await expect(inputOf(guest, 'sketch-name')).toBeDisabled();
    await snap(guest, 'share-guest-readonly');

    // The owner revokes it from the row menu.
    await table.locator('tbody tr').first().getByRole('button', { name: 'Actions' }).click();
    await $(page, 'menu-share').click();
    await expect($(page, 'share-status')).toContainText('A read-only link is live.');
    await $(page, 'share-revoke').click();
    await page.getByRole('button', { name: 'Stop sharing' }).last().click();
    await expect($(page, 'share-status')).toContainText('Private.');
    await expect($(page, 'share-recipients')).toContainText('link revoked');

    await guest.reload();
    await expect($(guest, 'board-error')).toContainText('This link no longer works.');
    await expect($(guest, 'link-gone')).toBeVisible();
    await expect(guest.getByRole('link', { name: 'Sign in' })).toBeVisible();
    await snap(guest, 'share-guest-revoked');
  } finally {
    await guestContext.close();
  }
});

test('the board menu opens the same share dialog for the open sketch', async ({ page }) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  await $(page, 'board-menu').click();
  await $(page, 'open-share').click();
  await expect($(page, 'share-dialog')).toContainText('Share “New four-link with lateral rod”');
  await $(page, 'share-create').click();
  await expect(inputOf(page, 'share-url')).toHaveValue(/\/shared\/[A-Za-z0-9_-]{32}$/);
  await snap(page, 'share-dialog-board');
});
