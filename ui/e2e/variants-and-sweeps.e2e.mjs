// Compare and size, as an engineer does it: a new link, a wavelength set of alternatives read side
// by side, a sweep and a heat map of the margin (with the redraw after an input change timed), the
// transmit beam sized for the required margin, and one alternative promoted to the next revision.
import { after, before, describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { BASE_URL, openBrowser, screenshot, signIn } from './support/browser.mjs';

const textOf = async (locator) => ((await locator.textContent()) ?? '').trim();
const toNumber = (text) => Number(text.replace('\u2212', '-').replace(/[^\d.+-]/g, ''));

describe('compare and size', () => {
  let browser;

  before(async () => {
    browser = await openBrowser({ width: 1440, height: 1000 });
  });
  after(async () => {
    await browser?.close();
  });

  it('compares a wavelength set, explores the margin, sizes the transmit beam and promotes an alternative', async () => {
    const { page, consoleErrors } = browser;
    await signIn(page, 'engineer@demo.test');

    // a link of its own, so the demo links keep their story
    await page.goto(`${BASE_URL}/links/new`);
    await page.getByLabel('Link name').fill(`Compare and size ${Date.now()}`);
    await page.getByLabel('Path length').fill('2.4 km');
    await page.getByRole('button', { name: 'Create and open' }).click();
    await page.getByTestId('design-results').waitFor();
    const saveButton = page.getByRole('button', { name: /^Save as revision \d+$/ });
    assert.match(await textOf(saveButton), /Save as revision 2/);

    // 1. a wavelength set, read side by side
    await page.getByTestId('results-tab-alternatives').click();
    await page.getByTestId('variant-wavelength-set').click();
    await page.getByTestId('variant-wavelength-usual').click();
    const rows = page.getByTestId('variant-row');
    await page.getByTestId('variant-comparison').waitFor();
    assert.equal(await rows.count(), 3, 'three other wavelengths of the usual four');
    const headers = await page.getByTestId('variant-comparison').locator('thead th').allTextContents();
    assert.deepEqual(headers.slice(2).map((text) => text.trim()), ['785 nm', '850 nm', '1310 nm']);
    const marginRow = page.getByTestId('variant-comparison').locator('[data-row="margin"]');
    const margins = (await marginRow.locator('td').allTextContents()).slice(1).map(toNumber);
    assert.equal(margins.length, 4);
    assert.ok(margins.every(Number.isFinite), `a margin per design (${margins.join(', ')})`);
    const bestColumn = margins.indexOf(Math.max(...margins));
    assert.equal(await marginRow.locator('td').nth(bestColumn + 1).getAttribute('data-best'), 'true', 'the best margin carries the star');
    assert.equal(await page.getByTestId('variant-comparison').locator('[data-row="wavelength"] [data-differs]').count(), 3, 'each wavelength differs from the design');
    await page.getByTestId('wavelength-table').waitFor();
    await page.getByTestId('chart-wavelengths').locator('svg').first().waitFor();
    await screenshot(page, 'alternatives-wavelength-set');

    assert.match(await textOf(page.getByTestId('edit-status')), /Alternatives changed/);
    await saveButton.click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Note').fill('Wavelength set for the review (browser test)');
    await dialog.getByRole('button', { name: 'Save revision' }).click();
    await page.getByTestId('saved-notice').waitFor();
    assert.match(await textOf(page.getByTestId('saved-notice')), /Saved as revision 2\b/);
    assert.match(await textOf(page.getByTestId('results-tab-alternatives')), /Alternatives \(3\)/);

    // 2. a sweep, and its redraw after an input change
    await page.getByTestId('results-tab-explore').click();
    const result = page.getByTestId('explore-result');
    await result.waitFor();
    await page.getByTestId('chart-explore').locator('svg').first().waitFor();
    assert.equal(await result.getAttribute('data-kind'), 'line');
    const serialBefore = Number(await result.getAttribute('data-serial'));
    const power = page.locator('main input[name="transmitter.powerDbm"]');
    const startedAt = Date.now();
    await power.fill('12 dBm');
    await page.waitForFunction((before) => Number(document.querySelector('[data-testid="explore-result"]')?.getAttribute('data-serial')) > before, serialBefore);
    await page.getByTestId('chart-explore').locator('svg').first().waitFor();
    await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
    const redrawMs = Date.now() - startedAt;
    console.log(`sweep redraw after an input change: ${redrawMs} ms (121 budgets in the worker, ${await textOf(page.getByTestId('explore-status'))})`);
    assert.ok(redrawMs < 15_000, 'the sweep follows the edit');

    // 3. a heat map over two inputs
    await page.getByTestId('explore-mode-grid').click();
    await page.waitForSelector('[data-testid="explore-result"][data-kind="grid"]');
    await page.getByTestId('chart-explore').locator('svg').first().waitFor();
    assert.equal(Number(await result.getAttribute('data-count')), 60 * 40);
    await screenshot(page, 'explore-heat-map');

    // 4. size the transmit beam for the required margin: a collimated beam (no datasheet divergence,
    // which would set the spot whatever the beam radius — the solver says so when it is left in)
    await page.locator('main input[name="transmitter.halfAngleDivergenceRad"]').fill('');
    await page.getByTestId('size-it-waistRadiusM').click();
    const card = page.getByTestId('size-it-result-waistRadiusM');
    await card.waitFor();
    assert.equal(await card.getAttribute('data-achievable'), 'true', await textOf(card));
    assert.match(await textOf(card), /Transmit aperture for it: .* diameter at the optimum truncation a\/w = 1\.121/);
    await page.getByTestId('size-it-use-waistRadiusM').click();
    await page.waitForFunction(() => {
      const text = document.querySelector('[data-testid="link-margin"]')?.textContent ?? '';
      const value = Number(text.replace('\u2212', '-').replace(/[^\d.+-]/g, ''));
      return Math.abs(value - 3) < 0.1;
    });
    await screenshot(page, 'sized-transmit-beam');

    // 5. promote an alternative: revision 3 carries the 785 nm design, the former design as an alternative
    await page.getByRole('button', { name: 'Discard changes' }).click();
    await page.getByTestId('results-tab-alternatives').click();
    await page.getByTestId('variant-promote').first().click();
    await page.getByTestId('saved-notice').filter({ hasText: 'revision 3' }).waitFor();
    assert.match(await textOf(page.getByTestId('saved-notice')), /Saved as revision 3\b/);
    assert.match(await textOf(saveButton), /Save as revision 4/);
    assert.equal(await page.locator('main input[name="transmitter.wavelengthM"]').inputValue(), '785 nm');
    const names = await page.getByTestId('variant-row').locator('input').evaluateAll((inputs) => inputs.map((input) => input.value));
    assert.deepEqual(names, ['Primary of revision 2', '850 nm', '1310 nm']);
    await screenshot(page, 'promoted-revision-3');
    assert.deepEqual(consoleErrors, []);
  });
});
