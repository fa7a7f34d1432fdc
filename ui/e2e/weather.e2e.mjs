// Weather records in the browser: upload a CSV through the mapping step, watch the upload and the
// import job progress, then see a link's availability over the new data set: the per-month chart
// and the path lengths for 99 %, 99.9 % and 99.99 %.
import { after, before, describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { openBrowser, screenshot, signIn } from './support/browser.mjs';

const HOURS = 3 * 8760;
const DATASET_NAME = `Browser test records ${Date.now()}`;

/**
 * Three years of hourly visibility in an airport-style export (statute miles, MOR), generated here
 * (synthetic: winter fog spells every few days). About 0.8 MB, enough for the progress to be seen.
 */
function airportCsv() {
  const start = Date.UTC(2022, 0, 1);
  const lines = ['valid,station,vsby,tmpc'];
  for (let i = 0; i < HOURS; i++) {
    const date = new Date(start + i * 3_600_000);
    const winter = [0, 1, 10, 11].includes(date.getUTCMonth());
    const fog = winter ? i % 120 < 6 : i % 400 < 2;
    lines.push(`${date.toISOString().slice(0, 16).replace('T', ' ')},TLM,${fog ? '0.12' : '6.00'},${winter ? '2.0' : '14.0'}`);
  }
  return Buffer.from(`${lines.join('\n')}\n`);
}

async function textOf(locator) {
  return ((await locator.textContent()) ?? '').trim();
}

describe('weather records and availability', () => {
  let browser;

  before(async () => {
    browser = await openBrowser({ width: 1440, height: 1000 });
  });
  after(async () => {
    // leave the shared browser database as it was: the data set goes again
    const { page } = browser ?? {};
    if (page) {
      await page
        .evaluate(async (name) => {
          const token = JSON.parse(window.localStorage.getItem('beamwright.session') ?? '{}').accessToken;
          const headers = { Authorization: `Bearer ${token}` };
          const { items } = await (await fetch('/api/weather-datasets', { headers })).json();
          for (const dataset of items.filter((item) => item.name === name)) await fetch(`/api/weather-datasets/${dataset.id}`, { method: 'DELETE', headers });
        }, DATASET_NAME)
        .catch(() => undefined);
    }
    await browser?.close();
  });

  it('uploads a CSV through the mapping step, showing the upload and the processing progress', async () => {
    const { page } = browser;
    await signIn(page, 'engineer@demo.test');
    await page.getByRole('link', { name: 'Weather data' }).click();
    await page.getByTestId('weather-datasets').waitFor();

    await page.getByTestId('weather-file-input').setInputFiles({ name: 'tallowmere-airport.csv', mimeType: 'text/csv', buffer: airportCsv() });
    const mapping = page.getByTestId('weather-mapping');
    await mapping.waitFor();
    // the columns guessed from the header and the first rows
    assert.equal(await mapping.getByLabel('Timestamp column').inputValue(), 'valid');
    assert.equal(await mapping.getByLabel('Visibility column').inputValue(), 'vsby');
    assert.equal(await mapping.getByLabel('Visibility unit').inputValue(), 'mi');
    assert.equal(await mapping.getByLabel('Visibility definition').inputValue(), 'mor-5-percent');
    assert.equal(await mapping.getByLabel('Air temperature column').inputValue(), 'tmpc');
    assert.match(await textOf(page.getByTestId('weather-preview')), /2022-01-01 00:00/);
    await mapping.getByLabel('Data set name').fill(DATASET_NAME);
    await mapping.getByLabel('Site').selectOption({ label: 'Harbour Office tower' });
    await screenshot(page, 'weather-mapping-step');

    // a slow uplink, so the upload's own progress is on screen for a while
    const cdp = await page.context().newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: 256 * 1024 });
    await page.getByRole('button', { name: 'Import the data set' }).click();
    const uploadBar = page.getByRole('progressbar', { name: /Uploading tallowmere-airport\.csv/ });
    await uploadBar.waitFor();
    await page.waitForFunction(() => {
      const bar = document.querySelector('[data-testid="upload-progress"]');
      const value = Number(bar?.getAttribute('aria-valuenow'));
      return value > 0 && value < 1;
    });
    const sent = await textOf(page.getByText(/MB of [\d.]+ MB sent/));
    assert.match(sent, /^\d+ %: [\d.]+ MB of 0\.[6-9]\d MB sent$/);
    await screenshot(page, 'weather-uploading', { fullPage: false });
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

    // then the job: queued or running with its own progress, until the outcome replaces it
    const processing = page.getByRole('progressbar', { name: 'Processing the import' });
    const outcome = page.getByTestId('import-outcome');
    await Promise.race([processing.waitFor({ timeout: 30_000 }), outcome.waitFor({ timeout: 30_000 })]);
    assert.ok(await processing.isVisible().catch(() => false) || (await outcome.isVisible()), 'the processing progress or its outcome is shown');
    await outcome.waitFor({ timeout: 60_000 });
    assert.match(await textOf(outcome), new RegExp(`Imported “${DATASET_NAME}”.*${HOURS.toLocaleString('en-GB')} rows`));
    await page.getByTestId('weather-datasets').getByText(DATASET_NAME).waitFor();
    await screenshot(page, 'weather-imported');
  });

  it('shows the per-month availability chart and the path lengths for 99, 99.9 and 99.99 % over the new data set', async () => {
    const { page } = browser;
    await page.getByRole('link', { name: 'Links' }).first().click();
    await page.getByTestId('links-table').getByRole('link', { name: 'Depot to Harbour Office' }).click();
    await page.getByTestId('design-results').waitFor();
    await page.getByRole('button', { name: 'Availability' }).click();
    await page.getByRole('heading', { name: 'Availability', level: 1 }).waitFor();
    await page.getByTestId('availability-dataset').selectOption({ label: DATASET_NAME });
    const results = page.getByTestId('availability-results');
    await results.waitFor({ timeout: 30_000 });
    await page.waitForFunction(() => !document.body.textContent?.includes('the figures below are still the previous ones'), undefined, { timeout: 30_000 });

    const months = page.getByRole('img', { name: 'Availability per calendar month, in percent' });
    await months.locator('svg').first().waitFor();
    // twelve bars: one per calendar month of the three years
    const section = page.locator('section').filter({ has: months });
    await section.getByRole('button', { name: /Show the values as a table \(12 rows\)/ }).click();
    const monthRows = page.getByTestId('chart-availability-months-table').locator('tbody tr');
    assert.equal(await monthRows.count(), 12);
    const january = Number((await textOf(monthRows.nth(0).locator('td').nth(1))).replace('\u2212', '-'));
    const july = Number((await textOf(monthRows.nth(6).locator('td').nth(1))).replace('\u2212', '-'));
    assert.ok(january < july, `the winter fog shows: January ${january} % below July ${july} %`);

    const ranges = page.getByTestId('availability-ranges');
    for (const label of ['99.0 %', '99.9 %', '99.99 %']) {
      const row = ranges.getByRole('row').filter({ hasText: label });
      assert.match(await textOf(row), /(up to [\d.]+ k?m|not reached even at 50 m|beyond 50 km)/, `${label} has a path length`);
    }
    await page.getByRole('img', { name: 'Availability in percent against path length in kilometres' }).locator('svg').first().waitFor();
    assert.match(await textOf(page.getByTestId('availability-method')), /fog and strong turbulence rarely coincide/);
    assert.match(await textOf(page.getByTestId('availability-headline')), /^Availability\s*\d{2,3}\.\d{3} %/);
    await screenshot(page, 'weather-availability');
    assert.deepEqual(browser.consoleErrors, []);
  });
});
