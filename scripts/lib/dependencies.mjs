// What a fresh clone installs before anything runs: node_modules (npm ci) and Debian's chromium.
// Plain ESM with node built-ins only: it runs before `npm ci` on a fresh clone.

import fs from 'node:fs';
import path from 'node:path';
import { ROOT_DIR } from './paths.mjs';
import { runCommand, step } from './processes.mjs';

/**
 * Names of packages whose installed version differs from package-lock.json (or that the lockfile
 * wants and node_modules lacks), read from npm's own record of the install
 * (node_modules/.package-lock.json). Optional platform packages that were skipped do not count.
 */
export function lockfileDrift() {
  try {
    const wanted = JSON.parse(fs.readFileSync(path.join(ROOT_DIR, 'package-lock.json'), 'utf8')).packages;
    const installed = JSON.parse(fs.readFileSync(path.join(ROOT_DIR, 'node_modules', '.package-lock.json'), 'utf8')).packages;
    const drift = [];
    for (const [key, entry] of Object.entries(wanted)) {
      if (!key.startsWith('node_modules/') || entry.optional || entry.peer) continue;
      if (installed[key]?.version !== entry.version) drift.push(key.slice('node_modules/'.length));
    }
    for (const key of Object.keys(installed)) if (!wanted[key]) drift.push(key.slice('node_modules/'.length));
    return drift;
  } catch {
    return [];
  }
}

/**
 * `npm ci` when node_modules is missing (a fresh clone). When it exists but no longer matches the
 * lockfile (after a pull), says so and leaves it alone: deleting a working node_modules is the
 * developer's call, not a side effect of starting the app.
 */
export async function ensureNodeModules() {
  if (fs.existsSync(path.join(ROOT_DIR, 'node_modules', '.package-lock.json'))) {
    const drift = lockfileDrift();
    if (drift.length) {
      process.stdout.write(
        `\n! node_modules does not match package-lock.json (${drift.length} package(s), e.g. ${drift.slice(0, 3).join(', ')}).\n` +
          '  If something fails below, run `npm ci` and try again.\n',
      );
    }
    return false;
  }
  step('node_modules is missing: installing the locked dependencies (npm ci, 1-3 minutes)');
  const result = await runCommand('npm', ['ci', '--no-audit', '--no-fund'], { env: { ...process.env, npm_config_loglevel: 'warn' } });
  if (result.code !== 0) throw new Error(`npm ci failed with exit code ${result.code}`);
  return true;
}

/** Path of chromium used by the browser tests. */
export const CHROMIUM_PATH = '/usr/bin/chromium';

/** Installs Debian's chromium when absent (as root); otherwise says what to run. */
export async function ensureChromium() {
  if (fs.existsSync(CHROMIUM_PATH)) return false;
  if (process.getuid?.() !== 0) {
    throw new Error(`${CHROMIUM_PATH} is missing. Install Debian's chromium: sudo sh -c 'apt-get update && apt-get install -y chromium'`);
  }
  step('Installing Debian\'s chromium for the browser tests (apt-get, about a minute)');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const args of [['update'], ['install', '-y', '--no-install-recommends', 'chromium']]) {
    const result = await runCommand('apt-get', args, { env, quiet: true });
    if (result.code !== 0) throw new Error(`apt-get ${args.join(' ')} failed:\n${result.output.slice(-2000)}`);
  }
  if (!fs.existsSync(CHROMIUM_PATH)) throw new Error(`apt-get installed chromium but ${CHROMIUM_PATH} is missing`);
  return true;
}
