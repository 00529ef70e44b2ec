import { test, expect, snap } from './fixtures';
import { test as anonymous, type Page } from '@playwright/test';
import { $, boardReady, pivotAt, settled } from './board';
import { csrf, ownerSharesStarter } from './api';

/** Presses a pivot's handle and drags it by (dx, dy) screen pixels in small steps, as a hand would. */
async function drag(page: Page, view: 'side' | 'rear', id: string, dx: number, dy: number) {
  const at = await pivotAt(page, view, id);
  await page.mouse.move(at.x, at.y);
  await page.mouse.down();
  const steps = 12;
  for (let i = 1; i <= steps; i++) await page.mouse.move(at.x + (dx * i) / steps, at.y + (dy * i) / steps);
  await page.mouse.up();
  await settled(page);
}

const cell = (page: Page, id: string, axis: 'x' | 'y' | 'z') => $(page, `pivot-${id}-${axis}`);

test('open a starter, drag a pivot, see the table and readout follow, undo it, type a coordinate', async ({ page }) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  await snap(page, 'board-starter');

  const z0 = await cell(page, 'UL.fl', 'z').inputValue();
  const as0 = (await $(page, 'readout-antisquat').textContent()) ?? '';

  // Up 40 px in the side view: the upper link's frame pivot rises; its right-hand partner follows.
  await drag(page, 'side', 'UL.fl', 0, -40);
  await expect(cell(page, 'UL.fl', 'z')).not.toHaveValue(z0);
  const z1 = await cell(page, 'UL.fl', 'z').inputValue();
  expect(Number(z1)).toBeGreaterThan(Number(z0));
  await expect(cell(page, 'UL.fr', 'z')).toHaveValue(z1);
  await expect($(page, 'readout-antisquat')).not.toHaveText(as0);
  await expect($(page, 'save-state')).toHaveAttribute('data-state', 'saved', { timeout: 8000 });
  await snap(page, 'board-dragged');

  // A whole drag is one step back.
  await page.keyboard.press('Control+z');
  await expect(cell(page, 'UL.fl', 'z')).toHaveValue(z0);
  await expect(cell(page, 'UL.fr', 'z')).toHaveValue(z0);
  await expect($(page, 'readout-antisquat')).toHaveText(as0);
  await page.keyboard.press('Control+Shift+z');
  await expect(cell(page, 'UL.fl', 'z')).toHaveValue(z1);
  await page.keyboard.press('Control+z');

  // Typed numbers: a bad one is refused with its reason, a good one moves both sides.
  const x = cell(page, 'LL.fl', 'x');
  await x.fill('12..5');
  await x.press('Enter');
  await expect($(page, 'pivot-LL.fl-x-error')).toContainText('not a number');
  await expect(cell(page, 'LL.fr', 'x')).not.toHaveValue('1000');
  await snap(page, 'board-bad-number');
  await x.fill('1000');
  await x.press('Enter');
  await expect($(page, 'pivot-LL.fl-x-error')).toHaveCount(0);
  await expect(cell(page, 'LL.fr', 'x')).toHaveValue('1000');
  await expect($(page, 'save-state')).toHaveAttribute('data-state', 'saved', { timeout: 8000 });

  // What was saved is what comes back.
  await page.reload();
  await boardReady(page);
  await expect(cell(page, 'LL.fl', 'x')).toHaveValue('1000');
  await expect(cell(page, 'UL.fl', 'z')).toHaveValue(z0);
  await snap(page, 'board-typed');
});

test('rear-view drags mirror the partner unless left and right are unlinked; snap keeps whole steps', async ({
  page,
}) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page, 'SH.fl');

  const y0 = Number(await cell(page, 'SH.fl', 'y').inputValue());
  // Left in the rear view is the vehicle's left (+y): the left shock top moves outward.
  await drag(page, 'rear', 'SH.fl', -30, 0);
  const y1 = Number(await cell(page, 'SH.fl', 'y').inputValue());
  expect(y1).toBeGreaterThan(y0);
  // Snap is on at 5 mm by default.
  expect(y1 % 5).toBe(0);
  await expect(cell(page, 'SH.fr', 'y')).toHaveValue(String(-y1));

  await $(page, 'mirror-toggle').click();
  await drag(page, 'rear', 'SH.fl', -30, 0);
  const y2 = Number(await cell(page, 'SH.fl', 'y').inputValue());
  expect(y2).toBeGreaterThan(y1);
  await expect(cell(page, 'SH.fr', 'y')).toHaveValue(String(-y1));
  await snap(page, 'board-rear-unlinked');
});

