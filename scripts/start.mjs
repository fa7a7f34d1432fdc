#!/usr/bin/env node
// `npm start`: everything a fresh clone needs, then the product at http://127.0.0.1:${PORT:-3000}.
// install (npm ci when node_modules is missing) -> PostgreSQL 15 binaries -> project-local cluster
// in .data/postgres (fsync on: it keeps your data) -> role + database -> builds (skipped when
// unchanged) -> migrations -> demo seed -> `node api/dist/main.js` -> wait for /api/health.
// Ctrl-C (or SIGTERM) stops the server, then the database (pg_ctl -m fast).

import { spawn } from 'node:child_process';
import path from 'node:path';
import {
  ensurePostgresBinaries, ensureRoleAndDatabase, initCluster, isClusterRunning, isPortInUse,
  resolveReachableDataDir, startCluster, stopCluster,
} from './lib/postgres.mjs';
import { buildWorkspaces } from './lib/builds.mjs';
import { ensureNodeModules } from './lib/dependencies.mjs';
import { DEFAULT_ENV, DEMO_USERS, loadDotEnv, localJwtSecret } from './lib/environment.mjs';
import { DATA_DIR, ROOT_DIR } from './lib/paths.mjs';
import { killRunningChildren, runCommand, step, waitForHealth } from './lib/processes.mjs';
import { acquireLock, releaseLock as releaseLockFile } from './lib/single-instance.mjs';

const LOCK_FILE = path.join(DATA_DIR, 'start.lock');

function fail(message) {
  process.stderr.write(`\n\u2716 ${message}\n`);
  process.exitCode = 1;
}

