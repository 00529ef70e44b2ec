import { test, expect, snap } from './fixtures';
import { test as anonymous } from '@playwright/test';
import { ownerSharesStarter } from './api';
import { starters } from '../../shared/kinematics';
import { $, boardReady } from './board';

test('the board menu opens the build sheet: caution, brackets and member lengths, and a print without the app around it', async ({
  page,
}) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  await $(page, 'board-menu').click();
  await $(page, 'open-build-sheet').click();
  await expect(page).toHaveURL(/\/sketches\/\d+\/sheet$/);

  await expect($(page, 'sheet-caution')).toContainText('Geometry only.');
  await expect($(page, 'sheet-caution')).toContainText('qualified person and local regulations');
  const doc = starters['four-link-lateral-rod']!.build();
  const ul = doc.points.find((p) => p.id === 'UL.fl')!;
  await expect($(page, 'sheet-pivot-UL.fl')).toContainText(ul.z.toFixed(1));
  const link = doc.members.find((m) => m.id === 'LLl')!;
  const [a, b] = [link.a, link.b].map((id) => doc.points.find((p) => p.id === id)!);
  await expect($(page, 'sheet-member-LLl-length')).toHaveText(
    `${Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z).toFixed(1)} mm`,
  );
  await expect($(page, 'sheet-geometry')).toContainText('Anti-squat at ride');
  await snap(page, 'build-sheet');

  // On paper: the sheet without the app's header, menu or buttons.
  await page.emulateMedia({ media: 'print' });
  await expect(page.locator('.q-header')).toBeHidden();
  await expect($(page, 'sheet-print')).toBeHidden();
  await expect($(page, 'sheet-caution')).toBeVisible();
  await snap(page, 'build-sheet-print');
  await page.emulateMedia({ media: 'screen' });
});

test('a build sheet for a sketch that is not there says so', async ({ page }) => {
  await page.goto('/sketches/999999/sheet');
  await expect($(page, 'sheet-error')).toContainText('The build sheet could not open: no such sketch.');
});

anonymous(
  'a customer with the read-only link opens the build sheet from the board without signing in',
  async ({ page, browser, baseURL }) => {
    const shareToken = await ownerSharesStarter(browser, baseURL);

    await page.goto(`/shared/${shareToken}`);
    await boardReady(page);
    await $(page, 'board-menu').click();
    await $(page, 'open-build-sheet').click();
    await expect(page).toHaveURL(new RegExp(`/shared/${shareToken}/sheet$`));
    await expect($(page, 'sheet-caution')).toContainText('Geometry only.');
    await expect($(page, 'sheet-pivot-UL.fl')).toBeVisible();
    await page.getByLabel('Back to the board').click();
    await expect(page).toHaveURL(new RegExp(`/shared/${shareToken}$`));
  },
);
