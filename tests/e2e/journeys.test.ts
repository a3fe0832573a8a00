import { statSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { useE2e } from '../src/useE2e.js';
import { screenshot } from '../src/screenshot.js';
import { signIn } from '../src/signIn.js';

// One harness for all journeys: starting the stack and chromium once keeps the suite short.
const h = useE2e();

describe('admin invites a user', () => {
  it('signs in, sends an invite, reads it in the dev inbox and accepts it', async () => {
    const anon = await h.browser.newPage({ viewport: { width: 1360, height: 900 } });
    await anon.goto(`${h.baseUrl}/signin`);
    await anon.getByRole('button', { name: 'Sign in' }).waitFor();
    await screenshot(anon, '01-sign-in');
    await anon.getByRole('link', { name: 'Forgot your password?' }).click();
    await anon.getByRole('button', { name: 'Send reset link' }).waitFor();
    await screenshot(anon, '01a-forgot');
    await anon.close();

    const page = await signIn(h.browser, h.baseUrl, 'admin@fenwick.example');
    await page.getByRole('link', { name: 'Admin' }).click();
    await page.getByRole('cell', { name: 'engineer@fenwick.example', exact: true }).waitFor();
    await screenshot(page, '02-admin-users');

    await page.getByRole('tab', { name: 'Invite' }).click();
    await page.getByLabel('Email').fill('new.hand@fenwick.example');
    await page.getByLabel('Role').selectOption('production');
    await page.getByRole('button', { name: 'Send invite' }).click();
    await page.getByText('Invitation sent to new.hand@fenwick.example').waitFor();

    await page.getByRole('tab', { name: 'Dev inbox' }).click();
    const mail = page.getByRole('button', { name: /to new\.hand@fenwick\.example/ });
    await mail.waitFor();
    await mail.click();
    const body = page.getByRole('article', { name: 'Message body' });
    await body.waitFor();
    await screenshot(page, '03-admin-dev-inbox');
    const text = (await body.textContent()) ?? '';
    const link = /https?:\/\/\S+\/invite\/[A-Za-z0-9_-]+/.exec(text)?.[0];
    expect(link, `invite link in: ${text}`).toBeTruthy();

    await page.getByRole('tab', { name: 'Workspace' }).click();
    await page.getByLabel('Workspace name').waitFor();
    await screenshot(page, '04a-admin-workspace');

    await page.getByRole('tab', { name: 'Audit' }).click();
    await page.getByRole('cell', { name: 'invite.create' }).first().waitFor();
    await screenshot(page, '04-admin-audit');
    await page.context().close();

    const guest = await h.browser.newPage({ viewport: { width: 1360, height: 900 } });
    await guest.goto(link!);
    await guest.getByLabel('Your name').fill('Nell Hand');
    await screenshot(guest, '05-invite-accept');
    await guest.getByLabel(/^Password/).fill('a-long-enough-password');
    await guest.getByRole('button', { name: 'Create my account' }).click();
    await guest.waitForURL(/\/designs$/);
    await expect(guest.getByTestId('current-user').textContent()).resolves.toContain('production');
    await guest.close();
  });
});

describe('engineer designs, runs and compares', () => {
  it('creates a design with live results, runs it twice and compares the runs', async () => {
    const page = await signIn(h.browser, h.baseUrl, 'engineer@fenwick.example');
    await page.getByRole('link', { name: /FL-50 driver/ }).waitFor();
    await screenshot(page, '06-designs-list');

    await page.getByRole('link', { name: 'New design' }).click();
    await page.getByLabel('Design name').fill('E2E splitter');
    const balance = page.getByTestId('balance');
    await balance.waitFor();
    const before = await balance.textContent();
    await page.getByLabel('RL2 value').fill('91k');
    await expect.poll(() => balance.textContent()).not.toBe(before);
    await page.getByTestId('trim').waitFor();
    await page.getByLabel('Rk kind').selectOption({ label: 'Carbon composition' });
    await screenshot(page, '07-design-editor-live');
    await page.getByRole('button', { name: 'Create design' }).click();
    await page.waitForURL(/\/designs\/[0-9a-f-]{36}$/);
    const designUrl = page.url();
    await page.getByRole('heading', { name: 'E2E splitter' }).waitFor();
    await page.getByRole('link', { name: 'rev 1' }).waitFor();
    await expect(page.getByLabel('Rk kind').inputValue()).resolves.toBe('carbon-comp');
    await screenshot(page, '07a-design-saved');

    const launch = async (seed: string, plan: string) => {
      await page.getByLabel('Samples N').fill('4000');
      await page.getByLabel('Seed (blank = new)').fill(seed);
      await page.getByLabel('Sampling plan').selectOption(plan);
      await page.getByRole('button', { name: 'Launch run' }).click();
      await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/);
      const runUrl = page.url();
      await page.getByTestId('joint-yield').waitFor({ timeout: 60_000 });
      return runUrl;
    };
    const runA = await launch('e2e-a', 'random');
    await page
      .getByRole('heading', { name: /Influence on/ })
      .or(page.getByText(/Influence on/))
      .first()
      .waitFor();
    const yieldText = await page.getByTestId('joint-yield').textContent();
    expect(yieldText).toMatch(/^\d+(\.\d+)? %$/);
    await screenshot(page, '08-run-results');
    // Chart export: each chart saves as SVG and as PNG.
    for (const kind of ['SVG', 'PNG']) {
      const [download] = await Promise.all([
        page.waitForEvent('download'),
        page.getByRole('button', { name: `Download Balance (dB) as ${kind}` }).click(),
      ]);
      const file = await download.path();
      expect(download.suggestedFilename()).toMatch(new RegExp(`balanceDb\\.${kind.toLowerCase()}$`));
      expect(statSync(file).size).toBeGreaterThan(1000);
    }

    await page.goto(`${runA}/report`);
    await page.getByRole('button', { name: 'Print or save as PDF' }).waitFor();
    await page.getByTestId('joint-yield').waitFor();
    await page.emulateMedia({ media: 'print' });
    await screenshot(page, '09-run-report-print');
    await page.emulateMedia({ media: 'screen' });

    await page.getByRole('link', { name: 'E2E splitter' }).click();
    const runB = await launch('e2e-b', 'lhs');
    const ids = [runA, runB].map((u) => u.split('/').pop()).join(',');
    await page.getByRole('link', { name: 'Runs', exact: true }).click();
    await page.getByRole('link', { name: runB.split('/').pop()!.slice(0, 8) }).waitFor();
    await screenshot(page, '09a-runs-list');
    await page.goto(`${h.baseUrl}/compare?runs=${ids}`);
    await page.getByTestId('compare-p-1').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('compare-p-1').textContent()).toMatch(/^(< 0\.0001|\d\.\d{4})$/);
    await screenshot(page, '10-compare');

    // A long run: the progress bar survives a reload (it polls GET /api/runs/:id), and cancel stops it.
    await page.goto(designUrl);
    await page.getByLabel('Samples N').fill('20000000');
    await page.getByLabel('Seed (blank = new)').fill('e2e-long');
    await page.getByRole('button', { name: 'Launch run' }).click();
    await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/);
    await page.getByRole('progressbar', { name: 'Run progress' }).waitFor();
    await screenshot(page, '12-run-progress');
    await page.reload();
    await page.getByRole('progressbar', { name: 'Run progress' }).waitFor();
    await page.getByRole('button', { name: 'Cancel run' }).click();
    await page.getByRole('heading', { name: 'Run cancelled' }).waitFor();
    await page.context().close();
  });
});

