import { test as base, expect, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';

export const ARTIFACTS = join(import.meta.dirname, 'artifacts');
mkdirSync(ARTIFACTS, { recursive: true });

/** The demo accounts seeded on first start (README lists them). */
export const DEMO = {
  admin: { email: 'admin@demo.test', password: 'demo-admin-2026' },
  instructor: { email: 'instructor@demo.test', password: 'demo-instructor-2026' },
  maker: { email: 'maker@demo.test', password: 'demo-maker-2026' },
  student: { email: 'student@demo.test', password: 'demo-student-2026' },
} as const;

/** The text box of a Quasar field, whether its data-test sits on the input or on the field around it. */
export function inputOf(page: Page, testId: string) {
  return page.locator(`input[data-test="${testId}"], [data-test="${testId}"] input`).first();
}

/** Signs in through the sign-in page, as a user would, and waits for the library. */
export async function signIn(page: Page, who: { email: string; password: string }): Promise<void> {
  await page.goto('/signin');
  await inputOf(page, 'email').fill(who.email);
  await inputOf(page, 'password').fill(who.password);
  await page.getByTestId('submit').click();
  await expect(page).toHaveURL(/\/library/);
}

/** A screenshot for people to look at, under tests/e2e/artifacts (git-ignored). */
export async function snap(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: join(ARTIFACTS, `${name}.png`), fullPage: false });
}

/** `page` arrives signed in as the demo maker (a member). Requests that leave the app fail the test. */
export const test = base.extend<{ page: Page }>({
  page: async ({ page, baseURL }, use) => {
    const outside: string[] = [];
    page.on('request', (req) => {
      const url = req.url();
      if (!url.startsWith(baseURL ?? '') && !url.startsWith('data:') && !url.startsWith('blob:')) outside.push(url);
    });
    await signIn(page, DEMO.maker);
    await use(page);
    expect(outside, 'requests that left the app').toEqual([]);
  },
});

export { expect };
