import { test, expect } from './fixtures';
import { $, boardReady, pivotAt } from './board';

const title =
  'a member added from the table comes into view with its new pivots, ' +
  'and a pivot clicked on the canvas brings its row into view';

test(title, async ({ page }) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  await $(page, 'tab-members').click();
  const rows = page.locator('[data-test^="member-row-"]');
  const before = await rows.count();

  // A link between a new frame pivot and a new axle pivot: the defaults of the add row.
  await $(page, 'member-add-kind').selectOption('link');
  await $(page, 'member-add-submit').click();
  await expect(rows).toHaveCount(before + 1);
  const added = rows.last();
  await expect(added).toBeInViewport();
  await expect(added).toHaveClass(/board-table__row--selected/);

  // The pivot table, scrolled back to its top, follows a click on a pivot far down its list.
  await $(page, 'tab-pivots').click();
  await page.locator('.board-pivots__scroll').evaluate((el) => el.scrollTo(0, 0));
  const last = page.locator('[data-test^="pivot-row-"]').last();
  const lastId = ((await last.getAttribute('data-test')) ?? '').replace('pivot-row-', '');
  await expect(last).not.toBeInViewport();
  const at = await pivotAt(page, 'side', lastId);
  await page.mouse.click(at.x, at.y);
  await expect(last).toBeInViewport();

  // Undo takes the member and its two pivots away again.
  await page.keyboard.press('Control+z');
  await $(page, 'tab-members').click();
  await expect(rows).toHaveCount(before);
});