describe('a viewer cannot edit', () => {
  it('sees designs read-only with edit and launch controls disabled', async () => {
    const page = await signIn(h.browser, h.baseUrl, 'viewer@fenwick.example');
    await expect(page.getByRole('link', { name: 'New design' }).count()).resolves.toBe(0);
    await expect(page.getByRole('link', { name: 'Admin' }).count()).resolves.toBe(0);
    // Search covers the notes of the latest revision too.
    await page.getByLabel('Search designs').fill('metal film');
    await expect.poll(() => page.getByRole('list', { name: 'Designs' }).getByRole('link').count()).toBe(1);
    await expect(page.getByRole('link', { name: /Studio line driver/ }).count()).resolves.toBe(1);
    await page.getByLabel('Search designs').fill('');
    await page.getByRole('link', { name: /FL-50 driver/ }).click();
    await page.getByLabel('Design name').waitFor();
    await expect(page.getByLabel('Design name').isDisabled()).resolves.toBe(true);
    await expect(page.getByLabel('RL1 value').isDisabled()).resolves.toBe(true);
    await expect(page.getByRole('button', { name: 'Launch run' }).isDisabled()).resolves.toBe(true);
    await expect(page.getByRole('button', { name: /Save revision/ }).count()).resolves.toBe(0);
    await page.getByTestId('balance').waitFor();
    await screenshot(page, '11-viewer-design');
    await page.getByRole('link', { name: 'rev 1' }).click();
    await page.getByText('back to the latest').waitFor();
    await expect(page.getByLabel('RL2 value').isDisabled()).resolves.toBe(true);
    await page.getByTestId('balance').waitFor();
    await screenshot(page, '11a-viewer-old-revision');
    await page.context().close();
  });
});

describe('password reset and the production role', () => {
  it('mails a reset link, sets a new password, and production may launch but not edit', async () => {
    const page = await h.browser.newPage({ viewport: { width: 1360, height: 900 } });
    await page.goto(`${h.baseUrl}/forgot`);
    await page.getByLabel('Email').fill('production@fenwick.example');
    await page.getByRole('button', { name: 'Send reset link' }).click();
    await page.getByRole('status').waitFor();
    // The server sends the mail after answering, so wait for the fake to store it.
    let text = '';
    await expect
      .poll(async () => {
        const row = await h.db
          .selectFrom('dev_mail')
          .select('text')
          .where('mail_to', '=', 'production@fenwick.example')
          .orderBy('received_at', 'desc')
          .executeTakeFirst();
        text = row?.text ?? '';
        return /\/reset\/\S+/.test(text);
      })
      .toBe(true);
    const link = /https?:\/\/\S+\/reset\/[A-Za-z0-9_-]+/.exec(text)![0];
    await page.goto(link);
    await page.getByLabel(/^New password/).fill('fresh-tail-pair-1');
    await page.getByLabel('Repeat it').fill('fresh-tail-pair-1');
    await screenshot(page, '13-reset-password');
    await page.getByRole('button', { name: 'Set password' }).click();
    await page.getByText('Password changed.').waitFor();
    await page.close();

    const prod = await signIn(h.browser, h.baseUrl, 'production@fenwick.example', 'fresh-tail-pair-1');
    await prod.getByRole('link', { name: /FL-50 driver/ }).click();
    await prod.getByRole('button', { name: 'Launch run' }).waitFor();
    await expect(prod.getByRole('button', { name: 'Launch run' }).isEnabled()).resolves.toBe(true);
    await expect(prod.getByLabel('Design name').isDisabled()).resolves.toBe(true);
    await prod.context().close();
  });
});
