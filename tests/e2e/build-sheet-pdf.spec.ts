import { readFileSync } from 'node:fs';
import type { Download, Page } from '@playwright/test';
import { extractText, getDocumentProxy } from 'unpdf';
import { test, expect } from './fixtures';
import { $, boardReady } from './board';
import { starters } from '../../shared/kinematics';
import { DATUM_TEXT } from '../../shared/sheet/buildSheet';

/** The downloaded PDF's text (white space runs as one space) and its first page's size in pt. */
async function readPdf(download: Download): Promise<{ text: string; size: number[] }> {
  const bytes = new Uint8Array(readFileSync(await download.path()));
  const pdf = await getDocumentProxy(bytes);
  const { text } = await extractText(pdf, { mergePages: true });
  return { text: text.replace(/\s+/g, ' '), size: (await pdf.getPage(1)).view };
}

async function download(page: Page, click: () => Promise<void>): Promise<Download> {
  const pending = page.waitForEvent('download');
  await click();
  return pending;
}

test('the board menu and the build sheet page download the build sheet as a PDF, on the paper picked and in the user’s unit', async ({
  page,
}) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  const doc = starters['four-link-lateral-rod']!.build();
  const ul = doc.points.find((p) => p.id === 'UL.fl')!;

  // From the board's menu, on US Letter (8.5 × 11 in, 72 pt to the inch), in mm.
  await $(page, 'board-menu').click();
  await $(page, 'build-sheet-pdf').click();
  const letter = await download(page, () => $(page, 'build-sheet-pdf-letter').click());
  expect(letter.suggestedFilename()).toMatch(/\.build-sheet\.pdf$/);
  const fromBoard = await readPdf(letter);
  expect(fromBoard.size.slice(2)).toEqual([612, 792]);
  expect(fromBoard.text).toContain(DATUM_TEXT.replace(/\s+/g, ' '));
  expect(fromBoard.text).toContain(`UL.fl ${ul.x.toFixed(1)} ${ul.y.toFixed(1)} ${ul.z.toFixed(1)}`);

  // From the build sheet page, on A4, after the user picks inches (25.4 mm to the inch).
  await page.keyboard.press('Escape');
  await page.locator('[aria-label="Units"]').getByText('in', { exact: true }).click();
  await $(page, 'board-menu').click();
  await $(page, 'open-build-sheet').click();
  await expect(page).toHaveURL(/\/sketches\/\d+\/sheet$/);
  await expect($(page, 'sheet-pdf')).toContainText('PDF (in)');
  await $(page, 'sheet-pdf').click();
  const a4 = await readPdf(await download(page, () => $(page, 'sheet-pdf-a4').click()));
  // ISO 216: A4 is 210 × 297 mm.
  expect(a4.size[2]).toBeCloseTo((210 / 25.4) * 72, 1);
  expect(a4.size[3]).toBeCloseTo((297 / 25.4) * 72, 1);
  expect(a4.text).toContain('x (in)');
  expect(a4.text).toContain(
    `UL.fl ${(ul.x / 25.4).toFixed(2)} ${(ul.y / 25.4).toFixed(2)} ${(ul.z / 25.4).toFixed(2)}`,
  );
});
