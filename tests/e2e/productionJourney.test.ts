import { describe, expect, it } from 'vitest';
import { useE2e } from '../src/useE2e.js';
import { screenshot } from '../src/screenshot.js';
import { signIn } from '../src/signIn.js';

const h = useE2e();

describe('production lead plans tolerances, compares pairing and ages a design', () => {
  it('plans to a PPM target (frontier, chosen plan, confirming run), compares pairing, applies ageing', async () => {
    const page = await signIn(h.browser, h.baseUrl, 'production@fenwick.example');
    await page.getByRole('link', { name: 'Production', exact: true }).click();
    await page.getByRole('heading', { name: 'Production', exact: true }).waitFor();
    // The seeded plan of the demo guitar design is listed.
    await page.getByRole('link', { name: /Combo 40 phase splitter rev 1/ }).waitFor();
    await screenshot(page, '20-production-home');

    // The invented demo price table; a bad price is refused at its field.
    await page.getByRole('link', { name: /Price table/ }).click();
    await expect(page.getByLabel('Row 1 tolerance').inputValue()).resolves.toBe('5');
    await page.getByLabel('Row 2 price').fill('-1');
    await page.getByRole('button', { name: 'Save prices' }).click();
    await page.getByText('A price of 0 or more').waitFor();
    await screenshot(page, '20a-prices');
    await page.getByRole('link', { name: 'Production', exact: true }).click();

    await page.getByRole('link', { name: /Tolerance plans/ }).click();
    const form = page.getByRole('form', { name: 'Plan tolerances' });
    await form
      .getByLabel('Design (latest revision)')
      .selectOption({ label: 'Combo 40 phase splitter (rev 1)' });
    // A field error in the browser, then one named by the server.
    await form.getByLabel('Target reject rate (PPM)').fill('0');
    await form.getByRole('button', { name: 'Find the cheapest plan' }).click();
    await form.getByText('A reject rate in PPM, above 0 and below 1,000,000').waitFor();
    await form.getByLabel('Target reject rate (PPM)').fill('5');
    await form.getByLabel('Common samples per candidate').fill('1000');
    await form.getByRole('button', { name: 'Find the cheapest plan' }).click();
    await form
      .getByText(/samples: 1000 samples cannot show 5 PPM/)
      .first()
      .waitFor();
    await screenshot(page, '21-plan-form-errors');

    await form.getByLabel('Target reject rate (PPM)').fill('500');
    await form.getByLabel('Common samples per candidate').fill('20000');
    await form.getByLabel('Confirming run samples (0 = none)').fill('100000');
    await form.getByRole('button', { name: 'Find the cheapest plan' }).click();
    await page.waitForURL(/\/production\/plans\/[0-9a-f-]+$/);
    await page.getByRole('img', { name: 'Cost per unit against reject rate' }).waitFor();
    await page.getByRole('heading', { name: 'Chosen plan' }).waitFor();
    await page.getByText(/The intervals overlap|do not overlap/).waitFor({ timeout: 60_000 });
    const intervals = (await page.getByTestId('plan-intervals').textContent()) ?? '';
    expect(intervals).toContain('ordinary run');
    expect(intervals).toContain('The intervals overlap');
    await screenshot(page, '22-plan-detail');

    await page.getByRole('link', { name: 'Production', exact: true }).click();
    await page.getByRole('link', { name: /Pairing strategies/ }).click();
    const pairing = page.getByRole('form', { name: 'Compare pairing strategies' });
    // A design whose balance spec feels the tube spread.
    await pairing
      .getByLabel('Design (latest revision)')
      .selectOption({ label: 'FL-50 driver: 12AX7 cap-coupled splitter (rev 1)' });
    await pairing.getByLabel('Matched: sections within ± %').fill('8');
    await pairing.getByRole('button', { name: 'Compare' }).click();
    await page.getByTestId('pairing-result').waitFor();
    await page.getByRole('cell', { name: 'Matched: Ia within ± 8 %' }).waitFor();
    await screenshot(page, '23-pairing');

    // The same comparison with tubes from a measured lot (Ia of each section, mA).
    const lotBox = pairing.getByLabel(/paste a measured lot/);
    await lotBox.fill('1.21, 1.18\n1.05, x');
    await pairing.getByRole('button', { name: 'Compare' }).click();
    await pairing.getByText('line 2: two positive numbers (section 1, section 2)').waitFor();
    await lotBox.fill('1.21, 1.18\n1.05, 1.12\n0.98, 0.99\n1.30, 1.02\n1.10, 1.08\n0.92, 1.01');
    await pairing.getByRole('button', { name: 'Compare' }).click();
    await page.getByText('Tubes from a measured lot of 6 envelopes.').waitFor();
    await screenshot(page, '23a-pairing-lot');
    // And from the workshop's stored tube lot, chosen by name: whole envelopes as measured.
    await pairing
      .getByLabel('Stored tube lot (optional)')
      .selectOption({ label: '12AX7 incoming, box 3 · 12AX7 · 200 envelopes' });
    await pairing.getByRole('button', { name: 'Compare' }).click();
    await page.getByText('Tubes from a measured lot of 200 envelopes.').waitFor();

    await page.getByRole('link', { name: 'Production', exact: true }).click();
    await page.getByRole('link', { name: /Ageing/ }).click();
    const ageing = page.getByRole('form', { name: 'Apply ageing' });
    await ageing
      .getByLabel('Design (latest revision)')
      .selectOption({ label: 'Combo 40 phase splitter (rev 2)' });
    await ageing.getByLabel('Tube emission loss shift').fill('25');
    await ageing.getByRole('button', { name: 'Apply ageing' }).click();
    await page.getByTestId('ageing-result').waitFor();
    await page.getByRole('heading', { name: 'Margin to each spec' }).waitFor();
    await screenshot(page, '24-ageing');
    await page.context().close();
  });
});
