#!/usr/bin/env node
// `npm test`: the whole suite on a fresh clone, with nothing typed first.
// Bootstrap (npm ci when node_modules is missing, PostgreSQL 15, Debian chromium) and a THROWAWAY
// cluster (own port and folder, fsync off, removed afterwards even on failure or Ctrl-C); then every
// suite in order, going on after a failure: lint, typecheck, script self-tests, link-core, api
// (unit + e2e against the throwaway cluster), ui components, then builds + migrate + seed + server
// on port 3100 for the browser tests. Prints a per-suite table and, as its very last line,
// "N passed, N failed, N skipped". Exits non-zero when anything failed.
//
// Options (environment): TEST_DATABASE_PORT (54339), TEST_SERVER_PORT (3100), FUZZ_SECONDS (60),
// TEST_ONLY=lint,typecheck,... (run a subset; the names: lint, typecheck, scripts, link-core, api,
// ui, browser, fuzz).

import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensurePostgresBinaries, ensureRoleAndDatabase, findFreePort, isPortInUse, startThrowawayPostgres } from './lib/postgres.mjs';
import { ensureChromium, ensureNodeModules } from './lib/dependencies.mjs';
import { DEFAULT_ENV } from './lib/environment.mjs';
import { ROOT_DIR, WORKSPACES } from './lib/paths.mjs';
import { killRunningChildren, runCommand, step, waitForHealth } from './lib/processes.mjs';
import { countNodeTestSummary, countVitest } from './lib/test-reports.mjs';

const SUITE_TIMEOUT_MS = 12 * 60_000;
const only = process.env.TEST_ONLY ? new Set(process.env.TEST_ONLY.split(',').map((name) => name.trim())) : undefined;
// Nothing new starts once Ctrl-C was pressed (see the signal handlers below).
const selected = (key) => !interrupted && (!only || only.has(key));

/** @type {{ key: string, name: string, passed: number, failed: number, skipped: number, seconds: number, note: string }[]} */
const results = [];
const startedAt = Date.now();
const workDir = fs.mkdtempSync(path.join(os.tmpdir(), 'bw-test-'));
let cluster;
let server;
let cleanUpRun;
let interrupted = false;

function record(key, name, { passed = 0, failed = 0, skipped = 0, durationMs = 0, note = '' }) {
  const row = { key, name, passed, failed, skipped, seconds: durationMs / 1000, note };
  results.push(row);
  const verdict = failed > 0 ? 'FAILED' : passed > 0 ? 'ok' : 'nothing ran';
  process.stdout.write(`\n\u25c0 ${name}: ${verdict} (${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''})${note ? ` - ${note}` : ''}\n`);
  return row;
}

/** A step that either works or fails as a whole (lint, typecheck, a build, migrations). */
async function checkStep(key, name, command, args, options = {}) {
  step(name);
  const result = await runCommand(command, args, { timeoutMs: SUITE_TIMEOUT_MS, ...options });
  const ok = result.code === 0;
  return record(key, name, {
    passed: ok ? 1 : 0, failed: ok ? 0 : 1, durationMs: result.durationMs,
    note: result.timedOut ? 'timed out' : ok ? '' : `exit ${result.code}`,
  });
}

const reportPath = (key) => path.join(workDir, `${key}.json`);

/** Runs a workspace's vitest suite with a JSON report beside the usual output and counts it. */
async function vitestSuite(key, name, workspaceName, env) {
  step(name);
  const result = await runCommand('npm', [
    'test', '-w', workspaceName, '--', '--reporter=default', '--reporter=json', `--outputFile=${reportPath(key)}`,
  ], { env, timeoutMs: SUITE_TIMEOUT_MS, capture: true });
  let report;
  try {
    report = JSON.parse(fs.readFileSync(reportPath(key), 'utf8'));
  } catch {
    report = undefined;
  }
  const counts = countVitest({ report, exitCode: result.code, output: result.output, timedOut: result.timedOut });
  counts.note = counts.note.replaceAll(`${ROOT_DIR}/`, '');
  return record(key, name, { ...counts, durationMs: result.durationMs });
}

