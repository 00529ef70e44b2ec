/** Board helpers shared by the browser tests: find things by data-test, wait for the board, read pivots, export. */
import { readFileSync } from 'node:fs';
import { expect, type Page } from '@playwright/test';

export const $ = (page: Page, id: string) => page.locator(`[data-test="${id}"]`);

/** Waits until a view has drawn the pivot and the readout has a sweep to show. */
export async function boardReady(page: Page, pivot = 'UL.fl') {
  await page.waitForFunction(
    (id) => !!window.arcwrightBoard?.side?.pivotAt(id) && !!window.arcwrightBoard?.rear?.pivotAt(id),
    pivot,
  );
  await expect($(page, 'readout-antisquat')).toContainText('%');
  const dismiss = $(page, 'caution-dismiss');
  if (await dismiss.isVisible()) await dismiss.click();
}

export async function pivotAt(page: Page, view: 'side' | 'rear', id: string) {
  const at = await page.evaluate(([v, p]) => window.arcwrightBoard?.[v as 'side' | 'rear']?.pivotAt(p) ?? null, [
    view,
    id,
  ] as const);
  expect(at, `${id} drawn in the ${view} view`).not.toBeNull();
  return at!;
}

/** Lets the page finish what a gesture started: the tables refresh on an animation frame. */
export async function settled(page: Page) {
  await page.evaluate(
    () => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(() => requestAnimationFrame(r)))),
  );
}

/** Picks an item of the board's menu. */
export async function menuItem(page: Page, id: string) {
  await $(page, 'board-menu').click();
  await $(page, id).click();
}

/** Picks an export from the board's menu and reads the file it saves. */
export async function download(page: Page, id: string) {
  const [file] = await Promise.all([page.waitForEvent('download'), menuItem(page, id)]);
  return { name: file.suggestedFilename(), bytes: readFileSync((await file.path())!) };
}
