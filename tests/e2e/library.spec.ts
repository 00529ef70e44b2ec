import { test, expect, snap, signIn, DEMO } from './fixtures';
import { test as anonymous } from '@playwright/test';

test('a signed-in member sees the library with its table and can open the starter dialog', async ({ page }) => {
  await expect(page.getByRole('heading', { name: 'Library' })).toBeVisible();
  await expect(page.getByTestId('library-table')).toBeVisible();
  await expect(page.getByTestId('user-menu')).toContainText(/Maker|maker/i);
  await snap(page, 'library');
  await page.getByTestId('new-sketch').first().click();
  await expect(page.getByTestId('starter-dialog')).toBeVisible();
  await snap(page, 'library-starter-dialog');
});

anonymous('a signed-out visitor is sent to sign in, and a wrong password is refused with a message', async ({ page }) => {
  await page.goto('/library');
  await expect(page).toHaveURL(/\/signin\?next=%2Flibrary/);
  await page.getByTestId('email').locator('input').fill(DEMO.maker.email);
  await page.getByTestId('password').locator('input').fill('not-the-password');
  await page.getByTestId('submit').click();
  await expect(page.getByTestId('error')).toBeVisible();
  await snap(page, 'signin-refused');
});

anonymous('an admin sees the admin pages in the drawer and the user list', async ({ page }) => {
  await signIn(page, DEMO.admin);
  await page.goto('/admin/users');
  await expect(page.getByTestId('users-table')).toContainText('student@demo.test');
  await snap(page, 'admin-users');
});
