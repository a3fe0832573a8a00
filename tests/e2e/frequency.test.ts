import { describe, expect, it } from 'vitest';
import { useE2e } from '../src/useE2e.js';
import { screenshot } from '../src/screenshot.js';
import { signIn } from '../src/signIn.js';

const h = useE2e();

describe('engineer works on the frequency response', () => {
  it('sees the nominal plots, tightens a coupling capacitor and reads the 20 kHz balance yield and influence', async () => {
    const page = await signIn(h.browser, h.baseUrl, 'engineer@fenwick.example');
    await page.getByRole('link', { name: /FL-50 driver/ }).click();
    await page.waitForURL(/\/designs\/[0-9a-f-]{36}$/);

    // The nominal frequency response, computed in the browser.
    const balancePlot = page.getByRole('img', { name: 'Balance against frequency' });
    await balancePlot.waitFor();
    await page.getByRole('img', { name: 'Gain of output 1 and output 2 against frequency' }).waitFor();
    expect(await page.getByTestId('corners').textContent()).toMatch(/out 1 [\d.]+ Hz … [\d.]+ kHz/);
    // The demo design carries a 20 kHz balance spec.
    expect(
      await page
        .getByLabel(/Spec \d frequency Hz/)
        .first()
        .inputValue(),
    ).toBe('20000');
    // Large-signal figures from the triode model, nominal.
    expect(await page.getByTestId('large-signal').textContent()).toMatch(
      /(grid current|cut-off), section \d/,
    );
    await screenshot(page, '20-frequency-editor');

    // Tighten both output coupling capacitors from ±10 % to ±2 % and save a revision.
    await page.getByLabel('Cout1 (output 1 coupling) tolerance percent').fill('2');
    await page.getByLabel('Cout2 (output 2 coupling) tolerance percent').fill('2');
    await page.getByRole('button', { name: 'Save revision' }).click();
    await page.getByText('revision 2').waitFor();

    await page.getByLabel('Samples N').fill('4000');
    await page.getByLabel('Seed (blank = new)').fill('e2e-freq');
    await page.getByRole('button', { name: 'Launch run' }).click();
    await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/);
    await page.getByTestId('joint-yield').waitFor({ timeout: 90_000 });

    // The 20 kHz balance spec reports its yield like any other spec.
    const card = page.getByText(/Balance at 20 kHz: Balance at 20 kHz/).first();
    await card.waitFor();
    // The balance band over the samples.
    await page.getByTestId('balance-band').waitFor();
    // Influence on the 20 kHz balance.
    await page.locator('#influence-metric').selectOption('acBalanceDb@20000');
    await page.getByText('Influence on Balance at 20 kHz').first().waitFor();
    await screenshot(page, '21-frequency-run');
    const cardText = await page.locator('div', { has: card }).filter({ hasText: 'Cpk' }).last().textContent();
    expect(cardText).toMatch(/\d+(\.\d+)? %/);
    await page.context().close();
  });
});
