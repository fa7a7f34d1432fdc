/**
 * Weather import benchmark, run by `npm run bench` after the link-core benchmarks (needs the built
 * api): ten years of hourly visibility (87 600 rows, synthetic and seeded) uploaded as CSV through
 * the running API into its own throwaway PostgreSQL cluster (like `npm test`'s), then the
 * availability over the imported rows in link-core. One line per figure in the bench format,
 * `bench <name>: <value> <unit> (target <op> <value> <unit>)`.
 *
 * The import is timed by the wall clock from the first byte sent to the 201 (upload, the pg-boss
 * job, parsing and the one transaction that writes the rows): it spans two processes and the
 * database, so CPU time of one process would not measure it. Median of three imports after a
 * warm-up. The availability (and the availability page's whole analysis) is CPU time of this
 * process, median of eleven runs after a warm-up.
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import { loadavg } from 'node:os';
import pg from 'pg';
import { analyseRecordsAvailability, availabilityFromRecords, seededUniform, workedExampleDesign } from '@beamwright/link-core';
import { findFreePort, startThrowawayPostgres } from '../../scripts/lib/postgres.mjs';
import { ROOT_DIR } from '../../scripts/lib/paths.mjs';
import { killGroup, runCommand, waitForHealth } from '../../scripts/lib/processes.mjs';

const ROWS = 87_600;
const DEMO_PASSWORD = 'bench-demo-password';

function line(name, value, unit, op, target) {
  console.log(`bench ${name}: ${value} ${unit} (target ${op} ${target} ${unit})`);
}

function median(values) {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

/** Ten years of hourly visibility with fog spells (synthetic, seeded): `time,visibility_m` lines. */
function tenYearsCsv(seed) {
  const random = seededUniform(seed);
  const start = Date.UTC(2015, 0, 1);
  const lines = ['time,visibility_m'];
  let fog = 0;
  for (let i = 0; i < ROWS; i++) {
    if (fog === 0 && random() < 0.002) fog = 1 + Math.floor(random() * 12);
    const visibility = fog > 0 ? 80 * Math.exp(random() * Math.log(30)) : 3000 * Math.exp(random() * Math.log(10));
    if (fog > 0) fog--;
    lines.push(`${new Date(start + i * 3_600_000).toISOString().slice(0, 19)}Z,${Math.round(visibility)}`);
  }
  return `${lines.join('\n')}\n`;
}

async function upload(baseUrl, token, csv, name) {
  const form = new FormData();
  form.set('name', name);
  form.set('mapping', JSON.stringify({ timestampColumn: 'time', visibilityColumn: 'visibility_m', visibilityUnit: 'm', visibilityDefinition: 'mor-5-percent' }));
  form.set('file', new Blob([csv], { type: 'text/csv' }), 'ten-years.csv');
  const started = process.hrtime.bigint();
  const response = await fetch(`${baseUrl}/api/weather-datasets`, { method: 'POST', headers: { Authorization: `Bearer ${token}` }, body: form });
  const body = await response.json();
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  if (response.status !== 201 || body.rowsImported !== csv.split('\n').length - 2) throw new Error(`import answered ${response.status}: ${JSON.stringify(body).slice(0, 300)}`);
  return { seconds, datasetId: body.id };
}

