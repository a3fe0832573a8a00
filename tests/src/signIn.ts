import type { Browser, Page } from 'playwright-core';

export const DEMO_PASSWORD = 'tailpair-demo';

/** A fresh browser context signed in through the sign-in form; returns its page on /designs. */
export async function signIn(
  browser: Browser,
  baseUrl: string,
  email: string,
  password = DEMO_PASSWORD,
): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1360, height: 900 } });
  const page = await context.newPage();
  page.on('pageerror', (err) => {
    throw err;
  });
  await page.goto(`${baseUrl}/signin`);
  await page.getByLabel('Email').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/designs$/);
  return page;
}
