// The engineer adds a site by its DMS coordinates, finds it on the site plan, and creates a link
// to it from the depot; the new link is then drawn on the plan with its verdict in words.
import { after, before, describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { BASE_URL, openBrowser, screenshot, signIn } from './support/browser.mjs';

describe('sites and the site plan', () => {
  let browser;
  before(async () => {
    browser = await openBrowser({ width: 1440, height: 1000 });
  });
  after(async () => {
    await browser?.close();
  });

  it('adds a site by DMS, shows it on the plan and links it to the depot', async () => {
    const { page, consoleErrors } = browser;
    await signIn(page, 'engineer@demo.test');
    const suffix = Date.now();
    const siteName = `Pier lamp ${suffix}`;

    await page.getByRole('link', { name: 'Sites', exact: true }).click();
    await page.getByTestId('sites-table').waitFor();
    await page.getByRole('button', { name: 'New site' }).click();
    await page.getByLabel('Site name').fill(siteName);
    // about 0.8 km south-east of the demo depot (56.0° N, 10.0° E)
    await page.getByLabel('Latitude').fill('55 59 40.0 N');
    await page.getByLabel('Longitude').fill("10°00'30.0\"E");
    await page.getByText('Read as 55.994444° = 55°59′40.00″ N').waitFor();
    await page.getByText('Read as 10.008333° = 10°00′30.00″ E').waitFor();
    await page.getByLabel('Ground elevation (m)').fill('3');
    await page.getByLabel('Mount height (m)').fill('6');
    await page.getByRole('button', { name: 'Add site' }).click();
    await page.getByRole('heading', { name: siteName, level: 1 }).waitFor();
    await page.getByText('No link uses this site yet.').waitFor();
    await page.getByTestId('site-plan-chart').locator('svg').first().waitFor();
    // the new site is plotted: its name is a label of the plan and a row of the plan's table
    await page.getByTestId('site-plan-chart').locator('svg text', { hasText: siteName }).first().waitFor();
    await page.getByRole('button', { name: /Show the values as a table/ }).click();
    const planRow = page.getByTestId('site-plan-table').locator('tr', { hasText: siteName });
    const cells = (await planRow.locator('td').allTextContents()).map((text) => Number(text.replace('\u2212', '-')));
    assert.equal(cells.length, 4);
    assert.ok(Number.isFinite(cells[1]) && Number.isFinite(cells[2]), `east and north are numbers (${cells.join(', ')})`);
    await screenshot(page, 'sites-new-site-on-plan');

    // a link from the depot to the new site, its path length from the two sites
    await page.goto(`${BASE_URL}/links/new`);
    await page.getByLabel('Link name').fill(`Depot to pier ${suffix}`);
    await page.getByLabel('Site A').selectOption({ label: 'Tallowmere Depot roof' });
    await page.getByLabel('Site B').selectOption({ label: siteName });
    await page.getByText(/From the two sites: .* slant range/).waitFor();
    await page.getByRole('button', { name: 'Create and open' }).click();
    await page.getByTestId('design-results').waitFor();

    await page.goto(`${BASE_URL}/sites`);
    await page.getByTestId('sites-table').getByRole('link', { name: siteName }).click();
    const siteLinks = page.getByTestId('site-links');
    await siteLinks.getByRole('link', { name: `Depot to pier ${suffix}` }).waitFor();
    assert.match((await siteLinks.locator('[data-verdict]').first().textContent()) ?? '', /\b(Fails|Thin|Adequate)\b/);
    const planLinks = page.getByTestId('site-plan-links');
    await planLinks.getByRole('link', { name: `Depot to pier ${suffix}` }).waitFor();
    await screenshot(page, 'sites-link-on-plan');

    // the site holds a link now: the delete is refused, naming it
    await page.getByTestId('delete-site').click();
    await page.getByTestId('confirm-delete-site').click();
    const refusal = page.getByTestId('site-in-use');
    await refusal.waitFor();
    assert.match((await refusal.textContent()) ?? '', new RegExp(`Depot to pier ${suffix}`));
    assert.deepEqual(consoleErrors, []);
  });
});
