import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { test, expect, snap, inputOf } from './fixtures';

// The example sketch file the format documentation ships.
const EXAMPLE = join(import.meta.dirname, '../../docs/examples/workshop-runabout.sketch.json');

test('import a sketch file, find it by search, delete it and undo the delete', async ({ page }) => {
  const doc = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as { name: string };
  const name = `Imported runabout ${Date.now()}`;
  await page.getByTestId('import-input').setInputFiles({
    name: 'runabout.json',
    mimeType: 'application/json',
    buffer: Buffer.from(JSON.stringify({ ...doc, name })),
  });
  await expect(page.getByText(`Imported “${name}”`)).toBeVisible();

  await inputOf(page, 'search').fill('Imported runabout');
  const table = page.getByTestId('library-table');
  await expect(table).toContainText(name);
  await expect(table.locator('tbody tr')).toHaveCount(1);

  await table.locator('tbody tr').first().getByRole('button', { name: 'Actions' }).click();
  await page
    .getByRole('menuitem', { name: 'Delete' })
    .or(page.locator('.q-item', { hasText: 'Delete' }))
    .first()
    .click();
  await expect(page.getByText(`Deleted “${name}”`)).toBeVisible();
  await expect(page.getByTestId('empty-state')).toBeVisible();
  await snap(page, 'library-deleted-undo');
  await page.getByRole('button', { name: 'Undo' }).click();
  await expect(table).toContainText(name);
});

test('a file that is not a sketch is refused with the problems named, and nothing is added', async ({ page }) => {
  const table = page.getByTestId('library-table');
  await expect(table.locator('tbody tr').first()).toBeVisible(); // the page has loaded its rows
  await page.getByTestId('import-input').setInputFiles({
    name: 'broken.json',
    mimeType: 'application/json',
    buffer: Buffer.from(
      JSON.stringify({
        format: 'arcwright.sketch',
        version: 1,
        name: 'broken',
        points: [{ id: 'A', body: 'frame', x: 'far' }],
      }),
    ),
  });
  const notice = page.locator('.q-notification').filter({ hasText: 'Could not import broken.json' });
  await expect(notice).toBeVisible();
  await expect(notice).toContainText('points[0].x');
  await snap(page, 'library-import-refused');
  await inputOf(page, 'search').fill('broken');
  await expect(page.getByTestId('empty-state')).toBeVisible();

  await page
    .getByTestId('import-input')
    .setInputFiles({ name: 'notes.json', mimeType: 'application/json', buffer: Buffer.from('{ not json') });
  await expect(page.locator('.q-notification').filter({ hasText: 'the file is not JSON' })).toBeVisible();
});