const cluster = await startThrowawayPostgres({ label: 'bench' });
let server;
try {
  const port = await findFreePort();
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PORT: String(port),
    DATABASE_HOST: cluster.host,
    DATABASE_PORT: String(cluster.port),
    DATABASE_USER: cluster.user,
    DATABASE_PASSWORD: cluster.password,
    DATABASE_NAME: cluster.database,
    JWT_SECRET: 'bench-only-jwt-secret-not-for-production',
    DEMO_PASSWORD,
    UI_DIST_DIR: path.join(cluster.dataDir, 'no-ui'),
  };
  for (const script of ['run-migrations.js', path.join('seeds', 'run-seed.js')]) {
    const result = await runCommand(process.execPath, [path.join(ROOT_DIR, 'api', 'dist', 'database', script)], { env, capture: true, quiet: true });
    if (result.code !== 0) throw new Error(`${script} failed:\n${result.output}`);
  }
  server = spawn(process.execPath, [path.join(ROOT_DIR, 'api', 'dist', 'main.js')], { cwd: ROOT_DIR, env, stdio: ['ignore', 'ignore', 'inherit'], detached: true });
  const baseUrl = `http://127.0.0.1:${port}`;
  await waitForHealth(`${baseUrl}/api/health`, { child: server, accept: (body) => body?.database === 'up' });
  const login = await fetch(`${baseUrl}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email: 'engineer@demo.test', password: DEMO_PASSWORD }) });
  const { accessToken } = await login.json();

  await upload(baseUrl, accessToken, tenYearsCsv(1).split('\n').slice(0, 5001).join('\n') + '\n', 'warm-up');
  const runs = [];
  for (let pass = 0; pass < 3; pass++) runs.push(await upload(baseUrl, accessToken, tenYearsCsv(10 + pass), `ten years ${pass + 1}`));
  const seconds = median(runs.map((run) => run.seconds));
  line('weather-import-87600-rows-api', seconds.toFixed(2), 's', '<', 5);
  console.log(`# weather-import-87600-rows-api passes: ${runs.map((run) => run.seconds.toFixed(2)).join(', ')} s wall clock, upload to 201 (load average ${loadavg()[0].toFixed(1)})`);

  // the availability over the rows as imported: read back from PostgreSQL, then link-core alone
  const client = new pg.Client({ host: cluster.host, port: cluster.port, user: cluster.user, password: cluster.password, database: cluster.database });
  await client.connect();
  const { rows } = await client.query(
    'SELECT (extract(epoch FROM observed_at) * 1000)::float8 AS t, visibility_m AS v FROM weather_record WHERE dataset_id = $1 ORDER BY observed_at',
    [runs[0].datasetId],
  );
  await client.end();
  const records = {
    timestampsMs: Float64Array.from(rows, (row) => row.t),
    visibilityM: Float64Array.from(rows, (row) => row.v ?? Number.NaN),
    visibilityDefinition: 'mor-5-percent',
  };
  if (records.visibilityM.length !== ROWS) throw new Error(`read back ${records.visibilityM.length} rows`);
  const design = { ...workedExampleDesign(), rangeM: 1000 };
  for (let i = 0; i < 5; i++) availabilityFromRecords(design, records, { requiredMarginDb: 3 });
  const timings = [];
  let check = 0;
  for (let i = 0; i < 11; i++) {
    const before = process.cpuUsage();
    check += availabilityFromRecords(design, records, { requiredMarginDb: 3 }).availability;
    const used = process.cpuUsage(before);
    timings.push((used.user + used.system) / 1000);
  }
  if (!Number.isFinite(check)) throw new Error('availability was not finite');
  line('availability-87600-imported-records', median(timings).toFixed(2), 'ms', '<', 1);

  // everything the availability page shows (months, outages, margin distribution, ranges, sweep)
  for (let i = 0; i < 3; i++) analyseRecordsAvailability(design, records, { requiredMarginDb: 3 });
  const analysisTimings = [];
  for (let i = 0; i < 11; i++) {
    const before = process.cpuUsage();
    analyseRecordsAvailability(design, records, { requiredMarginDb: 3 });
    const used = process.cpuUsage(before);
    analysisTimings.push((used.user + used.system) / 1000);
  }
  line('availability-analysis-87600-imported-records', median(analysisTimings).toFixed(1), 'ms', '<', 50);

  const started = process.hrtime.bigint();
  const answer = await fetch(`${baseUrl}/api/links/${(await (await fetch(`${baseUrl}/api/links?pageSize=1`, { headers: { Authorization: `Bearer ${accessToken}` } })).json()).items[0].id}/revisions/1/availability?datasetId=${runs[0].datasetId}`, {
    headers: { Authorization: `Bearer ${accessToken}` },
  });
  if (answer.status !== 200) throw new Error(`availability answered ${answer.status}`);
  await answer.json();
  console.log(`# the availability page's api call over the same 87 600 rows (read, analyse, months, ranges): ${(Number(process.hrtime.bigint() - started) / 1e6).toFixed(0)} ms wall clock, once`);
} finally {
  if (server && server.exitCode === null) {
    const exited = new Promise((resolve) => server.once('exit', resolve));
    killGroup(server, 'SIGTERM');
    await exited;
  }
  await cluster.remove();
}
