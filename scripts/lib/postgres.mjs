// Project-local PostgreSQL 15 on loopback: find (or install) the binaries, create a cluster in a
// folder the database user can reach, start/stop it with pg_ctl, and create the app role and
// database idempotently. Plain ESM JavaScript on purpose: it runs before anything is built, and the
// api's e2e tests import it to make clusters of their own.
//
// Why the care about users and folders: initdb and postgres refuse to run as root, so as root we run
// them as the `postgres` OS user (runuser), and that user must be able to traverse every parent of
// the data folder. When the checkout is not reachable (e.g. it lives under /root), we fall back to a
// folder under /var/tmp.

import { spawn, spawnSync, execFileSync } from 'node:child_process';
import { randomBytes, createHash } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

/** Debian's binary folder of the major version we support. */
export const POSTGRES_MAJOR_VERSION = 15;
const DEBIAN_BIN_DIR = `/usr/lib/postgresql/${POSTGRES_MAJOR_VERSION}/bin`;
/** Unix sockets have a hard path limit (108 bytes on Linux, including the socket file name). */
const MAX_SOCKET_DIR_LENGTH = 90;

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/**
 * The OS user that runs initdb/pg_ctl/postgres: `postgres` when we are root (PostgreSQL refuses
 * root), the invoking user otherwise.
 * @returns {{ name: string, uid: number, gid: number, viaRunuser: boolean }}
 */
export function databaseOsUser() {
  if (!isRoot()) {
    const info = os.userInfo();
    return { name: info.username, uid: info.uid, gid: info.gid, viaRunuser: false };
  }
  const uid = Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim());
  const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim());
  return { name: 'postgres', uid, gid, viaRunuser: true };
}

function hasPostgresOsUser() {
  return spawnSync('id', ['-u', 'postgres'], { stdio: 'ignore' }).status === 0;
}

function binariesPresent(binDir) {
  return ['initdb', 'pg_ctl', 'postgres', 'psql'].every((name) => fs.existsSync(path.join(binDir, name)));
}

/**
 * Finds PostgreSQL 15's binary folder; installs Debian's `postgresql-15` when it is missing and we
 * are root, otherwise throws an error that says what to run.
 * `PG_BIN_DIR` in the environment overrides the search (a folder holding initdb, pg_ctl, psql).
 * @param {{ log?: (message: string) => void }} [options]
 * @returns {Promise<string>} absolute path of the bin folder
 */
