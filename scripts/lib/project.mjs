// Shared pieces of `npm start` and `npm test`: where things are, the environment with its local
// defaults, running child processes, bootstrapping node_modules and incremental builds.
// Plain ESM with node built-ins only: it runs before `npm ci` on a fresh clone.

import { spawn, spawnSync } from 'node:child_process';
import { createHash, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** Absolute path of the checkout (the folder holding the root package.json). */
export const ROOT_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
/** Git-ignored folder for the local cluster, lock file, build stamps and the local JWT secret. */
export const DATA_DIR = path.join(ROOT_DIR, '.data');

/** Workspaces in build order: link-core first (the api imports its dist/). */
export const WORKSPACES = [
  { name: '@beamwright/link-core', dir: 'link-core', output: 'dist/index.js', dependsOn: [] },
  { name: '@beamwright/api', dir: 'api', output: 'dist/main.js', dependsOn: ['@beamwright/link-core'] },
  { name: '@beamwright/ui', dir: 'ui', output: 'dist/index.html', dependsOn: ['@beamwright/link-core'] },
];

/** Local defaults of every setting the api reads (documented in .env.example). */
export const DEFAULT_ENV = {
  NODE_ENV: 'production',
  PORT: '3000',
  HOST: '127.0.0.1',
  DATABASE_HOST: '127.0.0.1',
  DATABASE_PORT: '54329',
  DATABASE_USER: 'beamwright',
  DATABASE_PASSWORD: 'beamwright-local',
  DATABASE_NAME: 'beamwright',
  JWT_EXPIRES_IN: '8h',
  DEMO_PASSWORD: 'demo-pass-2026',
};

/** The four demo sign-ins seeded by the api (fixtures/demo). */
export const DEMO_USERS = [
  { email: 'admin@demo.test', role: 'admin' },
  { email: 'engineer@demo.test', role: 'engineer' },
  { email: 'reviewer@demo.test', role: 'reviewer' },
  { email: 'installer@demo.test', role: 'installer' },
];

/** Loads the root `.env` when present (it never overrides variables already set). */
export function loadDotEnv() {
  const file = path.join(ROOT_DIR, '.env');
  if (!fs.existsSync(file)) return false;
  process.loadEnvFile(file);
  return true;
}

/**
 * A JWT secret for local runs that stays the same across restarts (so sign-ins survive) but is
 * never a value committed anywhere: generated once into .data/jwt-secret (mode 0600).
 */
export function localJwtSecret() {
  const file = path.join(DATA_DIR, 'jwt-secret');
  if (fs.existsSync(file)) return fs.readFileSync(file, 'utf8').trim();
  fs.mkdirSync(DATA_DIR, { recursive: true });
  const secret = randomBytes(32).toString('base64url');
  fs.writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}

/** Prints a step heading. */
export function step(message) {
  process.stdout.write(`\n\u25b6 ${message}\n`);
}

/**
 * Runs a command to completion. Output goes to our terminal (and is collected when `capture`).
 * `detached` puts the child in its own process group, so that `killGroup` can end it with all of
 * its children (npm -> sh -> node -> workers) on a timeout or Ctrl-C.
 * @param {string} command
 * @param {string[]} args
 * @param {{ cwd?: string, env?: NodeJS.ProcessEnv, capture?: boolean, quiet?: boolean, timeoutMs?: number,
 *   onSpawn?: (child: import('node:child_process').ChildProcess) => void }} [options]
 * @returns {Promise<{ code: number, output: string, timedOut: boolean, durationMs: number }>}
 */
export function runCommand(command, args, { cwd = ROOT_DIR, env = process.env, capture = false, quiet = false, timeoutMs, onSpawn } = {}) {
  const startedAt = Date.now();
  if (refuseNewChildren) {
    return Promise.resolve({ code: 130, output: '', timedOut: false, durationMs: 0, interrupted: true });
  }
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, {
      cwd, env, detached: true, stdio: ['ignore', capture || quiet ? 'pipe' : 'inherit', capture || quiet ? 'pipe' : 'inherit'],
    });
    runningChildren.add(child);
    onSpawn?.(child);
    let output = '';
    const collect = (target) => (chunk) => {
      output += chunk;
      if (!quiet) target.write(chunk);
    };
    child.stdout?.on('data', collect(process.stdout));
    child.stderr?.on('data', collect(process.stderr));
    let timedOut = false;
    const timer = timeoutMs ? setTimeout(() => { timedOut = true; killGroup(child, 'SIGKILL'); }, timeoutMs) : undefined;
    child.once('error', (error) => { clearTimeout(timer); reject(error); });
    child.once('close', (code, signal) => {
      runningChildren.delete(child);
      clearTimeout(timer);
      resolve({ code: code ?? (signal ? 128 : 1), output, timedOut, durationMs: Date.now() - startedAt });
    });
  });
}

const runningChildren = new Set();
let refuseNewChildren = false;

/**
 * Ends every command started through runCommand that still runs, with its whole process group
 * (they are detached, so a Ctrl-C in the terminal reaches only us: we pass it on here), and makes
 * runCommand refuse new ones from then on, so that a script winding down starts nothing new.
 */
export function killRunningChildren(signal = 'SIGTERM') {
  refuseNewChildren = true;
  for (const child of runningChildren) killGroup(child, signal);
}

