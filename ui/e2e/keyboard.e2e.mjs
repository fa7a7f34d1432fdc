// The main job with the keyboard alone: the engineer signs in, opens a link from the grid, changes
// the path length (the margin headline, a polite live region, updates), saves a revision with a
// note and submits it; the reviewer approves it. Only keyboard.press / keyboard.type drive the
// page; a listener counts pointer events to prove it. Every focus stop on the way must show a
// visible focus indicator; one screenshot per step goes to a temporary folder (printed).
import { after, before, describe, it } from 'node:test';
import assert from 'node:assert/strict';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { BASE_URL, DEMO_PASSWORD, openBrowser } from './support/browser.mjs';
import { describeFocus } from './support/accessibility.mjs';

const LINK_NAME = 'Library to Depot';
const SHOTS_DIR = mkdtempSync(join(tmpdir(), 'beamwright-keyboard-'));
const POINTER_COUNT_KEY = 'beamwright.e2e.pointer-events';

async function textOf(locator) {
  return ((await locator.textContent()) ?? '').trim();
}

describe('the main job, keyboard only', () => {
  let browser;
  let stepNumber = 0;
  /** focus stops passed on the way that showed no indicator */
  const invisibleStops = [];

  before(async () => {
    browser = await openBrowser({ width: 1440, height: 1000 });
    // counts every pointer or mouse press in every document of the run (none is expected)
    await browser.context.addInitScript((key) => {
      const count = () => window.localStorage.setItem(key, String(Number(window.localStorage.getItem(key) ?? '0') + 1));
      for (const type of ['pointerdown', 'mousedown']) window.addEventListener(type, count, { capture: true });
    }, POINTER_COUNT_KEY);
  });
  after(async () => {
    console.log(`keyboard journey: ${stepNumber} step screenshot(s) in ${SHOTS_DIR}`);
    await browser?.close();
  });

  /** The current focus must be visible; then one screenshot of the step. */
  async function step(name) {
    const { page } = browser;
    const focus = await describeFocus(page);
    assert.ok(focus.visible, `step "${name}": the focused element shows no focus indicator (${focus.element}, ${focus.via})`);
    stepNumber += 1;
    await page.screenshot({ path: join(SHOTS_DIR, `${String(stepNumber).padStart(2, '0')}-${name.replace(/[^a-z0-9]+/gi, '-').toLowerCase()}.png`) });
    return focus;
  }

  /** Presses `key` until the focused element matches (checking first, without a key press). */
  async function pressUntil(key, matches, what, { max = 80 } = {}) {
    const { page } = browser;
    for (let presses = 0; presses <= max; presses += 1) {
      if (presses > 0) await page.keyboard.press(key);
      const focus = await describeFocus(page);
      if (focus.tag !== 'body' && !focus.visible) invisibleStops.push(`${focus.element} (${what})`);
      if (matches(focus)) return focus;
    }
    assert.fail(`${key} never reached ${what} in ${max} presses`);
  }

  const isButton = (label) => (focus) => (focus.tag === 'button' || focus.role === 'button') && (focus.text === label || focus.element.endsWith(`> ${label}`));

  async function signInByKeyboard(email) {
    const { page } = browser;
    await page.goto(`${BASE_URL}/sign-in`);
    await page.getByLabel('Email address').waitFor();
    await pressUntil('Tab', (focus) => focus.inputName === 'email', 'the email field');
    await page.keyboard.type(email);
    await pressUntil('Tab', (focus) => focus.inputName === 'password', 'the password field');
    await page.keyboard.type(DEMO_PASSWORD);
    await step(`${email} typed the password`);
    await page.keyboard.press('Enter');
    await page.getByTestId('current-user').waitFor();
    await page.getByTestId('links-table').waitFor();
  }

  /** Into the grid (its header), then down the name column to the link, then Enter. */
  async function openLinkFromGrid(name) {
    const { page } = browser;
    await pressUntil('Tab', (focus) => focus.role === 'button' && focus.text.startsWith('Link'), 'the grid');
    await pressUntil('ArrowDown', (focus) => focus.tag === 'a' && focus.text === name, `the link "${name}" in the grid`, { max: 25 });
    await step(`grid focus on ${name}`);
    await page.keyboard.press('Enter');
    await page.getByTestId('design-results').waitFor();
    await page.getByRole('heading', { level: 1, name }).waitFor();
  }

  it('as the engineer: opens the link, changes the path, hears the margin, saves with a note and submits it', async () => {
    const { page } = browser;
    await signInByKeyboard('engineer@demo.test');
    await openLinkFromGrid(LINK_NAME);

    // change a design field; the margin headline is a polite live region and its text follows
    const headline = page.getByTestId('margin-headline');
    assert.equal(await headline.getAttribute('aria-live'), 'polite');
    const headlineBefore = await textOf(headline);
    await pressUntil('Tab', (focus) => focus.inputName === 'rangeM', 'the path length field');
    const pathLength = page.locator('main input[name="rangeM"]');
    const [, number, unit] = /^\s*([\d.]+)\s*(km|m)\s*$/.exec(await pathLength.inputValue()) ?? [];
    const metres = Number(number) * (unit === 'km' ? 1000 : 1);
    assert.ok(metres > 0, 'the path length reads in m or km');
    await page.keyboard.press('Control+A');
    await page.keyboard.type(`${Math.round(metres * 0.7) / 1000} km`);
    await page.waitForFunction((before) => document.querySelector('[data-testid="margin-headline"]')?.textContent?.trim() !== before, headlineBefore);
    const headlineAfter = await textOf(headline);
    assert.notEqual(headlineAfter, headlineBefore);
    assert.match(headlineAfter, /Link margin.*dB.*(Fails|Thin|Adequate)/);
    await step('path length changed, margin headline updated');

    // save as a new revision, with a note, from the dialog
    const saveFocus = await pressUntil('Shift+Tab', (focus) => /^Save as revision \d+$/.test(focus.text), 'the save button');
    const savedRevision = Number(saveFocus.text.replace(/\D+/g, ''));
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog');
    await dialog.waitFor();
    await pressUntil('Tab', (focus) => focus.inDialog && focus.tag === 'textarea', 'the note');
    await page.keyboard.type('Path shortened to the surveyed roof edge (keyboard test)');
    await step('save dialog with the note');
    await pressUntil('Tab', (focus) => focus.inDialog && isButton('Save revision')(focus), 'the dialog’s save button');
    await page.keyboard.press('Enter');
    await page.getByTestId('saved-notice').waitFor();
    await dialog.waitFor({ state: 'detached' });
    assert.match(await textOf(page.getByTestId('saved-notice')), new RegExp(`Saved as revision ${savedRevision}\\b`));
    // the (now disabled) save button keeps the focus, so the user is not thrown back to the top
    const afterSave = await step('saved');
    assert.match(afterSave.text, /^Save as revision \d+$/);

    // submit it for review from the history
    await pressUntil('Shift+Tab', isButton('History and review'), 'the history button');
    await page.keyboard.press('Enter');
    await page.getByTestId('revisions-table').waitFor();
    await pressUntil('Tab', (focus) => !focus.inDialog && isButton('Submit for review')(focus), 'the submit button');
    await step('history, submit button');
    await page.keyboard.press('Enter');
    await dialog.waitFor();
    await pressUntil('Tab', (focus) => focus.inDialog && isButton('Submit for review')(focus), 'the dialog’s submit button');
    await page.keyboard.press('Enter');
    const outcome = page.getByTestId('review-outcome');
    await outcome.getByText(`Revision ${savedRevision} submitted for review.`).waitFor();
    await dialog.waitFor({ state: 'detached' });
    await page.waitForFunction(() => document.activeElement?.closest('[data-testid="review-outcome"]'));
    assert.equal(await outcome.getAttribute('role'), 'status');
    await step('submitted for review');
    assert.equal(await textOf(page.locator('main [data-status]').first()), 'In review');

    await pressUntil('Shift+Tab', isButton('Sign out'), 'the sign-out button');
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
  });

  it('as the reviewer: opens the submitted link and approves it', async () => {
    const { page } = browser;
    await signInByKeyboard('reviewer@demo.test');
    await openLinkFromGrid(LINK_NAME);
    await page.getByTestId('design-readout').waitFor();
    assert.equal(await textOf(page.locator('main [data-status]').first()), 'In review');

    await pressUntil('Tab', (focus) => !focus.inDialog && isButton('Approve')(focus), 'the approve button');
    await step('workspace, approve button');
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog');
    await dialog.waitFor();
    await pressUntil('Tab', (focus) => focus.inDialog && isButton('Approve')(focus), 'the dialog’s approve button');
    await step('approve dialog');
    await page.keyboard.press('Enter');
    const outcome = page.getByTestId('review-outcome');
    await outcome.getByText(/^Revision \d+ approved\.$/).waitFor();
    await dialog.waitFor({ state: 'detached' });
    await page.waitForFunction(() => document.activeElement?.closest('[data-testid="review-outcome"]'));
    await page.locator('main [data-status="approved"]').first().waitFor();
    await step('approved');
  });

  it('used no pointer at all, and every focus stop on the way was visible', async () => {
    const { page } = browser;
    const pointerEvents = await page.evaluate((key) => Number(window.localStorage.getItem(key) ?? '0'), POINTER_COUNT_KEY);
    assert.equal(pointerEvents, 0, 'pointer or mouse presses happened');
    assert.deepEqual(invisibleStops, [], 'focus stops without a visible indicator');
    assert.ok(stepNumber >= 10, `one screenshot per step (${stepNumber})`);
    assert.deepEqual(browser.consoleErrors, []);
  });
});
