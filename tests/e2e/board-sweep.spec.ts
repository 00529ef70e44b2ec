import { deflateSync, crc32 } from 'node:zlib';
import { test, expect, snap } from './fixtures';
import type { Page } from '@playwright/test';
import { starters } from '../../shared/kinematics';
import { csrf } from './api';
import { initialPlacement } from '../../src/canvas/tracingGeometry';
import { planeToScreen, type PlanePoint, type ViewTransform } from '../../src/canvas/transform';

const $ = (page: Page, test: string) => page.locator(`[data-test="${test}"]`);

/** A small PNG made here (a grey card with a dark band), so the test needs no photo from anywhere. */
function makePng(width: number, height: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(body));
    return Buffer.concat([len, body, crc]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // RGB
  const rows: Buffer[] = [];
  for (let y = 0; y < height; y++) {
    const row = Buffer.alloc(1 + width * 3);
    for (let x = 0; x < width; x++) {
      const v = y > height * 0.7 && y < height * 0.8 ? 60 : 200;
      row.fill(v, 1 + x * 3, 4 + x * 3);
    }
    rows.push(row);
  }
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(Buffer.concat(rows))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** A fresh four-link starter sketch of the signed-in maker's, made through the API. */
async function newFourLink(page: Page, name: string): Promise<number> {
  const document = { ...starters['four-link-lateral-rod']!.build(), name };
  const res = await page.request.post('/api/sketches', {
    data: { name, document },
    headers: { 'X-CSRF-Token': await csrf(page.request) },
  });
  expect(res.status()).toBe(201);
  return ((await res.json()) as { id: number }).id;
}

async function openBoard(page: Page, id: number) {
  await page.goto(`/sketches/${id}`);
  await page.waitForFunction(() => !!window.arcwrightBoard?.side?.pivotAt('UL.fl'));
  await expect($(page, 'plot-pinion').locator('canvas')).toBeVisible();
  await expect($(page, 'readout-antisquat')).toContainText('%');
}

async function viewTransform(page: Page, view: 'side' | 'rear' = 'side'): Promise<ViewTransform> {
  return page.evaluate((v) => window.arcwrightBoard![v]!.transform(), view);
}
const sideTransform = (page: Page) => viewTransform(page, 'side');

/** Client pixels of a plane point of a view (the side view unless told). */
async function clientOf(page: Page, p: PlanePoint, view: 'side' | 'rear' = 'side'): Promise<{ x: number; y: number }> {
  const t = await viewTransform(page, view);
  const box = (await $(page, `canvas-${view}`).boundingBox())!;
  const s = planeToScreen(t, p);
  return { x: box.x + s.px, y: box.y + s.py };
}

test('dragging a pivot changes a travel plot and the readout; typing a coordinate does too', async ({ page }) => {
  const id = await newFourLink(page, 'Sweep test: drag');
  await openBoard(page, id);
  await snap(page, 'board-sweep-open');

  const readoutBefore = await $(page, 'readout-antisquat').innerText();
  const plotBefore = await $(page, 'plot-antisquat').screenshot();

  // Drag the left upper link's frame pivot 60 px up on the side view.
  const at = await page.evaluate(() => window.arcwrightBoard!.side!.pivotAt('UL.fl'));
  await page.mouse.move(at!.x, at!.y);
  await page.mouse.down();
  for (let i = 1; i <= 12; i++) await page.mouse.move(at!.x, at!.y - 5 * i);
  await page.mouse.up();

  await expect($(page, 'readout-antisquat')).not.toHaveText(readoutBefore);
  await expect
    .poll(async () => Buffer.compare(await $(page, 'plot-antisquat').screenshot(), plotBefore) !== 0)
    .toBe(true);
  await snap(page, 'board-sweep-after-drag');

  // The travel slider moves the readout off ride height and the cursor with it.
  await expect($(page, 'readout-position')).toHaveText('at ride height');
  await $(page, 'slider-travel').focus();
  for (let i = 0; i < 6; i++) await page.keyboard.press('ArrowRight');
  await expect($(page, 'readout-position')).toHaveText('at +30.0 mm bump');
  await snap(page, 'board-sweep-travel-30');

  // Type a coordinate in the pivot table: the lateral rod's frame end 60 mm higher moves the roll centre.
  await page.keyboard.press('Home');
  const rcBefore = await $(page, 'readout-rc').innerText();
  const zCell = page.locator('[data-test="pivot-LR.f-z"]');
  await zCell.fill('440');
  await zCell.press('Enter');
  await expect($(page, 'readout-rc')).not.toHaveText(rcBefore);
});

test('the caution shows once, is dismissed for good, and stays reachable from the board menu', async ({ page }) => {
  const id = await newFourLink(page, 'Sweep test: caution');
  await openBoard(page, id);
  await expect($(page, 'caution-banner')).toContainText('Geometry only');
  await $(page, 'caution-dismiss').click();
  await expect($(page, 'caution-banner')).toHaveCount(0);
  await page.reload();
  await expect($(page, 'readout-antisquat')).toContainText('%');
  await expect($(page, 'caution-banner')).toHaveCount(0);
  await $(page, 'board-menu').click();
  await $(page, 'caution-menu-item').click();
  await expect($(page, 'caution-dialog')).toContainText('not whether they are strong enough');
});

test('targets shade the plots and missed ones are flagged', async ({ page }) => {
  const id = await newFourLink(page, 'Sweep test: targets');
  await openBoard(page, id);
  await $(page, 'tab-targets').click();
  const plotBefore = await $(page, 'plot-antisquat').screenshot();
  const min = page.locator('[data-test="target-antiSquat-min"]');
  await min.fill('70');
  await min.press('Enter');
  const max = page.locator('[data-test="target-antiSquat-max"]');
  await max.fill('90');
  await max.press('Enter');
  await expect(page.locator('[data-test="target-antiSquat-status"]')).toHaveAttribute('data-status', 'missed');
  await expect
    .poll(async () => Buffer.compare(await $(page, 'plot-antisquat').screenshot(), plotBefore) !== 0)
    .toBe(true);
  await $(page, 'tab-flags').click();
  await expect($(page, 'flag-target')).toContainText('Target missed: Anti-squat');
  await snap(page, 'board-sweep-targets');
});

test('a side photo uploads behind the side view, takes its scale from two clicked points, moves, and stays put when locked', async ({
  page,
}) => {
  const id = await newFourLink(page, 'Sweep test: tracing');
  await openBoard(page, id);
  await $(page, 'tab-tracing').click();

  const width = 400;
  const height = 200;
  await $(page, 'tracing-file').setInputFiles({
    name: 'chassis-side.png',
    mimeType: 'image/png',
    buffer: makePng(width, height),
  });
  const wheelbase = starters['four-link-lateral-rod']!.build().vehicle.wheelbase;
  const placed = initialPlacement('side', width, height, { wheelbase, track: 1600 });
  await expect($(page, 'tracing-scale')).toHaveText(`Scale: 1 photo pixel = ${placed.mmPerPx.toPrecision(3)} mm`);
  await snap(page, 'board-sweep-tracing-added');

  // Two points 1000 mm apart at the photo's first scale, low down where no pivot or link lies.
  const a = { h: 1300, v: 100 };
  const b = { h: 300, v: 100 };
  await $(page, 'tracing-set-scale').click();
  const pa = await clientOf(page, a);
  await page.mouse.click(pa.x, pa.y);
  const pb = await clientOf(page, b);
  await page.mouse.click(pb.x, pb.y);
  // They are really 1500 mm apart: every photo pixel covers 1.5 times as much.
  const distance = page.locator('[data-test="tracing-distance"]');
  await distance.fill('1500');
  await $(page, 'tracing-apply').click();
  await expect($(page, 'tracing-picking')).toHaveCount(0);
  // Clicks land on whole pixels: the clicked 1000 mm is good to about two view pixels; the scale is shown to
  // three significant digits (up to 0.26 % here).
  const shown = await $(page, 'tracing-scale').innerText();
  const mmPerPx = Number(/= ([\d.]+) mm/.exec(shown)![1]);
  const pxPerMm = (await sideTransform(page)).scale;
  const clickError = 2 / (1000 * pxPerMm);
  const roundingError = 0.005;
  expect(Math.abs(mmPerPx / (placed.mmPerPx * 1.5) - 1)).toBeLessThan(clickError + roundingError);
  await snap(page, 'board-sweep-tracing-scaled');

  // Saved with the sketch: the document carries the tracing at its new scale.
  const saved = async () => {
    const detail = (await (await page.request.get(`/api/sketches/${id}`)).json()) as {
      document: { tracing?: { side?: { mmPerPx: number; centre: PlanePoint } } };
    };
    return detail.document.tracing?.side;
  };
  await expect.poll(async () => (await saved())?.mmPerPx ?? 0).toBeGreaterThan(placed.mmPerPx * 1.4);

  // Move: drag the photo 40 px to the right (towards the rear: h grows to the left on screen).
  const before = (await saved())!.centre;
  const grip = await clientOf(page, { h: 1300, v: 120 });
  await page.mouse.move(grip.x, grip.y);
  await page.mouse.down();
  for (let i = 1; i <= 8; i++) await page.mouse.move(grip.x + 5 * i, grip.y);
  await page.mouse.up();
  const pxPerMmNow = (await sideTransform(page)).scale;
  await expect
    .poll(async () => before.h - (await saved())!.centre.h, { timeout: 10_000 })
    .toBeGreaterThan((40 / pxPerMmNow) * 0.9);
  const moved = (await saved())!.centre;
  expect(moved.h).toBeCloseTo(before.h - 40 / pxPerMmNow, 0);

  // Locked, the same drag leaves it where it is.
  await $(page, 'tracing-lock').click();
  await page.mouse.move(grip.x, grip.y);
  await page.mouse.down();
  for (let i = 1; i <= 8; i++) await page.mouse.move(grip.x + 5 * i, grip.y);
  await page.mouse.up();
  await page.waitForTimeout(2000); // longer than the autosave delay
  expect((await saved())!.centre).toEqual(moved);
});

test('a photo behind the rear view is its own: placed across the track, scaled from clicks in the rear view', async ({
  page,
}) => {
  const id = await newFourLink(page, 'Sweep test: rear tracing');
  await openBoard(page, id);
  await $(page, 'tab-tracing').click();
  await $(page, 'tracing-view').getByRole('button', { name: 'rear view' }).click();
  await $(page, 'tracing-file').setInputFiles({
    name: 'axle-rear.png',
    mimeType: 'image/png',
    buffer: makePng(400, 200),
  });
  const track = starters['four-link-lateral-rod']!.build().vehicle.track;
  const placed = initialPlacement('rear', 400, 200, { wheelbase: 3000, track });
  await expect($(page, 'tracing-scale')).toHaveText(`Scale: 1 photo pixel = ${placed.mmPerPx.toPrecision(3)} mm`);

  // 800 mm apart across the photo, below the axle, where no pivot or link lies; really 1200 mm.
  await $(page, 'tracing-set-scale').click();
  for (const h of [400, -400]) {
    const at = await clientOf(page, { h, v: 100 }, 'rear');
    await page.mouse.click(at.x, at.y);
  }
  await page.locator('[data-test="tracing-distance"]').fill('1200');
  await $(page, 'tracing-apply').click();
  await expect($(page, 'tracing-picking')).toHaveCount(0);
  await snap(page, 'board-sweep-tracing-rear');

  const saved = async () =>
    (
      (await (await page.request.get(`/api/sketches/${id}`)).json()) as {
        document: { tracing?: { side?: unknown; rear?: { mmPerPx: number } } };
      }
    ).document.tracing;
  const clickError = 2 / (800 * (await viewTransform(page, 'rear')).scale);
  await expect.poll(async () => (await saved())?.rear?.mmPerPx ?? 0).toBeGreaterThan(placed.mmPerPx * 1.4);
  const t = (await saved())!;
  expect(Math.abs(t.rear!.mmPerPx / (placed.mmPerPx * 1.5) - 1)).toBeLessThan(clickError + 1e-9);
  // The side view has no photo: each view keeps its own.
  expect(t.side).toBeUndefined();
  await $(page, 'tracing-view').getByRole('button', { name: 'side view' }).click();
  await expect($(page, 'tracing-scale')).toHaveCount(0);
});

test('a file that is not a photo is refused with a message and changes nothing', async ({ page }) => {
  const id = await newFourLink(page, 'Sweep test: bad photo');
  await openBoard(page, id);
  await $(page, 'tab-tracing').click();
  await $(page, 'tracing-file').setInputFiles({
    name: 'notes.txt',
    mimeType: 'text/plain',
    buffer: Buffer.from('not a photo'),
  });
  await expect($(page, 'tracing-error')).toContainText('“notes.txt” is not a PNG or JPEG photo.');
  await expect($(page, 'tracing-scale')).toHaveCount(0);
});