// Last resort: a detached child must never outlive us (process.kill is synchronous).
process.on('exit', () => {
  for (const child of runningChildren) killGroup(child, 'SIGKILL');
});

/** Sends a signal to a detached child's whole process group (falls back to the child alone). */
export function killGroup(child, signal = 'SIGTERM') {
  if (!child || child.exitCode !== null || child.signalCode !== null) return;
  try {
    process.kill(-child.pid, signal);
  } catch {
    try { child.kill(signal); } catch { /* already gone */ }
  }
}

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

const SKIPPED_FOLDERS = new Set(['node_modules', 'dist', 'coverage', '.vite', 'artifacts', '.turbo']);

/** Every input file of a workspace with its size and mtime, sorted, as one fingerprint. */
function fingerprintFolder(dir) {
  const entries = [];
  const walk = (current) => {
    for (const entry of fs.readdirSync(current, { withFileTypes: true })) {
      if (entry.isDirectory()) {
        if (!SKIPPED_FOLDERS.has(entry.name)) walk(path.join(current, entry.name));
      } else if (entry.isFile()) {
        const file = path.join(current, entry.name);
        const stat = fs.statSync(file);
        entries.push(`${path.relative(ROOT_DIR, file)}\t${stat.size}\t${stat.mtimeMs}`);
      }
    }
  };
  walk(dir);
  return entries.sort().join('\n');
}

/**
 * Fingerprint of what a workspace's build depends on: its own files, the workspaces it depends on,
 * the base tsconfig and the lockfile. Equal fingerprints mean the last build output is current.
 */
export function buildFingerprint(workspace) {
  const hash = createHash('sha256');
  for (const shared of ['tsconfig.base.json', 'package-lock.json']) {
    const file = path.join(ROOT_DIR, shared);
    if (fs.existsSync(file)) hash.update(fs.readFileSync(file));
  }
  for (const name of [...workspace.dependsOn, workspace.name]) {
    const dependency = WORKSPACES.find((candidate) => candidate.name === name);
    hash.update(fingerprintFolder(path.join(ROOT_DIR, dependency.dir)));
  }
  return hash.digest('hex');
}

const STAMP_FILE = path.join(DATA_DIR, 'build-stamps.json');

function readStamps() {
  try {
    return JSON.parse(fs.readFileSync(STAMP_FILE, 'utf8'));
  } catch {
    return {};
  }
}

/**
 * Builds the workspaces in order, skipping one whose inputs are unchanged since its last
 * successful build through this script (and whose output still exists). `force` builds all.
 * @param {{ env?: NodeJS.ProcessEnv, force?: boolean, only?: string[] }} [options]
 */
export async function buildWorkspaces({ env = process.env, force = false, only } = {}) {
  const stamps = readStamps();
  for (const workspace of WORKSPACES) {
    if (only && !only.includes(workspace.name)) continue;
    const fingerprint = buildFingerprint(workspace);
    const outputExists = fs.existsSync(path.join(ROOT_DIR, workspace.dir, workspace.output));
    if (!force && outputExists && stamps[workspace.name] === fingerprint) {
      process.stdout.write(`  ${workspace.name}: up to date, build skipped\n`);
      continue;
    }
    step(`Building ${workspace.name}`);
    const result = await runCommand('npm', ['run', 'build', '-w', workspace.name], { env });
    if (result.code !== 0) throw new Error(`The build of ${workspace.name} failed (exit ${result.code}); see the output above.`);
    stamps[workspace.name] = fingerprint;
    fs.mkdirSync(DATA_DIR, { recursive: true });
    fs.writeFileSync(STAMP_FILE, `${JSON.stringify(stamps, null, 2)}\n`);
  }
}

/**
 * Polls GET `url` until it answers 2xx with a JSON body that `accept` approves, the child exits,
 * or the time runs out.
 * @returns {Promise<object>} the last JSON body
 */
export async function waitForHealth(url, { child, timeoutMs = 60_000, accept = (body) => body?.status === 'ok' || body?.database === 'up' } = {}) {
  const deadline = Date.now() + timeoutMs;
  let last = 'no answer yet';
  while (Date.now() < deadline) {
    if (child && (child.exitCode !== null || child.signalCode !== null)) {
      throw new Error(`the server exited (code ${child.exitCode ?? child.signalCode}) before ${url} answered`);
    }
    try {
      const response = await fetch(url, { signal: AbortSignal.timeout(2000) });
      const text = await response.text();
      last = `${response.status} ${text.slice(0, 200)}`;
      if (response.ok) {
        const body = JSON.parse(text);
        if (accept(body)) return body;
      }
    } catch (error) {
      last = error.cause?.code ?? error.message;
    }
    await new Promise((resolve) => setTimeout(resolve, 300));
  }
  throw new Error(`${url} did not report healthy within ${Math.round(timeoutMs / 1000)} s (last: ${last})`);
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

/** git-describable short version for banners (best effort). */
export function checkoutVersion() {
  const result = spawnSync('git', ['rev-parse', '--short', 'HEAD'], { cwd: ROOT_DIR, encoding: 'utf8' });
  return result.status === 0 ? result.stdout.trim() : 'unknown';
}
