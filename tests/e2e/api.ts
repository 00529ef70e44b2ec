/** API calls the browser tests make beside the page: the CSRF token, and a sketch shared by link. */
import { expect, type APIRequestContext, type Browser } from '@playwright/test';
import { DEMO, signIn } from './fixtures';

export async function csrf(request: APIRequestContext): Promise<string> {
  return ((await (await request.get('/api/auth/csrf')).json()) as { token: string }).token;
}

/** The demo maker, in a browser context of their own, makes a four-link starter and shares it by link; its token. */
export async function ownerSharesStarter(browser: Browser, baseURL: string | undefined): Promise<string> {
  const owner = await browser.newContext({ baseURL });
  try {
    const page = await owner.newPage();
    await signIn(page, DEMO.maker);
    await page.goto('/sketches/new?starter=four-link-lateral-rod');
    await expect(page).toHaveURL(/\/sketches\/\d+$/);
    const id = Number(page.url().match(/(\d+)$/)![1]);
    const share = await page.request.post(`/api/sketches/${id}/share`, {
      data: { mode: 'link' },
      headers: { 'X-CSRF-Token': await csrf(page.request) },
    });
    expect(share.status()).toBe(200);
    return ((await share.json()) as { shareToken: string }).shareToken;
  } finally {
    await owner.close();
  }
}
