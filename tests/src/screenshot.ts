import path from 'node:path';
import type { Page } from 'playwright-core';
import { OUTPUT } from './e2eHarness.js';

/** Full-page screenshot under tests/output/ (gitignored), for looking at by eye. */
export async function screenshot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(OUTPUT, `${name}.png`), fullPage: true });
}
