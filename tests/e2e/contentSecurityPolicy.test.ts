import { describe, expect, it } from 'vitest';
import { useE2e } from '../src/useE2e.js';
import { screenshot } from '../src/screenshot.js';
import { signIn } from '../src/signIn.js';

// The built web app under the server's real Content-Security-Policy: chromium reports every
// blocked script, style, font, image or fetch as a console error and a securitypolicyviolation
// event; the journey below must produce none.
const h = useE2e();

describe('Content-Security-Policy in the browser', () => {
  it('blocks nothing the app needs: pages, d3 charts, live results, fonts, chart export', async () => {
    const page = await signIn(h.browser, h.baseUrl, 'engineer@fenwick.example');
    const violations: string[] = [];
    page.on('console', (msg) => {
      if (/Content Security Policy|Refused to/i.test(msg.text())) violations.push(msg.text());
    });
    // A string (it runs in the page, which has the DOM types this Node project lacks).
    await page.context().addInitScript({
      content: `document.addEventListener('securitypolicyviolation', (e) => {
        console.error('Refused to load (CSP ' + e.violatedDirective + '): ' + e.blockedURI + ' at ' + e.sourceFile + ':' + e.lineNumber + ':' + e.columnNumber);
      });`,
    });
    const csp = (await page.request.get(h.baseUrl + '/')).headers()['content-security-policy'];
    expect(csp).toMatch(/default-src 'self'/);

    // A fresh load so the init script is in place, then designs → a design → a run with charts.
    await page.goto(`${h.baseUrl}/designs`);
    await page.getByRole('link', { name: /FL-50 driver/ }).click();
    await page.getByTestId('balance').waitFor();
    await page.getByLabel('Samples N').fill('2000');
    await page.getByLabel('Seed (blank = new)').fill('csp');
    await page.getByRole('button', { name: 'Launch run' }).click();
    await page.waitForURL(/\/runs\/[0-9a-f-]{36}$/);
    await page.getByTestId('joint-yield').waitFor({ timeout: 60_000 });
    await page
      .getByText(/Influence on/)
      .first()
      .waitFor();
    const [png] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download Balance (dB) as PNG' }).click(),
    ]);
    expect(png.suggestedFilename()).toMatch(/\.png$/);
    await page.goto(`${page.url()}/report`);
    await page.getByTestId('joint-yield').waitFor();
    await page.goto(`${h.baseUrl}/designs/new`);
    await page.getByTestId('balance').waitFor();

    // Fonts come from the bundled @fontsource files (font-src 'self').
    const fonts = await page.evaluate<string[]>(`(async () => {
      await document.fonts.ready;
      return [...document.fonts].filter((f) => f.status === 'loaded').map((f) => f.family);
    })()`);
    expect(fonts.join(',')).toMatch(/Inter/);
    await screenshot(page, 'csp-design-editor');
    expect(violations).toEqual([]);
  });

  it('forbids framing the app (frame-ancestors none, X-Frame-Options DENY)', async () => {
    const res = await fetch(`${h.baseUrl}/designs`);
    expect(res.headers.get('x-frame-options')).toBe('DENY');
    expect(res.headers.get('content-security-policy')).toMatch(/frame-ancestors 'none'/);
  });
});

describe('sign out everywhere', () => {
  it('ends the sessions of the same account in other browsers at once', async () => {
    const laptop = await signIn(h.browser, h.baseUrl, 'viewer@fenwick.example');
    const bench = await signIn(h.browser, h.baseUrl, 'viewer@fenwick.example');
    await bench.getByRole('button', { name: 'Sign out everywhere' }).click();
    await bench.waitForURL(/\/signin$/);
    await laptop.reload();
    await laptop.waitForURL(/\/signin/);
    await laptop.getByRole('button', { name: 'Sign in' }).waitFor();
    await screenshot(laptop, 'signed-out-everywhere');
    await laptop.context().close();
    await bench.context().close();
  });
});