async function nodeTestSuite(key, name, command, args, options) {
  step(name);
  const result = await runCommand(command, args, { timeoutMs: SUITE_TIMEOUT_MS, capture: true, ...options });
  const counts = countNodeTestSummary(result.output);
  if (!counts) {
    return record(key, name, {
      failed: 1, durationMs: result.durationMs,
      note: result.timedOut ? 'timed out' : `no test summary in the output (exit ${result.code})`,
    });
  }
  const note = result.timedOut ? 'timed out' : result.code !== 0 && counts.failed === 0 ? `exit ${result.code}` : '';
  return record(key, name, {
    ...counts, failed: counts.failed + (note ? 1 : 0), durationMs: result.durationMs, note,
  });
}

async function stopServer() {
  if (!server || server.exitCode !== null || server.signalCode !== null) return;
  const exited = new Promise((resolve) => server.once('exit', resolve));
  server.kill('SIGTERM');
  const timer = setTimeout(() => server.kill('SIGKILL'), 10_000);
  await exited;
  clearTimeout(timer);
}

/** Ends children, the server and the throwaway cluster; every caller awaits the same run. */
function cleanUp() {
  cleanUpRun ??= (async () => {
    killRunningChildren('SIGKILL');
    await stopServer().catch(() => {});
    await cluster?.remove().catch((error) => process.stderr.write(`could not remove the test cluster: ${error.message}\n`));
    fs.rmSync(workDir, { recursive: true, force: true });
  })();
  return cleanUpRun;
}
process.on('exit', () => fs.rmSync(workDir, { recursive: true, force: true }));

for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(signal, () => {
    if (interrupted) return;
    interrupted = true;
    process.stdout.write(`\n${signal} received: removing the throwaway database and stopping.\n`);
    // The main flow then skips every later suite, prints the summary and exits 130; this is the
    // fallback should it be stuck.
    cleanUp().finally(() => setTimeout(() => process.exit(130), 15_000).unref());
  });
}

function printSummary() {
  const header = ['suite', 'passed', 'failed', 'skipped', 'time', 'note'];
  const rows = results.map((row) => [
    row.name, String(row.passed), String(row.failed), String(row.skipped), `${row.seconds.toFixed(1)}s`, row.note,
  ]);
  const widths = header.map((title, column) => Math.max(title.length, ...rows.map((row) => row[column].length)));
  const line = (cells) => cells.map((cell, column) => (column >= 1 && column <= 4 ? cell.padStart(widths[column]) : cell.padEnd(widths[column]))).join('  ').trimEnd();
  const total = (field) => results.reduce((sum, row) => sum + row[field], 0);
  process.stdout.write(`\n${'='.repeat(72)}\nTest summary (${((Date.now() - startedAt) / 1000).toFixed(0)} s in all)\n`);
  process.stdout.write(`${line(header)}\n${widths.map((width) => '-'.repeat(width)).join('  ')}\n`);
  for (const row of rows) process.stdout.write(`${line(row)}\n`);
  const failedSuites = results.filter((row) => row.failed > 0).map((row) => row.name);
  if (failedSuites.length) process.stdout.write(`\nFailed: ${failedSuites.join('; ')}\n`);
  const skipped = total('skipped');
  process.stdout.write(`\n${total('passed')} passed, ${total('failed')} failed${skipped ? `, ${skipped} skipped` : ''}\n`);
  return total('failed');
}