test('wheel zoom and fit; arrow keys nudge the selected pivot (Shift ten times); leaving saves first', async ({
  page,
}) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  const scale = () => page.evaluate(() => window.arcwrightBoard!.side!.transform().scale);
  const fitted = await scale();
  const box = (await $(page, 'canvas-side').boundingBox())!;
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.wheel(0, -300);
  await expect.poll(scale).toBeGreaterThan(fitted * 1.3);
  await $(page, 'fit-side').click();
  await expect.poll(scale).toBeCloseTo(fitted, 6);

  // Click a handle to select it, then nudge: up is +z; right in the side view is rearward (−x).
  const at = await pivotAt(page, 'side', 'LL.al');
  await page.mouse.click(at.x, at.y);
  const z0 = Number(await cell(page, 'LL.al', 'z').inputValue());
  const x0 = Number(await cell(page, 'LL.al', 'x').inputValue());
  await page.keyboard.press('ArrowUp');
  await page.keyboard.press('Shift+ArrowRight');
  await settled(page);
  // Snap is on at 5 mm: a nudge is one step, with Shift ten.
  await expect(cell(page, 'LL.al', 'z')).toHaveValue(String(z0 + 5));
  await expect(cell(page, 'LL.al', 'x')).toHaveValue(String(x0 - 50));
  await expect(cell(page, 'LL.ar', 'z')).toHaveValue(String(z0 + 5));
  // Nudges in a row undo as one step.
  await page.keyboard.press('Control+z');
  await expect(cell(page, 'LL.al', 'z')).toHaveValue(String(z0));
  await expect(cell(page, 'LL.al', 'x')).toHaveValue(String(x0));

  // An edit and straight away back to the library: it is saved on the way out.
  const url = page.url();
  await page.keyboard.press('ArrowUp');
  await page.getByLabel('Back to the library').click();
  await expect(page).toHaveURL(/\/library/);
  await page.goto(url);
  await boardReady(page);
  await expect(cell(page, 'LL.al', 'z')).toHaveValue(String(z0 + 5));
});

test('a save refused as stale shows the conflict, keeps the edit, and can save it as a copy', async ({ page }) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  const id = Number(page.url().match(/(\d+)$/)![1]);
  await boardReady(page);

  // Someone else saves the sketch behind this window's back.
  const token = await csrf(page.request);
  const current = await (await page.request.get(`/api/sketches/${id}`)).json();
  const put = await page.request.put(`/api/sketches/${id}`, {
    data: {
      document: { ...current.document, name: 'Changed elsewhere' },
      name: 'Changed elsewhere',
      version: current.version,
    },
    headers: { 'X-CSRF-Token': token },
  });
  expect(put.status()).toBe(200);

  await drag(page, 'side', 'LL.fl', 30, 0);
  const moved = await cell(page, 'LL.fl', 'x').inputValue();
  await expect($(page, 'conflict-dialog')).toBeVisible({ timeout: 8000 });
  await expect($(page, 'save-state')).toHaveAttribute('data-state', 'conflict');
  await snap(page, 'board-conflict');
  await $(page, 'conflict-copy').click();
  await expect(page).not.toHaveURL(new RegExp(`/sketches/${id}$`));
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  await expect(cell(page, 'LL.fl', 'x')).toHaveValue(moved);
});

test('revisions: compare an earlier version with the current sketch, then restore it', async ({ page }) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  const z0 = await cell(page, 'UL.fl', 'z').inputValue();
  const z = cell(page, 'UL.fl', 'z');
  await z.fill(String(Number(z0) + 50));
  await z.press('Enter');
  await expect($(page, 'save-state')).toHaveAttribute('data-state', 'saved', { timeout: 8000 });

  await $(page, 'tab-history').click();
  const oldest = $(page, 'board-revisions').locator('[data-test^="revision-"][data-test$="-compare"]').last();
  await expect(oldest).toBeVisible();
  await oldest.click();
  await expect($(page, 'compare-moved')).toContainText('UL.fl');
  await expect($(page, 'compare-moved')).toContainText('50.0');
  await snap(page, 'board-revisions-compare');

  await $(page, 'board-revisions').locator('[data-test^="revision-"][data-test$="-restore"]').last().click();
  await page.getByRole('button', { name: 'Restore', exact: true }).click();
  await $(page, 'tab-pivots').click();
  await expect(cell(page, 'UL.fl', 'z')).toHaveValue(z0);
});

anonymous(
  'a read-only link opens the board without sign-in: no drags, and a copy needs an account',
  async ({ page, browser, baseURL }) => {
    // The owner shares a sketch by link (through the API, signed in in a context of their own).
    const shareToken = await ownerSharesStarter(browser, baseURL);

    await page.goto(`/shared/${shareToken}`);
    await boardReady(page);
    await expect($(page, 'readonly-banner')).toBeVisible();
    await expect($(page, 'save-state')).toHaveAttribute('data-state', 'readonly');
    await expect(cell(page, 'UL.fl', 'z')).toBeDisabled();
    const z0 = await cell(page, 'UL.fl', 'z').inputValue();
    await drag(page, 'side', 'UL.fl', 0, -40);
    await expect(cell(page, 'UL.fl', 'z')).toHaveValue(z0);
    await snap(page, 'board-shared-readonly');
    await $(page, 'copy-to-library').click();
    await expect(page).toHaveURL(/\/signin\?next=/);
  },
);
