// Tests of the PostgreSQL helpers against a real throwaway cluster (node's test runner, no build).
// Run: node --test scripts/lib/postgres.test.mjs
import assert from 'node:assert/strict';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { after, before, test } from 'node:test';
import pg from 'pg';
import {
  databaseOsUser, findFreePort, isPortInUse, resolveReachableDataDir, startThrowawayPostgres,
} from './postgres.mjs';

const connect = async (cluster) => {
  const client = new pg.Client({
    host: cluster.host, port: cluster.port, user: cluster.user, password: cluster.password, database: cluster.database,
  });
  await client.connect();
  return client;
};

let cluster;
before(async () => {
  cluster = await startThrowawayPostgres({ port: await findFreePort(), label: 'scripts-selftest' });
});
after(async () => {
  await cluster?.remove();
});

test('the throwaway cluster accepts the app role over TCP on 127.0.0.1 with fsync off', async () => {
  const client = await connect(cluster);
  try {
    const { rows } = await client.query('SELECT current_user AS who, current_database() AS db, current_setting($1) AS fsync', ['fsync']);
    assert.deepEqual(rows[0], { who: cluster.user, db: cluster.database, fsync: 'off' });
    const listen = await client.query('SHOW listen_addresses');
    assert.equal(listen.rows[0].listen_addresses, '127.0.0.1');
  } finally {
    await client.end();
  }
});

test('a wrong password is refused (scram-sha-256 over TCP, no trust)', async () => {
  const client = new pg.Client({ host: cluster.host, port: cluster.port, user: cluster.user, password: 'not-the-password', database: cluster.database });
  await assert.rejects(client.connect(), /password authentication failed/);
});

test('stop() closes the port, start() brings the same data back', async () => {
  let client = await connect(cluster);
  await client.query('CREATE TABLE survivor (note text)');
  await client.query("INSERT INTO survivor VALUES ('still here')");
  await client.end();

  await cluster.stop();
  assert.equal(await isPortInUse(cluster.port), false);
  await cluster.start();
  assert.equal(await isPortInUse(cluster.port), true);

  client = await connect(cluster);
  try {
    const { rows } = await client.query('SELECT note FROM survivor');
    assert.deepEqual(rows, [{ note: 'still here' }]);
  } finally {
    await client.end();
  }
});

test('remove() stops the cluster and deletes its folder', async () => {
  const other = await startThrowawayPostgres({ port: await findFreePort(), label: 'scripts-remove' });
  assert.ok(fs.existsSync(other.dataDir));
  await other.remove();
  assert.equal(fs.existsSync(other.dataDir), false);
  assert.equal(await isPortInUse(other.port), false);
});

test('resolveReachableDataDir keeps a reachable folder and falls back from an unreachable one', (t) => {
  const osUser = databaseOsUser();
  const open = fs.mkdtempSync(path.join('/tmp', 'bw-reach-'));
  fs.chmodSync(open, 0o755);
  try {
    assert.deepEqual(resolveReachableDataDir(path.join(open, 'postgres'), { osUser }), { dir: path.join(open, 'postgres'), fallback: false });
    if (osUser.uid === os.userInfo().uid) {
      t.diagnostic('not root: the database user is the invoking user, the unreachable case needs another user');
      return;
    }
    fs.chmodSync(open, 0o700); // root-only: the postgres user can no longer traverse it
    const resolved = resolveReachableDataDir(path.join(open, 'postgres'), { osUser });
    assert.equal(resolved.fallback, true);
    assert.match(resolved.dir, /^\/var\/tmp\/beamwright-postgres-[0-9a-f]{12}$/);
    assert.match(resolved.reason, /cannot reach/);
    // Stable: the same checkout always resolves to the same fallback.
    assert.equal(resolveReachableDataDir(path.join(open, 'postgres'), { osUser }).dir, resolved.dir);
  } finally {
    fs.rmSync(open, { recursive: true, force: true });
  }
});

test('port 5432 is refused', async () => {
  await assert.rejects(startThrowawayPostgres({ port: 5432, label: 'refused' }), /5432 is reserved/);
});