async function main() {
  // No .env here on purpose: the suite must not depend on a developer's local settings.
  const databasePort = Number(process.env.TEST_DATABASE_PORT ?? 54339);
  const serverPort = Number(process.env.TEST_SERVER_PORT ?? 3100);

  // --- bootstrap: a failure here is one failed row, then the summary ---
  try {
    step('Bootstrap: dependencies, PostgreSQL 15, chromium');
    await ensureNodeModules();
    await ensurePostgresBinaries({ log: (message) => process.stdout.write(`  ${message}\n`) });
    if (selected('browser')) await ensureChromium();
    const port = (await isPortInUse(databasePort)) ? await findFreePort() : databasePort;
    if (port !== databasePort) process.stdout.write(`  port ${databasePort} is busy: the test cluster uses ${port}\n`);
    cluster = await startThrowawayPostgres({ port, label: 'npm-test', database: 'beamwright_test' });
    process.stdout.write(`  throwaway cluster on 127.0.0.1:${cluster.port} in ${cluster.dataDir} (fsync off, removed at the end)\n`);
  } catch (error) {
    process.stderr.write(`\n${error.stack ?? error}\n`);
    record('bootstrap', 'bootstrap', { failed: 1, note: error.message.split('\n')[0] });
    return;
  }

  // Only what the suites need: each test setup supplies its own defaults for the rest (a token
  // lifetime, for instance), so nothing from the shell or a local .env leaks into the tests.
  const inherited = { ...process.env };
  for (const name of Object.keys(DEFAULT_ENV)) delete inherited[name];
  for (const name of ['JWT_SECRET', 'UI_DIST_DIR']) delete inherited[name];
  const testEnv = {
    ...inherited,
    NODE_ENV: 'test',
    CI: process.env.CI ?? 'true',
    DATABASE_HOST: cluster.host,
    DATABASE_PORT: String(cluster.port),
    DATABASE_USER: cluster.user,
    DATABASE_PASSWORD: cluster.password,
    DATABASE_NAME: cluster.database,
    JWT_SECRET: 'test-only-jwt-secret-not-for-production',
  };

  if (selected('lint')) await lintSuite();

  if (selected('typecheck')) {
    for (const workspace of WORKSPACES) {
      if (interrupted) break;
      await checkStep('typecheck', `typecheck ${workspace.dir}`, 'npm', ['run', 'typecheck', '-w', workspace.name]);
    }
  }

  if (selected('scripts')) {
    // Listed explicitly: given the folder, node would also pick up scripts/test.mjs itself.
    const files = [
      ...fs.readdirSync(path.join(ROOT_DIR, 'scripts', 'lib')).filter((file) => file.endsWith('.test.mjs')).map((file) => path.join('scripts', 'lib', file)),
      // Recomputes the reference cases with Debian's python3 packages; skipped when they are absent.
      path.join('fixtures', 'reference', 'recompute.test.mjs'),
    ];
    await nodeTestSuite('scripts', 'scripts self-tests (node:test)', process.execPath, ['--test', '--test-reporter=tap', ...files], {});
  }

  if (selected('link-core')) await vitestSuite('link-core', 'link-core unit tests', '@beamwright/link-core', testEnv);

  // The api (Node) imports link-core's dist/: build it before the api suites.
  let linkCoreBuilt = false;
  if (selected('api') || selected('browser') || selected('fuzz')) {
    linkCoreBuilt = (await checkStep('build', 'build link-core', 'npm', ['run', 'build', '-w', '@beamwright/link-core'])).failed === 0;
  }
  if (selected('api')) {
    if (linkCoreBuilt) await vitestSuite('api', 'api unit + e2e tests', '@beamwright/api', testEnv);
    else record('api', 'api unit + e2e tests', { failed: 1, note: 'not run: link-core did not build' });
  }

  if (selected('ui')) await vitestSuite('ui', 'ui component tests', '@beamwright/ui', testEnv);

  if (selected('browser') || selected('fuzz')) await browserSuite(testEnv, serverPort);
}

/** eslint once, with a JSON report we print as `file:line:column  rule  message` and count. */
async function lintSuite() {
  step('lint (eslint)');
  const report = path.join(workDir, 'eslint.json');
  const result = await runCommand('npx', ['eslint', '.', '--format', 'json', '--output-file', report], { timeoutMs: SUITE_TIMEOUT_MS });
  let errors = 0;
  let warnings = 0;
  let readable = false;
  try {
    for (const file of JSON.parse(fs.readFileSync(report, 'utf8'))) {
      for (const message of file.messages) {
        const kind = message.severity === 2 ? 'error' : 'warning';
        process.stdout.write(`  ${path.relative(ROOT_DIR, file.filePath)}:${message.line ?? 0}:${message.column ?? 0}  ${kind}  ${message.message}  ${message.ruleId ?? ''}\n`);
      }
      errors += file.errorCount + (file.fatalErrorCount ?? 0);
      warnings += file.warningCount;
    }
    readable = true;
  } catch { /* no report: the linter crashed, its output is above */ }
  const ok = result.code === 0 && readable;
  record('lint', 'lint (eslint)', {
    passed: ok ? 1 : 0, failed: ok ? 0 : 1, durationMs: result.durationMs,
    note: readable ? `${errors} error(s), ${warnings} warning(s)` : `eslint exited ${result.code} without a report`,
  });
}