export async function ensurePostgresBinaries({ log = () => {} } = {}) {
  const override = process.env.PG_BIN_DIR;
  if (override) {
    if (!binariesPresent(override)) throw new Error(`PG_BIN_DIR=${override} does not hold initdb, pg_ctl, postgres and psql`);
    return override;
  }
  if (binariesPresent(DEBIAN_BIN_DIR) && (!isRoot() || hasPostgresOsUser())) return DEBIAN_BIN_DIR;

  const installCommand = `apt-get update && apt-get install -y postgresql-${POSTGRES_MAJOR_VERSION}`;
  if (!isRoot()) {
    throw new Error(
      `PostgreSQL ${POSTGRES_MAJOR_VERSION} is not installed (no ${DEBIAN_BIN_DIR}). Install it with:\n` +
        `  sudo sh -c '${installCommand}'\nthen run the command again.`,
    );
  }
  log(`PostgreSQL ${POSTGRES_MAJOR_VERSION} not found: installing Debian's postgresql-${POSTGRES_MAJOR_VERSION} (apt-get)...`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  await run('apt-get', ['update'], { env, quiet: true });
  await run('apt-get', ['install', '-y', '--no-install-recommends', `postgresql-${POSTGRES_MAJOR_VERSION}`], { env, quiet: true });
  if (!binariesPresent(DEBIAN_BIN_DIR)) {
    throw new Error(`apt-get installed postgresql-${POSTGRES_MAJOR_VERSION} but ${DEBIAN_BIN_DIR} is still missing`);
  }
  return DEBIAN_BIN_DIR;
}

/**
 * True when `osUser` can traverse every folder from / down to `dir` (the deepest existing
 * ancestor when `dir` does not exist yet) and write into that deepest existing folder or `dir`.
 * Checks permission bits rather than trying, because we may be root (who can always try).
 * @param {string} dir absolute path
 * @param {{ uid: number, gid: number }} osUser
 */
export function isReachableBy(dir, osUser) {
  const groups = groupIdsOf(osUser);
  const allows = (stat, bit) => {
    if (osUser.uid === 0) return true;
    if (stat.uid === osUser.uid) return Boolean(stat.mode & (bit << 6));
    if (groups.has(stat.gid)) return Boolean(stat.mode & (bit << 3));
    return Boolean(stat.mode & bit);
  };
  const parts = path.resolve(dir).split(path.sep).filter(Boolean);
  let current = path.sep;
  for (let index = 0; index <= parts.length; index += 1) {
    let stat;
    try {
      stat = fs.statSync(current);
    } catch {
      return false;
    }
    if (!allows(stat, 1)) return false; // execute = traverse
    if (index === parts.length) return true;
    const next = path.join(current, parts[index]);
    if (!fs.existsSync(next)) {
      // The rest will be created: by us as root (traversable, the cluster root then handed over),
      // or by this very user, who then needs write access here.
      if (isRoot()) return true;
      try {
        fs.accessSync(current, fs.constants.W_OK);
        return true;
      } catch {
        return false;
      }
    }
    current = next;
  }
  return true;
}

function groupIdsOf(osUser) {
  const groups = new Set([osUser.gid]);
  try {
    const name = spawnSync('id', ['-nu', String(osUser.uid)], { encoding: 'utf8' }).stdout.trim();
    const out = spawnSync('id', ['-G', name], { encoding: 'utf8' }).stdout.trim();
    for (const id of out.split(/\s+/)) if (id) groups.add(Number(id));
  } catch {
    // fall back to the primary group only
  }
  return groups;
}

/**
 * Picks the folder for a cluster: `preferredDir` when the database OS user can reach it and the
 * socket path fits, otherwise a stable fallback under /var/tmp (named from a hash of the preferred
 * path, so the same checkout always finds its data again).
 * @param {string} preferredDir absolute path, e.g. <checkout>/.data/postgres
 * @param {{ osUser?: { uid: number, gid: number } }} [options]
 * @returns {{ dir: string, fallback: boolean, reason?: string }}
 */
export function resolveReachableDataDir(preferredDir, { osUser = databaseOsUser() } = {}) {
  const resolved = path.resolve(preferredDir);
  const tooLong = path.join(resolved, 'run').length > MAX_SOCKET_DIR_LENGTH;
  if (!tooLong && isReachableBy(resolved, osUser)) return { dir: resolved, fallback: false };
  const digest = createHash('sha256').update(resolved).digest('hex').slice(0, 12);
  const dir = path.join('/var/tmp', `beamwright-${path.basename(resolved)}-${digest}`);
  const reason = tooLong
    ? `the path ${resolved} is too long for a Unix socket`
    : `the database user "${osUser.name ?? osUser.uid}" cannot reach ${resolved} (a parent folder is not traversable)`;
  return { dir, fallback: true, reason };
}

/** Folder layout of one cluster root: data/ (PGDATA), run/ (socket), server.log. */
export function clusterPaths(clusterDir) {
  return {
    clusterDir,
    pgData: path.join(clusterDir, 'data'),
    socketDir: path.join(clusterDir, 'run'),
    logFile: path.join(clusterDir, 'server.log'),
  };
}

/** Creates `dir` (and parents) and hands it to the database OS user with mode 0700. */
function makeOwnedDir(dir, osUser) {
  fs.mkdirSync(dir, { recursive: true, mode: 0o700 });
  if (isRoot()) fs.chownSync(dir, osUser.uid, osUser.gid);
  fs.chmodSync(dir, 0o700);
}

/**
 * Initialises a cluster in `<clusterDir>/data` unless one is already there (idempotent).
 * Settings: listen only on 127.0.0.1 at `port`, Unix socket in `<clusterDir>/run`, trust for local
 * socket connections of the OS user, scram-sha-256 over TCP.
 * @param {{ binDir: string, clusterDir: string, port: number, fsync?: boolean, log?: (m: string) => void }} options
 *   fsync=false is for throwaway test clusters only (faster, loses data on a crash).
 * @returns {Promise<{ created: boolean }>}
 */
export async function initCluster({ binDir, clusterDir, port, fsync = true, log = () => {} }) {
  assertProjectPort(port);
  const osUser = databaseOsUser();
  const { pgData, socketDir, logFile } = clusterPaths(clusterDir);
  // The cluster root's parent stays ours; the root itself belongs to the database user.
  const parent = path.dirname(clusterDir);
  if (!fs.existsSync(parent)) {
    fs.mkdirSync(parent, { recursive: true });
    // A restrictive umask must not lock the database user out of the folder it has to traverse.
    if (isRoot()) fs.chmodSync(parent, 0o755);
  }
  makeOwnedDir(clusterDir, osUser);
  makeOwnedDir(socketDir, osUser);
  if (!fs.existsSync(logFile)) fs.writeFileSync(logFile, '', { mode: 0o600 });
  if (isRoot()) fs.chownSync(logFile, osUser.uid, osUser.gid);

  let created = false;
  if (!fs.existsSync(path.join(pgData, 'PG_VERSION'))) {
    makeOwnedDir(pgData, osUser);
    log(`Initialising a PostgreSQL cluster in ${pgData}`);
    await runAsDatabaseUser(path.join(binDir, 'initdb'), [
      '-D', pgData, '-U', 'postgres', '--auth-local=trust', '--auth-host=scram-sha-256',
      '-E', 'UTF8', '--locale=C.UTF-8',
    ], { cwd: clusterDir, quiet: true });
    created = true;
  }
  // Always (re)write our settings: the port may change between runs through DATABASE_PORT.
  const settings = [
    '# Written by scripts/lib/postgres.mjs on every start; edit DATABASE_PORT, not this file.',
    "listen_addresses = '127.0.0.1'",
    `port = ${port}`,
    `unix_socket_directories = '${socketDir.replaceAll("'", "''")}'`,
    `fsync = ${fsync ? 'on' : 'off'}`,
    ...(fsync ? [] : ['synchronous_commit = off', 'full_page_writes = off']),
    'max_connections = 100',
    '',
  ].join('\n');
  const confFile = path.join(pgData, 'beamwright.conf');
  fs.writeFileSync(confFile, settings);
  if (isRoot()) fs.chownSync(confFile, osUser.uid, osUser.gid);
  const mainConf = path.join(pgData, 'postgresql.conf');
  const main = fs.readFileSync(mainConf, 'utf8');
  if (!main.includes("include_if_exists = 'beamwright.conf'")) {
    fs.appendFileSync(mainConf, "\ninclude_if_exists = 'beamwright.conf'\n");
  }
  return { created };
}

/**
 * True when the postmaster of `clusterDir` runs (pg_ctl status).
 * @param {{ binDir: string, clusterDir: string }} options
 */
export async function isClusterRunning({ binDir, clusterDir }) {
  const { pgData } = clusterPaths(clusterDir);
  if (!fs.existsSync(path.join(pgData, 'PG_VERSION'))) return false;
  const result = await runAsDatabaseUser(path.join(binDir, 'pg_ctl'), ['-D', pgData, 'status'], {
    cwd: clusterDir, quiet: true, allowFailure: true,
  });
  return result.code === 0;
}

/**
 * Starts the cluster and waits until it accepts connections (pg_ctl -w -t 30). A no-op when it
 * already runs. Throws with the tail of the server log when it does not start.
 * @param {{ binDir: string, clusterDir: string, port?: number }} options
 *   port: when given, fails early with a clear message if another process holds it.
 */
export async function startCluster({ binDir, clusterDir, port }) {
  const { pgData, logFile } = clusterPaths(clusterDir);
  if (await isClusterRunning({ binDir, clusterDir })) return { alreadyRunning: true };
  if (port !== undefined && (await isPortInUse(port))) {
    throw new Error(`Port ${port} on 127.0.0.1 is already in use by another process: cannot start PostgreSQL there.`);
  }
  const result = await runAsDatabaseUser(path.join(binDir, 'pg_ctl'), [
    '-D', pgData, '-l', logFile, '-w', '-t', '30', 'start',
  ], { cwd: clusterDir, quiet: true, allowFailure: true });
  if (result.code !== 0) {
    throw new Error(`PostgreSQL did not start (pg_ctl exit ${result.code}).\n${result.output}\n--- ${logFile} (last lines) ---\n${tail(logFile, 25)}`);
  }
  return { alreadyRunning: false };
}

/**
 * Stops the cluster (default mode "fast": disconnects clients, rolls back, checkpoints). A no-op
 * when it is not running.
 * @param {{ binDir: string, clusterDir: string, mode?: 'smart' | 'fast' | 'immediate' }} options
 */
export async function stopCluster({ binDir, clusterDir, mode = 'fast' }) {
  if (!(await isClusterRunning({ binDir, clusterDir }))) return { wasRunning: false };
  const { pgData } = clusterPaths(clusterDir);
  await runAsDatabaseUser(path.join(binDir, 'pg_ctl'), ['-D', pgData, '-m', mode, '-w', '-t', '60', 'stop'], {
    cwd: clusterDir, quiet: true,
  });
  return { wasRunning: true };
}

/** Synchronous stop for process-exit handlers (no event loop left there). */
export function stopClusterSync({ binDir, clusterDir, mode = 'fast' }) {
  const { pgData } = clusterPaths(clusterDir);
  if (!fs.existsSync(path.join(pgData, 'postmaster.pid'))) return;
  const [command, args] = asDatabaseUser(path.join(binDir, 'pg_ctl'), ['-D', pgData, '-m', mode, '-w', '-t', '30', 'stop']);
  spawnSync(command, args, { cwd: clusterDir, stdio: 'ignore' });
}

/**
 * Creates (or updates the password of) a login role and a database it owns, idempotently, by
 * connecting as the `postgres` superuser over the cluster's Unix socket.
 * @param {{ binDir: string, clusterDir: string, port: number, user: string, password: string, database: string }} options
 */
export async function ensureRoleAndDatabase({ binDir, clusterDir, port, user, password, database }) {
  for (const [field, value] of Object.entries({ user, database })) {
    if (!/^[a-z_][a-z0-9_]*$/.test(value)) throw new Error(`${field} "${value}" must be a lower-case SQL identifier (a-z, 0-9, _)`);
  }
  const literal = (text) => `'${String(text).replaceAll("'", "''")}'`;
  const psql = (sql) => runAsDatabaseUser(path.join(binDir, 'psql'), [
    '-X', '-q', '-v', 'ON_ERROR_STOP=1', '-h', clusterPaths(clusterDir).socketDir, '-p', String(port),
    '-U', 'postgres', '-d', 'postgres', '-tA', '-c', sql,
  ], { cwd: clusterDir, quiet: true });

  await psql(
    `DO $do$ BEGIN
       IF NOT EXISTS (SELECT FROM pg_roles WHERE rolname = ${literal(user)}) THEN
         CREATE ROLE "${user}" LOGIN CREATEDB PASSWORD ${literal(password)};
       ELSE
         ALTER ROLE "${user}" LOGIN PASSWORD ${literal(password)};
       END IF;
     END $do$;`,
  );
  const exists = await psql(`SELECT 1 FROM pg_database WHERE datname = ${literal(database)}`);
  if (exists.output.trim() !== '1') {
    await psql(`CREATE DATABASE "${database}" OWNER "${user}" ENCODING 'UTF8'`);
  }
}

/**
 * A fresh cluster for tests: its own folder under the system temp folder (or /var/tmp when that is
 * not reachable), fsync off, a role and database created, listening on 127.0.0.1:`port` (a free
 * port when omitted). `stop()`/`start()` keep the data; `remove()` stops it and deletes the folder.
 * The folder is also removed when the process exits without calling remove().
 * @param {{ port?: number, label?: string, user?: string, password?: string, database?: string, log?: (m: string) => void }} [options]
 * @returns {Promise<{ host: string, port: number, user: string, password: string, database: string,
 *   dataDir: string, stop: () => Promise<void>, start: () => Promise<void>, remove: () => Promise<void> }>}
 */
export async function startThrowawayPostgres({
  port, label = 'test', user = 'beamwright', password = randomBytes(12).toString('hex'), database = 'beamwright_test', log = () => {},
} = {}) {
  const binDir = await ensurePostgresBinaries({ log });
  const chosenPort = port ?? (await findFreePort());
  const safeLabel = label.replace(/[^a-zA-Z0-9_-]/g, '-').slice(0, 24);
  const osUser = databaseOsUser();
  let base = os.tmpdir();
  if (!isReachableBy(base, osUser) || base.length > 40) base = '/var/tmp';
  const clusterDir = fs.mkdtempSync(path.join(base, `bw-pg-${safeLabel}-`));
  let removed = false;
  const removeSync = () => {
    if (removed) return;
    removed = true;
    stopClusterSync({ binDir, clusterDir, mode: 'immediate' });
    fs.rmSync(clusterDir, { recursive: true, force: true });
  };
  process.once('exit', removeSync);
  try {
    await initCluster({ binDir, clusterDir, port: chosenPort, fsync: false, log });
    await startCluster({ binDir, clusterDir, port: chosenPort });
    await ensureRoleAndDatabase({ binDir, clusterDir, port: chosenPort, user, password, database });
  } catch (error) {
    removeSync();
    throw error;
  }
  return {
    host: '127.0.0.1',
    port: chosenPort,
    user,
    password,
    database,
    dataDir: clusterDir,
    async stop() {
      await stopCluster({ binDir, clusterDir, mode: 'fast' });
    },
    async start() {
      await startCluster({ binDir, clusterDir, port: chosenPort });
    },
    async remove() {
      if (removed) return;
      await stopCluster({ binDir, clusterDir, mode: 'immediate' }).catch(() => {});
      removed = true;
      process.removeListener('exit', removeSync);
      fs.rmSync(clusterDir, { recursive: true, force: true });
    },
  };
}

/** True when something accepts TCP connections on 127.0.0.1:`port`. */
export function isPortInUse(port, host = '127.0.0.1') {
  return new Promise((resolve) => {
    const socket = net.connect({ port, host });
    socket.setTimeout(1000);
    socket.once('connect', () => { socket.destroy(); resolve(true); });
    socket.once('timeout', () => { socket.destroy(); resolve(false); });
    socket.once('error', () => resolve(false));
  });
}

/** A TCP port that was free on 127.0.0.1 a moment ago (the OS picks it). */
export function findFreePort() {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.unref();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
}

function assertProjectPort(port) {
  if (!Number.isInteger(port) || port < 1024 || port > 65535) throw new Error(`port ${port} must be an integer in 1024..65535`);
  if (port === 5432) throw new Error('port 5432 is reserved for a system PostgreSQL: use a project port (e.g. 54329)');
}

function tail(file, lines) {
  try {
    return fs.readFileSync(file, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
  } catch {
    return '(no log)';
  }
}

function asDatabaseUser(command, args) {
  return isRoot() ? ['runuser', ['-u', 'postgres', '--', command, ...args]] : [command, args];
}

function runAsDatabaseUser(command, args, options) {
  const [wrapped, wrappedArgs] = asDatabaseUser(command, args);
  return run(wrapped, wrappedArgs, options);
}

/**
 * Runs a command, collecting its output; rejects on a non-zero exit unless allowFailure.
 * @returns {Promise<{ code: number, output: string }>}
 */
function run(command, args, { cwd, env, quiet = false, allowFailure = false } = {}) {
  return new Promise((resolve, reject) => {
    // Detached from our process group is not wanted: Ctrl-C should not reach pg_ctl mid-way either,
    // so the child ignores stdin and we collect its output.
    const child = spawn(command, args, { cwd, env, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    const collect = (chunk) => {
      output += chunk;
      if (!quiet) process.stdout.write(chunk);
    };
    child.stdout.on('data', collect);
    child.stderr.on('data', collect);
    child.once('error', reject);
    child.once('close', (code) => {
      if (code !== 0 && !allowFailure) {
        reject(new Error(`${command} ${args.join(' ')} exited with ${code}\n${output}`));
      } else {
        resolve({ code: code ?? 1, output });
      }
    });
  });
}
