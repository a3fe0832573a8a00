import { describe, expect, it } from 'vitest';
import { useE2e } from '../src/useE2e.js';
import { screenshot } from '../src/screenshot.js';
import { signIn } from '../src/signIn.js';

const h = useE2e();

const DESIGN = 'FL-50 driver: 12AX7 cap-coupled splitter';

describe('production lead: lots and test limits', () => {
  it('uploads a lot, sees a malformed one refused, applies a lot to a design and computes a guard band', async () => {
    const page = await signIn(h.browser, h.baseUrl, 'production@fenwick.example');
    await page.getByRole('link', { name: 'Production', exact: true }).click();
    await page.getByRole('link', { name: /^Measured lots/ }).click();
    await page.getByRole('link', { name: '12AX7 incoming, box 3' }).waitFor();
    await screenshot(page, '20-lots-list');

    // A malformed file: refused with one row per problem, nothing stored.
    const form = page.getByRole('form', { name: 'Upload a lot' });
    await form.getByRole('button', { name: 'Upload lot' }).click();
    await page.getByText('Give the lot a name.').waitFor();
    await page.getByText('Choose a CSV file.').waitFor();
    await page.getByLabel('Lot name').fill('Rk reel 15');
    await page.getByLabel('CSV file').setInputFiles({
      name: 'reel15.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('value\n470\n4x7\n471\n-2\n469.5\n'),
    });
    await form.getByRole('button', { name: 'Upload lot' }).click();
    await page.getByText('Nothing was stored.').waitFor();
    expect(await page.getByTestId('row-error').count()).toBe(2);
    await expect(page.getByTestId('row-error').first().textContent()).resolves.toContain('4x7');
    await screenshot(page, '21-lot-row-errors');

    // A good file: stored, and its page shows the statistics.
    const values = Array.from({ length: 120 }, (_, i) => (1000 * (1 + 0.004 * Math.sin(i * 2.3))).toFixed(1));
    await page.getByLabel('CSV file').setInputFiles({
      name: 'reel15.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from('value\n' + values.join('\n') + '\n'),
    });
    await form.getByRole('button', { name: 'Upload lot' }).click();
    await page.getByRole('heading', { name: 'Rk reel 15' }).waitFor();
    await page.getByTestId('fit-normal').waitFor();
    await expect(page.getByTestId('lot-count').textContent()).resolves.toBe('120');

    // Apply it to Rk of a demo design: a new revision.
    await page.getByLabel('Design', { exact: true }).selectOption({ label: DESIGN });
    await page.getByLabel('Part', { exact: true }).selectOption('rk');
    await page.getByRole('button', { name: 'Apply as a new revision' }).click();
    await page.getByText(/Saved as\s+revision 2/).waitFor();
    await screenshot(page, '22-lot-detail-applied');

    // The sorted demo reel is called binned.
    await page.getByRole('link', { name: '← Lots' }).click();
    await page.getByRole('link', { name: 'Rt 10k 5 % carbon, reel 9 (sorted)' }).click();
    await page.getByText('Looks binned:').waitFor();
    await screenshot(page, '23-lot-binned');

    // The demo tube lot goes on the design's tubes, whole envelopes at a time.
    await page.getByRole('link', { name: '← Lots' }).click();
    await page.getByRole('link', { name: '12AX7 incoming, box 3' }).click();
    await page.getByText('Section-to-section correlation').waitFor();
    await page.getByLabel('Design', { exact: true }).selectOption({ label: DESIGN });
    await page.getByRole('button', { name: 'Apply as a new revision' }).click();
    await page.getByText(/Saved as\s+revision 3/).waitFor();
    await screenshot(page, '23a-tube-lot');
    await page.getByRole('link', { name: 'revision 3' }).click();
    await page.getByTestId('tube-lot').waitFor();
    await expect(page.getByTestId('tube-lot').textContent()).resolves.toContain('12AX7 incoming, box 3');
    await page.getByText('lot: Rk reel 15 (120)').waitFor();
    await screenshot(page, '23b-revision-with-lots');
    await page.getByRole('link', { name: 'Production', exact: true }).click();
    await page.getByRole('link', { name: /^Measured lots/ }).click();

    // Guard band calculator: a field error first, then the answer.
    await page.getByRole('link', { name: /Test limits and guard bands/ }).click();
    await page.getByLabel('Process mean').fill('100');
    await page.getByLabel('Process sd').fill('-1');
    await page.getByLabel('Measurement sd (same unit)').fill('0.3');
    await page.getByLabel('Spec low').fill('97.5');
    await page.getByLabel('Spec high').fill('102.5');
    await page.getByRole('button', { name: 'Compute' }).click();
    await page.getByText('must be a positive number').waitFor();
    await page.getByLabel('Process sd').fill('1');
    await page.getByLabel('Target false accept (PPM)').fill('50');
    await page.getByRole('button', { name: 'Compute' }).click();
    await page.getByTestId('guard-band').waitFor();
    await expect(page.getByTestId('guard-band').textContent()).resolves.toMatch(/Guard band .* meets/);
    await screenshot(page, '24-guard-band');
    await page.context().close();
  });
});
