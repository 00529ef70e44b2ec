/**
 * The keyboard alone: every control below is reached with Tab and worked with keys (page.keyboard only,
 * no clicks), its effect checked on the page, with a visible focus ring on the way.
 */
import { test, expect, DEMO, inputOf, signIn } from './fixtures';
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

/**
 * How the focus is drawn on the focused control: "ring" for a solid outline at least 2 px wide, or, for a Quasar
 * text field (which the app leaves to show focus its own way), "field line" for the field's 2 px line in colour
 * all round (outlined) or underneath at full width (standard); else what is missing.
 */
function focusDrawn(page: Page): Promise<string> {
  return page.evaluate(() => {
    const at = document.activeElement!;
    const field = at.closest('.q-field');
    const control = field?.querySelector('.q-field__control');
    if (field && control && at.matches('.q-field__native, .q-field__input')) {
      if (!field.classList.contains('q-field--highlighted')) return 'a field not marked focused';
      const line = getComputedStyle(control, '::after');
      if (field.classList.contains('q-field--outlined')) {
        const colour = line.borderTopColor.match(/[\d.]+/g)!.map(Number);
        const opaque = colour.length < 4 || colour[3]! > 0;
        return parseFloat(line.borderTopWidth) >= 2 && opaque ? 'field line' : `a ${line.borderTopWidth} border`;
      }
      const scale = line.transform === 'none' ? 1 : new DOMMatrix(line.transform).a;
      return parseFloat(line.height) >= 2 && scale === 1 ? 'field line' : `a ${line.height} line at ${scale} width`;
    }
    const style = getComputedStyle(at);
    const ring = style.outlineStyle === 'solid' && parseFloat(style.outlineWidth) >= 2;
    return ring ? 'ring' : `a ${style.outlineStyle} ${style.outlineWidth} outline`;
  });
}

/** The focused control shows its focus (a field's line grows in over a few tenths of a second). */
async function expectFocusRing(page: Page): Promise<void> {
  await expect.poll(() => focusDrawn(page), 'the focused control shows its focus').toMatch(/^(ring|field line)$/);
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

/** Presses a key up to MAX_TABS times until `target` has the focus; fails if it never does. */
async function pressTo(page: Page, key: string, target: Locator): Promise<void> {
  for (let i = 0; i < MAX_TABS; i++) {
    if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) return;
    await page.keyboard.press(key);
  }
  throw new Error(`${MAX_TABS} presses of ${key} did not reach ${target}`);
}

/** The open dialog layer (Quasar's role="dialog" element) that holds `inside`. */
const dialogHolding = (page: Page, inside: Locator) => page.getByRole('dialog').filter({ has: inside });

/** Stops allowed for one round of Tab through a dialog: the largest dialog here has about twenty. */
const MAX_DIALOG_STOPS = 40;

/**
 * Where document.activeElement is: true inside the dialog, else a description for the failure message. (A native
 * date field's picker button has the focus inside the field's own shadow tree, where `:focus` does not reach; the
 * document names the field.)
 */
const focusInside = (dialog: Locator) =>
  dialog.evaluate((el) => {
    const at = document.activeElement;
    return el.contains(at) ? true : `the focus is on ${at?.outerHTML.slice(0, 120) ?? 'nothing'}`;
  });

/**
 * Tab (or Shift+Tab) moves the focus through the dialog and, after its last stop, back to where it started,
 * never outside it; each stop shows its focus.
 */
async function expectTabCycle(page: Page, dialog: Locator, key: 'Tab' | 'Shift+Tab', minStops: number): Promise<void> {
  await expect.poll(() => focusInside(dialog), 'the focus is in the dialog').toBe(true);
  const start = await page.evaluate(() => {
    document.activeElement!.setAttribute('data-focus-start', '');
    return document.activeElement!.outerHTML.slice(0, 120);
  });
  const startLocator = page.locator('[data-focus-start]');
  let stops = 0;
  try {
    for (;;) {
      await page.keyboard.press(key);
      stops++;
      await expect.poll(() => focusInside(dialog), `after ${stops} × ${key} from ${start}`).toBe(true);
      await expectFocusRing(page);
      if (await startLocator.evaluate((el) => el === document.activeElement)) break;
      expect(stops, `${key} comes back to ${start}`).toBeLessThan(MAX_DIALOG_STOPS);
    }
  } finally {
    await startLocator.evaluate((el) => el.removeAttribute('data-focus-start'));
  }
  expect(stops, `${key} steps through the dialog's controls`).toBeGreaterThanOrEqual(minStops);
}

/**
 * An open dialog from the keyboard: the focus is on `first` (its first field or main control), Tab and
 * Shift+Tab go round inside it, Escape closes it and the focus goes back to `opener`.
 */
async function expectDialogKeyboard(
  page: Page,
  dialog: Locator,
  first: Locator,
  opener: Locator,
  minStops = 2,
): Promise<void> {
  await expect(dialog).toBeVisible();
  await expect(first).toBeFocused();
  await expectFocusRing(page);
  await expectTabCycle(page, dialog, 'Tab', minStops);
  await expectTabCycle(page, dialog, 'Shift+Tab', minStops);
  await page.keyboard.press('Escape');
  await expect(dialog).toBeHidden();
  await expect(opener).toBeFocused();
}

/** Opens the menu of the focused button with Enter and waits until the menu has the focus (once it has faded in). */
async function openMenu(page: Page): Promise<void> {
  await page.keyboard.press('Enter');
  // Quasar's menu element, around the list of items (role="menu").
  await expect(page.locator('.q-menu:focus-within')).toHaveCount(1);
}

/** Opens the menu of the focused button, walks to `item` with the arrow keys and picks it with Enter. */
async function menuPick(page: Page, item: Locator): Promise<void> {
  await openMenu(page);
  await pressTo(page, 'ArrowDown', item);
  await expectFocusRing(page);
  await page.keyboard.press('Enter');
}

