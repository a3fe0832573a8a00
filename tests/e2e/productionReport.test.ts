import { describe, expect, it } from 'vitest';
import { useE2e } from '../src/useE2e.js';
import { screenshot } from '../src/screenshot.js';
import { signIn } from '../src/signIn.js';

const h = useE2e();

describe('production lead reports on a design', () => {
  it('runs a demo design, saves test limits, opens its production report, mails it to a colleague, and the mail reaches the dev inbox', async () => {
    const page = await signIn(h.browser, h.baseUrl, 'production@fenwick.example');
    // The demo design with the workshop's seeded tolerance plan.
    await page.getByRole('link', { name: /Combo 40 phase splitter/ }).click();
    await page.getByRole('button', { name: 'Launch run' }).waitFor();
    await page.getByLabel('Samples N').fill('4000');
    await page.getByLabel('Seed (blank = new)').fill('report-journey');
    await page.getByRole('button', { name: 'Launch run' }).click();
    await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/);
    await page.getByTestId('joint-yield').waitFor({ timeout: 60_000 });
    const runYield = await page.getByTestId('joint-yield').textContent();

    // Test limits on the run's balance, saved for the design.
    await page.getByRole('link', { name: 'Production', exact: true }).click();
    await page.getByRole('link', { name: /^Test limits/ }).click();
    await page.getByLabel('Process distribution').selectOption('run');
    await page.getByLabel('Run').selectOption({ index: 1 });
    await page.getByLabel('Metric').selectOption('balanceDb');
    await page.getByLabel('Measurement sd (same unit)').fill('0.05');
    await page.getByLabel('Spec low').fill('-0.5');
    await page.getByLabel('Spec high').fill('0.5');
    await page.getByLabel(/Save as this design’s test limits/).check();
    await page.getByRole('button', { name: 'Compute' }).click();
    await page.getByText('Saved as the test limits of the run’s design').waitFor();

    await page.getByRole('link', { name: 'Production', exact: true }).click();
    await page.getByRole('link', { name: 'Combo 40 phase splitter', exact: true }).click();
    await page.waitForURL(/\/production\/report\/[0-9a-f-]{36}$/);
    const joint = page.getByTestId('report-joint-yield');
    await joint.waitFor();
    expect(await joint.textContent()).toContain(runYield!);
    await expect(page.getByTestId('report-plan').textContent()).resolves.toMatch(/Target 500 PPM/);
    await expect(page.getByTestId('report-limits').textContent()).resolves.toMatch(/balanceDb: test/);
    await expect(page.getByRole('note', { name: 'Safety caution' }).count()).resolves.toBe(2);
    await page.emulateMedia({ media: 'print' });
    await screenshot(page, '20-production-report-print');
    await page.emulateMedia({ media: 'screen' });

    await page.getByLabel("Colleague's e-mail").fill('engineer@fenwick.example');
    await page.getByLabel('Note (optional)').fill('Numbers for Thursday’s build review.');
    await page.getByRole('button', { name: 'Send report' }).click();
    await page.getByText('Report sent to engineer@fenwick.example').waitFor();
    await screenshot(page, '21-production-report-sent');
    await page.context().close();

    const admin = await signIn(h.browser, h.baseUrl, 'admin@fenwick.example');
    await admin.getByRole('link', { name: 'Admin' }).click();
    await admin.getByRole('tab', { name: 'Dev inbox' }).click();
    const mail = admin
      .getByRole('button', {
        name: /production report.*to engineer@fenwick\.example|to engineer@fenwick\.example.*production report/,
      })
      .first();
    await mail.waitFor();
    await mail.click();
    const body = admin.getByRole('article', { name: 'Message body' });
    await body.waitFor();
    const text = (await body.textContent()) ?? '';
    expect(text).toContain('Joint yield');
    expect(text).toContain('Tolerance plan (target 500 PPM)');
    expect(text).toContain('Test limits (balanceDb)');
    expect(text).toMatch(/\/production\/report\/[0-9a-f-]{36}/);
    expect(text).toContain('High voltage');
    await screenshot(admin, '22-production-report-mail');
    await admin.context().close();
  });
});
