import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { test, expect, snap, ARTIFACTS } from './fixtures';
import type { Page } from '@playwright/test';
import { $, boardReady, download, menuItem } from './board';

const cell = (page: Page, id: string, axis: 'x' | 'y' | 'z') => $(page, `pivot-${id}-${axis}`);
const num = async (page: Page, id: string, axis: 'x' | 'y' | 'z') => Number(await cell(page, id, axis).inputValue());

test('import a hardpoint table: the preview lists the bad row, apply moves the pivot, undo puts it back', async ({
  page,
}) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  const [x0, y0, z0] = [await num(page, 'UL.fl', 'x'), await num(page, 'UL.fl', 'y'), await num(page, 'UL.fl', 'z')];
  const partnerZ = await num(page, 'UL.fr', 'z');

  const table = ['id,body,x (mm),y (mm),z (mm)', `UL.fl,frame,${x0},${y0},${z0 + 25}`, 'XX.9,frame,1,2,abc', ''];
  await menuItem(page, 'import-hardpoints');
  await page.locator('[data-test="hardpoint-import"] input[type="file"]').setInputFiles({
    name: 'hardpoints.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from(table.join('\r\n')),
  });
  await expect($(page, 'hardpoint-change-UL.fl')).toContainText(`${z0.toFixed(1)} mm → ${(z0 + 25).toFixed(1)} mm`);
  await expect($(page, 'hardpoint-problem')).toHaveText([
    "Row 3: no pivot 'XX.9' in this sketch",
    "Row 3: z is 'abc', not a number",
  ]);
  await snap(page, 'hardpoint-import-preview');
  // Nothing has changed yet.
  expect(await num(page, 'UL.fl', 'z')).toBe(z0);

  await $(page, 'hardpoint-apply').click();
  await expect($(page, 'hardpoint-import')).toHaveCount(0);
  await expect(cell(page, 'UL.fl', 'z')).toHaveValue(String(z0 + 25));
  // The table gives each pivot it moves: the partner is not mirrored.
  expect(await num(page, 'UL.fr', 'z')).toBe(partnerZ);

  await page.keyboard.press('Control+z');
  await expect(cell(page, 'UL.fl', 'z')).toHaveValue(String(z0));
});

test('the board hands on the hardpoints and the sweep as CSV and its views as one PNG on white', async ({ page }) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);

  const hardpoints = await download(page, 'export-hardpoints-csv');
  expect(hardpoints.name).toMatch(/-hardpoints\.csv$/);
  const lines = hardpoints.bytes.toString('utf8').trimEnd().split('\r\n');
  expect(lines[0]).toBe('id,body,x (mm),y (mm),z (mm)');
  const z = await num(page, 'UL.fl', 'z');
  expect(lines.find((l) => l.startsWith('UL.fl,'))).toMatch(new RegExp(`^UL\\.fl,frame,[^,]+,[^,]+,${z}$`));

  const sweep = await download(page, 'export-sweep-csv');
  expect(sweep.name).toMatch(/-sweep\.csv$/);
  expect(sweep.bytes.toString('utf8').split(',')[0]).toBe('travel (mm)');

  const png = await download(page, 'export-views-png');
  expect(png.name).toMatch(/-views\.png$/);
  writeFileSync(join(ARTIFACTS, 'board-views-export.png'), png.bytes);
  // PNG signature, then the IHDR chunk's width (big-endian, bytes 16-19): both views at twice their size,
  // with 16 px margins around and between them (src/board/viewsImage.ts), also doubled.
  expect(png.bytes.subarray(1, 4).toString('latin1')).toBe('PNG');
  const widths = await page.evaluate(() =>
    ['side', 'rear'].map((v) => document.querySelector(`[data-test="canvas-${v}"] canvas`)!.clientWidth),
  );
  expect(png.bytes.readUInt32BE(16)).toBe(2 * (widths[0] + widths[1]) + 2 * 16 * 3);
  const corner = await page.evaluate(async (b64) => {
    const img = new Image();
    img.src = `data:image/png;base64,${b64}`;
    await img.decode();
    const c = document.createElement('canvas');
    c.width = img.width;
    c.height = img.height;
    const ctx = c.getContext('2d')!;
    ctx.drawImage(img, 0, 0);
    return Array.from(ctx.getImageData(2, 2, 1, 1).data);
  }, png.bytes.toString('base64'));
  expect(corner).toEqual([255, 255, 255, 255]);
});