async function main() {
  const dotEnvLoaded = loadDotEnv();
  const env = { ...DEFAULT_ENV, ...process.env };
  env.JWT_SECRET ||= localJwtSecret();
  const url = `http://${env.HOST === '0.0.0.0' ? '127.0.0.1' : env.HOST}:${env.PORT}`;
  const databasePort = Number(env.DATABASE_PORT);

  const lock = acquireLock(LOCK_FILE, { url, databasePort });
  if (!lock.acquired) {
    const { holder } = lock;
    fail(
      `Beamwright is already running from this checkout (pid ${holder.pid}, since ${holder.startedAt}` +
        `${holder.url ? `, at ${holder.url}` : ''}).\n  Use that one, or stop it first (Ctrl-C in its terminal, or: kill -INT ${holder.pid}).`,
    );
    return;
  }
  const releaseLock = () => releaseLockFile(LOCK_FILE);

  let server;
  let cluster; // { binDir, clusterDir } once the database runs
  let shuttingDown = false;

  const shutdown = async (signal) => {
    if (shuttingDown) return;
    shuttingDown = true;
    process.stdout.write(`\n${signal ? `${signal} received: ` : ''}stopping Beamwright...\n`);
    killRunningChildren('SIGTERM'); // a bootstrap step in progress (npm ci, builds, migrations)
    if (server && server.exitCode === null && server.signalCode === null) {
      const exited = new Promise((resolve) => server.once('exit', resolve));
      server.kill('SIGTERM');
      const timer = setTimeout(() => server.kill('SIGKILL'), 10_000);
      await exited;
      clearTimeout(timer);
      process.stdout.write('  server stopped\n');
    }
    if (cluster) {
      try {
        await stopCluster({ ...cluster, mode: 'fast' });
        process.stdout.write('  database stopped (your data is kept in the cluster folder)\n');
      } catch (error) {
        process.stderr.write(`  could not stop the database cleanly: ${error.message}\n`);
      }
    }
    releaseLock();
  };
  for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
    process.on(signal, () => {
      shutdown(signal).finally(() => process.exit(0));
    });
  }

  try {
    if (dotEnvLoaded) process.stdout.write('Loaded settings from .env\n');

    if (await isPortInUse(Number(env.PORT), env.HOST === '0.0.0.0' ? '127.0.0.1' : env.HOST)) {
      throw new Error(`Port ${env.PORT} is already in use by another process. Stop it, or set PORT (e.g. PORT=3001 npm start).`);
    }

    await ensureNodeModules();

    const localDatabase = ['127.0.0.1', 'localhost', '::1'].includes(env.DATABASE_HOST);
    if (!localDatabase) {
      // DATABASE_HOST names another server: use it as it is, start nothing of our own.
      step(`PostgreSQL at ${env.DATABASE_HOST}:${databasePort} (DATABASE_HOST is not loopback: no local cluster)`);
    } else {
      step('PostgreSQL 15');
      const binDir = await ensurePostgresBinaries({ log: (message) => process.stdout.write(`  ${message}\n`) });
      const resolved = resolveReachableDataDir(path.join(DATA_DIR, 'postgres'));
      if (resolved.fallback) {
        process.stdout.write(`  Using ${resolved.dir} for the database: ${resolved.reason}.\n`);
      }
      const clusterDir = resolved.dir;
      const wasRunning = await isClusterRunning({ binDir, clusterDir });
      if (wasRunning) {
        // Left running by a start that was killed hard: restart it so the current settings apply.
        process.stdout.write('  The cluster was still running from an earlier start: restarting it.\n');
        await stopCluster({ binDir, clusterDir, mode: 'fast' });
      }
      const { created } = await initCluster({
        binDir, clusterDir, port: databasePort, fsync: true, log: (message) => process.stdout.write(`  ${message}\n`),
      });
      cluster = { binDir, clusterDir }; // from here on, shutdown stops it
      await startCluster({ binDir, clusterDir, port: databasePort });
      await ensureRoleAndDatabase({
        binDir, clusterDir, port: databasePort, user: env.DATABASE_USER, password: env.DATABASE_PASSWORD, database: env.DATABASE_NAME,
      });
      process.stdout.write(`  ${created ? 'Created' : 'Started'} the cluster in ${clusterDir}, listening on 127.0.0.1:${databasePort}\n`);
    }

    step('Builds');
    await buildWorkspaces({ env: { ...env, NODE_ENV: 'production' } });

    step('Database migrations');
    const migrate = await runCommand('npm', ['run', 'migration:run', '-w', '@beamwright/api'], { env });
    if (shuttingDown) return;
    if (migrate.code !== 0) throw new Error(`The migrations failed (exit ${migrate.code}); see the output above.`);

    step('Demo data (idempotent)');
    const seed = await runCommand('npm', ['run', 'seed', '-w', '@beamwright/api'], { env });
    if (shuttingDown) return;
    if (seed.code !== 0) throw new Error(`The demo seed failed (exit ${seed.code}); see the output above.`);

    step('Starting the server');
    server = spawn(process.execPath, [path.join(ROOT_DIR, 'api', 'dist', 'main.js')], { cwd: ROOT_DIR, env, stdio: 'inherit' });
    server.once('exit', (code, signal) => {
      if (shuttingDown) return;
      fail(`The server exited unexpectedly (${signal ?? `code ${code}`}).`);
      shutdown().finally(() => process.exit(1));
    });
    const health = await waitForHealth(`${url}/api/health`, { child: server, timeoutMs: 90_000, accept: (body) => body?.database === 'up' });

    const width = Math.max(...DEMO_USERS.map((user) => user.email.length));
    process.stdout.write(
      [
        '',
        '\u2500'.repeat(64),
        `  Beamwright is running at ${url}`,
        `  API ${url}/api   (OpenAPI: ${url}/api/docs)   health: database ${health.database}`,
        '',
        '  Demo sign-ins (fictional organisation), password: ' + env.DEMO_PASSWORD,
        ...DEMO_USERS.map((user) => `    ${user.email.padEnd(width)}  ${user.role}`),
        '',
        '  Press Ctrl-C to stop the server and the database.',
        '\u2500'.repeat(64),
        '',
      ].join('\n'),
    );
  } catch (error) {
    if (shuttingDown) return;
    fail(error.message);
    await shutdown();
    process.exit(1);
  }
}

main().catch((error) => {
  fail(error.stack ?? String(error));
  releaseLockFile(LOCK_FILE);
  process.exit(1);
});
