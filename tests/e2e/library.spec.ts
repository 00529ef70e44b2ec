import { test, expect, snap, signIn, inputOf, DEMO } from './fixtures';
import { test as anonymous } from '@playwright/test';

test('a signed-in member sees the library with its table and can open the starter dialog', async ({ page }) => {
  await expect(page.getByRole('heading', { name: 'Library' })).toBeVisible();
  await expect(page.getByTestId('library-table')).toBeVisible();
  // The seed gives the demo maker sketches of the shop's vehicles (searched for: the board tests,
  // run before this one, add sketches of their own to the first page).
  await inputOf(page, 'search').fill('Kettle Creek');
  await expect(page.getByTestId('library-table')).toContainText('Kettle Creek shop truck, rear four-link');
  await expect(page.getByTestId('library-table')).toContainText('Four-link with lateral rod');
  await snap(page, 'library');
  await page.getByTestId('new-sketch').first().click();
  await expect(page.getByTestId('starter-dialog')).toBeVisible();
  await expect(page.getByTestId('starter-create')).toBeEnabled();
  await page.waitForTimeout(400); // let the dialog's opening transition finish before the screenshot
  await snap(page, 'library-starter-dialog');
});

anonymous(
  'a signed-out visitor is sent to sign in, and a wrong password is refused with a message',
  async ({ page }) => {
    await page.goto('/library');
    await expect(page).toHaveURL(/\/signin\?next=(%2F|\/)library/);
    await inputOf(page, 'email').fill(DEMO.maker.email);
    await inputOf(page, 'password').fill('not-the-password');
    await page.getByTestId('submit').click();
    await expect(page.getByTestId('error')).toBeVisible();
    await snap(page, 'signin-refused');
  },
);

anonymous('an admin sees the admin pages in the drawer and the user list', async ({ page }) => {
  await signIn(page, DEMO.admin);
  await page.goto('/admin/users');
  await expect(page.getByTestId('users-table')).toContainText('student@demo.test');
  await snap(page, 'admin-users');
});

test('on a phone the library keeps each row’s shared state and menu on screen', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 800 });
  await page.goto('/library');
  await inputOf(page, 'search').fill('Kettle Creek');
  const table = page.getByTestId('library-table');
  await expect(table).toContainText('Kettle Creek shop truck, rear four-link');
  const row = table.locator('tbody tr', { hasText: 'Kettle Creek shop truck, rear four-link' });
  const actions = row.getByRole('button', { name: 'Actions' });
  const share = row.locator('[data-test^="share-"]');
  for (const control of [actions, share]) {
    const box = (await control.boundingBox())!;
    expect(box.x + box.width).toBeLessThanOrEqual(390);
  }
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await actions.click();
  await expect(page.getByTestId('menu-share')).toBeVisible();
  await snap(page, 'library-phone');
});
