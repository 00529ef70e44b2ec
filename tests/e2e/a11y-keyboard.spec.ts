/**
 * The keyboard alone: every control below is reached with Tab and worked with keys (page.keyboard only,
 * no clicks), its effect checked on the page, with a visible focus ring on the way.
 */
import { test, expect } from './fixtures';
import type { Locator, Page } from '@playwright/test';
import { starters } from '../../shared/kinematics';
import { $, boardReady } from './board';

// The board sweeps each sketch it opens; on a busy machine a test here takes longer than the default minute.
test.describe.configure({ timeout: 150_000 });

/** Tab presses allowed to reach a control: the board's tables hold a few hundred stops at most. */
const MAX_TABS = 400;

/** Presses Tab (or Shift+Tab) until `target` has the focus, as a keyboard user would; fails if it never does. */
async function tabTo(page: Page, target: Locator, back = false): Promise<void> {
  for (let i = 0; i < MAX_TABS; i++) {
    if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) return;
    await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
  }
  throw new Error(`${MAX_TABS} presses of ${back ? 'Shift+Tab' : 'Tab'} did not reach ${target}`);
}

/** The focused element's outline as drawn: a visible focus ring is a solid line at least 2 px wide. */
async function expectFocusRing(page: Page): Promise<void> {
  const ring = await page.evaluate(() => {
    const style = getComputedStyle(document.activeElement!);
    return { style: style.outlineStyle, width: parseFloat(style.outlineWidth) };
  });
  expect(ring.style, 'the focused control has an outline').toBe('solid');
  expect(ring.width).toBeGreaterThanOrEqual(2);
}

test('the pivot and member tables from the keyboard: a coordinate typed in, a member added and deleted', async ({
  page,
}) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  const antiSquat = await $(page, 'readout-antisquat').textContent();

  // The upper link's frame pivot raised 60 mm by typing in its z cell.
  const ul = starters['four-link-lateral-rod']!.build().points.find((p) => p.id === 'UL.fl')!;
  const z = $(page, 'pivot-UL.fl-z');
  await tabTo(page, z);
  await expectFocusRing(page);
  await page.keyboard.press('Control+a');
  await page.keyboard.type(String(ul.z + 60));
  await page.keyboard.press('Enter');
  await expect(z).toHaveValue(String(ul.z + 60));
  // Its mirror partner follows (left/right linked is on), and the anti-squat is swept anew.
  await expect($(page, 'pivot-UL.fr-z')).toHaveValue(String(ul.z + 60));
  await expect($(page, 'readout-antisquat')).not.toHaveText(antiSquat ?? '');

  // A refused entry says why, and Escape brings the value back.
  await page.keyboard.press('Control+a');
  await page.keyboard.type('high');
  await page.keyboard.press('Enter');
  await expect($(page, 'pivot-UL.fl-z-error')).toBeVisible();
  await page.keyboard.press('Escape');
  await expect(z).toHaveValue(String(ul.z + 60));

  // The Members tab, chosen with the arrow keys and Enter, then a link added with the add row's button.
  await tabTo(page, $(page, 'tab-pivots'), true);
  await page.keyboard.press('ArrowRight');
  await expect($(page, 'tab-members')).toBeFocused();
  await expectFocusRing(page);
  await page.keyboard.press('Enter');
  const rows = page.locator('[data-test^="member-row-"]');
  await expect(rows.first()).toBeVisible();
  const before = await rows.count();
  await tabTo(page, $(page, 'member-add-submit'));
  await expectFocusRing(page);
  await page.keyboard.press('Enter');
  await expect(rows).toHaveCount(before + 1);
  const added = ((await rows.last().getAttribute('data-test')) ?? '').replace('member-row-', '');

  // The new member's delete button sits just before the add row: Shift+Tab back to it and press it.
  const remove = $(page, `member-${added}-delete`);
  await tabTo(page, remove, true);
  await expectFocusRing(page);
  await page.keyboard.press('Enter');
  await expect(rows).toHaveCount(before);
  await expect(remove).toHaveCount(0);
});

test('the travel, roll and steer sliders from the keyboard', async ({ page }) => {
  // The double wishbone steers: all three sliders are there.
  await page.goto('/sketches/new?starter=double-wishbone');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await expect($(page, 'slider-steer')).toBeVisible({ timeout: 45_000 });
  await expect($(page, 'readout-position')).toHaveText('at ride height');

  await tabTo(page, $(page, 'slider-travel'));
  await expectFocusRing(page);
  const range = starters['double-wishbone']!.build().sweep;
  await page.keyboard.press('End');
  await expect($(page, 'slider-travel-value')).toContainText(`+${range.bump.toFixed(1)} mm`);
  await expect($(page, 'readout-position')).toContainText('bump');
  await page.keyboard.press('Home');
  await expect($(page, 'slider-travel-value')).toContainText(`${Math.abs(range.droop).toFixed(1)} mm`);
  await expect($(page, 'readout-position')).toContainText('droop');

  await tabTo(page, $(page, 'slider-roll'));
  await expectFocusRing(page);
  await page.keyboard.press('ArrowRight');
  await expect($(page, 'slider-roll-value')).not.toHaveText('no roll');
  await expect($(page, 'readout-position')).toContainText('roll');

  await tabTo(page, $(page, 'slider-steer'));
  await expectFocusRing(page);
  await page.keyboard.press('End');
  await expect($(page, 'slider-steer-value')).toHaveText('+60.0 mm rack');
  await expect($(page, 'readout-position')).toContainText('+60.0 mm rack');
});
