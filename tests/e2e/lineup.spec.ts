import { test, expect, snap, inputOf } from './fixtures';
import type { Page } from '@playwright/test';
import { starters } from '../../shared/kinematics';
import { csrf } from './api';
import { $ } from './board';

/** A four-link sketch of the maker's; `raise` lifts the upper links' frame pivots (mm). */
async function fourLink(page: Page, name: string, raise = 0): Promise<number> {
  const document = { ...starters['four-link-lateral-rod']!.build(), name };
  for (const p of document.points) if (p.id === 'UL.fl' || p.id === 'UL.fr') p.z += raise;
  const res = await page.request.post('/api/sketches', {
    data: { name, document },
    headers: { 'X-CSRF-Token': await csrf(page.request) },
  });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { id: number }).id;
}

test('two variants ticked in the library line up: overlaid views and plots, and the brackets they share', async ({
  page,
}) => {
  const stock = await fourLink(page, 'Line-up test: stock mounts');
  const raised = await fourLink(page, 'Line-up test: raised upper mounts', 60);
  await page.reload();
  await inputOf(page, 'search').fill('Line-up test');
  await expect(page.getByTestId('library-table').locator('tbody tr')).toHaveCount(2);
  await expect($(page, 'lineup-open')).toBeDisabled();
  await $(page, `pick-${stock}`).click();
  await $(page, `pick-${raised}`).click();
  await $(page, 'lineup-open').click();

  await expect(page).toHaveURL(new RegExp(`/lineup\\?ids=(${stock}(,|%2C)${raised}|${raised}(,|%2C)${stock})$`));
  await expect($(page, 'lineup-variants')).toContainText('Line-up test: stock mounts');
  await expect($(page, 'lineup-variants')).toContainText('Line-up test: raised upper mounts');
  await expect($(page, 'lineup-side').locator('canvas').first()).toBeVisible();
  await expect($(page, 'plot-antisquat').locator('canvas')).toBeVisible();

  // The upper links' frame brackets moved 60 mm; every other frame bracket is common.
  await expect($(page, 'bracket-UL.fl-status')).toHaveText('differs');
  await expect($(page, 'bracket-UL.fl')).toContainText('60.0 mm');
  await expect($(page, 'bracket-LL.fl-status')).toHaveText('common to all');
  const frame = starters['four-link-lateral-rod']!.build().points.filter((p) => p.body === 'frame').length;
  await expect($(page, 'lineup-brackets-summary')).toContainText(`${frame - 2} of ${frame} frame brackets are common`);
  await snap(page, 'lineup');

  // A variant opens on its own board.
  await $(page, 'lineup-variant-0').click();
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
});

test('a line-up address with one sketch, or with a sketch that is not there, says so', async ({ page }) => {
  await page.goto('/lineup?ids=5');
  await expect($(page, 'lineup-error')).toContainText('A line-up compares 2 to 4 sketches');
  await page.goto('/lineup?ids=999998,999999');
  await expect($(page, 'lineup-error')).toContainText('The line-up could not open: no such sketch.');
});
