import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { useE2e } from '../src/useE2e.js';
import { screenshot } from '../src/screenshot.js';
import { signIn } from '../src/signIn.js';

const h = useE2e();

/** Opens a design from the Designs page and runs it with a few thousand samples. */
async function runDesign(page: Page, name: RegExp, seed: string): Promise<void> {
  await page.goto(`${h.baseUrl}/designs`);
  await page.getByRole('link', { name }).click();
  await page.waitForURL(/\/designs\/[0-9a-f-]{36}$/);
  await page.getByLabel('Samples N').fill('4000');
  await page.getByLabel('Seed (blank = new)').fill(seed);
  await page.getByRole('button', { name: 'Launch run' }).click();
  await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/);
  await page.getByTestId('joint-yield').waitFor({ timeout: 90_000 });
}

describe('engineer chooses between a long-tailed pair and a split-load splitter', () => {
  it('edits the split-load design, runs both, and sets them side by side', async () => {
    const page = await signIn(h.browser, h.baseUrl, 'engineer@fenwick.example');
    await page.getByRole('link', { name: /Guitar 12AU7 split-load/ }).click();
    await page.waitForURL(/\/designs\/[0-9a-f-]{36}$/);
    expect(await page.getByLabel('Topology').inputValue()).toBe('split-load');
    await page.getByText('Gain to cathode').waitFor();
    expect(await page.getByTestId('balance').textContent()).toMatch(/dB$/);
    // Its frequency response and large signal, as for a pair: plate and cathode.
    await page.getByRole('img', { name: 'Balance against frequency' }).waitFor();
    expect(await page.getByTestId('corners').textContent()).toMatch(/out 2 \d[\d.]* Hz … [\d.]+ [kM]Hz/);
    expect(await page.getByTestId('large-signal').textContent()).toMatch(/THD plate \/ cathode[\d.]+ %/);
    await screenshot(page, '30-split-load-editor');

    await runDesign(page, /Guitar 12AU7 split-load/, 'e2e-split');
    await runDesign(page, /FL-50 driver/, 'e2e-ltp');

    await page.goto(`${h.baseUrl}/designs`);
    await page.getByRole('link', { name: 'Choose the splitter' }).click();
    await page.waitForURL(/\/designs\/choose/);
    // Opened without a choice, it starts from one design of each kind; each list offers only its kind.
    await page.waitForURL(/ltp=.*split=|split=.*ltp=/);
    const splitOptions = await page
      .getByLabel('Split-load', { exact: true })
      .locator('option')
      .allTextContents();
    expect(splitOptions).toContain('Guitar 12AU7 split-load');
    expect(splitOptions).not.toContain('FL-50 driver: 12AX7 cap-coupled splitter');
    await page
      .getByLabel('Long-tailed pair')
      .selectOption({ label: 'FL-50 driver: 12AX7 cap-coupled splitter' });
    await page.getByLabel('Split-load', { exact: true }).selectOption({ label: 'Guitar 12AU7 split-load' });
    const table = page.getByRole('table', { name: 'Splitter comparison' });
    await table.getByText('Split-load (cathodyne)').waitFor();
    await table
      .getByText(/% \(rev \d+, 4,000 samples\)/)
      .nth(1)
      .waitFor();
    const text = (await table.textContent()) ?? '';
    expect(text).toMatch(/Long-tailed pair, capacitor-coupled/);
    expect(text).not.toMatch(/no finished run/);
    // Swing of each output and distortion at one stated output level, for both designs.
    expect(text).toMatch(
      /Symmetrical swing, output 1 \(peak, before grid current or cut-off\)[\d.]+ V[\d.]+ V/,
    );
    expect(text).toMatch(/THD at 20 V peak on output 1: output 1 \/ output 2[\d.]+ % \/ [\d.]+ %/);
    expect(text.match(/peak drive\)/g)).toHaveLength(2);
    await screenshot(page, '31-choose-splitter');
    await page.context().close();
  });
});
