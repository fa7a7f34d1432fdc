import { after, before, describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { BASE_URL, openBrowser, screenshot, signIn } from './support/browser.mjs';

// "2.8 km" -> metres; the test types back a shorter path in the same words an engineer would.
function readMetres(text) {
  const match = /^\s*([\d.]+)\s*(km|m)\s*$/.exec(text);
  assert.ok(match, `path length field reads "${text}"`);
  return Number(match[1]) * (match[2] === 'km' ? 1000 : 1);
}

async function textOf(locator) {
  return ((await locator.textContent()) ?? '').trim();
}

describe('the planner', () => {
  let browser;
  let linkUrl;
  let savedRevision;

  before(async () => {
    browser = await openBrowser({ width: 1440, height: 1000 });
  });
  after(async () => {
    await browser?.close();
  });

  it('lets the engineer change the range, see the margin move before saving, and save revision n+1', async () => {
    const { page } = browser;
    await signIn(page, 'engineer@demo.test');
    const table = page.getByTestId('links-table');
    await table.waitFor();
    assert.ok((await table.locator('[data-link-id]').count()) > 0, 'the demo has links');
    await screenshot(page, 'links-table');

    await table.locator('[data-link-id] a').first().click();
    await page.getByTestId('design-results').waitFor();
    linkUrl = page.url();
    const saveButton = page.getByRole('button', { name: /^Save as revision \d+$/ });
    const nextRevision = Number((await textOf(saveButton)).replace(/\D+/g, ''));
    assert.ok(await saveButton.isDisabled(), 'nothing to save before an edit');

    const marginBefore = await textOf(page.getByTestId('link-margin'));
    const pathLength = page.locator('main input[name="rangeM"]');
    const metres = readMetres(await pathLength.inputValue());
    const shorterKm = Math.round((metres * 0.8) / 10) / 100;
    await pathLength.fill(`${shorterKm} km`);

    // the budget is recomputed in the browser: the margin changes with nothing saved
    await page.waitForFunction(
      (before) => document.querySelector('[data-testid="link-margin"]')?.textContent?.trim() !== before,
      marginBefore,
    );
    const marginAfter = await textOf(page.getByTestId('link-margin'));
    assert.notEqual(marginAfter, marginBefore);
    const toNumber = (text) => Number(text.replace('\u2212', '-').replace(/[^\d.+-]/g, ''));
    assert.ok(toNumber(marginAfter) > toNumber(marginBefore), `a shorter path has more margin (${marginBefore} -> ${marginAfter})`);
    assert.match(await textOf(page.getByTestId('edit-status')), /1 field changed since revision \d+, not saved yet/);

    // a typo is named beside its field and nothing is lost
    await pathLength.fill('2,5 km');
    await page.getByText('Path length use a point as the decimal separator').waitFor();
    assert.ok(await saveButton.isDisabled(), 'an invalid design cannot be saved');
    await pathLength.fill(`${shorterKm} km`);
    for (const chart of ['chart-waterfall', 'chart-beam', 'chart-range', 'chart-visibility']) {
      await page.getByTestId(chart).locator('svg').first().waitFor();
    }
    await page.waitForTimeout(400);
    await screenshot(page, 'workspace-engineer-edited');

    await saveButton.click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('button', { name: 'Save revision' }).click();
    await dialog.getByText('Add a note: what changed and why.').waitFor();
    await dialog.getByLabel('Note').fill(`Path shortened to ${shorterKm} km after the site survey (browser test)`);
    await dialog.getByRole('button', { name: 'Save revision' }).click();
    await page.getByTestId('saved-notice').waitFor();
    assert.match(await textOf(page.getByTestId('saved-notice')), new RegExp(`Saved as revision ${nextRevision}\\b`));
    savedRevision = nextRevision;
    assert.match(await textOf(page.getByTestId('edit-status')), new RegExp(`No unsaved changes to revision ${nextRevision}`));

    // the same screen in the dark theme, remembered until switched back
    await page.getByTestId('theme-toggle').click();
    await page.waitForTimeout(400);
    await screenshot(page, 'workspace-engineer-dark');
    await page.getByTestId('theme-toggle').click();

    await page.getByRole('button', { name: 'History and review' }).click();
    const row = page.locator(`[data-testid="revisions-table"] [data-revision="${nextRevision}"]`);
    await row.waitFor();
    assert.match(await textOf(row), /Path shortened to .* km after the site survey/);
    const diff = page.getByTestId('revision-diff');
    await diff.waitFor();
    assert.match(await textOf(diff), /Path length/);
    await screenshot(page, 'history-engineer');
  });

  it('turns a save conflict into a field-by-field comparison and re-applies the engineer’s edits', async () => {
    const { page } = browser;
    assert.ok(linkUrl, 'the first step opened a link');
    await page.goto(linkUrl);
    await page.getByTestId('design-results').waitFor();
    const linkId = new URL(linkUrl).pathname.split('/').pop();
    const pathLength = page.locator('main input[name="rangeM"]');
    const metres = readMetres(await pathLength.inputValue());
    const editedKm = Math.round((metres * 0.9) / 10) / 100;
    await pathLength.fill(`${editedKm} km`);

    // Meanwhile the same engineer, signed in elsewhere (another tab, another machine), saves a
    // revision of the same link through the api. (Only engineers write designs.)
    const login = await fetch(`${BASE_URL}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: 'engineer@demo.test', password: process.env.DEMO_PASSWORD ?? 'demo-pass-2026' }),
    });
    assert.equal(login.status, 200);
    const { accessToken } = await login.json();
    const headers = { Authorization: `Bearer ${accessToken}`, 'Content-Type': 'application/json' };
    const current = await (await fetch(`${BASE_URL}/api/links/${linkId}`, { headers })).json();
    const theirPowerDbm = current.design.transmitter.powerDbm - 1;
    const competing = await fetch(`${BASE_URL}/api/links/${linkId}/revisions`, {
      method: 'POST',
      headers,
      body: JSON.stringify({
        baseRevision: current.revision,
        design: { ...current.design, transmitter: { ...current.design.transmitter, powerDbm: theirPowerDbm } },
        note: 'Transmit power lowered by 1 dB (browser test, concurrent edit)',
      }),
    });
    assert.equal(competing.status, 201);
    const theirRevision = current.revision + 1;

    await page.getByRole('button', { name: `Save as revision ${theirRevision}` }).click();
    const saveDialog = page.getByRole('dialog');
    await saveDialog.getByLabel('Note').fill('Path corrected after the second survey (browser test)');
    await saveDialog.getByRole('button', { name: 'Save revision' }).click();

    const conflict = page.getByRole('alertdialog');
    await conflict.getByText(`Revision ${theirRevision} was saved while you were editing`).waitFor();
    assert.match(await textOf(conflict.getByTestId('conflict-their-changes')), /Transmit power/);
    await page.waitForTimeout(500); // let the dialog finish fading in
    await screenshot(page, 'workspace-save-conflict', { fullPage: false });
    await conflict.getByRole('button', { name: `Load revision ${theirRevision} and re-apply my edits` }).click();
    await page.getByTestId('rebase-notice').waitFor();
    assert.equal(await pathLength.inputValue(), `${editedKm} km`, 'the typed path length survived the conflict');
    assert.match(await page.locator('main input[name="transmitter.powerDbm"]').inputValue(), new RegExp(`^${theirPowerDbm} dBm$`));

    await page.getByRole('button', { name: `Save as revision ${theirRevision + 1}` }).click();
    assert.equal(await saveDialog.getByLabel('Note').inputValue(), 'Path corrected after the second survey (browser test)');
    await saveDialog.getByRole('button', { name: 'Save revision' }).click();
    await page.getByTestId('saved-notice').waitFor();
    assert.match(await textOf(page.getByTestId('saved-notice')), new RegExp(`Saved as revision ${theirRevision + 1}\\b`));
    savedRevision = theirRevision + 1;
    const stored = await (await fetch(`${BASE_URL}/api/links/${linkId}`, { headers })).json();
    assert.equal(stored.revision, savedRevision);
    assert.equal(stored.design.transmitter.powerDbm, theirPowerDbm);
    assert.ok(Math.abs(stored.design.rangeM - editedKm * 1000) < 1e-6);
  });

  it('lets the engineer archive a link behind a confirmation, find it with the archived switch, and restore it', async () => {
    const { page } = browser;
    await page.goto(`${BASE_URL}/links?q=Riverside`);
    const table = page.getByTestId('links-table');
    await table.locator('[data-link-id] a').first().click();
    await page.getByTestId('revision-meta').waitFor();
    const archivedUrl = page.url();

    await page.getByRole('button', { name: 'Archive', exact: true }).click();
    const confirm = page.getByRole('alertdialog');
    await confirm.getByText('Archive this link?').waitFor();
    await confirm.getByRole('button', { name: 'Archive', exact: true }).click();
    await page.getByTestId('archived-flag').waitFor();
    assert.match(await textOf(page.getByTestId('revision-meta')), /read-only until restored/);
    assert.equal(await page.locator('main input[name="rangeM"]').count(), 0, 'an archived link takes no edits');

    await page.goto(`${BASE_URL}/links?q=Riverside`);
    await page.getByText(/Archived links are hidden/).waitFor();
    await page.getByRole('switch', { name: 'Show archived links' }).click();
    await table.waitFor();
    assert.match(await textOf(table.locator('[data-link-id]').first()), /Archived/);

    await page.goto(archivedUrl);
    await page.getByRole('button', { name: 'Restore', exact: true }).click();
    await page.getByRole('alertdialog').getByRole('button', { name: 'Restore', exact: true }).click();
    await page.locator('main input[name="rangeM"]').waitFor();
    assert.equal(await page.getByTestId('archived-flag').count(), 0);
  });

  it('gives the installer the design to read and no way to edit it', async () => {
    const { page, context } = browser;
    assert.ok(linkUrl, 'the engineer step opened a link');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await context.clearCookies();
    await signIn(page, 'installer@demo.test');
    assert.equal(await page.getByRole('button', { name: 'New link' }).count(), 0);

    await page.goto(linkUrl);
    await page.getByTestId('design-readout').waitFor();
    await page.getByTestId('link-margin').waitFor();
    const main = page.locator('main');
    assert.equal(await main.locator('input, textarea, select').count(), 0, 'no inputs on the installer’s workspace');
    assert.equal(await main.getByRole('button', { name: /save|discard|submit|approve/i }).count(), 0);
    assert.match(await textOf(page.getByTestId('revision-meta')), new RegExp(`Revision ${savedRevision}\\b`));
    // the eye-safety indication travels with the design
    await page.getByTestId('eye-safety-caution').waitFor();
    for (const chart of ['chart-waterfall', 'chart-beam', 'chart-range', 'chart-visibility']) {
      await page.getByTestId(chart).locator('svg').first().waitFor();
    }
    await page.waitForTimeout(400);
    await screenshot(page, 'workspace-installer');

    await page.goto(`${BASE_URL}/links/new`);
    await page.getByTestId('links-table').waitFor();
    assert.match(new URL(page.url()).pathname, /^\/links$/);
  });

  it('reports no script errors in the page', () => {
    assert.deepEqual(browser.consoleErrors, []);
  });
});
