// Every screen and dialog of the planner, scanned with axe-core (WCAG 2.0/2.1/2.2 A and AA) in the
// light and the dark theme, as the engineer and as the reviewer; plus the checks axe cannot make:
// verdicts that carry words, errors tied to their fields, notices in live regions, reflow at 320 px.
// A new screen joins by calling `expectAccessible(page, '<name>')` once it is on show.
import { after, before, describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { BASE_URL, openBrowser, screenshot, signIn } from './support/browser.mjs';
import { expectAccessible, reportScans, scanLog, settle } from './support/accessibility.mjs';

const VERDICT_WORDS = /\b(Fails|Thin|Adequate)\b/;
const STATUS_WORDS = /^(Draft|In review|Approved|Installed)$/;

async function textOf(locator) {
  return ((await locator.textContent()) ?? '').trim();
}

/** The session token the page holds, to act through the api as the same user (no second sign-in). */
async function pageToken(page) {
  return page.evaluate(() => JSON.parse(window.localStorage.getItem('beamwright.session') ?? '{}').accessToken);
}

async function openLinkByName(page, name) {
  await page.goto(`${BASE_URL}/links`);
  await page.getByTestId('links-table').getByRole('link', { name }).click();
  await page.getByTestId('design-results').waitFor();
  for (const chart of ['chart-waterfall', 'chart-beam', 'chart-range', 'chart-visibility']) {
    await page.getByTestId(chart).locator('svg').first().waitFor();
  }
}

/** Opens the three "Show the values as a table" panels under the charts. */
async function openChartTables(page) {
  for (const chart of ['chart-beam', 'chart-range', 'chart-visibility']) {
    const section = page.locator('section').filter({ has: page.getByTestId(chart) });
    await section.getByRole('button', { name: /Show the values as a table/ }).click();
    await page.getByTestId(`${chart}-table`).waitFor();
  }
}

/** The element ids an element's aria-describedby names. */
async function describedByIds(locator) {
  return ((await locator.getAttribute('aria-describedby')) ?? '').split(/\s+/).filter(Boolean);
}

describe('accessibility of every screen and dialog, light and dark (axe-core)', () => {
  let browser;
  before(async () => {
    browser = await openBrowser({ width: 1440, height: 1000 });
  });
  after(async () => {
    reportScans('accessibility.e2e.mjs');
    console.log(`scanned: ${scanLog.labels.join('; ')}`);
    await browser?.close();
  });

  it('the sign-in page, empty and with its field errors tied to the fields', async () => {
    const { page } = browser;
    await page.goto(`${BASE_URL}/sign-in`);
    await page.getByLabel('Email address').waitFor();
    await expectAccessible(page, 'sign-in');

    // checked in the browser before any request, so no sign-in attempt is spent
    await page.getByRole('button', { name: 'Sign in' }).click();
    const email = page.getByLabel('Email address');
    await page.getByText('Enter your email address.').waitFor();
    assert.equal(await email.getAttribute('aria-invalid'), 'true');
    const messageId = await page.getByText('Enter your email address.').evaluate((node) => node.closest('[id]')?.id);
    assert.ok((await describedByIds(email)).includes(messageId), 'the email error describes the email field');
    await expectAccessible(page, 'sign-in with field errors');
  });

  it('as the engineer: links, workspace, its dialogs and notices, history and the new-link page', async () => {
    const { page } = browser;
    await signIn(page, 'engineer@demo.test');
    const table = page.getByTestId('links-table');
    await table.waitFor();

    // verdicts never by colour alone: every margin carries its verdict word and an icon, every status a word
    const rows = table.locator('[data-link-id]');
    assert.ok((await rows.count()) >= 3, 'the demo has links');
    for (let index = 0; index < (await rows.count()); index += 1) {
      const badge = rows.nth(index).locator('[data-verdict]');
      assert.match(await textOf(badge), VERDICT_WORDS);
      assert.equal(await badge.locator('svg').count(), 1, 'the margin verdict has an icon beside its colour');
      assert.match(await textOf(rows.nth(index).locator('[data-status]')), STATUS_WORDS);
      // the name is one plain link: a single focus stop, no button around it
      assert.equal(await rows.nth(index).getByRole('link').count(), 1);
      assert.equal(await rows.nth(index).getByRole('button').count(), 0);
    }
    assert.match(await textOf(table.locator('[data-link-id]', { hasText: 'Riverside feasibility' }).locator('[data-verdict]')), /Fails/);
    await expectAccessible(page, 'links list (engineer)');

    await openLinkByName(page, 'Riverside feasibility, 3 km');
    const headline = page.getByTestId('margin-headline');
    assert.equal(await headline.getAttribute('aria-live'), 'polite');
    assert.match(await textOf(page.getByTestId('margin-verdict')), VERDICT_WORDS);
    await openChartTables(page);
    await expectAccessible(page, 'workspace with the chart tables open (engineer)');

    // the margin explorer: a sweep, then a heat map with its values table open
    await page.getByTestId('results-tab-explore').click();
    await page.getByTestId('chart-explore').locator('svg').first().waitFor();
    await expectAccessible(page, 'workspace, margin against one input (engineer)');
    await page.getByTestId('explore-mode-grid').click();
    await page.waitForSelector('[data-testid="explore-result"][data-kind="grid"]');
    await page.getByTestId('chart-explore').locator('svg').first().waitFor();
    await page.locator('#results-panel-explore').getByRole('button', { name: /Show the values as a table/ }).click();
    await expectAccessible(page, 'workspace, heat map with its table (engineer)');
    await page.getByTestId('results-tab-budget').click();

    // a field error is tied to its field
    const pathLength = page.locator('main input[name="rangeM"]');
    const typed = await pathLength.inputValue();
    await pathLength.fill('2,5 km');
    const rangeError = page.getByText('Path length use a point as the decimal separator');
    await rangeError.waitFor();
    const rangeErrorId = await rangeError.evaluate((node) => node.closest('[id]')?.id);
    assert.ok((await describedByIds(pathLength)).includes(rangeErrorId), 'the path length error describes the field');
    assert.equal(await pathLength.getAttribute('aria-invalid'), 'true');
    await expectAccessible(page, 'workspace with a field error (engineer)');

    // the save dialog, with the note's error tied to the note
    await pathLength.fill(typed.replace(/^([\d.]+)/, (number) => String(Number(number) * 0.95)));
    await page.getByRole('button', { name: /^Save as revision \d+$/ }).click();
    const saveDialog = page.getByRole('dialog');
    await saveDialog.getByRole('button', { name: 'Save revision' }).click();
    await saveDialog.getByText('Add a note: what changed and why.').waitFor();
    const note = saveDialog.getByLabel('Note');
    const noteErrorId = await saveDialog.getByText('Add a note: what changed and why.').evaluate((node) => node.closest('[id]')?.id);
    assert.ok((await describedByIds(note)).includes(noteErrorId), 'the note error describes the note');
    await expectAccessible(page, 'save dialog with a note error');
    await note.fill('Path trimmed after the roof survey (accessibility test)');
    await saveDialog.getByRole('button', { name: 'Save revision' }).click();
    const saved = page.getByTestId('saved-notice');
    await saved.waitFor();
    await saveDialog.waitFor({ state: 'detached' });
    // the notice is announced: it appears inside a polite status region
    assert.equal(await saved.evaluate((node) => node.closest('[role="status"]')?.getAttribute('aria-live')), 'polite');
    await expectAccessible(page, 'workspace after a save (engineer)');

    // the conflict dialog: someone else saves first (through the api, as the same engineer)
    const linkId = new URL(page.url()).pathname.split('/').pop();
    const headers = { Authorization: `Bearer ${await pageToken(page)}`, 'Content-Type': 'application/json' };
    const current = await (await fetch(`${BASE_URL}/api/links/${linkId}`, { headers })).json();
    await pathLength.fill(typed);
    const competing = await fetch(`${BASE_URL}/api/links/${linkId}/revisions`, {
      method: 'POST',
      headers,
      body: JSON.stringify({
        baseRevision: current.revision,
        design: { ...current.design, transmitter: { ...current.design.transmitter, powerDbm: current.design.transmitter.powerDbm - 0.5 } },
        note: 'Transmit power lowered by 0.5 dB (accessibility test, concurrent edit)',
      }),
    });
    assert.equal(competing.status, 201);
    await page.getByRole('button', { name: `Save as revision ${current.revision + 1}` }).click();
    await saveDialog.getByLabel('Note').fill('Path back to the surveyed length (accessibility test)');
    await saveDialog.getByRole('button', { name: 'Save revision' }).click();
    const conflict = page.getByRole('alertdialog');
    await conflict.getByText(/was saved while you were editing/).waitFor();
    await expectAccessible(page, 'save conflict dialog');
    await conflict.getByRole('button', { name: /re-apply my edits/ }).click();
    const rebased = page.getByTestId('rebase-notice');
    await rebased.waitFor();
    assert.equal(await rebased.evaluate((node) => node.closest('[role="status"]')?.getAttribute('aria-live')), 'polite');

    // leaving with unsaved edits asks first
    await page.getByRole('link', { name: 'Links', exact: true }).first().click();
    const leave = page.getByRole('alertdialog');
    await leave.getByText('Leave without saving?').waitFor();
    await expectAccessible(page, 'leave-without-saving dialog');
    await leave.getByRole('button', { name: 'Stay and keep editing' }).click();
    await leave.waitFor({ state: 'detached' });
    await page.getByRole('button', { name: 'Discard changes' }).click();

    // the history, and the submit dialog (opened and cancelled: the keyboard test submits)
    await page.getByRole('button', { name: 'History and review' }).click();
    await page.getByTestId('revisions-table').waitFor();
    await page.getByTestId('revision-diff').waitFor();
    await expectAccessible(page, 'history (engineer)');
    await page.getByRole('button', { name: 'Submit for review' }).click();
    const submitDialog = page.getByRole('dialog');
    await submitDialog.getByText(/A reviewer will approve the revision/).waitFor();
    await expectAccessible(page, 'submit-for-review dialog');
    await submitDialog.getByRole('button', { name: 'Cancel' }).click();
    await submitDialog.waitFor({ state: 'detached' });

    await page.goto(`${BASE_URL}/links/new`);
    await page.getByRole('heading', { name: /new link/i }).waitFor();
    await settle(page);
    await expectAccessible(page, 'new link');
    await screenshot(page, 'accessibility-new-link');
  });

  it('reflows the workspace at 320 CSS px: no horizontal scrolling, charts stacked and shrunk', async () => {
    const { page } = browser;
    await page.setViewportSize({ width: 320, height: 800 });
    try {
      await openLinkByName(page, 'Riverside feasibility, 3 km');
      await settle(page);
      const layout = await page.evaluate(() => {
        const charts = ['chart-waterfall', 'chart-beam', 'chart-range', 'chart-visibility'].map((id) => {
          const rect = document.querySelector(`[data-testid="${id}"]`).getBoundingClientRect();
          return { id, left: rect.left, right: rect.right, top: rect.top, width: rect.width };
        });
        // for the failure message: the outermost elements that stick out to the right
        const sticking = [];
        for (const element of document.querySelectorAll('body *')) {
          const rect = element.getBoundingClientRect();
          if (rect.width > 0 && rect.right > 321 && !sticking.some((outer) => outer.contains(element))) sticking.push(element);
        }
        return {
          scrollWidth: document.scrollingElement.scrollWidth,
          clientWidth: document.documentElement.clientWidth,
          charts,
          sticking: sticking.slice(0, 8).map((element) => `${element.outerHTML.slice(0, 160)} (right ${Math.round(element.getBoundingClientRect().right)})`),
        };
      });
      assert.equal(layout.clientWidth, 320);
      assert.ok(layout.scrollWidth <= 320 + 1, `the page scrolls sideways at 320 px (scrollWidth ${layout.scrollWidth}):\n${layout.sticking.join('\n')}`);
      for (const chart of layout.charts) {
        assert.ok(chart.left >= 0 && chart.right <= 320 + 1 && chart.width > 200, `${chart.id} fits the screen (${JSON.stringify(chart)})`);
      }
      const tops = layout.charts.map((chart) => chart.top);
      assert.deepEqual([...tops].sort((a, b) => a - b), tops, 'the charts stack one under the other');
      assert.ok(new Set(tops.map(Math.round)).size === tops.length, 'no two charts side by side');
      // the form is still usable: a field can be reached and changed
      const pathLength = page.locator('main input[name="rangeM"]');
      const box = await pathLength.boundingBox();
      assert.ok(box && box.x >= 0 && box.x + box.width <= 321, 'the path length field is on screen');
      await expectAccessible(page, 'workspace at 320 px (engineer)');
      await screenshot(page, 'accessibility-workspace-320px');
    } finally {
      await page.setViewportSize({ width: 1440, height: 1000 });
    }
  });

  it('as the reviewer: links, read-only workspace, history and the review decision dialogs', async () => {
    const { page, context } = browser;
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await context.clearCookies();
    await signIn(page, 'reviewer@demo.test');
    await page.getByTestId('links-table').waitFor();
    await expectAccessible(page, 'links list (reviewer)');

    await openLinkByName(page, 'Harbour Office to North Water Tower');
    await page.getByTestId('design-readout').waitFor();
    await page.getByTestId('results-tab-alternatives').click();
    await page.getByTestId('variant-comparison').waitFor();
    await page.getByTestId('chart-wavelengths').locator('svg').first().waitFor();
    // the best of a row and what differs are said in words too, not by the star or the tint alone
    assert.match(await textOf(page.getByTestId('variant-comparison').locator('[data-best]').first()), /best/);
    await expectAccessible(page, 'alternatives side by side and the wavelength comparison (reviewer)');

    await openLinkByName(page, 'Depot to North Water Tower');
    await page.getByTestId('design-readout').waitFor();
    assert.match(await textOf(page.getByTestId('margin-verdict')), VERDICT_WORDS);
    await expectAccessible(page, 'workspace (reviewer)');

    await page.getByRole('button', { name: 'Approve' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText(/Approval is recorded with your name/).waitFor();
    await expectAccessible(page, 'approve dialog');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'detached' });

    await page.getByRole('button', { name: 'History and review' }).click();
    await page.getByTestId('revisions-table').waitFor();
    await expectAccessible(page, 'history (reviewer)');
    await page.getByRole('button', { name: 'Return with comment' }).click();
    await dialog.getByRole('button', { name: 'Return with comment' }).click();
    const required = dialog.getByText('A comment is required: tell the engineer what to change.');
    await required.waitFor();
    const comment = dialog.getByLabel(/Comment/);
    const requiredId = await required.evaluate((node) => node.closest('[id]')?.id);
    assert.ok((await describedByIds(comment)).includes(requiredId), 'the comment error describes the comment field');
    await expectAccessible(page, 'return-with-comment dialog with a field error');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'detached' });
  });

  it('reports no script errors in the page', () => {
    assert.deepEqual(browser.consoleErrors, []);
  });
});
