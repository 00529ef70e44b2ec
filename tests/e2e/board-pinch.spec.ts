import { test, expect } from './fixtures';
import type { Page } from '@playwright/test';
import { $, boardReady } from './board';
import { screenToPlane, type ViewTransform } from '../../src/canvas/transform';

// A touch screen: Chromium turns the touches below into pointer events, as on a tablet.
test.use({ hasTouch: true });

const sideTransform = (page: Page): Promise<ViewTransform> =>
  page.evaluate(() => window.arcwrightBoard!.side!.transform());

test('two fingers spreading on a view zoom it about the point between them, and move no pivot', async ({ page }) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  const box = (await $(page, 'canvas-side').boundingBox())!;
  const before = await sideTransform(page);
  const cells = () => Promise.all((['x', 'z'] as const).map((axis) => $(page, `pivot-UL.fl-${axis}`).inputValue()));
  const cellsBefore = await cells();

  // Below the ground line, where no handle is: a pinch, not a drag.
  const mid = { x: box.x + box.width * 0.5, y: box.y + box.height * 0.85 };
  const planeUnder = screenToPlane(before, { px: mid.x - box.x, py: mid.y - box.y });
  const cdp = await page.context().newCDPSession(page);
  const fingers = (half: number) => [
    { x: mid.x - half, y: mid.y, id: 1 },
    { x: mid.x + half, y: mid.y, id: 2 },
  ];
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: fingers(30) });
  for (let half = 35; half <= 90; half += 5)
    await cdp.send('Input.dispatchTouchEvent', { type: 'touchMove', touchPoints: fingers(half) });
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [] });

  const after = await sideTransform(page);
  // The fingers went from 60 to 180 px apart: three times the scale.
  expect(after.scale / before.scale).toBeCloseTo(3, 1);
  // What was under the fingers' midpoint is still there (within a pixel's worth of mm).
  const planeNow = screenToPlane(after, { px: mid.x - box.x, py: mid.y - box.y });
  expect(Math.abs(planeNow.h - planeUnder.h)).toBeLessThan(1 / after.scale + 1e-9);
  expect(Math.abs(planeNow.v - planeUnder.v)).toBeLessThan(1 / after.scale + 1e-9);
  // Nothing was edited: there is nothing to undo and the pivot's numbers are as they were.
  await expect($(page, 'undo')).toBeDisabled();
  expect(await cells()).toEqual(cellsBefore);
});
