import { after, before, describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { BASE_URL, openBrowser, screenshot, signIn } from './support/browser.mjs';

const DEMO_USERS = [
  { email: 'admin@demo.test', roleLabel: 'Administrator' },
  { email: 'engineer@demo.test', roleLabel: 'Link engineer' },
  { email: 'reviewer@demo.test', roleLabel: 'Reviewer' },
  { email: 'installer@demo.test', roleLabel: 'Installer' },
];

describe('signing in through the UI', () => {
  let browser;
  before(async () => {
    browser = await openBrowser();
  });
  after(async () => {
    await browser?.close();
  });

  it('shows the sign-in page to a visitor and names a wrong password beside the field', async () => {
    const { page } = browser;
    await page.goto(`${BASE_URL}/links`);
    await page.waitForURL(/\/sign-in\?redirectTo=%2Flinks/);
    await page.getByLabel('Email address').fill('engineer@demo.test');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('The email address or password is not correct.').waitFor();
    assert.equal(await page.getByLabel('Password').getAttribute('aria-invalid'), 'true');
    await screenshot(page, 'sign-in-wrong-password');
  });

  for (const user of DEMO_USERS) {
    it(`signs in as ${user.email} and sees the role "${user.roleLabel}"`, async () => {
      const { page, context } = browser;
      await context.clearCookies();
      await page.goto(`${BASE_URL}/sign-in`);
      await page.evaluate(() => window.localStorage.clear());
      await signIn(page, user.email);
      await page.getByRole('heading', { name: 'Links' }).waitFor();
      assert.equal((await page.getByTestId('current-role').textContent())?.trim(), user.roleLabel);
      const organisation = (await page.getByTestId('current-user').textContent()) ?? '';
      assert.ok(organisation.length > user.roleLabel.length, 'the header names the user and organisation');
      await screenshot(page, `signed-in-${user.email.split('@')[0]}`);
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    });
  }

  it('ends the token on the server when signing out: a copy of it is refused afterwards', async () => {
    const { page } = browser;
    await page.goto(`${BASE_URL}/sign-in`);
    await page.evaluate(() => window.localStorage.clear());
    await signIn(page, 'reviewer@demo.test');
    const token = await page.evaluate(() => JSON.parse(window.localStorage.getItem('beamwright.session') ?? '{}').accessToken);
    assert.ok(typeof token === 'string' && token.length > 0, 'the signed-in page keeps its token');
    const before = await fetch(`${BASE_URL}/api/auth/me`, { headers: { Authorization: `Bearer ${token}` } });
    assert.equal(before.status, 200);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    // the sign-out request is best effort and not awaited by the page: give it a moment
    let after;
    for (let attempt = 0; attempt < 20; attempt += 1) {
      after = await fetch(`${BASE_URL}/api/auth/me`, { headers: { Authorization: `Bearer ${token}` } });
      if (after.status === 401) break;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    assert.equal(after.status, 401);
  });

  it('reports no script errors in the page', () => {
    assert.deepEqual(browser.consoleErrors, []);
  });
});