async function browserSuite(testEnv, wantedPort) {
  // Its own database in the same cluster, so rows left by the api e2e suite cannot interfere.
  const browserDatabase = 'beamwright_browser';
  const binDir = await ensurePostgresBinaries();
  await ensureRoleAndDatabase({
    binDir, clusterDir: cluster.dataDir, port: cluster.port, user: cluster.user, password: cluster.password, database: browserDatabase,
  });
  const serverPort = (await isPortInUse(wantedPort)) ? await findFreePort() : wantedPort;
  if (serverPort !== wantedPort) process.stdout.write(`  port ${wantedPort} is busy: the test server uses ${serverPort}\n`);
  const env = {
    ...DEFAULT_ENV, ...testEnv, NODE_ENV: 'production', DATABASE_NAME: browserDatabase, PORT: String(serverPort), HOST: '127.0.0.1',
  };

  const prerequisites = [
    ['build ui', ['run', 'build', '-w', '@beamwright/ui']],
    ['build api', ['run', 'build', '-w', '@beamwright/api']],
    ['migrate (browser database)', ['run', 'migration:run', '-w', '@beamwright/api']],
    ['seed (browser database)', ['run', 'seed', '-w', '@beamwright/api']],
  ];
  for (const [name, args] of prerequisites) {
    if (interrupted) return;
    const row = await checkStep('browser', name, 'npm', args, { env });
    if (row.failed) {
      record('browser', 'ui browser tests', { failed: 1, note: `not run: ${name} failed` });
      return;
    }
  }

  if (interrupted) return;
  step(`Starting the server on 127.0.0.1:${serverPort} for the browser tests`);
  const baseUrl = `http://127.0.0.1:${serverPort}`;
  const serverLog = path.join(workDir, 'server.log');
  const logStream = fs.createWriteStream(serverLog);
  // The probe records the server's longest event-loop block (from the start of the fuzz run on).
  const eventLoopReport = path.join(workDir, 'event-loop.json');
  server = spawn(process.execPath, ['--import', './api/test/fuzz/event-loop-probe.mjs', path.join(ROOT_DIR, 'api', 'dist', 'main.js')], {
    cwd: ROOT_DIR, env: { ...env, EVENT_LOOP_REPORT: eventLoopReport }, stdio: ['ignore', 'pipe', 'pipe'],
  });
  server.stdout.pipe(logStream);
  server.stderr.pipe(logStream);
  try {
    await waitForHealth(`${baseUrl}/api/health`, { child: server, timeoutMs: 60_000, accept: (body) => body?.database === 'up' });
  } catch (error) {
    await stopServer();
    process.stdout.write(`--- server output ---\n${fs.existsSync(serverLog) ? fs.readFileSync(serverLog, 'utf8').slice(-3000) : ''}\n`);
    record('browser', 'ui browser tests', { failed: 1, note: `not run: the server did not start (${error.message})` });
    return;
  }
  try {
    if (selected('browser')) {
      await nodeTestSuite('browser', 'ui browser tests (chromium)', 'npm', ['run', 'e2e', '-w', '@beamwright/ui'], {
        env: { ...env, BASE_URL: baseUrl, CHROMIUM_PATH: '/usr/bin/chromium' },
      });
    }
    // Last, on the same server and database: it writes hostile (but valid) rows of its own.
    if (selected('fuzz')) {
      await nodeTestSuite('fuzz', 'api fuzz (hostile requests, about a minute)', process.execPath, [
        '--test', '--test-reporter=tap', path.join('api', 'test', 'fuzz', 'hostile-requests.fuzz.mjs'),
      ], { env: { ...env, BASE_URL: baseUrl, EVENT_LOOP_REPORT: eventLoopReport } });
    }
  } finally {
    await stopServer();
    if (fs.existsSync(eventLoopReport)) {
      const loop = JSON.parse(fs.readFileSync(eventLoopReport, 'utf8'));
      process.stdout.write(`  server event loop from ${loop.since} (the start of the fuzz run): longest block ${loop.maxMs} ms, p99 ${loop.p99Ms} ms (${loop.samples} samples)\n`);
    }
    const failedBrowser = results.at(-1)?.failed > 0;
    if (failedBrowser) {
      process.stdout.write(`--- server output (last lines) ---\n${fs.readFileSync(serverLog, 'utf8').slice(-3000)}\n`);
    }
  }
}

let failed;
try {
  await main();
} catch (error) {
  process.stderr.write(`\n${error.stack ?? error}\n`);
  record('runner', 'test runner', { failed: 1, note: error.message.split('\n')[0] });
} finally {
  await cleanUp();
  if (interrupted) record('runner', 'interrupted (Ctrl-C): later suites not run', { failed: 1 });
  failed = printSummary();
}
process.exit(interrupted ? 130 : failed > 0 ? 1 : 0);
