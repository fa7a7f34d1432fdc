// Accessibility helpers of the browser tests: an axe-core scan of the page as it is, in the light
// and the dark theme, and the checks axe cannot make (a visible focus indicator).
// axe-core is a devDependency only: it is injected into the page here and never bundled in the app.
import { createRequire } from 'node:module';
import assert from 'node:assert/strict';
import { BASE_URL } from './browser.mjs';

const require = createRequire(import.meta.url);
const axe = require('axe-core');

/** WCAG 2.0, 2.1 and 2.2 levels A and AA: the rule sets the scans run. */
export const AXE_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

/**
 * The one exclusion. Fluent UI's focus management (tabster) puts zero-size sentinel elements
 * (`<i tabindex="0" aria-hidden="true" data-tabster-dummy>`) at the edges of dialogs, menus and
 * grids: when Tab reaches one, tabster moves focus on (into the grid, or round the dialog's focus
 * trap), so the sentinel itself is never left focused and never read out. axe reports each one as
 * `aria-hidden-focus`; the library means them to be exactly that, so they are left out of the scan.
 * Nothing else is.
 */
export const AXE_EXCLUDE = ['[data-tabster-dummy]'];

const THEME_STORAGE_KEY = 'beamwright.theme';

/** Counts page views scanned in this test file (one screen or dialog in one theme = one view). */
export const scanLog = { views: 0, failedViews: 0, labels: [] };

async function ensureAxe(page) {
  // page.evaluate is not subject to the page's Content-Security-Policy, unlike an inline <script>.
  const loaded = await page.evaluate(() => typeof window.axe === 'object');
  if (!loaded) await page.evaluate(axe.source);
}

/** Waits until no finite CSS transition or animation is running (so colours are final for contrast). */
export async function settle(page) {
  await page.waitForFunction(() =>
    document.getAnimations().every((animation) => {
      const timing = animation.effect?.getComputedTiming?.();
      return animation.playState !== 'running' || timing?.iterations === Infinity;
    }),
  );
  // one more frame, for charts that redraw after a theme change
  await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
}

/** The theme the app shows now ('light' or 'dark'), read from the themed root. */
export async function currentTheme(page) {
  return page.evaluate(() => document.querySelector('[data-theme]')?.getAttribute('data-theme') ?? null);
}

/**
 * Switches the app's theme without touching the page under test (a dialog may be open): another
 * tab of the same origin stores the choice, and the app follows the storage event as it does for
 * a user with two tabs open.
 */
export async function switchTheme(page, mode) {
  if ((await currentTheme(page)) === mode) return;
  const context = page.context();
  let remote = context.pages().find((candidate) => candidate !== page && candidate.url().startsWith(`${BASE_URL}/api/health`));
  if (!remote) {
    remote = await context.newPage();
    await remote.goto(`${BASE_URL}/api/health`);
  }
  await remote.evaluate(([key, value]) => window.localStorage.setItem(key, value), [THEME_STORAGE_KEY, mode]);
  await page.waitForFunction((wanted) => document.querySelector('[data-theme]')?.getAttribute('data-theme') === wanted, mode);
  await settle(page);
}

function describeViolations(violations) {
  return violations
    .map((violation) => {
      const nodes = violation.nodes
        .slice(0, 5)
        .map((node) => `    ${node.target.join(' ')}\n      ${node.html.slice(0, 200)}\n      ${node.failureSummary.replace(/\n/g, '\n      ')}`)
        .join('\n');
      return `  ${violation.id} (${violation.impact}, ${violation.nodes.length} element(s)): ${violation.help}\n${nodes}`;
    })
    .join('\n');
}

/** Runs axe on the page as it is now; returns the violations (outside the documented exclusion). */
export async function scanWithAxe(page) {
  await ensureAxe(page);
  return page.evaluate(
    async ({ tags, exclude }) => {
      const results = await window.axe.run(
        { exclude: exclude.map((selector) => [selector]) },
        { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] },
      );
      return results.violations.map((violation) => ({
        id: violation.id,
        impact: violation.impact,
        help: violation.help,
        nodes: violation.nodes.map((node) => ({ target: node.target.map(String), html: node.html, failureSummary: node.failureSummary ?? '' })),
      }));
    },
    { tags: AXE_TAGS, exclude: AXE_EXCLUDE },
  );
}

/**
 * Scans the screen or dialog on show in the light and the dark theme and fails on any violation.
 * Returns the page to the theme it was in. `label` names the view in the failure message and log.
 */
export async function expectAccessible(page, label, { themes = ['light', 'dark'] } = {}) {
  const startTheme = (await currentTheme(page)) ?? 'light';
  const failures = [];
  await settle(page);
  for (const mode of themes) {
    await switchTheme(page, mode);
    const violations = await scanWithAxe(page);
    scanLog.views += 1;
    scanLog.labels.push(`${label} (${mode})`);
    if (violations.length > 0) {
      scanLog.failedViews += 1;
      failures.push(`${label}, ${mode} theme:\n${describeViolations(violations)}`);
    }
  }
  await switchTheme(page, startTheme);
  assert.equal(failures.length, 0, `axe found accessibility violations (${AXE_TAGS.join(', ')}):\n${failures.join('\n')}`);
}

/** Prints how many page views this file scanned (call from an `after` hook). */
export function reportScans(fileLabel) {
  console.log(
    `axe-core ${axe.version} (${AXE_TAGS.join(', ')}): ${scanLog.views} page view(s) scanned in ${fileLabel}, ` +
      `${scanLog.failedViews} with violations (outside ${AXE_EXCLUDE.join(', ')})`,
  );
}

/**
 * True when the focused element shows a visible focus indicator: Fluent marks keyboard focus with
 * `data-fui-focus-visible` on the element or on its focus container (`data-fui-focus-within`), and
 * draws the ring from that; otherwise the element's own computed outline must not be 'none'.
 */
export async function describeFocus(page) {
  return page.evaluate(() => {
    const active = document.activeElement;
    if (!active || active === document.body) return { tag: 'body', role: null, inputName: null, text: '', inDialog: false, visible: false, via: 'none', element: 'body' };
    const marked = active.closest('[data-fui-focus-visible]') ?? (active.closest('[data-fui-focus-within]')?.matches(':focus-within') ? active.closest('[data-fui-focus-within]') : null);
    const style = window.getComputedStyle(active);
    const outline = style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) > 0;
    const text = (active.textContent ?? '').trim().replace(/\s+/g, ' ').slice(0, 80);
    const name = active.getAttribute('aria-label') ?? active.getAttribute('name') ?? text;
    return {
      tag: active.tagName.toLowerCase(),
      role: active.getAttribute('role'),
      inputName: active.getAttribute('name'),
      text,
      inDialog: Boolean(active.closest('[role="dialog"], [role="alertdialog"]')),
      visible: Boolean(marked) || outline,
      via: marked ? `data-fui-focus-visible on <${marked.tagName.toLowerCase()}>` : outline ? `outline ${style.outlineStyle} ${style.outlineWidth}` : 'none',
      element: `<${active.tagName.toLowerCase()}${active.getAttribute('role') ? ` role="${active.getAttribute('role')}"` : ''}> ${name}`,
    };
  });
}
