import { test, expect, snap } from './fixtures';
import type { Page } from '@playwright/test';
import { runSweep, starters } from '../../shared/kinematics';
import { download } from './board';

const $ = (page: Page, id: string) => page.locator(`[data-test="${id}"]`);

/** "+153.7 %", "−24.20°": the readout's signed numbers (a true minus sign). */
const signed = (v: number, digits: number) => `${v < 0 ? '\u2212' : '+'}${Math.abs(v).toFixed(digits)}`;

test('the steer slider turns the double-wishbone starter to lock: Ackermann, turning radius, the lock flag and the plan view', async ({
  page,
}) => {
  // The starter as the library makes it, swept here for the numbers the readout must show at lock.
  const lock = runSweep(starters['double-wishbone']!.build()).steer!.rows.at(-1)!;

  await page.goto('/sketches/new?starter=double-wishbone');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await expect($(page, 'slider-steer')).toBeVisible();
  const dismiss = $(page, 'caution-dismiss');
  if (await dismiss.isVisible()) await dismiss.click();
  await expect($(page, 'readout-position')).toHaveText('at ride height');

  // To the slider's end: the last steer row, the rack's full travel.
  await $(page, 'slider-steer').focus();
  await page.keyboard.press('End');
  await expect($(page, 'slider-steer-value')).toHaveText('+60.0 mm rack');
  await expect($(page, 'readout-position')).toHaveText('at +60.0 mm rack, ride height');
  await expect($(page, 'readout-ackermann').locator('.board-readout__value')).toHaveText(
    `${signed(lock.ackermann!, 1)} %`,
  );
  await expect($(page, 'readout-turning-radius').locator('.board-readout__value')).toHaveText(
    `${lock.turningRadius!.toFixed(1)} mm`,
  );
  await expect($(page, 'readout-steer-left')).toContainText(`${signed(lock.leftSteer, 2)}°`);
  await expect($(page, 'readout-steer-right')).toContainText(`${signed(lock.rightSteer, 2)}°`);

  // The lock each way is flagged in rack travel.
  await $(page, 'tab-flags').click();
  const flags = $(page, 'flag-steer-lock');
  await expect(flags).toHaveCount(2);
  await expect(flags.filter({ hasText: '+60.0 mm rack' })).toHaveCount(1);
  await expect($(page, 'board-flags')).not.toContainText('mm bump');
  await snap(page, 'board-steer-lock');

  // The plan view beside the front view: the turning centre's radius is the readout's.
  await $(page, 'tab-plan').click();
  await expect($(page, 'canvas-plan')).toHaveAttribute(
    'aria-label',
    `Plan view: turning radius ${Math.round(lock.turningRadius!)} mm to the outer front wheel`,
  );
  await expect($(page, 'plan-note')).toContainText('axle line to the rear axle line');
  await snap(page, 'board-steer-lock-plan');

  // The views' picture takes the plan view while it is shown in the front view's place: the PNG's width
  // (IHDR, bytes 16-19) is the side and plan views at twice their size with 16 px margins, also doubled.
  const png = await download(page, 'export-views-png');
  const widths = await page.evaluate(() =>
    ['side', 'plan'].map((v) => document.querySelector(`[data-test="canvas-${v}"] canvas`)!.clientWidth),
  );
  expect(png.bytes.readUInt32BE(16)).toBe(2 * (widths[0] + widths[1]) + 2 * 16 * 3);

  // A phone: one view at a time, the plan view among the tabs, the slider kept at lock.
  await page.setViewportSize({ width: 390, height: 844 });
  await expect($(page, 'slider-steer-value')).toHaveText('+60.0 mm rack');
  await $(page, 'tab-plan').click();
  await expect($(page, 'canvas-plan')).toBeVisible();
  await snap(page, 'board-steer-lock-phone');
  await $(page, 'slider-steer').scrollIntoViewIfNeeded();
  await snap(page, 'board-steer-lock-phone-sliders');
  await $(page, 'readout-ackermann').scrollIntoViewIfNeeded();
  await snap(page, 'board-steer-lock-phone-readout');
});