test('a dialog from the board’s menu: the share dialog takes the focus, keeps it, and gives it back', async ({
  page,
}) => {
  await page.goto('/sketches/new?starter=four-link-lateral-rod');
  await expect(page).toHaveURL(/\/sketches\/\d+$/);
  await boardReady(page);
  const menu = $(page, 'board-menu');
  await tabTo(page, menu);

  // The menu: arrow keys move through its items; Escape closes it and the focus is back on its button.
  await openMenu(page);
  const share = $(page, 'open-share');
  await pressTo(page, 'ArrowDown', share);
  await page.keyboard.press('Escape');
  await expect(share).toBeHidden();
  await expect(menu).toBeFocused();

  await menuPick(page, share);
  const dialog = dialogHolding(page, $(page, 'share-dialog'));
  await expectDialogKeyboard(page, dialog, $(page, 'share-create'), menu);

  // Made from the keyboard, the link takes the focus; stopping it asks first, in a dialog of its own that starts
  // on keeping the link and gives the focus back to "Stop sharing" when it closes.
  await menuPick(page, share);
  await expect($(page, 'share-create')).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(inputOf(page, 'share-url')).toBeFocused();
  const revoke = $(page, 'share-revoke');
  await pressTo(page, 'Tab', revoke);
  await page.keyboard.press('Enter');
  const confirm = page.getByRole('dialog').filter({ hasText: 'Stop sharing?' });
  await expectDialogKeyboard(page, confirm, confirm.getByRole('button', { name: 'Keep sharing' }), revoke);
  await expect($(page, 'share-status')).toContainText('A read-only link is live.');
  await page.keyboard.press('Escape');
  await expect(dialog).toBeHidden();
  await expect(menu).toBeFocused();

  await menuPick(page, $(page, 'import-hardpoints'));
  const file = $(page, 'hardpoint-file');
  // The file field's data-test sits on its hidden file input; the control that takes the focus holds that input.
  await expectDialogKeyboard(page, dialogHolding(page, file), file.locator('xpath=..'), menu);

  await menuPick(page, $(page, 'caution-menu-item'));
  await expectDialogKeyboard(page, dialogHolding(page, $(page, 'caution-dialog')), $(page, 'caution-close'), menu, 1);
});

test('the new-sketch dialog from the keyboard: focus on its first field, kept inside, given back', async ({ page }) => {
  const opener = $(page, 'new-sketch').first();
  await tabTo(page, opener);
  await page.keyboard.press('Enter');
  const dialog = dialogHolding(page, $(page, 'starter-dialog'));
  await expectDialogKeyboard(page, dialog, inputOf(page, 'starter-layout'), opener);
});

test('a library action’s dialog from the keyboard: Rename from a sketch’s menu', async ({ page }) => {
  const actions = page.locator('[data-test^="actions-"]').first();
  await tabTo(page, actions);
  await menuPick(page, page.getByRole('menuitem', { name: 'Rename' }));
  const dialog = page.getByRole('dialog').filter({ hasText: 'Rename sketch' });
  const name = dialog.getByRole('textbox');
  await expectDialogKeyboard(page, dialog, name, actions);

  // Once more, and this time a new name typed and Enter pressed: the sketch is renamed.
  const renamed = `Renamed from the keyboard ${Date.now()}`;
  await menuPick(page, page.getByRole('menuitem', { name: 'Rename' }));
  await expect(name).toBeFocused();
  await page.keyboard.press('Control+a');
  await page.keyboard.type(renamed);
  await page.keyboard.press('Enter');
  await expect(dialog).toBeHidden();
  await expect(page.getByTestId('library-table')).toContainText(renamed);
});

test('the class dialogs from the keyboard: new class, renaming, new assignment and feedback', async ({ browser }) => {
  const context = await browser.newContext();
  try {
    const page = await context.newPage();
    await signIn(page, DEMO.instructor);
    await page.goto('/classes');
    const newClass = $(page, 'new-class');
    await tabTo(page, newClass);
    await page.keyboard.press('Enter');
    await expectDialogKeyboard(
      page,
      dialogHolding(page, $(page, 'new-class-dialog')),
      inputOf(page, 'new-class-name'),
      newClass,
    );

    // The demo class: renaming it (a prompt) and a new assignment.
    await page.getByRole('link', { name: /Chassis Design 210/ }).click();
    await expect($(page, 'class-name')).toHaveText('Chassis Design 210');
    const rename = $(page, 'class-rename');
    await tabTo(page, rename);
    await page.keyboard.press('Enter');
    const prompt = page.getByRole('dialog').filter({ hasText: 'Rename the class' });
    await expectDialogKeyboard(page, prompt, prompt.getByRole('textbox'), rename);

    const newAssignment = $(page, 'new-assignment');
    await tabTo(page, newAssignment);
    await page.keyboard.press('Enter');
    await expectDialogKeyboard(
      page,
      dialogHolding(page, $(page, 'assignment-dialog')),
      inputOf(page, 'assignment-sketch'),
      newAssignment,
    );

    // Lab 3's hand-ins: writing feedback on one.
    await page.getByRole('link', { name: /Lab 3/ }).click();
    await expect($(page, 'hand-ins-table')).toBeVisible();
    const write = page.getByRole('button', { name: /feedback for/ }).first();
    await tabTo(page, write);
    await page.keyboard.press('Enter');
    await expectDialogKeyboard(
      page,
      dialogHolding(page, $(page, 'feedback-dialog')),
      page.locator('textarea[data-test="feedback-text"], [data-test="feedback-text"] textarea'),
      write,
    );
  } finally {
    await context.close();
  }
});
