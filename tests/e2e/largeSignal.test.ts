import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { OUTPUT } from '../src/e2eHarness.js';
import { screenshot } from '../src/screenshot.js';
import { signIn } from '../src/signIn.js';
import { useE2e } from '../src/useE2e.js';

const h = useE2e();

describe('engineer reads the large-signal figures per sample', () => {
  it('launches a run with the large-signal switch on, reads its card and compares it with a run without', async () => {
    const page = await signIn(h.browser, h.baseUrl, 'engineer@fenwick.example');
    await page.getByRole('link', { name: /FL-50 driver/ }).click();
    await page.waitForURL(/\/designs\/[0-9a-f-]{36}$/);
    const designUrl = page.url();

    const launch = async (seed: string, largeSignal: boolean) => {
      await page.getByLabel('Samples N').fill('2000');
      await page.getByLabel('Seed (blank = new)').fill(seed);
      const box = page.getByLabel(/Large-signal figures per sample \(on a subsample, slower\)/);
      expect(await box.isChecked()).toBe(false); // off unless asked
      if (largeSignal) {
        await box.check();
        const size = page.getByLabel(/Subsample: first/);
        expect(await size.inputValue()).toBe('32');
        await size.fill('600');
        await page.getByText('A whole number from 32 to 512').waitFor();
        await page
          .locator('form')
          .filter({ has: box })
          .screenshot({ path: path.join(OUTPUT, '29a-launch-large-signal-bad-size.png') });
        expect(await page.getByRole('button', { name: 'Launch run' }).isDisabled()).toBe(true);
        await size.fill('48');
      }
      if (largeSignal)
        await page
          .locator('form')
          .filter({ has: box })
          .screenshot({ path: path.join(OUTPUT, '29-launch-large-signal.png') });
      await page.getByRole('button', { name: 'Launch run' }).click();
      await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/);
      await page.getByTestId('joint-yield').waitFor({ timeout: 90_000 });
      return page.url().split('/').pop()!;
    };

    const withLs = await launch('e2e-ls-on', true);
    const card = page.getByTestId('large-signal-spread');
    await card.waitFor();
    expect(await page.getByTestId('large-signal-subsample').textContent()).toBe('48');
    expect(await page.getByTestId('large-signal-drive').textContent()).toMatch(/^[\d.]+ m?V peak$/);
    for (const row of ['swing1', 'swing2', 'thd1', 'thd2', 'h21', 'h31', 'h22', 'h32']) {
      const cells = await page.getByTestId(`large-signal-${row}`).locator('td').allTextContents();
      // mean, interval, min, max, samples
      expect(cells, row).toHaveLength(5);
      expect(cells[1], row).toMatch(/^[\d.]+( \S+)? – [\d.]+ \S+$/);
      expect(cells[4], row).toBe('48');
    }
    expect(await page.getByTestId('large-signal-thd1').locator('td').first().textContent()).toMatch(/ %$/);
    expect(await page.getByTestId('large-signal-swing1').locator('td').first().textContent()).toMatch(/ V$/);
    await screenshot(page, '30-run-large-signal');
    // The card alone, legible at full size.
    await card
      .locator('xpath=ancestor::section[1]')
      .screenshot({ path: path.join(OUTPUT, '30a-large-signal-card.png') });

    await page.goto(designUrl);
    const without = await launch('e2e-ls-off', false);
    await page.getByTestId('large-signal-spread-absent').waitFor();
    await page
      .getByTestId('large-signal-spread-absent')
      .locator('xpath=ancestor::section[1]')
      .screenshot({ path: path.join(OUTPUT, '30b-large-signal-not-computed.png') });
    expect(await page.getByTestId('large-signal-spread').count()).toBe(0);

    await page.goto(`${h.baseUrl}/compare?runs=${withLs},${without}`);
    const table = page.getByTestId('compare-large-signal');
    await table.waitFor({ timeout: 30_000 });
    const thdRow = table.getByRole('row', { name: /THD, out 1/ });
    expect(await thdRow.locator('td').first().textContent()).toMatch(/^[\d.]+ %[\d.]+ – [\d.]+ %$/);
    expect(await thdRow.locator('td').nth(1).textContent()).toBe('not computed');
    await screenshot(page, '31-compare-large-signal');
    await table
      .locator('xpath=ancestor::section[1]')
      .screenshot({ path: path.join(OUTPUT, '31a-compare-large-signal-rows.png') });
    await page.context().close();
  });

  it('a viewer sees the switch but cannot launch', async () => {
    const page = await signIn(h.browser, h.baseUrl, 'viewer@fenwick.example');
    await page.getByRole('link', { name: /FL-50 driver/ }).click();
    const box = page.getByLabel(/Large-signal figures per sample/);
    await box.waitFor();
    expect(await box.isDisabled()).toBe(true);
    expect(await page.getByRole('button', { name: 'Launch run' }).isDisabled()).toBe(true);
    await page.context().close();
  });
});
