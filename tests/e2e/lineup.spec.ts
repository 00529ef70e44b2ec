import { test, expect, snap, inputOf, ARTIFACTS } from './fixtures';
import type { Page } from '@playwright/test';
import type { Sketch } from '../../shared/schema/sketch';
import { starters } from '../../shared/kinematics';
import { framePivots } from '../../shared/lineup/framePivots';
import { csrf } from './api';
import { $ } from './board';
import { platformVariants } from './lineupPlatform';

/** A four-link sketch of the maker's; `raise` lifts the upper links' frame pivots (mm). */
async function fourLink(page: Page, name: string, raise = 0): Promise<number> {
  const document = { ...starters['four-link-lateral-rod']!.build(), name };
  for (const p of document.points) if (p.id === 'UL.fl' || p.id === 'UL.fr') p.z += raise;
  return save(page, name, document);
}

async function save(page: Page, name: string, document: Sketch): Promise<number> {
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

  // The upper links' frame brackets moved 60 mm, over 3 × the 10 mm tolerance: each variant needs its own two, and
  // none is a near miss; the other frame brackets (the starter's, less the driveline's reference points) are common.
  const frame = framePivots(starters['four-link-lateral-rod']!.build()).length;
  await expect($(page, 'lineup-brackets-summary')).toHaveText(
    `${frame - 2} brackets common to all 2 variants; new per variant: ` +
      'Line-up test: stock mounts 2 (2 its own); Line-up test: raised upper mounts 2 (2 its own).',
  );
  const upper = $(page, 'lineup-brackets').locator('tbody tr', { hasText: 'UL.fl' });
  await expect(upper).toHaveCount(2);
  await expect(upper.first()).toContainText('only one');
  await expect($(page, 'lineup-near-misses')).toHaveCount(0);
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

test('three rear suspensions of three starters on one frame: the brackets they share, a near miss, on a phone too', async ({
  page,
}) => {
  const [leaf, fourLink, trailing] = platformVariants();
  const ids = [
    await save(page, 'Leaf', leaf),
    await save(page, 'Four-link', fourLink),
    await save(page, 'Trailing arm', trailing),
  ];
  await page.goto(`/lineup?ids=${ids.join(',')}`);

  // Worked by hand in lineupPlatform.ts: the shock tops common to all three (left and right), one spring seat
  // the four-link and the trailing arm share, and the trailing arm's right spring seat 22 mm from the four-link's.
  await expect($(page, 'lineup-brackets-summary')).toHaveText(
    '2 brackets common to all 3 variants; new per variant: Leaf 4 (4 its own); Four-link 7 (6 its own); ' +
      'Trailing arm 6 (5 its own).',
  );
  const common = $(page, 'lineup-brackets').locator('tbody tr', { hasText: 'SH.f.l' });
  await expect(common).toContainText('all 3');
  await expect(common).toContainText('SH.fl');
  const subset = $(page, 'lineup-brackets').locator('tbody tr', { hasText: '2 of 3' });
  await expect(subset).toHaveCount(1);
  await expect(subset).toContainText(/—\s*SP\.fl\s*SP\.fl/);
  await expect($(page, 'lineup-near-miss')).toHaveText([
    'Move Trailing arm’s SP.fr by 12.0 mm towards Four-link’s SP.fr (22.0 mm apart) and the two can share a bracket.',
  ]);
  await expect($(page, 'lineup-keys')).toContainText('Articulation');
  await expect($(page, 'lineup-side').locator('canvas').first()).toBeVisible();
  await snap(page, 'lineup-platform');

  // At a 22 mm tolerance the near miss shares a bracket: one fewer of their own for each.
  await inputOf(page, 'lineup-tolerance').fill('22');
  await expect($(page, 'lineup-brackets-summary')).toContainText(
    'Four-link 7 (5 its own); Trailing arm 6 (4 its own).',
  );
  await expect($(page, 'lineup-near-miss')).toHaveCount(0);
  await inputOf(page, 'lineup-tolerance').fill('0');
  await expect(
    page.getByText('The tolerance must be 0.1 to 100 mm; the bracket list keeps the last one.'),
  ).toBeVisible();
  await expect(inputOf(page, 'lineup-tolerance')).toHaveAttribute('aria-invalid', 'true');
  await expect($(page, 'lineup-brackets-summary')).toContainText('Four-link 7 (5 its own)');

  // A variant hidden leaves the drawing and the plots; the bracket list still counts it.
  await $(page, 'lineup-toggle-2').click();
  await expect($(page, 'lineup-toggle-2')).toHaveAttribute('aria-pressed', 'false');
  await expect($(page, 'lineup-plots-legend').locator('.lineup-plots__off')).toHaveText('Trailing arm');
  await expect($(page, 'lineup-brackets-summary')).toContainText('common to all 3 variants');

  // On a phone nothing runs off the side of the page.
  await page.setViewportSize({ width: 390, height: 844 });
  await page.reload();
  await expect($(page, 'lineup-brackets-summary')).toContainText('2 brackets common to all 3 variants');
  await expect($(page, 'lineup-side').locator('canvas').first()).toBeVisible();
  await $(page, 'plot-antisquat').scrollIntoViewIfNeeded();
  await expect($(page, 'plot-antisquat').locator('canvas')).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await snap(page, 'lineup-platform-phone');
  await page.screenshot({ path: `${ARTIFACTS}/lineup-platform-phone-full.png`, fullPage: true });
});

test('a front layout is matched only with front layouts, until the user asks for front and rear together', async ({
  page,
}) => {
  const rear = await save(page, 'Rear axle', starters['four-link-lateral-rod']!.build());
  const front = await save(page, 'Front wishbones', starters['double-wishbone']!.build());
  await page.goto(`/lineup?ids=${rear},${front}`);
  await expect($(page, 'lineup-brackets-summary')).toHaveCount(2);
  await expect($(page, 'lineup-brackets-summary').nth(1)).toContainText(
    '“Front wishbones” is the only front layout here: its 12 frame brackets are matched with no other',
  );
  await $(page, 'lineup-across-ends').click();
  await expect($(page, 'lineup-across-ends')).toHaveAttribute('aria-checked', 'true');
  await expect($(page, 'lineup-brackets-summary')).toHaveCount(1);
  await expect($(page, 'lineup-brackets-summary')).toContainText('common to all 2 variants');
});
