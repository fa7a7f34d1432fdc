// Shared helpers of the browser tests: Debian's chromium through playwright-core, demo sign-in,
// screenshots into ui/e2e/artifacts/ (git-ignored).
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';

export const BASE_URL = (process.env.BASE_URL ?? 'http://127.0.0.1:3100').replace(/\/$/, '');
export const DEMO_PASSWORD = process.env.DEMO_PASSWORD ?? 'demo-pass-2026';
export const ARTIFACTS_DIR = join(dirname(fileURLToPath(import.meta.url)), '..', 'artifacts');
const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** Opens a fresh browser profile (so no session leaks between tests); close it with `close()`. */
export async function openBrowser({ width = 1440, height = 900 } = {}) {
  const profileDir = mkdtempSync(join(tmpdir(), 'beamwright-e2e-'));
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    viewport: { width, height },
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  context.setDefaultTimeout(15_000);
  // The app runs under a strict Content-Security-Policy: a refused script, style, font or image
  // is reported by the browser as a securitypolicyviolation event, and counts as a page error.
  await context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (event) => {
      console.error(`CSP violation: ${event.violatedDirective} blocked ${event.blockedURI || 'inline content'} in ${event.sourceFile || 'the page'}`);
    });
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const consoleErrors = [];
  page.on('pageerror', (error) => consoleErrors.push(String(error)));
  page.on('console', (message) => {
    if (message.type() === 'error' && /Content Security Policy|CSP violation/.test(message.text())) consoleErrors.push(message.text());
  });
  return {
    context,
    page,
    consoleErrors,
    async close() {
      await context.close();
      rmSync(profileDir, { recursive: true, force: true });
    },
  };
}

/** Signs in through the sign-in form, as a user would, and waits for the signed-in layout. */
export async function signIn(page, email, password = DEMO_PASSWORD) {
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel('Email address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('current-user').waitFor();
}

export async function screenshot(page, name, { fullPage = true } = {}) {
  mkdirSync(ARTIFACTS_DIR, { recursive: true });
  const path = join(ARTIFACTS_DIR, `${name}.png`);
  await page.screenshot({ path, fullPage });
  return path;
}
