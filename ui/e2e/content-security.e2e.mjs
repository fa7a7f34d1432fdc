import { after, before, describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { BASE_URL, openBrowser, signIn } from './support/browser.mjs';

// The built app under the server's Content-Security-Policy: the page, its styles (Fluent's
// <style> elements carry the per-response nonce), fonts and charts load with no violation.
describe('the app under its Content-Security-Policy', () => {
  let browser;
  before(async () => {
    browser = await openBrowser();
  });
  after(async () => {
    await browser?.close();
  });

  it('serves each page with a fresh nonce that the header and the page share', async () => {
    const { page } = browser;
    const first = await page.goto(`${BASE_URL}/sign-in`);
    const policy = first.headers()['content-security-policy'];
    assert.match(policy, /script-src 'self';/);
    assert.match(policy, /frame-ancestors 'none'/);
    assert.doesNotMatch(policy, /unsafe-inline|unsafe-eval/);
    const headerNonce = /'nonce-([^']+)'/.exec(policy)?.[1];
    const pageNonce = await page.evaluate(() => document.querySelector('meta[property="csp-nonce"]')?.nonce);
    assert.ok(headerNonce, 'the policy names a nonce');
    assert.equal(pageNonce, headerNonce);
    const second = await page.goto(`${BASE_URL}/sign-in`);
    assert.notEqual(/'nonce-([^']+)'/.exec(second.headers()['content-security-policy'])?.[1], headerNonce);
    assert.equal(first.headers()['x-content-type-options'], 'nosniff');
    assert.equal(first.headers()['referrer-policy'], 'no-referrer');
  });

  it('renders the links list and a workspace with its charts without a single violation', async () => {
    const { page } = browser;
    await signIn(page, 'engineer@demo.test');
    await page.getByRole('heading', { name: 'Links' }).waitFor();
    await page.getByRole('link', { name: 'Depot to Harbour Office' }).first().click();
    await page.getByText('Link budget').first().waitFor();
    // the lazy chart chunk (ECharts) and the fonts load after the first paint
    await page.waitForLoadState('networkidle');
    const fontsReady = await page.evaluate(async () => {
      await document.fonts.ready;
      return [...document.fonts].filter((face) => face.status === 'loaded').length;
    });
    assert.ok(fontsReady > 0, 'Open Sans loaded from the app itself');
    assert.deepEqual(browser.consoleErrors, []);
  });
});
